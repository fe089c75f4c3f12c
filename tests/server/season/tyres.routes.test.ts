import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { makeTestApp, type TestApp } from '../test-app';
import { countOf, driverWithCarAndEvent, expectError, expectFieldErrors, type Driver } from './season-fixtures';

let t: TestApp;
beforeAll(async () => {
  t = await makeTestApp();
});
afterAll(async () => {
  await t.close();
});

const setsOf = (carId: string) => countOf(t, 'SELECT count(*) AS n FROM tyre_sets WHERE car_id = $1', [carId]);
const readingsOf = (setId: string) => countOf(t, 'SELECT count(*) AS n FROM tread_readings WHERE tyre_set_id = $1', [setId]);
const mountingsOf = (setId: string) => countOf(t, 'SELECT count(*) AS n FROM tyre_mountings WHERE tyre_set_id = $1', [setId]);
const depth = (innerMm: number, middleMm: number, outerMm: number) => ({ innerMm, middleMm, outerMm });

async function newSet(d: Driver, over: Record<string, unknown> = {}) {
  const res = await d.c.post(`/api/cars/${d.carId}/tyre-sets`, { label: 'Set A', size: '205/50R15', boughtOn: '2026-03-01', startTreadMm: 7, ...over });
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return res.body as { id: string; mountings: { mountedAt: string; positions: Record<string, number> }[] };
}

describe('POST /api/cars/:carId/tyre-sets', () => {
  it('when a set is created, then 201 with tyre 1 on LF, 2 on RF, 3 on LR, 4 on RR from the day it was bought, and no reading', async () => {
    const d = await driverWithCarAndEvent(t);
    const res = await d.c.post(`/api/cars/${d.carId}/tyre-sets`, { label: 'Set A', size: '205/50R15', boughtOn: '2026-03-01', startTreadMm: 7, notes: 'Scrubbed' });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body).toEqual({
      id: expect.any(String),
      carId: d.carId,
      label: 'Set A',
      size: '205/50R15',
      boughtOn: '2026-03-01',
      startTreadMm: 7,
      notes: 'Scrubbed',
      mountings: [{ id: expect.any(String), mountedAt: '2026-03-01T00:00:00.000Z', positions: { lf: 1, rf: 2, lr: 3, rr: 4 } }],
      latestReading: null,
      runs: 0,
      createdAt: expect.any(String),
    });
  });

  it('when the label is missing, the starting depth is over 20 mm or a field is unknown, then 400 and nothing is written', async () => {
    const d = await driverWithCarAndEvent(t);
    const url = `/api/cars/${d.carId}/tyre-sets`;
    expectFieldErrors(await d.c.post(url, { size: '205/50R15' }), ['label']);
    expectFieldErrors(await d.c.post(url, { label: 'A', startTreadMm: 20.5 }), ['startTreadMm']);
    expectFieldErrors(await d.c.post(url, { label: 'A', startTreadMm: -1 }), ['startTreadMm']);
    expectFieldErrors(await d.c.post(url, { label: 'A', boughtOn: 'March' }), ['boughtOn']);
    expect(expectFieldErrors(await d.c.post(url, { label: 'A', compound: 'soft' }), ['compound']).compound).toEqual(['Unknown field']);
    expect(await setsOf(d.carId)).toBe(0);
  });
});

describe('GET /api/cars/:carId/tyre-sets', () => {
  it('when the car has sets, then { items, count } in the order they were added', async () => {
    const d = await driverWithCarAndEvent(t);
    const a = await newSet(d, { label: 'A' });
    const b = await newSet(d, { label: 'B' });
    const res = await d.c.get(`/api/cars/${d.carId}/tyre-sets`);
    expect(res.status).toBe(200);
    expect(res.body.count).toBe(2);
    expect(res.body.items.map((s: { id: string }) => s.id)).toEqual([a.id, b.id]);
  });

  it('when several readings exist, then latestReading is the one taken last, whatever order they were entered in', async () => {
    const d = await driverWithCarAndEvent(t);
    const set = await newSet(d);
    const newest = await d.c.post(`/api/tyre-sets/${set.id}/readings`, { takenAt: '2026-05-10T16:00:00Z', corners: { lf: depth(5.2, 5.6, 5.8) } });
    const older = await d.c.post(`/api/tyre-sets/${set.id}/readings`, { takenAt: '2026-04-12T16:00:00Z', corners: { lf: depth(6.1, 6.5, 6.6) } });
    expect([newest.status, older.status]).toEqual([201, 201]);
    const list = await d.c.get(`/api/cars/${d.carId}/tyre-sets`);
    expect(list.body.items[0].latestReading).toEqual(newest.body);
    const third = await d.c.post(`/api/tyre-sets/${set.id}/readings`, { takenAt: '2026-06-01T16:00:00Z', corners: { rr: depth(4, 4.5, 4.9) } });
    expect((await d.c.get(`/api/cars/${d.carId}/tyre-sets`)).body.items[0].latestReading.id).toBe(third.body.id);
  });
});

