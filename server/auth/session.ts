import type { RequestHandler } from 'express';
import session from 'express-session';
import connectPgSimple from 'connect-pg-simple';
import type { Pool } from 'pg';
import type { User } from '@shared/auth/auth.schema';
import { USER_COLUMNS, userFromRow, type UserRow } from '../features/users/user.service';

export interface SessionSettings {
  secret: string | string[];
  /** Idle timeout: the session ends this long after the last request. */
  idleMs: number;
  /** Absolute timeout: the session ends this long after sign-in, however active. */
  absoluteMs: number;
  secureCookie: boolean;
}

export const SESSION_COOKIE = 'scrubline.sid';
export const DEFAULT_IDLE_MS = 7 * 24 * 60 * 60 * 1000;
export const DEFAULT_ABSOLUTE_MS = 30 * 24 * 60 * 60 * 1000;

/**
 * How stale the stored expiry may get before a request writes it again. express-session "touches" the
 * store at the end of every request that did not change the session, and connect-pg-simple answers
 * each touch with an UPDATE that the response waits for: a write per read. Refreshing it at most
 * every five minutes (the "lazy session update" of connect-mongo's `touchAfter`,
 * https://github.com/jdesboeufs/connect-mongo#lazy-session-update) ends an idle session at most five
 * minutes early against a seven-day idle timeout, and drops that write from nearly every request.
 * A short idle timeout (tests use seconds) refreshes at a twentieth of it instead.
 */
export const TOUCH_AFTER_MS = 5 * 60 * 1000;
export const touchAfterMs = (idleMs: number) => Math.min(TOUCH_AFTER_MS, idleMs / 20);

/**
 * What the store read alongside the session, riding on the loaded session from `get` to `touch` and
 * to passport's deserializeUser; never stored (`set` drops them).
 */
const STORED_EXPIRY = '__storedExpiryMs';
const SIGNED_IN_USER = '__signedInUser';

type SessionData = session.SessionData & { passport?: { user?: string }; [STORED_EXPIRY]?: number; [SIGNED_IN_USER]?: User | null };
type Callback<T = void> = (err: unknown, value?: T) => void;

/**
 * The signed-in user the store read with this request's session (the same query, so never stale), or
 * undefined when it did not (then passport reads the account itself).
 */
export function userReadWithSession(sess: object | undefined, id: string): User | null | undefined {
  const user = (sess as SessionData | undefined)?.[SIGNED_IN_USER];
  return user === null || user?.id === id ? user : undefined;
}

export function sessionStore(pool: Pool, touchAfter: number) {
  const PgStore = connectPgSimple(session);
  return new (class extends PgStore {
    /** The session and its signed-in account in one round trip: every request of a signed-in user needs both. */
    override get(sid: string, fn: Callback<SessionData | null>) {
      pool
        .query<{ sess: SessionData | string; expire: Date; user_id: string | null } & UserRow>({
          // Prepared, so its plan is kept per connection (see server/db/prepared.ts).
          name: 'session_with_user',
          text: `SELECT s.sess, s.expire, u.id AS user_id, ${USER_COLUMNS}
                   FROM session s
                   LEFT JOIN users u ON u.id = (s.sess #>> '{passport,user}')::uuid AND u.suspended_at IS NULL AND u.closed_at IS NULL
                  WHERE s.sid = $1 AND s.expire >= now()`,
          values: [sid],
        })
        .then(({ rows: [row] }) => {
          if (!row) return fn(null, null);
          const sess = typeof row.sess === 'string' ? (JSON.parse(row.sess) as SessionData) : row.sess;
          // null: the session names an account that no longer exists, or one suspended or closed since.
          const user = sess.passport?.user === undefined ? undefined : row.user_id ? userFromRow(row) : null;
          fn(null, { ...sess, [STORED_EXPIRY]: row.expire.getTime(), [SIGNED_IN_USER]: user });
        })
        .catch(fn);
    }

    override set(sid: string, sess: SessionData, fn?: Callback) {
      const { [STORED_EXPIRY]: _expiry, [SIGNED_IN_USER]: _user, ...stored } = sess;
      super.set(sid, stored as session.SessionData, fn);
    }

    override touch(sid: string, sess: SessionData, fn?: Callback) {
      const stored = sess[STORED_EXPIRY];
      const next = sess.cookie.expires?.getTime();
      if (stored !== undefined && next !== undefined && next - stored < touchAfter) return fn?.(null);
      super.touch(sid, sess, fn as () => void);
    }
  })({ pool, tableName: 'session', createTableIfMissing: false, pruneSessionInterval: 15 * 60 });
}

/** express-session backed by PostgreSQL (table `session`, created by a migration). */
export function sessionMiddleware(pool: Pool, s: SessionSettings): RequestHandler {
  return session({
    name: SESSION_COOKIE,
    secret: s.secret,
    store: sessionStore(pool, touchAfterMs(s.idleMs)),
    resave: false,
    saveUninitialized: false,
    rolling: true,
    cookie: { httpOnly: true, sameSite: 'lax', secure: s.secureCookie, maxAge: s.idleMs },
  });
}

/**
 * express-session has only the idle timeout (cookie maxAge with rolling). This ends
 * a signed-in session once `absoluteMs` has passed since sign-in: its row is
 * deleted and the request continues signed out.
 */
export function absoluteTimeout(absoluteMs: number, now: () => number = Date.now): RequestHandler {
  return (req, _res, next) => {
    const started = req.session?.signedInAt;
    if (started === undefined || now() - started <= absoluteMs) return next();
    req.session.destroy((err) => {
      if (err) return next(err);
      // A fresh, empty session object so later middleware can still use req.session.
      req.sessionStore.generate(req);
      next();
    });
  };
}
