import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { makeTestApp, signedInClient, type TestApp } from '../test-app';
import {
  addCoDriver, anonymous, countOf, driverWithCarAndEvent, expectError, expectFieldErrors, postRun, postSetup, runBody, setupBody,
  type Client, type Driver,
} from './season-fixtures';

let t: TestApp;
beforeAll(async () => {
  t = await makeTestApp();
});
afterAll(async () => {
  await t.close();
});

/** A car with a setup, a run, a tyre set, a change and a pressure reading. */
async function seasonOf(t: TestApp) {
  const d = await driverWithCarAndEvent(t);
  const setup = await postSetup(d.c, d.carId);
  const later = await postSetup(d.c, d.carId, { label: 'Later', effectiveFrom: '2026-04-12T10:30:00Z' });
  const run = await postRun(d.c, d.carId, d.eventId);
  const set = await d.c.post(`/api/cars/${d.carId}/tyre-sets`, { label: 'Set A', boughtOn: '2026-03-01', startTreadMm: 7 });
  expect(set.status).toBe(201);
  return { d, setup, later, run, tyreSetId: set.body.id as string };
}
type Season = Awaited<ReturnType<typeof seasonOf>>;

/** Every season route against one car's records, as [label, request]. */
function everyRoute(c: Client, s: Season): [string, () => Promise<{ status: number; body: unknown }>][] {
  const { d, setup, later, run, tyreSetId } = s;
  return [
    ['GET car', () => c.get(`/api/cars/${d.carId}`)],
    ['PATCH car', () => c.patch(`/api/cars/${d.carId}`, { version: 1, name: 'Taken' })],
    ['DELETE car', () => c.delete(`/api/cars/${d.carId}`)],
    ['POST co-driver', () => c.post(`/api/cars/${d.carId}/co-drivers`, { email: d.email })],
    ['DELETE co-driver', () => c.delete(`/api/cars/${d.carId}/co-drivers/${d.user.id}`)],
    ['POST setup', () => c.post(`/api/cars/${d.carId}/setups`, setupBody({ label: 'Intruder' }))],
    ['GET setups', () => c.get(`/api/cars/${d.carId}/setups`)],
    ['GET setup', () => c.get(`/api/setups/${setup.id}`)],
    ['PATCH setup', () => c.patch(`/api/setups/${setup.id}`, { version: 1, label: 'Taken' })],
    ['DELETE setup', () => c.delete(`/api/setups/${setup.id}`)],
    ['GET setup runs', () => c.get(`/api/setups/${setup.id}/runs`)],
    ['POST quick change', () => c.post(`/api/cars/${d.carId}/setups/quick-change`, { changes: [{ field: 'damperClicks', corners: ['lf'], delta: 1 }] })],
    ['GET diff', () => c.get(`/api/setups/${setup.id}/diff/${later.id}`)],
    ['POST run', () => c.post('/api/runs', runBody(d.carId, d.eventId, { runNumber: 9 }))],
    ['GET runs by car', () => c.get(`/api/runs?carId=${d.carId}`)],
    ['GET run', () => c.get(`/api/runs/${run.id}`)],
    ['PATCH run', () => c.patch(`/api/runs/${run.id}`, { version: 1, cones: 5 })],
    ['DELETE run', () => c.delete(`/api/runs/${run.id}`)],
    ['GET event summary by car', () => c.get(`/api/events/${d.eventId}/summary?carId=${d.carId}`)],
    ['POST tyre set', () => c.post(`/api/cars/${d.carId}/tyre-sets`, { label: 'Intruder' })],
    ['GET tyre sets', () => c.get(`/api/cars/${d.carId}/tyre-sets`)],
    ['POST reading', () => c.post(`/api/tyre-sets/${tyreSetId}/readings`, { takenAt: '2026-04-12T16:00:00Z', corners: { lf: { innerMm: 6, middleMm: 6, outerMm: 6 } } })],
    ['GET readings', () => c.get(`/api/tyre-sets/${tyreSetId}/readings`)],
    ['POST mounting', () => c.post(`/api/tyre-sets/${tyreSetId}/mountings`, { mountedAt: '2026-04-20T09:00:00Z', positions: { lf: 3, rf: 4, lr: 1, rr: 2 } })],
    ['POST change', () => c.post(`/api/cars/${d.carId}/changes`, { changedOn: '2026-04-01', what: 'Intruder' })],
    ['GET changes', () => c.get(`/api/cars/${d.carId}/changes`)],
    ['POST pressures', () => c.post(`/api/cars/${d.carId}/pressures`, { kind: 'cold', takenAt: '2026-04-12T08:00:00Z', corners: { lf: 200 } })],
    ['GET pressures', () => c.get(`/api/cars/${d.carId}/pressures`)],
  ];
}

