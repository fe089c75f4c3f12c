import type { DataSource } from 'typeorm';
import { preferencesSchema, type Preferences, type Role, type UpdatePreferencesInput, type User } from '@shared/auth/auth.schema';
import type { RegisterInput } from '@shared/auth/credentials.schema';
import { AppError } from '../../lib/app-error';
import { hashPassword } from '../../auth/password';
import { UserEntity } from './user.entity';

const UNIQUE_VIOLATION = '23505';

interface RoleRow {
  is_admin: boolean;
  shop_staff: boolean;
  team_captain: boolean;
}

/** Role flags for `users u`, derived from memberships so they are always current. */
const ROLE_COLUMNS = `u.is_admin,
  EXISTS (SELECT 1 FROM shop_members s WHERE s.user_id = u.id) AS shop_staff,
  EXISTS (SELECT 1 FROM team_members t WHERE t.user_id = u.id AND t.is_captain) AS team_captain`;

export async function rolesOf(ds: DataSource, userId: string): Promise<Role[]> {
  const rows: RoleRow[] = await ds.query(`SELECT ${ROLE_COLUMNS} FROM users u WHERE u.id = $1`, [userId]);
  return rows[0] ? rolesFromRow(rows[0]) : [];
}

function rolesFromRow(row: RoleRow): Role[] {
  const roles: Role[] = ['driver'];
  if (row.shop_staff) roles.push('shop_staff');
  if (row.team_captain) roles.push('team_captain');
  if (row.is_admin) roles.push('admin');
  return roles;
}

/** Stored preferences read through the shared schema: unknown or outdated values fall back to defaults. */
export function readPreferences(stored: unknown): Preferences {
  const result = preferencesSchema.safeParse(stored ?? {});
  return result.success ? result.data : preferencesSchema.parse({});
}

export function toUserDto(entity: UserEntity, roles: Role[]): User {
  return { id: entity.id, email: entity.email, displayName: entity.displayName, roles, preferences: readPreferences(entity.preferences) };
}

export async function updatePreferences(ds: DataSource, userId: string, input: UpdatePreferencesInput): Promise<User> {
  const entity = await ds.getRepository(UserEntity).findOneByOrFail({ id: userId });
  const current = readPreferences(entity.preferences);
  const next: Preferences = { ...current, units: { ...current.units, ...input.units } };
  await ds.getRepository(UserEntity).update({ id: userId }, { preferences: next });
  return toUserDto({ ...entity, preferences: next }, await rolesOf(ds, userId));
}

export async function findUserById(ds: DataSource, id: string): Promise<User | null> {
  const entity = await ds.getRepository(UserEntity).findOneBy({ id });
  return entity ? toUserDto(entity, await rolesOf(ds, entity.id)) : null;
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

export async function listUsers(ds: DataSource): Promise<User[]> {
  const rows: (RoleRow & { id: string; email: string; display_name: string; preferences: unknown })[] = await ds.query(
    `SELECT u.id, u.email, u.display_name, u.preferences, ${ROLE_COLUMNS} FROM users u ORDER BY u.created_at, u.email`,
  );
  return rows.map((r) => ({
    id: r.id, email: r.email, displayName: r.display_name, roles: rolesFromRow(r), preferences: readPreferences(r.preferences),
  }));
}
