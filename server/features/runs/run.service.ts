import type { DataSource, EntityManager } from 'typeorm';
import type { User } from '@shared/auth/auth.schema';
import { CORNERS, type Corner, type PerCorner } from '@shared/season/corners';
import type { CreateRunInput, Run, RunStatus, UpdateRunInput } from '@shared/season/run.schema';
import { scoreRuns } from '@shared/calc/scoring.calc';
import { AppError, staleVersion } from '../../lib/app-error';
import {
  accessibleCarIdsSql, assertCarAccess, assertCarChildAccess, assertEventAccess, assertRunWrite, carActionAllowedSql, drivesCarSql,
  runWriteFactsSql, type RunWriteFactsRow,
} from '../../auth/access';
import { queryPrepared } from '../../db/prepared';
import { writeRunHotPressures } from '../pressures/pressure.service';
import { RunEntity } from './run.entity';

type Db = DataSource | EntityManager;

interface RunRow {
  id: string;
  car_id: string;
  event_id: string;
  driver_id: string;
  driver_name: string;
  run_number: number;
  raw_time_sec: number | null;
  cones: number;
  status: RunStatus;
  recorded_at: Date;
  notes: string | null;
  version: number;
  created_at: Date;
  updated_at: Date;
  setup_id: string | null;
  cone_penalty_sec: number;
  lf_kpa: number | null;
  rf_kpa: number | null;
  lr_kpa: number | null;
  rr_kpa: number | null;
  has_hot: boolean;
  /** Matched `where` itself, rather than only sharing a scoring group with a run that did. */
  wanted: boolean;
  comment_count: number;
}

/**
 * Loads runs that match `where` (SQL over `r`, the runs_with_setup view) and scores
 * each against every run of the same driver, car and event, so adjusted times,
 * bests and % off best always come from the one scoring function.
 */
export async function loadRuns(db: Db, where: string, params: unknown[]): Promise<Run[]> {
  const rows = await queryPrepared<RunRow>(db,
    `WITH wanted AS (SELECT r.id, r.event_id, r.car_id, r.driver_id FROM runs_with_setup r WHERE ${where})
     SELECT r.id, r.car_id, r.event_id, r.driver_id, u.display_name AS driver_name, r.run_number, r.raw_time_sec,
            r.cones, r.status, r.recorded_at, r.notes, r.version, r.created_at, r.updated_at, r.setup_id,
            e.cone_penalty_sec, p.lf_kpa, p.rf_kpa, p.lr_kpa, p.rr_kpa, (p.id IS NOT NULL) AS has_hot,
            r.id IN (SELECT id FROM wanted) AS wanted,
            (SELECT count(*)::int FROM comments c WHERE c.run_id = r.id) AS comment_count
       FROM runs_with_setup r
       JOIN events e ON e.id = r.event_id
       JOIN users u ON u.id = r.driver_id
       LEFT JOIN pressure_readings p ON p.run_id = r.id AND p.kind = 'hot'
      WHERE (r.event_id, r.car_id, r.driver_id) IN (SELECT event_id, car_id, driver_id FROM wanted)
      ORDER BY e.date, r.event_id, r.car_id, r.driver_id, r.run_number, r.recorded_at`,
    params,
  );
  const groups = new Map<string, RunRow[]>();
  for (const row of rows) {
    const key = `${row.event_id}|${row.car_id}|${row.driver_id}`;
    groups.set(key, [...(groups.get(key) ?? []), row]);
  }
  const out: Run[] = [];
  for (const group of groups.values()) {
    const scored = scoreRuns(
      group.map((r) => ({ row: r, rawTimeSec: r.raw_time_sec, cones: r.cones, status: r.status })),
      group[0]!.cone_penalty_sec,
    );
    for (const s of scored) {
      const r = s.run.row;
      if (!r.wanted) continue;
      out.push({
        id: r.id,
        carId: r.car_id,
        eventId: r.event_id,
        driver: { id: r.driver_id, displayName: r.driver_name },
        runNumber: r.run_number,
        rawTimeSec: r.raw_time_sec,
        cones: r.cones,
        status: r.status,
        recordedAt: r.recorded_at.toISOString(),
        hotPressuresKpa: r.has_hot ? pressuresOf(r) : null,
        notes: r.notes,
        commentCount: r.comment_count,
        setupId: r.setup_id,
        adjustedTimeSec: s.adjustedTimeSec,
        pctOffBest: s.pctOffBest,
        isBest: s.isBest,
        version: r.version,
        createdAt: r.created_at.toISOString(),
        updatedAt: r.updated_at.toISOString(),
      });
    }
  }
  return out;
}

