import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { client, makeTestApp, signedInClient, type TestApp } from '../test-app';
import {
  addCoDriver, countOf, driverWithCarAndEvent, expectError, expectFieldErrors, postRun, postSetup, runBody, setupBody,
} from '../season/season-fixtures';
import { addStaff, grantedCar, postTreadReading, SHOP_NAME, shopWithAdmin } from './shop-fixtures';

let t: TestApp;
beforeAll(async () => {
  t = await makeTestApp();
});
afterAll(async () => {
  await t.close();
});

const grantsOf = (carId: string) => countOf(t, 'SELECT count(*) AS n FROM shop_grants WHERE car_id = $1', [carId]);

describe('POST /api/shops and GET /api/shops/mine', () => {
  it('when a signed-in user opens a shop, then 201 with them as its only staff and shop admin, and it is among their shops', async () => {
    const { c, user, email } = await signedInClient(t, { displayName: 'Dusty Okonjo' });
    const res = await c.post('/api/shops', { name: `  ${SHOP_NAME}  ` });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body).toEqual({
      id: expect.any(String),
      name: SHOP_NAME,
      staff: [{ id: user.id, displayName: 'Dusty Okonjo', email, isShopAdmin: true }],
      isShopAdmin: true,
      pendingInvitations: [],
      // The defaults from the migration: no tax, US dollars, 15 mm compressed-length tolerance.
      settings: { taxRatePct: 0, currency: 'usd', compressedLengthToleranceMm: 15, invoiceDetails: '' },
    });
    const mine = await c.get('/api/shops/mine');
    expect(mine.status).toBe(200);
    expect(mine.body).toEqual({ items: [{ id: res.body.id, name: SHOP_NAME, isShopAdmin: true, customerCount: 0 }], count: 1 });
  });

  it('when the name is empty or too long, then 400 at name and no shop is made', async () => {
    const { c } = await signedInClient(t);
    const before = await countOf(t, 'SELECT count(*) AS n FROM shops');
    expectFieldErrors(await c.post('/api/shops', { name: '   ' }), ['name']);
    expectFieldErrors(await c.post('/api/shops', { name: 'x'.repeat(81) }), ['name']);
    expectFieldErrors(await c.post('/api/shops', { name: 'Fine', owner: 'me' }), ['owner']);
    expect(await countOf(t, 'SELECT count(*) AS n FROM shops')).toBe(before);
  });

  it('when a user staffs no shop, then their list is empty; staff see each shop with how many cars it looks after', async () => {
    const nobody = await signedInClient(t);
    expect((await nobody.c.get('/api/shops/mine')).body).toEqual({ items: [], count: 0 });
    const { driver, staff, shopId } = await grantedCar(t);
    const second = await driverWithCarAndEvent(t);
    await second.c.post(`/api/cars/${second.carId}/shop-grants`, { shopId });
    const plain = await addStaff(t, shopId);
    expect((await staff.c.get('/api/shops/mine')).body.items).toEqual([{ id: shopId, name: SHOP_NAME, isShopAdmin: true, customerCount: 2 }]);
    expect((await plain.c.get('/api/shops/mine')).body.items).toEqual([{ id: shopId, name: SHOP_NAME, isShopAdmin: false, customerCount: 2 }]);
    expect((await driver.c.get('/api/shops/mine')).body.items).toEqual([]);
  });
});

describe('GET /api/shops', () => {
  it('when any signed-in driver asks, then shops come back as id and name only, filtered by ?q= without treating % or _ as wildcards', async () => {
    const tag = randomUUID().slice(0, 8);
    const a = await shopWithAdmin(t, `Harbour ${tag} Alignment`);
    const b = await shopWithAdmin(t, `Upland ${tag} Motorsport`);
    await shopWithAdmin(t, `Harbour ${tag}_x`);
    const driver = await signedInClient(t);
    const res = await driver.c.get(`/api/shops?q=${encodeURIComponent(`${tag} a`)}`);
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ items: [{ id: a.shopId, name: `Harbour ${tag} Alignment` }], count: 1 });
    const all = await driver.c.get(`/api/shops?q=${tag}`);
    expect(all.body.items.map((s: { id: string }) => s.id)).toEqual(expect.arrayContaining([a.shopId, b.shopId]));
    expect(all.body.count).toBe(3);
    // As wildcards, "%" would match "Harbour <tag>_x" and "_" would match "<tag> A…".
    expect((await driver.c.get(`/api/shops?q=${tag}%25x`)).body.count).toBe(0);
    expect((await driver.c.get(`/api/shops?q=${tag}_A`)).body.count).toBe(0);
  });

  it('when nobody is signed in, then 401', async () => {
    expectError(await client(t.app).get('/api/shops'), 401, 'unauthenticated');
  });
});

