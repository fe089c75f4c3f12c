import type { RequestHandler } from 'express';
import type { Role, User } from '@shared/auth/auth.schema';
import { AppError, HiddenRecord } from '../lib/app-error';
import { allows, type ACCESS_MATRIX } from './access-matrix';

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

export type CarAction = keyof (typeof ACCESS_MATRIX)['car'];
export type CarRelation = 'owner' | 'co_driver' | 'shop_staff';

/**
 * May this user do `action` to this car? The answer comes from ACCESS_MATRIX: owners
 * may do everything; co-drivers read and write the season but do not manage the car;
 * staff of a shop the owner granted read the season, comment and suggest, and never
 * write. Anyone else gets 404, so a car's existence is never revealed; someone who may
 * see the car but not do this gets 403. Every car-scoped route goes through here.
 */
export async function assertCarAccess(db: Queryable, user: User, carId: string, action: CarAction): Promise<CarRelation> {
  const row = await carRelationRow(db, user.id, carId);
  return assertCarRelations(relationsOf(row), action, row !== undefined);
}

const CAR_REFUSALS: Record<CarAction, string> = {
  read: 'That car was not found.',
  write: 'Only the car\'s drivers can change its season.',
  manage: 'Only the car\'s owner can change or delete the car, its co-drivers and its shop access.',
  comment: 'Only the car\'s drivers and its shop can comment.',
  suggest: 'Only staff of a shop the owner has granted can suggest setups.',
  decide: 'Only the car\'s drivers can accept or decline a suggestion.',
  service: 'Only staff of a shop the owner has granted can open a work order.',
};

/** Does `driver` drive the car `c` (its owner or a co-driver)? A condition on `cars c`. */
export const drivesCarSql = (driver: string) =>
  `(c.owner_id = ${driver} OR EXISTS (SELECT 1 FROM car_co_drivers d WHERE d.car_id = c.id AND d.user_id = ${driver}))`;

/** The user's relations to the car `c`, as the columns owner, co_driver and shop_staff. */
const carRelationColumns = (user: string) => `c.owner_id = ${user} AS owner,
            EXISTS (SELECT 1 FROM car_co_drivers d WHERE d.car_id = c.id AND d.user_id = ${user}) AS co_driver,
            EXISTS (SELECT 1 FROM shop_grants g JOIN shop_members m ON m.shop_id = g.shop_id
                     WHERE g.car_id = c.id AND m.user_id = ${user}) AS shop_staff`;

type RelationRow = Record<CarRelation, boolean>;
const CAR_RELATIONS = ['owner', 'co_driver', 'shop_staff'] as const satisfies readonly CarRelation[];
const relationsOf = (row: RelationRow | undefined): CarRelation[] => (row ? CAR_RELATIONS.filter((r) => row[r]) : []);

/** The user's relations to the car as one row; none when the car does not exist. */
async function carRelationRow(db: Queryable, userId: string, carId: string): Promise<RelationRow | undefined> {
  const rows: RelationRow[] = await db.query(`SELECT ${carRelationColumns('$2')} FROM cars c WHERE c.id = $1`, [carId, userId]);
  return rows[0];
}

/** Every relation the user has to the car, strongest first (empty: none). */
export async function carRelations(db: Queryable, userId: string, carId: string): Promise<CarRelation[]> {
  return relationsOf(await carRelationRow(db, userId, carId));
}

/**
 * SQL that is true when the relation columns of row `alias` (owner, co_driver, shop_staff) allow `action`
 * on the car. Built from ACCESS_MATRIX, so a statement that writes only where this holds follows the same
 * table as assertCarRelations.
 */
export const carActionAllowedSql = (alias: string, action: CarAction) => {
  const allowed = CAR_RELATIONS.filter((r) => allows('car', action, r));
  return allowed.length > 0 ? `(${allowed.map((r) => `${alias}.${r}`).join(' OR ')})` : 'false';
};

/**
 * What writing a run needs to know, as one row (none when the car does not exist): the user's relations
 * to the car, whether the user may see the event (event_visible: null when there is no such event, false
 * when it is not the user's to see), and whether the driver drives the car (drives_car, its owner or a
 * co-driver). The answers are the same as carRelations and assertEventAccess give one query each; a write
 * can join this row and happen only where it allows.
 */
export const runWriteFactsSql = (p: { user: string; car: string; event: string; driver: string }) =>
  `SELECT ${carRelationColumns(p.user)},
          (SELECT ${eventVisibleSql(p.user)} FROM events e WHERE e.id = ${p.event}) AS event_visible,
          ${drivesCarSql(p.driver)} AS drives_car
     FROM cars c WHERE c.id = ${p.car}`;

export type RunWriteFactsRow = RelationRow & { event_visible: boolean | null; drives_car: boolean };

