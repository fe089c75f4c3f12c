import type { DataSource, EntityManager } from 'typeorm';
import type { User } from '@shared/auth/auth.schema';
import { CORNERS, type PerCorner } from '@shared/season/corners';
import type { CreatePressureReadingInput, PressureReading } from '@shared/season/tyre.schema';
import { AppError } from '../../lib/app-error';
import { assertCarAccess } from '../../auth/access';
import { insertUnlessPresent } from '../../lib/insert';
import { PressureReadingEntity } from './pressure.entity';

function toReading(p: PressureReadingEntity): PressureReading {
  const corners: PerCorner<number> = {};
  for (const c of CORNERS) {
    const v = p[`${c}Kpa`];
    if (v !== null) corners[c] = v;
  }
  return { id: p.id, carId: p.carId, kind: p.kind, takenAt: p.takenAt.toISOString(), runId: p.runId, corners };
}

/** Replaces a run's hot pressures (inside the run's own transaction). */
export async function writeRunHotPressures(
  m: EntityManager,
  run: { id: string; carId: string; recordedAt: Date },
  userId: string,
  pressures: PerCorner<number> | null,
) {
  await m.getRepository(PressureReadingEntity).delete({ runId: run.id, kind: 'hot' });
  if (!pressures || Object.keys(pressures).length === 0) return;
  await m.getRepository(PressureReadingEntity).save({
    carId: run.carId,
    kind: 'hot',
    takenAt: run.recordedAt,
    runId: run.id,
    lfKpa: pressures.lf ?? null,
    rfKpa: pressures.rf ?? null,
    lrKpa: pressures.lr ?? null,
    rrKpa: pressures.rr ?? null,
    createdBy: userId,
  });
}

export async function createPressureReading(ds: DataSource, user: User, carId: string, input: CreatePressureReadingInput) {
  await assertCarAccess(ds, user, carId, 'write');
  const repo = ds.getRepository(PressureReadingEntity);
  if (input.runId) {
    const rows: { car_id: string }[] = await ds.query('SELECT car_id FROM runs WHERE id = $1', [input.runId]);
    if (rows[0]?.car_id !== carId) {
      throw new AppError('validation_failed', 'Some fields need attention.', { runId: ['Pick a run of this car'] });
    }
  }
  const { inserted, id } = await insertUnlessPresent(ds.manager, PressureReadingEntity, {
    ...(input.id ? { id: input.id } : {}),
    carId,
    kind: input.kind,
    takenAt: new Date(input.takenAt),
    runId: input.runId ?? null,
    lfKpa: input.corners.lf ?? null,
    rfKpa: input.corners.rf ?? null,
    lrKpa: input.corners.lr ?? null,
    rrKpa: input.corners.rr ?? null,
    createdBy: user.id,
  });
  const saved = inserted || input.id ? await repo.findOneBy({ id: id ?? input.id! }) : null;
  if (saved && saved.carId === carId) return { reading: toReading(saved), created: inserted };
  if (saved) throw new AppError('conflict', 'That reading id is already in use.');
  // Nothing inserted and no row with this id: the run already has readings of this kind.
  throw new AppError('conflict', `This run already has ${input.kind} pressures; edit them instead.`, {
    runId: [`This run already has ${input.kind} pressures`],
  });
}

export async function listPressureReadings(ds: DataSource, user: User, carId: string): Promise<PressureReading[]> {
  await assertCarAccess(ds, user, carId, 'read');
  const rows = await ds.getRepository(PressureReadingEntity).find({ where: { carId }, order: { takenAt: 'ASC' } });
  return rows.map(toReading);
}
