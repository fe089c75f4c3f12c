import type { DataSource } from 'typeorm';
import type { User } from '@shared/auth/auth.schema';
import type { BoardAxleWear, BoardCar, BoardResult, ClassBoard, TeamSharing } from '@shared/collab/team.schema';
import type { Corner } from '@shared/season/corners';
import type { RunStatus } from '@shared/season/run.schema';
import { adjustedTimeSec, bestRun, indexTimeSec, innerOuterSkewMm, leastSquaresSlope, pctOffBest } from '@shared/calc/index';
import { entriesOf, factorsOf, teamSummary } from './team.service';

/*
 * The class board: every entered car's season, grouped by the class it is entered in.
 * Read in a fixed number of queries whatever the number of cars (access, team, entries,
 * factors, the season's runs of every entered car, the shared setups and their tread), then scored
 * with the shared calculations.
 */

interface BoardRunRow {
  car_id: string;
  driver_id: string;
  driver_name: string;
  event_id: string;
  event_name: string;
  date: string;
  cone_penalty_sec: number;
  raw_time_sec: number | null;
  cones: number;
  status: RunStatus;
  setup_id: string | null;
}

interface SetupRow {
  id: string;
  label: string;
  effective_from: Date;
  corner: Corner | null;
  camber_deg: number | null;
  spring_rate_n_per_mm: number | null;
  damper_clicks: number | null;
  cold_pressure_kpa: number | null;
}

/** The latest season in which a member ran an entered car; the current year when none has. */
async function defaultSeason(ds: DataSource, teamId: string): Promise<number> {
  const rows: { season: number | null }[] = await ds.query(
    `SELECT max(extract(year FROM e.date))::int AS season
       FROM runs r
       JOIN team_entries te ON te.car_id = r.car_id AND te.team_id = $1
       JOIN team_members tm ON tm.team_id = $1 AND tm.user_id = r.driver_id
       JOIN events e ON e.id = r.event_id`,
    [teamId],
  );
  return rows[0]?.season ?? new Date().getUTCFullYear();
}

/**
 * Every run driven by a member of the team in an entered car at the season's events, each tied to its setup, in
 * one query. A co-driver who is not on the team is left out: entering the car shares its owner's results, and
 * the co-driver's own are theirs to share by joining.
 */
function seasonRuns(ds: DataSource, teamId: string, season: number): Promise<BoardRunRow[]> {
  return ds.query(
    `SELECT r.car_id, r.driver_id, u.display_name AS driver_name, r.event_id, e.name AS event_name, e.date::text AS date,
            e.cone_penalty_sec, r.raw_time_sec, r.cones, r.status, r.setup_id
       FROM runs_with_setup r
       JOIN team_entries te ON te.car_id = r.car_id AND te.team_id = $1
       JOIN team_members tm ON tm.team_id = $1 AND tm.user_id = r.driver_id
       JOIN events e ON e.id = r.event_id
       JOIN users u ON u.id = r.driver_id
      WHERE e.date >= make_date($2, 1, 1) AND e.date < make_date($2 + 1, 1, 1)
      ORDER BY e.date, e.name, e.id, r.recorded_at, r.run_number`,
    [teamId, season],
  );
}

const round6 = (n: number) => Math.round(n * 1e6) / 1e6;

/** The mean, to 6 decimals (floating-point dust off). */
const mean6 = (values: number[]) => round6(values.reduce((a, b) => a + b, 0) / values.length);

/** Mean of an axle's two corners; null unless both are recorded. */
function axleMean(rows: SetupRow[], corners: readonly Corner[], field: 'camber_deg' | 'spring_rate_n_per_mm' | 'damper_clicks' | 'cold_pressure_kpa') {
  const values = corners.map((c) => rows.find((r) => r.corner === c)?.[field]).filter((v): v is number => typeof v === 'number');
  return values.length === corners.length ? mean6(values) : null;
}

function setupSummary(rows: SetupRow[]): NonNullable<BoardCar['setup']> {
  const front = ['lf', 'rf'] as const;
  const rear = ['lr', 'rr'] as const;
  return {
    label: rows[0]!.label,
    effectiveFrom: rows[0]!.effective_from.toISOString(),
    frontCamberDeg: axleMean(rows, front, 'camber_deg'),
    rearCamberDeg: axleMean(rows, rear, 'camber_deg'),
    frontSpringNPerMm: axleMean(rows, front, 'spring_rate_n_per_mm'),
    rearSpringNPerMm: axleMean(rows, rear, 'spring_rate_n_per_mm'),
    frontClicks: axleMean(rows, front, 'damper_clicks'),
    rearClicks: axleMean(rows, rear, 'damper_clicks'),
    frontColdKpa: axleMean(rows, front, 'cold_pressure_kpa'),
    rearColdKpa: axleMean(rows, rear, 'cold_pressure_kpa'),
  };
}

