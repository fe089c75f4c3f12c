import { createStore, del, get, set, type UseStore } from 'idb-keyval';
import type { OutboxEntry, OutboxStorage } from './outbox';
import { memoryStorage } from './outbox';

/*
 * What the app keeps on the device, in IndexedDB: the outbox and the last data the
 * server sent (so the trackside screen opens with no signal).
 */

let store: UseStore | null = null;
function deviceStore(): UseStore | null {
  if (typeof indexedDB === 'undefined') return null;
  store ??= createStore('scrubline', 'device');
  return store;
}

const OUTBOX_KEY = 'outbox';

export function outboxStorage(): OutboxStorage {
  const s = deviceStore();
  if (!s) return memoryStorage();
  return {
    load: async () => ((await get<OutboxEntry[]>(OUTBOX_KEY, s)) ?? []),
    save: (entries) => set(OUTBOX_KEY, entries, s),
  };
}

/** An async key-value storage for TanStack Query's persister. */
export const queryCacheStorage = {
  getItem: async (key: string) => {
    const s = deviceStore();
    return s ? ((await get<string>(key, s)) ?? null) : null;
  },
  setItem: async (key: string, value: string) => {
    const s = deviceStore();
    if (s) await set(key, value, s);
  },
  removeItem: async (key: string) => {
    const s = deviceStore();
    if (s) await del(key, s);
  },
};
