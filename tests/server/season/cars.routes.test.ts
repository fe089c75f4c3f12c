import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DoubleAdjustableDampers1766016000000 } from '../../../server/db/migrations/1766016000000-double-adjustable-dampers';
import { makeTestApp, signedInClient, type TestApp } from '../test-app';
import { migratedDatabaseUrl } from '../support-seeded';
import {
  addCoDriver, anonymous, countOf, driverWithCarAndEvent, expectError, expectFieldErrors, postRun, postSetup,
} from './season-fixtures';

let t: TestApp;
beforeAll(async () => {
  t = await makeTestApp();
});
afterAll(async () => {
  await t.close();
});

const carsOf = (ownerId: string) => countOf(t, 'SELECT count(*) AS n FROM cars WHERE owner_id = $1', [ownerId]);
const coDriversOf = (carId: string) => countOf(t, 'SELECT count(*) AS n FROM car_co_drivers WHERE car_id = $1', [carId]);

describe('POST /api/cars', () => {
  it('when the input is valid, then it answers 201 with the car, its owner, no co-drivers and version 1', async () => {
    const { c, user } = await signedInClient(t, { displayName: 'Maren Holt' });
    const res = await c.post('/api/cars', {
      name: '  Green hatch ',
      classCode: 'STS',
      carNumber: '7',
      damperAdjusters: { front: { positions: 16, countFrom: 'full_stiff' } },
      motionRatios: { rear: 0.8 },
    });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body).toEqual({
      id: expect.any(String),
      owner: { id: user.id, displayName: 'Maren Holt' },
      coDrivers: [],
      name: 'Green hatch',
      classCode: 'STS',
      carNumber: '7',
      tyreSize: null,
      damperAdjusters: { front: { positions: 16, countFrom: 'full_stiff', rebound: null }, rear: null },
      motionRatios: { front: null, rear: 0.8 },
      notes: null,
      version: 1,
      createdAt: expect.any(String),
      updatedAt: expect.any(String),
    });
    expect(await carsOf(user.id)).toBe(1);
  });

  it('when the name and class are missing, then 400 names both and no car is written', async () => {
    const { c, user } = await signedInClient(t);
    expectFieldErrors(await c.post('/api/cars', { carNumber: '9' }), ['name', 'classCode']);
    expect(await carsOf(user.id)).toBe(0);
  });

  it('when a field is unknown, at the top or inside the adjusters, then 400 "Unknown field" at its path', async () => {
    const { c, user } = await signedInClient(t);
    const top = expectFieldErrors(await c.post('/api/cars', { name: 'A', classCode: 'SS', colour: 'red' }), ['colour']);
    expect(top.colour).toEqual(['Unknown field']);
    const nested = expectFieldErrors(
      await c.post('/api/cars', { name: 'A', classCode: 'SS', damperAdjusters: { front: { positions: 10, countFrom: 'full_soft', turns: 3 } } }),
      ['damperAdjusters.front.turns'],
    );
    expect(nested['damperAdjusters.front.turns']).toEqual(['Unknown field']);
    expect(await carsOf(user.id)).toBe(0);
  });

  it('when an adjuster has 0 or 101 positions or the motion ratio is 0, then 400 at each path', async () => {
    const { c, user } = await signedInClient(t);
    expectFieldErrors(
      await c.post('/api/cars', {
        name: 'A',
        classCode: 'SS',
        damperAdjusters: { front: { positions: 0, countFrom: 'full_soft' }, rear: { positions: 101, countFrom: 'full_soft' } },
        motionRatios: { front: 0 },
      }),
      ['damperAdjusters.front.positions', 'damperAdjusters.rear.positions', 'motionRatios.front'],
    );
    expect(await carsOf(user.id)).toBe(0);
  });
});

/** Double-adjustable front dampers: 16 clicks counted from full stiff, and a rebound adjuster of 24 counted from full soft. */
const FRONT_DOUBLE = { positions: 16, countFrom: 'full_stiff', rebound: { positions: 24, countFrom: 'full_soft' } };

