import { createStore } from 'idb-keyval';
import type { FieldErrors } from '@shared/api/api-error.schema';

/*
 * The outbox: every change made at the car is written to the device first and sent
 * after, in order, until the server confirms it. A weak signal, a killed tab or a
 * flat battery between the two cannot lose it, and a replay cannot double it: each
 * record carries an id made on the device, and the server treats a repeat as the
 * same record. Every tab of the site shares the stored entries, one record each, so
 * a second tab open at the car neither hides nor overwrites what the first queued.
 */

export type OutboxMethod = 'POST' | 'PATCH' | 'DELETE';
export type OutboxState = 'waiting' | 'sending' | 'failed';

export interface OutboxError {
  status: number;
  code: string;
  message: string;
  fieldErrors?: FieldErrors;
}

export interface OutboxEntry {
  /** This entry's own id. */
  key: string;
  /** The record the entry creates or changes; entries for one record are sent strictly in order. */
  recordId: string;
  /** What it does, e.g. `run.create`, `run.update`, `run.delete`, `setup.quickChange`. */
  kind: string;
  method: OutboxMethod;
  path: string;
  body?: unknown;
  /** One line for people: "Run 3 · 45.678". */
  label: string;
  /** Where it belongs, for screens that show pending work beside saved work. */
  scope: Record<string, string>;
  createdAt: number;
  attempts: number;
  nextAttemptAt: number;
  state: OutboxState;
  /** Set when the server refused the entry; it stays until fixed or discarded. */
  error?: OutboxError;
  /** The account that made it; none (entries stored before accounts were recorded) or null (made while nobody was signed in) is anyone's. */
  owner?: string | null;
}

export type NewOutboxEntry = Pick<OutboxEntry, 'recordId' | 'kind' | 'method' | 'path' | 'body' | 'label' | 'scope'> & {
  key?: string;
};

/** Entries to write and keys to remove; every other entry on the device stays as it is. */
export interface OutboxChange {
  put?: OutboxEntry[];
  remove?: string[];
}

/**
 * Where entries are kept. Every tab of the site shares it, so a tab never writes its list over it:
 * `change` reads what is stored now, writes only what its callback returns, with no other tab's
 * change in between, and resolves with what is then stored. Without a callback it only reads.
 */
export interface OutboxStorage {
  change(fn?: (stored: OutboxEntry[]) => OutboxChange | undefined): Promise<OutboxEntry[]>;
}

/** What a failed send means for the entry. */
export type SendFailure = { kind: 'retry'; reason: string } | { kind: 'refused'; error: OutboxError } | { kind: 'gone' };

export interface OutboxOptions {
  storage: OutboxStorage;
  /** Sends one entry; resolves with the server's answer. */
  send: (entry: OutboxEntry) => Promise<unknown>;
  /** Classifies a send error: try again later, refused for good, or already gone (a delete of a deleted record). */
  classify: (error: unknown) => SendFailure;
  onDelivered?: (entry: OutboxEntry, result: unknown) => void;
  /**
   * Who is signed in now. An entry is shown, sent and cleared only while the account that made it is:
   * after a session the server ended, the next person to sign in on the phone must not upload the
   * last one's runs as their own.
   */
  owner?: () => string | null | undefined;
  now?: () => number;
  newKey?: () => string;
  /** Backoff after the n-th failed try, ms. */
  backoffMs?: (attempts: number) => number;
  /** Timers, replaceable in tests. */
  setTimer?: (fn: () => void, ms: number) => unknown;
  clearTimer?: (handle: unknown) => void;
  /** Runs a flush while no other tab flushes; by default a Web Lock where the browser has them. */
  lock?: (run: () => Promise<void>) => Promise<unknown>;
}

const defaultBackoff = (attempts: number) => Math.min(60_000, 1000 * 2 ** Math.max(0, attempts - 1));

/**
 * One Web Lock for every tab of the site: while one tab holds it, the others' requests queue
 * (Web Locks API, §1: https://www.w3.org/TR/web-locks/). Browsers without it still send each
 * entry; a second tab may then send one twice, which the server's idempotency absorbs.
 */
