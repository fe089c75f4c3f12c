import type { DataSource } from 'typeorm';
import * as z from '@shared/zod';
import type { User } from '@shared/auth/auth.schema';
import {
  DSQ_NOTE,
  importRunValuesSchema,
  type ImportDifference,
  type ImportedRunValues,
  type ImportFailure,
  type ImportResult,
  type ImportResultsInput,
} from '@shared/import/import.schema';
import { AppError } from '../../lib/app-error';
import { assertCarAccess, assertEventAccess } from '../../auth/access';

/** Time zones run from UTC−12 to UTC+14: local noon is within 14 h of noon UTC. */
const MAX_OFFSET_MS = 14 * 3_600_000;

const invalid = (field: string, message: string) => new AppError('validation_failed', 'Some fields need attention.', { [field]: [message] });

/**
 * Stores the runs of a club's timing sheet for one car (and driver) at one event.
 * Runs whose number is already logged for that driver, car and event are left alone
 * (ON CONFLICT on the runs' unique run number), so importing the same file again adds
 * nothing. A run that fails the checks is listed with its reason; the others import
 * together in one transaction.
 */
export async function importResults(ds: DataSource, user: User, eventId: string, input: ImportResultsInput): Promise<ImportResult> {
  await assertCarAccess(ds, user, input.carId, 'write');
  await assertEventAccess(ds, user, eventId);
  const driverId = input.driverId ?? user.id;
  const drivers = await ds.query(
    `SELECT 1 FROM cars c WHERE c.id = $1
       AND (c.owner_id = $2 OR EXISTS (SELECT 1 FROM car_co_drivers d WHERE d.car_id = c.id AND d.user_id = $2))`,
    [input.carId, driverId],
  );
  if (drivers.length === 0) throw invalid('driverId', "The driver must be the car's owner or one of its co-drivers");

  const [event] = (await ds.query(`SELECT to_char(date, 'YYYY-MM-DD') AS date FROM events WHERE id = $1`, [eventId])) as { date: string }[];
  const noonUtc = Date.parse(`${event!.date}T12:00:00Z`);
  const firstRunAt = input.firstRunAt === undefined ? noonUtc : Date.parse(input.firstRunAt);
  if (Math.abs(firstRunAt - noonUtc) > MAX_OFFSET_MS) {
    throw invalid('firstRunAt', `Give a time on the event's day (${event!.date})`);
  }

  const failed: ImportFailure[] = [];
  const good: ({ line: number; runNumber: number; notes: string | null } & ImportedRunValues)[] = [];
  const seen = new Set<number>();
  for (const run of input.runs) {
    const checked = z.safeParse(importRunValuesSchema, run);
    if (!checked.success) {
      failed.push({ line: run.line, runNumber: run.runNumber, reason: checked.error.issues[0]?.message ?? 'This run could not be read' });
      continue;
    }
    if (seen.has(run.runNumber)) {
      failed.push({ line: run.line, runNumber: run.runNumber, reason: `Run ${run.runNumber} appears more than once in this import` });
      continue;
    }
    seen.add(run.runNumber);
    // A disqualification is stored as a DNF, with a note saying so.
    const status = run.status === 'dsq' ? 'dnf' : run.status;
    good.push({ line: run.line, runNumber: run.runNumber, status, rawTimeSec: run.rawTimeSec, cones: run.cones, notes: run.status === 'dsq' ? DSQ_NOTE : null });
  }

  let created = 0;
  const differing: ImportDifference[] = [];
  if (good.length > 0) {
    created = await ds.transaction(async (m) => {
      const inserted: { run_number: number }[] = await m.query(
        `INSERT INTO runs (id, car_id, event_id, driver_id, run_number, raw_time_sec, cones, status, recorded_at, notes)
         SELECT gen_random_uuid(), $1, $2, $3, g.run_number, g.raw_time_sec, g.cones, g.status,
                $4::timestamptz + (g.run_number - 1) * interval '1 minute', g.notes
           FROM unnest($5::int[], $6::float8[], $7::int[], $8::text[], $9::text[]) AS g(run_number, raw_time_sec, cones, status, notes)
         ON CONFLICT ON CONSTRAINT runs_number_unique DO NOTHING
         RETURNING run_number`,
        [
          input.carId, eventId, driverId, new Date(firstRunAt),
          good.map((r) => r.runNumber), good.map((r) => r.rawTimeSec), good.map((r) => r.cones),
          good.map((r) => r.status), good.map((r) => r.notes),
        ],
      );
      // The runs already logged: the phone's record stands, but where the sheet says otherwise the driver is told.
      const added = new Set(inserted.map((r) => r.run_number));
      const kept = good.filter((r) => !added.has(r.runNumber));
      if (kept.length > 0) {
        const logged: { run_number: number; status: ImportedRunValues['status']; raw_time_sec: number | null; cones: number }[] = await m.query(
          `SELECT run_number, status, raw_time_sec, cones FROM runs
            WHERE event_id = $1 AND car_id = $2 AND driver_id = $3 AND run_number = ANY($4::int[])`,
          [eventId, input.carId, driverId, kept.map((r) => r.runNumber)],
        );
        const byNumber = new Map(logged.map((r) => [r.run_number, r]));
        for (const sheet of kept) {
          const was = byNumber.get(sheet.runNumber);
          if (!was) continue;
          const values: ImportedRunValues = { status: was.status, rawTimeSec: was.raw_time_sec, cones: was.cones };
          if (!sameResult(values, sheet)) {
            differing.push({ line: sheet.line, runNumber: sheet.runNumber, logged: values, sheet: { status: sheet.status, rawTimeSec: sheet.rawTimeSec, cones: sheet.cones } });
          }
        }
      }
      return inserted.length;
    });
  }
  failed.sort((a, b) => a.line - b.line || a.runNumber - b.runNumber);
  return { created, alreadyThere: good.length - created, differing, failed };
}

/** The same result: status and cones, and for a finished run its time to the thousandth a timing sheet gives. */
function sameResult(a: ImportedRunValues, b: ImportedRunValues): boolean {
  const time = (s: number | null) => (s === null ? null : Math.round(s * 1000));
  return a.status === b.status && a.cones === b.cones && (a.status !== 'finished' || time(a.rawTimeSec) === time(b.rawTimeSec));
}