async function snapshotOf(t: TestApp, carId: string) {
  const q = async (sql: string) => countOf(t, sql, [carId]);
  return {
    cars: await q('SELECT count(*) AS n FROM cars WHERE id = $1'),
    version: await q('SELECT version AS n FROM cars WHERE id = $1'),
    coDrivers: await q('SELECT count(*) AS n FROM car_co_drivers WHERE car_id = $1'),
    setups: await q('SELECT count(*) AS n FROM setup_snapshots WHERE car_id = $1'),
    setupVersions: await q('SELECT sum(version) AS n FROM setup_snapshots WHERE car_id = $1'),
    runs: await q('SELECT count(*) AS n FROM runs WHERE car_id = $1'),
    runVersions: await q('SELECT sum(version) AS n FROM runs WHERE car_id = $1'),
    tyreSets: await q('SELECT count(*) AS n FROM tyre_sets WHERE car_id = $1'),
    mountings: await q('SELECT count(*) AS n FROM tyre_mountings m JOIN tyre_sets s ON s.id = m.tyre_set_id WHERE s.car_id = $1'),
    readings: await q('SELECT count(*) AS n FROM tread_readings r JOIN tyre_sets s ON s.id = r.tyre_set_id WHERE s.car_id = $1'),
    changes: await q('SELECT count(*) AS n FROM change_log WHERE car_id = $1'),
    pressures: await q('SELECT count(*) AS n FROM pressure_readings WHERE car_id = $1'),
  };
}

describe('another driver', () => {
  it('when they touch a car or anything under it, then every route answers 404 (never 403) and nothing changes', async () => {
    const s = await seasonOf(t);
    const other = await driverWithCarAndEvent(t);
    const before = await snapshotOf(t, s.d.carId);
    for (const [label, send] of everyRoute(other.c, s)) {
      const res = await send();
      expect(res.status, `${label}: ${JSON.stringify(res.body)}`).toBe(404);
      expect((res.body as { error: { code: string } }).error.code, label).toBe('not_found');
    }
    expect(await snapshotOf(t, s.d.carId)).toEqual(before);
  });

  it('when they diff one of their setups against this car’s, then 404', async () => {
    const s = await seasonOf(t);
    const other = await driverWithCarAndEvent(t);
    const theirs = await postSetup(other.c, other.carId);
    expectError(await other.c.get(`/api/setups/${theirs.id}/diff/${s.setup.id}`), 404, 'not_found');
    expectError(await other.c.get(`/api/setups/${s.setup.id}/diff/${theirs.id}`), 404, 'not_found');
  });

  it('when they log a run on their own event against this car, then 404 and nothing is written', async () => {
    const s = await seasonOf(t);
    const other = await driverWithCarAndEvent(t);
    expectError(await other.c.post('/api/runs', runBody(s.d.carId, other.eventId, { runNumber: 9 })), 404, 'not_found');
    expect(await countOf(t, 'SELECT count(*) AS n FROM runs WHERE car_id = $1', [s.d.carId])).toBe(1);
  });

  it('when they list runs, cars and events, then none of this driver’s records appear', async () => {
    const s = await seasonOf(t);
    const other = await driverWithCarAndEvent(t);
    const text = JSON.stringify([
      (await other.c.get('/api/runs')).body,
      (await other.c.get('/api/cars')).body,
      (await other.c.get('/api/events')).body,
    ]);
    for (const id of [s.d.carId, s.d.eventId, s.run.id]) expect(text).not.toContain(id);
  });
});

