import { isApiError } from '@/lib/api-client';

const FALLBACK = 'Something went wrong. Nothing you typed was lost; try again.';

/** A failed save's messages: per field key ("lines.0.quantity"), and what concerns the whole form. */
export function splitErrors(error: unknown): { fields: Record<string, string>; form: string | null } {
  if (!error) return { fields: {}, form: null };
  if (!isApiError(error)) return { fields: {}, form: FALLBACK };
  const fields = Object.fromEntries(Object.entries(error.fieldErrors).map(([k, v]) => [k, v.join(' ')]));
  return { fields, form: error.hasFieldErrors ? null : error.message || FALLBACK };
}
