import type { DataSource } from 'typeorm';
import type { User } from '@shared/auth/auth.schema';
import type { ChangeLogEntry, CreateChangeInput } from '@shared/season/change-log.schema';
import { AppError } from '../../lib/app-error';
import { assertCarAccess } from '../../auth/access';
import { insertUnlessPresent } from '../../lib/insert';
import { ChangeLogEntity } from './change.entity';

async function toEntries(ds: DataSource, rows: ChangeLogEntity[]): Promise<ChangeLogEntry[]> {
  if (rows.length === 0) return [];
  const names: { id: string; display_name: string }[] = await ds.query('SELECT id, display_name FROM users WHERE id = ANY($1)', [
    [...new Set(rows.map((r) => r.createdBy))],
  ]);
  const nameOf = new Map(names.map((n) => [n.id, n.display_name]));
  return rows.map((r) => ({
    id: r.id,
    carId: r.carId,
    changedOn: r.changedOn,
    what: r.what,
    location: r.location,
    notes: r.notes,
    setupId: r.setupId,
    fromVisit: r.workOrderId !== null,
    createdBy: { id: r.createdBy, displayName: nameOf.get(r.createdBy) ?? '' },
    createdAt: r.createdAt.toISOString(),
  }));
}

export async function createChange(ds: DataSource, user: User, carId: string, input: CreateChangeInput) {
  await assertCarAccess(ds, user, carId, 'write');
  const repo = ds.getRepository(ChangeLogEntity);
  if (input.setupId) {
    const rows: { car_id: string }[] = await ds.query('SELECT car_id FROM setup_snapshots WHERE id = $1', [input.setupId]);
    if (rows[0]?.car_id !== carId) {
      throw new AppError('validation_failed', 'Some fields need attention.', { setupId: ['Pick a setup of this car'] });
    }
  }
  const { inserted, id } = await insertUnlessPresent(ds.manager, ChangeLogEntity, {
    ...(input.id ? { id: input.id } : {}),
    carId,
    changedOn: input.changedOn,
    what: input.what,
    location: input.location,
    notes: input.notes ?? null,
    setupId: input.setupId ?? null,
    createdBy: user.id,
  });
  const saved = await repo.findOneBy({ id: id ?? input.id! });
  if (!saved || saved.carId !== carId) throw new AppError('conflict', 'That entry id is already in use.');
  return { entry: (await toEntries(ds, [saved]))[0]!, created: inserted };
}

export async function listChanges(ds: DataSource, user: User, carId: string): Promise<ChangeLogEntry[]> {
  await assertCarAccess(ds, user, carId, 'read');
  const rows = await ds.getRepository(ChangeLogEntity).find({ where: { carId }, order: { changedOn: 'ASC', createdAt: 'ASC' } });
  return toEntries(ds, rows);
}

/**
 * Deletes one entry of the car's change log (a mistaken one); its setup, if it named one, stays. Drivers of the
 * car only. An entry a shop wrote when it handed the car back belongs with that visit's record and stays (409).
 */
export async function deleteChange(ds: DataSource, user: User, carId: string, changeId: string): Promise<void> {
  await assertCarAccess(ds, user, carId, 'write');
  const rows: { from_visit: boolean; deleted: boolean }[] = await ds.query(
    `WITH gone AS (DELETE FROM change_log WHERE id = $1 AND car_id = $2 AND work_order_id IS NULL RETURNING id)
     SELECT c.work_order_id IS NOT NULL AS from_visit, EXISTS (SELECT 1 FROM gone) AS deleted
       FROM change_log c WHERE c.id = $1 AND c.car_id = $2`,
    [changeId, carId],
  );
  // The CTE's snapshot still sees a row it deletes: `deleted` tells the two apart.
  const row = rows[0];
  if (row?.deleted) return;
  if (row?.from_visit) throw new AppError('conflict', 'This entry was written by a shop when it handed the car back; it stays with that visit.');
  // Not there, or deleted by another request a moment ago.
  throw new AppError('not_found', 'That change-log entry was not found.');
}
