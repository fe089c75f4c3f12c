import { createHash } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { SignedInDevice } from '@shared/auth/account.schema';
import { deviceLabel } from '../../../server/auth/devices';
import { SESSION_USER_SQL } from '../../../server/auth/password';
import { client, makeTestApp, sessionCookie, signedInClient, sidOf, TEST_PASSWORD, type TestApp } from '../test-app';

/**
 * The devices signed in to an account (OWASP ASVS 4.0.3 V3.3.4: users can see their active sessions and,
 * having typed their password again, sign out any or all of them).
 */
let t: TestApp;
beforeAll(async () => {
  t = await makeTestApp({ authLimits: { loginPerAccount: 5 } });
});
afterAll(async () => {
  await t.close();
});

// User-Agent strings as the browsers send them (the formats are documented by each browser's maker).
const ANDROID_CHROME = 'Mozilla/5.0 (Linux; Android 14; Pixel 7) AppleWebKit/537.36 (KHTML, like Gecko) Chrome/126.0.0.0 Mobile Safari/537.36';
const IPHONE_SAFARI = 'Mozilla/5.0 (iPhone; CPU iPhone OS 17_5 like Mac OS X) AppleWebKit/605.1.15 (KHTML, like Gecko) Version/17.5 Mobile/15E148 Safari/604.1';
const LINUX_FIREFOX = 'Mozilla/5.0 (X11; Linux x86_64; rv:128.0) Gecko/20100101 Firefox/128.0';

/** Signs in to the account from a browser that sends this User-Agent; the client and its session id. */
async function signInFrom(email: string, userAgent: string) {
  const c = client(t.app);
  const token = await c.csrf();
  const res = await c.agent.post('/api/auth/login').set('User-Agent', userAgent).set('X-CSRF-Token', token).send({ email, password: TEST_PASSWORD });
  expect(res.status).toBe(200);
  // Signing in gives the session a new id (the cookie this answer sets).
  return { c, sid: sidOf(sessionCookie(res.headers['set-cookie'])!) };
}
const digest = (sid: string) => createHash('sha256').update(sid).digest('hex').slice(0, 32);
const devices = async (c: ReturnType<typeof client>) => {
  const res = await c.get('/api/auth/me/sessions');
  expect(res.status).toBe(200);
  return res.body.items as SignedInDevice[];
};

