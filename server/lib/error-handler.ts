import type { ErrorRequestHandler, RequestHandler } from 'express';
import type { ApiErrorBody } from '@shared/api/api-error.schema';
import { AppError } from './app-error';
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

/** Registered last: every error leaves the server through here, in one shape. */
export const errorHandler: ErrorRequestHandler = (err: unknown, req, res, next) => {
  if (res.headersSent) return next(err);
  const requestId = String(req.id ?? '');
  if (err instanceof AppError) {
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
  logger.error({ err, requestId, method: req.method, url: req.originalUrl }, 'unhandled error');
  return send(res, 500, {
    error: { code: 'internal', message: 'Something went wrong on our side. Your saved data is safe; try again.', requestId },
  });
};
