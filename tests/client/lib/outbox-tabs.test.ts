// IndexedDB for Node: every outbox in this file keeps its entries there, and several outboxes in one
// process share it as several tabs of one site do.
import 'fake-indexeddb/auto';
import { clear, createStore, get, keys, set } from 'idb-keyval';
import { afterEach, describe, expect, it } from 'vitest';
import { deviceStorage, Outbox, type NewOutboxEntry, type OutboxEntry } from '@/lib/outbox';

/** The app's store on the device, opened here as one more tab would. */
const device = createStore('scrubline', 'device');
afterEach(() => clear(device));

class Offline extends Error {}

/** One browser: a connection its tabs share, and what reached the server through it. */
function browser() {
  const net = { online: false, sent: [] as OutboxEntry[], hold: null as Promise<void> | null };
  // One exclusive lock for the browser's tabs, granted in request order, as navigator.locks grants one.
  let tail = Promise.resolve();
  const lock = (run: () => Promise<void>) => {
    const turn = tail.then(run);
    tail = turn.catch(() => undefined);
    return turn;
  };
  /** A tab of the app: an outbox over the device's storage. Timers never fire; each test drives the flushes. */
  const openTab = () =>
    new Outbox({
      storage: deviceStorage(),
      lock,
      send: async (entry) => {
        if (!net.online) throw new Offline();
        net.sent.push(entry);
        await net.hold;
        return { ok: true };
      },
      classify: () => ({ kind: 'retry', reason: 'No connection' }),
      setTimer: () => null,
      clearTimer: () => undefined,
    });
  const sentIds = () => net.sent.map((e) => `${e.method} ${e.recordId}`);
  return { net, openTab, sentIds };
}

const createRun = (recordId: string): NewOutboxEntry => ({
  recordId,
  kind: 'run.create',
  method: 'POST',
  path: '/api/runs',
  body: { id: recordId, rawTimeSec: 45.678 },
  label: `Run ${recordId}`,
  scope: { eventId: 'e1' },
});
const editRun = (recordId: string, body: Record<string, unknown>): NewOutboxEntry => ({
  ...createRun(recordId),
  kind: 'run.update',
  method: 'PATCH',
  path: `/api/runs/${recordId}`,
  body: { ...body, version: 1 },
});
const recordIds = (outbox: Outbox) => outbox.getSnapshot().map((e) => e.recordId);

describe('the outbox with several tabs open', () => {
  it('when two tabs each queue a run offline, then the device keeps both, a reopened tab sees both, and closing the first tab loses nothing', async () => {
    const { net, openTab, sentIds } = browser();
    const a = openTab();
    const b = openTab();
    await Promise.all([a.ready(), b.ready()]);
    await a.add(createRun('x'));
    await b.add(createRun('y'));

    // Tab A is closed here: nothing refers to it again.
    const reopened = openTab();
    await reopened.ready();
    expect(recordIds(reopened)).toEqual(['x', 'y']);

    net.online = true;
    await reopened.retryNow();
    expect(sentIds()).toEqual(['POST x', 'POST y']);
    expect(reopened.getSnapshot()).toEqual([]);
    // Tab B still shows y until it next looks at the device; its flush sends nothing again.
    await b.flush();
    expect(sentIds()).toEqual(['POST x', 'POST y']);
    expect(b.getSnapshot()).toEqual([]);
    expect(await keys(device)).toEqual([]);
  });

  it('when the signal returns and both tabs flush at once, then each queued run is sent exactly once, in the order queued', async () => {
    const { net, openTab, sentIds } = browser();
    const a = openTab();
    const b = openTab();
    await a.add(createRun('x'));
    await b.add(createRun('y'));
    await a.add(createRun('z'));

    net.online = true;
    await Promise.all([a.retryNow(), b.retryNow(), a.flush(), b.flush()]);
    expect(sentIds()).toEqual(['POST x', 'POST y', 'POST z']);
    expect([...a.getSnapshot(), ...b.getSnapshot()]).toEqual([]);
  });

  it('when a tab edits a run that another tab queued and has not tried to send, then the edit joins the queued run on the device', async () => {
    const { net, openTab, sentIds } = browser();
    const a = openTab();
    const b = openTab();
    await Promise.all([a.ready(), b.ready()]);
    await a.add(createRun('first')); // tried once offline: the runs behind it wait untried
    await a.add(createRun('x'));
    await b.add(editRun('x', { cones: 2 }));

    const reopened = openTab();
    await reopened.ready();
    expect(recordIds(reopened)).toEqual(['first', 'x']);
    expect(reopened.getSnapshot()[1]!.body).toEqual({ id: 'x', rawTimeSec: 45.678, cones: 2 });
    net.online = true;
    await reopened.retryNow();
    expect(sentIds()).toEqual(['POST first', 'POST x']);
  });

  it('when a tab edits a run while another tab is sending it, then the edit is sent after it rather than folded into a run already on its way', async () => {
    const { net, openTab, sentIds } = browser();
    const a = openTab();
    const b = openTab();
    await Promise.all([a.ready(), b.ready()]);
    net.online = true;
    let arrive!: () => void;
    net.hold = new Promise((resolve) => (arrive = resolve));
    await a.add(createRun('x'));
    await expect.poll(sentIds).toEqual(['POST x']);

    await b.add(editRun('x', { cones: 2 }));
    // Nothing more goes while the run is on its way.
    await new Promise((resolve) => setTimeout(resolve, 20));
    expect(sentIds()).toEqual(['POST x']);
    net.hold = null;
    arrive();
    await Promise.all([a.flush(), b.flush()]);
    expect(sentIds()).toEqual(['POST x', 'PATCH x']);
    expect(net.sent[1]!.body).toEqual({ cones: 2, version: 1 });
    expect(await keys(device)).toEqual([]);
  });

  it('when a tab deletes a run that another tab has already sent, then the delete is sent too', async () => {
    const { net, openTab, sentIds } = browser();
    const a = openTab();
    await a.add(createRun('first'));
    await a.add(createRun('x'));
    // Tab B opens while x is still queued and untried.
    const b = openTab();
    await b.ready();
    expect(recordIds(b)).toEqual(['first', 'x']);
    net.online = true;
    await a.retryNow();
    expect(sentIds()).toEqual(['POST first', 'POST x']);

    await b.add({ ...createRun('x'), kind: 'run.delete', method: 'DELETE', path: '/api/runs/x', body: undefined });
    await b.flush();
    expect(sentIds()).toEqual(['POST first', 'POST x', 'DELETE x']);
  });
});