function pressuresOf(r: Pick<RunRow, 'lf_kpa' | 'rf_kpa' | 'lr_kpa' | 'rr_kpa'>): PerCorner<number> {
  const out: PerCorner<number> = {};
  for (const c of CORNERS) {
    const v = r[`${c}_kpa`];
    if (v !== null) out[c] = v;
  }
  return out;
}

export async function loadRun(db: Db, runId: string): Promise<Run> {
  const [run] = await loadRuns(db, 'r.id = $1', [runId]);
  if (!run) throw new AppError('not_found', 'That run was not found.');
  return run;
}

async function assertDriverOfCar(db: Db, carId: string, driverId: string) {
  const rows = await db.query(
    `SELECT 1 FROM cars c WHERE c.id = $1 AND ${drivesCarSql('$2')}`,
    [carId, driverId],
  );
  if (rows.length === 0) throw notTheCarsDriver();
}

const notTheCarsDriver = () =>
  new AppError('validation_failed', 'Some fields need attention.', {
    driverId: ['The driver must be the car\'s owner or one of its co-drivers'],
  });

const runNumberTaken = (n: number) =>
  new AppError('conflict', `Run ${n} is already logged for this driver and car at this event.`, {
    runNumber: [`Run ${n} is already logged; use the next number`],
  });

/** Does a replayed POST carry the same run as the one stored? */
function sameContent(stored: Run, input: CreateRunInput, driverId: string): boolean {
  const samePressures = CORNERS.every((c: Corner) => (stored.hotPressuresKpa?.[c] ?? null) === (input.hotPressuresKpa?.[c] ?? null));
  return (
    stored.carId === input.carId &&
    stored.eventId === input.eventId &&
    stored.driver.id === driverId &&
    stored.runNumber === input.runNumber &&
    stored.rawTimeSec === input.rawTimeSec &&
    stored.cones === input.cones &&
    stored.status === input.status &&
    new Date(stored.recordedAt).getTime() === new Date(input.recordedAt).getTime() &&
    (stored.notes ?? null) === (input.notes ?? null) &&
    samePressures
  );
}

/**
 * Creates a run idempotently: the client's UUID is the primary key, so a replay
 * inserts nothing (ON CONFLICT (id) DO NOTHING, enforced by the database even when
 * two requests race) and answers with the stored run, or 409 if it differs.
 */
export async function createRun(ds: DataSource, user: User, input: CreateRunInput): Promise<{ run: Run; created: boolean }> {
  const driverId = input.driverId ?? user.id;
  const recordedAt = new Date(input.recordedAt);
  const rawTimeSec = input.status === 'finished' ? input.rawTimeSec : (input.rawTimeSec ?? null);

  // One round trip checks the car, the event and the driver and inserts only where all three allow it.
  // No conflict target: a replay (same id) and a clash of run numbers both insert nothing; which of the
  // two happened is read back below, after any racing insert has committed.
  const insert = async (db: Db) => {
    const [row] = await queryPrepared<RunWriteFactsRow & { created: boolean }>(db,
      `WITH f AS (${runWriteFactsSql({ user: '$11', car: '$2', event: '$3', driver: '$4' })}),
       ins AS (
         INSERT INTO runs (id, car_id, event_id, driver_id, run_number, raw_time_sec, cones, status, recorded_at, notes)
         SELECT $1::uuid, $2::uuid, $3::uuid, $4::uuid, $5::int, $6::double precision, $7::int, $8::text, $9::timestamptz, $10::text
           FROM f WHERE f.event_visible AND f.drives_car AND ${carActionAllowedSql('f', 'write')}
         ON CONFLICT DO NOTHING RETURNING id)
       SELECT f.*, EXISTS (SELECT 1 FROM ins) AS created FROM f`,
      [input.id, input.carId, input.eventId, driverId, input.runNumber, rawTimeSec, input.cones, input.status, recordedAt, input.notes ?? null, user.id],
    );
    // Nothing was written unless all three allowed it; refused in that order: the car, the event, the driver.
    assertRunWrite(row, notTheCarsDriver);
    return row.created;
  };
  const pressures = input.hotPressuresKpa && Object.keys(input.hotPressuresKpa).length > 0 ? input.hotPressuresKpa : null;
  // A run with hot pressures is two rows, written together or not at all. A run alone is one
  // statement, atomic by itself: it needs no BEGIN and COMMIT round trips (most runs at the track).
  const created = pressures
    ? await ds.transaction(async (m) => {
        if (!(await insert(m))) return false;
        await writeRunHotPressures(m, { id: input.id, carId: input.carId, recordedAt }, user.id, pressures);
        return true;
      })
    : await insert(ds);
  if (!created) {
    const existing = await ds.query('SELECT 1 FROM runs WHERE id = $1', [input.id]);
    if (existing.length === 0) throw runNumberTaken(input.runNumber);
  }
  const run = await loadRun(ds, input.id);
  if (!created) {
    // The id exists. Only its own car's people may learn anything about it.
    await assertCarAccess(ds, user, run.carId, 'read').catch(() => {
      throw new AppError('conflict', 'That run id is already in use.');
    });
    if (!sameContent(run, { ...input, rawTimeSec }, driverId)) {
      throw new AppError('conflict', 'A different run was already saved with this id.', undefined, undefined, run);
    }
  }
  return { run, created };
}