describe('GET /api/shops/:shopId', () => {
  it('when staff open their shop, then they see every member and the unused, unexpired invitations only; others get 404', async () => {
    const { shopId, admin } = await shopWithAdmin(t);
    const wren = await addStaff(t, shopId, 'Wren Iyer');
    const insert = (email: string, expires: string, used: boolean) =>
      t.ds.query(
        `INSERT INTO invitations (token_hash, shop_id, email, as_admin, invited_by, expires_at, used_at)
         VALUES ($1, $2, $3, $4, $5, now() + $6::interval, CASE WHEN $7 THEN now() END)`,
        [randomUUID(), shopId, email, email.startsWith('admin'), admin.user.id, expires, used],
      );
    await insert('admin-open@example.com', '3 days', false);
    await insert('expired@example.com', '-1 hour', false);
    await insert('used@example.com', '3 days', true);
    const res = await wren.c.get(`/api/shops/${shopId}`);
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body.isShopAdmin).toBe(false);
    expect(res.body.staff).toEqual([
      { id: admin.user.id, displayName: 'Dusty Okonjo', email: admin.email, isShopAdmin: true },
      { id: wren.user.id, displayName: 'Wren Iyer', email: wren.email, isShopAdmin: false },
    ]);
    expect(res.body.pendingInvitations).toEqual([{ email: 'admin-open@example.com', asAdmin: true, expiresAt: expect.any(String) }]);
    const outsider = await signedInClient(t);
    expectError(await outsider.c.get(`/api/shops/${shopId}`), 404, 'not_found');
    expectError(await outsider.c.get(`/api/shops/${randomUUID()}`), 404, 'not_found');
    expectError(await outsider.c.get('/api/shops/not-an-id'), 404, 'not_found');
  });
});

