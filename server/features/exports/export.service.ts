import { randomUUID } from 'node:crypto';
import type { DataSource, EntityManager } from 'typeorm';
import type { User } from '@shared/auth/auth.schema';
import { toFieldErrors, type FieldErrors } from '@shared/api/api-error.schema';
import { CORNERS, axleOf } from '@shared/season/corners';
import { SETUP_CORNER_FIELDS } from '@shared/season/setup.schema';
import {
  SEASON_FILE_FORMAT, SEASON_FILE_VERSION, seasonExportSchema, seasonFileHeaderProblem,
  type SeasonExport, type SeasonImportResult,
} from '@shared/export/season-export.schema';
import * as z from '@shared/zod';
import { AppError } from '../../lib/app-error';
import { unstorableFields } from '../../lib/validate';
import { assertCarAccess } from '../../auth/access';
import { adjusterFor, CLICK_FIELDS } from '@shared/season/damper-clicks';
import { damperAdjustersOf, loadCarEntity } from '../cars/car.service';
import { setupsOfCar } from '../setups/setup.service';
import { loadRuns } from '../runs/run.service';
import { tyreSetsWithReadings } from '../tyres/tyre.service';

type Db = DataSource | EntityManager;

/** The car's season in the file format (callers have checked read access). */
export async function buildSeasonExport(db: Db, carId: string, now = new Date()): Promise<SeasonExport> {
  const car = await loadCarEntity(db, carId);
  const setups = await setupsOfCar(db, carId);
  const runs = await loadRuns(db, 'r.car_id = $1', [carId]);
  const tyres = await tyreSetsWithReadings(db, carId);

  const changes: {
    id: string; changed_on: string; what: string; location: SeasonExport['changes'][number]['location'];
    notes: string | null; setup_id: string | null; recorded_by: string;
  }[] = await db.query(
    `SELECT l.id, l.changed_on::text AS changed_on, l.what, l.location, l.notes, l.setup_id, u.display_name AS recorded_by
       FROM change_log l JOIN users u ON u.id = l.created_by
      WHERE l.car_id = $1 ORDER BY l.changed_on, l.created_at, l.id`,
    [carId],
  );
  const pressures: { id: string; kind: 'cold' | 'hot'; taken_at: Date; run_id: string | null; lf_kpa: number | null; rf_kpa: number | null; lr_kpa: number | null; rr_kpa: number | null }[] =
    await db.query(
      `SELECT id, kind, taken_at, run_id, lf_kpa, rf_kpa, lr_kpa, rr_kpa FROM pressure_readings WHERE car_id = $1 ORDER BY taken_at, created_at, id`,
      [carId],
    );
  const readingIds = tyres.flatMap((t) => t.readings.map((r) => r.id));
  const readers: { id: string; recorded_by: string }[] = readingIds.length
    ? await db.query('SELECT r.id, u.display_name AS recorded_by FROM tread_readings r JOIN users u ON u.id = r.created_by WHERE r.id = ANY($1)', [readingIds])
    : [];
  const readerOf = new Map(readers.map((r) => [r.id, r.recorded_by]));

  // The events the season touches: those its runs and tread readings were at.
  const eventIds = [...new Set([...runs.map((r) => r.eventId), ...tyres.flatMap((t) => t.readings.map((r) => r.eventId))])].filter(
    (id): id is string => !!id,
  );
  const events: {
    id: string; name: string; date: string; venue: string | null; kind: 'autocross' | 'track_day'; cone_penalty_sec: number;
    surface: string | null; air_temp_c: number | null; track_temp_c: number | null; notes: string | null;
  }[] = eventIds.length
    ? await db.query(
        `SELECT id, name, date::text AS date, venue, kind, cone_penalty_sec, surface, air_temp_c, track_temp_c, notes
           FROM events WHERE id = ANY($1) ORDER BY date, created_at, id`,
        [eventIds],
      )
    : [];

  return {
    format: SEASON_FILE_FORMAT,
    version: SEASON_FILE_VERSION,
    exportedAt: now.toISOString(),
    car: {
      id: car.id,
      name: car.name,
      classCode: car.classCode,
      carNumber: car.carNumber,
      tyreSize: car.tyreSize,
      damperAdjusters: damperAdjustersOf(car),
      motionRatios: { front: car.frontMotionRatio, rear: car.rearMotionRatio },
      notes: car.notes,
    },
    setups: setups.map((s) => ({
      id: s.id,
      label: s.label,
      effectiveFrom: s.effectiveFrom,
      recordedBy: s.createdBy.displayName || null,
      derivedFromId: s.derivedFromId,
      notes: s.notes,
      corners: s.corners,
      axles: s.axles,
    })),
    changes: changes.map((c) => ({
      id: c.id,
      changedOn: c.changed_on,
      what: c.what,
      location: c.location,
      notes: c.notes,
      setupId: c.setup_id,
      recordedBy: c.recorded_by,
    })),
    events: events.map((e) => ({
      id: e.id,
      name: e.name,
      date: e.date,
      venue: e.venue,
      kind: e.kind,
      conePenaltySec: e.cone_penalty_sec,
      surface: e.surface,
      airTempC: e.air_temp_c,
      trackTempC: e.track_temp_c,
      notes: e.notes,
    })),
    runs: runs.map((r) => ({
      id: r.id,
      eventId: r.eventId,
      runNumber: r.runNumber,
      rawTimeSec: r.rawTimeSec,
      cones: r.cones,
      status: r.status,
      recordedAt: r.recordedAt,
      driverName: r.driver.displayName,
      notes: r.notes,
    })),
    pressures: pressures.map((p) => ({
      id: p.id,
      kind: p.kind,
      takenAt: p.taken_at.toISOString(),
      runId: p.run_id,
      corners: Object.fromEntries(CORNERS.flatMap((c) => (p[`${c}_kpa`] === null ? [] : [[c, p[`${c}_kpa`]]]))),
    })),
    tyreSets: tyres.map(({ set, readings }) => ({
      id: set.id,
      label: set.label,
      size: set.size,
      boughtOn: set.boughtOn,
      startTreadMm: set.startTreadMm,
      notes: set.notes,
      mountings: set.mountings.map((m) => ({ id: m.id, mountedAt: m.mountedAt, positions: m.positions })),
      readings: readings.map((r) => ({
        id: r.id,
        takenAt: r.takenAt,
        eventId: r.eventId,
        recordedBy: readerOf.get(r.id) ?? null,
        notes: r.notes,
        corners: Object.fromEntries(
          CORNERS.flatMap((c) => {
            const v = r.corners[c];
            return v ? [[c, { innerMm: v.innerMm, middleMm: v.middleMm, outerMm: v.outerMm }]] : [];
          }),
        ),
      })),
    })),
  };
}

