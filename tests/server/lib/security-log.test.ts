import { createHash } from 'node:crypto';
import { Writable } from 'node:stream';
import { pino } from 'pino';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { client, makeTestApp, signedInClient, TEST_PASSWORD, type TestApp } from '../test-app';
import { visit } from '../service/invoice-fixtures';

/**
 * Security events in the log (OWASP ASVS 4.0.3 V7.1.3: successful and failed authentication and access-control
 * failures are logged; V7.2.1: every authentication decision, without passwords or session tokens; V7.2.2: failed
 * access decisions; V7.1.1, V7.1.2: no credentials, and no personal data beyond what is needed).
 */
interface Line {
  level: number;
  msg: string;
  security?: string;
  userId?: string | null;
  account?: string;
  reason?: string;
  for?: string;
  target?: string;
  path?: string;
  res?: { statusCode: number };
  req?: { url: string; headers?: Record<string, string> };
}

const lines: Line[] = [];
const raw: string[] = [];
const sink = new Writable({
  write(chunk: Buffer, _enc, done) {
    for (const text of chunk.toString('utf8').split('\n').filter(Boolean)) {
      raw.push(text);
      lines.push(JSON.parse(text) as Line);
    }
    done();
  },
});

let t: TestApp;
beforeAll(async () => {
  t = await makeTestApp({ logger: pino({ level: 'info', redact: ['req.headers.cookie', 'req.headers["x-csrf-token"]', 'res.headers["set-cookie"]'] }, sink), authLimits: { loginPerAccount: 3 } });
});
afterAll(async () => {
  await t.close();
});

const events = (name: string) => lines.filter((l) => l.security === name);
const digest = (email: string) => createHash('sha256').update(email).digest('hex').slice(0, 16);
const WARN = 40;
const INFO = 30;

