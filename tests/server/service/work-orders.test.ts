/**
 * Shop service visits. The alignment and corner-weight numbers are invented test values
 * checked only for arithmetic (after − before, shares of a total); real alignment and
 * spring work is for the car maker's specifications, the event's rules and a qualified
 * technician (spring compressors, car on stands, clearances checked with the spring out).
 */
import { randomUUID } from 'node:crypto';
import { handoverLabel } from '../../../shared/service/handover-label';
import { LINES_TOTAL_MAX_CENTS } from '../../../shared/service/work-order.schema';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { captureMail, makeTestApp, signedInClient, type TestApp } from '../test-app';
import { addCoDriver, countOf, expectError, expectFieldErrors, postRun, postSetup } from '../season/season-fixtures';
import { grantedCar, SHOP_NAME, shopWithAdmin } from '../collab/shop-fixtures';
import { seededDatabaseUrl } from '../support-seeded';
import { createDataSource } from '../../../server/db/data-source';
import { DEMO_CAMBER_ARMS_DATE } from '../../../server/db/demo-season';
import { DEMO_SHOP } from '../../../server/db/demo-accounts';
import { loadWorkOrder } from '../../../server/features/work-orders/work-order.service';
import { UsedUpParts1765670400000 } from '../../../server/db/migrations/1765670400000-used-up-parts';

let t: TestApp;
let mail: ReturnType<typeof captureMail>;
beforeAll(async () => {
  mail = captureMail();
  t = await makeTestApp({ mail: mail.settings });
});
afterAll(async () => {
  await t.close();
});

const VISIT = { visitDate: '2026-06-12', requestedWork: 'Fit adjustable front camber arms and align', notes: 'Customer wants more front camber for autocross' };

/** A granted car with a baseline setup (front camber −1.5°), a co-driver, and an open visit by the granted shop. */
async function openVisit() {
  const g = await grantedCar(t);
  const co = await addCoDriver(t, g.driver);
  const setup = await postSetup(g.driver.c, g.driver.carId);
  const res = await g.staff.c.post(`/api/cars/${g.driver.carId}/work-orders`, VISIT);
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return { ...g, co, setup, workOrder: res.body as { id: string; version: number } & Record<string, unknown> };
}

const corner = (camberDeg: number, cornerWeightKg: number | null, over: Record<string, number | null> = {}) => ({
  camberDeg, toeMm: 0.5, casterDeg: 6.1, rideHeightMm: 125, cornerWeightKg, ...over,
});
const BEFORE = {
  measuredAt: '2026-06-12T09:00:00Z', driverInCar: true, driverWeightKg: 82, fuelLevelPct: 50,
  corners: { lf: corner(-1.1, 300), rf: corner(-1.2, 280), lr: corner(-1.5, 260), rr: corner(-1.5, 290) },
};
const AFTER = {
  measuredAt: '2026-06-12T15:00:00Z', driverInCar: true, driverWeightKg: 82, fuelLevelPct: 50,
  corners: { lf: corner(-2.4, 296), rf: corner(-2.4, 284), lr: corner(-1.5, 262), rr: corner(-1.5, 288) },
};
const LINES = {
  lines: [
    { kind: 'part', description: 'Adjustable front camber arm', quantity: 2, unitPriceCents: 18950 },
    { kind: 'labour', description: 'Fit arms and four-wheel alignment', quantity: 2.5, unitPriceCents: 9500 },
  ],
};
const SHEET = {
  corners: {
    lf: {
      damperCompressedLengthMm: 335, referenceCompressedLengthMm: 350, strokeMm: 110, bodyLengthSetting: '12 threads showing',
      mainSpringRateNPerMm: 105, wheelLoadKg: 300, wheelDroopMm: 70, bumpStopMm: 20, bumpClicks: 5, reboundClicks: 7,
    },
  },
};

describe('POST /api/cars/:carId/work-orders', () => {
  it('when staff of the granted shop open a visit, then 201, open, signed with the shop; a resend of the same id is 200 with the same visit', async () => {
    const g = await grantedCar(t);
    const id = randomUUID();
    const res = await g.staff.c.post(`/api/cars/${g.driver.carId}/work-orders`, { id, ...VISIT });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body).toMatchObject({
      id, carId: g.driver.carId, shop: { id: g.shopId, name: SHOP_NAME, taxRatePct: 0 }, visitDate: '2026-06-12', requestedWork: VISIT.requestedWork,
      status: 'open', handoverAt: null, setupId: null, lines: [], stages: { before: null, after: null }, version: 1,
    });
    const again = await g.staff.c.post(`/api/cars/${g.driver.carId}/work-orders`, { id, ...VISIT });
    expect(again.status).toBe(200);
    expect(again.body.id).toBe(id);
    expect(await countOf(t, 'SELECT count(*) AS n FROM work_orders WHERE car_id = $1', [g.driver.carId])).toBe(1);
  });

  it('when the car\'s drivers try to open one, then 403; another driver and another shop get 404; nothing is written', async () => {
    const g = await grantedCar(t);
    const co = await addCoDriver(t, g.driver);
    const stranger = await signedInClient(t);
    const other = await shopWithAdmin(t, 'Other shop');
    const url = `/api/cars/${g.driver.carId}/work-orders`;
    expectError(await g.driver.c.post(url, VISIT), 403, 'forbidden');
    expectError(await co.c.post(url, VISIT), 403, 'forbidden');
    expectError(await stranger.c.post(url, VISIT), 404, 'not_found');
    expectError(await other.admin.c.post(url, VISIT), 404, 'not_found');
    expect(await countOf(t, 'SELECT count(*) AS n FROM work_orders WHERE car_id = $1', [g.driver.carId])).toBe(0);
  });

  it('when the date and requested work are missing or bad, then 400 naming each field and nothing is written', async () => {
    const g = await grantedCar(t);
    const url = `/api/cars/${g.driver.carId}/work-orders`;
    expectFieldErrors(await g.staff.c.post(url, { visitDate: '12/06/2026', requestedWork: '   ' }), ['visitDate', 'requestedWork']);
    expectFieldErrors(await g.staff.c.post(url, { ...VISIT, shopId: randomUUID() }), ['shopId']);
    expect(await countOf(t, 'SELECT count(*) AS n FROM work_orders WHERE car_id = $1', [g.driver.carId])).toBe(0);
  });
});

