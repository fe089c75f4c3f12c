import type { ErrorRequestHandler, RequestHandler } from 'express';
import type { ApiErrorBody } from '@shared/api/api-error.schema';
import { AppError, HiddenRecord } from './app-error';
import { securityEvent } from './security-log';
import { logger } from './logger';

function send(res: Parameters<RequestHandler>[1], status: number, body: ApiErrorBody) {
  res.status(status).json(body);
}

/** Unknown /api paths answer with the envelope rather than the client app. */
export const apiNotFound: RequestHandler = (req) => {
  throw new AppError('not_found', `No API route for ${req.method} ${req.path}.`);
};

interface HttpishError {
  type?: string;
  status?: number;
  code?: string;
}

/**
 * The database cannot be reached or is going away: node-postgres's socket errors, PostgreSQL's SQLSTATE
 * class 08 (connection exception) and 57P (operator intervention: shutdown, cannot connect now), and
 * the pool's own words when a connection dies or cannot be made. TypeORM keeps the driver's error inside.
 */
export function isDatabaseUnavailable(err: unknown): boolean {
  const e = (err ?? {}) as { code?: unknown; message?: unknown; driverError?: unknown };
  if (e.driverError && isDatabaseUnavailable(e.driverError)) return true;
  const code = typeof e.code === 'string' ? e.code : '';
  if (['ECONNREFUSED', 'ECONNRESET', 'ETIMEDOUT', 'EPIPE', 'ENOTFOUND'].includes(code) || /^(08|57P)/.test(code)) return true;
  const message = typeof e.message === 'string' ? e.message : '';
  return /Connection terminated|timeout exceeded when trying to connect|the database system is (starting up|shutting down)/i.test(message);
}

/** Registered last: every error leaves the server through here, in one shape. */
export const errorHandler: ErrorRequestHandler = (err: unknown, req, res, next) => {
  if (res.headersSent) return next(err);
  const requestId = String(req.id ?? '');
  if (err instanceof AppError) {
    // The same 404 as for a record that does not exist, but a refused access decision all the same.
    if (err instanceof HiddenRecord) securityEvent(req, 'record-hidden', { path: req.originalUrl }, 'warn');
    for (const [name, value] of Object.entries(err.headers ?? {})) res.setHeader(name, value);
    return send(res, err.status, {
      error: {
        code: err.code,
        message: err.message,
        ...(err.fieldErrors ? { fieldErrors: err.fieldErrors } : {}),
        ...(err.current !== undefined ? { current: err.current } : {}),
      },
    });
  }
  const e = (err ?? {}) as HttpishError;
  if (e.type === 'entity.parse.failed') {
    return send(res, 400, { error: { code: 'malformed_json', message: 'The request body is not valid JSON.' } });
  }
  if (e.type === 'entity.too.large') {
    return send(res, 413, { error: { code: 'payload_too_large', message: 'The request body is too large.' } });
  }
  if (e.code === 'EBADCSRFTOKEN') {
    return send(res, 403, {
      error: { code: 'csrf_invalid', message: 'The form expired or came from elsewhere. Reload and try again.' },
    });
  }
  if (e.status === 415 || e.type === 'encoding.unsupported' || e.type === 'charset.unsupported') {
    return send(res, 415, { error: { code: 'unsupported_media_type', message: 'That content type is not supported.' } });
  }
  if (isDatabaseUnavailable(err)) {
    logger.warn({ err, requestId, method: req.method, url: req.originalUrl }, 'database unavailable');
    res.setHeader('Retry-After', '5');
    return send(res, 503, {
      error: { code: 'unavailable', message: 'Scrubline cannot reach its database just now. Nothing you saved is lost; try again in a moment.' },
    });
  }
  logger.error({ err, requestId, method: req.method, url: req.originalUrl }, 'unhandled error');
  return send(res, 500, {
    error: { code: 'internal', message: 'Something went wrong on our side. Your saved data is safe; try again.', requestId },
  });
};