const defaultLock = (run: () => Promise<void>) =>
  typeof navigator !== 'undefined' && navigator.locks ? navigator.locks.request('scrubline-outbox', run) : run();

export class Outbox {
  private entries: OutboxEntry[] = [];
  private listeners = new Set<() => void>();
  private flushing: Promise<void> | null = null;
  private again = false;
  private timer: unknown = null;
  private loaded: Promise<void>;
  private lastRetryReason: string | null = null;
  /** The entry this tab is sending; any other marked as sending belongs to another tab, or to a page that died. */
  private sendingKey: string | null = null;
  private readonly o: Required<Omit<OutboxOptions, 'onDelivered'>> & Pick<OutboxOptions, 'onDelivered'>;

  constructor(options: OutboxOptions) {
    this.o = {
      now: Date.now,
      newKey: () => crypto.randomUUID(),
      backoffMs: defaultBackoff,
      setTimer: (fn, ms) => setTimeout(fn, ms),
      clearTimer: (h) => clearTimeout(h as ReturnType<typeof setTimeout>),
      lock: defaultLock,
      owner: () => undefined,
      ...options,
    };
    this.loaded = this.change();
  }

  /** Resolves once the stored entries are loaded. */
  ready(): Promise<void> {
    return this.loaded;
  }

  getSnapshot = (): readonly OutboxEntry[] => this.entries;

  /** Reads the device again, for what another tab has changed there. */
  reload(): Promise<void> {
    return this.change();
  }

  /** Every entry on the device, whoever made it: the sign-in page counts those waiting for their account. */
  stored(): Promise<OutboxEntry[]> {
    return this.o.storage.change();
  }

  subscribe = (listener: () => void): (() => void) => {
    this.listeners.add(listener);
    return () => this.listeners.delete(listener);
  };

  /** Why the last try did not get through (e.g. "No connection"), while entries wait. */
  retryReason(): string | null {
    return this.entries.some((e) => e.state !== 'failed') ? this.lastRetryReason : null;
  }

  /**
   * Adds an entry and resolves once it is stored on the device, before anything is sent.
   * An edit of a record whose creation has not been sent is folded into the creation;
   * a delete of such a record removes both, so nothing is sent at all. Whether the creation
   * is still unsent is decided from the device, where another tab may have sent it.
   */
  async add(input: NewOutboxEntry): Promise<OutboxEntry | null> {
    await this.loaded;
    let added: OutboxEntry | null = null;
    await this.change((stored) => {
      const unsentCreate = stored.find(
        (e) => e.recordId === input.recordId && e.method === 'POST' && e.state === 'waiting' && e.attempts === 0,
      );
      if (unsentCreate && input.method === 'DELETE') {
        added = null;
        return { remove: stored.filter((e) => e.recordId === input.recordId && e.state !== 'sending').map((e) => e.key) };
      }
      if (unsentCreate && input.method === 'PATCH' && isObject(input.body) && isObject(unsentCreate.body)) {
        const { version: _version, ...changes } = input.body;
        added = { ...unsentCreate, body: { ...unsentCreate.body, ...changes }, label: input.label };
        return { put: [added] };
      }
      const now = this.o.now();
      added = {
        key: input.key ?? this.o.newKey(),
        recordId: input.recordId,
        kind: input.kind,
        method: input.method,
        path: input.path,
        body: input.body,
        label: input.label,
        scope: input.scope,
        // Also the order of sending, so it only goes up, even when two entries share a millisecond.
        createdAt: Math.max(now, (stored.at(-1)?.createdAt ?? 0) + 1),
        attempts: 0,
        nextAttemptAt: now,
        state: 'waiting',
        owner: this.o.owner(),
      };
      return { put: [added] };
    });
    if (added) this.kick();
    return added;
  }

  /**
   * Sends what is due, oldest first, including what other tabs added. Safe to call any time;
   * concurrent calls share one flush, and tabs take turns.
   */
  flush(): Promise<void> {
    this.again = true;
    this.flushing ??= this.passes().finally(() => {
      this.flushing = null;
      this.schedule();
    });
    return this.flushing;
  }

