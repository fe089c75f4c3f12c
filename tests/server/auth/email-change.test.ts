import { createHash } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { EMAIL_CHANGE_TTL_MS } from '../../../shared/auth/account.schema';
import { ADDRESS_TAKEN, LINK_UNUSABLE, SAME_ADDRESS, WRONG_PASSWORD } from '../../../server/auth/email-change';
import { captureMail, client, makeTestApp, signedInClient, TEST_PASSWORD, uniqueEmail, type TestApp } from '../test-app';

/**
 * Changing the sign-in address (OWASP ASVS 4.0.3 V3.7.1: the password again before a change to the
 * account's identity; V2.5.x-style links: random, stored as a hash, single use, time-limited).
 */
let t: TestApp;
const mail = captureMail();
beforeAll(async () => {
  t = await makeTestApp({ mail: mail.settings, authLimits: { loginPerAccount: 5 } });
});
afterAll(async () => {
  await t.close();
});

const sha256 = (s: string) => createHash('sha256').update(s).digest('hex');
const login = (email: string, password = TEST_PASSWORD) => client(t.app).post('/api/auth/login', { email, password });

function linkSentTo(email: string) {
  const message = mail.sent.filter((m) => m.to === email).at(-1);
  expect(message, `an e-mail to ${email}`).toBeDefined();
  const token = /\/settings\?email-link=([A-Za-z0-9_-]+)/.exec(message!.text)?.[1];
  expect(token).toBeDefined();
  return { message: message!, token: token! };
}

/** A signed-in account that asked to move to a fresh address, and the link's secret. */
async function accountAskingToMove() {
  const account = await signedInClient(t, { displayName: 'Maren Holt' });
  const newEmail = uniqueEmail('moved');
  const res = await account.c.post('/api/auth/me/email', { newEmail, password: TEST_PASSWORD });
  expect(res.status, JSON.stringify(res.body)).toBe(202);
  return { ...account, newEmail, res, ...linkSentTo(newEmail) };
}

describe('asking for a new sign-in address', () => {
  it('when the password is right, then a link goes to the new address, a warning to the old one, and nothing changes yet', async () => {
    const before = Date.now();
    const { c, email, newEmail, res, message, token, user } = await accountAskingToMove();
    expect(res.body.pending.email).toBe(newEmail);
    expect(Date.parse(res.body.pending.expiresAt) - before).toBeGreaterThanOrEqual(EMAIL_CHANGE_TTL_MS - 1000);

    expect(message.subject).toBe('Confirm your new Scrubline address');
    expect(message.text).toContain(`http://scrubline.test/settings?email-link=${token}`);
    const warning = mail.sent.filter((m) => m.to === email).at(-1)!;
    expect(warning.subject).toBe('Your Scrubline address is about to change');
    expect(warning.text).toContain(newEmail);
    expect(warning.text).not.toContain(token);

    // Only the secret's hash is stored.
    const rows: { token_hash: string }[] = await t.ds.query('SELECT token_hash FROM email_changes WHERE user_id = $1', [user.id]);
    expect(rows.map((r) => r.token_hash)).toEqual([sha256(token)]);
    // The old address still signs in; the new one does not yet.
    expect((await login(email)).status).toBe(200);
    expect((await login(newEmail)).status).toBe(401);
    expect((await c.get('/api/auth/me/email')).body).toEqual({ pending: res.body.pending });
  });

  it('when the password is wrong, then 400 on the password, no link is sent, and five wrong tries lock it like sign-in', async () => {
    const { c, email } = await signedInClient(t);
    const newEmail = uniqueEmail('never');
    const res = await c.post('/api/auth/me/email', { newEmail, password: 'not my password at all' });
    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors).toEqual({ password: [WRONG_PASSWORD] });
    expect(mail.sent.some((m) => m.to === newEmail)).toBe(false);
    for (let i = 0; i < 4; i++) await c.post('/api/auth/me/email', { newEmail, password: `wrong guess ${i}` });
    expect((await c.post('/api/auth/me/email', { newEmail, password: TEST_PASSWORD })).status).toBe(429);
    expect((await login(email)).status).toBe(429);
  });

  it('when the address is another account’s, or already this one’s, then the new address field says so and nothing is stored', async () => {
    const { c, email, user } = await signedInClient(t);
    const other = await signedInClient(t);
    const taken = await c.post('/api/auth/me/email', { newEmail: other.email.toUpperCase(), password: TEST_PASSWORD });
    expect(taken.status).toBe(409);
    expect(taken.body.error.fieldErrors).toEqual({ newEmail: [ADDRESS_TAKEN] });
    const same = await c.post('/api/auth/me/email', { newEmail: ` ${email} `, password: TEST_PASSWORD });
    expect(same.status).toBe(400);
    expect(same.body.error.fieldErrors).toEqual({ newEmail: [SAME_ADDRESS] });
    // Not a wrong password: five of these do not lock the account.
    for (let i = 0; i < 5; i++) await c.post('/api/auth/me/email', { newEmail: email, password: TEST_PASSWORD });
    expect((await login(email)).status).toBe(200);
    expect(await t.ds.query('SELECT 1 FROM email_changes WHERE user_id = $1', [user.id])).toEqual([]);
  });

  it.each([
    [{ password: TEST_PASSWORD }, 'newEmail', 'Enter your e-mail address'],
    [{ newEmail: 'not an address', password: TEST_PASSWORD }, 'newEmail', 'Enter a valid e-mail address'],
    [{ newEmail: 'fine@example.com' }, 'password', 'Enter your password'],
  ])('when the body is %j, then 400 with the field error on %s', async (body, field, message) => {
    const { c } = await signedInClient(t);
    const res = await c.post('/api/auth/me/email', body);
    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors[field]).toEqual([message]);
  });
});

