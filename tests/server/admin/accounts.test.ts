import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ACCOUNT_LIST_LIMIT, type AdminAccount } from '@shared/auth/admin.schema';
import { SUSPENDED_SIGN_IN } from '../../../server/auth/passport';
import { client, makeTestApp, signedInClient, TEST_PASSWORD, type TestApp } from '../test-app';

/**
 * The admin's accounts page: list and search the accounts, suspend one (it cannot sign in, and every
 * device signed in to it is signed out at once), restore it. OWASP ASVS 4.0.3 V4.1.1 and V4.1.3: the
 * checks run on the server, and only the `admin` role reaches them.
 */
let t: TestApp;
beforeAll(async () => {
  t = await makeTestApp({ authLimits: { loginPerAccount: 5 } });
});
afterAll(async () => {
  await t.close();
});

const signIn = async (email: string, password = TEST_PASSWORD) => {
  const c = client(t.app);
  return { c, res: await c.post('/api/auth/login', { email, password }) };
};
const suspendedRow = async (id: string) =>
  (await t.ds.query('SELECT suspended_at, suspended_by, suspension_note FROM users WHERE id = $1', [id]))[0] as {
    suspended_at: Date | null; suspended_by: string | null; suspension_note: string | null;
  };

describe('suspending and restoring an account', () => {
  it('when an admin suspends a driver, then both of the driver’s devices are signed out at once and sign-in is refused with a reason, only once the password is right', async () => {
    const admin = await signedInClient(t, { isAdmin: true });
    const driver = await signedInClient(t, { displayName: 'Suspended Sam' });
    const phone = await signIn(driver.email);
    expect((await phone.c.get('/api/auth/me')).status).toBe(200);

    const res = await admin.c.post(`/api/admin/users/${driver.user.id}/suspend`, { note: '  Shared the account with a stranger  ' });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    const account = res.body as AdminAccount;
    expect(account).toMatchObject({ id: driver.user.id, suspensionNote: 'Shared the account with a stranger', signedInDevices: 0 });
    expect(Math.abs(Date.parse(account.suspendedAt!) - Date.now())).toBeLessThan(60_000);
    expect(await suspendedRow(driver.user.id)).toMatchObject({ suspended_by: admin.user.id });

    expect((await driver.c.get('/api/auth/me')).status).toBe(401);
    expect((await phone.c.get('/api/auth/me')).status).toBe(401);
    const again = await signIn(driver.email);
    expect(again.res.status).toBe(403);
    expect(again.res.body.error).toMatchObject({ code: 'forbidden', message: SUSPENDED_SIGN_IN });
    // A wrong password is told no more than for any account.
    const guess = await signIn(driver.email, 'a wrong guess at the password');
    expect(guess.res.status).toBe(401);
    expect(JSON.stringify(guess.res.body)).not.toContain('suspend');
  });

  it('when an account is marked suspended but a session row of it is left behind, then that session reads as signed out', async () => {
    const driver = await signedInClient(t);
    // As if the delete had been missed (a session written back by a request in flight, say).
    await t.ds.query(`UPDATE users SET suspended_at = now(), suspension_note = 'Left behind' WHERE id = $1`, [driver.user.id]);
    expect((await driver.c.get('/api/auth/me')).status).toBe(401);
    await t.ds.query(`UPDATE users SET suspended_at = NULL, suspension_note = NULL WHERE id = $1`, [driver.user.id]);
  });

  it('when the suspension is restored, then the driver signs in again and the note is gone', async () => {
    const admin = await signedInClient(t, { isAdmin: true });
    const driver = await signedInClient(t);
    await admin.c.post(`/api/admin/users/${driver.user.id}/suspend`, { note: 'Pending a word with the club' });
    expect((await signIn(driver.email)).res.status).toBe(403);

    const res = await admin.c.post(`/api/admin/users/${driver.user.id}/restore`);
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ suspendedAt: null, suspensionNote: null });
    expect(await suspendedRow(driver.user.id)).toEqual({ suspended_at: null, suspended_by: null, suspension_note: null });
    const back = await signIn(driver.email);
    expect(back.res.status).toBe(200);
    expect((await back.c.get('/api/auth/me')).status).toBe(200);
  });

  it('when a suspended account is suspended again, then the note is replaced and the time it began is kept', async () => {
    const admin = await signedInClient(t, { isAdmin: true });
    const driver = await signedInClient(t);
    const first = (await admin.c.post(`/api/admin/users/${driver.user.id}/suspend`, { note: 'First reason' })).body as AdminAccount;
    const second = (await admin.c.post(`/api/admin/users/${driver.user.id}/suspend`, { note: 'Second reason' })).body as AdminAccount;
    expect(second.suspendedAt).toBe(first.suspendedAt);
    expect(second.suspensionNote).toBe('Second reason');
  });

  it('when an admin tries to suspend their own account, then 409 and they stay signed in', async () => {
    const admin = await signedInClient(t, { isAdmin: true });
    const res = await admin.c.post(`/api/admin/users/${admin.user.id}/suspend`, { note: 'Oops' });
    expect(res.status).toBe(409);
    expect(res.body.error.message).toBe('You cannot suspend your own account.');
    expect((await admin.c.get('/api/auth/me')).status).toBe(200);
    expect((await suspendedRow(admin.user.id)).suspended_at).toBeNull();
  });

  it.each([
    [{}, 'Say why, for the next admin who reads this'],
    [{ note: '   ' }, 'Say why, for the next admin who reads this'],
    [{ note: 'x'.repeat(501) }, 'Use at most 500 characters'],
  ])('when the body is %j, then 400 on the note and nothing changes', async (body, message) => {
    const admin = await signedInClient(t, { isAdmin: true });
    const driver = await signedInClient(t);
    const res = await admin.c.post(`/api/admin/users/${driver.user.id}/suspend`, body);
    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors.note).toEqual([message]);
    expect((await driver.c.get('/api/auth/me')).status).toBe(200);
    expect((await suspendedRow(driver.user.id)).suspended_at).toBeNull();
  });

  it('when a driver or a shop’s staff asks to suspend someone, then 403 and nothing changes', async () => {
    const driver = await signedInClient(t);
    const other = await signedInClient(t);
    const res = await driver.c.post(`/api/admin/users/${other.user.id}/suspend`, { note: 'Not theirs to do' });
    expect(res.status).toBe(403);
    expect((await suspendedRow(other.user.id)).suspended_at).toBeNull();
    expect((await other.c.get('/api/auth/me')).status).toBe(200);
  });
});

