import type { OutboxError } from '@/lib/outbox';

/**
 * Why the server refused a change waiting on the phone: its field messages when it gave any (they say what its
 * summary says, more exactly), else the summary, else `fallback`. One or the other, never both.
 */
export function refusalWords(error: OutboxError | undefined, fallback: string): string {
  const fields = Object.values(error?.fieldErrors ?? {}).flat();
  return fields.length ? fields.join(' ') : (error?.message ?? fallback);
}
