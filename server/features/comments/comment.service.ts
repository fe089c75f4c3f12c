import { randomUUID } from 'node:crypto';
import type { DataSource } from 'typeorm';
import type { User } from '@shared/auth/auth.schema';
import type { Comment, CommentTarget, CommentTargetType, CreateCommentInput, UpdateCommentInput } from '@shared/collab/comment.schema';
import { AppError, staleVersion } from '../../lib/app-error';
import { insertUnlessPresent } from '../../lib/insert';
import { allows } from '../../auth/access-matrix';
import { assertCarAccess, assertEventAccess, assertWorkOrderAccess, carRelations, grantedShopOf, type CarAction, type Queryable } from '../../auth/access';
import type { MailSettings } from '../../mail/mailer';
import { actorLabel, carAudience, driverRecipients, notify, sendOutbox, shopStaffRecipients, staffRecipients } from '../notifications/notify';
import { workOrderTarget } from '../work-orders/work-order.service';
import { CommentEntity } from './comment.entity';

/** The column each target type's id lives in. */
const TARGET_COLUMN: Record<CommentTargetType, 'run_id' | 'event_id' | 'setup_id' | 'tread_reading_id' | 'work_order_id'> = {
  run: 'run_id',
  event: 'event_id',
  setup: 'setup_id',
  tread_reading: 'tread_reading_id',
  work_order: 'work_order_id',
};

const NOT_FOUND: Record<CommentTargetType, string> = {
  run: 'That run was not found.',
  event: 'That event was not found.',
  setup: 'That setup was not found.',
  tread_reading: 'That tread reading was not found.',
  work_order: 'That work order was not found.',
};

/** What a thread hangs on, worked out: its car, where its people should be sent, and how to name it. */
interface ResolvedTarget {
  type: CommentTargetType;
  id: string;
  carId: string;
  /** The page a driver opens for this record, or how to make it for one driver. */
  driverLink: string | ((driverId: string) => string);
  /** The shop's page for the car with this thread open, when the page shows it. */
  staffLink?: string;
  /** "Teo Marsh’s run 3 at Harbour Lot Sprint" ("their own run 3 …" to the run's driver's own comment) */
  description: string;
  /** A work-order thread: the visit's shop, which its staff sign with even after the car's grant is withdrawn. */
  shop?: { id: string; name: string };
  /**
   * A work-order thread is the drivers' and the visit's shop's alone: only that shop's staff hear of it (granted
   * still or not), never another shop the car is granted to.
   */
  visitShopId?: string;
}

/**
 * The event's board for the car, opened with the reader as its driver, so it goes straight to the day's runs
 * (each with its thread) instead of asking which car and who is driving.
 */
/** The day's board with the reader as its driver, and the thread (a run's, or the day's own) opened over it. */
const eventBoardFor = (eventId: string, carId: string, threadId: string) => (driverId: string) =>
  `/events/${eventId}?carId=${carId}&driverId=${driverId}&comments=${threadId}`;

/** The shop's page for the car, with one thread (a run's, a day's or a setup's) open and, for a run or a day, its event. */
const customerPageAt = (carId: string, threadId: string, eventId?: string) =>
  `/shop/customers/${carId}?${eventId ? `event=${eventId}&` : ''}comments=${threadId}`;

/**
 * Finds the target's car and checks the user may `action` it (404 when the record or
 * the car is not theirs to see). An event thread is one car's: the car must have run
 * there, or the user must be able to see both the car and the event.
 */
