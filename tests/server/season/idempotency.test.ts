import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { makeTestApp, type TestApp } from '../test-app';
import { addCoDriver, countOf, driverWithCarAndEvent, expectError, runBody, secondSession, setupBody, type Driver } from './season-fixtures';

let t: TestApp;
beforeAll(async () => {
  t = await makeTestApp();
});
afterAll(async () => {
  await t.close();
});

const rowsWithId = (id: string) => countOf(t, 'SELECT count(*) AS n FROM runs WHERE id = $1', [id]);

describe('idempotent POST /api/runs (the client makes the id)', () => {
  it('when the same run is posted twice, then 201 then 200 with an identical body and one row', async () => {
    const d = await driverWithCarAndEvent(t);
    const body = runBody(d.carId, d.eventId, { cones: 1, hotPressuresKpa: { lf: 248, rr: 241 }, notes: 'Sweeper wide' });
    const first = await d.c.post('/api/runs', body);
    const second = await d.c.post('/api/runs', body);
    expect(first.status, JSON.stringify(first.body)).toBe(201);
    expect(second.status, JSON.stringify(second.body)).toBe(200);
    expect(second.body).toEqual(first.body);
    expect(await rowsWithId(body.id)).toBe(1);
    expect(await countOf(t, 'SELECT count(*) AS n FROM pressure_readings WHERE run_id = $1', [body.id])).toBe(1);
  });

  it('when a replay writes the same instant with another offset, then it is still the same run (200)', async () => {
    const d = await driverWithCarAndEvent(t);
    const body = runBody(d.carId, d.eventId, { recordedAt: '2026-04-12T10:00:00Z' });
    const first = await d.c.post('/api/runs', body);
    const second = await d.c.post('/api/runs', { ...body, recordedAt: '2026-04-12T12:00:00+02:00' });
    expect([first.status, second.status]).toEqual([201, 200]);
    expect(second.body).toEqual(first.body);
  });

  it('when the same id comes with different content, then 409 and the stored run is unchanged', async () => {
    const d = await driverWithCarAndEvent(t);
    const body = runBody(d.carId, d.eventId);
    const first = await d.c.post('/api/runs', body);
    expect(first.status).toBe(201);
    for (const change of [{ rawTimeSec: 44.9 }, { cones: 1 }, { runNumber: 2 }, { status: 'dnf' }, { hotPressuresKpa: { lf: 250 } }]) {
      const res = await d.c.post('/api/runs', { ...body, ...change });
      expectError(res, 409, 'conflict');
    }
    expect((await d.c.get(`/api/runs/${body.id}`)).body).toEqual(first.body);
    expect(await rowsWithId(body.id)).toBe(1);
    expect(await countOf(t, 'SELECT count(*) AS n FROM runs WHERE car_id = $1', [d.carId])).toBe(1);
  });

  it('when another driver reuses a run id on their own car, then 409 and they learn nothing of the run', async () => {
    const d = await driverWithCarAndEvent(t);
    const other = await driverWithCarAndEvent(t);
    const body = runBody(d.carId, d.eventId);
    expect((await d.c.post('/api/runs', body)).status).toBe(201);
    const res = await other.c.post('/api/runs', runBody(other.carId, other.eventId, { id: body.id }));
    expectError(res, 409, 'conflict');
    expect(JSON.stringify(res.body)).not.toContain(d.carId);
    expect(await countOf(t, 'SELECT count(*) AS n FROM runs WHERE car_id = $1', [other.carId])).toBe(0);
  });

  it('when two sessions of the same driver race the same run, then exactly one row and both answers are 200/201 with equal bodies', async () => {
    // Two racing INSERTs of one run can meet on the run-number index before the primary key: with
    // `ON CONFLICT (id)` alone the loser then failed with 409 "Run N is already logged" for the very same run,
    // in about 1–5 % of races. So the test races many times (stopping at the first bad answer); 400 races
    // miss a 1 % fault with probability 0.99^400 ≈ 2 %. A new event every 20 races keeps each answer small.
    const d = await driverWithCarAndEvent(t);
    const other = await secondSession(t, d.email);
    // Each session has its own CSRF token; fetching them up front lets both POSTs leave together.
    const [tokenA, tokenB] = [await d.c.csrf(), await other.csrf()];
    const send = (c: typeof other, token: string, body: object) => c.agent.post('/api/runs').set('X-CSRF-Token', token).send(body);
    let eventId = d.eventId;
    for (let i = 1; i <= 400; i++) {
      if (i % 20 === 0) eventId = (await d.c.post('/api/events', { name: `Heat ${i}`, date: '2026-04-12' })).body.id;
      const body = runBody(d.carId, eventId, { runNumber: (i % 20) + 1, rawTimeSec: 45 + (i % 10) / 10, hotPressuresKpa: { lf: 250 } });
      const [a, b] = await Promise.all([send(d.c, tokenA, body), send(other, tokenB, body)]);
      expect([a.status, b.status].sort(), `race ${i}: ${JSON.stringify([a.body, b.body])}`).toEqual([200, 201]);
      expect(b.body, `race ${i}`).toEqual(a.body);
      expect(await rowsWithId(body.id), `race ${i}`).toBe(1);
    }
  }, 120_000);

  it('when the run number is taken by a different run id, then 409 with fieldErrors.runNumber and the new id is not stored', async () => {
    const d = await driverWithCarAndEvent(t);
    expect((await d.c.post('/api/runs', runBody(d.carId, d.eventId, { runNumber: 4 }))).status).toBe(201);
    const dup = runBody(d.carId, d.eventId, { runNumber: 4, rawTimeSec: 47.2 });
    const res = await d.c.post('/api/runs', dup);
    expectError(res, 409, 'conflict');
    expect(res.body.error.fieldErrors).toEqual({ runNumber: [expect.any(String)] });
    expect(await rowsWithId(dup.id)).toBe(0);
  });

  it('when a co-driver replays the owner’s run naming the owner as driver, then 200 with the same run', async () => {
    const d = await driverWithCarAndEvent(t);
    const co = await addCoDriver(t, d);
    const body = runBody(d.carId, d.eventId);
    const first = await d.c.post('/api/runs', body);
    const replay = await co.c.post('/api/runs', { ...body, driverId: d.user.id });
    expect([first.status, replay.status]).toEqual([201, 200]);
    expect(replay.body).toEqual(first.body);
  });
});

