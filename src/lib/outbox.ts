import type { FieldErrors } from '@shared/api/api-error.schema';

/*
 * The outbox: every change made at the car is written to the device first and sent
 * after, in order, until the server confirms it. A weak signal, a killed tab or a
 * flat battery between the two cannot lose it, and a replay cannot double it: each
 * record carries an id made on the device, and the server treats a repeat as the
 * same record.
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
}

export type NewOutboxEntry = Pick<OutboxEntry, 'recordId' | 'kind' | 'method' | 'path' | 'body' | 'label' | 'scope'> & {
  key?: string;
};

export interface OutboxStorage {
  load(): Promise<OutboxEntry[]>;
  save(entries: OutboxEntry[]): Promise<void>;
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
  now?: () => number;
  newKey?: () => string;
  /** Backoff after the n-th failed try, ms. */
  backoffMs?: (attempts: number) => number;
  /** Timers, replaceable in tests. */
  setTimer?: (fn: () => void, ms: number) => unknown;
  clearTimer?: (handle: unknown) => void;
}

const defaultBackoff = (attempts: number) => Math.min(60_000, 1000 * 2 ** Math.max(0, attempts - 1));

export class Outbox {
  private entries: OutboxEntry[] = [];
  private listeners = new Set<() => void>();
  private flushing: Promise<void> | null = null;
  private timer: unknown = null;
  private loaded: Promise<void>;
  private lastRetryReason: string | null = null;
  private readonly o: Required<Omit<OutboxOptions, 'onDelivered'>> & Pick<OutboxOptions, 'onDelivered'>;

  constructor(options: OutboxOptions) {
    this.o = {
      now: Date.now,
      newKey: () => crypto.randomUUID(),
      backoffMs: defaultBackoff,
      setTimer: (fn, ms) => setTimeout(fn, ms),
      clearTimer: (h) => clearTimeout(h as ReturnType<typeof setTimeout>),
      ...options,
    };
    this.loaded = this.o.storage.load().then((stored) => {
      // An entry caught mid-send when the page died is simply waiting again; the server's idempotency makes the resend safe.
      this.entries = [...stored.map((e) => (e.state === 'sending' ? { ...e, state: 'waiting' as const } : e)), ...this.entries];
      this.emit();
    });
  }

  /** Resolves once the stored entries are loaded. */
  ready(): Promise<void> {
    return this.loaded;
  }

  getSnapshot = (): readonly OutboxEntry[] => this.entries;

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
   * a delete of such a record removes both, so nothing is sent at all.
   */
  async add(input: NewOutboxEntry): Promise<OutboxEntry | null> {
    await this.loaded;
    const unsentCreate = this.entries.find(
      (e) => e.recordId === input.recordId && e.method === 'POST' && e.state === 'waiting' && e.attempts === 0,
    );
    if (unsentCreate && input.method === 'DELETE') {
      this.entries = this.entries.filter((e) => e.recordId !== input.recordId || e.state === 'sending');
      await this.persist();
      return null;
    }
    if (unsentCreate && input.method === 'PATCH' && isObject(input.body) && isObject(unsentCreate.body)) {
      const { version: _version, ...changes } = input.body;
      const merged = { ...unsentCreate, body: { ...unsentCreate.body, ...changes }, label: input.label };
      this.entries = this.entries.map((e) => (e.key === unsentCreate.key ? merged : e));
      await this.persist();
      this.kick();
      return merged;
    }
    const now = this.o.now();
    const entry: OutboxEntry = {
      key: input.key ?? this.o.newKey(),
      recordId: input.recordId,
      kind: input.kind,
      method: input.method,
      path: input.path,
      body: input.body,
      label: input.label,
      scope: input.scope,
      createdAt: now,
      attempts: 0,
      nextAttemptAt: now,
      state: 'waiting',
    };
    this.entries = [...this.entries, entry];
    await this.persist();
    this.kick();
    return entry;
  }

  /** Sends what is due, oldest first. Safe to call any time; concurrent calls share one pass. */
  flush(): Promise<void> {
    this.flushing ??= this.loaded.then(() => this.pass()).finally(() => {
      this.flushing = null;
      this.schedule();
    });
    return this.flushing;
  }