/** Refuses a run's write from the facts of runWriteFactsSql, in order: the car (404, 403), the event (404), the driver. */
export function assertRunWrite(row: RunWriteFactsRow | undefined, notTheDriver: () => AppError): asserts row is RunWriteFactsRow {
  assertCarRelations(relationsOf(row), 'write', row !== undefined);
  if (row?.event_visible === false) throw new HiddenRecord('That event');
  if (!row?.event_visible) throw new AppError('not_found', 'That event was not found.');
  if (!row.drives_car) throw notTheDriver();
}

/** Refuses as assertCarAccess does, from relations already read; `carExists` marks a car hidden from this user. */
export function assertCarRelations(relations: CarRelation[], action: CarAction, carExists = false): CarRelation {
  if (!relations.some((r) => allows('car', 'read', r))) throw carExists ? new HiddenRecord('That car') : new AppError('not_found', 'That car was not found.');
  const relation = relations.find((r) => allows('car', action, r));
  if (!relation) throw new AppError('forbidden', CAR_REFUSALS[action]);
  return relation;
}

/** The shops (of those the user staffs) that hold a grant on the car: the name comments are signed with. */
export async function grantedShopOf(db: Queryable, userId: string, carId: string): Promise<{ id: string; name: string } | null> {
  const rows: { id: string; name: string }[] = await db.query(
    `SELECT s.id, s.name FROM shop_grants g
       JOIN shop_members m ON m.shop_id = g.shop_id AND m.user_id = $2
       JOIN shops s ON s.id = g.shop_id
      WHERE g.car_id = $1 ORDER BY g.created_at LIMIT 1`,
    [carId, userId],
  );
  return rows[0] ?? null;
}

/** SQL for the ids of the cars user `$n` drives (owned or co-driven): "my cars". */
export const accessibleCarIdsSql = (param: string) =>
  `(SELECT c.id FROM cars c WHERE c.owner_id = ${param}
    UNION SELECT d.car_id FROM car_co_drivers d WHERE d.user_id = ${param})`;

/** SQL for the ids of every car user `$n` may read: their own, co-driven, and granted to their shop. */
export const readableCarIdsSql = (param: string) =>
  `(SELECT c.id FROM cars c WHERE c.owner_id = ${param}
    UNION SELECT d.car_id FROM car_co_drivers d WHERE d.user_id = ${param}
    UNION SELECT g.car_id FROM shop_grants g JOIN shop_members m ON m.shop_id = g.shop_id WHERE m.user_id = ${param})`;

/* ---------- Service visits ---------- */

export type WorkOrderAction = keyof (typeof ACCESS_MATRIX)['work_order'];
export type WorkOrderRelation = 'owner' | 'co_driver' | 'shop_staff';

/**
 * May this user do `action` to this work order? The car's drivers read it, comment on it
 * and pay its invoice; staff of the visit's shop read it, and edit it and take cash while
 * the shop still holds a grant on the car. Anyone else gets 404.
 */
export async function assertWorkOrderAccess(
  db: Queryable,
  user: User,
  workOrderId: string,
  action: WorkOrderAction,
): Promise<{ relation: WorkOrderRelation; carId: string; shopId: string }> {
  const rows: { car_id: string; shop_id: string; owner: boolean; co_driver: boolean; staff: boolean; granted: boolean }[] = await db.query(
    `SELECT w.car_id, w.shop_id,
            c.owner_id = $2 AS owner,
            EXISTS (SELECT 1 FROM car_co_drivers d WHERE d.car_id = w.car_id AND d.user_id = $2) AS co_driver,
            EXISTS (SELECT 1 FROM shop_members m WHERE m.shop_id = w.shop_id AND m.user_id = $2) AS staff,
            EXISTS (SELECT 1 FROM shop_grants g WHERE g.car_id = w.car_id AND g.shop_id = w.shop_id) AS granted
       FROM work_orders w JOIN cars c ON c.id = w.car_id
      WHERE w.id = $1`,
    [workOrderId, user.id],
  );
  const row = rows[0];
  const relations: WorkOrderRelation[] = row
    ? [...(row.owner ? (['owner'] as const) : []), ...(row.co_driver ? (['co_driver'] as const) : []), ...(row.staff ? (['shop_staff'] as const) : [])]
    : [];
  if (!row) throw new AppError('not_found', 'That work order was not found.');
  if (!relations.some((r) => allows('work_order', 'read', r))) throw new HiddenRecord('That work order');
  const relation = relations.find((r) => allows('work_order', action, r));
  if (!relation) throw new AppError('forbidden', 'Only the shop that did the work can change this work order; the drivers read it and pay.');
  if (relation === 'shop_staff' && action !== 'read' && action !== 'comment' && !row.granted) {
    throw new AppError('forbidden', 'The owner no longer shares this car with your shop, so the work order can only be read.');
  }
  return { relation, carId: row.car_id, shopId: row.shop_id };
}

