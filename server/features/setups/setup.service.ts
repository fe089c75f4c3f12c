import type { DataSource, EntityManager } from 'typeorm';
import type { User } from '@shared/auth/auth.schema';
import type { Car } from '@shared/season/car.schema';
import { CORNERS, axleOf, type Corner } from '@shared/season/corners';
import {
  SETUP_CORNER_FIELDS, setupCornerSchema,
  type CreateSetupInput, type SetupCornerField, type QuickChangeInput, type Setup, type SetupCorner, type SetupDiff, type UpdateSetupInput,
} from '@shared/season/setup.schema';
import { diffSetups } from '@shared/season/setup-diff';
import { toFieldErrors, type FieldErrors } from '@shared/api/api-error.schema';
import { AppError, staleVersion } from '../../lib/app-error';
import { assertCarAccess, assertCarChildAccess } from '../../auth/access';
import { adjusterFor, CLICK_FIELDS } from '@shared/season/damper-clicks';
import { carAdjusters } from '../cars/car.service';
import { insertUnlessPresent } from '../../lib/insert';
import { SetupCornerEntity, SetupSnapshotEntity } from './setup.entity';

type Db = DataSource | EntityManager;

const emptyCorner = (): SetupCorner => Object.fromEntries(SETUP_CORNER_FIELDS.map((f) => [f, null])) as SetupCorner;

async function toSetups(db: Db, snapshots: SetupSnapshotEntity[]): Promise<Setup[]> {
  if (snapshots.length === 0) return [];
  const ids = snapshots.map((s) => s.id);
  const corners = await db.getRepository(SetupCornerEntity).createQueryBuilder('c').where('c.setup_id IN (:...ids)', { ids }).getMany();
  const names: { id: string; display_name: string }[] = await db.query('SELECT id, display_name FROM users WHERE id = ANY($1)', [
    [...new Set(snapshots.map((s) => s.createdBy))],
  ]);
  const nameOf = new Map(names.map((n) => [n.id, n.display_name]));
  // Snapshots made by accepting a shop's suggestion name it and the shop.
  const links: { setup_id: string; id: string; title: string; shop_name: string }[] = await db.query(
    `SELECT s.id AS setup_id, g.id, g.title, sh.name AS shop_name
       FROM setup_snapshots s JOIN setup_suggestions g ON g.id = s.suggestion_id JOIN shops sh ON sh.id = g.shop_id
      WHERE s.id = ANY($1)`,
    [ids],
  );
  const suggestionOf = new Map(links.map((l) => [l.setup_id, { id: l.id, title: l.title, shopName: l.shop_name }]));
  // Snapshots written by closing a shop's work order name the visit and the shop.
  const visits: { setup_id: string; id: string; shop_name: string; visit_date: string }[] = await db.query(
    `SELECT s.id AS setup_id, w.id, sh.name AS shop_name, w.visit_date::text AS visit_date
       FROM setup_snapshots s JOIN work_orders w ON w.id = s.work_order_id JOIN shops sh ON sh.id = w.shop_id
      WHERE s.id = ANY($1)`,
    [ids],
  );
  const workOrderOf = new Map(visits.map((v) => [v.setup_id, { id: v.id, shopName: v.shop_name, visitDate: v.visit_date }]));
  return snapshots.map((s) => {
    const byCorner = Object.fromEntries(CORNERS.map((c) => [c, emptyCorner()])) as Record<Corner, SetupCorner>;
    for (const c of corners.filter((x) => x.setupId === s.id)) {
      byCorner[c.corner] = Object.fromEntries(SETUP_CORNER_FIELDS.map((f) => [f, c[f]])) as SetupCorner;
    }
    return {
      id: s.id,
      carId: s.carId,
      label: s.label,
      effectiveFrom: s.effectiveFrom.toISOString(),
      createdBy: { id: s.createdBy, displayName: nameOf.get(s.createdBy) ?? '' },
      derivedFromId: s.derivedFromId,
      suggestion: suggestionOf.get(s.id) ?? null,
      workOrder: workOrderOf.get(s.id) ?? null,
      notes: s.notes,
      corners: byCorner,
      axles: { front: { antiRollBar: s.frontAntiRollBar }, rear: { antiRollBar: s.rearAntiRollBar } },
      version: s.version,
      createdAt: s.createdAt.toISOString(),
      updatedAt: s.updatedAt.toISOString(),
    };
  });
}

