import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Team, TeamEntry } from '../../../shared/collab/team.schema';
import { makeTestApp, signedInClient, type TestApp } from '../test-app';
import { addCoDriver, anonymous, countOf, expectError, expectFieldErrors, type Client } from '../season/season-fixtures';

let t: TestApp;
beforeAll(async () => {
  t = await makeTestApp();
});
afterAll(async () => {
  await t.close();
});

type Person = Awaited<ReturnType<typeof signedInClient>>;

/** A team made through the API by a new captain. */
async function newTeam(name = 'Cone Dodgers') {
  const captain = await signedInClient(t, { displayName: 'Cass Captain' });
  const res = await captain.c.post('/api/teams', { name });
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return { captain, teamId: res.body.id as string };
}

/** Puts an account on the team directly (invitations are their own feature). */
async function join(teamId: string, who: Person, isCaptain = false) {
  await t.ds.query('INSERT INTO team_members (team_id, user_id, is_captain) VALUES ($1, $2, $3)', [teamId, who.user.id, isCaptain]);
}

async function member(teamId: string, displayName = 'Mo Member') {
  const who = await signedInClient(t, { displayName });
  await join(teamId, who);
  return who;
}

async function carOf(c: Client, name = 'Green hatch', classCode = 'SH') {
  const res = await c.post('/api/cars', { name, classCode });
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return res.body.id as string;
}

const teamOf = async (c: Client, teamId: string) => {
  const res = await c.get(`/api/teams/${teamId}`);
  expect(res.status, JSON.stringify(res.body)).toBe(200);
  return res.body as Team;
};

describe('POST /api/teams and GET /api/teams/mine', () => {
  it('when a driver creates a team, then 201 with them as its captain, and it is listed among their teams only', async () => {
    const { captain, teamId } = await newTeam('  Gravel Rash  ');
    const outsider = await signedInClient(t);
    const team = await teamOf(captain.c, teamId);
    expect(team).toEqual({
      id: teamId,
      name: 'Gravel Rash',
      isCaptain: true,
      members: [{ id: captain.user.id, displayName: 'Cass Captain', isCaptain: true }],
      entries: [],
      pendingInvitations: [],
    });
    const mine = await captain.c.get('/api/teams/mine');
    expect(mine.status).toBe(200);
    expect(mine.body).toEqual({ items: [{ id: teamId, name: 'Gravel Rash', isCaptain: true }], count: 1 });
    expect((await outsider.c.get('/api/teams/mine')).body).toEqual({ items: [], count: 0 });
  });

  it('when the name is blank, too long or missing, then 400 on name and no team is made', async () => {
    const d = await signedInClient(t);
    expectFieldErrors(await d.c.post('/api/teams', { name: '   ' }), ['name']);
    expectFieldErrors(await d.c.post('/api/teams', { name: 'x'.repeat(81) }), ['name']);
    expectFieldErrors(await d.c.post('/api/teams', {}), ['name']);
    expect(await countOf(t, 'SELECT count(*) AS n FROM team_members WHERE user_id = $1', [d.user.id])).toBe(0);
  });

  it('when signed out, then 401 on create, list and read', async () => {
    const { teamId } = await newTeam();
    const anon = anonymous(t);
    expectError(await anon.post('/api/teams', { name: 'Nope' }), 401, 'unauthenticated');
    expectError(await anon.get('/api/teams/mine'), 401, 'unauthenticated');
    expectError(await anon.get(`/api/teams/${teamId}`), 401, 'unauthenticated');
  });
});

