import { randomUUID } from 'node:crypto';
import pg from 'pg';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { makeTestApp, signedInClient, type TestApp } from '../test-app';
import {
  addCoDriver, countOf, driverWithCarAndEvent, expectError, expectFieldErrors, postRun, runBody, type Driver,
} from './season-fixtures';
import { grantedCar } from '../collab/shop-fixtures';

let t: TestApp;
beforeAll(async () => {
  t = await makeTestApp();
});
afterAll(async () => {
  await t.close();
});

const runsOf = (carId: string) => countOf(t, 'SELECT count(*) AS n FROM runs WHERE car_id = $1', [carId]);
const post = (d: Driver, over: Record<string, unknown> = {}) => d.c.post('/api/runs', runBody(d.carId, d.eventId, over));
type RunJson = { id: string; runNumber: number; adjustedTimeSec: number | null; pctOffBest: number | null; isBest: boolean };

describe('POST /api/runs', () => {
  it('when the input is valid, then 201 with the run, its driver, setupId, times and version 1', async () => {
    const d = await driverWithCarAndEvent(t);
    const body = runBody(d.carId, d.eventId, { hotPressuresKpa: { lf: 250, rf: 252 }, notes: 'Wet start' });
    const res = await d.c.post('/api/runs', body);
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body).toEqual({
      id: body.id,
      carId: d.carId,
      eventId: d.eventId,
      driver: { id: d.user.id, displayName: 'Nell Ashdown' },
      runNumber: 1,
      rawTimeSec: 45.678,
      cones: 0,
      status: 'finished',
      recordedAt: '2026-04-12T10:00:00.000Z',
      hotPressuresKpa: { lf: 250, rf: 252 },
      notes: 'Wet start',
      setupId: null,
      adjustedTimeSec: 45.678,
      pctOffBest: 0,
      isBest: true,
      commentCount: 0,
      version: 1,
      createdAt: expect.any(String),
      updatedAt: expect.any(String),
    });
    expect((await d.c.get(`/api/runs/${body.id}`)).body).toEqual(res.body);
  });

  it('when a DNF or off-course run has no time, then it is stored with rawTimeSec null', async () => {
    const d = await driverWithCarAndEvent(t);
    const dnf = await post(d, { status: 'dnf', rawTimeSec: null });
    expect(dnf.status, JSON.stringify(dnf.body)).toBe(201);
    expect(dnf.body).toMatchObject({ status: 'dnf', rawTimeSec: null, adjustedTimeSec: null, pctOffBest: null, isBest: false });
    const off = await post(d, { runNumber: 2, status: 'off_course', rawTimeSec: null });
    expect(off.status).toBe(201);
  });

  it('when the raw time is 0, under a millisecond, negative, 1800 s or more, then 400 on rawTimeSec and nothing is written', async () => {
    const d = await driverWithCarAndEvent(t);
    for (const rawTimeSec of [0, 1e-300, 0.0009, -1, 1800, 1800.001, '45.6']) {
      expectFieldErrors(await post(d, { rawTimeSec }), ['rawTimeSec']);
    }
    expect((await post(d, { rawTimeSec: 0.0009 })).body.error.fieldErrors.rawTimeSec).toEqual(['The time must be at least 0.001 s']);
    expect(await runsOf(d.carId)).toBe(0);
  });

  it('when a run under a millisecond was stored before such times were refused, then the car\'s runs and season still load, with no % off a best of 0 s', async () => {
    const d = await driverWithCarAndEvent(t);
    expect((await post(d, { runNumber: 1, rawTimeSec: 47.5 })).status).toBe(201);
    expect((await post(d, { id: '0e0e0e0e-0000-4000-8000-000000000077', runNumber: 2, rawTimeSec: 48 })).status).toBe(201);
    await t.ds.query(`UPDATE runs SET raw_time_sec = 1e-300 WHERE id = '0e0e0e0e-0000-4000-8000-000000000077'`);

    const runs = await d.c.get(`/api/runs?carId=${d.carId}&eventId=${d.eventId}`);
    expect(runs.status, JSON.stringify(runs.body)).toBe(200);
    expect(runs.body.items.map((r: { adjustedTimeSec: number; pctOffBest: number | null; isBest: boolean }) => [r.adjustedTimeSec, r.pctOffBest, r.isBest])).toEqual(
      expect.arrayContaining([[0, null, true], [47.5, null, false]]),
    );
    expect((await d.c.get(`/api/cars/${d.carId}/season`)).status).toBe(200);
  });

  it('when the raw time is just above 0 or just under 1800 s, then it is accepted', async () => {
    const d = await driverWithCarAndEvent(t);
    expect((await post(d, { rawTimeSec: 0.001 })).status).toBe(201);
    expect((await post(d, { runNumber: 2, rawTimeSec: 1799.999 })).status).toBe(201);
  });

  it('when a finished run has no time, then 400 on rawTimeSec', async () => {
    const d = await driverWithCarAndEvent(t);
    expectFieldErrors(await post(d, { rawTimeSec: null }), ['rawTimeSec']);
    const { rawTimeSec: _omit, ...withoutTime } = runBody(d.carId, d.eventId);
    expectFieldErrors(await d.c.post('/api/runs', withoutTime), ['rawTimeSec']);
    expect(await runsOf(d.carId)).toBe(0);
  });

  it('when cones are 0 or 50, then they are accepted; −1, 51 or 2.5 are refused on cones', async () => {
    const d = await driverWithCarAndEvent(t);
    expect((await post(d, { cones: 0 })).status).toBe(201);
    expect((await post(d, { runNumber: 2, cones: 50 })).status).toBe(201);
    for (const cones of [-1, 51, 2.5]) expectFieldErrors(await post(d, { runNumber: 3, cones }), ['cones']);
    expect(await runsOf(d.carId)).toBe(2);
  });

  it('when a hot pressure is outside 50–450 kPa, then 400 at hotPressuresKpa.<corner>', async () => {
    const d = await driverWithCarAndEvent(t);
    expectFieldErrors(await post(d, { hotPressuresKpa: { lf: 451, rr: 49 } }), ['hotPressuresKpa.lf', 'hotPressuresKpa.rr']);
    expect(await runsOf(d.carId)).toBe(0);
  });

  it('when ids, the run number, status or recordedAt are malformed, then 400 at each field', async () => {
    const d = await driverWithCarAndEvent(t);
    expectFieldErrors(
      await post(d, { id: 'run-1', runNumber: 0, status: 'crashed', recordedAt: 'yesterday' }),
      ['id', 'runNumber', 'status', 'recordedAt'],
    );
    expectFieldErrors(await post(d, { carId: 'car', eventId: 'event' }), ['carId', 'eventId']);
    expectFieldErrors(await post(d, { runNumber: 1.5 }), ['runNumber']);
    expect(await runsOf(d.carId)).toBe(0);
  });

  it('when a field has no message of its own, then its error says the limit in plain words', async () => {
    const d = await driverWithCarAndEvent(t);
    const errors = expectFieldErrors(await post(d, { runNumber: 1000, notes: 'x'.repeat(2001) }), ['runNumber', 'notes']);
    expect(errors).toEqual({ runNumber: ['At most 999'], notes: ['At most 2000 characters'] });
    expect(await runsOf(d.carId)).toBe(0);
  });

  it('when a field is unknown, at the top or in the hot pressures, then 400 "Unknown field"', async () => {
    const d = await driverWithCarAndEvent(t);
    const errors = expectFieldErrors(await post(d, { setupId: randomUUID(), hotPressuresKpa: { lf: 250, spare: 200 } }), [
      'setupId',
      'hotPressuresKpa.spare',
    ]);
    expect(errors.setupId).toEqual(['Unknown field']);
    expect(await runsOf(d.carId)).toBe(0);
  });

  it('when the run number is already taken for the event, car and driver, then 409 with fieldErrors.runNumber', async () => {
    const d = await driverWithCarAndEvent(t);
    await postRun(d.c, d.carId, d.eventId, { runNumber: 3 });
    const res = await post(d, { runNumber: 3, rawTimeSec: 44.1 });
    expectError(res, 409, 'conflict');
    expect(res.body.error.fieldErrors.runNumber).toBeDefined();
    expect(await runsOf(d.carId)).toBe(1);
  });

  it('when the same run number is used by a co-driver in the same car, then both runs are kept', async () => {
    const d = await driverWithCarAndEvent(t);
    const co = await addCoDriver(t, d);
    await postRun(d.c, d.carId, d.eventId, { runNumber: 1 });
    const theirs = await co.c.post('/api/runs', runBody(d.carId, d.eventId, { runNumber: 1, rawTimeSec: 46.2 }));
    expect(theirs.status, JSON.stringify(theirs.body)).toBe(201);
    expect(theirs.body.driver.id).toBe(co.user.id);
    expect(await runsOf(d.carId)).toBe(2);
  });

  it('when the driverId is neither the owner nor a co-driver, then 400 on driverId and nothing is written', async () => {
    const d = await driverWithCarAndEvent(t);
    const stranger = await signedInClient(t);
    expectFieldErrors(await post(d, { driverId: stranger.user.id }), ['driverId']);
    expectFieldErrors(await post(d, { driverId: randomUUID() }), ['driverId']);
    expect(await runsOf(d.carId)).toBe(0);
  });

  it('when the owner logs a run for the co-driver, then the run is theirs', async () => {
    const d = await driverWithCarAndEvent(t);
    const co = await addCoDriver(t, d, 'Teo Marsh');
    const res = await post(d, { driverId: co.user.id });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body.driver).toEqual({ id: co.user.id, displayName: 'Teo Marsh' });
  });

  it('when the event is someone else’s and not shared, then 404 and nothing is written', async () => {
    const d = await driverWithCarAndEvent(t);
    const other = await driverWithCarAndEvent(t);
    expectError(await d.c.post('/api/runs', runBody(d.carId, other.eventId)), 404, 'not_found');
    expectError(await d.c.post('/api/runs', runBody(d.carId, randomUUID())), 404, 'not_found');
    expect(await runsOf(d.carId)).toBe(0);
  });

  it('when shop staff, a stranger, the wrong driver or a hidden event carry hot pressures, then each is refused as without them and neither a run nor a pressure is stored', async () => {
    const { driver: d, staff } = await grantedCar(t);
    const stranger = await driverWithCarAndEvent(t);
    const hot = { hotPressuresKpa: { lf: 250, rf: 251, lr: 240, rr: 241 } };
    expectError(await staff.c.post('/api/runs', runBody(d.carId, d.eventId, hot)), 403, 'forbidden');
    expectError(await stranger.c.post('/api/runs', runBody(d.carId, stranger.eventId, hot)), 404, 'not_found');
    expectError(await d.c.post('/api/runs', runBody(d.carId, stranger.eventId, hot)), 404, 'not_found');
    expectFieldErrors(await d.c.post('/api/runs', runBody(d.carId, d.eventId, { ...hot, driverId: stranger.user.id })), ['driverId']);
    expect(await runsOf(d.carId)).toBe(0);
    expect(await countOf(t, 'SELECT count(*) AS n FROM pressure_readings WHERE car_id = $1', [d.carId])).toBe(0);
  });

  it('when a run is logged, then the request sends PostgreSQL three statements: the session with its account, the checked insert and the read-back', async () => {
    const d = await driverWithCarAndEvent(t);
    await post(d, { runNumber: 1 }); // opens the connections
    const token = await d.c.csrf();
    const sent = vi.spyOn(pg.Client.prototype, 'query');
    try {
      const res = await d.c.agent.post('/api/runs').set('X-CSRF-Token', token).send(runBody(d.carId, d.eventId, { runNumber: 2 }));
      expect(res.status, JSON.stringify(res.body)).toBe(201);
      expect(sent).toHaveBeenCalledTimes(3);
    } finally {
      sent.mockRestore();
    }
    expect(await runsOf(d.carId)).toBe(2);
  });
});