describe('opening the link', () => {
  it('when the account that asked opens it, then it signs in with the new address only, and the link works once', async () => {
    const { c, email, newEmail, token } = await accountAskingToMove();
    const res = await c.post('/api/auth/me/email/confirm', { token });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body.user.email).toBe(newEmail);
    expect((await c.get('/api/auth/me')).body.user.email).toBe(newEmail);
    expect((await login(newEmail)).status).toBe(200);
    expect((await login(email)).status).toBe(401);
    expect((await c.get('/api/auth/me/email')).body).toEqual({ pending: null });

    const again = await c.post('/api/auth/me/email/confirm', { token });
    expect(again.status).toBe(400);
    expect(again.body.error.fieldErrors).toEqual({ token: [LINK_UNUSABLE] });
  });

  it('when another account opens it, then 400 and neither address changes', async () => {
    const { email, token, user } = await accountAskingToMove();
    const stranger = await signedInClient(t);
    const res = await stranger.c.post('/api/auth/me/email/confirm', { token });
    expect(res.status).toBe(400);
    const rows: { email: string }[] = await t.ds.query('SELECT email FROM users WHERE id = ANY($1) ORDER BY id = $2 DESC', [[user.id, stranger.user.id], user.id]);
    expect(rows.map((r) => r.email)).toEqual([email, stranger.email]);
  });

  it('when it is over a day old, or a newer request was made, then it no longer works', async () => {
    const first = await accountAskingToMove();
    await t.ds.query(`UPDATE email_changes SET expires_at = now() - interval '1 second' WHERE token_hash = $1`, [sha256(first.token)]);
    expect((await first.c.post('/api/auth/me/email/confirm', { token: first.token })).status).toBe(400);

    const second = await accountAskingToMove();
    const newer = uniqueEmail('newer');
    await second.c.post('/api/auth/me/email', { newEmail: newer, password: TEST_PASSWORD });
    expect((await second.c.post('/api/auth/me/email/confirm', { token: second.token })).status).toBe(400);
    expect((await second.c.post('/api/auth/me/email/confirm', { token: linkSentTo(newer).token })).status).toBe(200);
  });

  it('when the password is changed after the request, then the link no longer works', async () => {
    const { c, token } = await accountAskingToMove();
    const changed = await c.post('/api/auth/me/password', { currentPassword: TEST_PASSWORD, newPassword: 'a different long pass phrase' });
    expect(changed.status).toBe(204);
    expect((await c.post('/api/auth/me/email/confirm', { token })).status).toBe(400);
  });

  it('when someone registers the address before the link is opened, then 409 on the address and the account keeps its old one', async () => {
    const { c, email, newEmail, token } = await accountAskingToMove();
    const reg = await client(t.app).post('/api/auth/register', { email: newEmail, password: 'someone elses pass phrase', displayName: 'Quick Registrant' });
    expect(reg.status).toBe(201);
    const res = await c.post('/api/auth/me/email/confirm', { token });
    expect(res.status).toBe(409);
    expect((await c.get('/api/auth/me')).body.user.email).toBe(email);
  });
});
