import type { DataSource, EntityManager } from 'typeorm';
import type { User } from '@shared/auth/auth.schema';
import { CORNERS, type Corner } from '@shared/season/corners';
import { LIMITS } from '@shared/season/limits';
import type {
  CreateMountingInput, CreateTreadReadingInput, CreateTyreSetInput, TreadReading, TyreMounting, TyreSet,
} from '@shared/season/tyre.schema';
import type { FieldErrors } from '@shared/api/api-error.schema';
import { AppError } from '../../lib/app-error';
import { assertCarAccess, assertCarChildAccess, assertEventAccess } from '../../auth/access';
import { insertUnlessPresent } from '../../lib/insert';
import { TreadReadingCornerEntity, TreadReadingEntity, TyreMountingEntity, TyreSetEntity } from './tyre.entity';

type Db = DataSource | EntityManager;

const toMounting = (m: TyreMountingEntity): TyreMounting => ({
  id: m.id,
  mountedAt: m.mountedAt.toISOString(),
  positions: { lf: m.lfTyre, rf: m.rfTyre, lr: m.lrTyre, rr: m.rrTyre },
});

/** The tyre number on `corner` at `at`, from the latest mounting not after it. */
function tyreOn(mountings: TyreMountingEntity[], corner: Corner, at: Date): number | null {
  let found: TyreMountingEntity | null = null;
  for (const m of mountings) if (m.mountedAt <= at && (!found || m.mountedAt >= found.mountedAt)) found = m;
  // Before the first recorded mounting, the set was as first fitted.
  found ??= mountings.reduce<TyreMountingEntity | null>((a, m) => (!a || m.mountedAt < a.mountedAt ? m : a), null);
  return found ? found[`${corner}Tyre`] : null;
}

async function readingsOf(db: Db, setIds: string[], latestOnly: boolean): Promise<TreadReading[]> {
  if (setIds.length === 0) return [];
  const readings: TreadReadingEntity[] = latestOnly
    ? await db.query(
        `SELECT DISTINCT ON (tyre_set_id) id, tyre_set_id AS "tyreSetId", taken_at AS "takenAt", event_id AS "eventId",
                notes, created_at AS "createdAt"
           FROM tread_readings WHERE tyre_set_id = ANY($1) ORDER BY tyre_set_id, taken_at DESC, created_at DESC`,
        [setIds],
      )
    : await db
        .getRepository(TreadReadingEntity)
        .createQueryBuilder('t')
        .where('t.tyre_set_id IN (:...setIds)', { setIds })
        .orderBy('t.taken_at', 'ASC')
        .getMany();
  if (readings.length === 0) return [];
  const ids = readings.map((r) => r.id);
  const corners = await db.getRepository(TreadReadingCornerEntity).createQueryBuilder('c').where('c.reading_id IN (:...ids)', { ids }).getMany();
  const mountings = await db
    .getRepository(TyreMountingEntity)
    .createQueryBuilder('m')
    .where('m.tyre_set_id IN (:...setIds)', { setIds })
    .getMany();
  // The runs made on the set up to each reading (see runs_with_tyre_set).
  const runsBefore = new Map(
    (
      (await db.query(
        `WITH on_set AS MATERIALIZED (
           SELECT r.tyre_set_id, r.recorded_at FROM runs_with_tyre_set r
            WHERE r.car_id IN (SELECT car_id FROM tyre_sets WHERE id = ANY($2)) AND r.tyre_set_id = ANY($2)
         )
         SELECT t.id, (SELECT count(*)::int FROM on_set o WHERE o.tyre_set_id = t.tyre_set_id AND o.recorded_at <= t.taken_at) AS n
           FROM tread_readings t WHERE t.id = ANY($1)`,
        [ids, setIds],
      )) as { id: string; n: number }[]
    ).map((r) => [r.id, r.n]),
  );
  return readings.map((r) => {
    const takenAt = new Date(r.takenAt);
    const setMountings = mountings.filter((m) => m.tyreSetId === r.tyreSetId);
    const out: TreadReading['corners'] = {};
    for (const c of corners.filter((x) => x.readingId === r.id)) {
      out[c.corner] = { innerMm: c.innerMm, middleMm: c.middleMm, outerMm: c.outerMm, tyreNumber: tyreOn(setMountings, c.corner, takenAt) };
    }
    return {
      id: r.id,
      tyreSetId: r.tyreSetId,
      takenAt: takenAt.toISOString(),
      eventId: r.eventId,
      corners: out,
      runsOnSet: runsBefore.get(r.id) ?? 0,
      notes: r.notes,
      createdAt: new Date(r.createdAt).toISOString(),
    };
  });
}

