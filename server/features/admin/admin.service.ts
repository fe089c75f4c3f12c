import type { DataSource } from 'typeorm';
import { ACCOUNT_LIST_LIMIT, type AdminAccount, type AdminAccountList, type SuspendAccountInput } from '@shared/auth/admin.schema';
import type { User } from '@shared/auth/auth.schema';
import { AppError, notFound } from '../../lib/app-error';
import { SESSION_USER_SQL } from '../../auth/password';
import { ROLE_COLUMNS, rolesFromRow, type RoleRow } from '../users/user.service';

type AccountRow = RoleRow & {
  id: string;
  email: string;
  display_name: string;
  created_at: Date;
  suspended_at: Date | null;
  suspension_note: string | null;
  devices: number;
  total: number;
};

// Live sessions per account, through the index on a session's account (session_account_idx).
const ACCOUNT_COLUMNS = `u.id, u.email, u.display_name, u.created_at, u.suspended_at, u.suspension_note, ${ROLE_COLUMNS},
  (SELECT count(*)::int FROM session s WHERE ${SESSION_USER_SQL} = u.id::text AND s.expire >= now()) AS devices`;

function toAccount(r: AccountRow): AdminAccount {
  return {
    id: r.id,
    email: r.email,
    displayName: r.display_name,
    roles: rolesFromRow(r),
    createdAt: r.created_at.toISOString(),
    suspendedAt: r.suspended_at?.toISOString() ?? null,
    suspensionNote: r.suspension_note,
    signedInDevices: r.devices,
  };
}

/**
 * Accounts whose name or e-mail holds `q` (all when none), by name; closed ones never. The order does not
 * depend on suspension, so suspending or restoring an account leaves it where it was in the list.
 */
export async function listAccounts(ds: DataSource, q: string | undefined): Promise<AdminAccountList> {
  const like = q ? `%${q.replace(/[\\%_]/g, (c) => `\\${c}`)}%` : null;
  const rows: AccountRow[] = await ds.query(
    `SELECT ${ACCOUNT_COLUMNS}, count(*) OVER ()::int AS total
       FROM users u
      WHERE u.closed_at IS NULL AND ($1::text IS NULL OR u.email ILIKE $1 OR u.display_name ILIKE $1)
      ORDER BY lower(u.display_name), u.email, u.id
      LIMIT ${ACCOUNT_LIST_LIMIT}`,
    [like],
  );
  return { items: rows.map(toAccount), count: rows.length, total: rows[0]?.total ?? 0 };
}

async function loadAccount(ds: DataSource, id: string): Promise<AdminAccount> {
  const rows: AccountRow[] = await ds.query(`SELECT ${ACCOUNT_COLUMNS}, 1 AS total FROM users u WHERE u.id = $1 AND u.closed_at IS NULL`, [id]);
  if (!rows[0]) throw notFound('That account');
  return toAccount(rows[0]);
}

/**
 * Suspends an account: it cannot sign in until restored, and every device signed in to it is signed out
 * in the same transaction. An admin cannot suspend their own account, so one admin always remains able
 * to restore the others. Suspending a suspended account again only replaces the note.
 */
export async function suspendAccount(ds: DataSource, admin: User, id: string, input: SuspendAccountInput): Promise<AdminAccount> {
  if (id === admin.id) throw new AppError('conflict', 'You cannot suspend your own account.');
  await ds.transaction(async (m) => {
    // Wrapped in a SELECT: TypeORM answers a bare UPDATE … RETURNING with [rows, count], whose first item is always there.
    const rows: { id: string }[] = await m.query(
      `WITH done AS (
         UPDATE users SET suspended_at = coalesce(suspended_at, now()), suspended_by = $2, suspension_note = $3, updated_at = now()
          WHERE id = $1 AND closed_at IS NULL RETURNING id
       ) SELECT id FROM done`,
      [id, admin.id, input.note],
    );
    if (!rows[0]) throw notFound('That account');
    await m.query(`DELETE FROM session WHERE ${SESSION_USER_SQL} = $1`, [id]);
  });
  return loadAccount(ds, id);
}

/** Lets a suspended account sign in again; restoring an active account changes nothing. */
export async function restoreAccount(ds: DataSource, id: string): Promise<AdminAccount> {
  await ds.query(
    `UPDATE users SET suspended_at = NULL, suspended_by = NULL, suspension_note = NULL, updated_at = now()
      WHERE id = $1 AND suspended_at IS NOT NULL`,
    [id],
  );
  return loadAccount(ds, id);
}

/**
 * Gives or takes the `admin` role. An admin cannot take it from themselves, so the accounts always keep one
 * admin who can give it back.
 */
export async function setAdmin(ds: DataSource, admin: User, id: string, isAdmin: boolean): Promise<AdminAccount> {
  if (id === admin.id && !isAdmin) throw new AppError('conflict', 'You cannot take the admin role from yourself; ask another admin.');
  // The role is not given to a suspended account (it could not use it, and would have it on being restored); it
  // can still be taken from one.
  const rows: { id: string; suspended: boolean }[] = await ds.query(
    `WITH done AS (
       UPDATE users SET is_admin = $2, updated_at = now() WHERE id = $1 AND closed_at IS NULL AND (NOT $2 OR suspended_at IS NULL) RETURNING id
     )
     SELECT id, false AS suspended FROM done
     UNION ALL
     SELECT id, true FROM users WHERE id = $1 AND closed_at IS NULL AND suspended_at IS NOT NULL AND $2 AND NOT EXISTS (SELECT 1 FROM done)`,
    [id, isAdmin],
  );
  if (rows[0]?.suspended) throw new AppError('conflict', 'This account is suspended: restore it before making it an admin.');
  if (!rows[0]) throw notFound('That account');
  return loadAccount(ds, id);
}