export async function exportSeason(ds: DataSource, user: User, carId: string): Promise<SeasonExport> {
  await assertCarAccess(ds, user, carId, 'read');
  return buildSeasonExport(ds, carId);
}

/** `blue-roadster-season-2026`: the car's name in plain letters and the year of its latest event. */
export function seasonFileName(carName: string, eventDates: readonly string[], now = new Date()): string {
  const slug =
    carName
      .normalize('NFKD')
      .replace(/[\u0300-\u036f]/g, '')
      .toLowerCase()
      .replace(/[^a-z0-9]+/g, '-')
      .replace(/^-+|-+$/g, '')
      .slice(0, 60) || 'car';
  const year = eventDates.length ? [...eventDates].sort().at(-1)!.slice(0, 4) : String(now.getUTCFullYear());
  return `${slug}-season-${year}`;
}

/* ---------- Import ---------- */

const invalid = (errors: FieldErrors, message = 'Some fields need attention.') => new AppError('validation_failed', message, errors);

/** Ids that must be unique within the file, and references that must point at a record in it. */
function checkReferences(file: SeasonExport): FieldErrors {
  const errors: FieldErrors = {};
  const add = (key: string, message: string) => (errors[key] ??= []).push(message);
  const idsOf = (list: readonly { id: string }[], path: string) => {
    const seen = new Set<string>();
    list.forEach((r, i) => {
      if (seen.has(r.id)) add(`${path}.${i}.id`, 'This id is used twice in the file');
      seen.add(r.id);
    });
    return seen;
  };
  const setups = idsOf(file.setups, 'setups');
  const events = idsOf(file.events, 'events');
  const runs = idsOf(file.runs, 'runs');
  idsOf(file.changes, 'changes');
  idsOf(file.pressures, 'pressures');
  idsOf(file.tyreSets, 'tyreSets');
  // Rotations and readings are numbered within their set, but their ids are unique across the file.
  for (const kind of ['mountings', 'readings'] as const) {
    const seen = new Set<string>();
    file.tyreSets.forEach((t, i) =>
      t[kind].forEach((r, j) => {
        if (seen.has(r.id)) add(`tyreSets.${i}.${kind}.${j}.id`, 'This id is used twice in the file');
        seen.add(r.id);
      }),
    );
  }

  const car = file.car.damperAdjusters ?? {};
  file.setups.forEach((s, i) => {
    if (s.derivedFromId !== null && (!setups.has(s.derivedFromId) || s.derivedFromId === s.id)) {
      add(`setups.${i}.derivedFromId`, 'No other setup in the file has this id');
    }
    for (const corner of CORNERS) {
      for (const field of CLICK_FIELDS) {
        const positions = adjusterFor(car, axleOf(corner), field)?.positions;
        const v = s.corners[corner]?.[field];
        if (positions && v !== null && v !== undefined && v > positions) {
          add(`setups.${i}.corners.${corner}.${field}`, `The car's adjuster has ${positions} clicks; use 0 to ${positions}`);
        }
      }
    }
  });
  file.changes.forEach((c, i) => {
    if (c.setupId !== null && !setups.has(c.setupId)) add(`changes.${i}.setupId`, 'No setup in the file has this id');
  });
  file.runs.forEach((r, i) => {
    if (!events.has(r.eventId)) add(`runs.${i}.eventId`, 'No event in the file has this id');
  });
  const runKinds = new Set<string>();
  file.pressures.forEach((p, i) => {
    if (p.runId === null) return;
    if (!runs.has(p.runId)) add(`pressures.${i}.runId`, 'No run in the file has this id');
    else if (runKinds.has(`${p.runId}|${p.kind}`)) add(`pressures.${i}.runId`, `That run already has ${p.kind} pressures in the file`);
    runKinds.add(`${p.runId}|${p.kind}`);
  });
  file.tyreSets.forEach((t, i) =>
    t.readings.forEach((r, j) => {
      if (r.eventId !== null && !events.has(r.eventId)) add(`tyreSets.${i}.readings.${j}.eventId`, 'No event in the file has this id');
    }),
  );
  return errors;
}

