import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { makeTestApp, type TestApp } from '../test-app';
import { driverWithCarAndEvent, runBody, setupBody } from './season-fixtures';

let t: TestApp;
beforeAll(async () => {
  t = await makeTestApp();
});
afterAll(async () => {
  await t.close();
});

describe('season smoke', () => {
  it('when a car, setup, run, tyres and change are recorded, then they read back', async () => {
    const d = await driverWithCarAndEvent(t);
    const setup = await d.c.post(`/api/cars/${d.carId}/setups`, setupBody());
    expect(setup.status, JSON.stringify(setup.body)).toBe(201);
    const run = await d.c.post('/api/runs', runBody(d.carId, d.eventId, { cones: 2, hotPressuresKpa: { lf: 250, rr: 240 } }));
    expect(run.status, JSON.stringify(run.body)).toBe(201);
    expect(run.body).toMatchObject({ setupId: setup.body.id, adjustedTimeSec: 49.678, isBest: true, hotPressuresKpa: { lf: 250, rr: 240 } });
    const qc = await d.c.post(`/api/cars/${d.carId}/setups/quick-change`, {
      effectiveFrom: '2026-04-12T10:05:00Z',
      changes: [{ field: 'damperClicks', corners: ['lr', 'rr'], delta: 2 }],
    });
    expect(qc.status, JSON.stringify(qc.body)).toBe(201);
    expect(qc.body.corners.lr.damperClicks).toBe(8);
    const diff = await d.c.get(`/api/setups/${setup.body.id}/diff/${qc.body.id}`);
    expect(diff.body.changes.map((c: { path: string }) => c.path)).toEqual(['corners.lr.damperClicks', 'corners.rr.damperClicks']);
    const tyres = await d.c.post(`/api/cars/${d.carId}/tyre-sets`, { label: 'Set A', startTreadMm: 7, boughtOn: '2026-03-01' });
    expect(tyres.status, JSON.stringify(tyres.body)).toBe(201);
    const reading = await d.c.post(`/api/tyre-sets/${tyres.body.id}/readings`, {
      takenAt: '2026-04-12T16:00:00Z',
      corners: { lf: { innerMm: 6.1, middleMm: 6.5, outerMm: 6.6 } },
    });
    expect(reading.status, JSON.stringify(reading.body)).toBe(201);
    expect(reading.body.corners.lf.tyreNumber).toBe(1);
    const change = await d.c.post(`/api/cars/${d.carId}/changes`, { changedOn: '2026-06-12', what: 'Front camber arms fitted', location: 'front' });
    expect(change.status, JSON.stringify(change.body)).toBe(201);
    const summary = await d.c.get(`/api/events/${d.eventId}/summary?carId=${d.carId}`);
    expect(summary.status, JSON.stringify(summary.body)).toBe(200);
    expect(summary.body.entries[0]).toMatchObject({ bestAdjustedSec: 49.678, bestRawSec: 45.678, cones: 2 });
    const sets = await d.c.get(`/api/cars/${d.carId}/tyre-sets`);
    expect(sets.body.items[0].latestReading.id).toBe(reading.body.id);
  });
});
