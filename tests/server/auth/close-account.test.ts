import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { CLOSED_ACCOUNT_NAME } from '../../../shared/auth/account.schema';
import { closedAddress, NOT_THAT_ADDRESS, SUSPEND_FIRST, WRONG_PASSWORD } from '../../../server/auth/close-account';
import { DEMO_ACCOUNTS, DEMO_PASSWORD, DEMO_SHOP, DEMO_TEAM } from '../../../server/db/demo-accounts';
import { seededDatabaseUrl } from '../support-seeded';
import { captureMail, client, makeTestApp, signedInClient, TEST_PASSWORD, type TestApp } from '../test-app';
import { countOf, expectError, expectFieldErrors } from '../season/season-fixtures';

/**
 * Closing one's own account (OWASP ASVS 4.0.3 V8.3.2: "users have a method to remove … their data on
 * demand"; V3.7.1: the password is asked again first). Run on a database of its own holding the demo season,
 * so that who is the only admin, shop admin or captain is known.
 */
let t: TestApp;
let db: Awaited<ReturnType<typeof seededDatabaseUrl>>;
const mail = captureMail();
beforeAll(async () => {
  db = await seededDatabaseUrl();
  t = await makeTestApp({ databaseUrl: db.url, mail: mail.settings, authLimits: { loginPerAccount: 5 } });
});
afterAll(async () => {
  await t.close();
  await db.drop();
});

const login = (email: string, password: string) => client(t.app).post('/api/auth/login', { email, password });

async function demo(key: keyof typeof DEMO_ACCOUNTS) {
  const c = client(t.app);
  const res = await c.post('/api/auth/login', { email: DEMO_ACCOUNTS[key].email, password: DEMO_PASSWORD });
  expect(res.status, JSON.stringify(res.body)).toBe(200);
  return { c, id: res.body.user.id as string, email: DEMO_ACCOUNTS[key].email };
}

const userRow = async (id: string) =>
  (await t.ds.query('SELECT email, display_name, password_hash, is_admin, closed_at FROM users WHERE id = $1', [id]))[0] as {
    email: string; display_name: string; password_hash: string; is_admin: boolean; closed_at: Date | null;
  };

