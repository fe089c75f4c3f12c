import type { DataSource } from 'typeorm';
import { hashPassword } from '../auth/password';
import { UserEntity } from '../features/users/user.entity';
import { ShopEntity, ShopMemberEntity } from '../features/shops/shop.entity';
import { TeamEntity, TeamMemberEntity } from '../features/teams/team.entity';
import { DEMO_ACCOUNTS, DEMO_PASSWORD, DEMO_SHOP, DEMO_TEAM } from './demo-accounts';
import { seedDemoSeason } from './demo-season';

/** Fills an empty database with the demo scenario; does nothing when any account exists. */
export async function seedDemoIfEmpty(ds: DataSource): Promise<boolean> {
  const rows = (await ds.query('SELECT count(*)::int AS count FROM users')) as { count: number }[];
  if ((rows[0]?.count ?? 0) > 0) return false;
  await seedDemo(ds);
  return true;
}

export async function seedDemo(ds: DataSource): Promise<void> {
  const passwordHash = await hashPassword(DEMO_PASSWORD);
  await ds.transaction(async (m) => {
    const users = m.getRepository(UserEntity);
    const ids = {} as Record<keyof typeof DEMO_ACCOUNTS, string>;
    for (const [key, account] of Object.entries(DEMO_ACCOUNTS) as [keyof typeof DEMO_ACCOUNTS, (typeof DEMO_ACCOUNTS)[keyof typeof DEMO_ACCOUNTS]][]) {
      const saved = await users.save(
        users.create({ email: account.email, displayName: account.displayName, passwordHash, isAdmin: key === 'admin' }),
      );
      ids[key] = saved.id;
    }
    const shop = await m.getRepository(ShopEntity).save({ name: DEMO_SHOP });
    await m.getRepository(ShopMemberEntity).save({ shopId: shop.id, userId: ids.shopStaff, isShopAdmin: true });

    const team = await m.getRepository(TeamEntity).save({ name: DEMO_TEAM });
    await m.getRepository(TeamMemberEntity).save([
      { teamId: team.id, userId: ids.captain, isCaptain: true },
      { teamId: team.id, userId: ids.driver, isCaptain: false },
      { teamId: team.id, userId: ids.secondDriver, isCaptain: false },
    ]);
    await seedDemoSeason(m, {
      driver: ids.driver,
      coDriver: ids.coDriver,
      secondDriver: ids.secondDriver,
      shopStaff: ids.shopStaff,
      teamId: team.id,
    });
  });
}
