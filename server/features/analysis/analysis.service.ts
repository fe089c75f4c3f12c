import type { DataSource } from 'typeorm';
import type { User } from '@shared/auth/auth.schema';
import { CORNERS, type Corner } from '@shared/season/corners';
import { SETUP_CORNER_FIELDS, type Setup, type SetupCorner, type SetupCornerField } from '@shared/season/setup.schema';
import type { Run } from '@shared/season/run.schema';
import { diffSetups } from '@shared/season/setup-diff';
import {
  compareSamples, movedTogether, runOrderWithinDays, runsLeft, straightLineFit, summariseByValue, verdict, wearRateMmPerRun, type BetterWhen,
} from '@shared/calc/index';
import {
  SCATTER_PARAM_FIELD,
  type CompareQuery, type CompareResult, type Comparison, type CornerOrAxle, type ScatterParam, type ScatterPoint, type ScatterQuery,
  type ScatterResult, type SeasonResult,
} from '@shared/analysis/analysis.schema';
import { AppError } from '../../lib/app-error';
import { assertCarAccess } from '../../auth/access';
import { loadCarEntity } from '../cars/car.service';
import { setupsOfCar } from '../setups/setup.service';
import { loadRuns } from '../runs/run.service';
import { tyreSetsWithReadings } from '../tyres/tyre.service';
import type { CarEntity } from '../cars/car.entity';

/*
 * Analysis of one car's season: setup values against time and wear, before and
 * after a change, and tyre life. Data is read per car (indexed by car), and every
 * number comes from the shared calculations, so the screens and the API agree.
 */

const PARAM_UNIT: Record<ScatterParam, string> = { camber: '°', springRate: 'N/mm', damperClicks: 'clicks', coldPressure: 'kPa', rideHeight: 'mm' };

const cornersOf = (c: CornerOrAxle): Corner[] => (c === 'front' ? ['lf', 'rf'] : c === 'rear' ? ['lr', 'rr'] : [c]);

const mean = (xs: number[]) => xs.reduce((a, b) => a + b, 0) / xs.length;

/** The setup value at a corner or the mean over an axle; null when not recorded. */
function setupValue(setup: Setup | undefined, where: CornerOrAxle, field: keyof SetupCorner): number | null {
  if (!setup) return null;
  const values = cornersOf(where).map((c) => setup.corners[c][field]).filter((v): v is number => typeof v === 'number');
  return values.length === cornersOf(where).length ? mean(values) : null;
}

/** Clicks as 0–1 of the adjuster's range, 0 at the soft end, whichever end the count starts from. */
function normalizedClicks(car: CarEntity, where: CornerOrAxle, clicks: number): number | null {
  const front = where === 'front' || where === 'lf' || where === 'rf';
  const positions = front ? car.frontDamperPositions : car.rearDamperPositions;
  const from = front ? car.frontDamperCountFrom : car.rearDamperCountFrom;
  if (!positions || !from) return null;
  const share = clicks / positions;
  return from === 'full_soft' ? share : 1 - share;
}

interface WearInterval {
  corner: Corner;
  /** The two readings' times. */
  fromAt: string;
  toAt: string;
  /** The car's runs between them, and when the first and last were made. */
  runs: number;
  firstRunAt: string;
  lastRunAt: string;
  /** mm lost per run, by position; positive = worn. */
  inner: number;
  middle: number;
  outer: number;
  /** The snapshot most of those runs were on. */
  setupId: string | null;
  /** Every snapshot those runs were on (null for a run before the car's first). */
  setupIds: (string | null)[];
  eventId: string | null;
}

interface WearRow {
  corner: Corner;
  from_at: Date;
  to_at: Date;
  runs: number;
  first_run_at: Date;
  last_run_at: Date;
  inner: number;
  middle: number;
  outer: number;
  setup_id: string | null;
  setup_ids: (string | null)[];
  event_id: string | null;
}

/**
 * Wear between consecutive readings of each tyre set, per corner, over the car's
 * runs between them on that set — worked out in PostgreSQL (a window over the
 * readings and an aggregate over the runs), so only the intervals leave the
 * database. A run made while another set was on the car is not this set's
 * (`runs_with_tyre_set`); one made before any set was fitted counts for every set.
 * An interval across a rotation (another tyre on the corner) is left out: the two
 * readings are of different tyres. Before the first recorded mounting, the set is
 * as first fitted.
 */