export async function loadSetup(db: Db, setupId: string): Promise<Setup> {
  const s = await db.getRepository(SetupSnapshotEntity).findOneBy({ id: setupId });
  if (!s) throw new AppError('not_found', 'That setup was not found.');
  return (await toSetups(db, [s]))[0]!;
}

/** The snapshot in force on the car at `at`: latest effectiveFrom not after it. */
export async function activeSetupAt(db: Db, carId: string, at: Date): Promise<Setup | null> {
  const s = await db
    .getRepository(SetupSnapshotEntity)
    .createQueryBuilder('s')
    .where('s.car_id = :carId AND s.effective_from <= :at', { carId, at })
    .orderBy('s.effective_from', 'DESC')
    .addOrderBy('s.created_at', 'DESC')
    .addOrderBy('s.id', 'DESC')
    .limit(1)
    .getOne();
  return s ? (await toSetups(db, [s]))[0]! : null;
}

/** Clicks must lie within the car's adjuster: 0 to its number of positions (rebound clicks: the rebound adjuster's, if described). */
function checkClicks(adjusters: Car['damperAdjusters'], corners: Partial<Record<Corner, SetupCorner | undefined>>, prefix = 'corners') {
  const errors: FieldErrors = {};
  for (const corner of CORNERS) {
    const values = corners[corner];
    if (!values) continue;
    for (const field of CLICK_FIELDS) {
      const positions = adjusterFor(adjusters, axleOf(corner), field)?.positions;
      const v = values[field];
      if (positions !== undefined && v !== null && v !== undefined && v > positions) {
        errors[`${prefix}.${corner}.${field}`] = [`This adjuster has ${positions} clicks; use 0 to ${positions}`];
      }
    }
  }
  if (Object.keys(errors).length) throw new AppError('validation_failed', 'Some fields need attention.', errors);
}

/**
 * A whole snapshot's corners, made on the server (a visit's handover) rather than typed: each corner in the
 * setup's ranges and the clicks within the car's adjusters, or a 400 naming each field (`corners.lf.damperClicks`).
 */
export async function checkSnapshotCorners(db: Db, carId: string, corners: Record<Corner, SetupCorner>) {
  const errors: FieldErrors = {};
  for (const corner of CORNERS) {
    const result = setupCornerSchema.safeParse(corners[corner]);
    if (result.success) continue;
    for (const [key, messages] of Object.entries(toFieldErrors(result.error))) (errors[`corners.${corner}.${key}`] ??= []).push(...messages);
  }
  if (Object.keys(errors).length) throw new AppError('validation_failed', 'Some fields need attention.', errors);
  checkClicks(await carAdjusters(db, carId), corners);
}

/**
 * Writes the corners given. A field left out keeps its stored value (an edit of one
 * value must not wipe the rest); null clears it.
 */
async function writeCorners(m: EntityManager, setupId: string, corners: Partial<Record<Corner, SetupCorner | undefined>>) {
  const repo = m.getRepository(SetupCornerEntity);
  for (const corner of CORNERS) {
    const values = corners[corner];
    if (!values) continue;
    const stored = await repo.findOneBy({ setupId, corner });
    const row = { setupId, corner, ...emptyCorner() } as SetupCornerEntity;
    for (const f of SETUP_CORNER_FIELDS) row[f] = (values[f] !== undefined ? values[f] : (stored?.[f] ?? null)) as never;
    await repo.save(row);
  }
}