describe('lists', () => {
  it('when the driver lists the car\'s visits, then every shop\'s visit is there; staff see only their own shop\'s', async () => {
    const { driver, staff, workOrder, shopId } = await openVisit();
    const second = await shopWithAdmin(t, 'Second shop');
    await driver.c.post(`/api/cars/${driver.carId}/shop-grants`, { shopId: second.shopId });
    const theirs = await second.admin.c.post(`/api/cars/${driver.carId}/work-orders`, { visitDate: '2026-07-01', requestedWork: 'Corner balance' });
    expect(theirs.status).toBe(201);
    const mine = await driver.c.get(`/api/cars/${driver.carId}/work-orders`);
    expect(mine.status).toBe(200);
    expect(mine.body.items).toEqual([
      { id: workOrder.id, shop: { id: shopId, name: SHOP_NAME }, visitDate: '2026-06-12', requestedWork: VISIT.requestedWork, status: 'open', handoverAt: null, setupId: null, invoice: null },
      { id: theirs.body.id, shop: { id: second.shopId, name: 'Second shop' }, visitDate: '2026-07-01', requestedWork: 'Corner balance', status: 'open', handoverAt: null, setupId: null, invoice: null },
    ]);
    const staffView = await staff.c.get(`/api/cars/${driver.carId}/work-orders`);
    expect(staffView.body.items.map((w: { id: string }) => w.id)).toEqual([workOrder.id]);
  });

  it('when the shop reads its board, then open and closed filter it; another shop gets 404', async () => {
    const { driver, staff, shopId, workOrder } = await openVisit();
    const board = await staff.c.get(`/api/shops/${shopId}/work-orders?status=open`);
    expect(board.status).toBe(200);
    expect(board.body.items).toEqual([
      {
        id: workOrder.id, car: { id: driver.carId, name: 'Blue roadster' }, owner: { id: driver.user.id, displayName: 'Nell Ashdown' },
        visitDate: '2026-06-12', requestedWork: VISIT.requestedWork, status: 'open', handoverAt: null, invoice: null,
      },
    ]);
    expect((await staff.c.get(`/api/shops/${shopId}/work-orders?status=closed`)).body.items).toEqual([]);
    expectFieldErrors(await staff.c.get(`/api/shops/${shopId}/work-orders?status=done`), ['status']);
    const other = await shopWithAdmin(t, 'Nosy shop');
    expectError(await other.admin.c.get(`/api/shops/${shopId}/work-orders`), 404, 'not_found');
    expectError(await driver.c.get(`/api/shops/${shopId}/work-orders`), 404, 'not_found');
  });
});