describe('GET /api/teams/:teamId', () => {
  it('when a member reads the team, then they see members and entries as captains do, and `mine` marks their own cars', async () => {
    const { captain, teamId } = await newTeam();
    const mo = await member(teamId);
    const carId = await carOf(mo.c, 'Mo\'s hatch');
    expect((await mo.c.post(`/api/teams/${teamId}/entries`, { carId, classCode: 'SH' })).status).toBe(201);

    const asMember = await teamOf(mo.c, teamId);
    const asCaptain = await teamOf(captain.c, teamId);
    expect(asMember.isCaptain).toBe(false);
    expect(asMember.members).toEqual([
      { id: captain.user.id, displayName: 'Cass Captain', isCaptain: true },
      { id: mo.user.id, displayName: 'Mo Member', isCaptain: false },
    ]);
    expect(asCaptain.members).toEqual(asMember.members);
    const entry: Omit<TeamEntry, 'mine'> = {
      car: { id: carId, name: 'Mo\'s hatch', carNumber: null },
      owner: { id: mo.user.id, displayName: 'Mo Member' },
      classCode: 'SH',
      sharing: 'results',
    };
    expect(asMember.entries).toEqual([{ ...entry, mine: true }]);
    expect(asCaptain.entries).toEqual([{ ...entry, mine: false }]);
  });

  it('when invitations are open, used or expired, then captains see only the open ones and members see none', async () => {
    const { captain, teamId } = await newTeam();
    const mo = await member(teamId);
    const add = (email: string, expires: string, used: boolean) =>
      t.ds.query(
        `INSERT INTO invitations (token_hash, team_id, email, as_admin, invited_by, expires_at, used_at)
         VALUES ($1, $2, $3, true, $4, now() + $5::interval, ${used ? 'now()' : 'NULL'})`,
        [randomUUID(), teamId, email, captain.user.id, expires],
      );
    await add('open@example.com', '3 days', false);
    await add('used@example.com', '3 days', true);
    await add('expired@example.com', '-1 hour', false);
    const team = await teamOf(captain.c, teamId);
    expect(team.pendingInvitations).toEqual([{ email: 'open@example.com', asAdmin: true, expiresAt: expect.any(String) }]);
    expect(new Date(team.pendingInvitations[0]!.expiresAt).getTime()).toBeGreaterThan(Date.now());
    expect((await teamOf(mo.c, teamId)).pendingInvitations).toEqual([]);
  });

  it('when an outsider or another team\'s captain asks, then 404; a malformed id is 404 too', async () => {
    const { teamId } = await newTeam();
    const other = await newTeam('Other lot');
    const outsider = await signedInClient(t);
    expectError(await outsider.c.get(`/api/teams/${teamId}`), 404, 'not_found');
    expectError(await other.captain.c.get(`/api/teams/${teamId}`), 404, 'not_found');
    expectError(await outsider.c.get(`/api/teams/${randomUUID()}`), 404, 'not_found');
    expectError(await outsider.c.get('/api/teams/not-a-uuid'), 404, 'not_found');
  });
});

describe('POST /api/teams/:teamId/invitations (refusals)', () => {
  it('when a member invites, then 403; an outsider, 404; nothing is recorded', async () => {
    const { teamId } = await newTeam();
    const mo = await member(teamId);
    const outsider = await signedInClient(t);
    expectError(await mo.c.post(`/api/teams/${teamId}/invitations`, { email: 'friend@example.com' }), 403, 'forbidden');
    expectError(await outsider.c.post(`/api/teams/${teamId}/invitations`, { email: 'friend@example.com' }), 404, 'not_found');
    expect(await countOf(t, 'SELECT count(*) AS n FROM invitations WHERE team_id = $1', [teamId])).toBe(0);
  });

  it('when the captain gives a bad e-mail or a bad asAdmin, then 400 on that field', async () => {
    const { captain, teamId } = await newTeam();
    expectFieldErrors(await captain.c.post(`/api/teams/${teamId}/invitations`, { email: 'not an address' }), ['email']);
    expectFieldErrors(await captain.c.post(`/api/teams/${teamId}/invitations`, {}), ['email']);
    expectFieldErrors(await captain.c.post(`/api/teams/${teamId}/invitations`, { email: 'a@example.com', asAdmin: 'yes' }), ['asAdmin']);
  });

  it.each([
    { role: 'member', asAdmin: false, says: 'Mo Member is already on the team as a member.' },
    { role: 'member', asAdmin: true, says: 'Mo Member is already on the team as a member. To make them a captain, use Make captain in the member list.' },
    { role: 'captain', asAdmin: true, says: 'Mo Member is already on the team as a captain.' },
    { role: 'captain', asAdmin: false, says: 'Mo Member is already on the team as a captain. To make them a member, use Make member in the member list.' },
  ])('when the captain invites a $role already on the team with asAdmin $asAdmin, then 400 on email naming them, their role and, for another role, where to change it; nothing is sent', async ({ role, asAdmin, says }) => {
    const { captain, teamId } = await newTeam();
    const mo = await member(teamId);
    if (role === 'captain') await t.ds.query('UPDATE team_members SET is_captain = true WHERE team_id = $1 AND user_id = $2', [teamId, mo.user.id]);
    const res = await captain.c.post(`/api/teams/${teamId}/invitations`, { email: mo.email.toUpperCase(), asAdmin });
    expect(expectFieldErrors(res, ['email']).email).toEqual([says]);
    expect(res.body.error.message).toBe(says);
    expect(await countOf(t, 'SELECT count(*) AS n FROM invitations WHERE team_id = $1', [teamId])).toBe(0);
  });
});

