import type { RequestHandler } from 'express';
import type { Role, User } from '@shared/auth/auth.schema';
import { AppError } from '../lib/app-error';

/**
 * The one place that decides who may do what. Routes declare their need with these
 * middlewares; services ask the functions below. Later record-level checks (a car,
 * its shop grant, a team entry) are added here, not in the routes.
 */

export function hasRole(user: User | undefined, ...roles: Role[]): boolean {
  return !!user && roles.some((r) => user.roles.includes(r));
}

export const requireAuth: RequestHandler = (req, _res, next) => {
  if (!req.user) throw new AppError('unauthenticated', 'Sign in to continue.');
  next();
};

/** Signed in and holding at least one of the roles; otherwise 401 or 403. */
export function requireRole(...roles: Role[]): RequestHandler {
  return (req, _res, next) => {
    if (!req.user) throw new AppError('unauthenticated', 'Sign in to continue.');
    if (!hasRole(req.user, ...roles)) throw new AppError('forbidden', 'Your account cannot do this.');
    next();
  };
}

/** The signed-in user, for handlers behind requireAuth. */
export function currentUser(req: { user?: User }): User {
  if (!req.user) throw new AppError('unauthenticated', 'Sign in to continue.');
  return req.user;
}