describe('editing a visit', () => {
  it('when drivers read the visit, then 200; when they edit it, then 403; another driver or shop gets 404', async () => {
    const { driver, co, workOrder } = await openVisit();
    const url = `/api/work-orders/${workOrder.id}`;
    // The driver reads amounts in the shop's own currency, though they cannot read the shop.
    await t.ds.query(`UPDATE shops SET currency = 'eur' WHERE id = (SELECT shop_id FROM work_orders WHERE id = $1)`, [workOrder.id]);
    const read = await driver.c.get(url);
    expect(read.status).toBe(200);
    expect(read.body.shop.currency).toBe('eur');
    expect((await co.c.get(url)).status).toBe(200);
    expectError(await driver.c.patch(url, { notes: 'x', version: 1 }), 403, 'forbidden');
    expectError(await co.c.put(`${url}/lines`, LINES), 403, 'forbidden');
    expectError(await driver.c.put(`${url}/measurements/before`, BEFORE), 403, 'forbidden');
    expectError(await driver.c.post(`${url}/close`, { handoverAt: '2026-06-12T16:00:00Z' }), 403, 'forbidden');
    const stranger = await signedInClient(t);
    const other = await shopWithAdmin(t, 'Other shop');
    expectError(await stranger.c.get(url), 404, 'not_found');
    expectError(await other.admin.c.get(url), 404, 'not_found');
    expectError(await other.admin.c.patch(url, { notes: 'x', version: 1 }), 404, 'not_found');
  });

  it('when the owner withdraws the shop\'s access, then its staff still read the visit but get 403 on edits', async () => {
    const { driver, staff, shopId, workOrder } = await openVisit();
    expect((await driver.c.delete(`/api/cars/${driver.carId}/shop-grants/${shopId}`)).status).toBe(204);
    const url = `/api/work-orders/${workOrder.id}`;
    expect((await staff.c.get(url)).status).toBe(200);
    expectError(await staff.c.patch(url, { notes: 'x', version: 1 }), 403, 'forbidden');
    expectError(await staff.c.put(`${url}/lines`, LINES), 403, 'forbidden');
  });

  it('when staff patch with the current version, then it saves and the version goes up; an old version is 409 with the current visit', async () => {
    const { staff, workOrder } = await openVisit();
    const url = `/api/work-orders/${workOrder.id}`;
    const res = await staff.c.patch(url, { requestedWork: 'Camber arms, align, corner balance', version: 1 });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body).toMatchObject({ requestedWork: 'Camber arms, align, corner balance', notes: VISIT.notes, version: 2 });
    const stale = await staff.c.patch(url, { requestedWork: 'Something else', version: 1 });
    expectError(stale, 409, 'conflict');
    expect(stale.body.error.current).toMatchObject({ requestedWork: 'Camber arms, align, corner balance', version: 2 });
  });

  it('when lines are replaced, then the old ones go and totals are quantity × price; bad lines are 400 per field and nothing changes', async () => {
    const { staff, workOrder } = await openVisit();
    const url = `/api/work-orders/${workOrder.id}/lines`;
    await staff.c.put(url, { lines: [{ kind: 'part', description: 'Old line', quantity: 1, unitPriceCents: 100 }] });
    const res = await staff.c.put(url, LINES);
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    // 2 × 189.50 = 379.00; 2.5 h × 95.00 = 237.50.
    expect(res.body.lines).toEqual([
      { kind: 'part', description: 'Adjustable front camber arm', quantity: 2, unitPriceCents: 18950, usedUp: false, totalCents: 37900 },
      { kind: 'labour', description: 'Fit arms and four-wheel alignment', quantity: 2.5, unitPriceCents: 9500, usedUp: false, totalCents: 23750 },
    ]);
    expect(res.body.totals).toEqual({ partsCents: 37900, labourCents: 23750, subtotalCents: 61650 });
    expectFieldErrors(
      await staff.c.put(url, { lines: [{ kind: 'gift', description: '', quantity: 0, unitPriceCents: 1.5 }] }),
      ['lines.0.kind', 'lines.0.description', 'lines.0.quantity', 'lines.0.unitPriceCents'],
    );
    expect(await countOf(t, 'SELECT count(*) AS n FROM work_order_lines WHERE work_order_id = $1', [workOrder.id])).toBe(2);
  });

  it('when a part is marked used up, then it reads back used up; a part sent without the flag, and labour, stay on the car', async () => {
    const { staff, workOrder } = await openVisit();
    const res = await staff.c.put(`/api/work-orders/${workOrder.id}/lines`, {
      lines: [
        { kind: 'part', description: 'Brake fluid, 1 l', quantity: 1, unitPriceCents: 1800, usedUp: true },
        { kind: 'part', description: 'Adjustable front camber arm', quantity: 2, unitPriceCents: 18950 },
        { kind: 'part', description: 'Rear toe arm', quantity: 2, unitPriceCents: 9900, usedUp: false },
        { kind: 'labour', description: 'Bleed brakes', quantity: 0.5, unitPriceCents: 9500, usedUp: false },
      ],
    });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body.lines.map((l: { description: string; usedUp: boolean }) => [l.description, l.usedUp])).toEqual([
      ['Brake fluid, 1 l', true],
      ['Adjustable front camber arm', false],
      ['Rear toe arm', false],
      ['Bleed brakes', false],
    ]);
    // Used up or not, a part is billed as a part.
    expect(res.body.totals).toEqual({ partsCents: 1800 + 37900 + 19800, labourCents: 4750, subtotalCents: 1800 + 37900 + 19800 + 4750 });
    const stored = await t.ds.query('SELECT description, used_up FROM work_order_lines WHERE work_order_id = $1 ORDER BY position', [workOrder.id]);
    expect(stored.map((r: { used_up: boolean }) => r.used_up)).toEqual([true, false, false, false]);
  });

  it('when labour is marked used up, or the flag is not true or false, then 400 at that line\'s field and the lines stay as they were', async () => {
    const { staff, workOrder } = await openVisit();
    const url = `/api/work-orders/${workOrder.id}/lines`;
    expect((await staff.c.put(url, LINES)).status).toBe(200);
    const errors = expectFieldErrors(
      await staff.c.put(url, {
        lines: [
          { kind: 'labour', description: 'Alignment', quantity: 1, unitPriceCents: 9000, usedUp: true },
          { kind: 'part', description: 'Shop supplies', quantity: 1, unitPriceCents: 500, usedUp: 'yes' },
          { kind: 'part', description: 'Cable ties', quantity: 1, unitPriceCents: 100, usedUp: null },
        ],
      }),
      ['lines.0.usedUp', 'lines.1.usedUp', 'lines.2.usedUp'],
    );
    expect(errors['lines.0.usedUp']).toEqual(['Only a part can be used up, not labour']);
    // The database refuses a used-up labour line too, whatever writes it.
    await expect(
      t.ds.query(`INSERT INTO work_order_lines (work_order_id, kind, description, quantity, unit_price_cents, used_up, position) VALUES ($1, 'labour', 'x', 1, 1, true, 9)`, [workOrder.id]),
    ).rejects.toThrow(/work_order_lines_used_up_part_check/);
    const lines = (await staff.c.get(`/api/work-orders/${workOrder.id}`)).body.lines as { description: string; usedUp: boolean }[];
    expect(lines.map((l) => [l.description, l.usedUp])).toEqual([['Adjustable front camber arm', false], ['Fit arms and four-wheel alignment', false]]);
  });

  it('when a line lands on half a cent, then the work order rounds it as the invoice will (half away from zero)', async () => {
    const { staff, workOrder } = await openVisit();
    // 0.29 h × 50 cents = 14.5 cents exactly → 15 cents; binary floating point gives 14.499… and would show 14.
    const res = await staff.c.put(`/api/work-orders/${workOrder.id}/lines`, {
      lines: [{ kind: 'labour', description: 'Check torque', quantity: 0.29, unitPriceCents: 50 }],
    });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body.lines[0].totalCents).toBe(15);
  });

  it('when the lines add up to more than one invoice can hold, then 400 at the lines and the saved ones stay; up to the limit they save', async () => {
    const { staff, workOrder } = await openVisit();
    const url = `/api/work-orders/${workOrder.id}/lines`;
    expect((await staff.c.put(url, LINES)).status).toBe(200);
    // Each line is within its own limits (99999 pieces, 1 000 000.00 each); together 9 999 900 000 000 cents.
    const errors = expectFieldErrors(
      await staff.c.put(url, { lines: [{ kind: 'part', description: 'Bulk order', quantity: 99999, unitPriceCents: 100_000_000 }] }),
      ['lines'],
    );
    expect(errors.lines).toEqual(['These lines add up to more than one invoice can hold; split the work into smaller orders']);
    const kept = (await staff.c.get(`/api/work-orders/${workOrder.id}`)).body.lines as { description: string }[];
    expect(kept.map((l) => l.description)).toEqual(['Adjustable front camber arm', 'Fit arms and four-wheel alignment']);

    // Exactly at the limit: 10 × 100 000 000 cents = 1 000 000 000; one cent more is refused.
    const atLimit = { kind: 'part', description: 'Ten of the dearest', quantity: 10, unitPriceCents: 100_000_000 };
    expect((await staff.c.put(url, { lines: [atLimit] })).body.totals.subtotalCents).toBe(LINES_TOTAL_MAX_CENTS);
    expectFieldErrors(await staff.c.put(url, { lines: [atLimit, { kind: 'part', description: 'Washer', quantity: 1, unitPriceCents: 1 }] }), ['lines']);
  });

  it('when measurements are out of range or the driver sat in without a weight, then 400 per field and nothing is written', async () => {
    const { staff, workOrder } = await openVisit();
    const url = `/api/work-orders/${workOrder.id}/measurements`;
    expectFieldErrors(
      await staff.c.put(`${url}/before`, { driverInCar: true, fuelLevelPct: 120, corners: { lf: { camberDeg: -25, cornerWeightKg: -3 } } }),
      ['driverWeightKg', 'fuelLevelPct', 'corners.lf.camberDeg', 'corners.lf.cornerWeightKg'],
    );
    expectError(await staff.c.put(`${url}/during`, BEFORE), 404, 'not_found');
    expect(await countOf(t, 'SELECT count(*) AS n FROM work_order_stages WHERE work_order_id = $1', [workOrder.id])).toBe(0);
    expect(await countOf(t, 'SELECT count(*) AS n FROM work_order_measurements WHERE work_order_id = $1', [workOrder.id])).toBe(0);
  });
});

