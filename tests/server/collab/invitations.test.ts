import { createHash } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { INVITATION_TTL_MS } from '../../../shared/collab/invitation.schema';
import { createInvitation } from '../../../server/features/invitations/invitation.service';
import { captureMail, client, makeTestApp, signedInClient, uniqueEmail, type TestApp } from '../test-app';

let t: TestApp;
const mail = captureMail();
beforeAll(async () => {
  t = await makeTestApp({ mail: mail.settings });
});
afterAll(async () => {
  await t.close();
});

const sql = <T = { id: string }>(text: string, params: unknown[] = []) => t.ds.query(text, params) as Promise<T[]>;

async function shopWithAdmin(name = 'Kettle Lane Chassis Works') {
  const admin = await signedInClient(t, { displayName: 'Dora Vance' });
  const [shop] = await sql(`INSERT INTO shops (name) VALUES ($1) RETURNING id`, [name]);
  await sql(`INSERT INTO shop_members (shop_id, user_id, is_shop_admin) VALUES ($1, $2, true)`, [shop!.id, admin.user.id]);
  return { admin, shopId: shop!.id };
}

async function teamWithCaptain(name = 'Gravel Pit Irregulars') {
  const captain = await signedInClient(t, { displayName: 'Ines Marlow' });
  const [team] = await sql(`INSERT INTO teams (name) VALUES ($1) RETURNING id`, [name]);
  await sql(`INSERT INTO team_members (team_id, user_id, is_captain) VALUES ($1, $2, true)`, [team!.id, captain.user.id]);
  return { captain, teamId: team!.id };
}

/** The last e-mail to this address, and the token its link carries. */
function mailTo(email: string) {
  const message = mail.sent.filter((m) => m.to === email).at(-1);
  expect(message, `an e-mail to ${email}`).toBeDefined();
  const token = /\/invitations\/([A-Za-z0-9_-]+)/.exec(message!.text)?.[1];
  expect(token).toBeDefined();
  return { message: message!, token: token! };
}

const sha256 = (s: string) => createHash('sha256').update(s).digest('hex');

describe('createInvitation', () => {
  it('when a shop admin invites an address, then one e-mail carries a one-time link in its text and HTML, and only the hash is stored', async () => {
    const { admin, shopId } = await shopWithAdmin('Kettle Lane <Chassis> Works');
    const email = uniqueEmail('staff');
    const before = Date.now();
    const result = await createInvitation(t.ds, mail.settings, {
      shopId,
      email: `  ${email.toUpperCase()} `,
      asAdmin: false,
      invitedBy: { id: admin.user.id, displayName: 'Dora Vance' },
    });

    expect(result.email).toBe(email);
    expect(result.asAdmin).toBe(false);
    const ttl = Date.parse(result.expiresAt) - before;
    expect(ttl).toBeGreaterThanOrEqual(INVITATION_TTL_MS - 1000);
    expect(ttl).toBeLessThanOrEqual(INVITATION_TTL_MS + 5000);
    expect(INVITATION_TTL_MS).toBe(7 * 24 * 3600 * 1000);

    const { message, token } = mailTo(email);
    expect(message.subject).toBe('Dora Vance invites you to join Kettle Lane <Chassis> Works on Scrubline');
    const link = `http://scrubline.test/invitations/${token}`;
    expect(message.text).toContain(link);
    expect(message.html).toContain(`href="${link}"`);
    // The shop name is escaped in HTML, never inserted as markup.
    expect(message.html).toContain('Kettle Lane &lt;Chassis&gt; Works');
    expect(message.html).not.toContain('<Chassis>');
    // 32 random bytes in base64url are 43 characters.
    expect(token).toMatch(/^[A-Za-z0-9_-]{43}$/);

    const rows = await sql<{ token_hash: string; email: string }>(`SELECT token_hash, email FROM invitations WHERE shop_id = $1`, [shopId]);
    expect(rows).toEqual([{ token_hash: sha256(token), email }]);
    expect(JSON.stringify(rows)).not.toContain(token);
  });

  it('when the same address is invited to the same shop again, then the older unused link stops working', async () => {
    const { admin, shopId } = await shopWithAdmin();
    const email = uniqueEmail('staff');
    const invitedBy = { id: admin.user.id, displayName: 'Dora Vance' };
    await createInvitation(t.ds, mail.settings, { shopId, email, asAdmin: false, invitedBy });
    const first = mailTo(email).token;
    await createInvitation(t.ds, mail.settings, { shopId, email, asAdmin: true, invitedBy });
    const second = mailTo(email).token;

    expect(second).not.toBe(first);
    expect((await client(t.app).get(`/api/invitations/${first}`)).status).toBe(404);
    const preview = await client(t.app).get(`/api/invitations/${second}`);
    expect(preview.body).toMatchObject({ asAdmin: true, state: 'open' });
    expect(await sql(`SELECT id FROM invitations WHERE shop_id = $1`, [shopId])).toHaveLength(1);
  });

  it('when the shop does not exist, then it answers not found and sends nothing', async () => {
    const before = mail.sent.length;
    await expect(
      createInvitation(t.ds, mail.settings, {
        shopId: '00000000-0000-4000-8000-000000000000',
        email: uniqueEmail(),
        asAdmin: false,
        invitedBy: { id: '00000000-0000-4000-8000-000000000001', displayName: 'Nobody' },
      }),
    ).rejects.toMatchObject({ code: 'not_found' });
    expect(mail.sent.length).toBe(before);
  });
});

