import * as z from '@shared/zod';
import { apiErrorSchema, type ApiErrorCode, type FieldErrors } from '@shared/api/api-error.schema';
import { csrfResponseSchema } from '@shared/auth/auth.schema';

/** Codes the client adds to the server's own for failures that never reached, or never came back from, the server. */
export type ClientErrorCode = 'network' | 'unexpected_response';
/** A known code, or any other string a newer server might send. */
export type ApiErrorCodeLike = ApiErrorCode | ClientErrorCode | (string & Record<never, never>);

export const NETWORK_MESSAGE = 'No connection — nothing was lost, try again';
const UNEXPECTED_MESSAGE = 'The server sent an answer we could not read. Your saved data is safe; try again.';

/** Every failed request, whatever went wrong, reaches the app as one of these. */
export class ApiError extends Error {
  /** HTTP status; 0 when no answer arrived. */
  readonly status: number;
  readonly code: ApiErrorCodeLike;
  readonly fieldErrors: FieldErrors;
  readonly requestId: string | undefined;

  constructor(init: {
    status: number;
    code: ApiErrorCodeLike;
    message: string;
    fieldErrors?: FieldErrors;
    requestId?: string;
    cause?: unknown;
  }) {
    super(init.message, init.cause === undefined ? undefined : { cause: init.cause });
    this.name = 'ApiError';
    this.status = init.status;
    this.code = init.code;
    this.fieldErrors = init.fieldErrors ?? {};
    this.requestId = init.requestId;
  }

  /** True when the server pointed at particular fields, which a form shows beside its inputs. */
  get hasFieldErrors(): boolean {
    return Object.keys(this.fieldErrors).length > 0;
  }
}

export function isApiError(error: unknown): error is ApiError {
  return error instanceof ApiError;
}

type Method = 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';
const WRITE_METHODS: ReadonlySet<Method> = new Set(['POST', 'PUT', 'PATCH', 'DELETE']);

export const CSRF_PATH = '/api/auth/csrf';
export const CSRF_HEADER = 'X-CSRF-Token';

export interface RequestOptions<T> {
  body?: unknown;
  /** Checks the answer's shape; without one the parsed JSON is returned as is. */
  schema?: z.core.$ZodType<T>;
  signal?: AbortSignal;
}

function isAbort(error: unknown, signal: AbortSignal | undefined): boolean {
  return signal?.aborted === true || (error instanceof DOMException && error.name === 'AbortError');
}

async function send(url: string, init: RequestInit): Promise<Response> {
  try {
    return await fetch(url, { ...init, credentials: 'same-origin' });
  } catch (error) {
    // A cancelled query is not a failure to report: let TanStack Query see the abort as it is.
    if (isAbort(error, init.signal ?? undefined)) throw error;
    throw new ApiError({ status: 0, code: 'network', message: NETWORK_MESSAGE, cause: error });
  }
}

async function readJson(response: Response): Promise<unknown> {
  const text = await response.text();
  if (!text) return undefined;
  try {
    return JSON.parse(text) as unknown;
  } catch {
    return undefined;
  }
}

async function toApiError(response: Response): Promise<ApiError> {
  const envelope = apiErrorSchema.safeParse(await readJson(response));
  if (envelope.success) {
    const { code, message, fieldErrors, requestId } = envelope.data.error;
    return new ApiError({ status: response.status, code, message, fieldErrors, requestId });
  }
  // Not our envelope: a proxy page, a gateway timeout, an empty body.
  const message =
    response.status >= 500
      ? `The server could not answer just now (error ${response.status}). Your saved data is safe; try again.`
      : `The request was refused (error ${response.status}).`;
  return new ApiError({
    status: response.status,
    code: response.status >= 500 ? 'unavailable' : 'unexpected_response',
    message,
  });
}

async function parseBody<T>(response: Response, schema: z.core.$ZodType<T> | undefined): Promise<T> {
  if (response.status === 204) return undefined as T;
  const json = await readJson(response);
  if (!schema) return json as T;
  const parsed = z.safeParse(schema, json);
  if (!parsed.success) {
    throw new ApiError({ status: response.status, code: 'unexpected_response', message: UNEXPECTED_MESSAGE, cause: parsed.error });
  }
  return parsed.data;
}

// --- CSRF token: one per session, fetched on the first write and kept until dropped. ---

let csrfToken: Promise<string> | null = null;

async function fetchCsrfToken(): Promise<string> {
  const response = await send(CSRF_PATH, { method: 'GET', headers: { Accept: 'application/json' } });
  if (!response.ok) throw await toApiError(response);
  return (await parseBody(response, csrfResponseSchema)).token;
}

function getCsrfToken(): Promise<string> {
  if (!csrfToken) {
    const pending = fetchCsrfToken();
    csrfToken = pending;
    pending.catch(() => {
      if (csrfToken === pending) csrfToken = null;
    });
  }
  return csrfToken;
}

/**
 * Forgets the cached CSRF token. Call it after sign-in, registration and sign-out: the server
 * starts a new session then, and the old token no longer matches.
 */
export function dropCsrfToken(): void {
  csrfToken = null;
}

// --- Requests ---

async function request<T>(method: Method, path: string, options: RequestOptions<T> = {}): Promise<T> {
  const { body, schema, signal } = options;
  const isWrite = WRITE_METHODS.has(method);

  const attempt = async (): Promise<Response> => {
    const headers: Record<string, string> = { Accept: 'application/json' };
    if (body !== undefined) headers['Content-Type'] = 'application/json';
    if (isWrite) headers[CSRF_HEADER] = await getCsrfToken();
    return send(path, {
      method,
      headers,
      body: body === undefined ? undefined : JSON.stringify(body),
      signal,
    });
  };

  let response = await attempt();
  if (!response.ok) {
    const error = await toApiError(response);
    if (!isWrite || error.code !== 'csrf_invalid') throw error;
    // The session changed under us (it expired, or a sign-in replaced it): fetch a fresh token and try once more.
    dropCsrfToken();
    response = await attempt();
    if (!response.ok) throw await toApiError(response);
  }
  return parseBody(response, schema);
}

/** The one way the client talks to the server. JSON in and out; every failure is an ApiError. */
export const api = {
  get: <T>(path: string, options?: Omit<RequestOptions<T>, 'body'>) => request<T>('GET', path, options),
  post: <T>(path: string, body?: unknown, options?: Omit<RequestOptions<T>, 'body'>) =>
    request<T>('POST', path, { ...options, body }),
  put: <T>(path: string, body?: unknown, options?: Omit<RequestOptions<T>, 'body'>) =>
    request<T>('PUT', path, { ...options, body }),
  patch: <T>(path: string, body?: unknown, options?: Omit<RequestOptions<T>, 'body'>) =>
    request<T>('PATCH', path, { ...options, body }),
  delete: <T>(path: string, options?: Omit<RequestOptions<T>, 'body'>) => request<T>('DELETE', path, options),
};
