import type { RequestHandler } from 'express';
import session from 'express-session';
import connectPgSimple from 'connect-pg-simple';
import type { Pool } from 'pg';

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

/** express-session backed by PostgreSQL (table `session`, created by a migration). */
export function sessionMiddleware(pool: Pool, s: SessionSettings): RequestHandler {
  const PgStore = connectPgSimple(session);
  return session({
    name: SESSION_COOKIE,
    secret: s.secret,
    store: new PgStore({ pool, tableName: 'session', createTableIfMissing: false, pruneSessionInterval: 15 * 60 }),
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
