import type { Persister } from '@tanstack/react-query-persist-client';
import { memoryStorage, Outbox } from '../../src/lib/outbox';
import { render } from '@testing-library/react';
import type { ReactNode } from 'react';
import { QueryClientProvider, type QueryClient } from '@tanstack/react-query';
import { createMemoryRouter } from 'react-router-dom';
import { vi, type Mock } from 'vitest';
import { AppProvider } from '@/app/provider';
import { createQueryClient } from '@/app/query-client';
import { createRoutes, sendToSignIn } from '@/app/router';

export interface RecordedRequest {
  method: string;
  url: string;
  headers: Headers;
  body: unknown;
}

type Answer = Response | ((request: RecordedRequest) => Response | Promise<Response>);

export function jsonResponse(status: number, body?: unknown): Response {
  return new Response(body === undefined ? null : JSON.stringify(body), {
    status,
    headers: body === undefined ? {} : { 'Content-Type': 'application/json' },
  });
}

export function errorResponse(
  status: number,
  code: string,
  message: string,
  fieldErrors?: Record<string, string[]>,
): Response {
  return jsonResponse(status, { error: { code, message, ...(fieldErrors ? { fieldErrors } : {}) } });
}

export const CSRF_TOKEN = 'token-1';

/**
 * Stubs the global fetch with answers keyed "METHOD /path". An array is answered in order
 * (the last one repeats). GET /api/auth/csrf answers a token unless given. Unknown routes fail the test.
 */
export function stubFetch(routes: Record<string, Answer | Answer[]>): Mock<typeof fetch> {
  const calls = new Map<string, number>();
  const all: Record<string, Answer | Answer[]> = {
    'GET /api/auth/csrf': () => jsonResponse(200, { token: CSRF_TOKEN }),
    ...routes,
  };
  const mock = vi.fn<typeof fetch>(async (input, init) => {
    const url = typeof input === 'string' ? input : input instanceof URL ? input.href : input.url;
    const method = (init?.method ?? 'GET').toUpperCase();
    const key = `${method} ${url}`;
    const entry = all[key];
    if (!entry) throw new Error(`Unexpected request in test: ${key}`);
    const n = calls.get(key) ?? 0;
    calls.set(key, n + 1);
    const answer = Array.isArray(entry) ? entry[Math.min(n, entry.length - 1)] : entry;
    if (!answer) throw new Error(`No answer for ${key}`);
    const request: RecordedRequest = {
      method,
      url,
      headers: new Headers(init?.headers),
      body: typeof init?.body === 'string' ? (JSON.parse(init.body) as unknown) : undefined,
    };
    return typeof answer === 'function' ? answer(request) : answer.clone();
  });
  vi.stubGlobal('fetch', mock);
  return mock;
}

/** The requests a stubbed fetch received for one "METHOD /path". */
export function requestsTo(mock: Mock<typeof fetch>, key: string): RecordedRequest[] {
  return mock.mock.calls
    .map(([input, init]) => ({
      method: (init?.method ?? 'GET').toUpperCase(),
      url: String(input),
      headers: new Headers(init?.headers),
      body: typeof init?.body === 'string' ? (JSON.parse(init.body) as unknown) : undefined,
    }))
    .filter((r) => `${r.method} ${r.url}` === key);
}

/** A persister that keeps nothing, so each test starts from an empty cache. */
export function memoryPersister(): Persister {
  return { persistClient: async () => undefined, restoreClient: async () => undefined, removeClient: async () => undefined };
}

export function createTestQueryClient(): QueryClient {
  return createQueryClient({ retry: false });
}

/** Renders the whole app (real routes, providers and toasts) at an address, with a fresh QueryClient. */
export function renderApp(path: string) {
  const queryClient = createQueryClient({ retry: false, onUnauthenticated: () => sendToSignIn(router, queryClient) });
  const router = createMemoryRouter(createRoutes(queryClient), { initialEntries: [path] });
  const outbox = new Outbox({ storage: memoryStorage(), send: async () => undefined, classify: () => ({ kind: 'retry', reason: 'test' }) });
  const result = render(<AppProvider queryClient={queryClient} router={router} outbox={outbox} persister={memoryPersister()} />);
  return { ...result, router, queryClient, outbox };
}

/** Renders one component with a fresh QueryClient around it. */
export function renderWithQueryClient(ui: ReactNode) {
  const queryClient = createTestQueryClient();
  const result = render(<QueryClientProvider client={queryClient}>{ui}</QueryClientProvider>);
  return { ...result, queryClient };
}
