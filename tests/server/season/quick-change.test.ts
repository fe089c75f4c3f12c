import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { makeTestApp, type TestApp } from '../test-app';
import { countOf, driverWithCarAndEvent, expectError, expectFieldErrors, postSetup, setupBody } from './season-fixtures';

let t: TestApp;
beforeAll(async () => {
  t = await makeTestApp();
});
afterAll(async () => {
  await t.close();
});

const setupsOf = (carId: string) => countOf(t, 'SELECT count(*) AS n FROM setup_snapshots WHERE car_id = $1', [carId]);
const base = setupBody();

describe('POST /api/cars/:carId/setups/quick-change', () => {
  it('when rear damperClicks go +2, then a new snapshot derived from the active one is effective now with every other value copied', async () => {
    const d = await driverWithCarAndEvent(t);
    const active = await postSetup(d.c, d.carId);
    const before = Date.now();
    const res = await d.c.post(`/api/cars/${d.carId}/setups/quick-change`, {
      changes: [{ field: 'damperClicks', corners: ['lr', 'rr'], delta: 2 }],
    });
    const after = Date.now();
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body.id).not.toBe(active.id);
    expect(res.body.derivedFromId).toBe(active.id);
    const effective = Date.parse(res.body.effectiveFrom);
    expect(effective).toBeGreaterThanOrEqual(before - 1000);
    expect(effective).toBeLessThanOrEqual(after + 1000);
    const corners = active.corners as Record<string, Record<string, unknown>>;
    expect(res.body.corners).toEqual({
      lf: corners.lf,
      rf: corners.rf,
      lr: { ...corners.lr, damperClicks: base.corners.lr.damperClicks + 2 },
      rr: { ...corners.rr, damperClicks: base.corners.rr.damperClicks + 2 },
    });
    expect(res.body.axles).toEqual(active.axles);
    expect(res.body.label).toMatch(/rear clicks \+2/);
    expect(await setupsOf(d.carId)).toBe(2);
  });

  it('when cold pressure goes −7 kPa on all four corners, then each corner is 7 kPa lower', async () => {
    const d = await driverWithCarAndEvent(t);
    await postSetup(d.c, d.carId);
    const res = await d.c.post(`/api/cars/${d.carId}/setups/quick-change`, {
      effectiveFrom: '2026-04-12T10:05:00Z',
      changes: [{ field: 'coldPressureKpa', corners: ['lf', 'rf', 'lr', 'rr'], delta: -7 }],
    });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body.effectiveFrom).toBe('2026-04-12T10:05:00.000Z');
    const kpa = (['lf', 'rf', 'lr', 'rr'] as const).map((c) => res.body.corners[c].coldPressureKpa);
    expect(kpa).toEqual((['lf', 'rf', 'lr', 'rr'] as const).map((c) => base.corners[c].coldPressureKpa - 7));
  });

  it('when an effective time is given, then the change starts from the snapshot in force at that time, not the newest', async () => {
    const d = await driverWithCarAndEvent(t);
    const a = await postSetup(d.c, d.carId);
    await postSetup(d.c, d.carId, { label: 'Later', effectiveFrom: '2026-06-01T00:00:00Z', corners: { lr: { damperClicks: 1 } } });
    const res = await d.c.post(`/api/cars/${d.carId}/setups/quick-change`, {
      effectiveFrom: '2026-04-12T10:05:00Z',
      changes: [{ field: 'damperClicks', corners: ['lr'], delta: 1 }],
    });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body.derivedFromId).toBe(a.id);
    expect(res.body.corners.lr.damperClicks).toBe(base.corners.lr.damperClicks + 1);
  });

  it('when a value is given instead of a delta, then that value is set', async () => {
    const d = await driverWithCarAndEvent(t);
    await postSetup(d.c, d.carId);
    const res = await d.c.post(`/api/cars/${d.carId}/setups/quick-change`, {
      changes: [{ field: 'rideHeightMm', corners: ['lf', 'rf'], value: 118 }],
    });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect([res.body.corners.lf.rideHeightMm, res.body.corners.rf.rideHeightMm, res.body.corners.lr.rideHeightMm]).toEqual([118, 118, null]);
  });

  it('when one change sets a value the corners already have, then the default name leaves it out and names the change that was made', async () => {
    const d = await driverWithCarAndEvent(t);
    await postSetup(d.c, d.carId);
    const res = await d.c.post(`/api/cars/${d.carId}/setups/quick-change`, {
      changes: [
        { field: 'damperClicks', corners: ['lr', 'rr'], delta: 2 },
        { field: 'coldPressureKpa', corners: ['lf', 'rf'], value: base.corners.lf.coldPressureKpa },
      ],
    });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(base.corners.rf.coldPressureKpa).toBe(base.corners.lf.coldPressureKpa);
    expect(res.body.label).toBe('Quick change: rear clicks +2');
  });

  it('when a delta pushes clicks past the 12-position adjuster, then 400 under changes.0.delta and no snapshot is made', async () => {
    const d = await driverWithCarAndEvent(t);
    await postSetup(d.c, d.carId);
    const res = await d.c.post(`/api/cars/${d.carId}/setups/quick-change`, {
      changes: [{ field: 'damperClicks', corners: ['rr'], delta: 7 }],
    });
    const errors = expectFieldErrors(res, ['changes.0.delta']);
    expect(errors['changes.0.delta']!.join(' ')).toMatch(/RR/);
    expect(await setupsOf(d.carId)).toBe(1);
  });

  it('when the second change is the bad one, then the field error is under changes.1.delta', async () => {
    const d = await driverWithCarAndEvent(t);
    await postSetup(d.c, d.carId);
    const res = await d.c.post(`/api/cars/${d.carId}/setups/quick-change`, {
      changes: [
        { field: 'coldPressureKpa', corners: ['lf'], delta: -5 },
        { field: 'damperClicks', corners: ['lf', 'rf'], delta: 9 },
      ],
    });
    expectFieldErrors(res, ['changes.1.delta']);
    expect(await setupsOf(d.carId)).toBe(1);
  });

  it('when a delta pushes clicks past the adjuster on two corners, then the field error names both corners', async () => {
    // Each corner past the adjuster gets its own message under the change that caused it.
    const d = await driverWithCarAndEvent(t);
    await postSetup(d.c, d.carId);
    const res = await d.c.post(`/api/cars/${d.carId}/setups/quick-change`, {
      changes: [{ field: 'damperClicks', corners: ['lr', 'rr'], delta: 7 }],
    });
    const errors = expectFieldErrors(res, ['changes.0.delta']);
    expect(errors['changes.0.delta']!.join(' ')).toMatch(/LR/);
    expect(errors['changes.0.delta']!.join(' ')).toMatch(/RR/);
    expect(await setupsOf(d.carId)).toBe(1);
  });

  it('when a value past the adjuster is given, then the field error is under changes.0.value, where the value was sent', async () => {
    // A change sent as a value gets its error on `value`, the field the client sent.
    const d = await driverWithCarAndEvent(t);
    await postSetup(d.c, d.carId);
    const res = await d.c.post(`/api/cars/${d.carId}/setups/quick-change`, {
      changes: [{ field: 'damperClicks', corners: ['lf'], value: 13 }],
    });
    expectFieldErrors(res, ['changes.0.value']);
    expect(await setupsOf(d.carId)).toBe(1);
  });

  it('when a value past the schema cap of 100 clicks is given, then the field error is under changes.0.value', async () => {
    const d = await driverWithCarAndEvent(t);
    await postSetup(d.c, d.carId);
    const res = await d.c.post(`/api/cars/${d.carId}/setups/quick-change`, {
      changes: [{ field: 'damperClicks', corners: ['lf'], value: 101 }],
    });
    expectFieldErrors(res, ['changes.0.value']);
    expect(await setupsOf(d.carId)).toBe(1);
  });

  it('when a delta takes a pressure below 50 kPa, then 400 under changes.0.delta and no snapshot is made', async () => {
    const d = await driverWithCarAndEvent(t);
    await postSetup(d.c, d.carId);
    const res = await d.c.post(`/api/cars/${d.carId}/setups/quick-change`, {
      changes: [{ field: 'coldPressureKpa', corners: ['lr', 'rr'], delta: -161 }],
    });
    const errors = expectFieldErrors(res, ['changes.0.delta']);
    expect(errors['changes.0.delta']!.join(' ')).toMatch(/LR/);
    expect(errors['changes.0.delta']!.join(' ')).toMatch(/RR/);
    expect(await setupsOf(d.carId)).toBe(1);
  });

  it('when a delta is applied to a value that is not recorded (null), then 400 under changes.0.delta', async () => {
    const d = await driverWithCarAndEvent(t);
    await postSetup(d.c, d.carId);
    const res = await d.c.post(`/api/cars/${d.carId}/setups/quick-change`, {
      changes: [{ field: 'rideHeightMm', corners: ['lf'], delta: 5 }],
    });
    expectFieldErrors(res, ['changes.0.delta']);
    expect(await setupsOf(d.carId)).toBe(1);
  });

  it('when the car has no snapshot yet, then a delta has nothing to change: 400 and nothing written', async () => {
    const d = await driverWithCarAndEvent(t);
    const res = await d.c.post(`/api/cars/${d.carId}/setups/quick-change`, {
      changes: [{ field: 'coldPressureKpa', corners: ['lf'], delta: -7 }],
    });
    expectFieldErrors(res, ['changes.0.delta']);
    expect(await setupsOf(d.carId)).toBe(0);
  });

  it('when a change is malformed, then 400 at its path', async () => {
    const d = await driverWithCarAndEvent(t);
    await postSetup(d.c, d.carId);
    const url = `/api/cars/${d.carId}/setups/quick-change`;
    expectFieldErrors(await d.c.post(url, { changes: [] }), ['changes']);
    expectFieldErrors(await d.c.post(url, { changes: [{ field: 'damperClicks', corners: ['lr'], delta: 1, value: 3 }] }), ['changes.0.delta']);
    expectFieldErrors(await d.c.post(url, { changes: [{ field: 'casterDeg', corners: ['lr'], delta: 1 }] }), ['changes.0.field']);
    expectFieldErrors(await d.c.post(url, { changes: [{ field: 'damperClicks', corners: [], delta: 1 }] }), ['changes.0.corners']);
    expectFieldErrors(await d.c.post(url, { changes: [{ field: 'damperClicks', corners: ['lr'], delta: 1, why: 'x' }] }), ['changes.0.why']);
    expect(await setupsOf(d.carId)).toBe(1);
  });

  it('when the same client id is sent twice, then 201 then 200 with one snapshot', async () => {
    const d = await driverWithCarAndEvent(t);
    await postSetup(d.c, d.carId);
    const body = { id: randomUUID(), changes: [{ field: 'damperClicks', corners: ['lf'], delta: 1 }] };
    const first = await d.c.post(`/api/cars/${d.carId}/setups/quick-change`, body);
    const second = await d.c.post(`/api/cars/${d.carId}/setups/quick-change`, body);
    expect([first.status, second.status]).toEqual([201, 200]);
    expect(second.body).toEqual(first.body);
    expect(await setupsOf(d.carId)).toBe(2);
  });

  it('when the quick change is diffed against its parent, then only the changed paths are listed', async () => {
    const d = await driverWithCarAndEvent(t);
    const active = await postSetup(d.c, d.carId);
    const qc = await d.c.post(`/api/cars/${d.carId}/setups/quick-change`, {
      changes: [
        { field: 'damperClicks', corners: ['lr', 'rr'], delta: 2 },
        { field: 'coldPressureKpa', corners: ['lf'], delta: -7 },
      ],
    });
    expect(qc.status, JSON.stringify(qc.body)).toBe(201);
    const diff = await d.c.get(`/api/setups/${active.id}/diff/${qc.body.id}`);
    expect(diff.body.changes.map((c: { path: string; from: number; to: number; delta: number }) => [c.path, c.from, c.to, c.delta])).toEqual([
      ['corners.lf.coldPressureKpa', 220, 213, -7],
      ['corners.lr.damperClicks', 6, 8, 2],
      ['corners.rr.damperClicks', 6, 8, 2],
    ]);
  });

  it('when another driver asks for a quick change on the car, then 404 and nothing is written', async () => {
    const d = await driverWithCarAndEvent(t);
    const other = await driverWithCarAndEvent(t);
    await postSetup(d.c, d.carId);
    expectError(
      await other.c.post(`/api/cars/${d.carId}/setups/quick-change`, { changes: [{ field: 'damperClicks', corners: ['lf'], delta: 1 }] }),
      404,
      'not_found',
    );
    expect(await setupsOf(d.carId)).toBe(1);
  });
});
