import 'reflect-metadata';
import { DataSource } from 'typeorm';
import { UserEntity } from '../features/users/user.entity';
import { ShopEntity, ShopMemberEntity } from '../features/shops/shop.entity';
import { TeamEntity, TeamMemberEntity } from '../features/teams/team.entity';
import { Foundation1764633600000 } from './migrations/1764633600000-foundation';

export const entities = [UserEntity, ShopEntity, ShopMemberEntity, TeamEntity, TeamMemberEntity];
export const migrations = [Foundation1764633600000];

/** The app's one DataSource per database URL. Schema changes come only from migrations. */
export function createDataSource(url: string, options: { poolSize?: number } = {}) {
  return new DataSource({
    type: 'postgres',
    url,
    entities,
    migrations,
    synchronize: false,
    migrationsRun: false,
    logging: false,
    extra: { max: options.poolSize ?? 10, connectionTimeoutMillis: 5000 },
  });
}
