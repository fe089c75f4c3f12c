import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createDataSource } from '../../../server/db/data-source';
import { startCluster, type Cluster } from '../../../scripts/lib/pg-cluster';
import { makeTestApp, type TestApp } from '../test-app';
import { countOf, driverWithCarAndEvent, runBody } from '../season/season-fixtures';

/**
 * PostgreSQL stops while the app is serving, then starts again. The app answers 503 with a clear
 * message meanwhile, comes back by itself, and a client's queued run, sent again after a failure,
 * is stored exactly once. This file has a cluster of its own, so stopping it disturbs no other test.
 */
const dir = mkdtempSync(join(tmpdir(), 'scrubline-restart-'));
let cluster: Cluster;
let t: TestApp;

beforeAll(async () => {
  cluster = await startCluster({ dir, port: 0, database: 'restart', log: () => undefined });
  const ds = createDataSource(cluster.url, { poolSize: 1 });
  await ds.initialize();
  await ds.runMigrations({ transaction: 'each' });
  await ds.destroy();
  t = await makeTestApp({ databaseUrl: cluster.url });
}, 120_000);

afterAll(async () => {
  await t?.close().catch(() => undefined);
  cluster?.stop();
  rmSync(dir, { recursive: true, force: true });
});

describe('the database stops and starts again under a running app', () => {
  it('when PostgreSQL is down, then reads and writes answer 503 with a clear message and nothing is half written; when it is back, the same app serves again and a resent run is stored once', async () => {
    const d = await driverWithCarAndEvent(t);
    const run = runBody(d.carId, d.eventId, { runNumber: 1 });
    const token = await d.c.csrf();
    const send = () => d.c.agent.post('/api/runs').set('X-CSRF-Token', token).send(run);

    cluster.stop();

    const health = await d.c.agent.get('/api/health');
    expect(health.status).toBe(503);
    const read = await d.c.agent.get(`/api/cars/${d.carId}`);
    expect(read.status).toBe(503);
    expect(read.body.error).toMatchObject({ code: 'unavailable' });
    expect(read.body.error.message).toMatch(/cannot reach its database.*Nothing you saved is lost/);
    expect(read.headers['retry-after']).toBe('5');
    // The phone's outbox sends the run, gets 503, and keeps it to send again.
    const refused = await send();
    expect(refused.status).toBe(503);

    cluster = await startCluster({ dir, port: 0, database: 'restart', log: () => undefined });

    // The same app, not restarted: the session is still good and the run goes in, once.
    await expect.poll(async () => (await d.c.agent.get('/api/health')).status, { timeout: 15_000 }).toBe(200);
    expect((await d.c.agent.get(`/api/cars/${d.carId}`)).status).toBe(200);
    const first = await send();
    expect(first.status, JSON.stringify(first.body)).toBe(201);
    const again = await send();
    expect(again.status).toBeLessThan(300);
    expect(await countOf(t, 'SELECT count(*) AS n FROM runs WHERE car_id = $1', [d.carId])).toBe(1);
  });

  it('when PostgreSQL stops in the middle of a setup snapshot with its corners, then the snapshot is stored whole or not at all', async () => {
    const d = await driverWithCarAndEvent(t);
    const token = await d.c.csrf();
    const corners = { lf: { camberDeg: -2 }, rf: { camberDeg: -2 }, lr: { camberDeg: -1.5 }, rr: { camberDeg: -1.5 } };
    const body = (i: number) => ({ label: `Snapshot ${i}`, effectiveFrom: `2026-04-0${(i % 9) + 1}T08:00:00.000Z`, corners });
    // Several writes in flight as the database goes away.
    const inFlight = Array.from({ length: 6 }, (_, i) => d.c.agent.post(`/api/cars/${d.carId}/setups`).set('X-CSRF-Token', token).send(body(i)));
    cluster.stop();
    const answers = await Promise.all(inFlight);
    for (const a of answers) expect([201, 503]).toContain(a.status);

    cluster = await startCluster({ dir, port: 0, database: 'restart', log: () => undefined });
    await expect.poll(async () => (await d.c.agent.get('/api/health')).status, { timeout: 15_000 }).toBe(200);
    // Every stored snapshot has its four corners: none is half written.
    const rows: { id: string; corners: string }[] = await t.ds.query(
      `SELECT s.id, count(c.*) AS corners FROM setup_snapshots s LEFT JOIN setup_corners c ON c.setup_id = s.id
        WHERE s.car_id = $1 GROUP BY s.id`,
      [d.carId],
    );
    for (const r of rows) expect(Number(r.corners)).toBe(4);
    expect(rows.length).toBe(answers.filter((a) => a.status === 201).length);
  });
});