describe('double-adjustable dampers', () => {
  it('when a car is made with a rebound adjuster, then it reads back; an edit of the clicks alone keeps it, null clears it, and no adjuster takes it along', async () => {
    const { c } = await signedInClient(t);
    const made = await c.post('/api/cars', { name: 'Coupe', classCode: 'SS', damperAdjusters: { front: FRONT_DOUBLE, rear: { positions: 12, countFrom: 'full_soft' } } });
    expect(made.status, JSON.stringify(made.body)).toBe(201);
    expect(made.body.damperAdjusters).toEqual({ front: FRONT_DOUBLE, rear: { positions: 12, countFrom: 'full_soft', rebound: null } });
    expect((await c.get(`/api/cars/${made.body.id}`)).body.damperAdjusters).toEqual(made.body.damperAdjusters);

    // The front's clicks change; its rebound adjuster, not named, stays. The rear gains one.
    const edited = await c.patch(`/api/cars/${made.body.id}`, {
      version: 1,
      damperAdjusters: { front: { positions: 18, countFrom: 'full_stiff' }, rear: { positions: 12, countFrom: 'full_soft', rebound: { positions: 10, countFrom: 'full_stiff' } } },
    });
    expect(edited.status, JSON.stringify(edited.body)).toBe(200);
    expect(edited.body.damperAdjusters).toEqual({
      front: { ...FRONT_DOUBLE, positions: 18 },
      rear: { positions: 12, countFrom: 'full_soft', rebound: { positions: 10, countFrom: 'full_stiff' } },
    });

    const cleared = await c.patch(`/api/cars/${made.body.id}`, { version: 2, damperAdjusters: { front: { positions: 18, countFrom: 'full_stiff', rebound: null }, rear: null } });
    expect(cleared.status, JSON.stringify(cleared.body)).toBe(200);
    expect(cleared.body.damperAdjusters).toEqual({ front: { positions: 18, countFrom: 'full_stiff', rebound: null }, rear: null });
    // The rear's rebound went with its adjuster: giving the rear clicks again brings no rebound adjuster back.
    const again = await c.patch(`/api/cars/${made.body.id}`, { version: 3, damperAdjusters: { rear: { positions: 12, countFrom: 'full_soft' } } });
    expect(again.body.damperAdjusters.rear).toEqual({ positions: 12, countFrom: 'full_soft', rebound: null });
    expect((await c.get(`/api/cars/${made.body.id}`)).body).toEqual(again.body);
  });

  it('when a rebound adjuster has 0 or 101 positions, counts from no known end or has an unknown field, then 400 at its path and nothing changes', async () => {
    const d = await driverWithCarAndEvent(t);
    const errors = expectFieldErrors(
      await d.c.patch(`/api/cars/${d.carId}`, {
        version: 1,
        damperAdjusters: {
          front: { positions: 12, countFrom: 'full_soft', rebound: { positions: 0, countFrom: 'middle' } },
          rear: { positions: 12, countFrom: 'full_soft', rebound: { positions: 101, countFrom: 'full_soft', turns: 2 } },
        },
      }),
      ['damperAdjusters.front.rebound.positions', 'damperAdjusters.front.rebound.countFrom', 'damperAdjusters.rear.rebound.positions', 'damperAdjusters.rear.rebound.turns'],
    );
    expect(errors['damperAdjusters.rear.rebound.turns']).toEqual(['Unknown field']);
    expect((await d.c.get(`/api/cars/${d.carId}`)).body).toEqual(d.car);
    const { c, user } = await signedInClient(t);
    expectFieldErrors(
      await c.post('/api/cars', { name: 'A', classCode: 'SS', damperAdjusters: { front: { positions: 12, countFrom: 'full_soft', rebound: { positions: 2.5, countFrom: 'full_soft' } } } }),
      ['damperAdjusters.front.rebound.positions'],
    );
    expect(await carsOf(user.id)).toBe(0);
  });
});