describe('GET /api/work-orders/:workOrderId', () => {
  it('when both stages are measured, then each has cross, front and left % and the diff is after − before per corner', async () => {
    const { driver, staff, workOrder } = await openVisit();
    const url = `/api/work-orders/${workOrder.id}`;
    expect((await staff.c.put(`${url}/measurements/before`, BEFORE)).status).toBe(200);
    const partial = { ...AFTER, corners: { ...AFTER.corners, rr: corner(-1.5, null) } };
    const half = await staff.c.put(`${url}/measurements/after`, partial);
    expect(half.status, JSON.stringify(half.body)).toBe(200);
    expect(half.body.stages.after.balance).toBeNull();
    expect((await staff.c.put(`${url}/measurements/after`, AFTER)).status).toBe(200);
    const res = await driver.c.get(url);
    expect(res.status).toBe(200);
    const before = res.body.stages.before;
    // Hand-worked: total 300 + 280 + 260 + 290 = 1130 kg; front (300 + 280)/1130 = 51.33 %; left (300 + 260)/1130 = 49.56 %;
    // cross (LF + RR) (300 + 290)/1130 = 52.21 %.
    expect(before.balance.totalKg).toBe(1130);
    expect(before.balance.frontPct).toBeCloseTo(51.327, 3);
    expect(before.balance.leftPct).toBeCloseTo(49.558, 3);
    expect(before.balance.crossPct).toBeCloseTo(52.212, 3);
    expect(before).toMatchObject({ driverInCar: true, driverWeightKg: 82, fuelLevelPct: 50, measuredAt: '2026-06-12T09:00:00.000Z' });
    // After: 296 + 284 + 262 + 288 = 1130; cross (296 + 288)/1130 = 51.68 %.
    expect(res.body.stages.after.balance.crossPct).toBeCloseTo(51.681, 3);
    // −2.4 − (−1.1) = −1.3°; 296 − 300 = −4 kg; unchanged fields 0.
    expect(res.body.diff.lf).toEqual({ camberDeg: -1.3, toeMm: 0, casterDeg: 0, rideHeightMm: 0, cornerWeightKg: -4 });
    expect(res.body.diff.rr.cornerWeightKg).toBe(-2);
  });

  it('when a build sheet is saved, then each corner has its checks with the car\'s motion ratio and the shop\'s tolerance', async () => {
    const { staff, workOrder } = await openVisit();
    const url = `/api/work-orders/${workOrder.id}`;
    const res = await staff.c.put(`${url}/build-sheet`, SHEET);
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body.buildSheet.motionRatio).toEqual({ front: 0.7, rear: 0.75 });
    expect(res.body.buildSheet.corners.lf).toMatchObject(SHEET.corners.lf);
    expect(res.body.buildSheet.corners.rf).toBeNull();
    const lf = res.body.buildSheet.checks.lf;
    // 335 − 350 = −15 mm against the default 15 mm tolerance: within.
    expect(lf.compressedLength).toEqual({ differenceMm: -15, withinTolerance: true });
    // 300 kg × 9.80665 = 2942.0 N; / 0.7 = 4202.9 N at the spring; / 105 N/mm = 40.03 mm; droop 70 × 0.7 = 49 mm → 8.97 mm short.
    expect(lf.droop.staticCompressionMm).toBeCloseTo(40.027, 2);
    expect(lf.droop.seated).toBe(false);
    expect(lf.droop.shortfallMm).toBeCloseTo(8.973, 2);
    // (110 − 49 − 20)/0.7 = 58.57 mm at the wheel.
    expect(lf.bumpTravelAtWheelMm).toBeCloseTo(58.571, 2);
    await t.ds.query('UPDATE shops SET compressed_length_tolerance_mm = 13 WHERE id = $1', [res.body.shop.id]);
    expect((await staff.c.get(url)).body.buildSheet.checks.lf.compressedLength.withinTolerance).toBe(false);
  });
});

