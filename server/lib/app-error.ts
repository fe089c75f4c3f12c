import { API_ERROR_CODES, type ApiErrorCode, type FieldErrors } from '@shared/api/api-error.schema';

/** The one error type services throw for expected failures. */
export class AppError extends Error {
  readonly status: number;

  constructor(
    readonly code: ApiErrorCode,
    message: string,
    readonly fieldErrors?: FieldErrors,
    readonly headers?: Record<string, string>,
  ) {
    super(message);
    this.name = 'AppError';
    this.status = API_ERROR_CODES[code];
  }
}

export const notFound = (what = 'That record') => new AppError('not_found', `${what} was not found.`);
