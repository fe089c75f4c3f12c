import { METRIC_PREFERENCES } from '../../../shared/calc/units.calc';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import argon2 from 'argon2';
import { client, makeTestApp, sessionCookie, sidOf, sentCookie, signedInClient, TEST_PASSWORD, uniqueEmail, type TestApp } from '../test-app';
import { UserEntity } from '../../../server/features/users/user.entity';

let t: TestApp;
beforeAll(async () => {
  t = await makeTestApp();
});
afterAll(async () => {
  await t.close();
});

const register = (email = uniqueEmail(), password = TEST_PASSWORD, displayName = 'Rhea Calloway') =>
  client(t.app).post('/api/auth/register', { email, password, displayName });

describe('POST /api/auth/register', () => {
  it('when the input is valid, then it creates the account, signs in and answers 201 with the user', async () => {
    const c = client(t.app);
    const email = uniqueEmail();
    const res = await c.post('/api/auth/register', { email: `  ${email.toUpperCase()} `, password: TEST_PASSWORD, displayName: 'Rhea' });
    expect(res.status).toBe(201);
    expect(res.body).toEqual({ user: { id: expect.any(String), email, displayName: 'Rhea', roles: ['driver'], preferences: { units: METRIC_PREFERENCES, emailNotifications: true } } });
    expect(JSON.stringify(res.body)).not.toMatch(/hash/i);
    const me = await c.get('/api/auth/me');
    expect(me.status).toBe(200);
    expect(me.body.user.email).toBe(email);
  });

  it('when it stores the password, then it is an argon2id hash with m=19456, t=2, p=1 (OWASP Password Storage Cheat Sheet)', async () => {
    const email = uniqueEmail();
    await register(email).then((r) => expect(r.status).toBe(201));
    const row = await t.ds.getRepository(UserEntity).findOneByOrFail({ email });
    expect(row.passwordHash).toMatch(/^\$argon2id\$v=19\$m=19456,t=2,p=1\$/);
    expect(await argon2.verify(row.passwordHash, TEST_PASSWORD)).toBe(true);
  });

  it('when the e-mail is taken, then it answers 409 with a field error on email', async () => {
    const email = uniqueEmail();
    await register(email).then((r) => expect(r.status).toBe(201));
    const res = await register(email.toUpperCase());
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('conflict');
    expect(res.body.error.fieldErrors.email).toBeDefined();
  });

  it('when the password is under 12 characters, then it answers 400 with a field error and creates nothing', async () => {
    const email = uniqueEmail();
    const res = await register(email, 'short-pw-11');
    expect(res.status).toBe(400);
    expect(res.body.error).toMatchObject({ code: 'validation_failed', fieldErrors: { password: [expect.stringMatching(/12/)] } });
    expect(await t.ds.getRepository(UserEntity).countBy({ email })).toBe(0);
  });

  it('when the password is over 128 characters, then it answers 400 (OWASP ASVS 2.1.2)', async () => {
    const res = await register(uniqueEmail(), 'x'.repeat(129));
    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors.password).toBeDefined();
  });

  it('when the password is a common breached one, then it answers 400 on password', async () => {
    const res = await register(uniqueEmail(), 'Password1234');
    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors.password[0]).toMatch(/breached/);
  });

  it('when the body has an unknown field, then it answers 400 naming it', async () => {
    const res = await client(t.app).post('/api/auth/register', {
      email: uniqueEmail(), password: TEST_PASSWORD, displayName: 'X', isAdmin: true,
    });
    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors).toEqual({ isAdmin: ['Unknown field'] });
  });

  it('when fields are missing or malformed, then every one gets its own message', async () => {
    const res = await client(t.app).post('/api/auth/register', { email: 'not-an-email' });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fieldErrors).sort()).toEqual(['displayName', 'email', 'password']);
  });
});

describe('POST /api/auth/login', () => {
  it('when the password is right, then it answers 200 with the user and a new session cookie', async () => {
    const email = uniqueEmail();
    await register(email);
    const c = client(t.app);
    const csrfRes = await c.agent.get('/api/auth/csrf');
    const before = sessionCookie(csrfRes.headers['set-cookie']);
    expect(before).toBeDefined();
    const res = await c.agent
      .post('/api/auth/login')
      .set('X-CSRF-Token', csrfRes.body.token)
      .send({ email, password: TEST_PASSWORD });
    expect(res.status).toBe(200);
    expect(res.body.user.email).toBe(email);
    const after = sessionCookie(res.headers['set-cookie']);
    expect(after).toBeDefined();
    expect(after).not.toBe(before);
    // The pre-sign-in session row is gone: the ID was regenerated, not reused.
    const oldSid = sidOf(before!);
    const rows = await t.ds.query('SELECT 1 FROM session WHERE sid = $1', [oldSid]);
    expect(rows).toHaveLength(0);
  });

  it('when the cookie is set, then it is httpOnly and SameSite=Lax', async () => {
    const res = await request(t.app).get('/api/auth/csrf');
    const cookie = (res.headers['set-cookie'] as unknown as string[])[0]!;
    expect(cookie).toMatch(/HttpOnly/);
    expect(cookie).toMatch(/SameSite=Lax/);
    expect(cookie).not.toMatch(/Secure/);
  });

  it('when the password is wrong or the e-mail unknown, then both answers are the same 401', async () => {
    const email = uniqueEmail();
    await register(email);
    const wrong = await client(t.app).post('/api/auth/login', { email, password: 'not-the-password-at-all' });
    const unknown = await client(t.app).post('/api/auth/login', { email: uniqueEmail(), password: 'not-the-password-at-all' });
    expect(wrong.status).toBe(401);
    expect(unknown.status).toBe(401);
    expect(wrong.body).toEqual(unknown.body);
    expect(wrong.body.error.code).toBe('unauthenticated');
  });
});

