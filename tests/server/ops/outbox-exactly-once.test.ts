// IndexedDB for Node: the outbox keeps its entries there, as in the browser, and two outboxes in
// one process share it as two tabs of one site do.
import 'fake-indexeddb/auto';
import { createServer, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { MutationObserver, QueryClient } from '@tanstack/react-query';
import { createStore, entries } from 'idb-keyval';
import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest';
import { createAppOutbox } from '@/app/outbox';
import { login } from '@/features/auth/api/login';
import { authKeys } from '@/features/auth/api/auth-keys';
import { dropCsrfToken } from '@/lib/api-client';
import { createRunEntry, type CreateRunBody } from '@/features/runs/api/create-run';
import { outboxMutationKey } from '@/lib/outbox-context';
import type { Outbox, OutboxEntry } from '@/lib/outbox';
import { makeTestApp, TEST_PASSWORD, type TestApp } from '../test-app';
import { addCoDriver, countOf, driverWithCarAndEvent, runBody, type Driver } from '../season/season-fixtures';

/**
 * A run logged on the phone reaches the server exactly once, through the app's own outbox, API
 * client and mutation defaults, against the real server over HTTP: when the server stored it and
 * the answer never came back, and when the outbox is flushed several times at once or from two
 * tabs. Only `fetch` is the test's: it forwards to the server and can lose an answer on the way
 * back, as a dropped connection does.
 */
const nodeFetch = globalThis.fetch;
let t: TestApp;
let server: Server;
let origin: string;

beforeAll(async () => {
  t = await makeTestApp();
  server = createServer(t.app);
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  origin = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
});

afterAll(async () => {
  await new Promise((resolve) => server?.close(resolve));
  await t?.close();
});

interface Exchange {
  method: string;
  path: string;
  /** The server's status; absent when the request never reached it. */
  status?: number;
  /** The server answered, but the answer was lost on the way back. */
  lost?: boolean;
}

/**
 * One browser's network: a cookie jar shared by its tabs, and a fetch that forwards to the test
 * server. Node's fetch rejects with a TypeError when the connection fails, as browsers do (WHATWG
 * Fetch, "network error"); the api client turns that into its `network` error.
 */
function browserNetwork() {
  const cookies = new Map<string, string>();
  const log: Exchange[] = [];
  const net = {
    log,
    offline: false,
    /** The next request this matches is handled by the server, and its answer is lost. */
    loseAnswer: null as ((method: string, path: string) => boolean) | null,
    /** Held this long before it reaches the server, so other sends can start meanwhile. */
    delayMs: 0,
    /** The POSTs of this run that reached the server, with its answers. */
    postsOf: (runId: string) => log.filter((e) => e.method === 'POST' && e.path === '/api/runs' && e.status !== undefined && runIds.get(e) === runId),
  };
  const runIds = new WeakMap<Exchange, string>();
  const fetch = async (input: RequestInfo | URL, init: RequestInit = {}): Promise<Response> => {
    const url = new URL(String(input), origin);
    const method = (init.method ?? 'GET').toUpperCase();
    const exchange: Exchange = { method, path: url.pathname };
    log.push(exchange);
    if (method === 'POST' && url.pathname === '/api/runs') runIds.set(exchange, (JSON.parse(String(init.body)) as { id: string }).id);
    if (net.offline) throw new TypeError('fetch failed');
    if (net.delayMs) await new Promise((resolve) => setTimeout(resolve, net.delayMs));
    const headers = new Headers(init.headers);
    if (cookies.size) headers.set('Cookie', [...cookies].map(([k, v]) => `${k}=${v}`).join('; '));
    const response = await nodeFetch(url, { ...init, headers });
    for (const line of response.headers.getSetCookie()) {
      const [pair] = line.split(';');
      const at = pair!.indexOf('=');
      cookies.set(pair!.slice(0, at), pair!.slice(at + 1));
    }
    exchange.status = response.status;
    if (net.loseAnswer?.(method, url.pathname)) {
      net.loseAnswer = null;
      // Read to the end: the server has finished with the request before the answer is lost.
      await response.arrayBuffer();
      exchange.lost = true;
      throw new TypeError('fetch failed');
    }
    return response;
  };
  return { net, fetch };
}

const outboxes: Outbox[] = [];
afterEach(async () => {
  for (const o of outboxes.splice(0)) await o.clear();
  globalThis.fetch = nodeFetch;
});

/** A tab of the app: its query client and its outbox, wired as main.tsx wires them. */
function openTab() {
  const queryClient = new QueryClient({ defaultOptions: { queries: { retry: false } } });
  const outbox = createAppOutbox(queryClient);
  outboxes.push(outbox);
  /** Logs a run as the trackside form does: a mutation whose registered function stores it in the outbox. */
  const logRun = (body: CreateRunBody) =>
    new MutationObserver<OutboxEntry | null, Error, ReturnType<typeof createRunEntry>>(queryClient, {
      mutationKey: outboxMutationKey('run.create'),
    }).mutate(createRunEntry(body));
  return { queryClient, outbox, logRun };
}

/** What the device has stored for the outbox (shared by every tab): one record per entry, under `outbox:<key>`. */
const storedOnDevice = async () =>
  (await entries<IDBValidKey, unknown>(createStore('scrubline', 'device'))).filter(([key]) => String(key).startsWith('outbox'));

async function signedInBrowser() {
  const d = await driverWithCarAndEvent(t);
  const { net, fetch } = browserNetwork();
  globalThis.fetch = fetch;
  // A browser of its own: no token from another session.
  dropCsrfToken();
  await login({ email: d.email, password: TEST_PASSWORD });
  return { d, net };
}

/** Runs stored with this id, and runs of the car at all (a replay stored under another id would show there). */
const runCounts = async (d: Driver, runId: string) => ({
  withId: await countOf(t, 'SELECT count(*) AS n FROM runs WHERE id = $1', [runId]),
  ofCar: await countOf(t, 'SELECT count(*) AS n FROM runs WHERE car_id = $1', [d.carId]),
});
const newRun = (d: Driver, runNumber: number): CreateRunBody => ({
  ...(runBody(d.carId, d.eventId, { runNumber }) as Omit<CreateRunBody, 'driverId'>),
  driverId: d.user.id,
});

describe('a run queued on the phone arrives exactly once', () => {
  it('when the server stored the run but its answer was lost, then the outbox sends it again, the server answers with the stored run, and there is one run and an empty outbox', async () => {
    const { d, net } = await signedInBrowser();
    const tab = openTab();
    const reasons = new Set<string | null>();
    tab.outbox.subscribe(() => reasons.add(tab.outbox.retryReason()));
    net.loseAnswer = (method, path) => method === 'POST' && path === '/api/runs';

    const run = newRun(d, 1);
    await tab.logRun(run);
    // The outbox's own retry timer sends it again after its backoff (1 s after the first try).
    await expect.poll(() => tab.outbox.getSnapshot().length, { timeout: 15_000 }).toBe(0);

    expect(net.postsOf(run.id).map((e) => [e.status, e.lost ?? false])).toEqual([[201, true], [200, false]]);
    expect(reasons).toContain('No connection');
    expect(await runCounts(d, run.id)).toEqual({ withId: 1, ofCar: 1 });
    expect(await storedOnDevice()).toEqual([]);
    const stored = await d.c.get(`/api/runs/${run.id}`);
    expect(stored.body).toMatchObject({ id: run.id, runNumber: 1, rawTimeSec: run.rawTimeSec, version: 1 });
  });

  it('when the connection comes back and the online event, the retry timer and a page load all flush at once while the send is slow, then the run is sent once', async () => {
    const { d, net } = await signedInBrowser();
    const tab = openTab();
    net.offline = true;
    const run = newRun(d, 2);
    await tab.logRun(run);
    await expect.poll(() => tab.outbox.getSnapshot()[0]?.attempts ?? 0).toBeGreaterThan(0);
    expect(net.postsOf(run.id)).toEqual([]);

    net.offline = false;
    net.delayMs = 300;
    const flushes = [tab.outbox.retryNow(), tab.outbox.flush(), tab.outbox.flush()];
    // And again while the first send is still on its way.
    await new Promise((resolve) => setTimeout(resolve, 100));
    flushes.push(tab.outbox.retryNow(), tab.outbox.flush());
    await Promise.all(flushes);
    await expect.poll(() => tab.outbox.getSnapshot().length, { timeout: 15_000 }).toBe(0);

    expect(net.postsOf(run.id).map((e) => e.status)).toEqual([201]);
    expect(await runCounts(d, run.id)).toEqual({ withId: 1, ofCar: 1 });
    expect(await storedOnDevice()).toEqual([]);
  });

  it('when two tabs hold the same queued run and both send it at once, and one answer is lost, then the server stores it once and both outboxes end empty', async () => {
    const { d, net } = await signedInBrowser();
    net.offline = true;
    const first = openTab();
    const run = newRun(d, 3);
    await first.logRun(run);
    // A second tab opened meanwhile loads the same queued run from the device.
    const second = openTab();
    await second.outbox.ready();
    expect(second.outbox.getSnapshot().map((e) => e.recordId)).toEqual([run.id]);

    net.offline = false;
    net.delayMs = 50;
    net.loseAnswer = (method, path) => method === 'POST' && path === '/api/runs';
    await Promise.all([first.outbox.retryNow(), second.outbox.retryNow()]);
    await expect.poll(() => first.outbox.getSnapshot().length + second.outbox.getSnapshot().length, { timeout: 15_000 }).toBe(0);

    const statuses = net.postsOf(run.id).map((e) => e.status);
    expect(statuses.filter((s) => s === 201)).toHaveLength(1);
    expect(statuses.every((s) => s === 201 || s === 200)).toBe(true);
    expect(net.postsOf(run.id).filter((e) => e.lost)).toHaveLength(1);
    expect(await runCounts(d, run.id)).toEqual({ withId: 1, ofCar: 1 });
    expect(await storedOnDevice()).toEqual([]);
  });

  it('when the session of the driver who queued a run ends and her co-driver signs in on the same phone, then the run waits for her, unseen by him, and goes once, in her session, when she signs in again', async () => {
    const { d, net } = await signedInBrowser();
    const co = await addCoDriver(t, d);
    const tab = openTab();
    // Signed in as the app does it: the sign-in's answer is who is signed in.
    const signIn = async (email: string) => {
      dropCsrfToken();
      tab.queryClient.setQueryData(authKeys.me(), await login({ email, password: TEST_PASSWORD }));
    };
    await signIn(d.email);
    net.offline = true;
    const run = newRun(d, 4);
    await tab.logRun(run);
    await expect.poll(() => tab.outbox.getSnapshot()[0]?.attempts ?? 0).toBeGreaterThan(0);

    // Her session ends on the server (the app marks nobody signed in); with signal again, he signs in.
    tab.queryClient.setQueryData(authKeys.me(), null);
    net.offline = false;
    await signIn(co.email);
    await tab.outbox.retryNow();
    expect(tab.outbox.getSnapshot()).toEqual([]);
    // He signs out: what is his goes, hers stays.
    await tab.outbox.clear();
    expect(await storedOnDevice()).toHaveLength(1);
    expect(net.postsOf(run.id)).toEqual([]);

    // She signs in again: the run goes at once, without waiting for the outbox's backoff.
    await signIn(d.email);
    await expect.poll(() => net.postsOf(run.id).map((e) => e.status), { timeout: 5_000 }).toEqual([201]);
    await expect.poll(() => tab.outbox.getSnapshot().length).toBe(0);
    expect(await runCounts(d, run.id)).toEqual({ withId: 1, ofCar: 1 });
    // Sent after her last sign-in, so in her session.
    expect(net.log.findLastIndex((e) => e.path === '/api/auth/login')).toBeLessThan(net.log.findIndex((e) => e.method === 'POST' && e.path === '/api/runs' && e.status === 201));
    expect(await storedOnDevice()).toEqual([]);
  });
});
