import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { makeTestApp, type TestApp } from '../test-app';
import { countOf, driverWithCarAndEvent, expectError, expectFieldErrors, postRun } from './season-fixtures';

let t: TestApp;
beforeAll(async () => {
  t = await makeTestApp();
});
afterAll(async () => {
  await t.close();
});

const readingsOf = (carId: string) => countOf(t, 'SELECT count(*) AS n FROM pressure_readings WHERE car_id = $1', [carId]);

describe('POST /api/cars/:carId/pressures', () => {
  it('when a cold reading is posted, then 201 with the corners given and it lists in time order', async () => {
    const d = await driverWithCarAndEvent(t);
    const url = `/api/cars/${d.carId}/pressures`;
    const later = await d.c.post(url, { kind: 'cold', takenAt: '2026-04-12T12:00:00Z', corners: { lf: 215, rf: 215 } });
    expect(later.status, JSON.stringify(later.body)).toBe(201);
    expect(later.body).toEqual({ id: expect.any(String), carId: d.carId, kind: 'cold', takenAt: '2026-04-12T12:00:00.000Z', runId: null, corners: { lf: 215, rf: 215 } });
    const earlier = await d.c.post(url, { kind: 'cold', takenAt: '2026-04-12T08:00:00Z', corners: { lf: 220, rf: 220, lr: 210, rr: 210 } });
    const list = await d.c.get(url);
    expect(list.status).toBe(200);
    expect(list.body.count).toBe(2);
    expect(list.body.items.map((p: { id: string }) => p.id)).toEqual([earlier.body.id, later.body.id]);
  });

  it('when hot pressures are posted for a run, then the run shows them', async () => {
    const d = await driverWithCarAndEvent(t);
    const run = await postRun(d.c, d.carId, d.eventId);
    const res = await d.c.post(`/api/cars/${d.carId}/pressures`, { kind: 'hot', takenAt: '2026-04-12T10:01:00Z', runId: run.id, corners: { lf: 262, rr: 250 } });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect((await d.c.get(`/api/runs/${run.id}`)).body.hotPressuresKpa).toEqual({ lf: 262, rr: 250 });
  });

  it('when a pressure is 50 or 450 kPa it is accepted; 49.9 or 450.1 kPa is refused at corners.<corner>', async () => {
    const d = await driverWithCarAndEvent(t);
    const url = `/api/cars/${d.carId}/pressures`;
    expect((await d.c.post(url, { kind: 'cold', takenAt: '2026-04-12T08:00:00Z', corners: { lf: 50, rf: 450 } })).status).toBe(201);
    expectFieldErrors(await d.c.post(url, { kind: 'cold', takenAt: '2026-04-12T08:00:00Z', corners: { lr: 49.9, rr: 450.1 } }), ['corners.lr', 'corners.rr']);
    expect(await readingsOf(d.carId)).toBe(1);
  });

  it('when corners are empty, the kind is unknown or a field is unknown, then 400 at each path and nothing is written', async () => {
    const d = await driverWithCarAndEvent(t);
    const url = `/api/cars/${d.carId}/pressures`;
    expectFieldErrors(await d.c.post(url, { kind: 'cold', takenAt: '2026-04-12T08:00:00Z', corners: {} }), ['corners']);
    expectFieldErrors(await d.c.post(url, { kind: 'warm', takenAt: 'morning', corners: { lf: 200 } }), ['kind', 'takenAt']);
    expectFieldErrors(await d.c.post(url, { kind: 'cold', takenAt: '2026-04-12T08:00:00Z', corners: { lf: 200 }, unit: 'psi' }), ['unit']);
    expectFieldErrors(await d.c.post(url, { kind: 'cold', takenAt: '2026-04-12T08:00:00Z', corners: { front: 200 } }), ['corners', 'corners.front']);
    expect(await readingsOf(d.carId)).toBe(0);
  });

  it('when the run belongs to another car, then 400 on runId and nothing is written', async () => {
    const d = await driverWithCarAndEvent(t);
    const other = await driverWithCarAndEvent(t);
    const foreign = await postRun(other.c, other.carId, other.eventId);
    expectFieldErrors(
      await d.c.post(`/api/cars/${d.carId}/pressures`, { kind: 'hot', takenAt: '2026-04-12T10:01:00Z', runId: foreign.id, corners: { lf: 250 } }),
      ['runId'],
    );
    expectFieldErrors(
      await d.c.post(`/api/cars/${d.carId}/pressures`, { kind: 'hot', takenAt: '2026-04-12T10:01:00Z', runId: randomUUID(), corners: { lf: 250 } }),
      ['runId'],
    );
    expect(await readingsOf(d.carId)).toBe(0);
  });

  it('when a run already has hot pressures, then a second hot reading for it is 409 on runId', async () => {
    const d = await driverWithCarAndEvent(t);
    const run = await postRun(d.c, d.carId, d.eventId, { hotPressuresKpa: { lf: 255 } });
    const res = await d.c.post(`/api/cars/${d.carId}/pressures`, { kind: 'hot', takenAt: '2026-04-12T10:01:00Z', runId: run.id, corners: { lf: 250 } });
    expectError(res, 409, 'conflict');
    expect(res.body.error.fieldErrors.runId).toBeDefined();
    expect((await d.c.get(`/api/runs/${run.id}`)).body.hotPressuresKpa).toEqual({ lf: 255 });
    expect(await readingsOf(d.carId)).toBe(1);
  });

  it('when another driver reads or writes pressures of the car, then 404 and nothing is written', async () => {
    const d = await driverWithCarAndEvent(t);
    const other = await driverWithCarAndEvent(t);
    expectError(await other.c.get(`/api/cars/${d.carId}/pressures`), 404, 'not_found');
    expectError(await other.c.post(`/api/cars/${d.carId}/pressures`, { kind: 'cold', takenAt: '2026-04-12T08:00:00Z', corners: { lf: 220 } }), 404, 'not_found');
    expect(await readingsOf(d.carId)).toBe(0);
  });
});