describe('POST /api/shops/:shopId/invitations and /api/teams/:teamId/invitations', () => {
  it('when a shop admin invites through the API, then the invitee gets the e-mail with a link to the shop', async () => {
    const { admin, shopId } = await shopWithAdmin('Bramble Alignment');
    const email = uniqueEmail('staff');
    const res = await admin.c.post(`/api/shops/${shopId}/invitations`, { email, asAdmin: true });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ email, asAdmin: true, expiresAt: expect.any(String) });
    const { message, token } = mailTo(email);
    expect(message.subject).toBe('Dora Vance invites you to join Bramble Alignment on Scrubline');
    expect(message.text).toContain('as a shop admin');
    expect((await client(t.app).get(`/api/invitations/${token}`)).body).toMatchObject({ kind: 'shop', name: 'Bramble Alignment' });
  });

  it('when a team captain invites through the API, then the invitee gets the e-mail with a link to the team', async () => {
    const { captain, teamId } = await teamWithCaptain('Cone Counters');
    const email = uniqueEmail('member');
    const res = await captain.c.post(`/api/teams/${teamId}/invitations`, { email });
    expect(res.status).toBe(201);
    const { message, token } = mailTo(email);
    expect(message.subject).toBe('Ines Marlow invites you to join Cone Counters on Scrubline');
    expect(message.text).toContain(`http://scrubline.test/invitations/${token}`);
    expect((await client(t.app).get(`/api/invitations/${token}`)).body).toMatchObject({ kind: 'team', name: 'Cone Counters', asAdmin: false });
  });
});

describe('GET /api/invitations/:token', () => {
  it('when anyone opens an open link, then it shows what, for whom, by whom and until when', async () => {
    const { captain, teamId } = await teamWithCaptain('Slalom Sundays');
    const email = uniqueEmail('member');
    const created = await createInvitation(t.ds, mail.settings, { teamId, email, asAdmin: true, invitedBy: { id: captain.user.id, displayName: 'Ines Marlow' } });
    const res = await client(t.app).get(`/api/invitations/${mailTo(email).token}`);
    expect(res.status).toBe(200);
    expect(res.body).toEqual({
      kind: 'team', name: 'Slalom Sundays', email, asAdmin: true, invitedBy: 'Ines Marlow', expiresAt: created.expiresAt, state: 'open',
    });
  });

  it('when the token is unknown or malformed, then 404 with the error envelope', async () => {
    const unknown = await client(t.app).get(`/api/invitations/${'A'.repeat(43)}`);
    expect(unknown.status).toBe(404);
    expect(unknown.body.error.code).toBe('not_found');
    expect((await client(t.app).get('/api/invitations/short')).status).toBe(404);
    expect((await client(t.app).get(`/api/invitations/${'a'.repeat(40)}%20x`)).status).toBe(404);
  });
});