  /** A flush asked for during a pass gets a pass of its own after it, so nothing added meanwhile waits for a timer. */
  private async passes() {
    await this.loaded;
    while (this.again) {
      this.again = false;
      await this.o.lock(() => this.pass());
    }
  }

  /** A refused entry, fixed or not, goes back in line. */
  async retry(key: string, body?: unknown): Promise<void> {
    await this.update(key, () => ({ state: 'waiting', error: undefined, nextAttemptAt: this.o.now(), ...(body !== undefined ? { body } : {}) }));
    this.kick();
  }

  /** Retry everything that is waiting now, without waiting for the backoff. */
  async retryNow(): Promise<void> {
    const now = this.o.now();
    await this.change((stored) => ({ put: stored.filter((e) => e.state === 'waiting').map((e) => ({ ...e, nextAttemptAt: now })) }));
    await this.flush();
  }

  /** Drops one entry by its key, or every entry a test picks (one that is on its way stays), in one write. */
  async discard(which: string | ((entry: OutboxEntry) => boolean)): Promise<void> {
    await this.change((stored) => ({
      remove: typeof which === 'string' ? [which] : stored.filter((e) => e.state !== 'sending' && which(e)).map((e) => e.key),
    }));
  }

  /**
   * Removes an account's entries from the device (sign-out): by default the signed-in account's, but a
   * sign-out names the account it began for, as a read refused meanwhile may already have marked nobody
   * signed in. Another account's entries stay for it.
   */
  async clear(owner = this.o.owner()): Promise<void> {
    await this.loaded;
    if (this.timer !== null) this.o.clearTimer(this.timer);
    this.timer = null;
    await this.change((stored) => ({ remove: stored.filter((e) => ownedBy(e, owner)).map((e) => e.key) }));
  }

  /**
   * Strictly first in, first out: a run logged at an event created offline must not
   * arrive before the event. A refused entry is stepped over, but later entries for
   * the same record wait behind it.
   */
  private async pass(): Promise<void> {
    for (;;) {
      let next: OutboxEntry | undefined;
      // Marked as sending on the device, so no tab folds an edit into it while it is on its way.
      await this.change((stored) => {
        next = head(stored.filter(this.mine));
        if (!next || next.nextAttemptAt > this.o.now()) return (next = undefined);
        this.sendingKey = next.key;
        return { put: [{ ...next, state: 'sending' }] };
      });
      if (!next) return;
      const { key, attempts } = next;
      try {
        const result = await this.o.send(next);
        this.lastRetryReason = null;
        await this.change(() => ({ remove: [key] }));
        this.o.onDelivered?.(next, result);
      } catch (error) {
        const failure = this.o.classify(error);
        if (failure.kind === 'gone') {
          await this.change(() => ({ remove: [key] }));
          continue;
        }
        if (failure.kind === 'refused') {
          await this.update(key, () => ({ state: 'failed', error: failure.error, attempts: attempts + 1 }));
          continue;
        }
        // No connection or a struggling server: everything behind waits too.
        this.lastRetryReason = failure.reason;
        await this.update(key, () => ({ state: 'waiting', attempts: attempts + 1, nextAttemptAt: this.o.now() + this.o.backoffMs(attempts + 1) }));
        return;
      } finally {
        this.sendingKey = null;
      }
    }
  }

  private kick() {
    void this.flush();
  }

  private schedule() {
    if (this.timer !== null) this.o.clearTimer(this.timer);
    this.timer = null;
    const next = head(this.entries);
    if (!next) return;
    const due = next.nextAttemptAt;
    this.timer = this.o.setTimer(() => {
      this.timer = null;
      void this.flush();
    }, Math.max(0, due - this.o.now()));
  }

  /** Changes an entry if it is still on the device: one another tab has delivered is not brought back. */
  private update(key: string, patch: (stored: OutboxEntry) => Partial<OutboxEntry>) {
    return this.change((stored) => {
      const e = stored.find((s) => s.key === key);
      return e && { put: [{ ...e, ...patch(e) }] };
    });
  }