describe('runs on each set', () => {
  it('when two sets take turns on the car, then each counts the runs made while it was the one fitted last, a rotation keeps the set on, and a run before any set was fitted is no set’s', async () => {
    const d = await driverWithCarAndEvent(t);
    const run = (at: string, runNumber: number) => d.c.post('/api/runs', { id: randomUUID(), carId: d.carId, eventId: d.eventId, runNumber, rawTimeSec: 45.1, cones: 0, status: 'finished', recordedAt: at });
    expect((await run('2026-04-12T08:30:00Z', 1)).status).toBe(201); // before any set
    // With no day bought, a new set counts as fitted when it is recorded (today, after every run here).
    const a = await d.c.post(`/api/cars/${d.carId}/tyre-sets`, { label: 'Set A' });
    expect((await d.c.post(`/api/tyre-sets/${a.body.id}/mountings`, { mountedAt: '2026-04-12T08:45:00Z', positions: { lf: 1, rf: 2, lr: 3, rr: 4 } })).status).toBe(201);
    expect((await run('2026-04-12T09:00:00Z', 2)).status).toBe(201); // A
    const b = await newSet(d, { label: 'Set B', boughtOn: '2026-04-13' }); // fitted as bought, the next day
    expect((await run('2026-04-12T10:00:00Z', 3)).status).toBe(201); // A
    const toB = await d.c.post(`/api/tyre-sets/${b.id}/mountings`, { mountedAt: '2026-04-12T11:00:00Z', positions: { lf: 1, rf: 2, lr: 3, rr: 4 } });
    expect(toB.status).toBe(201);
    for (const [i, at] of ['2026-04-12T11:10:00Z', '2026-04-12T11:20:00Z', '2026-04-12T11:30:00Z'].entries()) expect((await run(at, 4 + i)).status).toBe(201); // B
    // Set A back on, rotated front to back.
    const backToA = await d.c.post(`/api/tyre-sets/${a.body.id}/mountings`, { mountedAt: '2026-04-12T12:00:00Z', positions: { lf: 3, rf: 4, lr: 1, rr: 2 } });
    expect(backToA.status).toBe(201);
    expect((await run('2026-04-12T12:10:00Z', 7)).status).toBe(201); // A

    const sets = (await d.c.get(`/api/cars/${d.carId}/tyre-sets`)).body.items as { label: string; runs: number }[];
    expect(sets.map((s) => [s.label, s.runs])).toEqual([['Set A', 3], ['Set B', 3]]);

    // Each reading of a set says how many runs the set had done by then.
    const lf = { lf: depth(6, 6.2, 6.3) };
    for (const takenAt of ['2026-04-12T08:40:00Z', '2026-04-12T11:05:00Z', '2026-04-12T12:30:00Z']) {
      expect((await d.c.post(`/api/tyre-sets/${a.body.id}/readings`, { takenAt, corners: lf })).status).toBe(201);
    }
    const readings = (await d.c.get(`/api/tyre-sets/${a.body.id}/readings`)).body.items as { runsOnSet: number }[];
    expect(readings.map((r) => r.runsOnSet)).toEqual([0, 2, 3]);
  });
});

