import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { makeTestApp, type TestApp } from '../test-app';
import { countOf, driverWithCarAndEvent, expectError, expectFieldErrors, postSetup } from './season-fixtures';

let t: TestApp;
beforeAll(async () => {
  t = await makeTestApp();
});
afterAll(async () => {
  await t.close();
});

const changesOf = (carId: string) => countOf(t, 'SELECT count(*) AS n FROM change_log WHERE car_id = $1', [carId]);

describe('POST /api/cars/:carId/changes', () => {
  it('when a change is logged, then 201 with the entry, the whole car as location by default and its author', async () => {
    const d = await driverWithCarAndEvent(t);
    const setup = await postSetup(d.c, d.carId);
    const res = await d.c.post(`/api/cars/${d.carId}/changes`, { changedOn: '2026-03-28', what: 'Corner-balanced with driver', notes: 'Shop visit', setupId: setup.id });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body).toEqual({
      id: expect.any(String),
      carId: d.carId,
      changedOn: '2026-03-28',
      what: 'Corner-balanced with driver',
      location: 'car',
      notes: 'Shop visit',
      setupId: setup.id,
      fromVisit: false,
      createdBy: { id: d.user.id, displayName: 'Nell Ashdown' },
      createdAt: expect.any(String),
    });
  });

  it('when what or changedOn is missing or malformed, or the location is unknown, then 400 at each field and nothing is written', async () => {
    const d = await driverWithCarAndEvent(t);
    const url = `/api/cars/${d.carId}/changes`;
    expectFieldErrors(await d.c.post(url, { location: 'front' }), ['changedOn', 'what']);
    expectFieldErrors(await d.c.post(url, { changedOn: '28/03/2026', what: 'x', location: 'roof' }), ['changedOn', 'location']);
    expectFieldErrors(await d.c.post(url, { changedOn: '2026-03-28', what: 'x'.repeat(201) }), ['what']);
    expect(expectFieldErrors(await d.c.post(url, { changedOn: '2026-03-28', what: 'x', cost: 40 }), ['cost']).cost).toEqual(['Unknown field']);
    expect(await changesOf(d.carId)).toBe(0);
  });

  it('when the setupId belongs to another car, then 400 on setupId and nothing is written', async () => {
    const d = await driverWithCarAndEvent(t);
    const other = await driverWithCarAndEvent(t);
    const foreign = await postSetup(other.c, other.carId);
    expectFieldErrors(await d.c.post(`/api/cars/${d.carId}/changes`, { changedOn: '2026-03-28', what: 'x', setupId: foreign.id }), ['setupId']);
    expect(await changesOf(d.carId)).toBe(0);
  });
});

describe('GET /api/cars/:carId/changes', () => {
  it('when changes were logged out of order, then { items, count } in date order', async () => {
    const d = await driverWithCarAndEvent(t);
    const url = `/api/cars/${d.carId}/changes`;
    const late = await d.c.post(url, { changedOn: '2026-06-12', what: 'Front camber arms fitted', location: 'front' });
    const early = await d.c.post(url, { changedOn: '2026-02-01', what: 'Coilovers fitted' });
    const res = await d.c.get(url);
    expect(res.status).toBe(200);
    expect(res.body.count).toBe(2);
    expect(res.body.items.map((e: { id: string }) => e.id)).toEqual([early.body.id, late.body.id]);
  });

  it('when another driver reads or writes the change log, then 404 and nothing is written', async () => {
    const d = await driverWithCarAndEvent(t);
    const other = await driverWithCarAndEvent(t);
    expectError(await other.c.get(`/api/cars/${d.carId}/changes`), 404, 'not_found');
    expectError(await other.c.post(`/api/cars/${d.carId}/changes`, { changedOn: '2026-03-28', what: 'x' }), 404, 'not_found');
    expect(await changesOf(d.carId)).toBe(0);
  });
});

describe('DELETE /api/cars/:carId/changes/:changeId', () => {
  it('when a mistaken entry is deleted, then 204 and the log no longer lists it; the setup it named stays', async () => {
    const d = await driverWithCarAndEvent(t);
    const setup = await postSetup(d.c, d.carId);
    const keep = await d.c.post(`/api/cars/${d.carId}/changes`, { changedOn: '2026-03-28', what: 'Camber arms fitted', location: 'front' });
    const wrong = await d.c.post(`/api/cars/${d.carId}/changes`, { changedOn: '2026-03-29', what: 'Wrong car', setupId: setup.id });

    expect((await d.c.delete(`/api/cars/${d.carId}/changes/${wrong.body.id}`)).status).toBe(204);

    const log = await d.c.get(`/api/cars/${d.carId}/changes`);
    expect(log.body.items.map((e: { id: string }) => e.id)).toEqual([keep.body.id]);
    expect(await countOf(t, 'SELECT count(*) AS n FROM setup_snapshots WHERE id = $1', [setup.id])).toBe(1);
    expectError(await d.c.delete(`/api/cars/${d.carId}/changes/${wrong.body.id}`), 404, 'not_found');
  });

  it('when the entry is another car’s, then 404 and it stays', async () => {
    const d = await driverWithCarAndEvent(t);
    const other = await driverWithCarAndEvent(t);
    const entry = await d.c.post(`/api/cars/${d.carId}/changes`, { changedOn: '2026-03-28', what: 'Camber arms fitted' });

    expectError(await other.c.delete(`/api/cars/${other.carId}/changes/${entry.body.id}`), 404, 'not_found');
    expect(await changesOf(d.carId)).toBe(1);
  });

  it('when the entry was written by a shop at a handover, then 409 and it stays with the visit', async () => {
    const d = await driverWithCarAndEvent(t);
    const entry = await d.c.post(`/api/cars/${d.carId}/changes`, { changedOn: '2026-03-28', what: 'Aligned, corner-balanced' });
    // As the handover writes it: the entry points at the visit (server/features/work-orders).
    const [shop] = (await t.ds.query(`INSERT INTO shops (name) VALUES ('Test bench') RETURNING id`)) as { id: string }[];
    const [visit] = (await t.ds.query(
      `INSERT INTO work_orders (id, car_id, shop_id, opened_by, visit_date, requested_work) VALUES (gen_random_uuid(), $1, $2, $3, '2026-03-28', 'Alignment') RETURNING id`,
      [d.carId, shop!.id, d.user.id],
    )) as { id: string }[];
    await t.ds.query('UPDATE change_log SET work_order_id = $1 WHERE id = $2', [visit!.id, entry.body.id]);
    // Listed as such, so the page offers no Delete for it.
    expect((await d.c.get(`/api/cars/${d.carId}/changes`)).body.items[0].fromVisit).toBe(true);

    const res = await d.c.delete(`/api/cars/${d.carId}/changes/${entry.body.id}`);
    expectError(res, 409, 'conflict');
    expect(res.body.error.message).toMatch(/handed the car back/);
    expect(await changesOf(d.carId)).toBe(1);
  });
});
