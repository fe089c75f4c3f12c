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
