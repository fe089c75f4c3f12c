import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { makeTestApp, type TestApp } from '../test-app';
import { countOf, driverWithCarAndEvent, expectError, expectFieldErrors, postRun, postSetup, setupBody, type Driver } from './season-fixtures';

let t: TestApp;
beforeAll(async () => {
  t = await makeTestApp();
});
afterAll(async () => {
  await t.close();
});

const setupsOf = (carId: string) => countOf(t, 'SELECT count(*) AS n FROM setup_snapshots WHERE car_id = $1', [carId]);
const emptyCorner = {
  camberDeg: null, toeMm: null, casterDeg: null, springRateNPerMm: null, rideHeightMm: null,
  damperClicks: null, damperReboundClicks: null, coldPressureKpa: null, cornerWeightKg: null,
};
const lfWith = (d: Driver, lf: Record<string, unknown>) =>
  d.c.post(`/api/cars/${d.carId}/setups`, setupBody({ corners: { lf } }));

describe('POST /api/cars/:carId/setups', () => {
  it('when the input is valid, then 201 with all four corners (unrecorded fields null), axles and no parent', async () => {
    const d = await driverWithCarAndEvent(t);
    const res = await d.c.post(
      `/api/cars/${d.carId}/setups`,
      setupBody({ corners: { lf: { camberDeg: -2.25, springRateNPerMm: 70 }, rr: { coldPressureKpa: 200 } }, notes: 'Pre-season' }),
    );
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body).toEqual({
      id: expect.any(String),
      carId: d.carId,
      label: 'Baseline',
      effectiveFrom: '2026-04-01T00:00:00.000Z',
      createdBy: { id: d.user.id, displayName: 'Nell Ashdown' },
      derivedFromId: null,
      suggestion: null,
      workOrder: null,
      notes: 'Pre-season',
      corners: {
        lf: { ...emptyCorner, camberDeg: -2.25, springRateNPerMm: 70 },
        rf: emptyCorner,
        lr: emptyCorner,
        rr: { ...emptyCorner, coldPressureKpa: 200 },
      },
      axles: { front: { antiRollBar: 'hole 2' }, rear: { antiRollBar: 'disconnected' } },
      version: 1,
      createdAt: expect.any(String),
      updatedAt: expect.any(String),
    });
    expect((await d.c.get(`/api/setups/${res.body.id}`)).body).toEqual(res.body);
  });

  it('when a later snapshot is added, then it is derived from the one in force at its effective time', async () => {
    const d = await driverWithCarAndEvent(t);
    const a = await postSetup(d.c, d.carId);
    const b = await postSetup(d.c, d.carId, { label: 'Event day', effectiveFrom: '2026-04-12T08:00:00Z' });
    expect(b.derivedFromId).toBe(a.id);
    const before = await postSetup(d.c, d.carId, { label: 'Winter', effectiveFrom: '2026-01-01T00:00:00Z' });
    expect(before.derivedFromId).toBeNull();
  });

  it('when the same client id is posted twice, then 201 then 200 with the same snapshot and one row', async () => {
    const d = await driverWithCarAndEvent(t);
    const body = setupBody({ id: randomUUID() });
    const first = await d.c.post(`/api/cars/${d.carId}/setups`, body);
    const second = await d.c.post(`/api/cars/${d.carId}/setups`, body);
    expect([first.status, second.status]).toEqual([201, 200]);
    expect(second.body).toEqual(first.body);
    expect(await setupsOf(d.carId)).toBe(1);
  });

  it('when derivedFromId names another car’s setup, then 400 on derivedFromId and nothing is written', async () => {
    const d = await driverWithCarAndEvent(t);
    const other = await driverWithCarAndEvent(t);
    const foreign = await postSetup(other.c, other.carId);
    expectFieldErrors(await d.c.post(`/api/cars/${d.carId}/setups`, setupBody({ derivedFromId: foreign.id })), ['derivedFromId']);
    expect(await setupsOf(d.carId)).toBe(0);
  });

  it('when the body is not valid JSON, then 400 malformed_json and nothing is written', async () => {
    const d = await driverWithCarAndEvent(t);
    const token = await d.c.csrf();
    const res = await d.c.agent.post(`/api/cars/${d.carId}/setups`).set('X-CSRF-Token', token).set('Content-Type', 'application/json').send('{"label": ');
    expectError(res, 400, 'malformed_json');
    expect(await setupsOf(d.carId)).toBe(0);
  });

  it('when label and effectiveFrom are missing or malformed, then 400 names them and nothing is written', async () => {
    const d = await driverWithCarAndEvent(t);
    expectFieldErrors(await d.c.post(`/api/cars/${d.carId}/setups`, { corners: {} }), ['label', 'effectiveFrom']);
    expectFieldErrors(await d.c.post(`/api/cars/${d.carId}/setups`, setupBody({ effectiveFrom: '12/04/2026 10:00' })), ['effectiveFrom']);
    expect(await setupsOf(d.carId)).toBe(0);
  });

  it('when a field is unknown at the top, in a corner, in an axle or is an unknown corner, then 400 "Unknown field" at its path', async () => {
    const d = await driverWithCarAndEvent(t);
    const errors = expectFieldErrors(
      await d.c.post(`/api/cars/${d.carId}/setups`, {
        ...setupBody(),
        tyre: 'A052',
        corners: { lf: { camberDeg: -1, springRate: 70 }, spare: {} },
        axles: { front: { antiRollBar: 'hole 1', bushing: 'poly' } },
      }),
      ['tyre', 'corners.lf.springRate', 'corners.spare', 'axles.front.bushing'],
    );
    expect(Object.values(errors)).toEqual([['Unknown field'], ['Unknown field'], ['Unknown field'], ['Unknown field']]);
    expect(await setupsOf(d.carId)).toBe(0);
  });
});