/**
 * Every run of the new car is the importer's, so two drivers' "run 1" at one event would
 * collide: the later one is numbered after the event's last run and says so in its notes.
 */
function runNumbers(file: SeasonExport): Map<string, { runNumber: number; notes: string | null }> {
  const out = new Map<string, { runNumber: number; notes: string | null }>();
  const byEvent = new Map<string, SeasonExport['runs']>();
  for (const r of file.runs) byEvent.set(r.eventId, [...(byEvent.get(r.eventId) ?? []), r]);
  for (const list of byEvent.values()) {
    const used = new Set<number>();
    let next = Math.max(...list.map((r) => r.runNumber)) + 1;
    // "Later" is by the time the run was recorded, whatever order the file lists them in.
    const inOrder = [...list].sort((x, y) => Date.parse(x.recordedAt) - Date.parse(y.recordedAt) || x.id.localeCompare(y.id));
    for (const r of inOrder) {
      if (!used.has(r.runNumber)) {
        used.add(r.runNumber);
        out.set(r.id, { runNumber: r.runNumber, notes: r.notes ?? null });
        continue;
      }
      const note = `Run ${r.runNumber}${r.driverName ? ` by ${r.driverName}` : ''} in the imported file.`;
      out.set(r.id, { runNumber: next, notes: r.notes ? `${r.notes}\n${note}` : note });
      used.add(next++);
    }
  }
  return out;
}