async function wearIntervals(ds: DataSource, carId: string): Promise<WearInterval[]> {
  const rows: WearRow[] = await ds.query(
    `WITH on_set AS MATERIALIZED (
       -- Each run's set, looked up once, not once for every interval it could fall in.
       SELECT run_id, tyre_set_id FROM runs_with_tyre_set WHERE car_id = $1
     ), corner_readings AS (
       SELECT t.id, t.tyre_set_id, t.taken_at, t.event_id, c.corner, c.inner_mm, c.middle_mm, c.outer_mm,
              (SELECT CASE c.corner WHEN 'lf' THEN m.lf_tyre WHEN 'rf' THEN m.rf_tyre WHEN 'lr' THEN m.lr_tyre ELSE m.rr_tyre END
                 FROM tyre_mountings m
                WHERE m.tyre_set_id = t.tyre_set_id
                ORDER BY (m.mounted_at <= t.taken_at) DESC,
                         CASE WHEN m.mounted_at <= t.taken_at THEN m.mounted_at END DESC NULLS LAST,
                         m.mounted_at
                LIMIT 1) AS tyre
         FROM tread_readings t
         JOIN tyre_sets s ON s.id = t.tyre_set_id
         JOIN tread_reading_corners c ON c.reading_id = t.id
        WHERE s.car_id = $1
     ), pairs AS (
       SELECT cr.*,
              lag(cr.taken_at) OVER w AS prev_at, lag(cr.tyre) OVER w AS prev_tyre,
              lag(cr.inner_mm) OVER w AS prev_inner, lag(cr.middle_mm) OVER w AS prev_middle, lag(cr.outer_mm) OVER w AS prev_outer
         FROM corner_readings cr
       WINDOW w AS (PARTITION BY cr.tyre_set_id, cr.corner ORDER BY cr.taken_at, cr.id)
     )
     SELECT p.corner, p.prev_at AS from_at, p.taken_at AS to_at, n.runs, n.first_run_at, n.last_run_at,
            (p.prev_inner - p.inner_mm) / n.runs AS inner,
            (p.prev_middle - p.middle_mm) / n.runs AS middle,
            (p.prev_outer - p.outer_mm) / n.runs AS outer,
            n.setup_id, n.setup_ids, COALESCE(p.event_id, n.last_event_id) AS event_id
       FROM pairs p
       CROSS JOIN LATERAL (
         SELECT count(*)::int AS runs, min(r.recorded_at) AS first_run_at, max(r.recorded_at) AS last_run_at,
                mode() WITHIN GROUP (ORDER BY r.setup_id) AS setup_id,
                array_agg(DISTINCT r.setup_id::text) AS setup_ids,
                (array_agg(r.event_id ORDER BY r.recorded_at DESC))[1] AS last_event_id
           FROM runs_with_setup r
           JOIN on_set rt ON rt.run_id = r.id
          WHERE r.car_id = $1 AND r.recorded_at > p.prev_at AND r.recorded_at <= p.taken_at
            AND (rt.tyre_set_id IS NULL OR rt.tyre_set_id = p.tyre_set_id)
       ) n
      WHERE p.prev_at IS NOT NULL AND p.prev_tyre IS NOT DISTINCT FROM p.tyre AND n.runs > 0
      ORDER BY p.taken_at, p.corner`,
    [carId],
  );
  return rows.map((r) => ({
    corner: r.corner,
    fromAt: r.from_at.toISOString(),
    toAt: r.to_at.toISOString(),
    runs: r.runs,
    firstRunAt: r.first_run_at.toISOString(),
    lastRunAt: r.last_run_at.toISOString(),
    inner: r.inner,
    middle: r.middle,
    outer: r.outer,
    setupId: r.setup_id,
    setupIds: r.setup_ids,
    eventId: r.event_id,
  }));
}