describe('POST /api/invitations/:token/accept', () => {
  async function invitedToShop(asAdmin = false) {
    const { admin, shopId } = await shopWithAdmin('Torsion Bar Garage');
    const invitee = await signedInClient(t, { displayName: 'Pip Ortega' });
    await createInvitation(t.ds, mail.settings, { shopId, email: invitee.email, asAdmin, invitedBy: { id: admin.user.id, displayName: 'Dora Vance' } });
    return { shopId, invitee, token: mailTo(invitee.email).token };
  }

  it('when the invited account accepts, then it becomes shop staff, the role shows in /api/auth/me, and the link reads as used', async () => {
    const { shopId, invitee, token } = await invitedToShop();
    expect((await invitee.c.get('/api/auth/me')).body.user.roles).toEqual(['driver']);

    const res = await invitee.c.post(`/api/invitations/${token}/accept`);
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ kind: 'shop', id: shopId, name: 'Torsion Bar Garage' });
    expect((await invitee.c.get('/api/auth/me')).body.user.roles).toContain('shop_staff');
    expect(await sql(`SELECT is_shop_admin FROM shop_members WHERE shop_id = $1 AND user_id = $2`, [shopId, invitee.user.id])).toEqual([
      { is_shop_admin: false },
    ]);
    expect((await client(t.app).get(`/api/invitations/${token}`)).body.state).toBe('used');
    const [row] = await sql<{ used_by: string }>(`SELECT used_by FROM invitations WHERE shop_id = $1`, [shopId]);
    expect(row?.used_by).toBe(invitee.user.id);
  });

  it('when a captain invitation is accepted, then the account is captain of the team', async () => {
    const { captain, teamId } = await teamWithCaptain('Pylon Dodgers');
    const invitee = await signedInClient(t, { displayName: 'Sol Brandt' });
    await createInvitation(t.ds, mail.settings, { teamId, email: invitee.email, asAdmin: true, invitedBy: { id: captain.user.id, displayName: 'Ines Marlow' } });
    const res = await invitee.c.post(`/api/invitations/${mailTo(invitee.email).token}/accept`);
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ kind: 'team', id: teamId, name: 'Pylon Dodgers' });
    expect((await invitee.c.get('/api/auth/me')).body.user.roles).toContain('team_captain');
  });

  it('when an existing shop admin accepts a staff invitation, then they stay admin', async () => {
    const { admin, shopId } = await shopWithAdmin();
    await createInvitation(t.ds, mail.settings, { shopId, email: admin.email, asAdmin: false, invitedBy: { id: admin.user.id, displayName: 'Dora Vance' } });
    expect((await admin.c.post(`/api/invitations/${mailTo(admin.email).token}/accept`)).status).toBe(200);
    expect(await sql(`SELECT is_shop_admin FROM shop_members WHERE shop_id = $1 AND user_id = $2`, [shopId, admin.user.id])).toEqual([
      { is_shop_admin: true },
    ]);
  });

  it('when the link is accepted a second time, then 409 with a message and nothing changes', async () => {
    const { invitee, token } = await invitedToShop();
    expect((await invitee.c.post(`/api/invitations/${token}/accept`)).status).toBe(200);
    const again = await invitee.c.post(`/api/invitations/${token}/accept`);
    expect(again.status).toBe(409);
    expect(again.body.error).toMatchObject({ code: 'conflict', message: expect.stringMatching(/already been used/) });
  });

  it('when the invitation has expired, then 410 gone, the preview says expired, and no membership is added', async () => {
    const { shopId, invitee, token } = await invitedToShop();
    await sql(`UPDATE invitations SET expires_at = now() - interval '1 minute' WHERE shop_id = $1`, [shopId]);
    expect((await client(t.app).get(`/api/invitations/${token}`)).body.state).toBe('expired');
    const res = await invitee.c.post(`/api/invitations/${token}/accept`);
    expect(res.status).toBe(410);
    expect(res.body.error).toMatchObject({ code: 'gone', message: expect.stringMatching(/expired/) });
    expect(await sql(`SELECT user_id FROM shop_members WHERE shop_id = $1 AND user_id = $2`, [shopId, invitee.user.id])).toEqual([]);
  });

  it('when another account tries the link, then 403 naming the invited address, and the link still works for the right one', async () => {
    const { invitee, token } = await invitedToShop();
    const stranger = await signedInClient(t, { displayName: 'Other Person' });
    const res = await stranger.c.post(`/api/invitations/${token}/accept`);
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('forbidden');
    expect(res.body.error.message).toContain(invitee.email);
    expect((await stranger.c.get('/api/auth/me')).body.user.roles).toEqual(['driver']);
    expect((await invitee.c.post(`/api/invitations/${token}/accept`)).status).toBe(200);
  });

  it('when nobody is signed in, then 401; when the token is unknown, then 404', async () => {
    const { token } = await invitedToShop();
    expect((await client(t.app).post(`/api/invitations/${token}/accept`)).status).toBe(401);
    const someone = await signedInClient(t);
    expect((await someone.c.post(`/api/invitations/${'B'.repeat(43)}/accept`)).status).toBe(404);
  });
});

