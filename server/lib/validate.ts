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
 * Where a request carries the character U+0000, by field ("corners.lf.notes"). PostgreSQL's text cannot hold it,
 * so a value with one would fail at the database, after the schema passed it; no one types it on purpose.
 */
export function nulCharacterFields(value: unknown): Record<string, string[]> {
  const found: Record<string, string[]> = {};
  const walk = (v: unknown, at: string) => {
    if (typeof v === 'string') {
      if (v.includes('\u0000')) found[at || '_'] = ['Contains a null character (U+0000), which cannot be stored: remove it'];
    } else if (Array.isArray(v)) {
      v.forEach((item, i) => walk(item, at ? `${at}.${i}` : String(i)));
    } else if (v && typeof v === 'object') {
      for (const [key, item] of Object.entries(v)) walk(item, at ? `${at}.${key}` : key);
    }
  };
  walk(value, '');
  return found;
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
      const nul = part === 'params' ? {} : nulCharacterFields(req[part]);
      if (!result.success || Object.keys(nul).length > 0) {
        // A malformed id names no record: that is "not found", like an id that does not exist.
        if (part === 'params') throw new AppError('not_found', 'That record was not found.');
        throw new AppError('validation_failed', 'Some fields need attention.', { ...(result.success ? {} : toFieldErrors(result.error)), ...nul });
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
