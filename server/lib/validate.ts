import type { RequestHandler } from 'express';
import * as z from '@shared/zod';
import { toFieldErrors, type FieldErrors } from '@shared/api/api-error.schema';
import { AppError } from './app-error';

interface Schemas {
  body?: z.core.$ZodType;
  params?: z.core.$ZodType;
  query?: z.core.$ZodType;
}

/** Deeper than any body of ours nests (a season file's runs' corners are five levels down). */
const MAX_DEPTH = 32;

/**
 * Where a request carries what cannot be stored, by field ("corners.lf.notes"): the character U+0000, which
 * PostgreSQL's text cannot hold (a value with one would fail at the database, after the schema passed it; no one
 * types it on purpose), and values nested deeper than `MAX_DEPTH`. The walk keeps its own list rather than
 * recursing, so a body nested thousands deep is an answer, not a stack overflow.
 */
export function unstorableFields(value: unknown): FieldErrors {
  // No prototype: a field named "__proto__" or "constructor" is a key like any other.
  const found: FieldErrors = Object.create(null);
  const pending: [unknown, string, number][] = [[value, '', 0]];
  for (let next = pending.pop(); next; next = pending.pop()) {
    const [v, at, depth] = next;
    if (typeof v === 'string') {
      if (v.includes('\u0000')) found[at || '_'] = ['Contains a null character (U+0000), which cannot be stored: remove it'];
    } else if (v && typeof v === 'object') {
      if (depth === MAX_DEPTH) found[at || '_'] = [`Nested too deeply: nothing here is more than ${MAX_DEPTH} levels down`];
      else for (const [key, item] of Object.entries(v)) pending.push([item, at ? `${at}.${key}` : key, depth + 1]);
    }
  }
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
      const unstorable = part === 'params' ? {} : unstorableFields(req[part]);
      if (!result.success || Object.keys(unstorable).length > 0) {
        // A malformed id names no record: that is "not found", like an id that does not exist.
        if (part === 'params') throw new AppError('not_found', 'That record was not found.');
        throw new AppError('validation_failed', 'Some fields need attention.', { ...(result.success ? {} : toFieldErrors(result.error)), ...unstorable });
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