describe('other client-made ids', () => {
  it('when a tyre set, a change-log entry, a pressure reading and a tread reading are replayed, then 200 with one row each', async () => {
    const d = await driverWithCarAndEvent(t);
    const set = { id: randomUUID(), label: 'Set B', startTreadMm: 7, boughtOn: '2026-03-01' };
    const change = { id: randomUUID(), changedOn: '2026-04-10', what: 'Rear bar disconnected', location: 'rear' };
    const pressure = { id: randomUUID(), kind: 'cold', takenAt: '2026-04-12T08:00:00Z', corners: { lf: 220 } };
    const reading = { id: randomUUID(), takenAt: '2026-04-12T16:00:00Z', corners: { lf: { innerMm: 6, middleMm: 6.4, outerMm: 6.5 } } };
    for (const [url, body] of [
      [`/api/cars/${d.carId}/tyre-sets`, set],
      [`/api/cars/${d.carId}/changes`, change],
      [`/api/cars/${d.carId}/pressures`, pressure],
      [`/api/tyre-sets/${set.id}/readings`, reading],
    ] as const) {
      const first = await d.c.post(url, body);
      const second = await d.c.post(url, body);
      expect([first.status, second.status], url).toEqual([201, 200]);
      expect(second.body.id).toBe(body.id);
    }
    expect(await countOf(t, 'SELECT count(*) AS n FROM tyre_sets WHERE id = $1', [set.id])).toBe(1);
    expect(await countOf(t, 'SELECT count(*) AS n FROM change_log WHERE id = $1', [change.id])).toBe(1);
    expect(await countOf(t, 'SELECT count(*) AS n FROM pressure_readings WHERE id = $1', [pressure.id])).toBe(1);
    expect(await countOf(t, 'SELECT count(*) AS n FROM tread_readings WHERE id = $1', [reading.id])).toBe(1);
  });
});

