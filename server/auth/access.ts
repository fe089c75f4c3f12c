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

/* ---------- Record-level access: cars and everything that hangs off a car ---------- */

export type CarAction = 'read' | 'write' | 'manage';
export type CarRelation = 'owner' | 'co_driver';

/**
 * May this user do `action` to this car? Owners may do everything; co-drivers may
 * read and write the season (setups, runs, tyres) but not manage the car itself.
 * Anyone else gets 404, so a car's existence is never revealed. This is the one
 * function every car-scoped route goes through; shop and team access extend it.
 */
export async function assertCarAccess(db: Queryable, user: User, carId: string, action: CarAction): Promise<CarRelation> {
  const rows: { relation: CarRelation }[] = await db.query(
    `SELECT CASE WHEN c.owner_id = $2 THEN 'owner' ELSE 'co_driver' END AS relation
       FROM cars c
      WHERE c.id = $1
        AND (c.owner_id = $2 OR EXISTS (SELECT 1 FROM car_co_drivers d WHERE d.car_id = c.id AND d.user_id = $2))`,
    [carId, user.id],
  );
  const relation = rows[0]?.relation;
  if (!relation) throw new AppError('not_found', 'That car was not found.');
  if (action === 'manage' && relation !== 'owner') {
    throw new AppError('forbidden', 'Only the car\'s owner can change or delete the car and its co-drivers.');
  }
  return relation;
}

/** SQL for the ids of the cars user `$n` can read (owned or co-driven). */
export const accessibleCarIdsSql = (param: string) =>
  `(SELECT c.id FROM cars c WHERE c.owner_id = ${param}
    UNION SELECT d.car_id FROM car_co_drivers d WHERE d.user_id = ${param})`;

/**
 * An event is visible to its creator, to anyone sharing a car with the creator
 * (so co-drivers log into the same event), and to anyone whose car ran at it.
 */
export async function assertEventAccess(db: Queryable, user: User, eventId: string): Promise<void> {
  const rows = await db.query(
    `SELECT 1 FROM events e
      WHERE e.id = $1
        AND (e.created_by = $2
             OR EXISTS (SELECT 1 FROM runs r WHERE r.event_id = e.id AND r.car_id IN ${accessibleCarIdsSql('$2')})
             OR EXISTS (SELECT 1 FROM cars c
                         WHERE c.id IN ${accessibleCarIdsSql('$2')}
                           AND (c.owner_id = e.created_by
                                OR EXISTS (SELECT 1 FROM car_co_drivers d WHERE d.car_id = c.id AND d.user_id = e.created_by))))`,
    [eventId, user.id],
  );
  if (rows.length === 0) throw new AppError('not_found', 'That event was not found.');
}

/** Finds the car a child record belongs to, then checks access to that car. */
export async function assertCarChildAccess(
  db: Queryable,
  user: User,
  table: 'setup_snapshots' | 'runs' | 'tyre_sets',
  id: string,
  action: CarAction,
  what: string,
): Promise<string> {
  const rows: { car_id: string }[] = await db.query(`SELECT car_id FROM ${table} WHERE id = $1`, [id]);
  const carId = rows[0]?.car_id;
  if (!carId) throw new AppError('not_found', `${what} was not found.`);
  try {
    await assertCarAccess(db, user, carId, action);
  } catch (err) {
    if (err instanceof AppError && err.code === 'not_found') throw new AppError('not_found', `${what} was not found.`);
    throw err;
  }
  return carId;
}

/** Anything that can run SQL: a DataSource or a transaction's EntityManager. */
export interface Queryable {
  query: (sql: string, params?: unknown[]) => Promise<any>; // eslint-disable-line @typescript-eslint/no-explicit-any
}