describe('the migration that lets dampers be double-adjustable', () => {
  it('when cars were stored before it, then they read back with no rebound adjuster, take one afterwards, and the columns come off and on again', async () => {
    // A database of its own: the test takes the migration's columns away and back.
    const db = await migratedDatabaseUrl();
    const own = await makeTestApp({ databaseUrl: db.url });
    try {
      const { c, user } = await signedInClient(own);
      const migration = new DoubleAdjustableDampers1766016000000();
      const runner = own.ds.createQueryRunner();
      const [withAdjusters, fixed] = [randomUUID(), randomUUID()];
      try {
        await migration.down(runner);
        // Two cars as the app stored them before: one with clicks front and rear, one on fixed dampers.
        await runner.query(
          `INSERT INTO cars (id, owner_id, name, class_code, front_damper_positions, front_damper_count_from, rear_damper_positions, rear_damper_count_from)
           VALUES ($1, $3, 'Old coupe', 'SS', 16, 'full_stiff', 12, 'full_soft'), ($2, $3, 'Old hatch', 'HS', NULL, NULL, NULL, NULL)`,
          [withAdjusters, fixed, user.id],
        );
        await migration.up(runner);
      } finally {
        await runner.release();
      }
      expect((await c.get(`/api/cars/${withAdjusters}`)).body.damperAdjusters).toEqual({
        front: { positions: 16, countFrom: 'full_stiff', rebound: null },
        rear: { positions: 12, countFrom: 'full_soft', rebound: null },
      });
      expect((await c.get(`/api/cars/${fixed}`)).body.damperAdjusters).toEqual({ front: null, rear: null });
      const edited = await c.patch(`/api/cars/${withAdjusters}`, { version: 1, damperAdjusters: { front: FRONT_DOUBLE } });
      expect(edited.status, JSON.stringify(edited.body)).toBe(200);
      expect(edited.body.damperAdjusters.front).toEqual(FRONT_DOUBLE);

      // A rebound adjuster stands only beside the axle's other adjuster, and whole.
      await expect(own.ds.query(`UPDATE cars SET rear_damper_rebound_positions = 10, rear_damper_rebound_count_from = 'full_soft' WHERE id = $1`, [fixed])).rejects.toThrow(/check/i);
      await expect(own.ds.query(`UPDATE cars SET rear_damper_rebound_positions = 10 WHERE id = $1`, [withAdjusters])).rejects.toThrow(/check/i);

      // Down takes the rebound adjusters away (the cars keep the rest); up brings the columns back empty.
      const again = own.ds.createQueryRunner();
      try {
        await migration.down(again);
        await migration.up(again);
      } finally {
        await again.release();
      }
      expect((await c.get(`/api/cars/${withAdjusters}`)).body.damperAdjusters).toEqual({
        front: { positions: 16, countFrom: 'full_stiff', rebound: null },
        rear: { positions: 12, countFrom: 'full_soft', rebound: null },
      });
    } finally {
      await own.close();
      await db.drop();
    }
  }, 60_000);
});

describe('GET /api/cars and /api/cars/:carId', () => {
  it('when a driver lists cars, then it answers { items, count } with their cars only', async () => {
    const a = await driverWithCarAndEvent(t);
    const b = await driverWithCarAndEvent(t);
    const second = await a.c.post('/api/cars', { name: 'Track car', classCode: 'CAM' });
    expect(second.status).toBe(201);
    const res = await a.c.get('/api/cars');
    expect(res.status).toBe(200);
    expect(res.body.count).toBe(res.body.items.length);
    expect(res.body.items.map((x: { id: string }) => x.id)).toEqual([a.carId, second.body.id]);
    expect(res.body.items.map((x: { id: string }) => x.id)).not.toContain(b.carId);
  });

  it('when the owner reads the car, then it answers 200 with the stored car', async () => {
    const d = await driverWithCarAndEvent(t);
    const res = await d.c.get(`/api/cars/${d.carId}`);
    expect(res.status).toBe(200);
    expect(res.body).toEqual(d.car);
  });

  it('when the car id is unknown or not a UUID, then 404 not_found', async () => {
    const d = await driverWithCarAndEvent(t);
    expectError(await d.c.get('/api/cars/0b6f2a8e-4b1c-4a57-9d37-6d0b7d1c0e11'), 404, 'not_found');
    expectError(await d.c.get('/api/cars/not-a-uuid'), 404, 'not_found');
  });
});