describe('POST /api/work-orders/:workOrderId/close', () => {
  async function readyVisit() {
    const v = await openVisit();
    const url = `/api/work-orders/${v.workOrder.id}`;
    for (const [path, body] of [['measurements/before', BEFORE], ['measurements/after', AFTER], ['lines', LINES], ['build-sheet', SHEET]] as const) {
      const res = await v.staff.c.put(`${url}/${path}`, body);
      expect(res.status, JSON.stringify(res.body)).toBe(200);
    }
    const run = await postRun(v.driver.c, v.driver.carId, v.driver.eventId);
    return { ...v, url, run };
  }

  const snapshotsOf = (carId: string) =>
    t.ds.query('SELECT s.*, (SELECT json_agg(c ORDER BY c.corner) FROM setup_corners c WHERE c.setup_id = s.id) AS corners FROM setup_snapshots s WHERE car_id = $1 ORDER BY s.id', [carId]);
  const runsOf = (carId: string) => t.ds.query('SELECT * FROM runs WHERE car_id = $1 ORDER BY id', [carId]);

  it('when staff close a visit whose requested work is long and give no label, then the setup\'s label is "<shop>: <work>" cut at a word\'s end, as the close form says beforehand', async () => {
    const { driver, staff, url } = await readyVisit();
    const work = 'Fit adjustable-body coilovers, set ride height and corner weights with the driver in, then align to the sheet';
    const { version } = (await staff.c.get(url)).body as { version: number };
    expect((await staff.c.patch(url, { requestedWork: work, version })).status).toBe(200);
    const res = await staff.c.post(`${url}/close`, { handoverAt: '2026-06-12T16:30:00Z' });
    expect(res.status, JSON.stringify(res.body)).toBe(200);

    const { label } = (await driver.c.get(`/api/setups/${res.body.setupId}`)).body as { label: string };
    expect(label).toBe(handoverLabel(SHOP_NAME, work));
    expect(label.length).toBeLessThanOrEqual(80);
    // Ends on a whole word of the text, then the ellipsis.
    expect(`${SHOP_NAME}: ${work} `.startsWith(`${label.slice(0, -1)} `)).toBe(true);
    expect(label.endsWith('…')).toBe(true);
  });

  it('when the build sheet has more clicks than the car\'s adjuster, then closing is refused with what to correct, the visit stays open and no snapshot is written; corrected, it closes', async () => {
    const { driver, staff, url } = await readyVisit();
    const sheet = { corners: { lf: { ...SHEET.corners.lf, bumpClicks: 20 } } };
    expect((await staff.c.put(`${url}/build-sheet`, sheet)).status).toBe(200);
    const snapshotsBefore = await snapshotsOf(driver.carId);

    const res = await staff.c.post(`${url}/close`, { handoverAt: '2026-06-12T16:30:00Z' });
    expect(res.status).toBe(400);
    // The car's front adjuster has 12 positions (the fixture's).
    expect(res.body.error.fieldErrors['corners.lf.damperClicks']).toEqual(['This adjuster has 12 clicks; use 0 to 12']);
    expect(res.body.error.message).toContain('LF clicks: This adjuster has 12 clicks');
    expect(res.body.error.message).toContain('Correct the build sheet or the after measurements');
    expect((await staff.c.get(url)).body.status).toBe('open');
    expect(await snapshotsOf(driver.carId)).toEqual(snapshotsBefore);

    // The quick change that a bad handover would have blocked still works on the setup in force.
    expect((await staff.c.put(`${url}/build-sheet`, SHEET)).status).toBe(200);
    expect((await staff.c.post(`${url}/close`, { handoverAt: '2026-06-12T16:30:00Z' })).status).toBe(200);
    const quick = await driver.c.post(`/api/cars/${driver.carId}/setups/quick-change`, {
      id: randomUUID(), label: 'Rear pressure down', changes: [{ field: 'coldPressureKpa', corners: ['rr'], delta: -7 }],
    });
    expect(quick.status, JSON.stringify(quick.body)).toBe(201);
  });

  it('when a main spring rate below what a setup takes is put on the build sheet, then 400 at that field', async () => {
    const { staff, url } = await readyVisit();
    const res = await staff.c.put(`${url}/build-sheet`, { corners: { lf: { mainSpringRateNPerMm: 0.5 } } });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fieldErrors)).toEqual(['corners.lf.mainSpringRateNPerMm']);
  });

  it('when staff close the visit, then one new snapshot (after-measurements and sheet over the setup in force), a change per part, the visit closed, the drivers notified; old snapshots and runs unchanged', async () => {
    const { driver, co, staff, setup, workOrder, url } = await readyVisit();
    const snapshotsBefore = await snapshotsOf(driver.carId);
    const runsBefore = await runsOf(driver.carId);
    const res = await staff.c.post(`${url}/close`, { handoverAt: '2026-06-12T16:30:00Z' });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body).toMatchObject({ status: 'closed', handoverAt: '2026-06-12T16:30:00.000Z', closedBy: { id: staff.user.id } });
    const setupId = res.body.setupId as string;

    const snapshot = (await driver.c.get(`/api/setups/${setupId}`)).body;
    expect(snapshot).toMatchObject({
      label: `${SHOP_NAME}: ${VISIT.requestedWork}`,
      effectiveFrom: '2026-06-12T16:30:00.000Z',
      createdBy: { id: staff.user.id },
      derivedFromId: setup.id,
      // The snapshot names the visit and the shop, so the driver's timeline can link back to it.
      workOrder: { id: workOrder.id, shopName: SHOP_NAME, visitDate: VISIT.visitDate },
      suggestion: null,
      axles: { front: { antiRollBar: 'hole 2' }, rear: { antiRollBar: 'disconnected' } },
    });
    // After-measurements laid over the baseline; the sheet's spring and clicks on LF; pressures kept from the baseline.
    expect(snapshot.corners.lf).toEqual({
      camberDeg: -2.4, toeMm: 0.5, casterDeg: 6.1, rideHeightMm: 125, cornerWeightKg: 296,
      springRateNPerMm: 105, damperClicks: 5, damperReboundClicks: 7, coldPressureKpa: 220,
    });
    expect(snapshot.corners.rf).toMatchObject({ camberDeg: -2.4, damperClicks: 4, springRateNPerMm: null });
    const [link] = await t.ds.query('SELECT work_order_id FROM setup_snapshots WHERE id = $1', [setupId]);
    expect(link.work_order_id).toBe(workOrder.id);

    const changes = await t.ds.query('SELECT changed_on::text, what, location, setup_id, work_order_id, created_by FROM change_log WHERE car_id = $1', [driver.carId]);
    expect(changes).toEqual([
      { changed_on: '2026-06-12', what: 'Fitted: Adjustable front camber arm ×2', location: 'car', setup_id: setupId, work_order_id: workOrder.id, created_by: staff.user.id },
    ]);

    const snapshotsAfter = await snapshotsOf(driver.carId);
    expect(snapshotsAfter).toHaveLength(snapshotsBefore.length + 1);
    expect(snapshotsAfter.filter((s: { id: string }) => s.id !== setupId)).toEqual(snapshotsBefore);
    expect(await runsOf(driver.carId)).toEqual(runsBefore);

    const notes = await t.ds.query('SELECT user_id, kind, link, work_order_id FROM notifications WHERE work_order_id = $1 ORDER BY user_id', [workOrder.id]);
    expect(notes).toEqual(
      [driver.user.id, co.user.id].sort().map((user_id) => ({ user_id, kind: 'work_order_closed', link: `/cars/${driver.carId}`, work_order_id: workOrder.id })),
    );
    const bell = await driver.c.get('/api/notifications');
    expect(bell.body.items[0]).toMatchObject({ kind: 'work_order_closed', link: `/cars/${driver.carId}` });
    await expect.poll(() => mail.sent.filter((m) => m.subject === 'The shop has finished work on Blue roadster' && m.text.includes(VISIT.requestedWork)).length).toBeGreaterThanOrEqual(2);
  });

  it('when a visit with parts used up in the work is closed, then only the parts that stay on the car become changes; the used-up ones are still on the visit and its invoice', async () => {
    const { driver, staff, url } = await readyVisit();
    const lines = {
      lines: [
        ...LINES.lines,
        { kind: 'part', description: 'Brake fluid, 1 l', quantity: 1, unitPriceCents: 1800, usedUp: true },
        { kind: 'part', description: 'Wheel balancing weights', quantity: 8, unitPriceCents: 50, usedUp: true },
        { kind: 'part', description: 'Rear toe arm', quantity: 2, unitPriceCents: 9900, usedUp: false },
      ],
    };
    expect((await staff.c.put(`${url}/lines`, lines)).status).toBe(200);
    const res = await staff.c.post(`${url}/close`, { handoverAt: '2026-06-12T16:30:00Z' });
    expect(res.status, JSON.stringify(res.body)).toBe(200);

    const changes = await t.ds.query('SELECT what FROM change_log WHERE car_id = $1 ORDER BY id', [driver.carId]);
    expect(changes.map((c: { what: string }) => c.what).sort()).toEqual(['Fitted: Adjustable front camber arm ×2', 'Fitted: Rear toe arm ×2']);
    // The driver's own read of the car's changes says the same.
    const read = await driver.c.get(`/api/cars/${driver.carId}/changes`);
    expect(read.status, JSON.stringify(read.body)).toBe(200);
    expect(JSON.stringify(read.body)).not.toMatch(/Brake fluid|balancing weights/);

    const visit = (await driver.c.get(url)).body as { lines: { description: string; usedUp: boolean }[] };
    expect(visit.lines.filter((l) => l.usedUp).map((l) => l.description)).toEqual(['Brake fluid, 1 l', 'Wheel balancing weights']);
    const invoice = await staff.c.post(`${url}/invoice`);
    expect(invoice.status, JSON.stringify(invoice.body)).toBe(201);
    expect(invoice.body.lines.map((l: { description: string }) => l.description)).toEqual(lines.lines.map((l) => l.description));
    // 379.00 + 237.50 + 18.00 + 8 × 0.50 + 2 × 99.00, no tax set.
    expect(invoice.body.subtotalCents).toBe(37900 + 23750 + 1800 + 400 + 19800);
  });

  it('when the visit is closed a second time, or edited after closing, then 409 and nothing more is written', async () => {
    const { driver, staff, url } = await readyVisit();
    expect((await staff.c.post(`${url}/close`, { handoverAt: '2026-06-12T16:30:00Z' })).status).toBe(200);
    const count = await countOf(t, 'SELECT count(*) AS n FROM setup_snapshots WHERE car_id = $1', [driver.carId]);
    expectError(await staff.c.post(`${url}/close`, { handoverAt: '2026-06-12T17:00:00Z' }), 409, 'conflict');
    expectError(await staff.c.put(`${url}/lines`, LINES), 409, 'conflict');
    expectError(await staff.c.patch(url, { notes: 'late', version: 2 }), 409, 'conflict');
    expect(await countOf(t, 'SELECT count(*) AS n FROM setup_snapshots WHERE car_id = $1', [driver.carId])).toBe(count);
    expect(await countOf(t, 'SELECT count(*) AS n FROM change_log WHERE car_id = $1', [driver.carId])).toBe(1);
  });

  it('when writing a change-log entry fails mid-way, then nothing is written: no snapshot, no change, the visit still open, no notification', async () => {
    const { driver, staff, workOrder, url } = await readyVisit();
    const snapshots = await countOf(t, 'SELECT count(*) AS n FROM setup_snapshots WHERE car_id = $1', [driver.carId]);
    const fn = `fail_change_${randomUUID().replace(/-/g, '')}`;
    await t.ds.query(`CREATE FUNCTION ${fn}() RETURNS trigger LANGUAGE plpgsql AS $$ BEGIN
      IF NEW.work_order_id = '${workOrder.id}' THEN RAISE EXCEPTION 'test failure'; END IF; RETURN NEW; END $$`);
    await t.ds.query(`CREATE TRIGGER ${fn} BEFORE INSERT ON change_log FOR EACH ROW EXECUTE FUNCTION ${fn}()`);
    try {
      const res = await staff.c.post(`${url}/close`, { handoverAt: '2026-06-12T16:30:00Z' });
      expectError(res, 500, 'internal');
    } finally {
      await t.ds.query(`DROP TRIGGER ${fn} ON change_log`);
      await t.ds.query(`DROP FUNCTION ${fn}()`);
    }
    expect(await countOf(t, 'SELECT count(*) AS n FROM setup_snapshots WHERE car_id = $1', [driver.carId])).toBe(snapshots);
    expect(await countOf(t, 'SELECT count(*) AS n FROM change_log WHERE car_id = $1', [driver.carId])).toBe(0);
    expect(await countOf(t, 'SELECT count(*) AS n FROM notifications WHERE work_order_id = $1', [workOrder.id])).toBe(0);
    const read = await staff.c.get(url);
    expect(read.body).toMatchObject({ status: 'open', setupId: null, handoverAt: null });
    // And it closes once the fault is gone.
    expect((await staff.c.post(`${url}/close`, { handoverAt: '2026-06-12T16:30:00Z' })).status).toBe(200);
  });

  it('when the handover time is missing or the label too long, then 400 per field', async () => {
    const { staff, url } = await readyVisit();
    expectFieldErrors(await staff.c.post(`${url}/close`, { label: 'x'.repeat(81) }), ['handoverAt', 'label']);
  });
});