  /** A refused entry, fixed or not, goes back in line. */
  async retry(key: string, body?: unknown): Promise<void> {
    this.entries = this.entries.map((e) =>
      e.key === key ? { ...e, state: 'waiting', error: undefined, nextAttemptAt: this.o.now(), ...(body !== undefined ? { body } : {}) } : e,
    );
    await this.persist();
    this.kick();
  }

  /** Retry everything that is waiting now, without waiting for the backoff. */
  async retryNow(): Promise<void> {
    const now = this.o.now();
    this.entries = this.entries.map((e) => (e.state === 'waiting' ? { ...e, nextAttemptAt: now } : e));
    await this.persist();
    await this.flush();
  }

  async discard(key: string): Promise<void> {
    this.entries = this.entries.filter((e) => e.key !== key);
    await this.persist();
  }

  /** Removes everything (sign-out). */
  async clear(): Promise<void> {
    await this.loaded;
    this.entries = [];
    if (this.timer !== null) this.o.clearTimer(this.timer);
    this.timer = null;
    await this.persist();
  }

  /**
   * Strictly first in, first out: a run logged at an event created offline must not
   * arrive before the event. A refused entry is stepped over, but later entries for
   * the same record wait behind it.
   */
  private async pass(): Promise<void> {
    for (;;) {
      const next = this.head();
      if (!next || next.nextAttemptAt > this.o.now()) return;
      this.update(next.key, { state: 'sending' });
      try {
        const result = await this.o.send(next);
        this.entries = this.entries.filter((e) => e.key !== next.key);
        this.lastRetryReason = null;
        await this.persist();
        this.o.onDelivered?.(next, result);
      } catch (error) {
        const failure = this.o.classify(error);
        if (failure.kind === 'gone') {
          this.entries = this.entries.filter((e) => e.key !== next.key);
          await this.persist();
          continue;
        }
        if (failure.kind === 'refused') {
          this.update(next.key, { state: 'failed', error: failure.error, attempts: next.attempts + 1 });
          await this.persist();
          continue;
        }
        // No connection or a struggling server: everything behind waits too.
        const attempts = next.attempts + 1;
        this.lastRetryReason = failure.reason;
        this.update(next.key, { state: 'waiting', attempts, nextAttemptAt: this.o.now() + this.o.backoffMs(attempts) });
        await this.persist();
        return;
      }
    }
  }

  /** The first entry that may be sent: not refused, and not behind a refused entry of its record. */
  private head(): OutboxEntry | undefined {
    const blocked = new Set(this.entries.filter((e) => e.state === 'failed').map((e) => e.recordId));
    return this.entries.find((e) => e.state !== 'failed' && !blocked.has(e.recordId));
  }

  private kick() {
    void this.flush();
  }

  private schedule() {
    if (this.timer !== null) this.o.clearTimer(this.timer);
    this.timer = null;
    const head = this.head();
    if (!head) return;
    const due = head.nextAttemptAt;
    this.timer = this.o.setTimer(() => {
      this.timer = null;
      void this.flush();
    }, Math.max(0, due - this.o.now()));
  }

  private update(key: string, patch: Partial<OutboxEntry>) {
    this.entries = this.entries.map((e) => (e.key === key ? { ...e, ...patch } : e));
    this.emit();
  }

  private async persist() {
    this.emit();
    await this.o.storage.save(this.entries);
  }

  private emit() {
    for (const l of this.listeners) l();
  }
}

function isObject(v: unknown): v is Record<string, unknown> {
  return typeof v === 'object' && v !== null && !Array.isArray(v);
}

/** Keeps entries in memory only (tests, or a browser without IndexedDB). */
export function memoryStorage(initial: OutboxEntry[] = []): OutboxStorage & { saved: OutboxEntry[] } {
  const store = {
    saved: initial,
    load: async () => store.saved.map((e) => ({ ...e })),
    save: async (entries: OutboxEntry[]) => {
      store.saved = entries.map((e) => ({ ...e }));
    },
  };
  return store;
}