describe('closing one’s own account', () => {
  it('when the password is wrong or missing, then a field error, nothing changes, and five wrong tries lock it like sign-in', async () => {
    const { c, email, user } = await signedInClient(t);
    const wrong = expectFieldErrors(await c.post('/api/auth/me/close', { password: 'not my password at all' }), ['password']);
    expect(wrong.password).toEqual([WRONG_PASSWORD]);
    expectFieldErrors(await c.post('/api/auth/me/close', {}), ['password']);
    expectFieldErrors(await c.post('/api/auth/me/close', { password: TEST_PASSWORD, alsoDelete: 'everything' }), ['alsoDelete']);
    expect((await userRow(user.id)).closed_at).toBeNull();
    expect((await c.get('/api/auth/me')).status).toBe(200);

    for (let i = 0; i < 4; i++) await c.post('/api/auth/me/close', { password: `wrong guess ${i}` });
    expect((await c.post('/api/auth/me/close', { password: TEST_PASSWORD })).status).toBe(429);
    expect((await login(email, TEST_PASSWORD)).status).toBe(429);
    expect((await userRow(user.id)).closed_at).toBeNull();
  });

  it('when signed out, or without the CSRF token, then 401 or 403 and the account stays', async () => {
    expectError(await client(t.app).post('/api/auth/me/close', { password: TEST_PASSWORD }), 401, 'unauthenticated');
    const { c, user } = await signedInClient(t);
    const raw = await c.agent.post('/api/auth/me/close').send({ password: TEST_PASSWORD });
    expect(raw.status).toBe(403);
    expect((await userRow(user.id)).closed_at).toBeNull();
  });

  it('when a driver with a car closes, then the car and its season go, every device is signed out, the address is free again and a farewell goes to it', async () => {
    const { c, email, user } = await signedInClient(t, { displayName: 'Oskar Penhale' });
    const car = await c.post('/api/cars', { name: 'Green hatch', classCode: 'SS' });
    expect(car.status).toBe(201);
    const event = await c.post('/api/events', { name: 'Quarry test day', date: '2026-05-03', venue: 'Old quarry lot', conePenaltySec: 2 });
    expect(event.status).toBe(201);
    const team = await c.post('/api/teams', { name: 'Solo Sundays' });
    expect(team.status).toBe(201);
    const phone = client(t.app);
    expect((await phone.post('/api/auth/login', { email, password: TEST_PASSWORD })).status).toBe(200);

    const res = await c.post('/api/auth/me/close', { password: TEST_PASSWORD });
    expect(res.status, JSON.stringify(res.body)).toBe(204);

    expect(await countOf(t, 'SELECT count(*) AS n FROM cars WHERE id = $1', [car.body.id])).toBe(0);
    expect(await countOf(t, 'SELECT count(*) AS n FROM events WHERE id = $1', [event.body.id])).toBe(0);
    // A team with nobody left in it goes too.
    expect(await countOf(t, 'SELECT count(*) AS n FROM teams WHERE id = $1', [team.body.id])).toBe(0);
    expect(await countOf(t, `SELECT count(*) AS n FROM session WHERE sess #>> '{passport,user}' = $1`, [user.id])).toBe(0);
    expectError(await c.get('/api/auth/me'), 401, 'unauthenticated');
    expectError(await phone.get('/api/auth/me'), 401, 'unauthenticated');

    const row = await userRow(user.id);
    expect(row).toMatchObject({ email: closedAddress(user.id), display_name: CLOSED_ACCOUNT_NAME, is_admin: false });
    expect(row.closed_at).not.toBeNull();
    // No password signs in to it, under either address.
    expect((await login(email, TEST_PASSWORD)).status).toBe(401);
    expect((await login(closedAddress(user.id), TEST_PASSWORD)).status).toBe(401);
    expect((await login(closedAddress(user.id), row.password_hash)).status).toBe(401);

    const farewell = mail.sent.filter((m) => m.to === email).at(-1);
    expect(farewell?.subject).toBe('Your Scrubline account is closed');
    expect(farewell?.text).toContain('Its car was deleted with its season.');

    // Its stand-in address reaches nobody: no reset link is made for it, and no car can take it as a co-driver.
    const reset = await client(t.app).post('/api/auth/password-reset', { email: closedAddress(user.id) });
    expect(reset.status).toBe(202);
    expect(await countOf(t, 'SELECT count(*) AS n FROM password_resets WHERE user_id = $1', [user.id])).toBe(0);
    const owner = await signedInClient(t);
    const ownCar = await owner.c.post('/api/cars', { name: 'Borrowed coupe', classCode: 'SS' });
    expectFieldErrors(await owner.c.post(`/api/cars/${ownCar.body.id}/co-drivers`, { email: closedAddress(user.id) }), ['email']);

    // The address may be used for a new, empty account.
    const again = await client(t.app).post('/api/auth/register', { email, password: TEST_PASSWORD, displayName: 'Oskar Penhale' });
    expect(again.status, JSON.stringify(again.body)).toBe(201);
    expect(again.body.user.id).not.toBe(user.id);
  });

  it('when the demo co-driver closes, then the runs he drove on the owner’s car stay under “Closed account”, and his place on the car goes', async () => {
    const teo = await demo('coDriver');
    const runsBefore = await countOf(t, 'SELECT count(*) AS n FROM runs WHERE driver_id = $1', [teo.id]);
    expect(runsBefore).toBeGreaterThan(0);

    expect((await teo.c.post('/api/auth/me/close', { password: DEMO_PASSWORD })).status).toBe(204);

    expect(await countOf(t, 'SELECT count(*) AS n FROM runs WHERE driver_id = $1', [teo.id])).toBe(runsBefore);
    expect(await countOf(t, 'SELECT count(*) AS n FROM car_co_drivers WHERE user_id = $1', [teo.id])).toBe(0);
    const maren = await demo('driver');
    const cars = await maren.c.get('/api/cars');
    const roadster = (cars.body.items as { id: string; owner: { id: string }; coDrivers: unknown[] }[]).find((x) => x.owner.id === maren.id)!;
    expect(roadster.coDrivers).toEqual([]);
    const season = await maren.c.get(`/api/runs?carId=${roadster.id}`);
    expect(season.status, JSON.stringify(season.body)).toBe(200);
    const drivers = new Set((season.body.items as { driver: { displayName: string } }[]).map((r) => r.driver.displayName));
    expect(drivers).toContain(CLOSED_ACCOUNT_NAME);
    expect(drivers).not.toContain(DEMO_ACCOUNTS.coDriver.displayName);
  });

  it('when the only admin, the shop’s only admin with staff, or the team’s only captain with members would close, then 409 saying what to hand over, and nothing changes', async () => {
    const admin = await demo('admin');
    const refused = await admin.c.post('/api/auth/me/close', { password: DEMO_PASSWORD });
    expectError(refused, 409, 'conflict');
    expect(refused.body.error.message).toContain('only admin');
    expect((await userRow(admin.id)).closed_at).toBeNull();
    expect((await admin.c.get('/api/auth/me')).status).toBe(200);

    // With a second admin, the first may go.
    const other = await signedInClient(t, { isAdmin: true });
    expect((await admin.c.post('/api/auth/me/close', { password: DEMO_PASSWORD })).status).toBe(204);
    expect((await userRow(admin.id)).is_admin).toBe(false);
    // …and the last one left may not.
    expectError(await other.c.post('/api/auth/me/close', { password: TEST_PASSWORD }), 409, 'conflict');

    const captain = await demo('captain');
    const team = await captain.c.post('/api/auth/me/close', { password: DEMO_PASSWORD });
    expectError(team, 409, 'conflict');
    expect(team.body.error.message).toContain(`only captain of the team “${DEMO_TEAM}”`);
    expect(await countOf(t, 'SELECT count(*) AS n FROM team_members WHERE user_id = $1', [captain.id])).toBe(1);

    // The demo shop has one member of staff: alone, its admin may close, and the shop keeps its records.
    const dusty = await demo('shopStaff');
    const shopId = ((await t.ds.query('SELECT id FROM shops WHERE name = $1', [DEMO_SHOP])) as { id: string }[])[0]!.id;
    const staff = await signedInClient(t, { displayName: 'Wren Iyer' });
    await t.ds.query('INSERT INTO shop_members (shop_id, user_id, is_shop_admin) VALUES ($1, $2, false)', [shopId, staff.user.id]);
    const shop = await dusty.c.post('/api/auth/me/close', { password: DEMO_PASSWORD });
    expectError(shop, 409, 'conflict');
    expect(shop.body.error.message).toContain(`only admin of the shop “${DEMO_SHOP}”`);
    await t.ds.query('DELETE FROM shop_members WHERE user_id = $1', [staff.user.id]);
    const workOrders = await countOf(t, 'SELECT count(*) AS n FROM work_orders WHERE shop_id = $1', [shopId]);
    expect((await dusty.c.post('/api/auth/me/close', { password: DEMO_PASSWORD })).status).toBe(204);
    expect(await countOf(t, 'SELECT count(*) AS n FROM work_orders WHERE shop_id = $1', [shopId])).toBe(workOrders);
    expect(await countOf(t, 'SELECT count(*) AS n FROM shop_members WHERE user_id = $1', [dusty.id])).toBe(0);
  });

  it('when the demo driver closes, then her cars, their runs (her co-driver’s too), files, comments and work orders go; events others still use and the shop\'s invoice stay; the admin no longer finds her', async () => {
    const maren = await demo('driver');
    const priya = await demo('secondDriver');
    const carIds = ((await t.ds.query('SELECT id FROM cars WHERE owner_id = $1', [maren.id])) as { id: string }[]).map((r) => r.id);
    expect(carIds.length).toBeGreaterThan(0);
    // A photo on one of her runs, as an upload stores it.
    const storageKey = `${randomUUID()}/original`;
    await t.ds.query(
      `INSERT INTO attachments (id, car_id, run_id, storage_key, file_name, content_type, size_bytes, uploaded_by)
       SELECT gen_random_uuid(), r.car_id, r.id, $2, 'tyre-chalk.jpg', 'image/jpeg', 1234, $1 FROM runs r WHERE r.car_id = ANY($3) LIMIT 1`,
      [maren.id, storageKey, carIds],
    );
    expect(await countOf(t, 'SELECT count(*) AS n FROM attachments WHERE storage_key = $1', [storageKey])).toBe(1);
    const shared: { id: string }[] = await t.ds.query(
      'SELECT DISTINCT e.id FROM events e JOIN runs r ON r.event_id = e.id WHERE e.created_by = $1 AND r.car_id <> ALL($2)',
      [maren.id, carIds],
    );
    const priyaRuns = await countOf(t, 'SELECT count(*) AS n FROM runs WHERE driver_id = $1', [priya.id]);
    // A comment of hers on a run of the other driver's car.
    const [note]: { id: string }[] = await t.ds.query(
      `INSERT INTO comments (id, car_id, run_id, author_id, body)
       SELECT gen_random_uuid(), r.car_id, r.id, $1, 'Fronts looked cold on run 3' FROM runs r JOIN cars c ON c.id = r.car_id
        WHERE c.owner_id = $2 LIMIT 1 RETURNING id`,
      [maren.id, priya.id],
    );
    expect(note).toBeDefined();
    const invoices: { id: string }[] = await t.ds.query('SELECT id FROM invoices WHERE car_id = ANY($1)', [carIds]);
    expect(invoices).toHaveLength(1);

    expect((await maren.c.post('/api/auth/me/close', { password: DEMO_PASSWORD })).status).toBe(204);

    for (const [sql, params] of [
      ['SELECT count(*) AS n FROM cars WHERE owner_id = $1', [maren.id]],
      ['SELECT count(*) AS n FROM runs WHERE car_id = ANY($1)', [carIds]],
      ['SELECT count(*) AS n FROM setup_snapshots WHERE car_id = ANY($1)', [carIds]],
      ['SELECT count(*) AS n FROM comments WHERE author_id = $1', [maren.id]],
      ['SELECT count(*) AS n FROM team_members WHERE user_id = $1', [maren.id]],
      ['SELECT count(*) AS n FROM notifications WHERE user_id = $1', [maren.id]],
    ] as const) {
      expect(await countOf(t, sql, [...params]), sql).toBe(0);
    }
    expect(await countOf(t, 'SELECT count(*) AS n FROM work_orders WHERE car_id = ANY($1)', [carIds])).toBe(0);
    // The shop's invoice stays its record, made out to the name it was issued to, with its lines.
    const kept: { bill_to: string; work_order_id: string | null; car_id: string | null; lines: number }[] = await t.ds.query(
      'SELECT bill_to, work_order_id, car_id, (SELECT count(*)::int FROM invoice_lines WHERE invoice_id = i.id) AS lines FROM invoices i WHERE id = $1',
      [invoices[0]!.id],
    );
    expect(kept).toEqual([{ bill_to: DEMO_ACCOUNTS.driver.displayName, work_order_id: null, car_id: null, lines: 2 }]);
    // The stored file goes with its record: queued for removal from storage in the same transaction.
    expect(await countOf(t, 'SELECT count(*) AS n FROM attachments WHERE storage_key = $1', [storageKey])).toBe(0);
    expect(await countOf(t, 'SELECT count(*) AS n FROM stored_file_removals WHERE storage_key = $1', [storageKey])).toBe(1);
    // The other driver's season and the events it uses are untouched.
    expect(await countOf(t, 'SELECT count(*) AS n FROM runs WHERE driver_id = $1', [priya.id])).toBe(priyaRuns);
    expect(await countOf(t, 'SELECT count(*) AS n FROM events WHERE id = ANY($1)', [shared.map((e) => e.id)])).toBe(shared.length);

    const admin = await signedInClient(t, { isAdmin: true });
    const list = await admin.c.get(`/api/admin/users?q=${encodeURIComponent('Maren')}`);
    expect(list.body.items).toEqual([]);
    expect(list.body.total).toBe(0);
    expectError(await admin.c.post(`/api/admin/users/${maren.id}/suspend`, { note: 'Too late' }), 404, 'not_found');
    expectError(await admin.c.put(`/api/admin/users/${maren.id}/admin`, { isAdmin: true }), 404, 'not_found');
  });
});

