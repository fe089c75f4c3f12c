import { isApiError } from '@/lib/api-client';

/** No connection: said on forms whose writes cannot wait for signal. */
export const NEEDS_SIGNAL = 'This needs a connection. Nothing was changed; try again when you have signal.';

/** What went wrong with an online write, in words for the form; null when the form should use the server's own words. */
export function onlineFailure(error: unknown): string | null {
  if (isApiError(error) && error.code === 'network') return NEEDS_SIGNAL;
  return null;
}

/** The server's message for a refusal that concerns no one field, or a general one. */
export function failureMessage(error: unknown): string {
  return onlineFailure(error) ?? (isApiError(error) && error.message ? error.message : 'Something went wrong; try again.');
}
