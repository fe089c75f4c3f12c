import { randomUUID } from 'node:crypto';
import { expect } from 'vitest';
import { client, signedInClient, TEST_PASSWORD, type TestApp } from '../test-app';

export type Client = Awaited<ReturnType<typeof signedInClient>>['c'];
export type Driver = Awaited<ReturnType<typeof driverWithCarAndEvent>>;
type Res = { status: number; body: unknown };

/** A signed-in driver with one car (12-position adjusters front and rear, counted from full soft) and one event. */
export async function driverWithCarAndEvent(t: TestApp, opts: { conePenaltySec?: number } = {}) {
  const driver = await signedInClient(t, { displayName: 'Nell Ashdown' });
  const car = await driver.c.post('/api/cars', {
    name: 'Blue roadster',
    classCode: 'SS',
    carNumber: '42',
    tyreSize: '205/50R15',
    damperAdjusters: { front: { positions: 12, countFrom: 'full_soft' }, rear: { positions: 12, countFrom: 'full_soft' } },
    motionRatios: { front: 0.7, rear: 0.75 },
  });
  expect(car.status).toBe(201);
  const event = await driver.c.post('/api/events', {
    name: 'Spring points round 1',
    date: '2026-04-12',
    venue: 'Harrow Flats airfield',
    conePenaltySec: opts.conePenaltySec ?? 2,
  });
  expect(event.status).toBe(201);
  return { ...driver, carId: car.body.id as string, eventId: event.body.id as string, car: car.body };
}

export function runBody(carId: string, eventId: string, over: Record<string, unknown> = {}) {
  return {
    id: randomUUID(),
    carId,
    eventId,
    runNumber: 1,
    rawTimeSec: 45.678,
    cones: 0,
    status: 'finished',
    recordedAt: '2026-04-12T10:00:00Z',
    ...over,
  };
}

export function setupBody(over: Record<string, unknown> = {}) {
  return {
    label: 'Baseline',
    effectiveFrom: '2026-04-01T00:00:00Z',
    corners: {
      lf: { camberDeg: -1.5, toeMm: 0, damperClicks: 4, coldPressureKpa: 220 },
      rf: { camberDeg: -1.5, toeMm: 0, damperClicks: 4, coldPressureKpa: 220 },
      lr: { camberDeg: -1.0, toeMm: 1, damperClicks: 6, coldPressureKpa: 210 },
      rr: { camberDeg: -1.0, toeMm: 1, damperClicks: 6, coldPressureKpa: 210 },
    },
    axles: { front: { antiRollBar: 'hole 2' }, rear: { antiRollBar: 'disconnected' } },
    ...over,
  };
}

/** A client with no session: every season route must answer it 401. */
export const anonymous = (t: TestApp) => client(t.app);

/** A second, separately signed-in agent (own session and CSRF token) for an existing account. */
export async function secondSession(t: TestApp, email: string) {
  const c = client(t.app);
  const res = await c.post('/api/auth/login', { email, password: TEST_PASSWORD });
  expect(res.status, JSON.stringify(res.body)).toBe(200);
  return c;
}

/** Another registered driver, made a co-driver of `owner`'s car by e-mail. */
export async function addCoDriver(t: TestApp, owner: Driver, displayName = 'Teo Marsh') {
  const co = await signedInClient(t, { displayName });
  const res = await owner.c.post(`/api/cars/${owner.carId}/co-drivers`, { email: co.email });
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return co;
}

/** Posts a setup and returns its body, failing loudly when it is refused. */
export async function postSetup(c: Client, carId: string, over: Record<string, unknown> = {}) {
  const res = await c.post(`/api/cars/${carId}/setups`, setupBody(over));
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return res.body as { id: string; version: number; effectiveFrom: string } & Record<string, unknown>;
}

/** Posts a run and returns its body, failing loudly when it is refused. */
export async function postRun(c: Client, carId: string, eventId: string, over: Record<string, unknown> = {}) {
  const res = await c.post('/api/runs', runBody(carId, eventId, over));
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return res.body as { id: string; version: number; setupId: string | null } & Record<string, unknown>;
}

/** One number from SQL such as `SELECT count(*) AS n FROM runs WHERE car_id = $1`. */
export async function countOf(t: TestApp, sql: string, params: unknown[] = []): Promise<number> {
  const rows = (await t.ds.query(sql, params)) as { n: string | number }[];
  return Number(rows[0]?.n);
}

/** A 400 `validation_failed` whose fieldErrors are keyed by exactly these paths. */
export function expectFieldErrors(res: Res, keys: string[]) {
  expect(res.status, JSON.stringify(res.body)).toBe(400);
  const error = (res.body as { error: { code: string; fieldErrors?: Record<string, string[]> } }).error;
  expect(error.code).toBe('validation_failed');
  expect(Object.keys(error.fieldErrors ?? {}).sort()).toEqual([...keys].sort());
  for (const key of keys) expect(error.fieldErrors?.[key]?.length, key).toBeGreaterThan(0);
  return error.fieldErrors as Record<string, string[]>;
}

/** The error envelope with this status and code. */
export function expectError(res: Res, status: number, code: string) {
  expect(res.status, JSON.stringify(res.body)).toBe(status);
  expect((res.body as { error: { code: string } }).error.code).toBe(code);
}