export async function createSetup(ds: DataSource, user: User, carId: string, input: CreateSetupInput): Promise<{ setup: Setup; created: boolean }> {
  await assertCarAccess(ds, user, carId, 'write');
  checkClicks(await carAdjusters(ds, carId), input.corners);
  const effectiveFrom = new Date(input.effectiveFrom);
  if (input.derivedFromId) await assertSameCar(ds, input.derivedFromId, carId, 'derivedFromId');
  const { id, created } = await ds.transaction(async (m) => {
    const derivedFromId = input.derivedFromId ?? (await activeSetupAt(m, carId, effectiveFrom))?.id ?? null;
    return insertSnapshot(m, user, carId, { ...input, derivedFromId });
  });
  if (!created) return { setup: await existingOfCar(ds, id, carId), created: false };
  return { setup: await loadSetup(ds, id), created: true };
}

/**
 * Writes one snapshot and its corners inside the caller's transaction (access and values
 * already checked). A client id already used answers `created: false` with that id.
 */
export async function insertSnapshot(
  m: EntityManager,
  user: User,
  carId: string,
  input: CreateSetupInput,
  opts: { suggestionId?: string } = {},
): Promise<{ id: string; created: boolean }> {
  const { inserted, id: newId } = await insertUnlessPresent(m, SetupSnapshotEntity, {
    ...(input.id ? { id: input.id } : {}),
    carId,
    label: input.label,
    effectiveFrom: new Date(input.effectiveFrom),
    createdBy: user.id,
    derivedFromId: input.derivedFromId ?? null,
    notes: input.notes ?? null,
    frontAntiRollBar: input.axles.front?.antiRollBar ?? null,
    rearAntiRollBar: input.axles.rear?.antiRollBar ?? null,
  });
  if (!inserted) return { id: input.id!, created: false };
  await writeCorners(m, newId!, input.corners);
  if (opts.suggestionId) await m.query('UPDATE setup_snapshots SET suggestion_id = $2 WHERE id = $1', [newId, opts.suggestionId]);
  return { id: newId!, created: true };
}

/** A replayed client id: the stored snapshot, if it belongs to this car. */
async function existingOfCar(ds: DataSource, id: string, carId: string): Promise<Setup> {
  const existing = await ds.getRepository(SetupSnapshotEntity).findOneBy({ id });
  if (!existing || existing.carId !== carId) throw new AppError('conflict', 'That setup id is already in use.');
  return loadSetup(ds, id);
}

async function assertSameCar(db: Db, setupId: string, carId: string, field: string) {
  const s = await db.getRepository(SetupSnapshotEntity).findOneBy({ id: setupId });
  if (!s || s.carId !== carId) {
    throw new AppError('validation_failed', 'Some fields need attention.', { [field]: ['Pick a setup of this car'] });
  }
}

/** Every snapshot of a car, oldest first (callers have checked access). */
export async function setupsOfCar(db: Db, carId: string): Promise<Setup[]> {
  const snapshots = await db.getRepository(SetupSnapshotEntity).find({ where: { carId }, order: { effectiveFrom: 'ASC', createdAt: 'ASC' } });
  return toSetups(db, snapshots);
}

export async function listSetups(ds: DataSource, user: User, carId: string): Promise<Setup[]> {
  await assertCarAccess(ds, user, carId, 'read');
  const snapshots = await ds.getRepository(SetupSnapshotEntity).find({
    where: { carId },
    order: { effectiveFrom: 'DESC', createdAt: 'DESC' },
  });
  return toSetups(ds, snapshots);
}

export async function getSetup(ds: DataSource, user: User, setupId: string): Promise<Setup> {
  await assertCarChildAccess(ds, user, 'setup_snapshots', setupId, 'read', 'That setup');
  return loadSetup(ds, setupId);
}

