import 'reflect-metadata';
import { DataSource } from 'typeorm';
import { UserEntity } from '../features/users/user.entity';
import { ShopEntity, ShopMemberEntity } from '../features/shops/shop.entity';
import { TeamEntity, TeamMemberEntity } from '../features/teams/team.entity';
import { CarCoDriverEntity, CarEntity } from '../features/cars/car.entity';
import { SetupCornerEntity, SetupSnapshotEntity } from '../features/setups/setup.entity';
import { ChangeLogEntity } from '../features/changes/change.entity';
import { EventEntity } from '../features/events/event.entity';
import { RunEntity } from '../features/runs/run.entity';
import { TreadReadingCornerEntity, TreadReadingEntity, TyreMountingEntity, TyreSetEntity } from '../features/tyres/tyre.entity';
import { PressureReadingEntity } from '../features/pressures/pressure.entity';
import { CommentEntity } from '../features/comments/comment.entity';
import { SetupSuggestionEntity } from '../features/suggestions/suggestion.entity';
import { Foundation1764633600000 } from './migrations/1764633600000-foundation';
import { SeasonRecord1764720000000 } from './migrations/1764720000000-season-record';
import { UserPreferences1764806400000 } from './migrations/1764806400000-user-preferences';
import { Collaboration1764892800000 } from './migrations/1764892800000-collaboration';
import { ServiceVisits1764979200000 } from './migrations/1764979200000-service-visits';
import { Attachments1765065600000 } from './migrations/1765065600000-attachments';
import { StoredFileRemovals1765152000000 } from './migrations/1765152000000-stored-file-removals';
import { SessionAccountIndex1765238400000 } from './migrations/1765238400000-session-account-index';
import { AccountSuspension1765324800000 } from './migrations/1765324800000-account-suspension';
import { EmailChanges1765411200000 } from './migrations/1765411200000-email-changes';
import { ClosedAccounts1765497600000 } from './migrations/1765497600000-closed-accounts';
import { CoDriverNotice1765584000000 } from './migrations/1765584000000-co-driver-notice';
import { UsedUpParts1765670400000 } from './migrations/1765670400000-used-up-parts';
import { RunsOnTyreSets1765756800000 } from './migrations/1765756800000-runs-on-tyre-sets';
import { InvoiceNumbers1765843200000 } from './migrations/1765843200000-invoice-numbers';
import { InvoiceBook1765929600000 } from './migrations/1765929600000-invoice-book';
import { DoubleAdjustableDampers1766016000000 } from './migrations/1766016000000-double-adjustable-dampers';

export const entities = [
  UserEntity, ShopEntity, ShopMemberEntity, TeamEntity, TeamMemberEntity,
  CarEntity, CarCoDriverEntity, SetupSnapshotEntity, SetupCornerEntity, ChangeLogEntity, EventEntity, RunEntity,
  TyreSetEntity, TyreMountingEntity, TreadReadingEntity, TreadReadingCornerEntity, PressureReadingEntity,
  CommentEntity, SetupSuggestionEntity,
];
export const migrations = [
  Foundation1764633600000, SeasonRecord1764720000000, UserPreferences1764806400000, Collaboration1764892800000,
  ServiceVisits1764979200000, Attachments1765065600000, StoredFileRemovals1765152000000,
  SessionAccountIndex1765238400000, AccountSuspension1765324800000, EmailChanges1765411200000,
  ClosedAccounts1765497600000,
  CoDriverNotice1765584000000,
  UsedUpParts1765670400000,
  RunsOnTyreSets1765756800000,
  InvoiceNumbers1765843200000,
  InvoiceBook1765929600000,
  DoubleAdjustableDampers1766016000000,
];

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