/** Each set's latest reading: taken last, and of two taken at once the one entered last (as `readingsOf` picks it). */
function latestOfEach(readings: readonly TreadReading[]): TreadReading[] {
  const latest = new Map<string, TreadReading>();
  for (const r of readings) {
    const seen = latest.get(r.tyreSetId);
    if (!seen || r.takenAt > seen.takenAt || (r.takenAt === seen.takenAt && r.createdAt >= seen.createdAt)) latest.set(r.tyreSetId, r);
  }
  return [...latest.values()];
}

/** `allReadings`: every reading of these sets when the caller has them already; else the latest are read here. */
async function toTyreSets(db: Db, sets: TyreSetEntity[], allReadings?: readonly TreadReading[]): Promise<TyreSet[]> {
  const ids = sets.map((s) => s.id);
  const mountings = ids.length
    ? await db.getRepository(TyreMountingEntity).createQueryBuilder('m').where('m.tyre_set_id IN (:...ids)', { ids }).orderBy('m.mounted_at', 'ASC').getMany()
    : [];
  const latest = allReadings ? latestOfEach(allReadings) : await readingsOf(db, ids, true);
  const runs = new Map(
    ids.length
      ? (
          (await db.query(
            // By car first: the view ties every run it reads to a set.
            `SELECT tyre_set_id, count(*)::int AS n FROM runs_with_tyre_set WHERE car_id = ANY($1) AND tyre_set_id = ANY($2) GROUP BY tyre_set_id`,
            [[...new Set(sets.map((s) => s.carId))], ids],
          )) as { tyre_set_id: string; n: number }[]
        ).map((r) => [r.tyre_set_id, r.n])
      : [],
  );
  return sets.map((s) => ({
    id: s.id,
    carId: s.carId,
    label: s.label,
    size: s.size,
    boughtOn: s.boughtOn,
    startTreadMm: s.startTreadMm,
    notes: s.notes,
    mountings: mountings.filter((m) => m.tyreSetId === s.id).map(toMounting),
    latestReading: latest.find((r) => r.tyreSetId === s.id) ?? null,
    runs: runs.get(s.id) ?? 0,
    createdAt: s.createdAt.toISOString(),
  }));
}

/** A new set starts with tyre 1 on LF, 2 on RF, 3 on LR, 4 on RR; rotations add mountings. */
export async function createTyreSet(ds: DataSource, user: User, carId: string, input: CreateTyreSetInput) {
  await assertCarAccess(ds, user, carId, 'write');
  const { id, created } = await ds.transaction(async (m) => {
    const { inserted, id: newId } = await insertUnlessPresent(m, TyreSetEntity, {
      ...(input.id ? { id: input.id } : {}),
      carId,
      label: input.label,
      size: input.size ?? null,
      boughtOn: input.boughtOn ?? null,
      startTreadMm: input.startTreadMm ?? null,
      notes: input.notes ?? null,
    });
    if (!inserted) return { id: input.id!, created: false };
    const mountedAt = input.boughtOn ? new Date(`${input.boughtOn}T00:00:00Z`) : new Date();
    await m.getRepository(TyreMountingEntity).save({ tyreSetId: newId!, mountedAt, lfTyre: 1, rfTyre: 2, lrTyre: 3, rrTyre: 4 });
    return { id: newId!, created: true };
  });
  const saved = await ds.getRepository(TyreSetEntity).findOneBy({ id });
  if (!saved || saved.carId !== carId) throw new AppError('conflict', 'That tyre set id is already in use.');
  return { tyreSet: (await toTyreSets(ds, [saved]))[0]!, created };
}

/** A car's tyre sets and all their readings, oldest first (callers have checked access). */
export async function tyreSetsWithReadings(db: Db, carId: string): Promise<{ set: TyreSet; readings: TreadReading[] }[]> {
  const sets = await db.getRepository(TyreSetEntity).find({ where: { carId }, order: { createdAt: 'ASC' } });
  // Read once: the sets' latest readings come from the same list.
  const readings = await readingsOf(db, sets.map((s) => s.id), false);
  const dtos = await toTyreSets(db, sets, readings);
  return dtos.map((set) => ({ set, readings: readings.filter((r) => r.tyreSetId === set.id) }));
}