describe('GET /api/shops/:shopId/customers', () => {
  it('when a car is granted, then it is listed with its owner and grant time and no activity yet; the driver and other shops get 404', async () => {
    const { driver, staff, shopId } = await grantedCar(t);
    const res = await staff.c.get(`/api/shops/${shopId}/customers`);
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body).toEqual({
      items: [{
        car: { id: driver.carId, name: 'Blue roadster', classCode: 'SS', carNumber: '42' },
        owner: { id: driver.user.id, displayName: 'Nell Ashdown' },
        grantedAt: expect.any(String),
        latestActivity: null,
        openSuggestions: 0,
      }],
      count: 1,
    });
    expectError(await driver.c.get(`/api/shops/${shopId}/customers`), 404, 'not_found');
    const other = await shopWithAdmin(t, 'Upland Motorsport');
    expectError(await other.admin.c.get(`/api/shops/${shopId}/customers`), 404, 'not_found');
  });

  it('when runs, setups, tread readings and comments are added, then the latest by when it happened is shown, with open suggestions counted', async () => {
    const { driver, staff, shopId } = await grantedCar(t);
    const latest = async () => (await staff.c.get(`/api/shops/${shopId}/customers`)).body.items[0];

    const base = await postSetup(driver.c, driver.carId, { label: 'Spring baseline', effectiveFrom: '2026-04-01T00:00:00Z' });
    expect((await latest()).latestActivity).toEqual({ at: '2026-04-01T00:00:00.000Z', kind: 'setup', summary: 'New setup “Spring baseline”' });

    await postRun(driver.c, driver.carId, driver.eventId, { runNumber: 3, recordedAt: '2026-04-12T10:00:00Z' });
    expect((await latest()).latestActivity).toEqual({ at: '2026-04-12T10:00:00.000Z', kind: 'run', summary: 'Nell Ashdown’s run 3 at Spring points round 1' });

    // Entered later but in force earlier: the run is still the newest thing that happened.
    await postSetup(driver.c, driver.carId, { label: 'Winter storage', effectiveFrom: '2026-01-10T00:00:00Z' });
    expect((await latest()).latestActivity.kind).toBe('run');

    await postTreadReading(driver.c, driver.carId, '2026-04-12T16:00:00Z');
    expect((await latest()).latestActivity).toEqual({ at: '2026-04-12T16:00:00.000Z', kind: 'tread_reading', summary: 'Tread reading on Set A' });

    const comment = await driver.c.post('/api/comments', { target: { type: 'setup', id: base.id }, body: 'Front felt lazy on turn-in all morning.' });
    expect(comment.status, JSON.stringify(comment.body)).toBe(201);
    expect((await latest()).latestActivity).toEqual({
      at: comment.body.createdAt,
      kind: 'comment',
      summary: 'Nell Ashdown commented: “Front felt lazy on turn-in all morning.”',
    });

    const suggest = (title: string) =>
      staff.c.post(`/api/cars/${driver.carId}/suggestions`, {
        baseSetupId: base.id, title, rationale: 'More bite on entry', changes: [{ field: 'camberDeg', corners: ['lf', 'rf'], delta: -0.5 }],
      });
    expect((await suggest('More front camber')).status).toBe(201);
    const declined = await suggest('Even more');
    await driver.c.post(`/api/suggestions/${declined.body.id}/decline`, { note: 'Not this season' });
    expect((await latest()).openSuggestions).toBe(1);
    // Another shop's open suggestion on the same car is that shop's business, not counted here.
    const [other] = await t.ds.query(`INSERT INTO shops (name) VALUES ('Another bench') RETURNING id`);
    await t.ds.query(
      `INSERT INTO setup_suggestions (id, car_id, base_setup_id, shop_id, author_id, title, rationale, changes)
       VALUES (gen_random_uuid(), $1, $2, $3, $4, 'Stiffer rear', 'Why not', '[]')`,
      [driver.carId, base.id, other.id, driver.user.id],
    );
    expect((await latest()).openSuggestions).toBe(1);
  });

  it('when a shop has several customers, then the one with the newest activity comes first and cars without any come last', async () => {
    const { driver, staff, shopId } = await grantedCar(t);
    const quiet = await driverWithCarAndEvent(t);
    await quiet.c.post(`/api/cars/${quiet.carId}/shop-grants`, { shopId });
    const busy = await driverWithCarAndEvent(t);
    await busy.c.post(`/api/cars/${busy.carId}/shop-grants`, { shopId });
    await postSetup(driver.c, driver.carId, { effectiveFrom: '2026-04-01T00:00:00Z' });
    await postSetup(busy.c, busy.carId, { effectiveFrom: '2026-05-01T00:00:00Z' });
    const res = await staff.c.get(`/api/shops/${shopId}/customers`);
    expect(res.body.items.map((c: { car: { id: string } }) => c.car.id)).toEqual([busy.carId, driver.carId, quiet.carId]);
  });
});