async function loadSeason(ds: DataSource, carId: string) {
  const [car, setups, runs, sets, events] = await Promise.all([
    loadCarEntity(ds, carId),
    setupsOfCar(ds, carId),
    loadRuns(ds, 'r.car_id = $1', [carId]),
    tyreSetsWithReadings(ds, carId),
    ds.query(
      `SELECT DISTINCT e.id, e.name, e.date::text AS date, e.venue FROM events e JOIN runs r ON r.event_id = e.id
        WHERE r.car_id = $1 ORDER BY date`,
      [carId],
    ) as Promise<{ id: string; name: string; date: string; venue: string | null }[]>,
  ]);
  return { car, setups, runs, sets, events, setupById: new Map(setups.map((s) => [s.id, s])), eventById: new Map(events.map((e) => [e.id, e])) };
}

/**
 * The runs whose time speaks for the setup: finished (a time, scored against the day's best) and clean. A cone's
 * penalty is a driver's error, not the car's, and would read as a slower setup (common practice: runs with
 * driver errors are set aside when comparing setups).
 */
const timesTheSetup = (run: Run): run is Run & { pctOffBest: number } => run.pctOffBest !== null && run.cones === 0;

/** The straight line through the points, from three on (two always fit exactly and say nothing). */
function fitLine(points: { x: number; y: number }[]): ScatterResult['fit'] {
  return points.length < 3 ? null : straightLineFit(points.map((p) => [p.x, p.y]));
}

const inRange = (date: string | null, q: { from?: string; to?: string }) =>
  !date || ((!q.from || date >= q.from) && (!q.to || date <= q.to));

/**
 * The one value of a setting that every run of a wear interval was on, or null when they were on more than one (a
 * run on a snapshot without it recorded counts as another value) or it was never recorded.
 */
function intervalValue(setupIds: (string | null)[], valueOf: (setupId: string | null) => number | null): { x: number | null; mixed: boolean } {
  const values = new Set(setupIds.map(valueOf));
  if (values.size > 1) return { x: null, mixed: true };
  const [only] = values;
  return { x: only ?? null, mixed: false };
}

export async function scatter(ds: DataSource, user: User, carId: string, q: ScatterQuery): Promise<ScatterResult> {
  await assertCarAccess(ds, user, carId, 'read');
  const season = await loadSeason(ds, carId);
  const field = SCATTER_PARAM_FIELD[q.x];
  const unit = PARAM_UNIT[q.x];
  const points: ScatterPoint[] = [];
  const valueOf = (setupId: string | null) => setupValue(setupId ? season.setupById.get(setupId) : undefined, q.corner, field);
  const eventOf = (eventId: string | null) => (eventId ? season.eventById.get(eventId) : undefined);
  const base = (x: number, setupId: string | null, eventId: string | null) => {
    const event = eventOf(eventId);
    return {
      x,
      xNormalized: q.x === 'damperClicks' ? normalizedClicks(season.car, q.corner, x) : null,
      setupId,
      setupLabel: (setupId ? season.setupById.get(setupId)?.label : undefined) ?? null,
      eventId,
      eventName: event?.name ?? null,
      eventDate: event?.date ?? null,
    };
  };

  let mixedSetting = 0;
  let perValue: ScatterResult['perValue'] = null;
  if (q.y === 'time') {
    const readings: { value: number; y: number; day: string; order: number }[] = [];
    for (const run of season.runs.filter(timesTheSetup)) {
      const x = valueOf(run.setupId);
      if (x === null || !inRange(eventOf(run.eventId)?.date ?? null, q)) continue;
      points.push({ ...base(x, run.setupId, run.eventId), y: run.pctOffBest, runId: run.id, driver: run.driver, runNumber: run.runNumber, runs: null, corner: null });
      readings.push({ value: x, y: run.pctOffBest, day: run.eventId, order: Date.parse(run.recordedAt) });
    }
    perValue = { values: summariseByValue(readings), runOrder: runOrderWithinDays(readings) };
  } else {
    const wanted = new Set(cornersOf(q.corner));
    for (const w of await wearIntervals(ds, carId)) {
      if (!wanted.has(w.corner) || !inRange(eventOf(w.eventId)?.date ?? null, q)) continue;
      // The wear between two readings belongs to every value its runs were on: credited to one of them, it would
      // read as that value's (and a trend could be another change's). Such an interval is left out, and counted.
      const { x, mixed } = intervalValue(w.setupIds, valueOf);
      if (mixed) mixedSetting++;
      if (x === null) continue;
      const y = q.y === 'wear' ? (w.inner + w.middle + w.outer) / 3 : w.inner - w.outer;
      points.push({ ...base(x, w.setupId, w.eventId), y, runId: null, driver: null, runNumber: null, runs: w.runs, corner: w.corner });
    }
  }
  const descriptions = {
    time:
      "% off that driver's best at the same event. Raw times from different courses can't be compared, so each run is measured against its own day. Runs with a cone are left out: the penalty is the driver's, not the setup's.",
    wear: 'Tread lost per run between two readings, mean of inner, middle and outer.',
    wearSkew: 'Inner-edge wear minus outer-edge wear per run: above 0, the inner edge wears faster.',
  } as const;
  // Every other setting at the plotted corner or axle, as [x, its value] at each point.
  const others = Object.fromEntries(
    SETUP_CORNER_FIELDS.filter((f) => f !== field).map((f) => [f, points.map((p) => [p.x, setupValue(p.setupId ? season.setupById.get(p.setupId) : undefined, q.corner, f)] as const)]),
  ) as Record<SetupCornerField, (readonly [number, number | null])[]>;
  return {
    alsoMoved: movedTogether(others),
    x: { param: q.x, corner: q.corner, unit },
    y: { metric: q.y, unit: q.y === 'time' ? '%' : 'mm/run', description: descriptions[q.y] },
    points,
    n: points.length,
    fit: fitLine(points),
    leftOut: { mixedSetting },
    perValue,
    eventIds: season.events.map((e) => e.id),
  };
}