describe('CSRF', () => {
  it('when a write has no X-CSRF-Token, then it answers 403 and does nothing', async () => {
    const email = uniqueEmail();
    const agent = request.agent(t.app);
    await agent.get('/api/auth/csrf');
    const res = await agent.post('/api/auth/register').send({ email, password: TEST_PASSWORD, displayName: 'No Token' });
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('csrf_invalid');
    expect(await t.ds.getRepository(UserEntity).countBy({ email })).toBe(0);
  });

  it('when the token belongs to another session, then it answers 403', async () => {
    const other = await request.agent(t.app).get('/api/auth/csrf');
    const agent = request.agent(t.app);
    await agent.get('/api/auth/csrf');
    const res = await agent.post('/api/auth/logout').set('X-CSRF-Token', other.body.token);
    expect(res.status).toBe(403);
  });
});

describe('POST /api/auth/logout', () => {
  it('when signed in, then it answers 204, deletes the session row and /me is 401 after', async () => {
    const { c } = await signedInClient(t);
    const me = await c.get('/api/auth/me');
    const sid = sidOf(sentCookie(me));
    const rowsFor = () => t.ds.query('SELECT 1 FROM session WHERE sid = $1', [sid]);
    expect(await rowsFor()).toHaveLength(1);
    const res = await c.post('/api/auth/logout');
    expect(res.status).toBe(204);
    expect(await rowsFor()).toHaveLength(0);
    expect((await c.get('/api/auth/me')).status).toBe(401);
  });

  it('when a signed-out cookie is replayed, then it no longer signs anyone in', async () => {
    const { c, email } = await signedInClient(t);
    const me = await c.get('/api/auth/me');
    expect(me.body.user.email).toBe(email);
    const cookieHeader = sentCookie(me);
    await c.post('/api/auth/logout');
    const replay = await request(t.app).get('/api/auth/me').set('Cookie', cookieHeader);
    expect(replay.status).toBe(401);
  });
});

describe('GET /api/auth/me', () => {
  it('when signed out, then it answers 401 in the error envelope', async () => {
    const res = await request(t.app).get('/api/auth/me');
    expect(res.status).toBe(401);
    expect(res.body).toEqual({ error: { code: 'unauthenticated', message: expect.any(String) } });
  });
});

describe('GET /api/auth/session', () => {
  it('when nobody is signed in, then it answers 200 with a null user, so a browser logs no failed request', async () => {
    const res = await request(t.app).get('/api/auth/session');
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ user: null });
  });

  it('when signed in, then it answers the user, and null again once signed out', async () => {
    const c = client(t.app);
    const email = uniqueEmail();
    await c.post('/api/auth/register', { email, password: TEST_PASSWORD, displayName: 'Odile' }).then((r) => expect(r.status).toBe(201));
    const before = await c.get('/api/auth/session');
    expect(before.status).toBe(200);
    expect(before.body.user).toMatchObject({ email, displayName: 'Odile', roles: ['driver'] });
    await c.post('/api/auth/logout').then((r) => expect(r.status).toBe(204));
    expect((await c.get('/api/auth/session')).body).toEqual({ user: null });
  });
});

describe('PATCH /api/auth/me/preferences', () => {
  it('when a driver picks psi and 1/32 in, then they are kept with the account and the rest stay metric', async () => {
    const { c } = await signedInClient(t);
    const res = await c.patch('/api/auth/me/preferences', { units: { pressure: 'psi', treadDepth: 'in32' } });
    expect(res.status).toBe(200);
    expect(res.body.user.preferences.units).toEqual({ ...METRIC_PREFERENCES, pressure: 'psi', treadDepth: 'in32' });
    const me = await c.get('/api/auth/me');
    expect(me.body.user.preferences.units.pressure).toBe('psi');
    const again = await c.patch('/api/auth/me/preferences', { units: { temperature: 'degF' } });
    expect(again.body.user.preferences.units).toMatchObject({ pressure: 'psi', treadDepth: 'in32', temperature: 'degF' });
  });

  it('when a unit does not fit the quantity, then 400 with a field error and nothing changes', async () => {
    const { c } = await signedInClient(t);
    const res = await c.patch('/api/auth/me/preferences', { units: { pressure: 'mm' } });
    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors['units.pressure']).toBeDefined();
    expect((await c.get('/api/auth/me')).body.user.preferences.units).toEqual(METRIC_PREFERENCES);
  });

  it('when signed out, then 401', async () => {
    const res = await client(t.app).patch('/api/auth/me/preferences', { units: { pressure: 'psi' } });
    expect(res.status).toBe(401);
  });
});
