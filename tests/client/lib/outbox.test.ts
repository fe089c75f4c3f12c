import { describe, expect, it, vi } from 'vitest';
import { memoryStorage, Outbox, type OutboxEntry, type SendFailure } from '../../../src/lib/outbox';

class Offline extends Error {}
class Refused extends Error {
  constructor(readonly status: number, readonly code: string) {
    super(code);
  }
}

function setup(opts: { initial?: OutboxEntry[]; send?: (e: OutboxEntry) => Promise<unknown>; owner?: () => string | null } = {}) {
  let clock = 1_000_000;
  let key = 0;
  const storage = memoryStorage(opts.initial);
  const sent: OutboxEntry[] = [];
  const delivered: string[] = [];
  const timers: { fn: () => void; at: number }[] = [];
  let online = true;
  const outbox = new Outbox({
    storage,
    now: () => clock,
    newKey: () => `k${++key}`,
    send:
      opts.send ??
      (async (e) => {
        if (!online) throw new Offline();
        sent.push(e);
        return { ok: true };
      }),
    classify: (err): SendFailure => {
      if (err instanceof Refused) {
        return err.status === 404 && err.code === 'gone' ? { kind: 'gone' } : { kind: 'refused', error: { status: err.status, code: err.code, message: err.code } };
      }
      return { kind: 'retry', reason: 'No connection' };
    },
    onDelivered: (e) => delivered.push(e.key),
    ...(opts.owner ? { owner: opts.owner } : {}),
    setTimer: (fn, ms) => {
      const t = { fn, at: clock + ms };
      timers.push(t);
      return t;
    },
    clearTimer: (t) => {
      const i = timers.indexOf(t as (typeof timers)[number]);
      if (i >= 0) timers.splice(i, 1);
    },
  });
  return {
    outbox,
    storage,
    sent,
    delivered,
    timers,
    setOnline: (v: boolean) => (online = v),
    advance: (ms: number) => (clock += ms),
  };
}

const run = (recordId: string, label = 'Run') => ({
  recordId,
  kind: 'run.create',
  method: 'POST' as const,
  path: '/api/runs',
  body: { id: recordId, rawTimeSec: 45.678 },
  label,
  scope: { eventId: 'e1' },
});