describe('tread readings', () => {
  it('when a reading is posted, then 201 with each corner’s depths and the tyre number on it; the list is in time order', async () => {
    const d = await driverWithCarAndEvent(t);
    const set = await newSet(d);
    const res = await d.c.post(`/api/tyre-sets/${set.id}/readings`, {
      takenAt: '2026-04-12T16:00:00Z',
      eventId: d.eventId,
      corners: { lf: depth(6.1, 6.5, 6.6), rr: depth(6.4, 6.6, 6.2) },
      notes: 'After round 1',
    });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body).toEqual({
      id: expect.any(String),
      tyreSetId: set.id,
      takenAt: '2026-04-12T16:00:00.000Z',
      eventId: d.eventId,
      corners: { lf: { ...depth(6.1, 6.5, 6.6), tyreNumber: 1 }, rr: { ...depth(6.4, 6.6, 6.2), tyreNumber: 4 } },
      runsOnSet: 0,
      notes: 'After round 1',
      createdAt: expect.any(String),
    });
    const earlier = await d.c.post(`/api/tyre-sets/${set.id}/readings`, { takenAt: '2026-03-20T16:00:00Z', corners: { lf: depth(7, 7, 7) } });
    const list = await d.c.get(`/api/tyre-sets/${set.id}/readings`);
    expect(list.status).toBe(200);
    expect(list.body.count).toBe(2);
    expect(list.body.items.map((r: { id: string }) => r.id)).toEqual([earlier.body.id, res.body.id]);
  });

  it('when a depth is 0 or 20 mm it is accepted; below 0 or above 20 mm it is refused at corners.<corner>.<field>', async () => {
    const d = await driverWithCarAndEvent(t);
    const set = await newSet(d, { startTreadMm: null });
    const url = `/api/tyre-sets/${set.id}/readings`;
    expect((await d.c.post(url, { takenAt: '2026-04-12T16:00:00Z', corners: { lf: depth(0, 20, 0) } })).status).toBe(201);
    expectFieldErrors(await d.c.post(url, { takenAt: '2026-04-12T16:00:00Z', corners: { lf: depth(-0.1, 5, 20.1), rr: depth(5, 21, 5) } }), [
      'corners.lf.innerMm', 'corners.lf.outerMm', 'corners.rr.middleMm',
    ]);
    expect(await readingsOf(set.id)).toBe(1);
  });

  it('when a middle reading is more than 1 mm above the set’s starting depth, then 400 at corners.<corner>.middleMm; exactly 1 mm above is accepted', async () => {
    const d = await driverWithCarAndEvent(t);
    const set = await newSet(d, { startTreadMm: 7 });
    const url = `/api/tyre-sets/${set.id}/readings`;
    const errors = expectFieldErrors(await d.c.post(url, { takenAt: '2026-04-12T16:00:00Z', corners: { lf: depth(6, 6.5, 6), rf: depth(6, 8.1, 6) } }), [
      'corners.rf.middleMm',
    ]);
    expect(errors['corners.rf.middleMm']![0]).toMatch(/7 mm/);
    expect(await readingsOf(set.id)).toBe(0);
    expect((await d.c.post(url, { takenAt: '2026-04-12T16:00:00Z', corners: { rf: depth(6, 8, 6) } })).status).toBe(201);
  });

  it('when the reading has no corners, an unknown corner field or a bad time, then 400 at each path and nothing is written', async () => {
    const d = await driverWithCarAndEvent(t);
    const set = await newSet(d);
    const url = `/api/tyre-sets/${set.id}/readings`;
    expectFieldErrors(await d.c.post(url, { takenAt: '2026-04-12T16:00:00Z', corners: {} }), ['corners']);
    expectFieldErrors(await d.c.post(url, { takenAt: '2026-04-12T16:00:00Z', corners: { lf: { ...depth(6, 6, 6), shoulderMm: 5 } } }), [
      'corners.lf.shoulderMm',
    ]);
    expectFieldErrors(await d.c.post(url, { takenAt: 'after lunch', corners: { lf: depth(6, 6, 6) } }), ['takenAt']);
    expectFieldErrors(await d.c.post(url, { takenAt: '2026-04-12T16:00:00Z', corners: { lf: { innerMm: 6, middleMm: 6 } } }), ['corners.lf.outerMm']);
    expect(await readingsOf(set.id)).toBe(0);
  });

  it('when the tyre set id is unknown, then reading routes answer 404', async () => {
    const d = await driverWithCarAndEvent(t);
    expectError(await d.c.get(`/api/tyre-sets/${randomUUID()}/readings`), 404, 'not_found');
    expectError(await d.c.post(`/api/tyre-sets/${randomUUID()}/readings`, { takenAt: '2026-04-12T16:00:00Z', corners: { lf: depth(6, 6, 6) } }), 404, 'not_found');
  });
});

