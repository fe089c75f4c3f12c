import { createContext, useContext, useMemo, useSyncExternalStore, type ReactNode } from 'react';
import { useMutation } from '@tanstack/react-query';
import type { NewOutboxEntry, Outbox, OutboxEntry } from './outbox';

const OutboxContext = createContext<Outbox | null>(null);

export function OutboxProvider({ outbox, children }: { outbox: Outbox; children: ReactNode }) {
  return <OutboxContext.Provider value={outbox}>{children}</OutboxContext.Provider>;
}

export function useOutbox(): Outbox {
  const outbox = useContext(OutboxContext);
  if (!outbox) throw new Error('useOutbox needs an OutboxProvider');
  return outbox;
}

/** Every entry not yet confirmed by the server, live. */
export function useOutboxEntries(): readonly OutboxEntry[] {
  const outbox = useOutbox();
  return useSyncExternalStore(outbox.subscribe, outbox.getSnapshot, outbox.getSnapshot);
}

/** Entries whose scope matches all the given keys, e.g. `{ eventId, carId }`. */
export function useOutboxEntriesFor(scope: Record<string, string | undefined>): OutboxEntry[] {
  const entries = useOutboxEntries();
  const key = JSON.stringify(scope);
  return useMemo(() => {
    const wanted = JSON.parse(key) as Record<string, string | undefined>;
    return entries.filter((e) => Object.entries(wanted).every(([k, v]) => v === undefined || e.scope[k] === v));
  }, [entries, key]);
}

/** The mutation key every outbox write uses; its mutationFn is registered once with setMutationDefaults. */
export const outboxMutationKey = (kind: string) => ['outbox', kind] as const;

/** Writes a change to the outbox (resolves once stored on the device, not when uploaded). */
export function useOutboxWrite(kind: string) {
  return useMutation<OutboxEntry | null, Error, NewOutboxEntry>({ mutationKey: outboxMutationKey(kind) });
}