describe('the list of accounts', () => {
  it('when an admin searches by part of a name or an e-mail, then only those accounts come back, each with its live devices, by name whether suspended or not', async () => {
    const admin = await signedInClient(t, { isAdmin: true });
    const tag = `Quokka${Date.now()}`;
    const a = await signedInClient(t, { displayName: `${tag} Alpha` });
    const b = await signedInClient(t, { displayName: `${tag} Beta` });
    await signIn(b.email);
    await admin.c.post(`/api/admin/users/${b.user.id}/suspend`, { note: 'Test' });
    await signIn(a.email);

    const res = await admin.c.get(`/api/admin/users?q=${encodeURIComponent(tag.toLowerCase())}`);
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ count: 2, total: 2 });
    // Beta is suspended and still comes after Alpha: suspending an account does not move it in the list.
    expect(res.body.items.map((x: AdminAccount) => [x.displayName, x.signedInDevices, x.suspendedAt === null])).toEqual([
      [`${tag} Alpha`, 2, true],
      [`${tag} Beta`, 0, false],
    ]);
    const byMail = await admin.c.get(`/api/admin/users?q=${encodeURIComponent(a.email.toUpperCase())}`);
    expect(byMail.body.items.map((x: AdminAccount) => x.id)).toEqual([a.user.id]);
  });

  it('when more accounts match than one list holds, then the first 100 come back with the number of all that match', async () => {
    const admin = await signedInClient(t, { isAdmin: true });
    const tag = `Wombat${Date.now()}`;
    // Rows made directly (no password needed to list them).
    await t.ds.query(
      `INSERT INTO users (email, display_name, password_hash)
       SELECT lower($1) || '-' || n || '@example.com', $1 || ' ' || lpad(n::text, 3, '0'), 'not-a-hash' FROM generate_series(1, 101) AS n`,
      [tag],
    );
    const res = await admin.c.get(`/api/admin/users?q=${tag}`);
    expect(res.body).toMatchObject({ count: ACCOUNT_LIST_LIMIT, total: 101 });
    expect(res.body.items[0].displayName).toBe(`${tag} 001`);
  });

  it('when the search holds % or _, then they match only themselves', async () => {
    const admin = await signedInClient(t, { isAdmin: true });
    const res = await admin.c.get('/api/admin/users?q=%25');
    expect(res.status).toBe(200);
    expect(res.body.items.every((x: AdminAccount) => `${x.displayName} ${x.email}`.includes('%'))).toBe(true);
  });

  it('when the search is too long, then 400 on q', async () => {
    const admin = await signedInClient(t, { isAdmin: true });
    const res = await admin.c.get(`/api/admin/users?q=${'x'.repeat(81)}`);
    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors.q).toEqual(['Use at most 80 characters']);
  });
});