describe('PATCH /api/cars/:carId', () => {
  it('when the version is current, then it saves the fields given, keeps the rest and bumps the version', async () => {
    const d = await driverWithCarAndEvent(t);
    const res = await d.c.patch(`/api/cars/${d.carId}`, { version: 1, name: 'Blue roadster (2026)', notes: 'New bushings' });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body).toMatchObject({ name: 'Blue roadster (2026)', notes: 'New bushings', classCode: 'SS', carNumber: '42', version: 2 });
    expect(res.body.damperAdjusters).toEqual(d.car.damperAdjusters);
    expect((await d.c.get(`/api/cars/${d.carId}`)).body).toEqual(res.body);
  });

  it('when the version is missing, then 400 on version and nothing changes', async () => {
    const d = await driverWithCarAndEvent(t);
    expectFieldErrors(await d.c.patch(`/api/cars/${d.carId}`, { name: 'Renamed' }), ['version']);
    expect((await d.c.get(`/api/cars/${d.carId}`)).body).toEqual(d.car);
  });

  it('when the version is stale, then 409 carries the current car and the stale edit changes nothing', async () => {
    const d = await driverWithCarAndEvent(t);
    const first = await d.c.patch(`/api/cars/${d.carId}`, { version: 1, classCode: 'STR' });
    expect(first.status).toBe(200);
    const stale = await d.c.patch(`/api/cars/${d.carId}`, { version: 1, name: 'Stale name', carNumber: '99' });
    expectError(stale, 409, 'conflict');
    expect(stale.body.error.current).toMatchObject({ id: d.carId, version: 2, classCode: 'STR', name: 'Blue roadster', carNumber: '42' });
    const now = await d.c.get(`/api/cars/${d.carId}`);
    expect(now.body).toEqual(first.body);
  });

  it('when an edit has an unknown field or an empty name, then 400 and nothing changes', async () => {
    const d = await driverWithCarAndEvent(t);
    expect(expectFieldErrors(await d.c.patch(`/api/cars/${d.carId}`, { version: 1, ownerId: d.user.id }), ['ownerId']).ownerId).toEqual([
      'Unknown field',
    ]);
    expectFieldErrors(await d.c.patch(`/api/cars/${d.carId}`, { version: 1, name: '  ' }), ['name']);
    expect((await d.c.get(`/api/cars/${d.carId}`)).body.version).toBe(1);
  });
});

describe('DELETE /api/cars/:carId', () => {
  it('when the owner deletes the car, then 204, it is gone and its setups and runs go with it', async () => {
    const d = await driverWithCarAndEvent(t);
    await postSetup(d.c, d.carId);
    await postRun(d.c, d.carId, d.eventId);
    const res = await d.c.delete(`/api/cars/${d.carId}`);
    expect(res.status).toBe(204);
    expectError(await d.c.get(`/api/cars/${d.carId}`), 404, 'not_found');
    expect(await countOf(t, 'SELECT count(*) AS n FROM setup_snapshots WHERE car_id = $1', [d.carId])).toBe(0);
    expect(await countOf(t, 'SELECT count(*) AS n FROM runs WHERE car_id = $1', [d.carId])).toBe(0);
  });
});