describe('comments on a visit', () => {
  it('when the driver comments on the visit, then 201 and the thread lists it; shop staff reply signed with the shop; others get 404', async () => {
    const { driver, staff, shopId, workOrder } = await openVisit();
    const target = { type: 'work_order', id: workOrder.id };
    const res = await driver.c.post('/api/comments', { target, body: 'Can you check the rear toe too?' });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body).toMatchObject({ carId: driver.carId, target, shop: null });
    const reply = await staff.c.post('/api/comments', { target, body: 'Will do.' });
    expect(reply.status).toBe(201);
    expect(reply.body.shop).toEqual({ id: shopId, name: SHOP_NAME });
    const thread = await driver.c.get(`/api/comments?type=work_order&id=${workOrder.id}`);
    expect(thread.body.items.map((c: { body: string }) => c.body)).toEqual(['Can you check the rear toe too?', 'Will do.']);
    const stranger = await signedInClient(t);
    expectError(await stranger.c.post('/api/comments', { target, body: 'hi' }), 404, 'not_found');
    expectError(await stranger.c.get(`/api/comments?type=work_order&id=${workOrder.id}`), 404, 'not_found');
  });

  it('when the owner withdraws the shop\'s access, then its staff still edit and delete their own comments on the visit; a stranger still gets 404', async () => {
    const { driver, staff, shopId, workOrder } = await openVisit();
    const target = { type: 'work_order', id: workOrder.id };
    const mine = (await staff.c.post('/api/comments', { target, body: 'Rear toe checked: 1 mm in per side.' })).body as { id: string; version: number };
    const theirs = (await driver.c.post('/api/comments', { target, body: 'Thanks!' })).body as { id: string; version: number };
    expect((await driver.c.delete(`/api/cars/${driver.carId}/shop-grants/${shopId}`)).status).toBe(204);

    const edited = await staff.c.patch(`/api/comments/${mine.id}`, { body: 'Rear toe checked: 1.0 mm in per side.', version: mine.version });
    expect(edited.status, JSON.stringify(edited.body)).toBe(200);
    expect(edited.body.body).toBe('Rear toe checked: 1.0 mm in per side.');
    // Still only the author's own: the driver's comment is not theirs to change.
    expectError(await staff.c.patch(`/api/comments/${theirs.id}`, { body: 'x', version: theirs.version }), 403, 'forbidden');
    const stranger = await signedInClient(t);
    expectError(await stranger.c.delete(`/api/comments/${mine.id}`), 404, 'not_found');
    expect((await staff.c.delete(`/api/comments/${mine.id}`)).status).toBe(204);
    const thread = await driver.c.get(`/api/comments?type=work_order&id=${workOrder.id}`);
    expect(thread.body.items.map((c: { body: string }) => c.body)).toEqual(['Thanks!']);
  });
});