describe('the outbox on a device that stored it as one list', () => {
  const stored = (key: string, recordId: string, createdAt: number): OutboxEntry => ({
    key,
    recordId,
    kind: 'run.create',
    method: 'POST',
    path: '/api/runs',
    body: { id: recordId },
    label: `Run ${recordId}`,
    scope: {},
    createdAt,
    attempts: 1,
    nextAttemptAt: 0,
    state: 'waiting',
  });

  it('when a page died while sending an entry, then the next tab shows it waiting, sends it, and queues an edit behind it rather than into it', async () => {
    await set('outbox:k1', { ...stored('k1', 'r1', 5), attempts: 0, state: 'sending' }, device);
    const { net, openTab, sentIds } = browser();
    const tab = openTab();
    await tab.ready();
    expect(tab.getSnapshot().map((e) => e.state)).toEqual(['waiting']);
    await tab.add(editRun('r1', { cones: 1 }));
    expect(recordIds(tab)).toEqual(['r1', 'r1']);
    net.online = true;
    await tab.retryNow();
    expect(sentIds()).toEqual(['POST r1', 'PATCH r1']);
  });

  it('when a tab opens, then the list becomes one record per entry, in the same order, and the list is removed', async () => {
    // Two entries made in the same millisecond keep their order.
    await set('outbox', [stored('k2', 'r2', 5), stored('k1', 'r1', 5), stored('k3', 'r3', 7)], device);
    await set('REACT_QUERY_OFFLINE_CACHE', '{"clientState":{}}', device);
    const { net, openTab, sentIds } = browser();
    const tab = openTab();
    await tab.ready();
    expect(recordIds(tab)).toEqual(['r2', 'r1', 'r3']);
    expect(await get('outbox', device)).toBeUndefined();
    expect((await keys(device)).sort()).toEqual(['REACT_QUERY_OFFLINE_CACHE', 'outbox:k1', 'outbox:k2', 'outbox:k3']);
    expect(await get('outbox:k1', device)).toMatchObject({ key: 'k1', recordId: 'r1', attempts: 1 });

    const other = openTab();
    await other.ready();
    expect(recordIds(other)).toEqual(['r2', 'r1', 'r3']);
    net.online = true;
    await other.flush();
    expect(sentIds()).toEqual(['POST r2', 'POST r1', 'POST r3']);
    expect(await keys(device)).toEqual(['REACT_QUERY_OFFLINE_CACHE']);
  });
});
