import type { DataSource } from 'typeorm';
import { CLOSED_ACCOUNT_NAME } from '@shared/auth/account.schema';
import type { User } from '@shared/auth/auth.schema';
import { AppError } from '../lib/app-error';
import { sendInBackground, type MailSettings } from '../mail/mailer';
import { renderMail } from '../mail/templates';
import type { Queryable } from './access';
import { WRONG_PASSWORD, assertOwnPassword, SESSION_USER_SQL } from './password';

export { WRONG_PASSWORD };

/*
 * Closing one's own account (OWASP ASVS 4.0 V8.3.2: users can remove their data on demand).
 *
 * What goes: the account's cars with their whole seasons (as deleting each car would), its comments, its
 * memberships of shops, teams and other people's cars, its notifications, links and invitations, and every
 * session. What stays: the runs it drove on other people's cars, and what it wrote into other people's
 * records (setups, suggestions, work orders, files), since those belong to the car's season or the shop's
 * books. They keep pointing at the account's row, which no longer says who it was: its name becomes
 * "Closed account", its address one under the reserved top-level domain `.invalid` (RFC 2606 §2), which no
 * one can receive mail at or type by chance, and its password a value no password hashes to.
 */


/** The address a closed account keeps, unique as the column requires; `.invalid` is reserved by RFC 2606 §2. */
export const closedAddress = (userId: string) => `closed-${userId}@scrubline.invalid`;

/**
 * Not an argon2 hash, so no password verifies against it (argon2's verify refuses it, and the sign-in
 * treats that as a mismatch); the `!` of a locked entry in crypt(5)'s shadow files.
 */
const NO_PASSWORD = '!';

/**
 * The places someone else would be left without an admin or captain: the only site admin, the only admin
 * of a shop with other staff, the only captain of a team with other members. Each one is a sentence saying
 * what to do first. The rows are locked, so two people closing at once cannot both pass.
 */
async function seatsToHandOver(m: Queryable, userId: string, by: ClosedBy): Promise<string[]> {
  // The admins' rows only when an admin is leaving: closing anyone else never waits on them.
  await m.query('SELECT id FROM users WHERE is_admin AND EXISTS (SELECT 1 FROM users me WHERE me.id = $1 AND me.is_admin) FOR UPDATE', [userId]);
  await m.query('SELECT 1 FROM shop_members WHERE shop_id IN (SELECT shop_id FROM shop_members WHERE user_id = $1) FOR UPDATE', [userId]);
  await m.query('SELECT 1 FROM team_members WHERE team_id IN (SELECT team_id FROM team_members WHERE user_id = $1) FOR UPDATE', [userId]);
  const rows: { kind: 'site' | 'shop' | 'team'; name: string }[] = await m.query(
    `SELECT 'site' AS kind, '' AS name FROM users u
      WHERE u.id = $1 AND u.is_admin
        AND NOT EXISTS (SELECT 1 FROM users o WHERE o.is_admin AND o.id <> $1 AND o.suspended_at IS NULL AND o.closed_at IS NULL)
     UNION ALL
     SELECT 'shop', s.name FROM shop_members me JOIN shops s ON s.id = me.shop_id
      WHERE me.user_id = $1 AND me.is_shop_admin
        AND NOT EXISTS (SELECT 1 FROM shop_members o WHERE o.shop_id = me.shop_id AND o.user_id <> $1 AND o.is_shop_admin)
        AND EXISTS (SELECT 1 FROM shop_members o WHERE o.shop_id = me.shop_id AND o.user_id <> $1)
     UNION ALL
     SELECT 'team', t.name FROM team_members me JOIN teams t ON t.id = me.team_id
      WHERE me.user_id = $1 AND me.is_captain
        AND NOT EXISTS (SELECT 1 FROM team_members o WHERE o.team_id = me.team_id AND o.user_id <> $1 AND o.is_captain)
        AND EXISTS (SELECT 1 FROM team_members o WHERE o.team_id = me.team_id AND o.user_id <> $1)
     ORDER BY 1, 2`,
    [userId],
  );
  const it = by === 'owner' ? 'You are' : 'It is';
  return rows.map((r) =>
    r.kind === 'site'
      ? `${it} Scrubline’s only admin: make another account an admin first (Accounts).`
      : r.kind === 'shop'
        ? `${it} the only admin of the shop “${r.name}”: invite another admin first, so someone can still manage it.`
        : `${it} the only captain of the team “${r.name}”: make another member captain first.`,
  );
}

/** Who closes the account: its owner in Settings, or an admin, after suspending it. */
export type ClosedBy = 'owner' | 'admin';

const carsGone = (n: number) =>
  n === 0 ? 'It had no cars of its own.' : n === 1 ? 'Its car was deleted with its season.' : `Its ${n} cars were deleted with their seasons.`;

export function accountClosedMail(o: { email: string; cars: number; by: ClosedBy }) {
  const how = o.by === 'owner' ? 'at its owner’s request' : 'by an administrator';
  return renderMail({
    subject: 'Your Scrubline account is closed',
    paragraphs: [
      `The Scrubline account ${o.email} was closed ${how}, and nobody can sign in to it any more. ${carsGone(o.cars)}`,
      'Runs you drove on other people’s cars stay in their seasons under “Closed account”. You can register again with this address at any time; nothing of the old account comes back.',
    ],
    footer: 'If you did not close it, someone knew your password: tell whoever runs your Scrubline. A closed account cannot be reopened.',
  });
}