export async function listTyreSets(ds: DataSource, user: User, carId: string): Promise<TyreSet[]> {
  await assertCarAccess(ds, user, carId, 'read');
  const sets = await ds.getRepository(TyreSetEntity).find({ where: { carId }, order: { createdAt: 'ASC' } });
  return toTyreSets(ds, sets);
}

/** `created` is false when this id was already saved (a phone sending its queued rotation again). */
export async function addMounting(
  ds: DataSource, user: User, tyreSetId: string, input: CreateMountingInput,
): Promise<{ mounting: TyreMounting; created: boolean }> {
  await assertCarChildAccess(ds, user, 'tyre_sets', tyreSetId, 'write', 'That tyre set');
  const p = input.positions;
  const { id, inserted } = await insertUnlessPresent(ds.manager, TyreMountingEntity, {
    ...(input.id ? { id: input.id } : {}),
    tyreSetId, mountedAt: new Date(input.mountedAt), lfTyre: p.lf, rfTyre: p.rf, lrTyre: p.lr, rrTyre: p.rr,
  });
  const saved = await ds.getRepository(TyreMountingEntity).findOneBy({ id: id ?? input.id! });
  if (!saved || saved.tyreSetId !== tyreSetId) throw new AppError('conflict', 'That rotation id is already in use.');
  return { mounting: toMounting(saved), created: inserted };
}

/**
 * Tread depths must be 0–20 mm, and a middle reading may not exceed the set's
 * starting depth by more than 1 mm (a gauge's tolerance; more means a typo).
 */
export async function createTreadReading(ds: DataSource, user: User, tyreSetId: string, input: CreateTreadReadingInput) {
  await assertCarChildAccess(ds, user, 'tyre_sets', tyreSetId, 'write', 'That tyre set');
  const set = await ds.getRepository(TyreSetEntity).findOneByOrFail({ id: tyreSetId });
  if (input.eventId) await assertEventAccess(ds, user, input.eventId);
  const errors: FieldErrors = {};
  if (set.startTreadMm !== null) {
    const cap = set.startTreadMm + LIMITS.treadAboveStartMm;
    for (const corner of CORNERS) {
      const c = input.corners[corner];
      if (c && c.middleMm > cap) {
        errors[`corners.${corner}.middleMm`] = [`Above this set's starting depth of ${set.startTreadMm} mm by more than ${LIMITS.treadAboveStartMm} mm; check the reading`];
      }
    }
  }
  if (Object.keys(errors).length) throw new AppError('validation_failed', 'Some fields need attention.', errors);
  const { id, created } = await ds.transaction(async (m) => {
    const { inserted, id: newId } = await insertUnlessPresent(m, TreadReadingEntity, {
      ...(input.id ? { id: input.id } : {}),
      tyreSetId,
      takenAt: new Date(input.takenAt),
      eventId: input.eventId ?? null,
      notes: input.notes ?? null,
      createdBy: user.id,
    });
    if (!inserted) return { id: input.id!, created: false };
    for (const corner of CORNERS) {
      const c = input.corners[corner];
      if (c) await m.getRepository(TreadReadingCornerEntity).save({ readingId: newId!, corner, ...c });
    }
    return { id: newId!, created: true };
  });
  const reading = (await readingsOf(ds, [tyreSetId], false)).find((r) => r.id === id);
  if (!reading) throw new AppError('conflict', 'That reading id is already in use.');
  return { reading, created };
}

export async function listTreadReadings(ds: DataSource, user: User, tyreSetId: string): Promise<TreadReading[]> {
  await assertCarChildAccess(ds, user, 'tyre_sets', tyreSetId, 'read', 'That tyre set');
  return readingsOf(ds, [tyreSetId], false);
}

/**
 * Deletes one tread reading of the set (a mistyped one), with its corners, comments and photos (the database
 * cascades). Drivers of the car only; a reading of another set is not found.
 */
export async function deleteTreadReading(ds: DataSource, user: User, tyreSetId: string, readingId: string): Promise<void> {
  await assertCarChildAccess(ds, user, 'tyre_sets', tyreSetId, 'write', 'That tyre set');
  const [{ n }] = (await ds.query(
    'WITH gone AS (DELETE FROM tread_readings WHERE id = $1 AND tyre_set_id = $2 RETURNING id) SELECT count(*)::int AS n FROM gone',
    [readingId, tyreSetId],
  )) as [{ n: number }];
  if (n === 0) throw new AppError('not_found', 'That tread reading was not found.');
}