describe('an invitation from someone who no longer manages the shop or team', () => {
  /** A team with two captains, the second of whom invites `invitee` as captain through the API. */
  async function secondCaptainInvites() {
    const { captain, teamId } = await teamWithCaptain('Apex Hunters');
    const second = await signedInClient(t, { displayName: 'Rafe Oduya' });
    await sql(`INSERT INTO team_members (team_id, user_id, is_captain) VALUES ($1, $2, true)`, [teamId, second.user.id]);
    const invitee = await signedInClient(t, { displayName: 'Lark Penhale' });
    expect((await second.c.post(`/api/teams/${teamId}/invitations`, { email: invitee.email, asAdmin: true })).status).toBe(201);
    return { captain, second, teamId, invitee, token: mailTo(invitee.email).token };
  }

  const onTeam = (teamId: string, userId: string) => sql(`SELECT is_captain FROM team_members WHERE team_id = $1 AND user_id = $2`, [teamId, userId]);

  it('when the captain who sent it is made a plain member, then the link is withdrawn and accepting it adds no one', async () => {
    const { captain, second, teamId, invitee, token } = await secondCaptainInvites();
    expect((await captain.c.patch(`/api/teams/${teamId}/members/${second.user.id}`, { isCaptain: false })).status).toBe(200);

    expect((await client(t.app).get(`/api/invitations/${token}`)).status).toBe(404);
    expect((await invitee.c.post(`/api/invitations/${token}/accept`)).status).toBe(404);
    expect(await onTeam(teamId, invitee.user.id)).toEqual([]);
  });

  it('when the captain who sent it is taken off the team, then the link is withdrawn, and the other captain\'s own invitations stand', async () => {
    const { captain, second, teamId, invitee, token } = await secondCaptainInvites();
    const other = await signedInClient(t, { displayName: 'Noor Fenwick' });
    expect((await captain.c.post(`/api/teams/${teamId}/invitations`, { email: other.email })).status).toBe(201);
    const othersToken = mailTo(other.email).token;
    expect((await captain.c.delete(`/api/teams/${teamId}/members/${second.user.id}`)).status).toBe(204);

    expect((await invitee.c.post(`/api/invitations/${token}/accept`)).status).toBe(404);
    expect(await onTeam(teamId, invitee.user.id)).toEqual([]);
    expect((await other.c.post(`/api/invitations/${othersToken}/accept`)).status).toBe(200);
    expect(await onTeam(teamId, other.user.id)).toEqual([{ is_captain: false }]);
  });

  it('when the shop admin who sent it is taken off the staff, then the link is withdrawn and accepting it adds no one', async () => {
    const { admin, shopId } = await shopWithAdmin('Bump Steer Bench');
    const second = await signedInClient(t, { displayName: 'Cass Whitlow' });
    await sql(`INSERT INTO shop_members (shop_id, user_id, is_shop_admin) VALUES ($1, $2, true)`, [shopId, second.user.id]);
    const invitee = await signedInClient(t, { displayName: 'Ode Marsh' });
    expect((await second.c.post(`/api/shops/${shopId}/invitations`, { email: invitee.email, asAdmin: true })).status).toBe(201);
    const { token } = mailTo(invitee.email);
    expect((await admin.c.delete(`/api/shops/${shopId}/staff/${second.user.id}`)).status).toBe(204);

    expect((await invitee.c.post(`/api/invitations/${token}/accept`)).status).toBe(404);
    expect(await sql(`SELECT 1 FROM shop_members WHERE shop_id = $1 AND user_id = $2`, [shopId, invitee.user.id])).toEqual([]);
  });

  it('when the sender lost the standing some other way and the link is still there, then accepting it is 410 naming who and what, and adds no one', async () => {
    const { second, teamId, invitee, token } = await secondCaptainInvites();
    // As a database from before invitations were withdrawn with the standing would hold it.
    await sql(`UPDATE team_members SET is_captain = false WHERE team_id = $1 AND user_id = $2`, [teamId, second.user.id]);

    const res = await invitee.c.post(`/api/invitations/${token}/accept`);
    expect(res.status).toBe(410);
    expect(res.body.error).toEqual({
      code: 'gone',
      message: 'This invitation no longer stands: Rafe Oduya is no longer a captain of Apex Hunters. Ask one of its captains for a new one.',
    });
    expect(await onTeam(teamId, invitee.user.id)).toEqual([]);
    expect((await client(t.app).get(`/api/invitations/${token}`)).body.state).toBe('open');
  });
});

