import Bowser from 'bowser';
import type { DataSource } from 'typeorm';
import type { SignedInDevice } from '@shared/auth/account.schema';
import { AppError } from '../lib/app-error';
import { WRONG_PASSWORD, assertOwnPassword, SESSION_USER_SQL } from './password';

export { WRONG_PASSWORD };

/*
 * The devices signed in to an account: its rows in the `session` table. A session's id is its secret,
 * so it never leaves the server; the list and the sign-out name each session by the first 32 hex
 * digits of its SHA-256 instead (computed by PostgreSQL's sha256(), so the two always agree).
 */

/** "Chrome on Android", "Safari on iOS", or null when the browser does not say. */
export function deviceLabel(userAgent: string | undefined): string | null {
  if (!userAgent) return null;
  const { browser, os } = Bowser.parse(userAgent.slice(0, 512));
  if (browser.name && os.name) return `${browser.name} on ${os.name}`;
  return browser.name || os.name || null;
}

const SESSION_KEY = `left(encode(sha256(convert_to(sid, 'UTF8')), 'hex'), 32)`;

interface SessionRow {
  key: string;
  sess: { signedInAt?: number; device?: string | null; cookie?: { originalMaxAge?: number | null } };
  expire: Date;
  current: boolean;
}

/**
 * The account's live sessions, this one first, then the most recently active. The stored expiry is the
 * last request (written at most every few minutes, see TOUCH_AFTER_MS) plus the idle timeout.
 */
export async function listDevices(ds: DataSource, userId: string, currentSid: string, idleMs: number): Promise<SignedInDevice[]> {
  const rows: SessionRow[] = await ds.query(
    `SELECT ${SESSION_KEY} AS key, sess, expire, sid = $2 AS current
       FROM session WHERE ${SESSION_USER_SQL} = $1 AND expire >= now()`,
    [userId, currentSid],
  );
  return rows
    .map((r) => ({
      id: r.key,
      device: r.sess.device ?? null,
      signedInAt: r.sess.signedInAt ? new Date(r.sess.signedInAt).toISOString() : null,
      lastActiveAt: new Date(r.expire.getTime() - (r.sess.cookie?.originalMaxAge ?? idleMs)).toISOString(),
      current: r.current,
    }))
    .sort((a, b) => Number(b.current) - Number(a.current) || b.lastActiveAt.localeCompare(a.lastActiveAt));
}

export const UNKNOWN_DEVICE = 'That device is no longer signed in';

/**
 * Signs out one other device (`sessionId`) or every other one, once the password is typed again
 * (OWASP ASVS 4.0 V3.3.4). This device stays signed in; it signs out with Sign out. Answers how many
 * devices were signed out.
 */
export async function endOtherSessions(
  ds: DataSource,
  userId: string,
  currentSid: string,
  input: { password: string; sessionId?: string },
): Promise<number> {
  await assertOwnPassword(ds, userId, input.password, { field: 'password', message: WRONG_PASSWORD });
  // Counted by a SELECT over the DELETE: TypeORM answers a bare DELETE with [rows, count], not rows.
  const rows: { ended: number }[] = await ds.query(
    `WITH gone AS (
       DELETE FROM session
        WHERE ${SESSION_USER_SQL} = $1 AND sid <> $2 AND ($3::text IS NULL OR ${SESSION_KEY} = $3)
        RETURNING 1
     )
     SELECT count(*)::int AS ended FROM gone`,
    [userId, currentSid, input.sessionId ?? null],
  );
  const ended = rows[0]?.ended ?? 0;
  if (input.sessionId && ended === 0) throw new AppError('not_found', UNKNOWN_DEVICE);
  return ended;
}