describe('GET /api/runs', () => {
  it('when filtered by car or event, then it answers { items, count } with the matching runs only', async () => {
    const d = await driverWithCarAndEvent(t);
    const car2 = await d.c.post('/api/cars', { name: 'Second car', classCode: 'STS' });
    const event2 = await d.c.post('/api/events', { name: 'Round 2', date: '2026-05-10' });
    const a = await postRun(d.c, d.carId, d.eventId);
    const b = await postRun(d.c, car2.body.id, d.eventId);
    const c = await postRun(d.c, d.carId, event2.body.id, { recordedAt: '2026-05-10T10:00:00Z' });
    const ids = (res: { body: { items: { id: string }[] } }) => res.body.items.map((r) => r.id).sort();

    const byCar = await d.c.get(`/api/runs?carId=${d.carId}`);
    expect(byCar.status).toBe(200);
    expect(byCar.body.count).toBe(2);
    expect(ids(byCar)).toEqual([a.id, c.id].sort());
    expect(ids(await d.c.get(`/api/runs?eventId=${d.eventId}`))).toEqual([a.id, b.id].sort());
    expect(ids(await d.c.get(`/api/runs?carId=${d.carId}&eventId=${d.eventId}`))).toEqual([a.id]);
    const all = await d.c.get('/api/runs');
    expect(all.body.count).toBe(all.body.items.length);
    expect(ids(all)).toEqual([a.id, b.id, c.id].sort());
  });

  it('when the query has a malformed id or an unknown parameter, then 400 at that parameter', async () => {
    const d = await driverWithCarAndEvent(t);
    expectFieldErrors(await d.c.get('/api/runs?carId=abc'), ['carId']);
    expect(expectFieldErrors(await d.c.get('/api/runs?driver=me'), ['driver']).driver).toEqual(['Unknown field']);
  });

  it('when another driver lists runs, then none of this driver’s runs appear, and filtering by this car is 404', async () => {
    const d = await driverWithCarAndEvent(t);
    const other = await driverWithCarAndEvent(t);
    await postRun(d.c, d.carId, d.eventId);
    expect((await other.c.get('/api/runs')).body).toEqual({ items: [], count: 0 });
    expectError(await other.c.get(`/api/runs?carId=${d.carId}`), 404, 'not_found');
    expectError(await other.c.get(`/api/runs?eventId=${d.eventId}`), 404, 'not_found');
  });
});