describe('the devices signed in to an account', () => {
  it.each([
    [ANDROID_CHROME, 'Chrome on Android'],
    [IPHONE_SAFARI, 'Safari on iOS'],
    [LINUX_FIREFOX, 'Firefox on Linux'],
    ['', null],
    [undefined, null],
  ])('when the browser says %j, then the device is called %j', (userAgent, label) => {
    expect(deviceLabel(userAgent)).toBe(label);
  });

  it('when an account is signed in on three devices, then each lists all three, its own first, named by a digest of the session id and never the id', async () => {
    const { email } = await signedInClient(t);
    const phone = await signInFrom(email, ANDROID_CHROME);
    const iphone = await signInFrom(email, IPHONE_SAFARI);
    const laptop = await signInFrom(email, LINUX_FIREFOX);

    const seen = await devices(phone.c);
    // The account's first session (signedInClient's) is a fourth.
    expect(seen).toHaveLength(4);
    expect(seen[0]).toMatchObject({ id: digest(phone.sid), device: 'Chrome on Android', current: true });
    expect(seen.filter((d) => d.current)).toHaveLength(1);
    expect(seen.map((d) => d.device)).toEqual(expect.arrayContaining(['Safari on iOS', 'Firefox on Linux']));
    expect(JSON.stringify(seen)).not.toContain(iphone.sid);
    for (const d of seen) {
      expect(Date.parse(d.signedInAt!)).toBeLessThanOrEqual(Date.now());
      // The last request: the stored expiry less the idle timeout, so about now.
      expect(Math.abs(Date.parse(d.lastActiveAt) - Date.now())).toBeLessThan(60_000);
    }
    expect((await devices(laptop.c))[0]).toMatchObject({ id: digest(laptop.sid), current: true });
  });

  it('when one other device is signed out with the password, then only it is signed out; this one and the rest stay', async () => {
    const { email } = await signedInClient(t);
    const phone = await signInFrom(email, ANDROID_CHROME);
    const iphone = await signInFrom(email, IPHONE_SAFARI);
    const laptop = await signInFrom(email, LINUX_FIREFOX);

    const res = await phone.c.post('/api/auth/me/sessions/end', { password: TEST_PASSWORD, sessionId: digest(iphone.sid) });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body).toEqual({ ended: 1 });
    expect((await iphone.c.get('/api/auth/me')).status).toBe(401);
    expect((await laptop.c.get('/api/auth/me')).status).toBe(200);
    expect((await phone.c.get('/api/auth/me')).status).toBe(200);
    expect((await devices(phone.c)).map((d) => d.id)).not.toContain(digest(iphone.sid));

    // Gone already: 404, and nothing else is touched.
    const again = await phone.c.post('/api/auth/me/sessions/end', { password: TEST_PASSWORD, sessionId: digest(iphone.sid) });
    expect(again.status).toBe(404);
    expect((await laptop.c.get('/api/auth/me')).status).toBe(200);
  });

  it('when every other device is signed out, then only the one asking stays signed in, and its own id cannot be used to end it', async () => {
    const { c: first, email } = await signedInClient(t);
    const phone = await signInFrom(email, ANDROID_CHROME);
    const laptop = await signInFrom(email, LINUX_FIREFOX);

    expect((await phone.c.post('/api/auth/me/sessions/end', { password: TEST_PASSWORD, sessionId: digest(phone.sid) })).status).toBe(404);
    const res = await phone.c.post('/api/auth/me/sessions/end', { password: TEST_PASSWORD });
    expect(res.body).toEqual({ ended: 2 });
    expect((await first.get('/api/auth/me')).status).toBe(401);
    expect((await laptop.c.get('/api/auth/me')).status).toBe(401);
    expect((await phone.c.get('/api/auth/me')).status).toBe(200);
    expect(await devices(phone.c)).toHaveLength(1);
  });

  it('when another account\'s device is named, then it is not found and that account stays signed in', async () => {
    const me = await signedInClient(t);
    const other = await signedInClient(t);
    const theirs = await signInFrom(other.email, IPHONE_SAFARI);
    const res = await me.c.post('/api/auth/me/sessions/end', { password: TEST_PASSWORD, sessionId: digest(theirs.sid) });
    expect(res.status).toBe(404);
    expect((await theirs.c.get('/api/auth/me')).status).toBe(200);
    expect((await devices(me.c)).map((d) => d.id)).not.toContain(digest(theirs.sid));
  });

  it('when the password is wrong, then 400 on the password field, no device is signed out, and five wrong tries lock it like sign-in', async () => {
    const { email } = await signedInClient(t);
    const phone = await signInFrom(email, ANDROID_CHROME);
    const laptop = await signInFrom(email, LINUX_FIREFOX);
    const res = await phone.c.post('/api/auth/me/sessions/end', { password: 'not my password at all' });
    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors).toEqual({ password: ['That is not your password'] });
    expect((await laptop.c.get('/api/auth/me')).status).toBe(200);
    for (let i = 0; i < 4; i++) await phone.c.post('/api/auth/me/sessions/end', { password: `wrong guess ${i}` });
    expect((await phone.c.post('/api/auth/me/sessions/end', { password: TEST_PASSWORD })).status).toBe(429);
    expect((await laptop.c.get('/api/auth/me')).status).toBe(200);
  });

  it.each([
    [{}, 'password', 'Enter your password'],
    [{ password: TEST_PASSWORD, sessionId: 'not-a-digest' }, 'sessionId', 'Choose a device from the list'],
  ])('when the body is %j, then 400 with the field error on %s', async (body, field, message) => {
    const { c } = await signedInClient(t);
    const res = await c.post('/api/auth/me/sessions/end', body);
    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors[field]).toEqual([message]);
  });

  it('when sessions are found by their account, then PostgreSQL can use an index on the account, not read the whole table', async () => {
    const { user } = await signedInClient(t);
    // With sequential scans priced out, the planner still picks one when no index matches the expression.
    const plans = await t.ds.transaction(async (m) => {
      await m.query('SET LOCAL enable_seqscan = off');
      return Promise.all(
        [
          `SELECT sid FROM session WHERE ${SESSION_USER_SQL} = $1 AND expire >= now()`,
          `DELETE FROM session WHERE ${SESSION_USER_SQL} = $1 AND sid IS DISTINCT FROM NULL`,
        ].map(async (sql) => JSON.stringify(await m.query(`EXPLAIN (FORMAT JSON) ${sql}`, [user.id]))),
      );
    });
    for (const plan of plans) {
      expect(plan).toContain('"Index Name":"session_account_idx"');
      expect(plan).not.toContain('Seq Scan');
    }
  });
});