describe('plausibility limits on a setup', () => {
  it('when camber is at −10° and +5°, then it is accepted', async () => {
    const d = await driverWithCarAndEvent(t);
    const res = await d.c.post(`/api/cars/${d.carId}/setups`, setupBody({ corners: { lf: { camberDeg: -10 }, rf: { camberDeg: 5 } } }));
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect([res.body.corners.lf.camberDeg, res.body.corners.rf.camberDeg]).toEqual([-10, 5]);
  });

  it('when camber is −10.1° or +5.1°, then 400 at corners.<corner>.camberDeg and nothing is written', async () => {
    const d = await driverWithCarAndEvent(t);
    expectFieldErrors(await lfWith(d, { camberDeg: -10.1 }), ['corners.lf.camberDeg']);
    expectFieldErrors(
      await d.c.post(`/api/cars/${d.carId}/setups`, setupBody({ corners: { rr: { camberDeg: 5.1 } } })),
      ['corners.rr.camberDeg'],
    );
    expect(await setupsOf(d.carId)).toBe(0);
  });

  it('when toe is ±20 mm it is accepted, and at ±20.5 mm it is refused at corners.<corner>.toeMm', async () => {
    const d = await driverWithCarAndEvent(t);
    expect((await d.c.post(`/api/cars/${d.carId}/setups`, setupBody({ corners: { lf: { toeMm: -20 }, rf: { toeMm: 20 } } }))).status).toBe(201);
    expectFieldErrors(
      await d.c.post(`/api/cars/${d.carId}/setups`, setupBody({ corners: { lf: { toeMm: -20.5 }, rf: { toeMm: 20.5 } } })),
      ['corners.lf.toeMm', 'corners.rf.toeMm'],
    );
    expect(await setupsOf(d.carId)).toBe(1);
  });

  it('when clicks are 0 or 12 on the 12-position adjuster, then they are accepted', async () => {
    const d = await driverWithCarAndEvent(t);
    const res = await d.c.post(
      `/api/cars/${d.carId}/setups`,
      setupBody({ corners: { lf: { damperClicks: 0 }, rr: { damperClicks: 12, damperReboundClicks: 12 } } }),
    );
    expect(res.status, JSON.stringify(res.body)).toBe(201);
  });

  it('when clicks are 13 on the 12-position adjuster, then 400 at corners.lf.damperClicks naming the adjuster and nothing is written', async () => {
    const d = await driverWithCarAndEvent(t);
    const errors = expectFieldErrors(await lfWith(d, { damperClicks: 13 }), ['corners.lf.damperClicks']);
    expect(errors['corners.lf.damperClicks']![0]).toMatch(/12/);
    expectFieldErrors(
      await d.c.post(`/api/cars/${d.carId}/setups`, setupBody({ corners: { rr: { damperReboundClicks: 13 } } })),
      ['corners.rr.damperReboundClicks'],
    );
    expect(await setupsOf(d.carId)).toBe(0);
  });

  it('when the rear dampers have a rebound adjuster of 20 clicks, then rebound clicks there are checked against its 20 and clicks against the other adjuster\'s 12', async () => {
    const d = await driverWithCarAndEvent(t);
    const rear = { positions: 12, countFrom: 'full_soft', rebound: { positions: 20, countFrom: 'full_stiff' } };
    expect((await d.c.patch(`/api/cars/${d.carId}`, { version: 1, damperAdjusters: { rear } })).status).toBe(200);
    const ok = await d.c.post(`/api/cars/${d.carId}/setups`, setupBody({ corners: { rr: { damperClicks: 12, damperReboundClicks: 20 } } }));
    expect(ok.status, JSON.stringify(ok.body)).toBe(201);
    const errors = expectFieldErrors(
      await d.c.post(`/api/cars/${d.carId}/setups`, setupBody({ corners: { lf: { damperReboundClicks: 13 }, rr: { damperClicks: 13, damperReboundClicks: 21 } } })),
      ['corners.lf.damperReboundClicks', 'corners.rr.damperClicks', 'corners.rr.damperReboundClicks'],
    );
    expect(errors['corners.rr.damperReboundClicks']![0]).toMatch(/20 clicks/);
    expect(errors['corners.rr.damperClicks']![0]).toMatch(/12 clicks/);
    // The front dampers describe no rebound adjuster: their rebound clicks stay within their one adjuster's 12.
    expect(errors['corners.lf.damperReboundClicks']![0]).toMatch(/12 clicks/);
    expect(await setupsOf(d.carId)).toBe(1);
  });

  it('when clicks are −1, 101 or fractional, then the schema refuses them at the corner field', async () => {
    const d = await driverWithCarAndEvent(t);
    expectFieldErrors(await lfWith(d, { damperClicks: -1 }), ['corners.lf.damperClicks']);
    expectFieldErrors(await lfWith(d, { damperClicks: 101 }), ['corners.lf.damperClicks']);
    expectFieldErrors(await lfWith(d, { damperClicks: 4.5 }), ['corners.lf.damperClicks']);
    expect(await setupsOf(d.carId)).toBe(0);
  });

  it('when the car has no adjuster recorded, then clicks up to the schema cap of 100 are accepted', async () => {
    const d = await driverWithCarAndEvent(t);
    const car = await d.c.post('/api/cars', { name: 'Unknown dampers', classCode: 'SM' });
    const res = await d.c.post(`/api/cars/${car.body.id}/setups`, setupBody({ corners: { lf: { damperClicks: 100 } } }));
    expect(res.status, JSON.stringify(res.body)).toBe(201);
  });

  it('when cold pressure is 50 or 450 kPa it is accepted; 49.9 or 450.1 kPa is refused at corners.<corner>.coldPressureKpa', async () => {
    const d = await driverWithCarAndEvent(t);
    expect((await d.c.post(`/api/cars/${d.carId}/setups`, setupBody({ corners: { lf: { coldPressureKpa: 50 }, rf: { coldPressureKpa: 450 } } }))).status).toBe(201);
    expectFieldErrors(
      await d.c.post(`/api/cars/${d.carId}/setups`, setupBody({ corners: { lr: { coldPressureKpa: 49.9 }, rr: { coldPressureKpa: 450.1 } } })),
      ['corners.lr.coldPressureKpa', 'corners.rr.coldPressureKpa'],
    );
    expect(await setupsOf(d.carId)).toBe(1);
  });

  it('when a value is a string, then 400 at its path', async () => {
    const d = await driverWithCarAndEvent(t);
    expectFieldErrors(await lfWith(d, { camberDeg: '-1.5' }), ['corners.lf.camberDeg']);
    expect(await setupsOf(d.carId)).toBe(0);
  });
});