/** Wear rates are shown to 3 decimals (mm per run, and /32 in per run): the verdict writes them the same way. */
const WEAR_DECIMALS = 3;

function comparison(
  before: number[], after: number[], words: { what: string; unit: string; betterWhen: BetterWhen; counted: string; decimals: number },
): Comparison {
  const c = compareSamples(before, after);
  return { ...c, verdict: verdict(c, words), about: { what: words.what, betterWhen: words.betterWhen, counted: words.counted } };
}

/**
 * The % off the day's best on each side of a change, from the days a driver ran on both sides of it only. Each run
 * is measured against the same driver's best that day, so within one day both sides share one yardstick. A day
 * wholly before or after the change has its own best, so its runs sit near 0 % whatever the car was: a change
 * made between events would read as no change at all (or as the driver's consistency), and those runs are left
 * out, and counted.
 */
function timeAcrossSplit(timed: (Run & { pctOffBest: number })[], split: string) {
  const byDay = new Map<string, (Run & { pctOffBest: number })[]>();
  for (const r of timed) {
    const key = `${r.eventId}|${r.driver.id}`;
    byDay.set(key, [...(byDay.get(key) ?? []), r]);
  }
  const before: number[] = [];
  const after: number[] = [];
  const events = new Set<string>();
  let leftOut = 0;
  for (const runs of byDay.values()) {
    const early = runs.filter((r) => r.recordedAt < split);
    const late = runs.filter((r) => r.recordedAt >= split);
    if (early.length === 0 || late.length === 0) {
      leftOut += runs.length;
      continue;
    }
    before.push(...early.map((r) => r.pctOffBest));
    after.push(...late.map((r) => r.pctOffBest));
    events.add(runs[0]!.eventId);
  }
  return { before, after, days: events.size, leftOut };
}

