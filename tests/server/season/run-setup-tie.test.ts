import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { makeTestApp, type TestApp } from '../test-app';
import { driverWithCarAndEvent, postRun, postSetup, type Driver } from './season-fixtures';

let t: TestApp;
beforeAll(async () => {
  t = await makeTestApp();
});
afterAll(async () => {
  await t.close();
});

/** The run-to-setup tie is computed at read time (view runs_with_setup): the snapshot with the latest effectiveFrom not after recordedAt. */
const setupOfRun = async (d: Driver, runId: string) => {
  const res = await d.c.get(`/api/runs/${runId}`);
  expect(res.status).toBe(200);
  return res.body.setupId as string | null;
};
const runsOfSetup = async (d: Driver, setupId: string) => {
  const res = await d.c.get(`/api/setups/${setupId}/runs`);
  expect(res.status).toBe(200);
  expect(res.body.count).toBe(res.body.items.length);
  return (res.body.items as { id: string; setupId: string }[]).map((r) => {
    expect(r.setupId).toBe(setupId);
    return r.id;
  }).sort();
};

describe('runs tied to setup snapshots', () => {
  it('when snapshots are added, backdated, moved and deleted, then every run follows the snapshot in force when it was recorded', async () => {
    const d = await driverWithCarAndEvent(t);
    const a = await postSetup(d.c, d.carId, { label: 'A', effectiveFrom: '2026-04-01T00:00:00Z' });
    const b = await postSetup(d.c, d.carId, { label: 'B', effectiveFrom: '2026-04-12T10:30:00Z' });
    const at10 = await postRun(d.c, d.carId, d.eventId, { runNumber: 1, recordedAt: '2026-04-12T10:00:00Z' });
    const at11 = await postRun(d.c, d.carId, d.eventId, { runNumber: 2, recordedAt: '2026-04-12T11:00:00Z' });
    expect(at10.setupId).toBe(a.id);
    expect(at11.setupId).toBe(b.id);
    expect(await runsOfSetup(d, a.id)).toEqual([at10.id]);
    expect(await runsOfSetup(d, b.id)).toEqual([at11.id]);

    // A backdated snapshot C from 09:00 that day takes over the 10:00 run.
    const c = await postSetup(d.c, d.carId, { label: 'C', effectiveFrom: '2026-04-12T09:00:00Z' });
    expect(await setupOfRun(d, at10.id)).toBe(c.id);
    expect(await setupOfRun(d, at11.id)).toBe(b.id);
    expect(await runsOfSetup(d, c.id)).toEqual([at10.id]);
    expect(await runsOfSetup(d, a.id)).toEqual([]);

    // C moved to 10:15: the 10:00 run goes back to A.
    const moved = await d.c.patch(`/api/setups/${c.id}`, { version: c.version, effectiveFrom: '2026-04-12T10:15:00Z' });
    expect(moved.status, JSON.stringify(moved.body)).toBe(200);
    expect(await setupOfRun(d, at10.id)).toBe(a.id);
    expect(await runsOfSetup(d, a.id)).toEqual([at10.id]);
    expect(await runsOfSetup(d, c.id)).toEqual([]);
    expect(await setupOfRun(d, at11.id)).toBe(b.id);

    // B deleted: the 11:00 run is on C (10:15).
    expect((await d.c.delete(`/api/setups/${b.id}`)).status).toBe(204);
    expect(await setupOfRun(d, at11.id)).toBe(c.id);
    expect(await runsOfSetup(d, c.id)).toEqual([at11.id]);
    expect(await setupOfRun(d, at10.id)).toBe(a.id);
  });

  it('when a run was recorded before any snapshot, then its setupId is null', async () => {
    const d = await driverWithCarAndEvent(t);
    await postSetup(d.c, d.carId, { effectiveFrom: '2026-04-12T10:30:00Z' });
    const early = await postRun(d.c, d.carId, d.eventId, { recordedAt: '2026-04-12T10:00:00Z' });
    expect(early.setupId).toBeNull();
    expect(await setupOfRun(d, early.id)).toBeNull();
  });

  it('when a run is recorded at exactly a snapshot’s effective time, then it is on that snapshot', async () => {
    const d = await driverWithCarAndEvent(t);
    await postSetup(d.c, d.carId, { label: 'A' });
    const b = await postSetup(d.c, d.carId, { label: 'B', effectiveFrom: '2026-04-12T10:30:00Z' });
    const run = await postRun(d.c, d.carId, d.eventId, { recordedAt: '2026-04-12T10:30:00Z' });
    expect(run.setupId).toBe(b.id);
  });

  it('when two snapshots share an effective time, then the run is on the one entered last, from every endpoint', async () => {
    const d = await driverWithCarAndEvent(t);
    const first = await postSetup(d.c, d.carId, { label: 'First entry', effectiveFrom: '2026-04-12T09:00:00Z' });
    const second = await postSetup(d.c, d.carId, { label: 'Second entry', effectiveFrom: '2026-04-12T09:00:00Z' });
    const run = await postRun(d.c, d.carId, d.eventId, { recordedAt: '2026-04-12T10:00:00Z' });
    expect(run.setupId).toBe(second.id);
    expect(await runsOfSetup(d, second.id)).toEqual([run.id]);
    expect(await runsOfSetup(d, first.id)).toEqual([]);
    // the list puts the one in force first, as the quick change picks it
    expect((await d.c.get(`/api/cars/${d.carId}/setups`)).body.items[0].id).toBe(second.id);
  });

  it('when a run’s recordedAt is edited, then it moves to the snapshot in force at the new time', async () => {
    const d = await driverWithCarAndEvent(t);
    const a = await postSetup(d.c, d.carId, { label: 'A' });
    const b = await postSetup(d.c, d.carId, { label: 'B', effectiveFrom: '2026-04-12T10:30:00Z' });
    const run = await postRun(d.c, d.carId, d.eventId, { recordedAt: '2026-04-12T10:00:00Z' });
    expect(run.setupId).toBe(a.id);
    const res = await d.c.patch(`/api/runs/${run.id}`, { version: 1, recordedAt: '2026-04-12T10:45:00Z' });
    expect(res.body.setupId).toBe(b.id);
    expect(await setupOfRun(d, run.id)).toBe(b.id);
  });

  it('when another car of the same driver gets a snapshot, then this car’s runs are not tied to it', async () => {
    const d = await driverWithCarAndEvent(t);
    const car2 = await d.c.post('/api/cars', { name: 'Second car', classCode: 'STS' });
    await postSetup(d.c, car2.body.id, { effectiveFrom: '2026-04-01T00:00:00Z', corners: {} });
    const run = await postRun(d.c, d.carId, d.eventId);
    expect(run.setupId).toBeNull();
  });

  it('when runs are read from every endpoint, then each carries its setupId', async () => {
    const d = await driverWithCarAndEvent(t);
    const a = await postSetup(d.c, d.carId, { label: 'A' });
    const b = await postSetup(d.c, d.carId, { label: 'B', effectiveFrom: '2026-04-12T10:30:00Z' });
    const r1 = await postRun(d.c, d.carId, d.eventId, { runNumber: 1, recordedAt: '2026-04-12T10:00:00Z' });
    const r2 = await postRun(d.c, d.carId, d.eventId, { runNumber: 2, recordedAt: '2026-04-12T11:00:00Z' });
    const want = new Map([[r1.id, a.id], [r2.id, b.id]]);
    const check = (runs: { id: string; setupId?: string | null }[], where: string) => {
      expect(runs.length, where).toBeGreaterThan(0);
      for (const r of runs) {
        expect(r, where).toHaveProperty('setupId');
        expect(r.setupId, where).toBe(want.get(r.id));
      }
    };
    check([r1, r2], 'POST /api/runs');
    check([(await d.c.get(`/api/runs/${r1.id}`)).body], 'GET /api/runs/:id');
    check((await d.c.get('/api/runs')).body.items, 'GET /api/runs');
    check((await d.c.get(`/api/runs?carId=${d.carId}`)).body.items, 'GET /api/runs?carId');
    check((await d.c.get(`/api/runs?eventId=${d.eventId}`)).body.items, 'GET /api/runs?eventId');
    check((await d.c.get(`/api/setups/${a.id}/runs`)).body.items, 'GET /api/setups/:id/runs');
    check([(await d.c.patch(`/api/runs/${r2.id}`, { version: 1, notes: 'x' })).body], 'PATCH /api/runs/:id');
    const summary = await d.c.get(`/api/events/${d.eventId}/summary?carId=${d.carId}`);
    check(summary.body.entries[0].runs, 'GET /api/events/:id/summary');
    const replay = await d.c.post('/api/runs', { id: r1.id, carId: d.carId, eventId: d.eventId, runNumber: 1, rawTimeSec: 45.678, cones: 0, status: 'finished', recordedAt: '2026-04-12T10:00:00Z' });
    expect(replay.status).toBe(200);
    check([replay.body], 'POST /api/runs replay');
  });
});