describe('GET /api/cars/:carId/setups and /api/setups/:setupId', () => {
  it('when a car has snapshots, then the list answers { items, count }, latest effective first', async () => {
    const d = await driverWithCarAndEvent(t);
    const a = await postSetup(d.c, d.carId, { label: 'A' });
    const c = await postSetup(d.c, d.carId, { label: 'C', effectiveFrom: '2026-05-01T00:00:00Z' });
    const b = await postSetup(d.c, d.carId, { label: 'B', effectiveFrom: '2026-04-12T10:30:00Z' });
    const res = await d.c.get(`/api/cars/${d.carId}/setups`);
    expect(res.status).toBe(200);
    expect(res.body.count).toBe(3);
    expect(res.body.items.map((s: { id: string }) => s.id)).toEqual([c.id, b.id, a.id]);
  });

  it('when a car has no snapshots, then the list is empty', async () => {
    const d = await driverWithCarAndEvent(t);
    expect((await d.c.get(`/api/cars/${d.carId}/setups`)).body).toEqual({ items: [], count: 0 });
  });

  it('when the setup id is unknown or malformed, then 404', async () => {
    const d = await driverWithCarAndEvent(t);
    expectError(await d.c.get(`/api/setups/${randomUUID()}`), 404, 'not_found');
    expectError(await d.c.get('/api/setups/abc'), 404, 'not_found');
  });
});