type ColumnType = 'uuid' | 'text' | 'timestamptz' | 'date' | 'double precision' | 'integer';

/** One INSERT … SELECT FROM unnest(…) for many rows: a season of thousands of runs stays one round trip per table. */
async function insertRows(m: EntityManager, table: string, columns: Record<string, ColumnType>, rows: Record<string, unknown>[]) {
  if (rows.length === 0) return;
  const names = Object.keys(columns);
  const params = names.map((n) => rows.map((r) => r[n] ?? null));
  const unnest = names.map((n, i) => `$${i + 1}::${columns[n]}[]`).join(', ');
  await m.query(`INSERT INTO ${table} (${names.join(', ')}) SELECT * FROM unnest(${unnest})`, params);
}

/**
 * Reads a season file into a NEW car owned by `user`: every record gets a new id (the
 * file's links — run to event, snapshot to its parent, reading to its event — follow the
 * new ids), events are made anew as the importer's, and the importer is recorded as the
 * driver and recorder of everything. One transaction: all of it or none.
 */
export async function importSeason(ds: DataSource, user: User, body: unknown): Promise<SeasonImportResult> {
  const header = seasonFileHeaderProblem(body);
  if (header) throw invalid({ [header.field]: [header.message] }, header.message);
  const result = z.safeParse(seasonExportSchema, body);
  const unstorable = unstorableFields(body);
  if (!result.success || Object.keys(unstorable).length > 0) {
    throw invalid({ ...(result.success ? {} : toFieldErrors(result.error)), ...unstorable }, 'This season file has values Scrubline cannot read.');
  }
  const file = result.data;
  const refErrors = checkReferences(file);
  if (Object.keys(refErrors).length) throw invalid(refErrors, 'This season file has records that point at nothing.');

  const ids = new Map<string, string>();
  /** New id for a file id of one kind (kinds keep their own id spaces). */
  const fresh = (kind: string, id: string) => {
    const key = `${kind}|${id}`;
    let v = ids.get(key);
    if (!v) ids.set(key, (v = randomUUID()));
    return v;
  };
  const ref = (kind: string, id: string | null | undefined) => (id === null || id === undefined ? null : fresh(kind, id));
  // Creation times follow the file's order, so ties (two snapshots from the same minute) resolve as they did.
  const base = Date.now();
  const createdAt = (i: number) => new Date(base + i).toISOString();
  const numbers = runNumbers(file);
  const c = file.car;

  const carId = randomUUID();
  await ds.transaction(async (m) => {
    await insertRows(
      m,
      'cars',
      {
        id: 'uuid', owner_id: 'uuid', name: 'text', class_code: 'text', car_number: 'text', tyre_size: 'text',
        front_damper_positions: 'integer', front_damper_count_from: 'text', rear_damper_positions: 'integer', rear_damper_count_from: 'text',
        front_damper_rebound_positions: 'integer', front_damper_rebound_count_from: 'text',
        rear_damper_rebound_positions: 'integer', rear_damper_rebound_count_from: 'text',
        front_motion_ratio: 'double precision', rear_motion_ratio: 'double precision', notes: 'text',
      },
      [{
        id: carId, owner_id: user.id, name: c.name, class_code: c.classCode, car_number: c.carNumber || null, tyre_size: c.tyreSize || null,
        front_damper_positions: c.damperAdjusters?.front?.positions, front_damper_count_from: c.damperAdjusters?.front?.countFrom,
        rear_damper_positions: c.damperAdjusters?.rear?.positions, rear_damper_count_from: c.damperAdjusters?.rear?.countFrom,
        front_damper_rebound_positions: c.damperAdjusters?.front?.rebound?.positions,
        front_damper_rebound_count_from: c.damperAdjusters?.front?.rebound?.countFrom,
        rear_damper_rebound_positions: c.damperAdjusters?.rear?.rebound?.positions,
        rear_damper_rebound_count_from: c.damperAdjusters?.rear?.rebound?.countFrom,
        front_motion_ratio: c.motionRatios?.front, rear_motion_ratio: c.motionRatios?.rear, notes: c.notes || null,
      }],
    );
    await insertRows(
      m,
      'events',
      {
        id: 'uuid', created_by: 'uuid', name: 'text', date: 'date', venue: 'text', kind: 'text', cone_penalty_sec: 'double precision',
        surface: 'text', air_temp_c: 'double precision', track_temp_c: 'double precision', notes: 'text', created_at: 'timestamptz',
      },
      file.events.map((e, i) => ({
        id: fresh('event', e.id), created_by: user.id, name: e.name, date: e.date, venue: e.venue, kind: e.kind,
        cone_penalty_sec: e.conePenaltySec, surface: e.surface, air_temp_c: e.airTempC, track_temp_c: e.trackTempC, notes: e.notes, created_at: createdAt(i),
      })),
    );
    await insertRows(
      m,
      'setup_snapshots',
      {
        id: 'uuid', car_id: 'uuid', label: 'text', effective_from: 'timestamptz', created_by: 'uuid', notes: 'text',
        front_anti_roll_bar: 'text', rear_anti_roll_bar: 'text', created_at: 'timestamptz', updated_at: 'timestamptz',
      },
      file.setups.map((s, i) => ({
        id: fresh('setup', s.id), car_id: carId, label: s.label, effective_from: s.effectiveFrom, created_by: user.id, notes: s.notes,
        front_anti_roll_bar: s.axles.front?.antiRollBar, rear_anti_roll_bar: s.axles.rear?.antiRollBar,
        created_at: createdAt(i), updated_at: createdAt(i),
      })),
    );
    // Parents may come after their children in the file, so the links go in once every snapshot exists.
    const links = file.setups.filter((s) => s.derivedFromId !== null);
    if (links.length) {
      await m.query(
        `UPDATE setup_snapshots s SET derived_from_id = v.parent FROM unnest($1::uuid[], $2::uuid[]) AS v(child, parent) WHERE s.id = v.child`,
        [links.map((s) => fresh('setup', s.id)), links.map((s) => fresh('setup', s.derivedFromId!))],
      );
    }
    const cornerColumns = {
      camberDeg: 'camber_deg', toeMm: 'toe_mm', casterDeg: 'caster_deg', springRateNPerMm: 'spring_rate_n_per_mm', rideHeightMm: 'ride_height_mm',
      damperClicks: 'damper_clicks', damperReboundClicks: 'damper_rebound_clicks', coldPressureKpa: 'cold_pressure_kpa', cornerWeightKg: 'corner_weight_kg',
    } as const;
    await insertRows(
      m,
      'setup_corners',
      {
        setup_id: 'uuid', corner: 'text', camber_deg: 'double precision', toe_mm: 'double precision', caster_deg: 'double precision',
        spring_rate_n_per_mm: 'double precision', ride_height_mm: 'double precision', damper_clicks: 'integer', damper_rebound_clicks: 'integer',
        cold_pressure_kpa: 'double precision', corner_weight_kg: 'double precision',
      },
      file.setups.flatMap((s) =>
        CORNERS.flatMap((corner) => {
          const values = s.corners[corner];
          if (!values || SETUP_CORNER_FIELDS.every((f) => values[f] === null || values[f] === undefined)) return [];
          return [{ setup_id: fresh('setup', s.id), corner, ...Object.fromEntries(SETUP_CORNER_FIELDS.map((f) => [cornerColumns[f], values[f]])) }];
        }),
      ),
    );
    await insertRows(
      m,
      'change_log',
      { id: 'uuid', car_id: 'uuid', changed_on: 'date', what: 'text', location: 'text', notes: 'text', setup_id: 'uuid', created_by: 'uuid', created_at: 'timestamptz' },
      file.changes.map((ch, i) => ({
        id: fresh('change', ch.id), car_id: carId, changed_on: ch.changedOn, what: ch.what, location: ch.location, notes: ch.notes,
        setup_id: ref('setup', ch.setupId), created_by: user.id, created_at: createdAt(i),
      })),
    );
    await insertRows(
      m,
      'runs',
      {
        id: 'uuid', car_id: 'uuid', event_id: 'uuid', driver_id: 'uuid', run_number: 'integer', raw_time_sec: 'double precision', cones: 'integer',
        status: 'text', recorded_at: 'timestamptz', notes: 'text', created_at: 'timestamptz', updated_at: 'timestamptz',
      },
      file.runs.map((r, i) => ({
        id: fresh('run', r.id), car_id: carId, event_id: fresh('event', r.eventId), driver_id: user.id,
        run_number: numbers.get(r.id)!.runNumber, raw_time_sec: r.rawTimeSec, cones: r.cones, status: r.status, recorded_at: r.recordedAt,
        notes: numbers.get(r.id)!.notes, created_at: createdAt(i), updated_at: createdAt(i),
      })),
    );
    await insertRows(
      m,
      'pressure_readings',
      {
        id: 'uuid', car_id: 'uuid', kind: 'text', taken_at: 'timestamptz', run_id: 'uuid', lf_kpa: 'double precision', rf_kpa: 'double precision',
        lr_kpa: 'double precision', rr_kpa: 'double precision', created_by: 'uuid', created_at: 'timestamptz',
      },
      file.pressures.map((p, i) => ({
        id: fresh('pressure', p.id), car_id: carId, kind: p.kind, taken_at: p.takenAt, run_id: ref('run', p.runId),
        lf_kpa: p.corners.lf, rf_kpa: p.corners.rf, lr_kpa: p.corners.lr, rr_kpa: p.corners.rr, created_by: user.id, created_at: createdAt(i),
      })),
    );
    await insertRows(
      m,
      'tyre_sets',
      { id: 'uuid', car_id: 'uuid', label: 'text', size: 'text', bought_on: 'date', start_tread_mm: 'double precision', notes: 'text', created_at: 'timestamptz' },
      file.tyreSets.map((t, i) => ({
        id: fresh('tyreSet', t.id), car_id: carId, label: t.label, size: t.size, bought_on: t.boughtOn, start_tread_mm: t.startTreadMm,
        notes: t.notes, created_at: createdAt(i),
      })),
    );
    await insertRows(
      m,
      'tyre_mountings',
      { id: 'uuid', tyre_set_id: 'uuid', mounted_at: 'timestamptz', lf_tyre: 'integer', rf_tyre: 'integer', lr_tyre: 'integer', rr_tyre: 'integer', created_at: 'timestamptz' },
      file.tyreSets.flatMap((t) =>
        t.mountings.map((mt, i) => ({
          id: fresh('mounting', mt.id), tyre_set_id: fresh('tyreSet', t.id), mounted_at: mt.mountedAt,
          lf_tyre: mt.positions.lf, rf_tyre: mt.positions.rf, lr_tyre: mt.positions.lr, rr_tyre: mt.positions.rr, created_at: createdAt(i),
        })),
      ),
    );
    const readings = file.tyreSets.flatMap((t) => t.readings.map((r) => ({ set: t.id, r })));
    await insertRows(
      m,
      'tread_readings',
      { id: 'uuid', tyre_set_id: 'uuid', taken_at: 'timestamptz', event_id: 'uuid', notes: 'text', created_by: 'uuid', created_at: 'timestamptz' },
      readings.map(({ set, r }, i) => ({
        id: fresh('reading', r.id), tyre_set_id: fresh('tyreSet', set), taken_at: r.takenAt, event_id: ref('event', r.eventId),
        notes: r.notes, created_by: user.id, created_at: createdAt(i),
      })),
    );
    await insertRows(
      m,
      'tread_reading_corners',
      { reading_id: 'uuid', corner: 'text', inner_mm: 'double precision', middle_mm: 'double precision', outer_mm: 'double precision' },
      readings.flatMap(({ r }) =>
        CORNERS.flatMap((corner) => {
          const v = r.corners[corner];
          return v ? [{ reading_id: fresh('reading', r.id), corner, inner_mm: v.innerMm, middle_mm: v.middleMm, outer_mm: v.outerMm }] : [];
        }),
      ),
    );
  });
  return { carId };
}
