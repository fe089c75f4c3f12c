import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { hashSecretToken, newSecretToken } from '../../../server/lib/secret-token';
import { client, makeTestApp, signedInClient, TEST_PASSWORD, type TestApp } from '../test-app';
import { secondSession } from '../season/season-fixtures';

/**
 * POST /api/auth/me/password. OWASP ASVS 4.0.3: V2.1.5 (users can change their password), V2.1.6 (the current
 * and the new password are both asked for), V3.3.3 (other sessions end after a password change), V3.7.1 (the
 * current password is asked again before the change). The account's failed sign-in limit (5 in 15 minutes,
 * the app's default) applies to a wrong current password too.
 */
let t: TestApp;
beforeAll(async () => {
  t = await makeTestApp({ authLimits: { loginPerAccount: 5 } });
});
afterAll(async () => {
  await t.close();
});

const NEW_PASSWORD = 'copper kettle under the grandstand';
const change = (c: ReturnType<typeof client>, body: Record<string, unknown>) => c.post('/api/auth/me/password', body);
const login = (email: string, password: string) => client(t.app).post('/api/auth/login', { email, password });

describe('changing the password while signed in', () => {
  it('when the current password is right, then the new one signs in, the old one no longer does, this device stays signed in and every other device is signed out', async () => {
    const me = await signedInClient(t);
    const phone = await secondSession(t, me.email);
    expect((await phone.get('/api/auth/me')).status).toBe(200);

    const res = await change(me.c, { currentPassword: TEST_PASSWORD, newPassword: NEW_PASSWORD });
    expect(res.status, JSON.stringify(res.body)).toBe(204);

    expect((await me.c.get('/api/auth/me')).status).toBe(200);
    expect((await phone.get('/api/auth/me')).status).toBe(401);
    expect((await login(me.email, TEST_PASSWORD)).status).toBe(401);
    expect((await login(me.email, NEW_PASSWORD)).status).toBe(200);
    // This device keeps its session and its CSRF token: it can go on writing.
    expect((await me.c.patch('/api/auth/me/preferences', { units: { pressure: 'psi' } })).status).toBe(200);
  });

  it('when a reset link was open, then the change voids it', async () => {
    const me = await signedInClient(t);
    const { token, hash } = newSecretToken();
    await t.ds.query(`INSERT INTO password_resets (token_hash, user_id, expires_at) VALUES ($1, $2, now() + interval '1 hour')`, [hash, me.user.id]);
    expect(hashSecretToken(token)).toBe(hash);
    expect((await change(me.c, { currentPassword: TEST_PASSWORD, newPassword: NEW_PASSWORD })).status).toBe(204);
    const reset = await client(t.app).post('/api/auth/password-reset/confirm', { token, password: 'someone else entirely here' });
    expect(reset.status).toBe(400);
    expect(reset.body.error.fieldErrors.token).toBeDefined();
    expect((await login(me.email, NEW_PASSWORD)).status).toBe(200);
  });

  it('when the current password is wrong, then 400 with a field error on it, nothing changes and no device is signed out', async () => {
    const me = await signedInClient(t);
    const phone = await secondSession(t, me.email);
    const res = await change(me.c, { currentPassword: 'not my password at all', newPassword: NEW_PASSWORD });
    expect(res.status).toBe(400);
    expect(res.body.error).toMatchObject({ code: 'validation_failed', fieldErrors: { currentPassword: ['That is not your current password'] } });
    expect((await phone.get('/api/auth/me')).status).toBe(200);
    expect((await login(me.email, TEST_PASSWORD)).status).toBe(200);
    expect((await login(me.email, NEW_PASSWORD)).status).toBe(401);
  });

  it.each([
    [{ currentPassword: TEST_PASSWORD, newPassword: 'short one' }, 'newPassword', 'Use at least 12 characters'],
    [{ currentPassword: TEST_PASSWORD, newPassword: 'x'.repeat(129) }, 'newPassword', 'Use at most 128 characters'],
    [{ currentPassword: TEST_PASSWORD, newPassword: 'password1234' }, 'newPassword', 'This password appears in lists of breached passwords; choose another'],
    [{ currentPassword: TEST_PASSWORD, newPassword: TEST_PASSWORD }, 'newPassword', 'Choose a password other than your current one'],
    [{ currentPassword: '', newPassword: NEW_PASSWORD }, 'currentPassword', 'Enter your current password'],
  ])('when the body is %j, then 400 with the field error on %s and the password is unchanged', async (body, field, message) => {
    const me = await signedInClient(t);
    const res = await change(me.c, body);
    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors[field]).toEqual([message]);
    expect((await login(me.email, TEST_PASSWORD)).status).toBe(200);
  });

  it('when the current password is guessed wrong five times, then the sixth try gets 429 even when right, and sign-in is locked as well', async () => {
    const me = await signedInClient(t);
    for (let i = 0; i < 5; i++) {
      expect((await change(me.c, { currentPassword: `guess number ${i} here`, newPassword: NEW_PASSWORD })).status).toBe(400);
    }
    const blocked = await change(me.c, { currentPassword: TEST_PASSWORD, newPassword: NEW_PASSWORD });
    expect(blocked.status).toBe(429);
    expect(blocked.headers['retry-after']).toMatch(/^\d+$/);
    expect((await login(me.email, TEST_PASSWORD)).status).toBe(429);
  });

  it('when signed out, then 401 and no password is read', async () => {
    const res = await client(t.app).post('/api/auth/me/password', { currentPassword: TEST_PASSWORD, newPassword: NEW_PASSWORD });
    expect(res.status).toBe(401);
  });
});