/**
 * Inside the caller's transaction: refuses (409, nothing changed) while the account is the last admin or
 * captain that others depend on, then removes or makes anonymous everything above and signs every device
 * out. Returns how many cars went.
 */
async function closeInTransaction(m: Queryable, account: { id: string; email: string }, by: ClosedBy): Promise<number> {
  const blockers = await seatsToHandOver(m, account.id, by);
  if (blockers.length) throw new AppError('conflict', `${by === 'owner' ? 'Your' : 'This'} account is still open. ${blockers.join(' ')}`);

  // The cars and everything on them (runs, setups, tyres, work orders, files: foreign keys cascade, and the
  // stored files are queued for removal by the same triggers as when one car is deleted).
  const [{ cars }]: [{ cars: number }] = await m.query(
    'WITH gone AS (DELETE FROM cars WHERE owner_id = $1 RETURNING id) SELECT count(*)::int AS cars FROM gone',
    [account.id],
  );
  // Its events, unless someone else's runs still use them.
  await m.query('DELETE FROM events e WHERE e.created_by = $1 AND NOT EXISTS (SELECT 1 FROM runs r WHERE r.event_id = e.id)', [account.id]);
  await m.query('DELETE FROM comments WHERE author_id = $1', [account.id]);
  await m.query('DELETE FROM car_co_drivers WHERE user_id = $1', [account.id]);
  await m.query('DELETE FROM shop_members WHERE user_id = $1', [account.id]);
  // A team left with nobody in it has nothing left to show (its members' entries went with their cars).
  await m.query(
    `WITH left_teams AS (DELETE FROM team_members WHERE user_id = $1 RETURNING team_id)
     DELETE FROM teams t WHERE t.id IN (SELECT team_id FROM left_teams)
       AND NOT EXISTS (SELECT 1 FROM team_members o WHERE o.team_id = t.id AND o.user_id <> $1)`,
    [account.id],
  );
  await m.query('DELETE FROM notifications WHERE user_id = $1', [account.id]);
  await m.query('DELETE FROM invitations WHERE used_at IS NULL AND (invited_by = $1 OR email = $2)', [account.id, account.email]);
  await m.query('DELETE FROM password_resets WHERE user_id = $1', [account.id]);
  await m.query('DELETE FROM email_changes WHERE user_id = $1', [account.id]);
  await m.query(`DELETE FROM session WHERE ${SESSION_USER_SQL} = $1`, [account.id]);
  await m.query(
    `UPDATE users SET email = $2, display_name = $3, password_hash = $4, is_admin = false, preferences = '{}'::jsonb,
            email_notifications = false, unsubscribe_token = gen_random_uuid(), suspended_at = NULL, suspended_by = NULL,
            suspension_note = NULL, closed_at = now(), updated_at = now()
      WHERE id = $1`,
    [account.id, closedAddress(account.id), CLOSED_ACCOUNT_NAME, NO_PASSWORD],
  );
  return cars;
}

/**
 * Closes the signed-in account, its password typed again, in one transaction (see closeInTransaction). A
 * farewell e-mail goes to the old address.
 */
export async function closeAccount(ds: DataSource, mail: MailSettings | undefined, user: User, input: { password: string }): Promise<void> {
  const cars = await ds.transaction(async (m) => {
    await assertOwnPassword(m, user.id, input.password, { field: 'password', message: WRONG_PASSWORD, forUpdate: true });
    return closeInTransaction(m, user, 'owner');
  });
  sendInBackground(mail, { to: user.email, ...accountClosedMail({ email: user.email, cars, by: 'owner' }) });
}

export const NOT_THAT_ADDRESS = 'Type the account’s e-mail address exactly as shown';
export const SUSPEND_FIRST = 'Suspend the account first: only a suspended account can be closed by an admin.';

/**
 * An admin closes someone else's account (an erasure asked for by e-mail, say, or an account suspended for
 * abuse). Only a suspended one, so that closing is always a second, deliberate step, and only once its
 * address is typed again. An admin's own account is closed from Settings.
 */
export async function closeAccountAsAdmin(ds: DataSource, mail: MailSettings | undefined, admin: User, userId: string, input: { email: string }): Promise<void> {
  if (userId === admin.id) throw new AppError('conflict', 'Close your own account in Settings.');
  const closed = await ds.transaction(async (m) => {
    const rows: { email: string; suspended_at: Date | null }[] = await m.query(
      'SELECT email, suspended_at FROM users WHERE id = $1 AND closed_at IS NULL FOR UPDATE',
      [userId],
    );
    const account = rows[0];
    if (!account) throw new AppError('not_found', 'That account was not found.');
    if (!account.suspended_at) throw new AppError('conflict', SUSPEND_FIRST);
    if (input.email !== account.email) throw new AppError('validation_failed', `${NOT_THAT_ADDRESS}.`, { email: [NOT_THAT_ADDRESS] });
    return { email: account.email, cars: await closeInTransaction(m, { id: userId, email: account.email }, 'admin') };
  });
  sendInBackground(mail, { to: closed.email, ...accountClosedMail({ ...closed, by: 'admin' }) });
}