describe('nobody signed in', () => {
  it('when anonymous, then every season route answers 401 and nothing changes', async () => {
    const s = await seasonOf(t);
    const before = await snapshotOf(t, s.d.carId);
    const anon = anonymous(t);
    const routes: [string, () => Promise<{ status: number; body: unknown }>][] = [
      ...everyRoute(anon, s),
      ['GET cars', () => anon.get('/api/cars')],
      ['POST car', () => anon.post('/api/cars', { name: 'A', classCode: 'SS' })],
      ['GET runs', () => anon.get('/api/runs')],
      ['GET events', () => anon.get('/api/events')],
      ['POST event', () => anon.post('/api/events', { name: 'X', date: '2026-06-12' })],
      ['GET event', () => anon.get(`/api/events/${s.d.eventId}`)],
    ];
    for (const [label, send] of routes) {
      const res = await send();
      expect(res.status, `${label}: ${JSON.stringify(res.body)}`).toBe(401);
      expect((res.body as { error: { code: string } }).error.code, label).toBe('unauthenticated');
    }
    expect(await snapshotOf(t, s.d.carId)).toEqual(before);
  });
});

describe('a co-driver', () => {
  async function withCoDriver() {
    const s = await seasonOf(t);
    const co = await addCoDriver(t, s.d, 'Teo Marsh');
    return { ...s, co };
  }

  it('when they read the car’s season, then setups, runs, tyres, changes, pressures and the event answer 200', async () => {
    const s = await withCoDriver();
    const { d, co } = s;
    for (const path of [
      `/api/cars/${d.carId}`, `/api/cars/${d.carId}/setups`, `/api/setups/${s.setup.id}`, `/api/setups/${s.setup.id}/runs`,
      `/api/setups/${s.setup.id}/diff/${s.later.id}`, `/api/runs?carId=${d.carId}`, `/api/runs/${s.run.id}`,
      `/api/events/${d.eventId}`, `/api/events/${d.eventId}/summary?carId=${d.carId}`, `/api/cars/${d.carId}/tyre-sets`,
      `/api/tyre-sets/${s.tyreSetId}/readings`, `/api/cars/${d.carId}/changes`, `/api/cars/${d.carId}/pressures`,
    ]) {
      const res = await co.c.get(path);
      expect(res.status, `${path}: ${JSON.stringify(res.body)}`).toBe(200);
    }
    expect((await co.c.get(`/api/runs/${s.run.id}`)).body.setupId).toBe(s.setup.id);
  });

  it('when they write setups, then create, quick change, edit and delete all succeed', async () => {
    const s = await withCoDriver();
    const { d, co } = s;
    const created = await co.c.post(`/api/cars/${d.carId}/setups`, setupBody({ label: 'Co-driver tweak', effectiveFrom: '2026-04-12T12:00:00Z' }));
    expect(created.status, JSON.stringify(created.body)).toBe(201);
    expect(created.body.createdBy.id).toBe(co.user.id);
    const qc = await co.c.post(`/api/cars/${d.carId}/setups/quick-change`, { changes: [{ field: 'coldPressureKpa', corners: ['lf'], delta: -7 }] });
    expect(qc.status, JSON.stringify(qc.body)).toBe(201);
    const edited = await co.c.patch(`/api/setups/${s.setup.id}`, { version: 1, notes: 'Checked by Teo' });
    expect(edited.status).toBe(200);
    expect((await co.c.delete(`/api/setups/${created.body.id}`)).status).toBe(204);
  });

  it('when they log a run without a driverId, then it is logged as theirs; they can edit and delete runs', async () => {
    const s = await withCoDriver();
    const { d, co } = s;
    const mine = await co.c.post('/api/runs', runBody(d.carId, d.eventId, { runNumber: 1, rawTimeSec: 47.2 }));
    expect(mine.status, JSON.stringify(mine.body)).toBe(201);
    expect(mine.body.driver).toEqual({ id: co.user.id, displayName: 'Teo Marsh' });
    const explicit = await co.c.post('/api/runs', runBody(d.carId, d.eventId, { runNumber: 2, driverId: co.user.id }));
    expect(explicit.status).toBe(201);
    expect(explicit.body.driver.id).toBe(co.user.id);
    const edited = await co.c.patch(`/api/runs/${s.run.id}`, { version: 1, cones: 1 });
    expect(edited.status).toBe(200);
    expect(edited.body.driver.id).toBe(d.user.id);
    expect((await co.c.delete(`/api/runs/${explicit.body.id}`)).status).toBe(204);
  });

  it('when they write tyres, changes and pressures, then each is accepted', async () => {
    const s = await withCoDriver();
    const { d, co } = s;
    expect((await co.c.post(`/api/cars/${d.carId}/tyre-sets`, { label: 'Set B' })).status).toBe(201);
    expect((await co.c.post(`/api/tyre-sets/${s.tyreSetId}/readings`, { takenAt: '2026-04-12T16:00:00Z', corners: { lf: { innerMm: 6, middleMm: 6, outerMm: 6 } } })).status).toBe(201);
    expect((await co.c.post(`/api/tyre-sets/${s.tyreSetId}/mountings`, { mountedAt: '2026-04-20T09:00:00Z', positions: { lf: 3, rf: 4, lr: 1, rr: 2 } })).status).toBe(201);
    expect((await co.c.post(`/api/cars/${d.carId}/changes`, { changedOn: '2026-04-01', what: 'Toe reset' })).status).toBe(201);
    expect((await co.c.post(`/api/cars/${d.carId}/pressures`, { kind: 'cold', takenAt: '2026-04-12T08:00:00Z', corners: { lf: 200 } })).status).toBe(201);
  });

  it('when they edit or delete the car, then 403 forbidden and the car is unchanged', async () => {
    const s = await withCoDriver();
    const { d, co } = s;
    const before = await snapshotOf(t, d.carId);
    expectError(await co.c.patch(`/api/cars/${d.carId}`, { version: 1, name: 'Teo’s car' }), 403, 'forbidden');
    expectError(await co.c.delete(`/api/cars/${d.carId}`), 403, 'forbidden');
    expect(await snapshotOf(t, d.carId)).toEqual(before);
    expect((await d.c.get(`/api/cars/${d.carId}`)).body).toMatchObject({ name: 'Blue roadster', version: 1 });
  });

  it('when anyone logs a run for a driver who is neither owner nor co-driver, then 400 on driverId and nothing is written', async () => {
    const s = await withCoDriver();
    const { d, co } = s;
    const stranger = await signedInClient(t);
    expectFieldErrors(await co.c.post('/api/runs', runBody(d.carId, d.eventId, { runNumber: 5, driverId: stranger.user.id })), ['driverId']);
    expectFieldErrors(await d.c.post('/api/runs', runBody(d.carId, d.eventId, { runNumber: 5, driverId: stranger.user.id })), ['driverId']);
    expect(await countOf(t, 'SELECT count(*) AS n FROM runs WHERE car_id = $1', [d.carId])).toBe(1);
  });

  it('when the co-driver is removed, then the car and everything under it is 404 for them again', async () => {
    const s = await withCoDriver();
    const { d, co } = s;
    expect((await d.c.delete(`/api/cars/${d.carId}/co-drivers/${co.user.id}`)).status).toBe(204);
    expectError(await co.c.get(`/api/cars/${d.carId}/setups`), 404, 'not_found');
    expectError(await co.c.get(`/api/runs/${s.run.id}`), 404, 'not_found');
    expectError(await co.c.post('/api/runs', runBody(d.carId, d.eventId, { runNumber: 7 })), 404, 'not_found');
  });
});

describe('ids that name nothing', () => {
  it('when a route gets a well-formed id that does not exist, then 404', async () => {
    const d: Driver = await driverWithCarAndEvent(t);
    const id = randomUUID();
    for (const path of [`/api/cars/${id}`, `/api/cars/${id}/setups`, `/api/setups/${id}`, `/api/setups/${id}/runs`, `/api/runs/${id}`, `/api/events/${id}/summary`, `/api/cars/${id}/tyre-sets`, `/api/tyre-sets/${id}/readings`, `/api/cars/${id}/changes`, `/api/cars/${id}/pressures`]) {
      expectError(await d.c.get(path), 404, 'not_found');
    }
  });
});
