import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { makeTestApp, signedInClient, type TestApp } from '../test-app';
import { ShopEntity, ShopMemberEntity } from '../../../server/features/shops/shop.entity';
import { TeamEntity, TeamMemberEntity } from '../../../server/features/teams/team.entity';

let t: TestApp;
beforeAll(async () => {
  t = await makeTestApp();
});
afterAll(async () => {
  await t.close();
});

describe('role check on /api/admin', () => {
  it('when signed out, then 401', async () => {
    expect((await request(t.app).get('/api/admin/users')).status).toBe(401);
  });

  it('when a driver asks, then 403 forbidden', async () => {
    const { c } = await signedInClient(t);
    const res = await c.get('/api/admin/users');
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('forbidden');
  });

  it('when an admin asks, then 200 with accounts and their roles, and no password hashes', async () => {
    const { c, user } = await signedInClient(t, { isAdmin: true });
    expect(user.roles).toEqual(['driver', 'admin']);
    // Searched by its address: the test database holds every test's accounts, more than one page of them.
    const res = await c.get(`/api/admin/users?q=${encodeURIComponent(user.email)}`);
    expect(res.status).toBe(200);
    expect(res.body.count).toBe(res.body.items.length);
    expect(res.body.items).toContainEqual(
      expect.objectContaining({ id: user.id, email: user.email, displayName: user.displayName, roles: ['driver', 'admin'], suspendedAt: null }),
    );
    expect(JSON.stringify(res.body)).not.toMatch(/argon2|passwordHash/);
  });
});

describe('roles from memberships', () => {
  it('when a user joins a shop and captains a team, then /me lists shop_staff and team_captain', async () => {
    const { c, user } = await signedInClient(t);
    const shop = await t.ds.getRepository(ShopEntity).save({ name: 'Test Shop' });
    await t.ds.getRepository(ShopMemberEntity).save({ shopId: shop.id, userId: user.id });
    const team = await t.ds.getRepository(TeamEntity).save({ name: 'Test Team' });
    await t.ds.getRepository(TeamMemberEntity).save({ teamId: team.id, userId: user.id, isCaptain: true });
    const me = await c.get('/api/auth/me');
    expect(me.body.user.roles).toEqual(['driver', 'shop_staff', 'team_captain']);
  });

  it('when a team member is not captain, then they are not team_captain', async () => {
    const { c, user } = await signedInClient(t);
    const team = await t.ds.getRepository(TeamEntity).save({ name: 'Other Team' });
    await t.ds.getRepository(TeamMemberEntity).save({ teamId: team.id, userId: user.id, isCaptain: false });
    expect((await c.get('/api/auth/me')).body.user.roles).toEqual(['driver']);
  });
});