export async function updateSetup(ds: DataSource, user: User, setupId: string, input: UpdateSetupInput): Promise<Setup> {
  const carId = await assertCarChildAccess(ds, user, 'setup_snapshots', setupId, 'write', 'That setup');
  if (input.corners) checkClicks(await carAdjusters(ds, carId), input.corners);
  if (input.derivedFromId) {
    if (input.derivedFromId === setupId) {
      throw new AppError('validation_failed', 'Some fields need attention.', { derivedFromId: ['A setup cannot be derived from itself'] });
    }
    await assertSameCar(ds, input.derivedFromId, carId, 'derivedFromId');
  }
  const set: Partial<Record<keyof SetupSnapshotEntity, unknown>> = {};
  if (input.label !== undefined) set.label = input.label;
  if (input.effectiveFrom !== undefined) set.effectiveFrom = new Date(input.effectiveFrom);
  if (input.notes !== undefined) set.notes = input.notes;
  if (input.derivedFromId !== undefined) set.derivedFromId = input.derivedFromId;
  if (input.axles?.front !== undefined) set.frontAntiRollBar = input.axles.front.antiRollBar ?? null;
  if (input.axles?.rear !== undefined) set.rearAntiRollBar = input.axles.rear.antiRollBar ?? null;
  const updated = await ds.transaction(async (m) => {
    const result = await m
      .createQueryBuilder()
      .update(SetupSnapshotEntity)
      .set({ ...set, version: () => 'version + 1', updatedAt: () => 'now()' })
      .where('id = :setupId AND version = :version', { setupId, version: input.version })
      .execute();
    if (result.affected !== 1) return false;
    if (input.corners) await writeCorners(m, setupId, input.corners);
    return true;
  });
  if (!updated) throw staleVersion(await loadSetup(ds, setupId));
  return loadSetup(ds, setupId);
}

/** Deleting a snapshot re-ties its runs to whatever was in force before it (the tie is computed on read). */
export async function deleteSetup(ds: DataSource, user: User, setupId: string): Promise<void> {
  await assertCarChildAccess(ds, user, 'setup_snapshots', setupId, 'write', 'That setup');
  await ds.getRepository(SetupSnapshotEntity).delete({ id: setupId });
}

/** A corner field in words, as messages name it. */
export const FIELD_WORDS: Record<SetupCornerField, string> = {
  camberDeg: 'camber', toeMm: 'toe', casterDeg: 'caster', springRateNPerMm: 'spring rate', rideHeightMm: 'ride height',
  damperClicks: 'clicks', damperReboundClicks: 'rebound clicks', coldPressureKpa: 'cold pressure', cornerWeightKg: 'corner weight',
};

function describeCorners(corners: Corner[]): string {
  const set = new Set(corners);
  if (set.size === 4) return 'all';
  if (set.size === 2 && set.has('lf') && set.has('rf')) return 'front';
  if (set.size === 2 && set.has('lr') && set.has('rr')) return 'rear';
  return [...set].map((c) => c.toUpperCase()).join('+');
}

/** A change to some corners' field: by a delta, or to a value (exactly one is given). */
export interface CornerChange {
  field: SetupCornerField;
  corners: Corner[];
  delta?: number;
  value?: number;
}

/** One corner's value before and after one change. */
export interface AppliedStep {
  field: SetupCornerField;
  corner: Corner;
  from: number | null;
  to: number | null;
}

/**
 * Applies the changes in order to a copy of `start` and checks the result against the
 * setup field limits. Errors are keyed `changes.<i>.delta|value`, naming the corner.
 */
export function applyCornerChanges(start: Record<Corner, SetupCorner> | null, changes: CornerChange[]) {
  const corners = Object.fromEntries(CORNERS.map((c) => [c, { ...(start?.[c] ?? emptyCorner()) }])) as Record<Corner, SetupCorner>;
  const errors: FieldErrors = {};
  const words: string[] = [];
  // The words of changes that moved nothing (a value set to what it was), named only when no change moved anything.
  const idle: string[] = [];
  const steps: AppliedStep[] = [];
  changes.forEach((change, i) => {
    let moved = false;
    for (const corner of change.corners) {
      const current = corners[corner][change.field] ?? null;
      if (change.value !== undefined) {
        corners[corner][change.field] = change.value;
      } else if (current === null) {
        (errors[`changes.${i}.delta`] ??= []).push(`No current ${FIELD_WORDS[change.field]} on ${corner.toUpperCase()} to change; give a value instead`);
      } else {
        corners[corner][change.field] = Math.round((current + change.delta!) * 1e6) / 1e6;
      }
      steps.push({ field: change.field, corner, from: current, to: corners[corner][change.field] ?? null });
      moved ||= current !== (corners[corner][change.field] ?? null);
    }
    const amount = change.value !== undefined ? `= ${change.value}` : `${change.delta! > 0 ? '+' : ''}${change.delta}`;
    (moved ? words : idle).push(`${describeCorners(change.corners)} ${FIELD_WORDS[change.field]} ${amount}`);
  });
  if (words.length === 0) words.push(...idle);
  for (const corner of CORNERS) {
    const result = setupCornerSchema.safeParse(corners[corner]);
    if (!result.success) {
      for (const [key, messages] of Object.entries(toFieldErrors(result.error))) {
        const i = changes.findIndex((c) => c.field === key && c.corners.includes(corner));
        (errors[`changes.${Math.max(i, 0)}.${i >= 0 && changes[i]!.value !== undefined ? 'value' : 'delta'}`] ??= []).push(
          `${corner.toUpperCase()}: ${messages.join('; ')}`,
        );
      }
    }
  }
  return { corners, errors, words, steps };
}