async function resolveTarget(db: Queryable, user: User, target: CommentTarget, action: CarAction, carField: string): Promise<ResolvedTarget> {
  const missing = () => new AppError('not_found', NOT_FOUND[target.type]);
  let resolved: ResolvedTarget;
  switch (target.type) {
    case 'run': {
      const rows: { car_id: string; event_id: string; run_number: number; event_name: string; driver_id: string; driver_name: string }[] = await db.query(
        `SELECT r.car_id, r.event_id, r.run_number, e.name AS event_name, r.driver_id, d.display_name AS driver_name
           FROM runs r JOIN events e ON e.id = r.event_id JOIN users d ON d.id = r.driver_id WHERE r.id = $1`,
        [target.id],
      );
      const r = rows[0];
      if (!r) throw missing();
      resolved = {
        type: 'run', id: target.id, carId: r.car_id,
        driverLink: eventBoardFor(r.event_id, r.car_id, target.id),
        staffLink: customerPageAt(r.car_id, target.id, r.event_id),
        // A shared car's drivers each have a run 3 that day: the driver's name says whose. The same words go to
        // everyone told, so never "your run"; a driver writing on their own run is not named twice.
        description: `${r.driver_id === user.id ? 'their own' : `${r.driver_name}’s`} run ${r.run_number} at ${r.event_name}`,
      };
      break;
    }
    case 'setup': {
      const rows: { car_id: string; label: string }[] = await db.query('SELECT car_id, label FROM setup_snapshots WHERE id = $1', [target.id]);
      const s = rows[0];
      if (!s) throw missing();
      resolved = {
        type: 'setup', id: target.id, carId: s.car_id,
        driverLink: `/cars/${s.car_id}?comments=${target.id}`, staffLink: customerPageAt(s.car_id, target.id), description: `the setup "${s.label}"`,
      };
      break;
    }
    case 'tread_reading': {
      const rows: { car_id: string; label: string }[] = await db.query(
        'SELECT ts.car_id, ts.label FROM tread_readings t JOIN tyre_sets ts ON ts.id = t.tyre_set_id WHERE t.id = $1',
        [target.id],
      );
      const t = rows[0];
      if (!t) throw missing();
      resolved = {
        type: 'tread_reading', id: target.id, carId: t.car_id,
        driverLink: `/cars/${t.car_id}/tread`, description: `a tread reading of ${t.label}`,
      };
      break;
    }
    case 'work_order': {
      // A visit has its own rule (the visit's shop keeps reading and commenting), not the car's.
      const visit = await workOrderTarget(db, target.id);
      if (!visit) throw missing();
      const { relation } = await assertWorkOrderAccess(db, user, target.id, action === 'read' ? 'read' : 'comment');
      const shopRows: { id: string; name: string }[] =
        relation === 'shop_staff' ? await db.query('SELECT s.id, s.name FROM work_orders w JOIN shops s ON s.id = w.shop_id WHERE w.id = $1', [target.id]) : [];
      return {
        type: 'work_order', id: target.id, carId: visit.carId,
        driverLink: `/work-orders/${target.id}`, staffLink: `/work-orders/${target.id}`, description: visit.description,
        visitShopId: visit.shopId,
        ...(shopRows[0] ? { shop: shopRows[0] } : {}),
      };
    }
    case 'event': {
      if (!target.carId) {
        throw new AppError('validation_failed', 'Some fields need attention.', { [carField]: ['Say which car this event thread is about'] });
      }
      const rows: { name: string; car_ran: boolean }[] = await db.query(
        'SELECT e.name, EXISTS (SELECT 1 FROM runs r WHERE r.event_id = e.id AND r.car_id = $2) AS car_ran FROM events e WHERE e.id = $1',
        [target.id, target.carId],
      );
      const e = rows[0];
      if (!e) throw missing();
      resolved = {
        type: 'event', id: target.id, carId: target.carId,
        driverLink: eventBoardFor(target.id, target.carId, target.id),
        staffLink: customerPageAt(target.carId, target.id, target.id),
        description: e.name,
      };
      await checkCar(db, user, resolved, action, missing);
      if (!e.car_ran) {
        try {
          await assertEventAccess(db, user, target.id);
        } catch {
          throw missing();
        }
      }
      return resolved;
    }
  }
  await checkCar(db, user, resolved, action, missing);
  return resolved;
}

/** 404 (naming the target) when the car is not the user's to see; 403 when they see it but may not do this. */
async function checkCar(db: Queryable, user: User, target: ResolvedTarget, action: CarAction, missing: () => AppError) {
  try {
    await assertCarAccess(db, user, target.carId, action);
  } catch (err) {
    if (err instanceof AppError && err.code === 'not_found') throw missing();
    throw err;
  }
}

interface CommentRow {
  id: string;
  car_id: string;
  run_id: string | null;
  event_id: string | null;
  setup_id: string | null;
  tread_reading_id: string | null;
  work_order_id: string | null;
  author_id: string;
  author_name: string;
  shop_id: string | null;
  shop_name: string | null;
  body: string;
  version: number;
  edited_at: Date | null;
  created_at: Date;
}

const SELECT_COMMENTS = `
  SELECT k.id, k.car_id, k.run_id, k.event_id, k.setup_id, k.tread_reading_id, k.work_order_id, k.author_id, u.display_name AS author_name,
         k.shop_id, s.name AS shop_name, k.body, k.version, k.edited_at, k.created_at
    FROM comments k JOIN users u ON u.id = k.author_id LEFT JOIN shops s ON s.id = k.shop_id`;

function toComment(r: CommentRow, viewer: User): Comment {
  const type = (Object.keys(TARGET_COLUMN) as CommentTargetType[]).find((t) => r[TARGET_COLUMN[t]] !== null)!;
  return {
    id: r.id,
    carId: r.car_id,
    target: { type, id: r[TARGET_COLUMN[type]]! },
    author: { id: r.author_id, displayName: r.author_name },
    shop: r.shop_id && r.shop_name ? { id: r.shop_id, name: r.shop_name } : null,
    body: r.body,
    mine: r.author_id === viewer.id,
    editedAt: r.edited_at?.toISOString() ?? null,
    version: r.version,
    createdAt: r.created_at.toISOString(),
  };
}

async function loadComment(db: Queryable, viewer: User, commentId: string): Promise<Comment | null> {
  const rows: CommentRow[] = await db.query(`${SELECT_COMMENTS} WHERE k.id = $1`, [commentId]);
  return rows[0] ? toComment(rows[0], viewer) : null;
}

