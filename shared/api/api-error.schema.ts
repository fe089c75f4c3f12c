import * as z from '../zod';

/** Machine-readable error codes; the HTTP status goes with each one. */
export const API_ERROR_CODES = {
  validation_failed: 400,
  malformed_json: 400,
  unauthenticated: 401,
  csrf_invalid: 403,
  forbidden: 403,
  not_found: 404,
  conflict: 409,
  /** A link that worked once and no longer does (an expired invitation). */
  gone: 410,
  payload_too_large: 413,
  unsupported_media_type: 415,
  rate_limited: 429,
  internal: 500,
  unavailable: 503,
} as const;

export type ApiErrorCode = keyof typeof API_ERROR_CODES;

export const fieldErrorsSchema = z.record(z.string(), z.array(z.string()));
export type FieldErrors = z.infer<typeof fieldErrorsSchema>;

/** The one error envelope every failing API answer carries. */
export const apiErrorSchema = z.object({
  error: z.object({
    code: z.string(),
    message: z.string(),
    fieldErrors: z.optional(fieldErrorsSchema),
    requestId: z.optional(z.string()),
    /** On a 409 for a stale edit: the record as it stands now. */
    current: z.optional(z.unknown()),
  }),
});
export type ApiErrorBody = z.infer<typeof apiErrorSchema>;

/** Flattens a zod error into `{ "path.to.field": ["message"] }`. */
export function toFieldErrors(error: z.core.$ZodError): FieldErrors {
  // No prototype: an unknown field named "constructor" or "__proto__" gets its message like any other.
  const out: FieldErrors = Object.create(null);
  for (const issue of error.issues) {
    const key = issue.path.map(String).join('.');
    if (issue.code === 'unrecognized_keys') {
      for (const unknown of issue.keys) {
        const k = key ? `${key}.${unknown}` : unknown;
        (out[k] ??= []).push('Unknown field');
      }
      continue;
    }
    (out[key || '_'] ??= []).push(issue.message);
  }
  return out;
}