/** Clicks after the changes must fit the car's adjusters; errors keyed like applyCornerChanges. */
export function checkChangedClicks(adjusters: Car['damperAdjusters'], corners: Record<Corner, SetupCorner>, changes: CornerChange[]) {
  try {
    checkClicks(adjusters, corners);
  } catch (err) {
    if (err instanceof AppError && err.fieldErrors) {
      const remapped: FieldErrors = {};
      for (const [key, messages] of Object.entries(err.fieldErrors)) {
        const [, corner, field] = key.split('.');
        const i = changes.findIndex((c) => c.field === field && c.corners.includes(corner as Corner));
        const where = i >= 0 && changes[i]!.value !== undefined ? 'value' : 'delta';
        (remapped[`changes.${Math.max(i, 0)}.${where}`] ??= []).push(...messages.map((m) => `${corner!.toUpperCase()}: ${m}`));
      }
      throw new AppError('validation_failed', 'Some fields need attention.', remapped);
    }
    throw err;
  }
}

/** A new snapshot derived from the active one, with a few values nudged; effective now unless told otherwise. */
export async function quickChange(ds: DataSource, user: User, carId: string, input: QuickChangeInput): Promise<{ setup: Setup; created: boolean }> {
  await assertCarAccess(ds, user, carId, 'write');
  if (input.id) {
    // A replay of a quick change already made: answer with it rather than applying the deltas twice.
    const existing = await ds.getRepository(SetupSnapshotEntity).findOneBy({ id: input.id });
    if (existing) return { setup: await existingOfCar(ds, existing.id, carId), created: false };
  }
  const effectiveFrom = input.effectiveFrom ? new Date(input.effectiveFrom) : new Date();
  const active = await activeSetupAt(ds, carId, effectiveFrom);
  const { corners, errors, words } = applyCornerChanges(active?.corners ?? null, input.changes);
  if (Object.keys(errors).length) throw new AppError('validation_failed', 'Some fields need attention.', errors);
  checkChangedClicks(await carAdjusters(ds, carId), corners, input.changes);
  const created = await createSetup(ds, user, carId, {
    ...(input.id ? { id: input.id } : {}),
    label: input.label ?? `Quick change: ${words.join(', ')}`,
    effectiveFrom: effectiveFrom.toISOString(),
    corners,
    axles: { front: { antiRollBar: active?.axles.front.antiRollBar ?? null }, rear: { antiRollBar: active?.axles.rear.antiRollBar ?? null } },
    derivedFromId: active?.id ?? null,
    notes: input.notes ?? null,
  });
  return created;
}

export async function diff(ds: DataSource, user: User, fromId: string, toId: string): Promise<SetupDiff> {
  await assertCarChildAccess(ds, user, 'setup_snapshots', fromId, 'read', 'That setup');
  await assertCarChildAccess(ds, user, 'setup_snapshots', toId, 'read', 'That setup');
  const [a, b] = await Promise.all([loadSetup(ds, fromId), loadSetup(ds, toId)]);
  return { fromId, toId, changes: diffSetups(a, b) };
}
