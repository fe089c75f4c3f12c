import { createHash, randomUUID } from 'node:crypto';
import argon2 from 'argon2';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { PASSWORD_RESET_TTL_MS } from '../../../shared/collab/invitation.schema';
import { captureMail, client, makeTestApp, signedInClient, TEST_PASSWORD, uniqueEmail, type TestApp } from '../test-app';

let t: TestApp;
const mail = captureMail();
beforeAll(async () => {
  t = await makeTestApp({ mail: mail.settings });
});
afterAll(async () => {
  await t.close();
});

const NEW_PASSWORD = 'tread-depth-seven-thirtyseconds';
const sql = <T>(text: string, params: unknown[] = []) => t.ds.query(text, params) as Promise<T[]>;
const sha256 = (s: string) => createHash('sha256').update(s).digest('hex');

const requestReset = (email: string, app = t) => client(app.app).post('/api/auth/password-reset', { email });
const confirm = (token: string, password = NEW_PASSWORD) => client(t.app).post('/api/auth/password-reset/confirm', { token, password });
const login = (email: string, password: string) => client(t.app).post('/api/auth/login', { email, password });

function linkTo(email: string) {
  const message = mail.sent.filter((m) => m.to === email).at(-1);
  expect(message, `an e-mail to ${email}`).toBeDefined();
  const token = /\/reset-password\?token=([A-Za-z0-9_-]+)/.exec(message!.text)?.[1];
  expect(token).toBeDefined();
  return { message: message!, token: token! };
}

/** A signed-in account that asked for a reset, and the token from its e-mail. */
async function accountWithLink() {
  const account = await signedInClient(t, { displayName: 'Maren Holt' });
  expect((await requestReset(account.email)).status).toBe(202);
  return { ...account, ...linkTo(account.email) };
}

describe('POST /api/auth/password-reset', () => {
  it('when the address has an account or not, then the answer is the same 202, and only the account gets an e-mail', async () => {
    const account = await signedInClient(t);
    const nobody = uniqueEmail('nobody');
    const before = mail.sent.length;
    const known = await requestReset(account.email.toUpperCase());
    const unknown = await requestReset(nobody);

    expect(known.status).toBe(202);
    expect(unknown.status).toBe(202);
    expect(known.body).toEqual(unknown.body);
    expect(known.body.message).toMatch(/If an account uses that address/);
    expect(mail.sent.slice(before).map((m) => m.to)).toEqual([account.email]);
  });

  it('when an account asks, then the e-mail links to /reset-password with a token, in text and HTML, valid one hour, stored only as a hash', async () => {
    const before = Date.now();
    const { message, token, user } = await accountWithLink();
    const link = `http://scrubline.test/reset-password?token=${token}`;
    expect(message.subject).toBe('Choose a new Scrubline password');
    expect(message.text).toContain(link);
    expect(message.html).toContain(`href="${link}"`);
    expect(message.text).toMatch(/one hour/);
    expect(message.unsubscribeUrl).toBeUndefined();

    const rows = await sql<{ token_hash: string; expires_at: Date; used_at: Date | null }>(
      `SELECT token_hash, expires_at, used_at FROM password_resets WHERE user_id = $1`,
      [user.id],
    );
    expect(rows).toHaveLength(1);
    expect(rows[0]!.token_hash).toBe(sha256(token));
    expect(rows[0]!.used_at).toBeNull();
    const ttl = new Date(rows[0]!.expires_at).getTime() - before;
    expect(PASSWORD_RESET_TTL_MS).toBe(3600 * 1000);
    expect(ttl).toBeGreaterThanOrEqual(PASSWORD_RESET_TTL_MS - 1000);
    expect(ttl).toBeLessThanOrEqual(PASSWORD_RESET_TTL_MS + 5000);
  });

  it('when the e-mail is not an address, then 400 with a field error', async () => {
    const res = await client(t.app).post('/api/auth/password-reset', { email: 'not-an-address' });
    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors.email).toBeDefined();
  });

  it('when one address is asked for too often, then 429 with Retry-After, and other addresses still work', async () => {
    const limited = await makeTestApp({ mail: mail.settings, authLimits: { resetPerEmail: 2, keyPrefix: `reset-${randomUUID()}` } });
    try {
      const email = uniqueEmail('nobody');
      for (let i = 0; i < 2; i++) expect((await requestReset(email, limited)).status).toBe(202);
      const blocked = await requestReset(email, limited);
      expect(blocked.status).toBe(429);
      expect(blocked.body.error.code).toBe('rate_limited');
      expect(Number(blocked.headers['retry-after'])).toBeGreaterThan(0);
      expect((await requestReset(uniqueEmail('nobody'), limited)).status).toBe(202);
    } finally {
      await limited.close();
    }
  });

  it('when one IP asks too often across addresses, then 429', async () => {
    const limited = await makeTestApp({ mail: mail.settings, authLimits: { resetPerIp: 3, keyPrefix: `reset-${randomUUID()}` } });
    try {
      for (let i = 0; i < 3; i++) expect((await requestReset(uniqueEmail('nobody'), limited)).status).toBe(202);
      expect((await requestReset(uniqueEmail('nobody'), limited)).status).toBe(429);
    } finally {
      await limited.close();
    }
  });
});