describe('PATCH /api/runs/:runId', () => {
  it('when the version is current, then it saves the change, rescored, and bumps the version', async () => {
    const d = await driverWithCarAndEvent(t);
    const run = await postRun(d.c, d.carId, d.eventId);
    const res = await d.c.patch(`/api/runs/${run.id}`, { version: 1, cones: 1, notes: 'Hit the pointer cone' });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    // 45.678 s + 1 cone × 2 s = 47.678 s (SCCA Solo Rules §1.2.1, common practice: time plus penalties)
    expect(res.body).toMatchObject({ cones: 1, notes: 'Hit the pointer cone', version: 2, adjustedTimeSec: 47.678, rawTimeSec: 45.678 });
    expect(res.body).toHaveProperty('setupId');
    expect((await d.c.get(`/api/runs/${run.id}`)).body).toEqual(res.body);
  });

  it('when the version is missing, then 400 on version and nothing changes', async () => {
    const d = await driverWithCarAndEvent(t);
    const run = await postRun(d.c, d.carId, d.eventId);
    expectFieldErrors(await d.c.patch(`/api/runs/${run.id}`, { cones: 3 }), ['version']);
    expect((await d.c.get(`/api/runs/${run.id}`)).body).toEqual(run);
  });

  it('when the version is stale, then 409 carries the current run and the stale edit changes nothing', async () => {
    const d = await driverWithCarAndEvent(t);
    const run = await postRun(d.c, d.carId, d.eventId);
    const fresh = await d.c.patch(`/api/runs/${run.id}`, { version: 1, rawTimeSec: 45.5 });
    expect(fresh.status).toBe(200);
    const stale = await d.c.patch(`/api/runs/${run.id}`, { version: 1, cones: 4, hotPressuresKpa: { lf: 260 } });
    expectError(stale, 409, 'conflict');
    expect(stale.body.error.current).toMatchObject({ id: run.id, version: 2, rawTimeSec: 45.5, cones: 0, hotPressuresKpa: null });
    expect((await d.c.get(`/api/runs/${run.id}`)).body).toEqual(fresh.body);
    expect(await countOf(t, 'SELECT count(*) AS n FROM pressure_readings WHERE run_id = $1', [run.id])).toBe(0);
  });

  it('when a finished run loses its time or gets out-of-range values, then 400 at the field and nothing changes', async () => {
    const d = await driverWithCarAndEvent(t);
    const run = await postRun(d.c, d.carId, d.eventId);
    expectFieldErrors(await d.c.patch(`/api/runs/${run.id}`, { version: 1, rawTimeSec: null }), ['rawTimeSec']);
    expectFieldErrors(await d.c.patch(`/api/runs/${run.id}`, { version: 1, cones: 51 }), ['cones']);
    expectFieldErrors(await d.c.patch(`/api/runs/${run.id}`, { version: 1, rawTimeSec: 1800 }), ['rawTimeSec']);
    expectFieldErrors(await d.c.patch(`/api/runs/${run.id}`, { version: 1, carId: d.carId }), ['carId']);
    expect((await d.c.get(`/api/runs/${run.id}`)).body).toEqual(run);
  });

  it('when a run becomes a DNF without a time, then it is saved and loses its adjusted time', async () => {
    const d = await driverWithCarAndEvent(t);
    const run = await postRun(d.c, d.carId, d.eventId);
    const res = await d.c.patch(`/api/runs/${run.id}`, { version: 1, status: 'dnf', rawTimeSec: null });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body).toMatchObject({ status: 'dnf', rawTimeSec: null, adjustedTimeSec: null, isBest: false });
  });

  it('when a DNF without a time is marked finished without giving one, then 400 on rawTimeSec and nothing changes', async () => {
    const d = await driverWithCarAndEvent(t);
    const run = await postRun(d.c, d.carId, d.eventId, { status: 'dnf', rawTimeSec: null });
    expectFieldErrors(await d.c.patch(`/api/runs/${run.id}`, { version: 1, status: 'finished' }), ['rawTimeSec']);
    expect((await d.c.get(`/api/runs/${run.id}`)).body).toEqual(run);
    const fixed = await d.c.patch(`/api/runs/${run.id}`, { version: 1, status: 'finished', rawTimeSec: 48.2 });
    expect(fixed.body).toMatchObject({ status: 'finished', adjustedTimeSec: 48.2, isBest: true });
  });

  it('when the run number is changed to one already taken, then 409 with fieldErrors.runNumber', async () => {
    const d = await driverWithCarAndEvent(t);
    await postRun(d.c, d.carId, d.eventId, { runNumber: 1 });
    const second = await postRun(d.c, d.carId, d.eventId, { runNumber: 2 });
    const res = await d.c.patch(`/api/runs/${second.id}`, { version: 1, runNumber: 1 });
    expectError(res, 409, 'conflict');
    expect(res.body.error.fieldErrors.runNumber).toBeDefined();
    expect((await d.c.get(`/api/runs/${second.id}`)).body.runNumber).toBe(2);
  });

  it('when the hot pressures are changed, one corner left out, then the run holds exactly the new set and every other field as it was', async () => {
    const d = await driverWithCarAndEvent(t);
    const run = await postRun(d.c, d.carId, d.eventId, { cones: 1, notes: 'Wet start', hotPressuresKpa: { lf: 250, rf: 252, lr: 240, rr: 241 } });
    const res = await d.c.patch(`/api/runs/${run.id}`, {
      version: 1, runNumber: run.runNumber, rawTimeSec: run.rawTimeSec, cones: 1, status: 'finished', notes: 'Wet start',
      hotPressuresKpa: { lf: 255.1, rf: 252, lr: 240 },
    });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body).toEqual({ ...run, hotPressuresKpa: { lf: 255.1, rf: 252, lr: 240 }, version: 2, updatedAt: res.body.updatedAt });
    expect((await d.c.get(`/api/runs/${run.id}`)).body).toEqual(res.body);
    expect(await countOf(t, "SELECT count(*) AS n FROM pressure_readings WHERE run_id = $1 AND kind = 'hot'", [run.id])).toBe(1);
  });

  it('when the hot pressures are set to null, then the run has none and its other fields are kept', async () => {
    const d = await driverWithCarAndEvent(t);
    const run = await postRun(d.c, d.carId, d.eventId, { notes: 'Cold tyres', hotPressuresKpa: { lf: 250, rr: 241 } });
    const res = await d.c.patch(`/api/runs/${run.id}`, { version: 1, hotPressuresKpa: null });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body).toMatchObject({ hotPressuresKpa: null, notes: 'Cold tyres', rawTimeSec: run.rawTimeSec, version: 2 });
    expect(await countOf(t, 'SELECT count(*) AS n FROM pressure_readings WHERE run_id = $1', [run.id])).toBe(0);
  });

  it('when an edit leaves the hot pressures out, then they are kept as they were', async () => {
    const d = await driverWithCarAndEvent(t);
    const run = await postRun(d.c, d.carId, d.eventId, { hotPressuresKpa: { lf: 250.4, rf: 252 } });
    const res = await d.c.patch(`/api/runs/${run.id}`, { version: 1, cones: 2 });
    expect(res.body).toMatchObject({ cones: 2, hotPressuresKpa: { lf: 250.4, rf: 252 } });
  });

  it('when a hot pressure in an edit is negative or outside 50–450 kPa, then 400 at that corner and nothing changes', async () => {
    const d = await driverWithCarAndEvent(t);
    const run = await postRun(d.c, d.carId, d.eventId, { hotPressuresKpa: { lf: 250 } });
    expectFieldErrors(await d.c.patch(`/api/runs/${run.id}`, { version: 1, cones: 3, hotPressuresKpa: { lf: -250, rr: 451 } }), [
      'hotPressuresKpa.lf',
      'hotPressuresKpa.rr',
    ]);
    expect((await d.c.get(`/api/runs/${run.id}`)).body).toEqual(run);
  });

  it('when the driver is changed to someone not on the car, then 400 on driverId', async () => {
    const d = await driverWithCarAndEvent(t);
    const stranger = await signedInClient(t);
    const run = await postRun(d.c, d.carId, d.eventId);
    expectFieldErrors(await d.c.patch(`/api/runs/${run.id}`, { version: 1, driverId: stranger.user.id }), ['driverId']);
    expect((await d.c.get(`/api/runs/${run.id}`)).body.driver.id).toBe(d.user.id);
  });
});

