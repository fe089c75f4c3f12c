import type { DataSource, EntityManager } from 'typeorm';
import { hashPassword } from '../auth/password';
import { UserEntity } from '../features/users/user.entity';
import { ShopEntity, ShopMemberEntity } from '../features/shops/shop.entity';
import { TeamEntity, TeamMemberEntity } from '../features/teams/team.entity';
import { DEMO_ACCOUNTS, DEMO_CLASS_FACTORS, DEMO_PASSWORD, DEMO_SEASON_YEAR, DEMO_SHOP, DEMO_TEAM } from './demo-accounts';
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
    await seedDemoCollaboration(m, ids, shop.id, team.id);
  });
}

/**
 * Who shares what in the demo: Maren lets the shop see Pebble; both demo cars are entered
 * in the team, Pebble with its setup shared. The captain has entered this season's class
 * factors for the team's own reckoning (invented numbers, as the app ships none).
 */
async function seedDemoCollaboration(
  m: EntityManager,
  ids: Record<keyof typeof DEMO_ACCOUNTS, string>,
  shopId: string,
  teamId: string,
): Promise<void> {
  const cars: { id: string; owner_id: string; class_code: string }[] = await m.query(
    'SELECT id, owner_id, class_code FROM cars WHERE owner_id = ANY($1) ORDER BY created_at',
    [[ids.driver, ids.secondDriver]],
  );
  const pebble = cars.find((c) => c.owner_id === ids.driver)!;
  await m.query('INSERT INTO shop_grants (car_id, shop_id, granted_by) VALUES ($1, $2, $3)', [pebble.id, shopId, ids.driver]);
  for (const car of cars) {
    await m.query(
      'INSERT INTO team_entries (team_id, car_id, class_code, sharing, entered_by) VALUES ($1, $2, $3, $4, $5)',
      [teamId, car.id, car.class_code, car.owner_id === ids.driver ? 'results_and_setup' : 'results', car.owner_id],
    );
  }
  for (const [classCode, factor] of DEMO_CLASS_FACTORS) {
    await m.query(
      'INSERT INTO team_class_factors (team_id, season, class_code, factor, updated_by) VALUES ($1, $2, $3, $4, $5)',
      [teamId, DEMO_SEASON_YEAR, classCode, factor, ids.captain],
    );
  }
}