/* ---------- Shops and teams ---------- */

export type ShopAction = keyof (typeof ACCESS_MATRIX)['shop'];
export type TeamAction = keyof (typeof ACCESS_MATRIX)['team'];

/** Staff of the shop may read it; its shop admins manage staff. Others get 404. */
export async function assertShopAccess(db: Queryable, user: User, shopId: string, action: ShopAction): Promise<'shop_staff' | 'shop_admin'> {
  // null when the shop exists but the user is not on its staff.
  const rows: { is_shop_admin: boolean | null }[] = await db.query(
    'SELECT (SELECT is_shop_admin FROM shop_members WHERE shop_id = s.id AND user_id = $2) AS is_shop_admin FROM shops s WHERE s.id = $1',
    [shopId, user.id],
  );
  if (!rows[0]) throw new AppError('not_found', 'That shop was not found.');
  if (rows[0].is_shop_admin === null) throw new HiddenRecord('That shop');
  const relations = rows[0].is_shop_admin ? (['shop_admin', 'shop_staff'] as const) : (['shop_staff'] as const);
  const relation = relations.find((r) => allows('shop', action, r));
  if (!relation) throw new AppError('forbidden', 'Only the shop\'s admins can do this.');
  return relation;
}

/** Members read the team and enter their cars; captains manage it. Others get 404. */
export async function assertTeamAccess(db: Queryable, user: User, teamId: string, action: TeamAction): Promise<'team_member' | 'team_captain'> {
  // null when the team exists but the user is not on it.
  const rows: { is_captain: boolean | null }[] = await db.query(
    'SELECT (SELECT is_captain FROM team_members WHERE team_id = t.id AND user_id = $2) AS is_captain FROM teams t WHERE t.id = $1',
    [teamId, user.id],
  );
  if (!rows[0]) throw new AppError('not_found', 'That team was not found.');
  if (rows[0].is_captain === null) throw new HiddenRecord('That team');
  const relations = rows[0].is_captain ? (['team_captain', 'team_member'] as const) : (['team_member'] as const);
  const relation = relations.find((r) => allows('team', action, r));
  if (!relation) throw new AppError('forbidden', 'Only the team\'s captains can do this.');
  return relation;
}

/**
 * An event is visible to its creator, to anyone sharing a car with the creator
 * (so co-drivers log into the same event), and to anyone who may read a car that ran at it.
 * A car's owner chose its co-drivers, so the owner's events are theirs to see; a co-driver was added
 * without being asked, so only the events they made since they were added are shared through the car,
 * never the ones from before. A condition on `events e`.
 */
const eventVisibleSql = (user: string) => `(e.created_by = ${user}
             OR EXISTS (SELECT 1 FROM runs r WHERE r.event_id = e.id AND r.car_id IN ${readableCarIdsSql(user)})
             OR ${eventSharedThroughCarSql(user)})`;

/** The part of the rule above that shares an event among a car's drivers; the events list uses it too. */
export const eventSharedThroughCarSql = (user: string) => `EXISTS (SELECT 1 FROM cars c
                         WHERE c.id IN ${accessibleCarIdsSql(user)}
                           AND (c.owner_id = e.created_by
                                OR EXISTS (SELECT 1 FROM car_co_drivers d
                                            WHERE d.car_id = c.id AND d.user_id = e.created_by AND d.created_at <= e.created_at)))`;

export async function assertEventAccess(db: Queryable, user: User, eventId: string): Promise<void> {
  const rows: { visible: boolean }[] = await db.query(`SELECT ${eventVisibleSql('$2')} AS visible FROM events e WHERE e.id = $1`, [eventId, user.id]);
  if (rows.length === 0) throw new AppError('not_found', 'That event was not found.');
  if (!rows[0]!.visible) throw new HiddenRecord('That event');
}

/** Finds the car a child record belongs to, then checks access to that car. */
export async function assertCarChildAccess(
  db: Queryable,
  user: User,
  table: 'setup_snapshots' | 'runs' | 'tyre_sets' | 'setup_suggestions',
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
    if (err instanceof HiddenRecord) throw new HiddenRecord(what);
    if (err instanceof AppError && err.code === 'not_found') throw new AppError('not_found', `${what} was not found.`);
    throw err;
  }
  return carId;
}

/** Anything that can run SQL: a DataSource or a transaction's EntityManager. */
export interface Queryable {
  query: (sql: string, params?: unknown[]) => Promise<any>; // eslint-disable-line @typescript-eslint/no-explicit-any
}
