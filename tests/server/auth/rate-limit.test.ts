import { randomUUID } from 'node:crypto';
import { afterEach, describe, expect, it } from 'vitest';
import { client, makeTestApp, TEST_PASSWORD, uniqueEmail, type TestApp, type TestAppOptions } from '../test-app';
import { createUser } from '../../../server/features/users/user.service';

const opened: TestApp[] = [];
afterEach(async () => {
  await Promise.all(opened.splice(0).map((t) => t.close()));
});
async function app(limits: TestAppOptions['authLimits']) {
  const t = await makeTestApp({ authLimits: limits });
  opened.push(t);
  return t;
}

const login = (t: TestApp, email: string, password: string) => client(t.app).post('/api/auth/login', { email, password });

describe('sign-in rate limit', () => {
  it('when an account has too many failed sign-ins, then the next try gets 429 with Retry-After, even with the right password', async () => {
    const t = await app({ loginPerAccount: 3, keyPrefix: `rl-${randomUUID()}` });
    const email = uniqueEmail();
    await createUser(t.ds, { email, password: TEST_PASSWORD, displayName: 'Locked' });
    for (let i = 0; i < 3; i++) expect((await login(t, email, 'wrong-password-xyz')).status).toBe(401);
    const blocked = await login(t, email, TEST_PASSWORD);
    expect(blocked.status).toBe(429);
    expect(blocked.body.error.code).toBe('rate_limited');
    expect(Number(blocked.headers['retry-after'])).toBeGreaterThan(0);
    expect(Number(blocked.headers['retry-after'])).toBeLessThanOrEqual(15 * 60);
  });

  it('when a sign-in succeeds, then the account counter starts again', async () => {
    const t = await app({ loginPerAccount: 3, keyPrefix: `rl-${randomUUID()}` });
    const email = uniqueEmail();
    await createUser(t.ds, { email, password: TEST_PASSWORD, displayName: 'Forgetful' });
    for (let i = 0; i < 2; i++) await login(t, email, 'wrong-password-xyz');
    expect((await login(t, email, TEST_PASSWORD)).status).toBe(200);
    for (let i = 0; i < 2; i++) expect((await login(t, email, 'wrong-password-xyz')).status).toBe(401);
  });

  it('when one IP makes too many attempts across accounts, then it gets 429', async () => {
    const t = await app({ loginPerIp: 4, keyPrefix: `rl-${randomUUID()}` });
    for (let i = 0; i < 4; i++) expect((await login(t, uniqueEmail(), 'wrong-password-xyz')).status).toBe(401);
    expect((await login(t, uniqueEmail(), 'wrong-password-xyz')).status).toBe(429);
  });

  it('when drivers behind one address sign in rightly, then only the failures count against it', async () => {
    // OWASP ASVS 4.0.3 2.2.1: the limit is on failed attempts; a club's paddock Wi-Fi puts many drivers behind one address.
    const t = await app({ loginPerIp: 3, keyPrefix: `rl-${randomUUID()}` });
    const email = uniqueEmail();
    await createUser(t.ds, { email, password: TEST_PASSWORD, displayName: 'Paddock' });
    for (let i = 0; i < 6; i++) expect((await login(t, email, TEST_PASSWORD)).status).toBe(200);
    for (let i = 0; i < 3; i++) expect((await login(t, uniqueEmail(), 'wrong-password-xyz')).status).toBe(401);
    expect((await login(t, email, TEST_PASSWORD)).status).toBe(429);
  });

  it('when the server restarts, then the counters are still there (kept in PostgreSQL)', async () => {
    const keyPrefix = `rl-${randomUUID()}`;
    const first = await app({ loginPerAccount: 2, keyPrefix });
    const email = uniqueEmail();
    await createUser(first.ds, { email, password: TEST_PASSWORD, displayName: 'Restart' });
    await login(first, email, 'wrong-password-xyz');
    await login(first, email, 'wrong-password-xyz');
    await first.close();
    opened.splice(opened.indexOf(first), 1);
    const second = await app({ loginPerAccount: 2, keyPrefix });
    expect((await login(second, email, TEST_PASSWORD)).status).toBe(429);
    const rows = await second.ds.query('SELECT count(*)::int AS n FROM auth_rate_limits WHERE key LIKE $1', [`${keyPrefix}%`]);
    expect(rows[0].n).toBeGreaterThan(0);
  });

  it('when one IP registers too often, then it gets 429', async () => {
    const t = await app({ registerPerIp: 2, keyPrefix: `rl-${randomUUID()}` });
    const reg = () => client(t.app).post('/api/auth/register', { email: uniqueEmail(), password: TEST_PASSWORD, displayName: 'R' });
    expect((await reg()).status).toBe(201);
    expect((await reg()).status).toBe(201);
    const third = await reg();
    expect(third.status).toBe(429);
    expect(third.headers['retry-after']).toBeDefined();
  });
});