export async function compare(ds: DataSource, user: User, carId: string, q: CompareQuery): Promise<CompareResult> {
  await assertCarAccess(ds, user, carId, 'read');
  let splitAt: Date;
  let change: CompareResult['change'] = null;
  if (q.changeId) {
    const rows: { id: string; what: string; changed_on: string; car_id: string; effective_from: Date | null }[] = await ds.query(
      `SELECT c.id, c.what, c.changed_on::text AS changed_on, c.car_id, s.effective_from
         FROM change_log c LEFT JOIN setup_snapshots s ON s.id = c.setup_id WHERE c.id = $1`,
      [q.changeId],
    );
    const row = rows[0];
    if (!row || row.car_id !== carId) throw new AppError('not_found', 'That change was not found on this car.');
    // The snapshot the change produced says when it took effect; else the start of the day it was logged.
    splitAt = row.effective_from ?? new Date(`${row.changed_on}T00:00:00Z`);
    change = { id: row.id, what: row.what, changedOn: row.changed_on };
  } else {
    splitAt = new Date(q.at!.length === 10 ? `${q.at}T00:00:00Z` : q.at!);
  }
  const season = await loadSeason(ds, carId);
  const split = splitAt.toISOString();
  const intervals = await wearIntervals(ds, carId);
  const corners = {} as CompareResult['corners'];
  for (const corner of CORNERS) {
    const mine = intervals.filter((w) => w.corner === corner);
    // An interval counts on a side when all its runs were made on that side of the change.
    const before = mine.filter((w) => w.lastRunAt < split);
    const after = mine.filter((w) => w.firstRunAt >= split);
    const label = corner.toUpperCase();
    corners[corner] = {
      wear: comparison(before.map((w) => (w.inner + w.middle + w.outer) / 3), after.map((w) => (w.inner + w.middle + w.outer) / 3), {
        what: `${label} wear`, unit: 'mm per run', betterWhen: 'lower', counted: 'interval', decimals: WEAR_DECIMALS,
      }),
      innerWear: comparison(before.map((w) => w.inner), after.map((w) => w.inner), {
        what: `${label} inner-edge wear`, unit: 'mm per run', betterWhen: 'lower', counted: 'interval', decimals: WEAR_DECIMALS,
      }),
      skew: comparison(before.map((w) => w.inner - w.outer), after.map((w) => w.inner - w.outer), {
        // Even wear across the tread (0) is the aim (common practice): a swing to the outer edge is no gain.
        what: `${label} inner-minus-outer wear`, unit: 'mm per run', betterWhen: 'nearZero', counted: 'interval', decimals: WEAR_DECIMALS,
      }),
    };
  }
  const { before, after, days, leftOut } = timeAcrossSplit(season.runs.filter(timesTheSetup), split);
  const time = comparison(before, after, { what: "time off the day's best", unit: '%', betterWhen: 'lower', counted: 'run', decimals: 2 });
  return { splitAt: split, change, corners, time, timeScope: { days, leftOut } };
}

/** The fields whose change re-sets a tyre's wear rate at a corner. */
const ALIGNMENT_FIELDS = new Set(['camberDeg', 'toeMm', 'casterDeg']);

/** The latest setup, after `after`, that changed camber, toe or caster at `corner`: when it took effect, and its label. */
function latestAlignmentChange(setups: Setup[], corner: Corner, after: string): { at: string; label: string } | null {
  for (let i = setups.length - 1; i > 0; i--) {
    const s = setups[i]!;
    if (s.effectiveFrom <= after) return null;
    if (diffSetups(setups[i - 1]!, s).some((c) => c.corner === corner && ALIGNMENT_FIELDS.has(c.field))) return { at: s.effectiveFrom, label: s.label };
  }
  return null;
}