export async function listRuns(ds: DataSource, user: User, filter: { carId?: string; eventId?: string }): Promise<Run[]> {
  const clauses = [`r.car_id IN ${accessibleCarIdsSql('$1')}`];
  const params: unknown[] = [user.id];
  if (filter.carId) {
    // One car asked for by someone who may read it, which includes a granted shop's staff.
    await assertCarAccess(ds, user, filter.carId, 'read');
    params[0] = filter.carId;
    clauses[0] = 'r.car_id = $1';
  }
  if (filter.eventId) {
    await assertEventAccess(ds, user, filter.eventId);
    params.push(filter.eventId);
    clauses.push(`r.event_id = $${params.length}`);
  }
  return loadRuns(ds, clauses.join(' AND '), params);
}

export async function getRun(ds: DataSource, user: User, runId: string): Promise<Run> {
  await assertCarChildAccess(ds, user, 'runs', runId, 'read', 'That run');
  return loadRun(ds, runId);
}

export async function updateRun(ds: DataSource, user: User, runId: string, input: UpdateRunInput): Promise<Run> {
  const carId = await assertCarChildAccess(ds, user, 'runs', runId, 'write', 'That run');
  if (input.driverId) await assertDriverOfCar(ds, carId, input.driverId);
  const current = await loadRun(ds, runId);
  const status = input.status ?? current.status;
  const rawTimeSec = input.rawTimeSec !== undefined ? input.rawTimeSec : current.rawTimeSec;
  if (status === 'finished' && rawTimeSec === null) {
    throw new AppError('validation_failed', 'Some fields need attention.', { rawTimeSec: ['A finished run needs its time'] });
  }
  const set: Partial<Omit<RunEntity, 'version' | 'updatedAt'>> = {};
  if (input.runNumber !== undefined) set.runNumber = input.runNumber;
  if (input.rawTimeSec !== undefined) set.rawTimeSec = input.rawTimeSec;
  if (input.cones !== undefined) set.cones = input.cones;
  if (input.status !== undefined) set.status = input.status;
  if (input.recordedAt !== undefined) set.recordedAt = new Date(input.recordedAt);
  if (input.driverId !== undefined) set.driverId = input.driverId;
  if (input.notes !== undefined) set.notes = input.notes;
  let ok: boolean;
  try {
    ok = await ds.transaction(async (m) => {
      const result = await m
        .createQueryBuilder()
        .update(RunEntity)
        .set({ ...set, version: () => 'version + 1', updatedAt: () => 'now()' })
        .where('id = :runId AND version = :version', { runId, version: input.version })
        .execute();
      if (result.affected !== 1) return false;
      if (input.hotPressuresKpa !== undefined) {
        const recordedAt = set.recordedAt instanceof Date ? set.recordedAt : new Date(current.recordedAt);
        await writeRunHotPressures(m, { id: runId, carId, recordedAt }, user.id, input.hotPressuresKpa);
      }
      return true;
    });
  } catch (err) {
    if ((err as { constraint?: string }).constraint === 'runs_number_unique') throw runNumberTaken(input.runNumber ?? current.runNumber);
    throw err;
  }
  if (!ok) throw staleVersion(await loadRun(ds, runId));
  return loadRun(ds, runId);
}

export async function deleteRun(ds: DataSource, user: User, runId: string): Promise<void> {
  await assertCarChildAccess(ds, user, 'runs', runId, 'write', 'That run');
  await ds.query('DELETE FROM runs WHERE id = $1', [runId]);
}

export async function runsOfSetup(ds: DataSource, user: User, setupId: string): Promise<Run[]> {
  await assertCarChildAccess(ds, user, 'setup_snapshots', setupId, 'read', 'That setup');
  return loadRuns(ds, 'r.setup_id = $1', [setupId]);
}
