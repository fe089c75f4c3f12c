import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { AccountExport } from '../../../shared/export/account-export';
import { seasonExportSchema } from '../../../shared/export/season-export.schema';
import { DEMO_ACCOUNTS, DEMO_PASSWORD, DEMO_SHOP, DEMO_TEAM } from '../../../server/db/demo-accounts';
import { seededDatabaseUrl } from '../support-seeded';
import { client, makeTestApp, type TestApp } from '../test-app';
import { countOf, expectError } from '../season/season-fixtures';

/**
 * The account's data in one file (OWASP ASVS 4.0.3 V8.3.2: "users have a method to … export their data on
 * demand"), on a database of its own holding the demo season.
 */
let t: TestApp;
let db: Awaited<ReturnType<typeof seededDatabaseUrl>>;
beforeAll(async () => {
  db = await seededDatabaseUrl();
  t = await makeTestApp({ databaseUrl: db.url });
});
afterAll(async () => {
  await t.close();
  await db.drop();
});

async function demo(key: keyof typeof DEMO_ACCOUNTS) {
  const c = client(t.app);
  const res = await c.post('/api/auth/login', { email: DEMO_ACCOUNTS[key].email, password: DEMO_PASSWORD });
  expect(res.status, JSON.stringify(res.body)).toBe(200);
  return { c, id: res.body.user.id as string };
}

/** The file as a browser saves it: a download, parsed from its text. */
async function download(c: ReturnType<typeof client>) {
  const res = await c.get('/api/auth/me/export.json');
  expect(res.status, res.text).toBe(200);
  expect(res.headers['content-type']).toMatch(/^application\/json/);
  expect(res.headers['content-disposition']).toMatch(/^attachment; filename="scrubline-account-\d{4}-\d{2}-\d{2}\.json"$/);
  expect(res.headers['cache-control']).toBe('no-store');
  return JSON.parse(res.text) as AccountExport;
}

describe('downloading one’s data', () => {
  it('when the demo driver downloads, then each of her cars is a season file the import accepts, and nobody else’s car is in it', async () => {
    const maren = await demo('driver');
    const file = await download(maren.c);
    expect(file).toMatchObject({ format: 'scrubline-account', version: 1, account: { email: DEMO_ACCOUNTS.driver.email, displayName: DEMO_ACCOUNTS.driver.displayName } });
    expect(file.account.roles).toContain('driver');
    expect(file.memberships.teams).toEqual([{ name: DEMO_TEAM, captain: false }]);

    const owned = await countOf(t, 'SELECT count(*) AS n FROM cars WHERE owner_id = $1', [maren.id]);
    expect(file.cars).toHaveLength(owned);
    for (const car of file.cars) {
      expect(seasonExportSchema.safeParse(car).success, car.car.name).toBe(true);
      expect(car.runs.length).toBe(await countOf(t, 'SELECT count(*) AS n FROM runs WHERE car_id = $1', [car.car.id]));
    }
    const others: { name: string }[] = await t.ds.query('SELECT name FROM cars WHERE owner_id <> $1', [maren.id]);
    for (const { name } of others) expect(file.cars.map((c) => c.car.name)).not.toContain(name);

    // One of them, cut out of the file, imports again as a car of her own.
    const imported = await maren.c.post('/api/cars/import', file.cars[0]!);
    expect(imported.status, JSON.stringify(imported.body)).toBe(201);
    expect(await countOf(t, 'SELECT count(*) AS n FROM runs WHERE car_id = $1', [imported.body.carId])).toBe(file.cars[0]!.runs.length);
  });

  it('when the co-driver downloads, then the runs he drove on her car are listed with the car and its owner, and no car of his own', async () => {
    const teo = await demo('coDriver');
    const file = await download(teo.c);
    expect(file.cars).toEqual([]);
    expect(file.memberships.coDriverOf).toHaveLength(1);
    expect(file.memberships.coDriverOf[0]!.owner).toBe(DEMO_ACCOUNTS.driver.displayName);
    const driven = await countOf(t, 'SELECT count(*) AS n FROM runs WHERE driver_id = $1', [teo.id]);
    expect(driven).toBeGreaterThan(0);
    expect(file.runsOnOtherCars).toHaveLength(driven);
    for (const run of file.runsOnOtherCars) {
      expect(run.owner).toBe(DEMO_ACCOUNTS.driver.displayName);
      expect(run.event.date).toMatch(/^\d{4}-\d{2}-\d{2}$/);
    }
  });

  it('when shop staff download, then their shop and what they wrote in comment threads are in it', async () => {
    const dusty = await demo('shopStaff');
    await t.ds.query(
      `INSERT INTO comments (id, car_id, run_id, author_id, body)
       SELECT gen_random_uuid(), r.car_id, r.id, $1, 'Try two clicks softer on the rear' FROM runs r LIMIT 1`,
      [dusty.id],
    );
    const file = await download(dusty.c);
    expect(file.comments).toContainEqual(expect.objectContaining({ on: 'run', body: 'Try two clicks softer on the rear' }));
    expect(file.memberships.shops).toEqual([{ name: DEMO_SHOP, admin: true }]);
    const written = await countOf(t, 'SELECT count(*) AS n FROM comments WHERE author_id = $1', [dusty.id]);
    expect(file.comments).toHaveLength(written);
    for (const comment of file.comments) expect(['run', 'event', 'setup', 'tread reading', 'car']).toContain(comment.on);
  });

  it('when nobody is signed in, then 401 and no file', async () => {
    expectError(await client(t.app).get('/api/auth/me/export.json'), 401, 'unauthenticated');
  });
});