/** One thread, oldest first. */
export async function listComments(ds: DataSource, user: User, target: CommentTarget): Promise<Comment[]> {
  const t = await resolveTarget(ds, user, target, 'read', 'carId');
  const column = TARGET_COLUMN[t.type];
  const rows: CommentRow[] = await ds.query(
    `${SELECT_COMMENTS} WHERE k.${column} = $1 AND k.car_id = $2 ORDER BY k.created_at, k.id`,
    [t.id, t.carId],
  );
  return rows.map((r) => toComment(r, user));
}

/**
 * Adds a comment. Staff of a granted shop who do not drive the car sign with the shop's
 * name. The car's drivers and the staff of every shop it is granted to hear about it, in
 * the same transaction. A resent client id answers with the comment already saved.
 */
export async function createComment(
  ds: DataSource,
  mail: MailSettings | undefined,
  user: User,
  input: CreateCommentInput,
): Promise<{ comment: Comment; created: boolean }> {
  const target = await resolveTarget(ds, user, input.target, 'comment', 'target.carId');
  const relations = await carRelations(ds, user.id, target.carId);
  const drives = relations.includes('owner') || relations.includes('co_driver');
  const shop = drives ? null : (target.shop ?? (await grantedShopOf(ds, user.id, target.carId)));
  const { id, created, outbox } = await ds.transaction(async (m) => {
    const { inserted, id: newId } = await insertUnlessPresent(m, CommentEntity, {
      id: input.id ?? randomUUID(),
      carId: target.carId,
      runId: target.type === 'run' ? target.id : null,
      eventId: target.type === 'event' ? target.id : null,
      setupId: target.type === 'setup' ? target.id : null,
      treadReadingId: target.type === 'tread_reading' ? target.id : null,
      workOrderId: target.type === 'work_order' ? target.id : null,
      authorId: user.id,
      shopId: shop?.id ?? null,
      body: input.body,
    });
    if (!inserted) return { id: input.id!, created: false, outbox: [] };
    const audience = await carAudience(m, target.carId);
    const outbox = await notify(m, mail, {
      kind: 'comment',
      actorId: user.id,
      carId: target.carId,
      commentId: newId!,
      summary: `${actorLabel(user.displayName, shop?.name)} commented on ${target.description}`,
      detail: `“${input.body}”`,
      recipients: [
        ...driverRecipients(audience, target.driverLink),
        ...(target.visitShopId
          ? await shopStaffRecipients(m, audience, target.visitShopId, target.staffLink)
          : staffRecipients(audience, { link: target.staffLink })),
      ],
    });
    return { id: newId!, created: true, outbox };
  });
  sendOutbox(mail, outbox);
  const comment = await loadComment(ds, user, id);
  if (!comment || (!created && (comment.author.id !== user.id || comment.target.id !== target.id))) {
    throw new AppError('conflict', 'That comment id is already in use.');
  }
  return { comment, created };
}

/**
 * The comment and what the user may do with it: 404 when they cannot see its car,
 * 403 when they can but did not write it.
 */
async function ownComment(ds: DataSource, user: User, commentId: string, action: 'edit' | 'delete'): Promise<Comment> {
  const comment = await loadComment(ds, user, commentId);
  const missing = () => new AppError('not_found', 'That comment was not found.');
  if (!comment) throw missing();
  // A work order's thread is readable by whoever reads the work order (its shop's staff keep it
  // after a grant is withdrawn); every other thread by whoever reads the car.
  const [row]: { work_order_id: string | null }[] = await ds.query('SELECT work_order_id FROM comments WHERE id = $1', [commentId]);
  const workOrderId = row?.work_order_id ?? null;
  if (workOrderId) {
    await assertWorkOrderAccess(ds, user, workOrderId, 'read').catch((err: unknown) => {
      throw err instanceof AppError && err.code === 'not_found' ? missing() : err;
    });
  } else {
    const relations = await carRelations(ds, user.id, comment.carId);
    if (!relations.some((r) => allows('car', 'read', r))) throw missing();
  }
  if (!allows('comment', action, comment.mine ? 'author' : 'signed_in')) {
    throw new AppError('forbidden', `Only its author can ${action} a comment.`);
  }
  return comment;
}

export async function updateComment(ds: DataSource, user: User, commentId: string, input: UpdateCommentInput): Promise<Comment> {
  await ownComment(ds, user, commentId, 'edit');
  const [, affected]: [unknown, number] = await ds.query(
    `UPDATE comments SET body = $3, version = version + 1, edited_at = now() WHERE id = $1 AND version = $2`,
    [commentId, input.version, input.body],
  );
  const current = await loadComment(ds, user, commentId);
  if (!current) throw new AppError('not_found', 'That comment was not found.');
  if (affected !== 1) throw staleVersion(current);
  return current;
}

export async function deleteComment(ds: DataSource, user: User, commentId: string): Promise<void> {
  await ownComment(ds, user, commentId, 'delete');
  await ds.query('DELETE FROM comments WHERE id = $1', [commentId]);
}