interface TreadRow {
  car_id: string;
  axle: 'front' | 'rear';
  taken_at: Date;
  inner_mm: number;
  middle_mm: number;
  outer_mm: number;
}

/**
 * For each car, per axle, the latest tread reading up to the season's end that has both of the axle's corners
 * (a reading may leave corners out), in one query: one row per corner of those readings.
 */
function latestTread(ds: DataSource, carIds: string[], season: number): Promise<TreadRow[]> {
  return ds.query(
    `WITH axle_readings AS (
       SELECT s.car_id, t.id, t.taken_at, t.created_at, CASE WHEN c.corner IN ('lf', 'rf') THEN 'front' ELSE 'rear' END AS axle
         FROM tread_readings t
         JOIN tyre_sets s ON s.id = t.tyre_set_id
         JOIN tread_reading_corners c ON c.reading_id = t.id
        WHERE s.car_id = ANY($1) AND t.taken_at < make_date($2 + 1, 1, 1)
        GROUP BY s.car_id, t.id, axle
       HAVING count(*) = 2
     ), latest AS (
       SELECT DISTINCT ON (car_id, axle) car_id, id, axle, taken_at
         FROM axle_readings
        ORDER BY car_id, axle, taken_at DESC, created_at DESC, id DESC
     )
     SELECT l.car_id, l.axle, l.taken_at, c.inner_mm, c.middle_mm, c.outer_mm
       FROM latest l
       JOIN tread_reading_corners c
         ON c.reading_id = l.id AND (CASE WHEN c.corner IN ('lf', 'rf') THEN 'front' ELSE 'rear' END) = l.axle`,
    [carIds, season],
  );
}

/** An axle's two corners as means: depth over inner, middle and outer; inner minus outer (the shared skew). */
function axleWear(rows: TreadRow[]): BoardAxleWear | null {
  if (rows.length === 0) return null;
  return {
    meanDepthMm: mean6(rows.flatMap((r) => [r.inner_mm, r.middle_mm, r.outer_mm])),
    innerMinusOuterMm: mean6(rows.map((r) => innerOuterSkewMm({ innerMm: r.inner_mm, outerMm: r.outer_mm }))),
    takenAt: rows[0]!.taken_at.toISOString(),
  };
}

function wearSummary(rows: TreadRow[]): BoardCar['wear'] {
  if (rows.length === 0) return null;
  return { front: axleWear(rows.filter((r) => r.axle === 'front')), rear: axleWear(rows.filter((r) => r.axle === 'rear')) };
}

interface Day {
  carId: string;
  classCode: string;
  eventOrder: number;
  result: BoardResult;
}

