import { createStore, del, get, set, type UseStore } from 'idb-keyval';

/*
 * What the app keeps on the device, in IndexedDB: the last data the server sent (so the
 * trackside screen opens with no signal). The outbox keeps its entries in the same store,
 * one record each (deviceStorage in outbox.ts).
 */

let store: UseStore | null = null;
function deviceStore(): UseStore | null {
  if (typeof indexedDB === 'undefined') return null;
  store ??= createStore('scrubline', 'device');
  return store;
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