describe('the admin role', () => {
  it('when an admin gives it to a driver, then the driver is an admin at once; taken back, the admin routes refuse them again', async () => {
    const admin = await signedInClient(t, { isAdmin: true });
    const driver = await signedInClient(t);
    expect((await driver.c.get('/api/admin/users')).status).toBe(403);

    const given = await admin.c.put(`/api/admin/users/${driver.user.id}/admin`, { isAdmin: true });
    expect(given.status).toBe(200);
    expect(given.body.roles).toEqual(['driver', 'admin']);
    // The session reads the account's roles on every request: no new sign-in needed.
    expect((await driver.c.get('/api/auth/me')).body.user.roles).toContain('admin');
    expect((await driver.c.get('/api/admin/users')).status).toBe(200);

    const taken = await admin.c.put(`/api/admin/users/${driver.user.id}/admin`, { isAdmin: false });
    expect(taken.body.roles).toEqual(['driver']);
    expect((await driver.c.get('/api/admin/users')).status).toBe(403);
  });

  it('when the account is suspended, then the role is not given (409, nothing changes) but can still be taken', async () => {
    const admin = await signedInClient(t, { isAdmin: true });
    const driver = await signedInClient(t);
    const other = await signedInClient(t, { isAdmin: true });
    for (const who of [driver, other]) {
      expect((await admin.c.post(`/api/admin/users/${who.user.id}/suspend`, { note: 'Shared a password' })).status).toBe(200);
    }
    const given = await admin.c.put(`/api/admin/users/${driver.user.id}/admin`, { isAdmin: true });
    expect(given.status).toBe(409);
    expect(given.body.error.code).toBe('conflict');
    expect(given.body.error.message).toBe('This account is suspended: restore it before making it an admin.');
    const rows = await t.ds.query('SELECT is_admin FROM users WHERE id = $1', [driver.user.id]);
    expect(rows[0].is_admin).toBe(false);

    const taken = await admin.c.put(`/api/admin/users/${other.user.id}/admin`, { isAdmin: false });
    expect(taken.status).toBe(200);
    expect(taken.body.roles).toEqual(['driver']);
  });

  it('when an admin tries to take the role from themselves, then 409 and they stay an admin', async () => {
    const admin = await signedInClient(t, { isAdmin: true });
    const res = await admin.c.put(`/api/admin/users/${admin.user.id}/admin`, { isAdmin: false });
    expect(res.status).toBe(409);
    expect((await admin.c.get('/api/admin/users')).status).toBe(200);
  });

  it('when the body is not a yes or no, then 400 on isAdmin', async () => {
    const admin = await signedInClient(t, { isAdmin: true });
    const driver = await signedInClient(t);
    const res = await admin.c.put(`/api/admin/users/${driver.user.id}/admin`, { isAdmin: 'yes' });
    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors.isAdmin).toEqual(['Choose yes or no']);
  });
});