describe('an admin closing someone else’s account', () => {
  it('when the account is not suspended, the address is mistyped, or it is the admin’s own, then refused and nothing changes', async () => {
    const admin = await signedInClient(t, { isAdmin: true });
    const driver = await signedInClient(t, { displayName: 'Pim Achterberg' });
    const url = `/api/admin/users/${driver.user.id}/close`;

    const active = await admin.c.post(url, { email: driver.email });
    expectError(active, 409, 'conflict');
    expect(active.body.error.message).toBe(SUSPEND_FIRST);

    expect((await admin.c.post(`/api/admin/users/${driver.user.id}/suspend`, { note: 'Asked by e-mail to be removed' })).status).toBe(200);
    const wrong = expectFieldErrors(await admin.c.post(url, { email: 'someone-else@example.com' }), ['email']);
    expect(wrong.email).toEqual([NOT_THAT_ADDRESS]);
    expectFieldErrors(await admin.c.post(url, {}), ['email']);
    expectError(await admin.c.post(`/api/admin/users/${admin.user.id}/close`, { email: admin.email }), 409, 'conflict');
    expectError(await driver.c.post(url, { email: driver.email }), 401, 'unauthenticated');
    expect((await userRow(driver.user.id)).closed_at).toBeNull();
  });

  it('when a suspended account is closed with its address typed again, then its car goes, a farewell says an admin closed it, and it leaves the list', async () => {
    const admin = await signedInClient(t, { isAdmin: true });
    const driver = await signedInClient(t, { displayName: 'Pim Achterberg' });
    const car = await driver.c.post('/api/cars', { name: 'Spare hatch', classCode: 'SS' });
    expect(car.status).toBe(201);
    expect((await admin.c.post(`/api/admin/users/${driver.user.id}/suspend`, { note: 'Asked by e-mail to be removed' })).status).toBe(200);

    const res = await admin.c.post(`/api/admin/users/${driver.user.id}/close`, { email: `  ${driver.email.toUpperCase()} ` });
    expect(res.status, JSON.stringify(res.body)).toBe(204);

    expect(await countOf(t, 'SELECT count(*) AS n FROM cars WHERE id = $1', [car.body.id])).toBe(0);
    expect(await userRow(driver.user.id)).toMatchObject({ email: closedAddress(driver.user.id), display_name: CLOSED_ACCOUNT_NAME });
    const row = (await t.ds.query('SELECT suspended_at, suspension_note FROM users WHERE id = $1', [driver.user.id]))[0];
    expect(row).toEqual({ suspended_at: null, suspension_note: null });
    const farewell = mail.sent.filter((m) => m.to === driver.email).at(-1);
    expect(farewell?.text).toContain('was closed by an administrator');
    expect((await admin.c.get(`/api/admin/users?q=${encodeURIComponent(driver.email)}`)).body.total).toBe(0);
    expectError(await admin.c.post(`/api/admin/users/${driver.user.id}/close`, { email: driver.email }), 404, 'not_found');
  });
});
