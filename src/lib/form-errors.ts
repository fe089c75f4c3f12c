import type { FieldValues, Path, UseFormSetError } from 'react-hook-form';
import { isApiError } from './api-client';

const FALLBACK = 'Something went wrong. Nothing you typed was lost; try again.';

/**
 * Puts a failed request's messages where they belong: each server field error on its input
 * (the first one focused), and returns whatever concerns the form as a whole, or null.
 */
export function applyServerErrors<T extends FieldValues>(
  error: unknown,
  setError: UseFormSetError<T>,
  fields: readonly Path<T>[],
): string | null {
  if (!isApiError(error)) return FALLBACK;
  if (!error.hasFieldErrors) return error.message || FALLBACK;

  const leftOver: string[] = [];
  let focused = false;
  for (const [key, messages] of Object.entries(error.fieldErrors)) {
    const field = fields.find((f) => f === key);
    const message = messages.join(' ');
    if (!field) {
      leftOver.push(message);
      continue;
    }
    setError(field, { type: 'server', message }, { shouldFocus: !focused });
    focused = true;
  }
  return leftOver.length > 0 ? leftOver.join(' ') : null;
}