describe('POST /api/tyre-sets/:tyreSetId/mountings (rotations)', () => {
  it('when the set is rotated front to rear, then readings after it report the rotated tyre numbers and earlier ones the original', async () => {
    const d = await driverWithCarAndEvent(t);
    const set = await newSet(d);
    const before = await d.c.post(`/api/tyre-sets/${set.id}/readings`, {
      takenAt: '2026-04-12T16:00:00Z',
      corners: { lf: depth(6, 6.2, 6.4), rf: depth(6, 6.2, 6.4), lr: depth(6.5, 6.6, 6.7), rr: depth(6.5, 6.6, 6.7) },
    });
    const rotation = await d.c.post(`/api/tyre-sets/${set.id}/mountings`, {
      mountedAt: '2026-04-20T09:00:00Z',
      positions: { lf: 3, rf: 4, lr: 1, rr: 2 },
    });
    expect(rotation.status, JSON.stringify(rotation.body)).toBe(201);
    expect(rotation.body).toEqual({ id: expect.any(String), mountedAt: '2026-04-20T09:00:00.000Z', positions: { lf: 3, rf: 4, lr: 1, rr: 2 } });
    const after = await d.c.post(`/api/tyre-sets/${set.id}/readings`, {
      takenAt: '2026-05-10T16:00:00Z',
      corners: { lf: depth(5.9, 6, 6.1), rf: depth(5.9, 6, 6.1), lr: depth(5.5, 5.7, 5.9), rr: depth(5.5, 5.7, 5.9) },
    });
    expect(after.status).toBe(201);
    const numbers = (r: { corners: Record<string, { tyreNumber: number }> }) =>
      Object.fromEntries(Object.entries(r.corners).map(([corner, v]) => [corner, v.tyreNumber]));
    expect(numbers(after.body)).toEqual({ lf: 3, rf: 4, lr: 1, rr: 2 });
    expect(numbers(before.body)).toEqual({ lf: 1, rf: 2, lr: 3, rr: 4 });

    const readings = await d.c.get(`/api/tyre-sets/${set.id}/readings`);
    expect(readings.body.items.map(numbers)).toEqual([{ lf: 1, rf: 2, lr: 3, rr: 4 }, { lf: 3, rf: 4, lr: 1, rr: 2 }]);
    const sets = await d.c.get(`/api/cars/${d.carId}/tyre-sets`);
    expect(sets.body.items[0].mountings.map((m: { positions: unknown }) => m.positions)).toEqual([
      { lf: 1, rf: 2, lr: 3, rr: 4 },
      { lf: 3, rf: 4, lr: 1, rr: 2 },
    ]);
    expect(numbers(sets.body.items[0].latestReading)).toEqual({ lf: 3, rf: 4, lr: 1, rr: 2 });
  });

  it('when a reading is backfilled after a rotation was logged, then it still reports the tyres on at its own time', async () => {
    const d = await driverWithCarAndEvent(t);
    const set = await newSet(d);
    expect((await d.c.post(`/api/tyre-sets/${set.id}/mountings`, { mountedAt: '2026-04-20T09:00:00Z', positions: { lf: 3, rf: 4, lr: 1, rr: 2 } })).status).toBe(201);
    const backfilled = await d.c.post(`/api/tyre-sets/${set.id}/readings`, { takenAt: '2026-04-12T16:00:00Z', corners: { lf: depth(6, 6, 6) } });
    expect(backfilled.body.corners.lf.tyreNumber).toBe(1);
  });

  it('when a tyre is on two corners, a number is out of 1–5 or a corner is missing, then 400 and no mounting is written', async () => {
    const d = await driverWithCarAndEvent(t);
    const set = await newSet(d);
    const url = `/api/tyre-sets/${set.id}/mountings`;
    const at = '2026-04-20T09:00:00Z';
    expectFieldErrors(await d.c.post(url, { mountedAt: at, positions: { lf: 1, rf: 1, lr: 3, rr: 4 } }), ['positions']);
    expectFieldErrors(await d.c.post(url, { mountedAt: at, positions: { lf: 6, rf: 2, lr: 3, rr: 4 } }), ['positions.lf']);
    expectFieldErrors(await d.c.post(url, { mountedAt: at, positions: { lf: 1, rf: 2, lr: 3 } }), ['positions.rr']);
    expectFieldErrors(await d.c.post(url, { mountedAt: 'today', positions: { lf: 1, rf: 2, lr: 3, rr: 4 } }), ['mountedAt']);
    expectFieldErrors(await d.c.post(url, { mountedAt: at, positions: { lf: 1, rf: 2, lr: 3, rr: 4, spare: 5 } }), ['positions.spare']);
    expect(await mountingsOf(set.id)).toBe(1);
  });

  it('when the spare (tyre 5) goes on a corner, then it is accepted', async () => {
    const d = await driverWithCarAndEvent(t);
    const set = await newSet(d);
    const res = await d.c.post(`/api/tyre-sets/${set.id}/mountings`, { mountedAt: '2026-04-20T09:00:00Z', positions: { lf: 5, rf: 2, lr: 3, rr: 4 } });
    expect(res.status).toBe(201);
    expect(await mountingsOf(set.id)).toBe(2);
  });
});

