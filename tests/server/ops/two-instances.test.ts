import { randomUUID } from 'node:crypto';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createUser } from '../../../server/features/users/user.service';
import { makeTestApp, sessionCookie, TEST_PASSWORD, uniqueEmail, type TestApp } from '../test-app';

/**
 * Two app processes behind one load balancer share nothing but the database: a session made on
 * one must be good on the other, and so must its CSRF token and the sign-in counters.
 */
let a: TestApp;
let b: TestApp;
const keyPrefix = `two-${randomUUID()}`;

beforeAll(async () => {
  // The same limits and counter keys on both, as two instances of one deployment would have.
  const authLimits = { loginPerAccount: 3, keyPrefix };
  a = await makeTestApp({ authLimits });
  b = await makeTestApp({ authLimits });
});

afterAll(async () => {
  await a?.close();
  await b?.close();
});

async function csrfOn(app: TestApp['app'], cookie: string): Promise<{ token: string; cookie: string }> {
  const res = await request(app).get('/api/auth/csrf').set('Cookie', cookie).expect(200);
  return { token: (res.body as { token: string }).token, cookie: sessionCookie(res.headers['set-cookie']) ?? cookie };
}

describe('two app instances on one database', () => {
  it('when a driver signs in on one instance, then the other knows the session, takes its CSRF token, and the sign-out on it ends the session on both', async () => {
    const email = uniqueEmail();
    await createUser(a.ds, { email, password: TEST_PASSWORD, displayName: 'Two Boxes' });

    const first = await csrfOn(a.app, '');
    const login = await request(a.app)
      .post('/api/auth/login')
      .set('Cookie', first.cookie)
      .set('X-CSRF-Token', first.token)
      .send({ email, password: TEST_PASSWORD });
    expect(login.status, JSON.stringify(login.body)).toBe(200);
    const cookie = sessionCookie(login.headers['set-cookie'])!;
    expect(cookie).toBeTruthy();

    const me = await request(b.app).get('/api/auth/me').set('Cookie', cookie);
    expect(me.status).toBe(200);
    expect(me.body.user.email).toBe(email);

    // A write on B with a token issued by A: the token lives in the shared session.
    const { token } = await csrfOn(a.app, cookie);
    const car = await request(b.app)
      .post('/api/cars')
      .set('Cookie', cookie)
      .set('X-CSRF-Token', token)
      .send({ name: 'Load-balanced roadster', classCode: 'SS' });
    expect(car.status, JSON.stringify(car.body)).toBe(201);
    expect((await request(a.app).get(`/api/cars/${car.body.id}`).set('Cookie', cookie)).status).toBe(200);

    const out = await request(b.app).post('/api/auth/logout').set('Cookie', cookie).set('X-CSRF-Token', token);
    expect(out.status).toBeLessThan(300);
    expect((await request(a.app).get('/api/auth/me').set('Cookie', cookie)).status).toBe(401);
  });

  it('when an admin on one instance suspends an account signed in on the other, then the other refuses it at its next request', async () => {
    const signIn = async (app: TestApp['app'], email: string) => {
      const first = await csrfOn(app, '');
      const res = await request(app).post('/api/auth/login').set('Cookie', first.cookie).set('X-CSRF-Token', first.token).send({ email, password: TEST_PASSWORD });
      expect(res.status).toBe(200);
      return sessionCookie(res.headers['set-cookie'])!;
    };
    const driverEmail = uniqueEmail();
    const adminEmail = uniqueEmail('admin');
    const driver = await createUser(a.ds, { email: driverEmail, password: TEST_PASSWORD, displayName: 'Two Boxes Driver' });
    await createUser(a.ds, { email: adminEmail, password: TEST_PASSWORD, displayName: 'Two Boxes Admin' }, { isAdmin: true });
    const driverOnB = await signIn(b.app, driverEmail);
    expect((await request(b.app).get('/api/auth/me').set('Cookie', driverOnB)).status).toBe(200);

    const adminOnA = await signIn(a.app, adminEmail);
    const { token, cookie } = await csrfOn(a.app, adminOnA);
    const res = await request(a.app).post(`/api/admin/users/${driver.id}/suspend`).set('Cookie', cookie).set('X-CSRF-Token', token).send({ note: 'Two instances' });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    // No copy of the session or the account is kept in B's memory.
    expect((await request(b.app).get('/api/auth/me').set('Cookie', driverOnB)).status).toBe(401);
  });

  it('when wrong passwords are tried on both instances, then the counter is one: the limit holds across them', async () => {
    const email = uniqueEmail();
    await createUser(a.ds, { email, password: TEST_PASSWORD, displayName: 'Guessed At' });
    const attempt = async (app: TestApp['app'], password: string) => {
      const { token, cookie } = await csrfOn(app, '');
      return request(app).post('/api/auth/login').set('Cookie', cookie).set('X-CSRF-Token', token).send({ email, password });
    };
    expect((await attempt(a.app, 'wrong-password-one')).status).toBe(401);
    expect((await attempt(b.app, 'wrong-password-two')).status).toBe(401);
    expect((await attempt(a.app, 'wrong-password-three')).status).toBe(401);
    // Three failures in all: the fourth try is refused on either instance, even with the right password.
    expect((await attempt(b.app, TEST_PASSWORD)).status).toBe(429);
  });
});