describe('PATCH /api/setups/:setupId', () => {
  it('when the version is current, then it saves the change, keeps untouched corners and bumps the version', async () => {
    const d = await driverWithCarAndEvent(t);
    const s = await postSetup(d.c, d.carId);
    const lf = { camberDeg: -2, toeMm: 0, damperClicks: 5, coldPressureKpa: 215 };
    const res = await d.c.patch(`/api/setups/${s.id}`, { version: 1, label: 'Baseline, more camber', corners: { lf }, axles: { rear: { antiRollBar: 'hole 1' } } });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body).toMatchObject({ label: 'Baseline, more camber', version: 2, effectiveFrom: s.effectiveFrom });
    expect(res.body.corners.lf).toEqual({ ...emptyCorner, ...lf });
    expect(res.body.corners.rr).toEqual((s.corners as Record<string, unknown>).rr);
    expect(res.body.axles).toEqual({ front: { antiRollBar: 'hole 2' }, rear: { antiRollBar: 'hole 1' } });
    expect((await d.c.get(`/api/setups/${s.id}`)).body).toEqual(res.body);
  });

  it('when an edit sends one field of a corner, then that corner’s other recorded values are kept; null clears a value', async () => {
    // PATCH keeps what is not sent; null clears a value.
    const d = await driverWithCarAndEvent(t);
    const s = await postSetup(d.c, d.carId);
    const res = await d.c.patch(`/api/setups/${s.id}`, { version: 1, corners: { lf: { camberDeg: -2, toeMm: null } } });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body.corners.lf).toEqual({ ...emptyCorner, camberDeg: -2, toeMm: null, damperClicks: 4, coldPressureKpa: 220 });
  });

  it('when the version is missing, then 400 on version and nothing changes', async () => {
    const d = await driverWithCarAndEvent(t);
    const s = await postSetup(d.c, d.carId);
    expectFieldErrors(await d.c.patch(`/api/setups/${s.id}`, { label: 'No version' }), ['version']);
    expect((await d.c.get(`/api/setups/${s.id}`)).body).toEqual(s);
  });

  it('when the version is stale, then 409 carries the current setup and the stale edit changes nothing', async () => {
    const d = await driverWithCarAndEvent(t);
    const s = await postSetup(d.c, d.carId);
    const fresh = await d.c.patch(`/api/setups/${s.id}`, { version: 1, label: 'Fresh' });
    expect(fresh.status).toBe(200);
    const stale = await d.c.patch(`/api/setups/${s.id}`, { version: 1, label: 'Stale', corners: { lf: { camberDeg: -3 } } });
    expectError(stale, 409, 'conflict');
    expect(stale.body.error.current).toMatchObject({ id: s.id, version: 2, label: 'Fresh' });
    expect(stale.body.error.current.corners.lf.camberDeg).toBe(-1.5);
    expect((await d.c.get(`/api/setups/${s.id}`)).body).toEqual(fresh.body);
  });

  it('when an edit puts clicks past the adjuster or camber out of range, then 400 at the corner path and nothing changes', async () => {
    const d = await driverWithCarAndEvent(t);
    const s = await postSetup(d.c, d.carId);
    expectFieldErrors(await d.c.patch(`/api/setups/${s.id}`, { version: 1, corners: { lf: { damperClicks: 13 } } }), ['corners.lf.damperClicks']);
    expectFieldErrors(await d.c.patch(`/api/setups/${s.id}`, { version: 1, corners: { rf: { camberDeg: 6 } } }), ['corners.rf.camberDeg']);
    expectFieldErrors(await d.c.patch(`/api/setups/${s.id}`, { version: 1, id: randomUUID() }), ['id']);
    expect((await d.c.get(`/api/setups/${s.id}`)).body).toEqual(s);
  });

  it('when a setup is made derived from itself or from another car’s setup, then 400 on derivedFromId', async () => {
    const d = await driverWithCarAndEvent(t);
    const other = await driverWithCarAndEvent(t);
    const s = await postSetup(d.c, d.carId);
    const foreign = await postSetup(other.c, other.carId);
    expectFieldErrors(await d.c.patch(`/api/setups/${s.id}`, { version: 1, derivedFromId: s.id }), ['derivedFromId']);
    expectFieldErrors(await d.c.patch(`/api/setups/${s.id}`, { version: 1, derivedFromId: foreign.id }), ['derivedFromId']);
    expect((await d.c.get(`/api/setups/${s.id}`)).body.version).toBe(1);
  });
});