describe('racing replays of other client-made ids', () => {
  // Every create below takes a client id; two requests racing with one id must leave one row and equal answers
  // (INSERT … ON CONFLICT DO NOTHING, then read the winner's row).
  const cases: [string, string, (d: Driver, tyreSetId: string, i: number) => [string, Record<string, unknown>]][] = [
    ['setup snapshot', 'setup_snapshots', (d, _s, i) => [`/api/cars/${d.carId}/setups`, setupBody({ id: randomUUID(), effectiveFrom: `2026-05-0${i}T00:00:00Z` })]],
    ['quick change', 'setup_snapshots', (d) => [`/api/cars/${d.carId}/setups/quick-change`, { id: randomUUID(), changes: [{ field: 'coldPressureKpa', corners: ['lf'], value: 200 }] }]],
    ['change-log entry', 'change_log', (d) => [`/api/cars/${d.carId}/changes`, { id: randomUUID(), changedOn: '2026-04-10', what: 'Rear bar disconnected' }]],
    ['tyre set', 'tyre_sets', (d) => [`/api/cars/${d.carId}/tyre-sets`, { id: randomUUID(), label: 'Set C' }]],
    ['tread reading', 'tread_readings', (_d, s) => [`/api/tyre-sets/${s}/readings`, { id: randomUUID(), takenAt: '2026-04-12T16:00:00Z', corners: { lf: { innerMm: 6, middleMm: 6, outerMm: 6 } } }]],
    ['pressure reading', 'pressure_readings', (d) => [`/api/cars/${d.carId}/pressures`, { id: randomUUID(), kind: 'cold', takenAt: '2026-04-12T08:00:00Z', corners: { lf: 220 } }]],
  ];

  it.each(cases)('when two sessions race the same %s id, then one row and the answers are 201 and 200 with the same record', async (_what, table, make) => {
    const d = await driverWithCarAndEvent(t);
    const other = await secondSession(t, d.email);
    const set = await d.c.post(`/api/cars/${d.carId}/tyre-sets`, { label: 'Set A', boughtOn: '2026-03-01' });
    for (let i = 1; i <= 5; i++) {
      const [url, body] = make(d, set.body.id, i);
      const [a, b] = await Promise.all([d.c.post(url, body), other.post(url, body)]);
      expect([a.status, b.status].sort(), JSON.stringify([a.body, b.body])).toEqual([200, 201]);
      expect(b.body).toEqual(a.body);
      expect(await countOf(t, `SELECT count(*) AS n FROM ${table} WHERE id = $1`, [body.id])).toBe(1);
    }
  });
});

describe('events and cars made on the device', () => {
  it('when an event with a client id is posted twice, then 201 then 200 with the same event, and one row', async () => {
    const d = await driverWithCarAndEvent(t);
    const body = { id: randomUUID(), name: 'Gravel Pit practice', date: '2026-05-01' };
    const first = await d.c.post('/api/events', body);
    const second = await d.c.post('/api/events', body);
    expect(first.status).toBe(201);
    expect(second.status).toBe(200);
    expect(second.body).toEqual(first.body);
    expect(first.body.id).toBe(body.id);
    expect(await countOf(t, 'SELECT count(*) AS n FROM events WHERE id = $1', [body.id])).toBe(1);
  });

  it("when another driver reuses someone's event or car id, then 409 and nothing of theirs is shown", async () => {
    const a = await driverWithCarAndEvent(t);
    const b = await driverWithCarAndEvent(t);
    const ev = await b.c.post('/api/events', { id: a.eventId, name: 'Mine now', date: '2026-05-01' });
    expect(ev.status).toBe(409);
    expect(JSON.stringify(ev.body)).not.toContain('Spring points');
    const car = await b.c.post('/api/cars', { id: a.carId, name: 'Mine now', classCode: 'X' });
    expect(car.status).toBe(409);
  });

  it('when a car with a client id is posted twice, then one car and the same answer', async () => {
    const d = await driverWithCarAndEvent(t);
    const body = { id: randomUUID(), name: 'Spare hatch', classCode: 'SH' };
    const first = await d.c.post('/api/cars', body);
    const second = await d.c.post('/api/cars', body);
    expect([first.status, second.status]).toEqual([201, 200]);
    expect(second.body).toEqual(first.body);
    expect(await countOf(t, 'SELECT count(*) AS n FROM cars WHERE id = $1', [body.id])).toBe(1);
  });
});

describe('rotations made on the device', () => {
  it('when a rotation with a client id is sent twice, then it is recorded once: 201, then 200 with the same body', async () => {
    const d = await driverWithCarAndEvent(t);
    const set = await d.c.post(`/api/cars/${d.carId}/tyre-sets`, { label: 'Set R' });
    const body = { id: randomUUID(), mountedAt: '2026-07-01T12:00:00Z', positions: { lf: 3, rf: 4, lr: 1, rr: 2 } };
    const first = await d.c.post(`/api/tyre-sets/${set.body.id}/mountings`, body);
    const second = await d.c.post(`/api/tyre-sets/${set.body.id}/mountings`, body);
    expect([first.status, second.status]).toEqual([201, 200]);
    expect(second.body).toEqual(first.body);
    expect(await countOf(t, 'SELECT count(*) AS n FROM tyre_mountings WHERE id = $1', [body.id])).toBe(1);
  });
});