describe('who hears of a comment on a visit', () => {
  const notices = async (c: { get: (path: string) => Promise<{ body: { items: { summary: string; link: string }[] } }> }) =>
    (await c.get('/api/notifications')).body.items.filter((n) => n.summary.includes('commented on the'));

  it('when the car is also granted to another shop, then only the visit\'s shop hears, and the other shop\'s customer list does not quote it', async () => {
    const { driver, staff, shopId, workOrder } = await openVisit();
    const other = await shopWithAdmin(t, 'Upland Motorsport', 'Ola Brandt');
    expect((await driver.c.post(`/api/cars/${driver.carId}/shop-grants`, { shopId: other.shopId })).status).toBe(201);

    const res = await driver.c.post('/api/comments', { target: { type: 'work_order', id: workOrder.id }, body: 'Their quote was 900 for the arms.' });
    expect(res.status, JSON.stringify(res.body)).toBe(201);

    expect((await notices(staff.c)).map((n) => n.link)).toEqual([`/work-orders/${workOrder.id}`]);
    expect(await notices(other.admin.c)).toEqual([]);
    const theirs = (await other.admin.c.get(`/api/shops/${other.shopId}/customers`)).body.items as { latestActivity: { summary: string } | null }[];
    expect(theirs.map((c) => c.latestActivity?.summary ?? '').join(' ')).not.toContain('900');
    const ours = (await staff.c.get(`/api/shops/${shopId}/customers`)).body.items as { latestActivity: { summary: string } | null }[];
    expect(ours[0]!.latestActivity!.summary).toContain('Their quote was 900');

    // A thread on the car itself is every granted shop's to hear of.
    await driver.c.post('/api/comments', { target: { type: 'setup', id: (await postSetup(driver.c, driver.carId, { label: 'After the arms' })).id }, body: 'Feels sharper.' });
    expect(await notices(other.admin.c)).toHaveLength(1);
  });

  it('when the owner has withdrawn the visit\'s shop\'s access, then its staff still hear of comments on their visit', async () => {
    const { driver, staff, shopId, workOrder } = await openVisit();
    expect((await driver.c.delete(`/api/cars/${driver.carId}/shop-grants/${shopId}`)).status).toBe(204);

    await driver.c.post('/api/comments', { target: { type: 'work_order', id: workOrder.id }, body: 'Is the invoice final?' });
    expect((await notices(staff.c)).map((n) => n.link)).toEqual([`/work-orders/${workOrder.id}`]);
  });
});