describe('the security log', () => {
  it('when someone signs in with a wrong password and then the right one, then both decisions are logged, the address only as a digest and no password at all', async () => {
    const { email, user } = await signedInClient(t);
    const c = client(t.app);
    await c.post('/api/auth/login', { email, password: 'a wrong password, typed' });
    await c.post('/api/auth/login', { email, password: TEST_PASSWORD });

    const refused = events('sign-in-refused').find((l) => l.account === digest(email));
    expect(refused).toMatchObject({ level: INFO, userId: null, reason: 'no match' });
    expect(events('signed-in').some((l) => l.userId === user.id)).toBe(true);
    const all = raw.join('\n');
    expect(all).not.toContain(email);
    expect(all).not.toContain(TEST_PASSWORD);
    expect(all).not.toContain('a wrong password, typed');
    expect(all).not.toMatch(/scrubline\.sid=/);
  });

  it('when a write comes without its CSRF token, or sign-in is tried past the limit, then the refusal is logged at warn with the account that asked', async () => {
    const { c, email, user } = await signedInClient(t);
    await c.agent.post('/api/cars').send({ name: 'No token', classCode: 'SS' });
    const forbidden = lines.find((l) => l.res?.statusCode === 403 && l.req?.url === '/api/cars' && l.userId === user.id);
    expect(forbidden?.level).toBe(WARN);

    const other = client(t.app);
    for (let i = 0; i < 4; i++) await other.post('/api/auth/login', { email, password: `guess ${i} of many` });
    expect(lines.some((l) => l.res?.statusCode === 429 && l.req?.url === '/api/auth/login' && l.level === WARN)).toBe(true);
  });

  it('when someone asks for a car, an event, a tyre set or a work order that is not theirs, then the 404 is the same as for none, but only theirs is logged at warn as a hidden record', async () => {
    const owner = await signedInClient(t);
    const car = (await owner.c.post('/api/cars', { name: 'Not yours', classCode: 'SS' })).body as { id: string };
    const stranger = await signedInClient(t);
    const hidden = await stranger.c.get(`/api/cars/${car.id}`);
    const missing = await stranger.c.get('/api/cars/00000000-0000-4000-8000-000000000000');

    expect(hidden.status).toBe(404);
    expect(hidden.body).toEqual(missing.body);
    const logged = events('record-hidden').filter((l) => l.userId === stranger.user.id);
    expect(logged).toHaveLength(1);
    expect(logged[0]).toMatchObject({ level: WARN, path: `/api/cars/${car.id}` });
    expect(events('record-hidden').some((l) => l.userId === owner.user.id)).toBe(false);

    // The owner's event, a tyre set of that car, and a shop's work order on it, asked for by the same stranger: hidden too; ones that do not exist are not.
    const event = (await owner.c.post('/api/events', { name: 'Quarry test day', date: '2026-05-03', venue: 'Old quarry lot', conePenaltySec: 2 })).body as { id: string };
    expect((await stranger.c.get(`/api/events/${event.id}`)).status).toBe(404);
    expect((await stranger.c.get('/api/events/00000000-0000-4000-8000-000000000000')).status).toBe(404);
    const tyreSet = (await owner.c.post(`/api/cars/${car.id}/tyre-sets`, { label: 'Set A', boughtOn: '2026-03-01', startTreadMm: 7 })).body as { id: string };
    expect((await stranger.c.get(`/api/tyre-sets/${tyreSet.id}/readings`)).status).toBe(404);
    expect((await stranger.c.get('/api/tyre-sets/00000000-0000-4000-8000-000000000000/readings')).status).toBe(404);
    const staff = await signedInClient(t);
    const shop = (await staff.c.post('/api/shops', { name: 'Hidden Hollow Garage' })).body as { id: string };
    const workOrderId = await visit(t, { shopId: shop.id, carId: car.id, staffId: staff.user.id });
    expect((await stranger.c.get(`/api/work-orders/${workOrderId}`)).status).toBe(404);
    expect((await stranger.c.get('/api/work-orders/00000000-0000-4000-8000-000000000000')).status).toBe(404);
    expect(events('record-hidden').filter((l) => l.userId === stranger.user.id).map((l) => l.path)).toEqual([
      `/api/cars/${car.id}`,
      `/api/events/${event.id}`,
      `/api/tyre-sets/${tyreSet.id}/readings`,
      `/api/work-orders/${workOrderId}`,
    ]);
  });

  it('when someone logs a run into an event, or asks for a shop or a team, that is not theirs, then the 404 is the same as for none, and only theirs is logged as a hidden record', async () => {
    const owner = await signedInClient(t);
    const event = (await owner.c.post('/api/events', { name: 'Closed club day', date: '2026-05-10', venue: 'Back lot', conePenaltySec: 2 })).body as { id: string };
    const shop = (await owner.c.post('/api/shops', { name: 'Private Bench Garage' })).body as { id: string };
    const team = (await owner.c.post('/api/teams', { name: 'Closed Door Racing' })).body as { id: string };
    const stranger = await signedInClient(t);
    const car = (await stranger.c.post('/api/cars', { name: 'Own car', classCode: 'SS' })).body as { id: string };
    const none = '00000000-0000-4000-8000-000000000000';
    const runInto = (eventId: string) =>
      stranger.c.post('/api/runs', { id: crypto.randomUUID(), carId: car.id, eventId, runNumber: 1, rawTimeSec: 45.6, cones: 0, status: 'finished', recordedAt: '2026-05-10T10:00:00Z' });

    const pairs = [
      [await runInto(event.id), await runInto(none)],
      [await stranger.c.get(`/api/shops/${shop.id}`), await stranger.c.get(`/api/shops/${none}`)],
      [await stranger.c.get(`/api/teams/${team.id}`), await stranger.c.get(`/api/teams/${none}`)],
    ];
    for (const [hidden, missing] of pairs) {
      expect(hidden!.status).toBe(404);
      expect(hidden!.body).toEqual(missing!.body);
    }
    expect(events('record-hidden').filter((l) => l.userId === stranger.user.id).map((l) => [l.level, l.path])).toEqual([
      [WARN, '/api/runs'],
      [WARN, `/api/shops/${shop.id}`],
      [WARN, `/api/teams/${team.id}`],
    ]);
    expect(await t.ds.query('SELECT 1 FROM runs WHERE car_id = $1', [car.id])).toEqual([]);
    // Their own shop and team are theirs: nothing is logged for the owner.
    expect((await owner.c.get(`/api/shops/${shop.id}`)).status).toBe(200);
    expect((await owner.c.get(`/api/teams/${team.id}`)).status).toBe(200);
    expect(events('record-hidden').some((l) => l.userId === owner.user.id)).toBe(false);
  });

  it('when the password is changed, mistyped at a change, or the account closed, then each is an event of that account', async () => {
    const { c, user } = await signedInClient(t);
    await c.post('/api/auth/me/password', { currentPassword: 'not the current one at all', newPassword: 'a brand new long password' });
    await c.post('/api/auth/me/password', { currentPassword: TEST_PASSWORD, newPassword: 'a brand new long password' });
    await c.post('/api/auth/me/close', { password: 'a brand new long password' });
    expect(events('password-check-failed').find((l) => l.userId === user.id)?.for).toBe('password-changed');
    expect(events('password-changed').some((l) => l.userId === user.id)).toBe(true);
    expect(events('account-closed').some((l) => l.userId === user.id)).toBe(true);
  });

  it('when an admin suspends, restores, and gives the admin role, then each decision names the admin and the account', async () => {
    const admin = await signedInClient(t, { isAdmin: true });
    const driver = await signedInClient(t);
    await admin.c.post(`/api/admin/users/${driver.user.id}/suspend`, { note: 'Checking the log' });
    await admin.c.post(`/api/admin/users/${driver.user.id}/restore`);
    await admin.c.put(`/api/admin/users/${driver.user.id}/admin`, { isAdmin: true });
    for (const name of ['account-suspended', 'account-restored', 'admin-role-changed']) {
      expect(events(name).find((l) => l.target === driver.user.id), name).toMatchObject({ userId: admin.user.id });
    }
  });
});