describe('GET and DELETE /api/runs/:runId', () => {
  it('when the run id is unknown or malformed, then 404', async () => {
    const d = await driverWithCarAndEvent(t);
    expectError(await d.c.get(`/api/runs/${randomUUID()}`), 404, 'not_found');
    expectError(await d.c.get('/api/runs/7'), 404, 'not_found');
  });

  it('when the owner deletes a run, then 204, it is gone and its hot pressures with it', async () => {
    const d = await driverWithCarAndEvent(t);
    const run = await postRun(d.c, d.carId, d.eventId, { hotPressuresKpa: { lf: 250 } });
    expect((await d.c.delete(`/api/runs/${run.id}`)).status).toBe(204);
    expectError(await d.c.get(`/api/runs/${run.id}`), 404, 'not_found');
    expect(await runsOf(d.carId)).toBe(0);
    expect(await countOf(t, 'SELECT count(*) AS n FROM pressure_readings WHERE run_id = $1', [run.id])).toBe(0);
    expectError(await d.c.delete(`/api/runs/${run.id}`), 404, 'not_found');
  });
});

describe('times (SCCA Solo Rules §1.2.1; common practice: corrected time = raw + penalty per cone, DNF has no time)', () => {
  it('when 45.678 s has 2 cones at the default 2 s penalty, then the adjusted time is 49.678 s', async () => {
    const d = await driverWithCarAndEvent(t);
    const res = await post(d, { rawTimeSec: 45.678, cones: 2 });
    expect(res.status).toBe(201);
    // Worked by hand (time plus penalties, SCCA Solo Rules §1.2.1): 45.678 s + 2 cones → 49.678 s
    expect(res.body.adjustedTimeSec).toBeCloseTo(49.678, 9);
    expect((await d.c.get(`/api/events/${d.eventId}`)).body.conePenaltySec).toBe(2);
  });

  it('when the event’s cone penalty is 1 s, then each cone adds 1 s', async () => {
    const d = await driverWithCarAndEvent(t, { conePenaltySec: 1 });
    const res = await post(d, { rawTimeSec: 45.678, cones: 2 });
    // 45.678 + 2 × 1 = 47.678 (time plus penalties, with the event's own penalty)
    expect(res.body.adjustedTimeSec).toBeCloseTo(47.678, 9);
  });

  it('when runs are [52.101 + 1 cone, DNF, 51.880], then 51.880 is best, the DNF has no time and % off best follows', async () => {
    const d = await driverWithCarAndEvent(t);
    const r1 = await postRun(d.c, d.carId, d.eventId, { runNumber: 1, rawTimeSec: 52.101, cones: 1, recordedAt: '2026-04-12T10:00:00Z' });
    const r2 = await postRun(d.c, d.carId, d.eventId, { runNumber: 2, status: 'dnf', rawTimeSec: null, recordedAt: '2026-04-12T11:00:00Z' });
    const r3 = await postRun(d.c, d.carId, d.eventId, { runNumber: 3, rawTimeSec: 51.88, recordedAt: '2026-04-12T12:00:00Z' });
    const list = await d.c.get(`/api/runs?carId=${d.carId}&eventId=${d.eventId}`);
    const byId = new Map<string, RunJson>(list.body.items.map((r: RunJson) => [r.id, r]));
    // Worked by hand (common practice): runs [52.101 + 1 cone, DNF, 51.880] → best 51.880
    expect(byId.get(r3.id)).toMatchObject({ adjustedTimeSec: 51.88, isBest: true, pctOffBest: 0 });
    expect(byId.get(r2.id)).toMatchObject({ adjustedTimeSec: null, pctOffBest: null, isBest: false });
    const first = byId.get(r1.id)!;
    expect(first.adjustedTimeSec).toBeCloseTo(54.101, 9);
    expect(first.isBest).toBe(false);
    // % off fastest = (t − t_best) / t_best × 100 (common practice)
    expect(Math.abs(first.pctOffBest! - ((54.101 - 51.88) / 51.88) * 100)).toBeLessThan(1e-9);
    expect(list.body.items.filter((r: RunJson) => r.isBest)).toHaveLength(1);
    // the single-run endpoint scores against the same group
    expect((await d.c.get(`/api/runs/${r1.id}`)).body.pctOffBest).toBe(first.pctOffBest);
  });

  it('when the only runs are a DNF and an off-course, then no run is best and none has a time', async () => {
    const d = await driverWithCarAndEvent(t);
    await postRun(d.c, d.carId, d.eventId, { runNumber: 1, status: 'dnf', rawTimeSec: null });
    await postRun(d.c, d.carId, d.eventId, { runNumber: 2, status: 'off_course', rawTimeSec: 50.2 });
    const list = await d.c.get(`/api/runs?carId=${d.carId}`);
    expect(list.body.items.map((r: RunJson) => [r.adjustedTimeSec, r.pctOffBest, r.isBest])).toEqual([
      [null, null, false],
      [null, null, false],
    ]);
  });

  it('when two drivers share the car, then each driver’s runs are scored against their own best', async () => {
    const d = await driverWithCarAndEvent(t);
    const co = await addCoDriver(t, d);
    const mine = await postRun(d.c, d.carId, d.eventId, { rawTimeSec: 50 });
    const theirs = await co.c.post('/api/runs', runBody(d.carId, d.eventId, { rawTimeSec: 55 }));
    expect(theirs.body).toMatchObject({ isBest: true, pctOffBest: 0 });
    expect((await d.c.get(`/api/runs/${mine.id}`)).body).toMatchObject({ isBest: true, pctOffBest: 0 });
  });
});