describe('POST /api/auth/password-reset/confirm', () => {
  it('when the link is used, then the new password works, the old one does not, and it is stored as argon2id', async () => {
    const { token, email, user } = await accountWithLink();
    const res = await confirm(token);
    expect(res.status).toBe(204);
    expect((await login(email, TEST_PASSWORD)).status).toBe(401);
    expect((await login(email, NEW_PASSWORD)).status).toBe(200);
    const [row] = await sql<{ password_hash: string }>(`SELECT password_hash FROM users WHERE id = $1`, [user.id]);
    expect(row!.password_hash).toMatch(/^\$argon2id\$/);
    expect(await argon2.verify(row!.password_hash, NEW_PASSWORD)).toBe(true);
  });

  it('when the password is reset, then every existing session of the account ends, other accounts keep theirs', async () => {
    const { token, c, email } = await accountWithLink();
    const secondDevice = client(t.app);
    expect((await secondDevice.post('/api/auth/login', { email, password: TEST_PASSWORD })).status).toBe(200);
    const bystander = await signedInClient(t);
    expect((await c.get('/api/auth/me')).status).toBe(200);

    expect((await confirm(token)).status).toBe(204);
    expect((await c.get('/api/auth/me')).status).toBe(401);
    expect((await secondDevice.get('/api/auth/me')).status).toBe(401);
    expect((await bystander.c.get('/api/auth/me')).status).toBe(200);
  });

  it('when the request comes from a signed-in browser of the account, then that session ends too', async () => {
    const { token, c } = await accountWithLink();
    const res = await c.post('/api/auth/password-reset/confirm', { token, password: NEW_PASSWORD });
    expect(res.status).toBe(204);
    expect((await c.get('/api/auth/me')).status).toBe(401);
  });

  it('when the same link is used twice, then the second time is 400 with a field error on token', async () => {
    const { token, email } = await accountWithLink();
    expect((await confirm(token)).status).toBe(204);
    const again = await confirm(token, 'another-long-passphrase-entirely');
    expect(again.status).toBe(400);
    expect(again.body.error.code).toBe('validation_failed');
    expect(again.body.error.fieldErrors.token).toEqual([expect.stringMatching(/expired or was already used/)]);
    expect((await login(email, NEW_PASSWORD)).status).toBe(200);
  });

  it('when a newer link was used, then the older unused link no longer works', async () => {
    const { token: older, email } = await accountWithLink();
    await requestReset(email);
    const { token: newer } = linkTo(email);
    expect(newer).not.toBe(older);
    expect((await confirm(newer)).status).toBe(204);
    expect((await confirm(older, 'another-long-passphrase-entirely')).status).toBe(400);
  });

  it('when the link is older than one hour, then 400 on token and the password stays', async () => {
    const { token, email, user } = await accountWithLink();
    await sql(`UPDATE password_resets SET expires_at = now() - interval '1 second' WHERE user_id = $1`, [user.id]);
    const res = await confirm(token);
    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors.token).toBeDefined();
    expect((await login(email, TEST_PASSWORD)).status).toBe(200);
  });

  it('when the token is unknown, then 400 on token', async () => {
    const res = await confirm('C'.repeat(43));
    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors.token).toEqual([expect.stringMatching(/expired or was already used/)]);
  });

  it('when the new password is too short or breached, then 400 on password and the link still works', async () => {
    const { token, email } = await accountWithLink();
    const short = await confirm(token, 'short-pw');
    expect(short.status).toBe(400);
    expect(short.body.error.fieldErrors.password).toEqual([expect.stringMatching(/12/)]);
    const breached = await confirm(token, 'password1234');
    expect(breached.status).toBe(400);
    expect(breached.body.error.fieldErrors.password).toBeDefined();
    expect((await confirm(token)).status).toBe(204);
    expect((await login(email, NEW_PASSWORD)).status).toBe(200);
  });

  it('when the account was locked by failed sign-ins, then the new password lets them in', async () => {
    const limited = await makeTestApp({ mail: mail.settings, authLimits: { loginPerAccount: 2, keyPrefix: `reset-${randomUUID()}` } });
    try {
      const { email } = await signedInClient(limited);
      for (let i = 0; i < 2; i++) await client(limited.app).post('/api/auth/login', { email, password: 'wrong-password-xyz' });
      expect((await client(limited.app).post('/api/auth/login', { email, password: TEST_PASSWORD })).status).toBe(429);
      await requestReset(email, limited);
      const { token } = linkTo(email);
      expect((await client(limited.app).post('/api/auth/password-reset/confirm', { token, password: NEW_PASSWORD })).status).toBe(204);
      expect((await client(limited.app).post('/api/auth/login', { email, password: NEW_PASSWORD })).status).toBe(200);
    } finally {
      await limited.close();
    }
  });
});
