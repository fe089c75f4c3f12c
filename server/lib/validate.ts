import type { RequestHandler } from 'express';
import * as z from '@shared/zod';
import { toFieldErrors } from '@shared/api/api-error.schema';
import { AppError } from './app-error';

interface Schemas {
  body?: z.core.$ZodType;
  params?: z.core.$ZodType;
  query?: z.core.$ZodType;
}

/**
 * Parses body, params and query with the shared schemas at the edge. Handlers read
 * the parsed values from `res.locals.body|params|query`; a failure is a 400 with
 * field errors.
 */
export function validate(schemas: Schemas): RequestHandler {
  return (req, res, next) => {
    for (const part of ['params', 'query', 'body'] as const) {
      const schema = schemas[part];
      if (!schema) continue;
      const result = z.safeParse(schema, req[part] ?? {});
      if (!result.success) {
        // A malformed id names no record: that is "not found", like an id that does not exist.
        if (part === 'params') throw new AppError('not_found', 'That record was not found.');
        throw new AppError('validation_failed', 'Some fields need attention.', toFieldErrors(result.error));
      }
      res.locals[part] = result.data;
    }
    next();
  };
}

/** Typed read of what `validate` stored. */
export function parsed<T>(res: { locals: Record<string, unknown> }, part: 'body' | 'params' | 'query'): T {
  return res.locals[part] as T;
}
