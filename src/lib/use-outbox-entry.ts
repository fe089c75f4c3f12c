import { useOutboxEntries } from './outbox-context';
import type { OutboxEntry } from './outbox';

export type WatchedEntry =
  | { status: 'none' }
  /** On the device, not confirmed yet (waiting or sending). */
  | { status: 'waiting'; entry: OutboxEntry }
  /** The server refused it; it waits to be fixed or discarded. */
  | { status: 'failed'; entry: OutboxEntry }
  /** Gone from the outbox: the server confirmed it (or it was discarded). */
  | { status: 'delivered' };

/** Follows one entry a form wrote, so the form can show the server's answer when it comes. */
export function useWatchedEntry(key: string | null): WatchedEntry {
  const entries = useOutboxEntries();
  if (!key) return { status: 'none' };
  const entry = entries.find((e) => e.key === key);
  if (!entry) return { status: 'delivered' };
  return entry.state === 'failed' ? { status: 'failed', entry } : { status: 'waiting', entry };
}