describe('PATCH /api/teams/:teamId/members/:userId', () => {
  it('when the captain makes a member captain, then both are captains; then either may step down, but not the last', async () => {
    const { captain, teamId } = await newTeam();
    const mo = await member(teamId);
    const promoted = await captain.c.patch(`/api/teams/${teamId}/members/${mo.user.id}`, { isCaptain: true });
    expect(promoted.status, JSON.stringify(promoted.body)).toBe(200);
    expect((promoted.body as Team).members.every((m) => m.isCaptain)).toBe(true);

    // The new captain demotes the first; the team still has one.
    expect((await mo.c.patch(`/api/teams/${teamId}/members/${captain.user.id}`, { isCaptain: false })).status).toBe(200);
    const last = await mo.c.patch(`/api/teams/${teamId}/members/${mo.user.id}`, { isCaptain: false });
    expectError(last, 409, 'conflict');
    expect(last.body.error.message).toMatch(/at least one captain/);
    expect(await countOf(t, 'SELECT count(*) AS n FROM team_members WHERE team_id = $1 AND is_captain', [teamId])).toBe(1);
  });

  it('when a member tries to make themself captain, then 403; an outsider gets 404', async () => {
    const { teamId } = await newTeam();
    const mo = await member(teamId);
    const outsider = await signedInClient(t);
    expectError(await mo.c.patch(`/api/teams/${teamId}/members/${mo.user.id}`, { isCaptain: true }), 403, 'forbidden');
    expectError(await outsider.c.patch(`/api/teams/${teamId}/members/${mo.user.id}`, { isCaptain: true }), 404, 'not_found');
    expect(await countOf(t, 'SELECT count(*) AS n FROM team_members WHERE user_id = $1 AND is_captain', [mo.user.id])).toBe(0);
  });

  it('when the user is not on the team or isCaptain is not a boolean, then 404 or 400', async () => {
    const { captain, teamId } = await newTeam();
    const outsider = await signedInClient(t);
    expectError(await captain.c.patch(`/api/teams/${teamId}/members/${outsider.user.id}`, { isCaptain: true }), 404, 'not_found');
    expectFieldErrors(await captain.c.patch(`/api/teams/${teamId}/members/${captain.user.id}`, { isCaptain: 'yes' }), ['isCaptain']);
  });
});

