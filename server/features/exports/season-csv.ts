import Papa from 'papaparse';
import type { DataSource } from 'typeorm';
import type { User } from '@shared/auth/auth.schema';
import { CORNERS } from '@shared/season/corners';
import type { Run } from '@shared/season/run.schema';
import type { Setup, SetupCornerField } from '@shared/season/setup.schema';
import { assertCarAccess } from '../../auth/access';
import { loadCarEntity } from '../cars/car.service';
import { setupsOfCar } from '../setups/setup.service';
import { loadRuns } from '../runs/run.service';
import { seasonFileName } from './export.service';

/** Per-corner setup columns: `<corner>_<name>_<unit>`, values in SI as stored. */
const CORNER_COLUMNS: [SetupCornerField, string][] = [
  ['camberDeg', 'camber_deg'],
  ['toeMm', 'toe_mm'],
  ['casterDeg', 'caster_deg'],
  ['springRateNPerMm', 'spring_rate_n_per_mm'],
  ['rideHeightMm', 'ride_height_mm'],
  ['damperClicks', 'clicks'],
  ['damperReboundClicks', 'rebound_clicks'],
  ['coldPressureKpa', 'cold_pressure_kpa'],
  ['cornerWeightKg', 'corner_weight_kg'],
];

/** The header row, in order. */
export const SEASON_CSV_COLUMNS = [
  'event_date', 'event_name', 'venue', 'run_number', 'driver', 'status', 'raw_time_s', 'cones', 'cone_penalty_s', 'adjusted_time_s',
  'recorded_at', 'setup_label', 'setup_effective_from',
  ...CORNERS.flatMap((c) => CORNER_COLUMNS.map(([, name]) => `${c}_${name}`)),
  'front_anti_roll_bar', 'rear_anti_roll_bar', 'run_notes', 'tyre_set',
] as const;

type Cell = string | number | null;

function rowOf(run: Run, event: EventRow, setup: Setup | undefined, tyreSet: string | null): Cell[] {
  const values: Record<string, Cell> = {
    event_date: event.date,
    event_name: event.name,
    venue: event.venue,
    run_number: run.runNumber,
    driver: run.driver.displayName,
    status: run.status,
    raw_time_s: run.rawTimeSec,
    cones: run.cones,
    cone_penalty_s: event.cone_penalty_sec,
    // From the one scoring function (raw + cones × the event's penalty), as every screen shows it.
    adjusted_time_s: run.adjustedTimeSec,
    recorded_at: run.recordedAt,
    setup_label: setup?.label ?? null,
    setup_effective_from: setup?.effectiveFrom ?? null,
    front_anti_roll_bar: setup?.axles.front.antiRollBar ?? null,
    rear_anti_roll_bar: setup?.axles.rear.antiRollBar ?? null,
    run_notes: run.notes,
    tyre_set: tyreSet,
  };
  for (const c of CORNERS) for (const [field, name] of CORNER_COLUMNS) values[`${c}_${name}`] = setup?.corners[c]?.[field] ?? null;
  return SEASON_CSV_COLUMNS.map((col) => values[col] ?? null);
}

interface EventRow {
  id: string;
  date: string;
  name: string;
  venue: string | null;
  cone_penalty_sec: number;
}

/**
 * One row per run with the setup in force when it was recorded and the tyre set then on the car, by
 * run id (RFC 4180: CRLF line ends, quotes doubled). A text cell that a spreadsheet would read as a
 * formula (= + - @, tab, carriage return first) gets a leading apostrophe (OWASP, "CSV Injection");
 * numbers stay numbers, negative camber too.
 */
export function seasonCsv(runs: readonly Run[], events: readonly EventRow[], setups: readonly Setup[], tyreSetOf: ReadonlyMap<string, string> = new Map()): string {
  const eventOf = new Map(events.map((e) => [e.id, e]));
  const setupOf = new Map(setups.map((s) => [s.id, s]));
  const rows = runs.map((r) => rowOf(r, eventOf.get(r.eventId)!, r.setupId ? setupOf.get(r.setupId) : undefined, tyreSetOf.get(r.id) ?? null));
  // A byte-order mark, so spreadsheet programs read the file as UTF-8 (names with accents survive).
  return `\uFEFF${Papa.unparse({ fields: [...SEASON_CSV_COLUMNS], data: rows }, { escapeFormulae: true, newline: '\r\n' })}\r\n`;
}

export async function exportSeasonCsv(ds: DataSource, user: User, carId: string): Promise<{ csv: string; fileName: string }> {
  await assertCarAccess(ds, user, carId, 'read');
  const car = await loadCarEntity(ds, carId);
  const runs = await loadRuns(ds, 'r.car_id = $1', [carId]);
  const setups = await setupsOfCar(ds, carId);
  const events: EventRow[] = runs.length
    ? await ds.query('SELECT id, date::text AS date, name, venue, cone_penalty_sec FROM events WHERE id = ANY($1)', [[...new Set(runs.map((r) => r.eventId))]])
    : [];
  const onSet: { run_id: string; label: string }[] = await ds.query(
    'SELECT r.run_id, s.label FROM runs_with_tyre_set r JOIN tyre_sets s ON s.id = r.tyre_set_id WHERE r.car_id = $1',
    [carId],
  );
  const tyreSetOf = new Map(onSet.map((r) => [r.run_id, r.label]));
  return { csv: seasonCsv(runs, events, setups, tyreSetOf), fileName: `${seasonFileName(car.name, events.map((e) => e.date))}.csv` };
}