describe('the demo visits', () => {
  it('when the demo is seeded, then Pebble has the closed camber-arm visit tied to its snapshot and changes, and an open coilover visit with a part-built sheet', async () => {
    const db = await seededDatabaseUrl();
    const ds = createDataSource(db.url, { poolSize: 1 });
    await ds.initialize();
    try {
      const visits: { id: string; status: string; setup_id: string | null }[] = await ds.query('SELECT id, status, setup_id FROM work_orders ORDER BY visit_date');
      expect(visits.map((v) => v.status)).toEqual(['closed', 'open']);
      const closed = await loadWorkOrder(ds, visits[0]!.id);
      expect(closed).toMatchObject({ visitDate: DEMO_CAMBER_ARMS_DATE, carName: 'Pebble', shop: { name: DEMO_SHOP } });
      const [snapshot] = await ds.query('SELECT work_order_id, effective_from FROM setup_snapshots WHERE id = $1', [closed.setupId]);
      expect(snapshot.work_order_id).toBe(closed.id);
      expect(new Date(snapshot.effective_from).toISOString()).toBe(closed.handoverAt);
      expect(await ds.query('SELECT 1 FROM change_log WHERE work_order_id = $1', [closed.id])).toHaveLength(3);
      expect(closed.stages.before?.corners.lf.camberDeg).toBe(-1.1);
      expect(closed.stages.after?.corners.lf.camberDeg).toBe(-2.4);
      expect(closed.stages.after).toMatchObject({ driverInCar: true, driverWeightKg: 74 });
      expect(closed.diff.lf.camberDeg).toBe(-1.3);
      // After: (256 + 269)/(256 + 251 + 268 + 269) = 525/1044 = 50.29 % cross.
      expect(closed.stages.after?.balance?.crossPct).toBeCloseTo(50.287, 2);
      expect(closed.lines.map((l) => [l.kind, l.quantity])).toEqual([['part', 2], ['labour', 2.5]]);

      const open = await loadWorkOrder(ds, visits[1]!.id);
      expect(open.buildSheet.corners.rr).toBeNull();
      expect(open.buildSheet.checks.lf?.droop?.seated).toBe(false);
      // 330 − 350 = −20 mm: beyond the shop's default 15 mm.
      expect(open.buildSheet.checks.lr?.compressedLength).toEqual({ differenceMm: -20, withinTolerance: false });
    } finally {
      await ds.destroy();
      await db.drop();
    }
  }, 60_000);

  it('when lines were written before a part could be marked used up, then they stay on the car: the demo\'s, and those already stored when the column is added', async () => {
    const db = await seededDatabaseUrl();
    const ds = createDataSource(db.url, { poolSize: 1 });
    await ds.initialize();
    try {
      const [closed, open] = (await ds.query('SELECT id FROM work_orders ORDER BY visit_date')) as { id: string }[];
      // The demo writes its lines without the flag.
      expect((await loadWorkOrder(ds, closed!.id)).lines.map((l) => [l.kind, l.usedUp])).toEqual([['part', false], ['labour', false]]);

      // Back to the table as it was before the flag, a line written as the app wrote it then, and the column added again.
      const migration = new UsedUpParts1765670400000();
      const runner = ds.createQueryRunner();
      try {
        await migration.down(runner);
        await runner.query(
          `INSERT INTO work_order_lines (work_order_id, kind, description, quantity, unit_price_cents, position) VALUES ($1, 'part', 'Bump stop, 25 mm', 4, 1200, 3)`,
          [open!.id],
        );
        await migration.up(runner);
      } finally {
        await runner.release();
      }
      expect((await loadWorkOrder(ds, open!.id)).lines.map((l) => [l.description, l.usedUp])).toEqual([
        ['Main spring 70 N/mm, 178 mm free', false],
        ['Helper spring 10 N/mm', false],
        ['Coilover fit and build', false],
        ['Bump stop, 25 mm', false],
      ]);
    } finally {
      await ds.destroy();
      await db.drop();
    }
  }, 60_000);
});