describe('shop grants', () => {
  it('when the owner grants a shop twice, then 201 then 200 with the same grant and one row; drivers and staff can list it', async () => {
    const driver = await driverWithCarAndEvent(t);
    const { shopId, admin } = await shopWithAdmin(t);
    const url = `/api/cars/${driver.carId}/shop-grants`;
    const first = await driver.c.post(url, { shopId });
    expect(first.status, JSON.stringify(first.body)).toBe(201);
    expect(first.body).toEqual({
      shop: { id: shopId, name: SHOP_NAME },
      grantedBy: { id: driver.user.id, displayName: 'Nell Ashdown' },
      createdAt: expect.any(String),
    });
    const again = await driver.c.post(url, { shopId });
    expect(again.status).toBe(200);
    expect(again.body).toEqual(first.body);
    expect(await grantsOf(driver.carId)).toBe(1);
    expect((await driver.c.get(url)).body).toEqual({ items: [first.body], count: 1 });
    expect((await admin.c.get(url)).body).toEqual({ items: [first.body], count: 1 });
  });

  it('when the shop id names no shop or is not an id, then 400 at shopId and nothing is granted', async () => {
    const driver = await driverWithCarAndEvent(t);
    const url = `/api/cars/${driver.carId}/shop-grants`;
    expectFieldErrors(await driver.c.post(url, { shopId: randomUUID() }), ['shopId']);
    expectFieldErrors(await driver.c.post(url, { shopId: 'kettle-lane' }), ['shopId']);
    expectFieldErrors(await driver.c.post(url, {}), ['shopId']);
    expect(await grantsOf(driver.carId)).toBe(0);
  });

  it('when a co-driver grants or revokes, then 403; another driver gets 404; nothing changes', async () => {
    const { driver, shopId } = await grantedCar(t);
    const co = await addCoDriver(t, driver);
    const other = await signedInClient(t);
    const { shopId: second } = await shopWithAdmin(t, 'Upland Motorsport');
    const url = `/api/cars/${driver.carId}/shop-grants`;
    expectError(await co.c.post(url, { shopId: second }), 403, 'forbidden');
    expectError(await co.c.delete(`${url}/${shopId}`), 403, 'forbidden');
    expectError(await other.c.post(url, { shopId: second }), 404, 'not_found');
    expectError(await other.c.get(url), 404, 'not_found');
    expect(await grantsOf(driver.carId)).toBe(1);
  });

  it('when a shop is granted, then its staff read the car, its setups, the event summary and the season, and get 403 on every write', async () => {
    const { driver, staff } = await grantedCar(t);
    const setup = await postSetup(driver.c, driver.carId);
    const run = await postRun(driver.c, driver.carId, driver.eventId);

    const car = await staff.c.get(`/api/cars/${driver.carId}`);
    expect(car.status, JSON.stringify(car.body)).toBe(200);
    expect(car.body.name).toBe('Blue roadster');
    const setups = await staff.c.get(`/api/cars/${driver.carId}/setups`);
    expect(setups.body.items.map((s: { id: string }) => s.id)).toEqual([setup.id]);
    const summary = await staff.c.get(`/api/events/${driver.eventId}/summary?carId=${driver.carId}`);
    expect(summary.status, JSON.stringify(summary.body)).toBe(200);
    expect(summary.body.entries).toHaveLength(1);
    expect(summary.body.entries[0].runs.map((r: { id: string }) => r.id)).toEqual([run.id]);
    const runs = await staff.c.get(`/api/runs?carId=${driver.carId}`);
    expect(runs.body.items.map((r: { id: string }) => r.id)).toEqual([run.id]);
    const season = await staff.c.get(`/api/cars/${driver.carId}/season`);
    expect(season.status, JSON.stringify(season.body)).toBe(200);

    expectError(await staff.c.post('/api/runs', runBody(driver.carId, driver.eventId, { runNumber: 2 })), 403, 'forbidden');
    expectError(await staff.c.post(`/api/cars/${driver.carId}/setups`, setupBody({ label: 'Shop idea' })), 403, 'forbidden');
    expectError(await staff.c.patch(`/api/cars/${driver.carId}`, { name: 'Renamed', version: car.body.version }), 403, 'forbidden');
    expect(await countOf(t, 'SELECT count(*) AS n FROM runs WHERE car_id = $1', [driver.carId])).toBe(1);
    expect(await countOf(t, 'SELECT count(*) AS n FROM setup_snapshots WHERE car_id = $1', [driver.carId])).toBe(1);
    expect((await driver.c.get(`/api/cars/${driver.carId}`)).body.name).toBe('Blue roadster');
  });

  it('when the owner revokes, then 204 and the shop\'s staff get 404 at once; revoking again is 404', async () => {
    const { driver, staff, shopId } = await grantedCar(t);
    const setup = await postSetup(driver.c, driver.carId);
    expect((await staff.c.get(`/api/setups/${setup.id}`)).status).toBe(200);
    const res = await driver.c.delete(`/api/cars/${driver.carId}/shop-grants/${shopId}`);
    expect(res.status).toBe(204);
    expectError(await staff.c.get(`/api/cars/${driver.carId}`), 404, 'not_found');
    expectError(await staff.c.get(`/api/cars/${driver.carId}/setups`), 404, 'not_found');
    expectError(await staff.c.get(`/api/setups/${setup.id}`), 404, 'not_found');
    expect((await staff.c.get(`/api/shops/${shopId}/customers`)).body.count).toBe(0);
    expectError(await driver.c.delete(`/api/cars/${driver.carId}/shop-grants/${shopId}`), 404, 'not_found');
  });

  it('when a shop is not granted the car, then its staff get 404 on the car and its records', async () => {
    const { driver } = await grantedCar(t);
    const setup = await postSetup(driver.c, driver.carId);
    const other = await shopWithAdmin(t, 'Upland Motorsport');
    expectError(await other.admin.c.get(`/api/cars/${driver.carId}`), 404, 'not_found');
    expectError(await other.admin.c.get(`/api/setups/${setup.id}`), 404, 'not_found');
    expectError(await other.admin.c.get(`/api/events/${driver.eventId}/summary?carId=${driver.carId}`), 404, 'not_found');
  });
});