describe('accepting while the sender is being taken off', () => {
  /** Waits until some other connection is waiting for a row lock (the request under test has reached it). */
  async function someoneWaitsForALock() {
    for (let i = 0; i < 100; i++) {
      const [row] = await sql<{ n: string }>(`SELECT count(*) AS n FROM pg_stat_activity WHERE wait_event_type = 'Lock' AND datname = current_database()`);
      if (Number(row!.n) > 0) return;
      await new Promise((r) => setTimeout(r, 50));
    }
    throw new Error('no request came to wait for the lock');
  }

  it('when an acceptance comes while a removal holds the team and then withdraws the invitation, then neither deadlocks: the removal goes through and the acceptance finds no invitation', async () => {
    const { teamId } = await teamWithCaptain('Late Apex Club');
    const second = await signedInClient(t, { displayName: 'Rafe Oduya' });
    await sql(`INSERT INTO team_members (team_id, user_id, is_captain) VALUES ($1, $2, true)`, [teamId, second.user.id]);
    const invitee = await signedInClient(t, { displayName: 'Lark Penhale' });
    expect((await second.c.post(`/api/teams/${teamId}/invitations`, { email: invitee.email })).status).toBe(201);
    const { token } = mailTo(invitee.email);

    // The removal, step by step as removeMember takes its locks: the team's row, then the sender's invitations.
    const removal = t.ds.createQueryRunner();
    await removal.connect();
    await removal.startTransaction();
    try {
      await removal.query('SELECT id FROM teams WHERE id = $1 FOR UPDATE', [teamId]);
      const accepting = invitee.c.post(`/api/invitations/${token}/accept`);
      await someoneWaitsForALock();
      await removal.query('DELETE FROM team_members WHERE team_id = $1 AND user_id = $2', [teamId, second.user.id]);
      await removal.query('DELETE FROM invitations WHERE team_id = $1 AND invited_by = $2 AND used_at IS NULL', [teamId, second.user.id]);
      await removal.commitTransaction();

      const res = await accepting;
      expect(res.status, JSON.stringify(res.body)).toBe(404);
    } finally {
      if (removal.isTransactionActive) await removal.rollbackTransaction();
      await removal.release();
    }
    expect(await sql(`SELECT 1 FROM team_members WHERE team_id = $1 AND user_id = $2`, [teamId, invitee.user.id])).toEqual([]);
  });
});