describe('DELETE /api/setups/:setupId', () => {
  it('when the owner deletes a snapshot, then 204, it is gone and a snapshot derived from it loses its parent', async () => {
    const d = await driverWithCarAndEvent(t);
    const a = await postSetup(d.c, d.carId);
    const b = await postSetup(d.c, d.carId, { label: 'B', effectiveFrom: '2026-04-12T10:30:00Z' });
    expect(b.derivedFromId).toBe(a.id);
    expect((await d.c.delete(`/api/setups/${a.id}`)).status).toBe(204);
    expectError(await d.c.get(`/api/setups/${a.id}`), 404, 'not_found');
    expect((await d.c.get(`/api/setups/${b.id}`)).body.derivedFromId).toBeNull();
    expect(await setupsOf(d.carId)).toBe(1);
    expectError(await d.c.delete(`/api/setups/${a.id}`), 404, 'not_found');
  });
});

describe('GET /api/setups/:setupId/runs', () => {
  it('when runs were made on a snapshot, then it answers { items, count } with those runs only', async () => {
    const d = await driverWithCarAndEvent(t);
    const a = await postSetup(d.c, d.carId);
    const b = await postSetup(d.c, d.carId, { label: 'B', effectiveFrom: '2026-04-12T10:30:00Z' });
    const r1 = await postRun(d.c, d.carId, d.eventId, { runNumber: 1, recordedAt: '2026-04-12T10:00:00Z' });
    const r2 = await postRun(d.c, d.carId, d.eventId, { runNumber: 2, recordedAt: '2026-04-12T11:00:00Z' });
    const onA = await d.c.get(`/api/setups/${a.id}/runs`);
    expect(onA.status).toBe(200);
    expect(onA.body).toMatchObject({ count: 1, items: [{ id: r1.id, setupId: a.id }] });
    expect((await d.c.get(`/api/setups/${b.id}/runs`)).body).toMatchObject({ count: 1, items: [{ id: r2.id, setupId: b.id }] });
  });
});

describe('GET /api/setups/:a/diff/:b', () => {
  it('when two snapshots differ, then it lists exactly the changed paths with from, to and delta', async () => {
    const d = await driverWithCarAndEvent(t);
    const a = await postSetup(d.c, d.carId);
    const base = setupBody();
    const b = await postSetup(d.c, d.carId, {
      label: 'More front camber, softer rear bar',
      effectiveFrom: '2026-04-12T10:30:00Z',
      corners: { ...base.corners, lf: { ...base.corners.lf, camberDeg: -2.1 }, rf: { ...base.corners.rf, camberDeg: -2.1 }, rr: { ...base.corners.rr, coldPressureKpa: 203, rideHeightMm: 120 } },
      axles: { front: { antiRollBar: 'hole 2' }, rear: { antiRollBar: 'hole 1' } },
    });
    const res = await d.c.get(`/api/setups/${a.id}/diff/${b.id}`);
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body).toEqual({
      fromId: a.id,
      toId: b.id,
      changes: [
        { path: 'corners.lf.camberDeg', corner: 'lf', axle: null, field: 'camberDeg', from: -1.5, to: -2.1, delta: expect.closeTo(-0.6, 9) },
        { path: 'corners.rf.camberDeg', corner: 'rf', axle: null, field: 'camberDeg', from: -1.5, to: -2.1, delta: expect.closeTo(-0.6, 9) },
        { path: 'corners.rr.rideHeightMm', corner: 'rr', axle: null, field: 'rideHeightMm', from: null, to: 120, delta: null },
        { path: 'corners.rr.coldPressureKpa', corner: 'rr', axle: null, field: 'coldPressureKpa', from: 210, to: 203, delta: -7 },
        { path: 'axles.rear.antiRollBar', corner: null, axle: 'rear', field: 'antiRollBar', from: 'disconnected', to: 'hole 1', delta: null },
      ],
    });
  });

  it('when a snapshot is compared with itself, then there are no changes; an unknown id is 404', async () => {
    const d = await driverWithCarAndEvent(t);
    const a = await postSetup(d.c, d.carId);
    expect((await d.c.get(`/api/setups/${a.id}/diff/${a.id}`)).body.changes).toEqual([]);
    expectError(await d.c.get(`/api/setups/${a.id}/diff/${randomUUID()}`), 404, 'not_found');
  });
});