describe('co-drivers', () => {
  it('when the owner adds a registered driver by e-mail, then 201 lists them and the car appears in their list', async () => {
    const d = await driverWithCarAndEvent(t);
    const co = await signedInClient(t, { displayName: 'Teo Marsh' });
    const res = await d.c.post(`/api/cars/${d.carId}/co-drivers`, { email: co.email.toUpperCase() });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body.coDrivers).toEqual([{ id: co.user.id, displayName: 'Teo Marsh' }]);
    const theirs = await co.c.get('/api/cars');
    expect(theirs.body.items.map((x: { id: string }) => x.id)).toEqual([d.carId]);
    expect((await co.c.get(`/api/cars/${d.carId}`)).status).toBe(200);
  });

  it('when no account uses the e-mail, or it is malformed, then 400 on email and no co-driver is written', async () => {
    const d = await driverWithCarAndEvent(t);
    expectFieldErrors(await d.c.post(`/api/cars/${d.carId}/co-drivers`, { email: 'nobody-here@example.com' }), ['email']);
    expectFieldErrors(await d.c.post(`/api/cars/${d.carId}/co-drivers`, { email: 'not-an-email' }), ['email']);
    expectFieldErrors(await d.c.post(`/api/cars/${d.carId}/co-drivers`, { email: d.email, role: 'x' }), ['role']);
    expect(await coDriversOf(d.carId)).toBe(0);
  });

  it('when the owner adds their own e-mail, then 400 on email', async () => {
    const d = await driverWithCarAndEvent(t);
    expectFieldErrors(await d.c.post(`/api/cars/${d.carId}/co-drivers`, { email: d.email }), ['email']);
    expect(await coDriversOf(d.carId)).toBe(0);
  });

  it('when a co-driver edits, deletes the car or adds a co-driver, then 403 and the car is unchanged', async () => {
    const d = await driverWithCarAndEvent(t);
    const co = await addCoDriver(t, d);
    const third = await signedInClient(t);
    expectError(await co.c.patch(`/api/cars/${d.carId}`, { version: 1, name: 'Mine now' }), 403, 'forbidden');
    expectError(await co.c.delete(`/api/cars/${d.carId}`), 403, 'forbidden');
    expectError(await co.c.post(`/api/cars/${d.carId}/co-drivers`, { email: third.email }), 403, 'forbidden');
    const car = await d.c.get(`/api/cars/${d.carId}`);
    expect(car.body).toMatchObject({ name: 'Blue roadster', version: 1 });
    expect(await coDriversOf(d.carId)).toBe(1);
  });

  it('when the owner removes a co-driver, then 204 and the car is hidden from them; removing again is 404', async () => {
    const d = await driverWithCarAndEvent(t);
    const co = await addCoDriver(t, d);
    expect((await d.c.delete(`/api/cars/${d.carId}/co-drivers/${co.user.id}`)).status).toBe(204);
    expectError(await co.c.get(`/api/cars/${d.carId}`), 404, 'not_found');
    expect((await d.c.get(`/api/cars/${d.carId}`)).body.coDrivers).toEqual([]);
    expectError(await d.c.delete(`/api/cars/${d.carId}/co-drivers/${co.user.id}`), 404, 'not_found');
  });

  it('when a co-driver takes themselves off, then 204; taking another co-driver off is 403', async () => {
    const d = await driverWithCarAndEvent(t);
    const co1 = await addCoDriver(t, d, 'First co');
    const co2 = await addCoDriver(t, d, 'Second co');
    expectError(await co1.c.delete(`/api/cars/${d.carId}/co-drivers/${co2.user.id}`), 403, 'forbidden');
    expect((await co1.c.delete(`/api/cars/${d.carId}/co-drivers/${co1.user.id}`)).status).toBe(204);
    expect((await d.c.get(`/api/cars/${d.carId}`)).body.coDrivers).toEqual([{ id: co2.user.id, displayName: 'Second co' }]);
  });
});

describe('someone else’s car', () => {
  it('when another driver reads, edits, deletes or adds co-drivers, then 404 every time and nothing changes', async () => {
    const d = await driverWithCarAndEvent(t);
    const other = await signedInClient(t);
    expectError(await other.c.get(`/api/cars/${d.carId}`), 404, 'not_found');
    expectError(await other.c.patch(`/api/cars/${d.carId}`, { version: 1, name: 'Taken' }), 404, 'not_found');
    expectError(await other.c.delete(`/api/cars/${d.carId}`), 404, 'not_found');
    expectError(await other.c.post(`/api/cars/${d.carId}/co-drivers`, { email: other.email }), 404, 'not_found');
    expectError(await other.c.delete(`/api/cars/${d.carId}/co-drivers/${other.user.id}`), 404, 'not_found');
    expect((await other.c.get('/api/cars')).body).toEqual({ items: [], count: 0 });
    expect((await d.c.get(`/api/cars/${d.carId}`)).body).toEqual(d.car);
    expect(await coDriversOf(d.carId)).toBe(0);
  });

  it('when nobody is signed in, then every car route answers 401', async () => {
    const d = await driverWithCarAndEvent(t);
    const anon = anonymous(t);
    for (const res of [
      await anon.get('/api/cars'),
      await anon.post('/api/cars', { name: 'A', classCode: 'SS' }),
      await anon.get(`/api/cars/${d.carId}`),
      await anon.patch(`/api/cars/${d.carId}`, { version: 1, name: 'X' }),
      await anon.delete(`/api/cars/${d.carId}`),
      await anon.post(`/api/cars/${d.carId}/co-drivers`, { email: d.email }),
      await anon.delete(`/api/cars/${d.carId}/co-drivers/${d.user.id}`),
    ]) {
      expectError(res, 401, 'unauthenticated');
    }
    expect((await d.c.get(`/api/cars/${d.carId}`)).body).toEqual(d.car);
  });
});
