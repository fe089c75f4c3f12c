import { API_ERROR_CODES, type ApiErrorCode, type FieldErrors } from '@shared/api/api-error.schema';

/** The one error type services throw for expected failures. */
export class AppError extends Error {
  readonly status: number;

  constructor(
    readonly code: ApiErrorCode,
    message: string,
    readonly fieldErrors?: FieldErrors,
    readonly headers?: Record<string, string>,
    /** For a 409 on a stale edit: the record as it stands now. */
    readonly current?: unknown,
  ) {
    super(message);
    this.name = 'AppError';
    this.status = API_ERROR_CODES[code];
  }
}

export const notFound = (what = 'That record') => new AppError('not_found', `${what} was not found.`);

/**
 * A 404 for a record that exists but that the user may not see: the same answer as for one that does not exist,
 * so nothing is disclosed, but logged as a refused access decision (OWASP ASVS 4.0.3 V7.2.2).
 */
export class HiddenRecord extends AppError {
  constructor(what: string) {
    super('not_found', `${what} was not found.`);
  }
}

/** 409 for an edit based on an old version, carrying the current record so the client can merge. */
export const staleVersion = (current: unknown) =>
  new AppError(
    'conflict',
    'Someone changed this since you opened it. Here is the current version; check it and save again.',
    undefined,
    undefined,
    current,
  );