describe('DELETE /api/tyre-sets/:tyreSetId/readings/:readingId', () => {
  it('when a mistyped reading is deleted, then 204, the set’s latest reading is the one before it, and its comments go with it', async () => {
    const d = await driverWithCarAndEvent(t);
    const set = await newSet(d);
    const good = await d.c.post(`/api/tyre-sets/${set.id}/readings`, { takenAt: '2026-04-12T16:00:00Z', corners: { lf: depth(6, 6.2, 6.4) } });
    const typo = await d.c.post(`/api/tyre-sets/${set.id}/readings`, { takenAt: '2026-05-10T16:00:00Z', corners: { lf: depth(4.5, 5.4, 6.2) } });
    expect((await d.c.post('/api/comments', { target: { type: 'tread_reading', id: typo.body.id }, body: '5.4 in the middle?' })).status).toBe(201);

    expect((await d.c.delete(`/api/tyre-sets/${set.id}/readings/${typo.body.id}`)).status).toBe(204);

    expect(await readingsOf(set.id)).toBe(1);
    const sets = await d.c.get(`/api/cars/${d.carId}/tyre-sets`);
    expect(sets.body.items[0].latestReading.id).toBe(good.body.id);
    expect(await countOf(t, 'SELECT count(*) AS n FROM comments WHERE tread_reading_id = $1', [typo.body.id])).toBe(0);
    // Gone is gone: a second delete finds nothing.
    expectError(await d.c.delete(`/api/tyre-sets/${set.id}/readings/${typo.body.id}`), 404, 'not_found');
  });

  it('when the reading belongs to another set, or to another driver’s car, then 404 and it stays', async () => {
    const d = await driverWithCarAndEvent(t);
    const other = await driverWithCarAndEvent(t);
    const setA = await newSet(d);
    const setB = await newSet(d, { label: 'Set B' });
    const theirSet = await newSet(other);
    const reading = await d.c.post(`/api/tyre-sets/${setA.id}/readings`, { takenAt: '2026-04-12T16:00:00Z', corners: { lf: depth(6, 6, 6) } });

    expectError(await d.c.delete(`/api/tyre-sets/${setB.id}/readings/${reading.body.id}`), 404, 'not_found');
    expectError(await other.c.delete(`/api/tyre-sets/${setA.id}/readings/${reading.body.id}`), 404, 'not_found');
    expectError(await other.c.delete(`/api/tyre-sets/${theirSet.id}/readings/${reading.body.id}`), 404, 'not_found');
    expect(await readingsOf(setA.id)).toBe(1);
  });
});