describe('DELETE /api/teams/:teamId/members/:userId', () => {
  it('when a member leaves, then they are off the team and their cars\' entries go with them, others\' stay', async () => {
    const { captain, teamId } = await newTeam();
    const mo = await member(teamId);
    const moCar = await carOf(mo.c);
    const captainCar = await carOf(captain.c, 'Captain\'s coupe', 'SR');
    expect((await mo.c.post(`/api/teams/${teamId}/entries`, { carId: moCar, classCode: 'SH' })).status).toBe(201);
    expect((await captain.c.post(`/api/teams/${teamId}/entries`, { carId: captainCar, classCode: 'SR' })).status).toBe(201);

    expect((await mo.c.delete(`/api/teams/${teamId}/members/${mo.user.id}`)).status).toBe(204);
    const team = await teamOf(captain.c, teamId);
    expect(team.members.map((m) => m.id)).toEqual([captain.user.id]);
    expect(team.entries.map((e) => e.car.id)).toEqual([captainCar]);
    expectError(await mo.c.get(`/api/teams/${teamId}`), 404, 'not_found');
  });

  it('when a member tries to remove someone else, then 403; the captain may remove them', async () => {
    const { captain, teamId } = await newTeam();
    const mo = await member(teamId);
    const jo = await member(teamId, 'Jo Member');
    expectError(await mo.c.delete(`/api/teams/${teamId}/members/${jo.user.id}`), 403, 'forbidden');
    expect((await captain.c.delete(`/api/teams/${teamId}/members/${jo.user.id}`)).status).toBe(204);
    expect(await countOf(t, 'SELECT count(*) AS n FROM team_members WHERE team_id = $1', [teamId])).toBe(2);
  });

  it('when the last captain tries to leave, then 409 with how to hand over; once another is captain, they can', async () => {
    const { captain, teamId } = await newTeam();
    const mo = await member(teamId);
    const refused = await captain.c.delete(`/api/teams/${teamId}/members/${captain.user.id}`);
    expectError(refused, 409, 'conflict');
    expect(refused.body.error.message).toMatch(/Make another member captain first/);
    expect((await captain.c.patch(`/api/teams/${teamId}/members/${mo.user.id}`, { isCaptain: true })).status).toBe(200);
    expect((await captain.c.delete(`/api/teams/${teamId}/members/${captain.user.id}`)).status).toBe(204);
    expect((await teamOf(mo.c, teamId)).members).toEqual([{ id: mo.user.id, displayName: 'Mo Member', isCaptain: true }]);
  });

  it('when an outsider removes a member, or the captain removes someone not on the team, then 404', async () => {
    const { captain, teamId } = await newTeam();
    const mo = await member(teamId);
    const outsider = await signedInClient(t);
    expectError(await outsider.c.delete(`/api/teams/${teamId}/members/${mo.user.id}`), 404, 'not_found');
    expectError(await captain.c.delete(`/api/teams/${teamId}/members/${outsider.user.id}`), 404, 'not_found');
  });
});

