import type { DataSource } from 'typeorm';
import * as z from '@shared/zod';
import type { User } from '@shared/auth/auth.schema';
import {
  DSQ_NOTE,
  importRunValuesSchema,
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
  const good: { runNumber: number; status: string; rawTimeSec: number | null; cones: number; notes: string | null }[] = [];
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
    const dsq = run.status === 'dsq';
    good.push({ runNumber: run.runNumber, status: dsq ? 'dnf' : run.status, rawTimeSec: run.rawTimeSec, cones: run.cones, notes: dsq ? DSQ_NOTE : null });
  }

  let created = 0;
  if (good.length > 0) {
    created = await ds.transaction(async (m) => {
      const inserted: unknown[] = await m.query(
        `INSERT INTO runs (id, car_id, event_id, driver_id, run_number, raw_time_sec, cones, status, recorded_at, notes)
         SELECT gen_random_uuid(), $1, $2, $3, g.run_number, g.raw_time_sec, g.cones, g.status,
                $4::timestamptz + (g.run_number - 1) * interval '1 minute', g.notes
           FROM unnest($5::int[], $6::float8[], $7::int[], $8::text[], $9::text[]) AS g(run_number, raw_time_sec, cones, status, notes)
         ON CONFLICT ON CONSTRAINT runs_number_unique DO NOTHING
         RETURNING id`,
        [
          input.carId, eventId, driverId, new Date(firstRunAt),
          good.map((r) => r.runNumber), good.map((r) => r.rawTimeSec), good.map((r) => r.cones),
          good.map((r) => r.status), good.map((r) => r.notes),
        ],
      );
      return inserted.length;
    });
  }
  failed.sort((a, b) => a.line - b.line || a.runNumber - b.runNumber);
  return { created, alreadyThere: good.length - created, failed };
}