export async function seasonSummary(ds: DataSource, user: User, carId: string, minDepthMm: number): Promise<SeasonResult> {
  await assertCarAccess(ds, user, carId, 'read');
  const season = await loadSeason(ds, carId);
  const events: SeasonResult['events'] = season.events.map((e) => {
    const byDriver = new Map<string, Run[]>();
    for (const r of season.runs.filter((x) => x.eventId === e.id)) byDriver.set(r.driver.id, [...(byDriver.get(r.driver.id) ?? []), r]);
    return {
      eventId: e.id,
      name: e.name,
      date: e.date,
      venue: e.venue,
      drivers: [...byDriver.values()].map((runs) => {
        const raws = runs.filter((r) => r.status === 'finished' && r.rawTimeSec !== null).map((r) => r.rawTimeSec!);
        return {
          driver: runs[0]!.driver,
          bestRawSec: raws.length ? Math.min(...raws) : null,
          bestAdjustedSec: runs.find((r) => r.isBest)?.adjustedTimeSec ?? null,
          runCount: runs.length,
          cones: runs.reduce((n, r) => n + r.cones, 0),
          classPosition: null,
        };
      }),
    };
  });
  const setupChanges = season.setups.map((s, i) => ({
    setupId: s.id,
    label: s.label,
    effectiveFrom: s.effectiveFrom,
    createdBy: s.createdBy.displayName,
    changes: i === 0 ? [] : diffSetups(season.setups[i - 1]!, s),
  }));
  const changeLog: SeasonResult['changeLog'] = (
    (await ds.query(
      `SELECT id, changed_on::text AS changed_on, what, location, setup_id FROM change_log WHERE car_id = $1 ORDER BY changed_on, created_at`,
      [carId],
    )) as { id: string; changed_on: string; what: string; location: string; setup_id: string | null }[]
  ).map((c) => ({ id: c.id, changedOn: c.changed_on, what: c.what, location: c.location, setupId: c.setup_id }));

  // The set each run was made on (null before any set was fitted: such a run counts for every set, as in wearIntervals).
  const onSet = new Map(
    ((await ds.query(`SELECT run_id, tyre_set_id FROM runs_with_tyre_set WHERE car_id = $1`, [carId])) as { run_id: string; tyre_set_id: string | null }[]).map((r) => [r.run_id, r.tyre_set_id]),
  );
  const tyreLife = season.sets.map(({ set, readings }) => {
    const runsOnSet = season.runs.filter((x) => (onSet.get(x.id) ?? set.id) === set.id);
    const latest = readings.at(-1) ?? null;
    let worst: NonNullable<SeasonResult['tyreLife'][number]['worst']> | null = null;
    for (const corner of CORNERS) {
      const c = latest?.corners[corner];
      if (!c) continue;
      for (const position of ['inner', 'middle', 'outer'] as const) {
        const depthMm = c[`${position}Mm`];
        if (!worst || depthMm < worst.depthMm) worst = { corner, position, depthMm };
      }
    }
    // The worst spot's depth against the cumulative runs on this set at each reading of this tyre.
    const ofTyre = worst ? readings.filter((r) => r.corners[worst!.corner]?.tyreNumber === latest!.corners[worst!.corner]!.tyreNumber) : [];
    const toPoint = (r: (typeof readings)[number]) => ({ runs: runsOnSet.filter((x) => x.recordedAt <= r.takenAt).length, depthMm: r.corners[worst!.corner]![`${worst!.position}Mm`] });
    // A new camber, toe or caster at that corner moves where and how fast the tread wears (common practice), so
    // the line starts at the last reading before the latest such change, when two readings from there on allow one.
    const change = worst && ofTyre.length ? latestAlignmentChange(season.setups, worst.corner, ofTyre[0]!.takenAt) : null;
    const since = change ? ofTyre.slice(Math.max(0, ofTyre.findLastIndex((r) => r.takenAt <= change.at))) : [];
    const fitted: 'since' | 'whole' = change && since.length >= 2 ? 'since' : 'whole';
    const points = (fitted === 'since' ? since : ofTyre).map(toPoint);
    const rate = wearRateMmPerRun(points);
    // Runs made on the set since its latest reading wear it further: each takes one run off what was left then.
    const runsSinceReading = latest ? runsOnSet.filter((x) => x.recordedAt > latest.takenAt).length : 0;
    const leftAtReading = rate && worst ? runsLeft({ depthNowMm: worst.depthMm, minimumDepthMm: minDepthMm, mmPerRun: rate.mmPerRun }) : null;
    return {
      alignmentChange: change && { ...change, fitted },
      tyreSetId: set.id,
      label: set.label,
      minDepthMm,
      latestReadingAt: latest?.takenAt ?? null,
      worst,
      mmPerRun: rate?.mmPerRun ?? null,
      r2: rate?.r2 ?? null,
      n: points.length,
      runsSinceReading,
      runsLeft: leftAtReading === null ? null : Math.max(0, leftAtReading - runsSinceReading),
    };
  });
  return { carId, events, setupChanges, changeLog, tyreLife };
}