describe('team entries', () => {
  it('when a member enters their own car, then 201 sharing results by default; entering again changes class and sharing (200)', async () => {
    const { teamId } = await newTeam();
    const mo = await member(teamId);
    const carId = await carOf(mo.c);
    const first = await mo.c.post(`/api/teams/${teamId}/entries`, { carId, classCode: ' SH ' });
    expect(first.status, JSON.stringify(first.body)).toBe(201);
    expect(first.body).toMatchObject({ car: { id: carId }, classCode: 'SH', sharing: 'results', mine: true });
    const again = await mo.c.post(`/api/teams/${teamId}/entries`, { carId, classCode: 'STX', sharing: 'results_and_setup' });
    expect(again.status, JSON.stringify(again.body)).toBe(200);
    expect(again.body).toMatchObject({ classCode: 'STX', sharing: 'results_and_setup' });
    expect(await countOf(t, 'SELECT count(*) AS n FROM team_entries WHERE team_id = $1', [teamId])).toBe(1);
  });

  it('when a member enters a car they cannot see, or one that does not exist, then the same 400 on carId, revealing nothing', async () => {
    const { teamId } = await newTeam();
    const mo = await member(teamId);
    const stranger = await signedInClient(t);
    const strangersCar = await carOf(stranger.c, 'Secret racer');
    const hidden = await mo.c.post(`/api/teams/${teamId}/entries`, { carId: strangersCar, classCode: 'SH' });
    const missing = await mo.c.post(`/api/teams/${teamId}/entries`, { carId: randomUUID(), classCode: 'SH' });
    expect(expectFieldErrors(hidden, ['carId']).carId).toEqual(['Pick one of your own cars']);
    expect(missing.body).toEqual(hidden.body);
    expect(JSON.stringify(hidden.body)).not.toContain('Secret racer');
    expect(await countOf(t, 'SELECT count(*) AS n FROM team_entries WHERE team_id = $1', [teamId])).toBe(0);
  });

  it('when a co-driver enters the car they share, then 403: only the owner enters a car', async () => {
    const { teamId } = await newTeam();
    const owner = await signedInClient(t);
    const ownerCar = await carOf(owner.c);
    const co = await addCoDriver(t, { ...owner, carId: ownerCar } as never, 'Cody Driver');
    await join(teamId, co);
    expectError(await co.c.post(`/api/teams/${teamId}/entries`, { carId: ownerCar, classCode: 'SH' }), 403, 'forbidden');
  });

  it('when the class, sharing or car id is bad, then 400 on those fields', async () => {
    const { captain, teamId } = await newTeam();
    const carId = await carOf(captain.c);
    expectFieldErrors(
      await captain.c.post(`/api/teams/${teamId}/entries`, { carId: 'nope', classCode: '', sharing: 'everything' }),
      ['carId', 'classCode', 'sharing'],
    );
    expectFieldErrors(await captain.c.post(`/api/teams/${teamId}/entries`, { carId, classCode: 'X'.repeat(21) }), ['classCode']);
    expectFieldErrors(await captain.c.patch(`/api/teams/${teamId}/entries/${carId}`, { sharing: 'all' }), ['sharing']);
  });

  it('when an outsider enters a car, then 404', async () => {
    const { teamId } = await newTeam();
    const outsider = await signedInClient(t);
    const carId = await carOf(outsider.c);
    expectError(await outsider.c.post(`/api/teams/${teamId}/entries`, { carId, classCode: 'SH' }), 404, 'not_found');
  });

  it('when the owner changes their entry, then it changes; another member may not (403)', async () => {
    const { teamId } = await newTeam();
    const mo = await member(teamId);
    const jo = await member(teamId, 'Jo Member');
    const carId = await carOf(mo.c);
    await mo.c.post(`/api/teams/${teamId}/entries`, { carId, classCode: 'SH' });
    const changed = await mo.c.patch(`/api/teams/${teamId}/entries/${carId}`, { sharing: 'results_and_setup' });
    expect(changed.status, JSON.stringify(changed.body)).toBe(200);
    expect(changed.body).toMatchObject({ classCode: 'SH', sharing: 'results_and_setup', mine: true });
    expectError(await jo.c.patch(`/api/teams/${teamId}/entries/${carId}`, { sharing: 'results' }), 403, 'forbidden');
    expect((await teamOf(mo.c, teamId)).entries[0]!.sharing).toBe('results_and_setup');
  });

  it('when a member withdraws another\'s entry, then 403; the captain or the owner may (204); a missing entry is 404', async () => {
    const { captain, teamId } = await newTeam();
    const mo = await member(teamId);
    const jo = await member(teamId, 'Jo Member');
    const moCar = await carOf(mo.c);
    const joCar = await carOf(jo.c, 'Jo\'s roadster');
    await mo.c.post(`/api/teams/${teamId}/entries`, { carId: moCar, classCode: 'SH' });
    await jo.c.post(`/api/teams/${teamId}/entries`, { carId: joCar, classCode: 'SR' });

    expectError(await jo.c.delete(`/api/teams/${teamId}/entries/${moCar}`), 403, 'forbidden');
    expect((await captain.c.delete(`/api/teams/${teamId}/entries/${moCar}`)).status).toBe(204);
    expect((await jo.c.delete(`/api/teams/${teamId}/entries/${joCar}`)).status).toBe(204);
    expect(await countOf(t, 'SELECT count(*) AS n FROM team_entries WHERE team_id = $1', [teamId])).toBe(0);
    expectError(await jo.c.delete(`/api/teams/${teamId}/entries/${joCar}`), 404, 'not_found');
    expectError(await jo.c.patch(`/api/teams/${teamId}/entries/${joCar}`, { classCode: 'SS' }), 404, 'not_found');
  });
});