describe('POST /api/shops/:shopId/invitations', () => {
  it('when staff who are not admins invite, then 403; outsiders get 404; a bad e-mail is 400 at email; nothing is recorded', async () => {
    const { shopId, admin } = await shopWithAdmin(t);
    const plain = await addStaff(t, shopId);
    const outsider = await signedInClient(t);
    const url = `/api/shops/${shopId}/invitations`;
    expectError(await plain.c.post(url, { email: 'new-staff@example.com' }), 403, 'forbidden');
    expectError(await outsider.c.post(url, { email: 'new-staff@example.com' }), 404, 'not_found');
    expectFieldErrors(await admin.c.post(url, { email: 'not an address' }), ['email']);
    expect(await countOf(t, 'SELECT count(*) AS n FROM invitations WHERE shop_id = $1', [shopId])).toBe(0);
  });

  it('when the admin invites someone already on the staff, then 400 at email and no invitation is made', async () => {
    const { shopId, admin } = await shopWithAdmin(t);
    const plain = await addStaff(t, shopId);
    expectFieldErrors(await admin.c.post(`/api/shops/${shopId}/invitations`, { email: plain.email }), ['email']);
    expect(await countOf(t, 'SELECT count(*) AS n FROM invitations WHERE shop_id = $1', [shopId])).toBe(0);
  });
});

describe('DELETE /api/shops/:shopId/staff/:userId', () => {
  const staffOf = (shopId: string) => countOf(t, 'SELECT count(*) AS n FROM shop_members WHERE shop_id = $1', [shopId]);

  it('when a shop admin removes staff, then 204 and that person loses the shop and its customers at once', async () => {
    const { driver, staff: admin, shopId } = await grantedCar(t);
    const wren = await addStaff(t, shopId);
    expect((await wren.c.get(`/api/cars/${driver.carId}`)).status).toBe(200);
    expect((await admin.c.delete(`/api/shops/${shopId}/staff/${wren.user.id}`)).status).toBe(204);
    expectError(await wren.c.get(`/api/shops/${shopId}`), 404, 'not_found');
    expectError(await wren.c.get(`/api/cars/${driver.carId}`), 404, 'not_found');
    expectError(await admin.c.delete(`/api/shops/${shopId}/staff/${wren.user.id}`), 404, 'not_found');
  });

  it('when staff who are not admins remove someone else, then 403; they may remove themselves', async () => {
    const { shopId, admin } = await shopWithAdmin(t);
    const wren = await addStaff(t, shopId, 'Wren Iyer');
    const ola = await addStaff(t, shopId, 'Ola Brandt');
    expectError(await wren.c.delete(`/api/shops/${shopId}/staff/${ola.user.id}`), 403, 'forbidden');
    expectError(await wren.c.delete(`/api/shops/${shopId}/staff/${admin.user.id}`), 403, 'forbidden');
    expect(await staffOf(shopId)).toBe(3);
    expect((await wren.c.delete(`/api/shops/${shopId}/staff/${wren.user.id}`)).status).toBe(204);
    expect(await staffOf(shopId)).toBe(2);
  });

  it('when the last shop admin would go, then 409 with a clear message; with a second admin, an admin may leave', async () => {
    const { shopId, admin } = await shopWithAdmin(t);
    const wren = await addStaff(t, shopId, 'Wren Iyer');
    const res = await admin.c.delete(`/api/shops/${shopId}/staff/${admin.user.id}`);
    expectError(res, 409, 'conflict');
    expect(res.body.error.message).toMatch(/only admin/);
    expect(await staffOf(shopId)).toBe(2);
    const second = await addStaff(t, shopId, 'Ola Brandt', true);
    expect((await second.c.delete(`/api/shops/${shopId}/staff/${admin.user.id}`)).status).toBe(204);
    expectError(await second.c.delete(`/api/shops/${shopId}/staff/${second.user.id}`), 409, 'conflict');
    expect((await second.c.delete(`/api/shops/${shopId}/staff/${wren.user.id}`)).status).toBe(204);
    expect(await staffOf(shopId)).toBe(1);
  });

  it('when an outsider tries, then 404', async () => {
    const { shopId, admin } = await shopWithAdmin(t);
    const outsider = await signedInClient(t);
    expectError(await outsider.c.delete(`/api/shops/${shopId}/staff/${admin.user.id}`), 404, 'not_found');
    expect(await staffOf(shopId)).toBe(1);
  });
});
