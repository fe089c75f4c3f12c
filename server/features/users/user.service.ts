import type { DataSource } from 'typeorm';
import { preferencesSchema, type Preferences, type Role, type UpdatePreferencesInput, type User } from '@shared/auth/auth.schema';
import type { RegisterInput } from '@shared/auth/credentials.schema';
import { AppError } from '../../lib/app-error';
import { hashPassword } from '../../auth/password';
import { UserEntity } from './user.entity';

const UNIQUE_VIOLATION = '23505';

export interface RoleRow {
  is_admin: boolean;
  shop_staff: boolean;
  team_captain: boolean;
}

/** Role flags for `users u`, derived from memberships so they are always current. */
export const ROLE_COLUMNS = `u.is_admin,
  EXISTS (SELECT 1 FROM shop_members s WHERE s.user_id = u.id) AS shop_staff,
  EXISTS (SELECT 1 FROM team_members t WHERE t.user_id = u.id AND t.is_captain) AS team_captain`;

export async function rolesOf(ds: DataSource, userId: string): Promise<Role[]> {
  const rows: RoleRow[] = await ds.query(`SELECT ${ROLE_COLUMNS} FROM users u WHERE u.id = $1`, [userId]);
  return rows[0] ? rolesFromRow(rows[0]) : [];
}

export function rolesFromRow(row: RoleRow): Role[] {
  const roles: Role[] = ['driver'];
  if (row.shop_staff) roles.push('shop_staff');
  if (row.team_captain) roles.push('team_captain');
  if (row.is_admin) roles.push('admin');
  return roles;
}

/**
 * Stored preferences read through the shared schema: unknown or outdated values fall back to defaults.
 * `emailNotifications` lives in its own column (users.email_notifications), not in the JSON.
 */
export function readPreferences(stored: unknown, emailNotifications = true): Preferences {
  const result = preferencesSchema.safeParse(stored ?? {});
  const prefs = result.success ? result.data : preferencesSchema.parse({});
  return { ...prefs, emailNotifications };
}

export function toUserDto(entity: UserEntity, roles: Role[]): User {
  return {
    id: entity.id,
    email: entity.email,
    displayName: entity.displayName,
    roles,
    preferences: readPreferences(entity.preferences, entity.emailNotifications),
  };
}

export async function updatePreferences(ds: DataSource, userId: string, input: UpdatePreferencesInput): Promise<User> {
  const entity = await ds.getRepository(UserEntity).findOneByOrFail({ id: userId });
  const current = readPreferences(entity.preferences, entity.emailNotifications);
  const next: Preferences = {
    ...current,
    units: { ...current.units, ...input.units },
    emailNotifications: input.emailNotifications ?? current.emailNotifications,
  };
  const { emailNotifications, ...stored } = next;
  await ds.getRepository(UserEntity).update({ id: userId }, { preferences: stored, emailNotifications });
  return toUserDto({ ...entity, preferences: stored, emailNotifications }, await rolesOf(ds, userId));
}

/**
 * The unsubscribe link in notification e-mails: turns them off for the account whose
 * token it is. False when no account has that token.
 */
export async function unsubscribeByToken(ds: DataSource, token: string): Promise<boolean> {
  // TypeORM answers an UPDATE with [rows, affected count].
  const [, affected]: [unknown[], number] = await ds.query(
    `UPDATE users SET email_notifications = false, updated_at = now() WHERE unsubscribe_token = $1`,
    [token],
  );
  return affected > 0;
}

/** The columns `userFromRow` reads, for `users u`. */
export const USER_COLUMNS = `u.id, u.email, u.display_name, u.preferences, u.email_notifications, ${ROLE_COLUMNS}`;

export type UserRow = RoleRow & { id: string; email: string; display_name: string; preferences: unknown; email_notifications: boolean };

export function userFromRow(row: UserRow): User {
  return {
    id: row.id,
    email: row.email,
    displayName: row.display_name,
    roles: rolesFromRow(row),
    preferences: readPreferences(row.preferences, row.email_notifications),
  };
}

/** An account with its roles, in one query. */
export async function findUserById(ds: DataSource, id: string): Promise<User | null> {
  const rows: UserRow[] = await ds.query(`SELECT ${USER_COLUMNS} FROM users u WHERE u.id = $1`, [id]);
  return rows[0] ? userFromRow(rows[0]) : null;
}

export function findUserEntityByEmail(ds: DataSource, email: string) {
  return ds.getRepository(UserEntity).findOneBy({ email: email.trim().toLowerCase() });
}

export async function createUser(ds: DataSource, input: RegisterInput, opts: { isAdmin?: boolean } = {}): Promise<User> {
  const passwordHash = await hashPassword(input.password);
  try {
    const entity = await ds.getRepository(UserEntity).save(
      ds.getRepository(UserEntity).create({
        email: input.email,
        displayName: input.displayName,
        passwordHash,
        isAdmin: opts.isAdmin ?? false,
      }),
    );
    return toUserDto(entity, await rolesOf(ds, entity.id));
  } catch (err) {
    if ((err as { code?: string }).code === UNIQUE_VIOLATION) {
      throw new AppError('conflict', 'An account with this e-mail already exists.', {
        email: ['An account with this e-mail already exists'],
      });
    }
    throw err;
  }
}