export async function classBoard(ds: DataSource, user: User, teamId: string, season?: number): Promise<ClassBoard> {
  const team = await teamSummary(ds, user, teamId);
  const year = season ?? (await defaultSeason(ds, teamId));
  const [entries, factors, runs] = await Promise.all([entriesOf(ds, teamId), factorsOf(ds, teamId, year), seasonRuns(ds, teamId, year)]);
  const factorOf = new Map(factors.map((f) => [f.classCode, f.factor]));
  const entryOf = new Map(entries.map((e) => [e.car_id, e]));

  // The season's events in date order: the x of each car's trend.
  const eventOrder = new Map<string, number>();
  for (const r of runs) if (!eventOrder.has(r.event_id)) eventOrder.set(r.event_id, eventOrder.size + 1);

  // Each car's runs per (event, driver): one line on the board, scored with the shared scoring.
  const groups = new Map<string, BoardRunRow[]>();
  for (const r of runs) {
    const key = `${r.car_id}|${r.event_id}|${r.driver_id}`;
    const list = groups.get(key) ?? [];
    list.push(r);
    groups.set(key, list);
  }
  const days: Day[] = [];
  for (const group of groups.values()) {
    const first = group[0]!;
    const classCode = entryOf.get(first.car_id)!.class_code;
    const runsScored = group.map((r) => ({ rawTimeSec: r.raw_time_sec, cones: r.cones, status: r.status }));
    // The fastest clock time, cones not added; of equal times, the one with fewer cones.
    let bestRaw: { rawTimeSec: number; cones: number } | null = null;
    for (const r of runsScored) {
      if (r.status !== 'finished' || r.rawTimeSec === null) continue;
      if (!bestRaw || r.rawTimeSec < bestRaw.rawTimeSec || (r.rawTimeSec === bestRaw.rawTimeSec && r.cones < bestRaw.cones)) {
        bestRaw = { rawTimeSec: r.rawTimeSec, cones: r.cones };
      }
    }
    const best = bestRun(runsScored, first.cone_penalty_sec);
    const bestAdjustedSec = best ? adjustedTimeSec(best, first.cone_penalty_sec) : null;
    const factor = factorOf.get(classCode);
    days.push({
      carId: first.car_id,
      classCode,
      eventOrder: eventOrder.get(first.event_id)!,
      result: {
        eventId: first.event_id,
        eventName: first.event_name,
        date: first.date,
        driver: { id: first.driver_id, displayName: first.driver_name },
        runs: {
          finished: runsScored.filter((r) => r.status === 'finished').length,
          dnf: runsScored.filter((r) => r.status === 'dnf').length,
          offCourse: runsScored.filter((r) => r.status === 'off_course').length,
        },
        bestRawSec: bestRaw?.rawTimeSec ?? null,
        bestRawCones: bestRaw?.cones ?? null,
        bestAdjustedSec,
        indexSec: bestAdjustedSec !== null && factor !== undefined ? indexTimeSec(bestAdjustedSec, factor) : null,
        pctOffClassFastest: null,
        rankInClass: null,
        aloneInClass: false,
      },
    });
  }

  // % off the class's fastest adjusted time at each event, and the rank in class there.
  const byClassEvent = new Map<string, Day[]>();
  for (const d of days) {
    const key = `${d.classCode}|${d.result.eventId}`;
    byClassEvent.set(key, [...(byClassEvent.get(key) ?? []), d]);
  }
  for (const group of byClassEvent.values()) {
    const times = group.map((d) => d.result.bestAdjustedSec).filter((t): t is number => t !== null);
    if (times.length === 0) continue;
    // One time alone is fastest and off nothing by itself: no rank, no % off, and no point on the trend.
    if (times.length === 1) {
      for (const d of group) if (d.result.bestAdjustedSec !== null) d.result.aloneInClass = true;
      continue;
    }
    const fastest = Math.min(...times);
    for (const d of group) {
      const t = d.result.bestAdjustedSec;
      if (t === null) continue;
      // A fastest of 0 s (see scoreRuns) has no % off it.
      if (fastest > 0) d.result.pctOffClassFastest = pctOffBest(t, fastest);
      d.result.rankInClass = times.filter((other) => other < t).length + 1;
    }
  }

  // The setups in force at each sharing car's latest event: its last run there, in one query.
  const lastSetupOf = new Map<string, string | null>();
  for (const r of runs) if (entryOf.get(r.car_id)!.sharing === 'results_and_setup') lastSetupOf.set(r.car_id, r.setup_id);
  const setupIds = [...new Set([...lastSetupOf.values()].filter((id): id is string => id !== null))];
  const setupRows: SetupRow[] = setupIds.length === 0 ? [] : await ds.query(
    `SELECT s.id, s.label, s.effective_from, c.corner, c.camber_deg, c.spring_rate_n_per_mm, c.damper_clicks, c.cold_pressure_kpa
       FROM setup_snapshots s LEFT JOIN setup_corners c ON c.setup_id = s.id
      WHERE s.id = ANY($1)`,
    [setupIds],
  );

  // The tread of every car that shares setups, in one query; none is read for a car that shares results only.
  const sharingCarIds = entries.filter((e) => e.sharing === 'results_and_setup').map((e) => e.car_id);
  const treadRows = sharingCarIds.length === 0 ? [] : await latestTread(ds, sharingCarIds, year);

  const classes = new Map<string, BoardCar[]>();
  for (const e of entries) {
    const own = days.filter((d) => d.carId === e.car_id).sort((a, b) => a.eventOrder - b.eventOrder
      || a.result.driver.displayName.localeCompare(b.result.driver.displayName) || a.result.driver.id.localeCompare(b.result.driver.id));
    const sharing: TeamSharing = e.sharing;
    const setupId = sharing === 'results_and_setup' ? lastSetupOf.get(e.car_id) ?? null : null;
    const rows = setupId ? setupRows.filter((r) => r.id === setupId) : [];
    classes.set(e.class_code, [...(classes.get(e.class_code) ?? []), {
      car: { id: e.car_id, name: e.car_name, carNumber: e.car_number },
      owner: { id: e.owner_id, displayName: e.owner_name },
      sharing,
      results: own.map((d) => d.result),
      trendPctPerEvent: trendOf(own),
      setup: rows.length > 0 ? setupSummary(rows) : null,
      wear: sharing === 'results_and_setup' ? wearSummary(treadRows.filter((r) => r.car_id === e.car_id)) : null,
    }]);
  }

  return {
    team,
    season: year,
    classes: [...classes.entries()]
      .sort(([a], [b]) => a.localeCompare(b))
      .map(([classCode, cars]) => ({ classCode, factor: factorOf.get(classCode) ?? null, cars })),
  };
}

/**
 * Slope of the car's % off its class's fastest against the season's event order
 * (least squares): at each event the car's best line over its drivers. Null with
 * fewer than 2 events.
 */
function trendOf(days: Day[]): number | null {
  const bestAt = new Map<number, number>();
  for (const d of days) {
    const pct = d.result.pctOffClassFastest;
    if (pct === null) continue;
    bestAt.set(d.eventOrder, Math.min(pct, bestAt.get(d.eventOrder) ?? Infinity));
  }
  return leastSquaresSlope([...bestAt.entries()]);
}