describe('class index factors', () => {
  it('when the captain sets factors, then members read them by season; null removes one', async () => {
    const { captain, teamId } = await newTeam();
    const mo = await member(teamId);
    const put = (body: object) => captain.c.put(`/api/teams/${teamId}/factors`, body);
    expect((await put({ season: 2025, classCode: 'SR', factor: 0.84 })).status).toBe(200);
    expect((await put({ season: 2025, classCode: 'SH', factor: 0.81 })).status).toBe(200);
    const latest = await put({ season: 2026, classCode: 'SR', factor: 0.845 });
    expect(latest.body).toEqual({ items: [{ season: 2026, classCode: 'SR', factor: 0.845 }], count: 1 });
    // Setting the same class and season again replaces the factor.
    expect((await put({ season: 2025, classCode: 'SR', factor: 0.842 })).body.items).toEqual([
      { season: 2025, classCode: 'SH', factor: 0.81 },
      { season: 2025, classCode: 'SR', factor: 0.842 },
    ]);

    expect((await mo.c.get(`/api/teams/${teamId}/factors?season=2025`)).body).toEqual({
      items: [{ season: 2025, classCode: 'SH', factor: 0.81 }, { season: 2025, classCode: 'SR', factor: 0.842 }],
      count: 2,
    });
    expect((await mo.c.get(`/api/teams/${teamId}/factors`)).body.count).toBe(3);

    const removed = await put({ season: 2025, classCode: 'SH', factor: null });
    expect(removed.status).toBe(200);
    expect(removed.body.items).toEqual([{ season: 2025, classCode: 'SR', factor: 0.842 }]);
    expect(await countOf(t, 'SELECT count(*) AS n FROM team_class_factors WHERE team_id = $1', [teamId])).toBe(2);
  });

  it('when the captain sets a factor with four decimals, then it is stored and read back as entered, not rounded', async () => {
    const { captain, teamId } = await newTeam();
    const put = await captain.c.put(`/api/teams/${teamId}/factors`, { season: 2026, classCode: 'SR', factor: 0.8535 });
    expect(put.status, JSON.stringify(put.body)).toBe(200);
    expect(put.body.items).toEqual([{ season: 2026, classCode: 'SR', factor: 0.8535 }]);
    expect((await captain.c.get(`/api/teams/${teamId}/factors?season=2026`)).body.items).toEqual([{ season: 2026, classCode: 'SR', factor: 0.8535 }]);
  });

  it('when a new team is read, then it has no factors: none ship with the app', async () => {
    const { captain, teamId } = await newTeam();
    expect((await captain.c.get(`/api/teams/${teamId}/factors`)).body).toEqual({ items: [], count: 0 });
  });

  it('when a member sets a factor, then 403; an outsider reading or setting them gets 404', async () => {
    const { teamId } = await newTeam();
    const mo = await member(teamId);
    const outsider = await signedInClient(t);
    const body = { season: 2025, classCode: 'SR', factor: 0.9 };
    expectError(await mo.c.put(`/api/teams/${teamId}/factors`, body), 403, 'forbidden');
    expectError(await outsider.c.put(`/api/teams/${teamId}/factors`, body), 404, 'not_found');
    expectError(await outsider.c.get(`/api/teams/${teamId}/factors`), 404, 'not_found');
    expect(await countOf(t, 'SELECT count(*) AS n FROM team_class_factors WHERE team_id = $1', [teamId])).toBe(0);
  });

  it.each([
    { body: { season: 2025, classCode: 'SR', factor: 0 }, fields: ['factor'] },
    { body: { season: 2025, classCode: 'SR', factor: -0.5 }, fields: ['factor'] },
    { body: { season: 2025, classCode: 'SR', factor: 2.01 }, fields: ['factor'] },
    { body: { season: 2025, classCode: 'SR', factor: 0.85351 }, fields: ['factor'] },
    { body: { season: 2025, classCode: 'SR', factor: 'fast' }, fields: ['factor'] },
    { body: { season: 2025, classCode: 'SR' }, fields: ['factor'] },
    { body: { season: 1800, classCode: 'SR', factor: 0.9 }, fields: ['season'] },
    { body: { season: 2025.5, classCode: 'SR', factor: 0.9 }, fields: ['season'] },
    { body: { season: 2025, classCode: '  ', factor: 0.9 }, fields: ['classCode'] },
    { body: { classCode: 'SR', factor: 0.9, extra: 1 }, fields: ['season', 'extra'] },
  ])('when the captain sends $body, then 400 on $fields and nothing is stored', async ({ body, fields }) => {
    const { captain, teamId } = await newTeam();
    const res = await captain.c.put(`/api/teams/${teamId}/factors`, body);
    expect(res.status, JSON.stringify(res.body)).toBe(400);
    expect(Object.keys(res.body.error.fieldErrors).sort()).toEqual([...fields].sort());
    for (const f of fields) expect(res.body.error.fieldErrors?.[f]?.length, f).toBeGreaterThan(0);
    expect(await countOf(t, 'SELECT count(*) AS n FROM team_class_factors WHERE team_id = $1', [teamId])).toBe(0);
  });

  it('when the season in the query is not a year, then 400 on season', async () => {
    const { captain, teamId } = await newTeam();
    expectFieldErrors(await captain.c.get(`/api/teams/${teamId}/factors?season=soon`), ['season']);
  });
});