  /** Writes a change through to the device and shows what the device then holds, oldest first. */
  private async change(fn?: (stored: OutboxEntry[]) => OutboxChange | undefined) {
    const stored = await this.o.storage.change(fn && ((s) => fn(byAge(s))));
    // An entry marked as sending by a page that died is simply waiting again; the server's idempotency makes a resend safe.
    this.entries = byAge(stored).filter(this.mine).map((e) => (e.state === 'sending' && e.key !== this.sendingKey ? { ...e, state: 'waiting' } : e));
    this.emit();
  }

  private mine = (e: OutboxEntry) => ownedBy(e, this.o.owner());

  private emit() {
    for (const l of this.listeners) l();
  }
}

/** The first entry that may be sent: not refused, and not behind a refused entry of its record. */
function head(entries: readonly OutboxEntry[]): OutboxEntry | undefined {
  const blocked = new Set(entries.filter((e) => e.state === 'failed').map((e) => e.recordId));
  return entries.find((e) => e.state !== 'failed' && !blocked.has(e.recordId));
}

/** An entry with no owner is anyone's. */
const ownedBy = (e: OutboxEntry, owner: string | null | undefined) => e.owner == null || e.owner === owner;

const byAge = (entries: OutboxEntry[]) => [...entries].sort((a, b) => a.createdAt - b.createdAt);

function isObject(v: unknown): v is Record<string, unknown> {
  return typeof v === 'object' && v !== null && !Array.isArray(v);
}

/** Keeps entries in memory only (tests, or a browser without IndexedDB). */
export function memoryStorage(initial: OutboxEntry[] = []): OutboxStorage & { saved: OutboxEntry[] } {
  const copy = (entries: OutboxEntry[]) => entries.map((e) => ({ ...e }));
  const store = {
    saved: initial,
    change: async (fn?: (stored: OutboxEntry[]) => OutboxChange | undefined) => {
      const { put = [], remove = [] } = fn?.(copy(store.saved)) ?? {};
      // Rewritten in place, so entries made in one millisecond keep their order.
      const byKey = new Map(store.saved.map((e) => [e.key, e]));
      for (const e of copy(put)) byKey.set(e.key, e);
      for (const key of remove) byKey.delete(key);
      store.saved = [...byKey.values()];
      return copy(store.saved);
    },
  };
  return store;
}

const PREFIX = 'outbox:';

/**
 * Keeps entries in the site's IndexedDB, one record per entry under `outbox:<key>`, beside the
 * rest of what the app keeps on the device. Each change is one read-write transaction, and
 * IndexedDB runs read-write transactions on one store one after another, whichever tab opened
 * them (Indexed Database API, "Transaction scheduling": https://www.w3.org/TR/IndexedDB/).
 * A list stored whole under `outbox`, as earlier versions did, is moved into records on the
 * first change.
 */
export function deviceStorage(): OutboxStorage {
  if (typeof indexedDB === 'undefined') return memoryStorage();
  const store = createStore('scrubline', 'device');
  return {
    change: (fn) =>
      store('readwrite', (os) => {
        const list = os.get('outbox');
        const records = os.getAll(IDBKeyRange.bound(PREFIX, `${PREFIX}\uffff`));
        let stored: OutboxEntry[] = [];
        records.onsuccess = () => {
          const migrated: OutboxEntry[] = [];
          let last = 0;
          for (const e of Array.isArray(list.result) ? (list.result as OutboxEntry[]) : []) {
            // The list's order is the order of sending; a shared millisecond must not reorder it.
            last = Math.max(e.createdAt, last + 1);
            if (!records.result.some((s) => (s as OutboxEntry).key === e.key)) migrated.push({ ...e, createdAt: last });
          }
          if (list.result !== undefined) os.delete('outbox');
          const current = [...(records.result as OutboxEntry[]), ...migrated];
          const { put = [], remove = [] } = fn?.(current) ?? {};
          const byKey = new Map([...current, ...put].map((e) => [e.key, e]));
          for (const e of [...migrated, ...put]) os.put(e, PREFIX + e.key);
          for (const key of remove) {
            os.delete(PREFIX + key);
            byKey.delete(key);
          }
          stored = [...byKey.values()];
        };
        return new Promise<OutboxEntry[]>((resolve, reject) => {
          os.transaction.oncomplete = () => resolve(stored);
          os.transaction.onabort = () => reject(os.transaction.error);
        });
      }),
  };
}
