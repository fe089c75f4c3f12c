import argon2 from 'argon2';
import { AppError } from '../lib/app-error';
import type { Queryable } from './access';

/**
 * argon2id with m = 19456 KiB, t = 2, p = 1: the first setting listed by the OWASP
 * Password Storage Cheat Sheet.
 */
export const ARGON2_OPTIONS = { type: argon2.argon2id, memoryCost: 19456, timeCost: 2, parallelism: 1 } as const;

export function hashPassword(password: string): Promise<string> {
  return argon2.hash(password, ARGON2_OPTIONS);
}

export async function verifyPassword(hash: string, password: string): Promise<boolean> {
  try {
    return await argon2.verify(hash, password);
  } catch {
    return false;
  }
}

let dummyHash: Promise<string> | undefined;

/**
 * Spends the same work as a real check when the e-mail is unknown, so response
 * times do not tell which addresses have accounts.
 */
export async function verifyAgainstDummy(password: string): Promise<false> {
  dummyHash ??= hashPassword('scrubline-dummy-password-not-for-use');
  await verifyPassword(await dummyHash, password);
  return false;
}

/** The field error when a signed-in person's password, typed again, does not match. */
export const WRONG_PASSWORD = 'That is not your password';

/**
 * A signed-in person's password typed again, checked against the stored hash; a mismatch is a field error on
 * `field` (the form's password field). `forUpdate` locks the account's row for the rest of the transaction.
 */
export async function assertOwnPassword(
  db: Queryable,
  userId: string,
  password: string,
  { field, message, forUpdate = false }: { field: string; message: string; forUpdate?: boolean },
): Promise<void> {
  const rows: { password_hash: string }[] = await db.query(`SELECT password_hash FROM users WHERE id = $1${forUpdate ? ' FOR UPDATE' : ''}`, [userId]);
  const row = rows[0];
  if (!row || !(await verifyPassword(row.password_hash, password))) throw new AppError('validation_failed', `${message}.`, { [field]: [message] });
}

/** The account a stored session belongs to: passport.serializeUser keeps its id at sess.passport.user (passport.ts). */
export const SESSION_USER_SQL = `sess #>> '{passport,user}'`;

/**
 * A new password hash for the account, inside the caller's transaction: every open reset link and change of
 * address is voided and the account's sessions end, but `keepSessionId` (the one that changed it while signed
 * in), when given.
 */
export async function storeNewPassword(db: Queryable, userId: string, hash: string, keepSessionId: string | null): Promise<void> {
  await db.query('UPDATE users SET password_hash = $2, updated_at = now() WHERE id = $1', [userId, hash]);
  await db.query('UPDATE password_resets SET used_at = now() WHERE user_id = $1 AND used_at IS NULL', [userId]);
  // A change of address asked for with the old password waits no longer (server/auth/email-change.ts).
  await db.query('UPDATE email_changes SET used_at = now() WHERE user_id = $1 AND used_at IS NULL', [userId]);
  await db.query(`DELETE FROM session WHERE ${SESSION_USER_SQL} = $1 AND sid IS DISTINCT FROM $2`, [userId, keepSessionId]);
}