describe('the outbox', () => {
  it('when an entry is added, then it is stored before anything is sent', async () => {
    const t = setup();
    let storedAtSend = -1;
    const outbox = new Outbox({
      storage: t.storage,
      send: async () => {
        storedAtSend = t.storage.saved.length;
      },
      classify: () => ({ kind: 'retry', reason: 'x' }),
    });
    await outbox.add(run('r1'));
    await outbox.flush();
    expect(storedAtSend).toBe(1);
    expect(t.storage.saved).toHaveLength(0);
  });

  it('when online, then entries are sent in the order they were added and removed once confirmed', async () => {
    const t = setup();
    t.setOnline(false);
    await t.outbox.add(run('r1'));
    await t.outbox.add(run('r2'));
    await t.outbox.add(run('r3'));
    await t.outbox.flush();
    expect(t.sent).toHaveLength(0);
    expect(t.outbox.getSnapshot().map((e) => e.state)).toEqual(['waiting', 'waiting', 'waiting']);
    expect(t.outbox.retryReason()).toBe('No connection');
    t.setOnline(true);
    await t.outbox.retryNow();
    expect(t.sent.map((e) => e.recordId)).toEqual(['r1', 'r2', 'r3']);
    expect(t.outbox.getSnapshot()).toHaveLength(0);
    expect(t.storage.saved).toHaveLength(0);
    expect(t.delivered).toHaveLength(3);
  });

  it('when the page is reloaded with entries waiting, then they are loaded and sent, including one caught mid-send', async () => {
    const stored: OutboxEntry[] = [
      { key: 'a', recordId: 'r1', kind: 'run.create', method: 'POST', path: '/api/runs', body: {}, label: 'Run 1', scope: {}, createdAt: 1, attempts: 1, nextAttemptAt: 0, state: 'sending' },
      { key: 'b', recordId: 'r2', kind: 'run.create', method: 'POST', path: '/api/runs', body: {}, label: 'Run 2', scope: {}, createdAt: 2, attempts: 0, nextAttemptAt: 0, state: 'waiting' },
    ];
    const t = setup({ initial: stored });
    await t.outbox.ready();
    expect(t.outbox.getSnapshot().map((e) => e.state)).toEqual(['waiting', 'waiting']);
    await t.outbox.flush();
    expect(t.sent.map((e) => e.key)).toEqual(['a', 'b']);
  });

  it('when a send fails for lack of connection, then it backs off and tries again later by itself', async () => {
    const t = setup();
    t.setOnline(false);
    await t.outbox.add(run('r1'));
    await t.outbox.flush();
    const entry = t.outbox.getSnapshot()[0]!;
    expect(entry.attempts).toBeGreaterThanOrEqual(1);
    expect(t.timers.length).toBe(1);
    expect(t.timers[0]!.at).toBe(entry.nextAttemptAt);
    t.setOnline(true);
    t.advance(entry.nextAttemptAt);
    t.timers.shift()!.fn();
    await t.outbox.flush();
    expect(t.sent).toHaveLength(1);
  });

  it('when the server refuses an entry, then it stays with its error, later work for other records still goes, and it can be fixed and retried', async () => {
    let refuse = true;
    const sent: string[] = [];
    const t = setup({
      send: async (e) => {
        if (e.recordId === 'bad' && refuse) throw new Refused(400, 'validation_failed');
        sent.push(e.recordId);
      },
    });
    await t.outbox.add(run('bad'));
    await t.outbox.add({ ...run('bad'), kind: 'run.update', method: 'PATCH', path: '/api/runs/bad', body: { cones: 1, version: 1 } });
    await t.outbox.add(run('good'));
    await t.outbox.flush();
    expect(sent).toEqual(['good']);
    const [failed, behind] = t.outbox.getSnapshot();
    expect(failed).toMatchObject({ state: 'failed', error: { status: 400, code: 'validation_failed' } });
    expect(behind).toMatchObject({ state: 'waiting', recordId: 'bad' });
    refuse = false;
    await t.outbox.retry(failed!.key, { id: 'bad', rawTimeSec: 46.1 });
    await t.outbox.flush();
    expect(sent).toEqual(['good', 'bad', 'bad']);
    expect(t.outbox.getSnapshot()).toHaveLength(0);
  });

  it('when a record is edited before its creation was sent, then the edit is folded into the creation', async () => {
    const t = setup();
    t.setOnline(false);
    await t.outbox.add(run('r1', 'Run 1 · 45.678'));
    await t.outbox.flush();
    // Attempted once already: the edit must not be folded into an entry that may have reached the server.
    await t.outbox.add(run('r2', 'Run 2 · 45.678'));
    await t.outbox.add({ ...run('r2'), kind: 'run.update', method: 'PATCH', path: '/api/runs/r2', body: { cones: 2, version: 1 }, label: 'Run 2 · 45.678 +2' });
    const entries = t.outbox.getSnapshot();
    expect(entries).toHaveLength(2);
    expect(entries[1]!.body).toEqual({ id: 'r2', rawTimeSec: 45.678, cones: 2 });
    expect(entries[1]!.label).toBe('Run 2 · 45.678 +2');
  });

  it('when a record is deleted before its creation was sent, then nothing about it is sent at all', async () => {
    const t = setup();
    t.setOnline(false);
    await t.outbox.add(run('r0'));
    await t.outbox.flush(); // r0 attempted: it blocks the head with a backoff
    await t.outbox.add(run('r1'));
    await t.outbox.add({ ...run('r1'), kind: 'run.delete', method: 'DELETE', path: '/api/runs/r1', body: undefined });
    expect(t.outbox.getSnapshot().map((e) => e.recordId)).toEqual(['r0']);
  });

  it('when a delete finds the record already gone, then the entry is done', async () => {
    const t = setup({ send: async () => Promise.reject(new Refused(404, 'gone')) });
    await t.outbox.add({ ...run('r1'), method: 'DELETE', path: '/api/runs/r1', kind: 'run.delete' });
    await t.outbox.flush();
    expect(t.outbox.getSnapshot()).toHaveLength(0);
  });

  it('when cleared (sign-out), then nothing is left on the device', async () => {
    const t = setup();
    t.setOnline(false);
    await t.outbox.add(run('r1'));
    await t.outbox.clear();
    expect(t.outbox.getSnapshot()).toHaveLength(0);
    expect(t.storage.saved).toHaveLength(0);
  });

  describe('whose entries', () => {
    it('when the session of the account that queued runs ends and another account signs in on the phone, then that account neither sees, sends nor clears them, and they go once their own account is back', async () => {
      let signedIn: string | null = 'ana';
      const t = setup({ owner: () => signedIn });
      t.setOnline(false);
      await t.outbox.add(run('r1', 'Ana run 1'));
      await t.outbox.add(run('r2', 'Ana run 2'));
      expect(t.storage.saved.map((e) => e.owner)).toEqual(['ana', 'ana']);

      // The server ended Ana's session; Ben signs in on the same phone, with signal.
      signedIn = null;
      await t.outbox.retryNow();
      expect(t.outbox.getSnapshot()).toEqual([]);
      signedIn = 'ben';
      t.setOnline(true);
      await t.outbox.retryNow();
      await t.outbox.add(run('r3', 'Ben run 1'));
      await t.outbox.flush();
      expect(t.sent.map((e) => e.recordId)).toEqual(['r3']);
      expect(t.outbox.getSnapshot()).toEqual([]);
      expect(t.outbox.retryReason()).toBeNull();

      // Ben signs out: his entries would go, Ana's stay for her.
      await t.outbox.clear();
      expect(t.storage.saved.map((e) => e.recordId)).toEqual(['r1', 'r2']);

      signedIn = 'ana';
      await t.outbox.retryNow();
      expect(t.sent.map((e) => e.recordId)).toEqual(['r3', 'r1', 'r2']);
      expect(t.storage.saved).toEqual([]);
    });

    it('when entries were stored before accounts were recorded, then whoever signs in sends them, as before', async () => {
      const legacy: OutboxEntry = { key: 'a', recordId: 'r1', kind: 'run.create', method: 'POST', path: '/api/runs', body: {}, label: 'Run 1', scope: {}, createdAt: 1, attempts: 0, nextAttemptAt: 0, state: 'waiting' };
      const t = setup({ initial: [legacy], owner: () => 'ana' });
      await t.outbox.ready();
      expect(t.outbox.getSnapshot().map((e) => e.key)).toEqual(['a']);
      await t.outbox.flush();
      expect(t.sent.map((e) => e.key)).toEqual(['a']);
    });

    it('when nobody is signed in, then an entry of an account waits, unseen', async () => {
      let signedIn: string | null = 'ana';
      const t = setup({ owner: () => signedIn });
      t.setOnline(false);
      await t.outbox.add(run('r1'));
      await t.outbox.flush();
      signedIn = null;
      t.setOnline(true);
      await t.outbox.retryNow();
      expect(t.sent).toEqual([]);
      expect(t.outbox.getSnapshot()).toEqual([]);
      expect(t.timers).toEqual([]);
      expect(t.storage.saved.map((e) => e.recordId)).toEqual(['r1']);
      // Unseen, but counted: what the device holds, whoever made it (the sign-in page says so).
      expect((await t.outbox.stored()).map((e) => [e.recordId, e.owner])).toEqual([['r1', 'ana']]);
    });
  });

  it('when an entry is added while another is being sent, then it is sent in the same flush, without waiting for a timer', async () => {
    let arrive!: () => void;
    const held = new Promise<void>((resolve) => (arrive = resolve));
    const sent: string[] = [];
    const t = setup({
      send: async (e) => {
        sent.push(e.recordId);
        if (e.recordId === 'r1') await held;
      },
    });
    await t.outbox.add(run('r1'));
    const flushed = t.outbox.flush();
    await t.outbox.add(run('r2'));
    arrive();
    await flushed;
    expect(sent).toEqual(['r1', 'r2']);
    expect(t.timers).toHaveLength(0);
  });

  it('when subscribed, then listeners hear every change', async () => {
    const t = setup();
    const listener = vi.fn();
    t.outbox.subscribe(listener);
    await t.outbox.add(run('r1'));
    await t.outbox.flush();
    expect(listener).toHaveBeenCalled();
  });
});
