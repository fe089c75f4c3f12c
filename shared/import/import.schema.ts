import * as z from '../zod';
import { isoDateTime } from '../api/dates.schema';
import { conesSchema, rawTimeSecSchema } from '../season/run.schema';

/** The most runs one import may carry (a full season of one car at one event is far fewer). */
export const MAX_IMPORT_RUNS = 500;

export const IMPORT_STATUSES = ['finished', 'dnf', 'off_course', 'dsq'] as const;
export type ImportStatus = (typeof IMPORT_STATUSES)[number];

/** A disqualified run is kept as a DNF with this note: runs record finished, DNF or off course only. */
export const DSQ_NOTE = 'DSQ in the club results';

/**
 * One run as the sheet gave it. Only its shape is checked here; its values are checked run
 * by run on the server, so one bad run is listed while the others import.
 */
export const importRunItemSchema = z.strictObject({
  /** The line in the file, to point the user back at it. */
  line: z.number().check(z.int(), z.gte(1)),
  runNumber: z.number(),
  status: z.enum(IMPORT_STATUSES),
  rawTimeSec: z.nullable(z.number()),
  cones: z.number(),
});
export type ImportRunItem = z.infer<typeof importRunItemSchema>;

/** The checks a run must pass to be stored (the same limits as a run logged by hand). */
export const importRunValuesSchema = z
  .object({
    runNumber: z.number().check(z.int('Run numbers are whole numbers'), z.gte(1, 'Run numbers start at 1'), z.lte(999, 'Run numbers go up to 999')),
    status: z.enum(IMPORT_STATUSES),
    rawTimeSec: z.nullable(rawTimeSecSchema),
    cones: conesSchema,
  })
  .check(z.refine((r) => r.status !== 'finished' || r.rawTimeSec !== null, { message: 'A finished run needs its time', path: ['rawTimeSec'] }));

export const importResultsInputSchema = z.strictObject({
  carId: z.uuid({ error: 'Choose the car' }),
  /** Whose runs these are: the car's owner or a co-driver. Defaults to the signed-in driver. */
  driverId: z.optional(z.uuid()),
  /**
   * When run 1 is taken to have started (the event's date at noon where the driver is);
   * each later run one minute on. Defaults to noon UTC on the event's date.
   */
  firstRunAt: z.optional(isoDateTime('Use a date and time such as 2026-06-12T12:00:00+02:00')),
  runs: z
    .array(importRunItemSchema)
    .check(z.minLength(1, 'Choose at least one run to import'), z.maxLength(MAX_IMPORT_RUNS, `Import at most ${MAX_IMPORT_RUNS} runs at a time`)),
});
export type ImportResultsInput = z.infer<typeof importResultsInputSchema>;

export interface ImportFailure {
  line: number;
  runNumber: number;
  reason: string;
}

/** A run's result as logged or as the sheet gives it (a disqualification is stored as a DNF). */
export interface ImportedRunValues {
  status: 'finished' | 'dnf' | 'off_course';
  rawTimeSec: number | null;
  cones: number;
}

/** A run already logged whose time, cones or result the sheet gives otherwise: kept as logged, and said. */
export interface ImportDifference {
  line: number;
  runNumber: number;
  logged: ImportedRunValues;
  sheet: ImportedRunValues;
}

export interface ImportResult {
  created: number;
  /** Runs with that number were already logged for this driver and car at this event; they are left as they are. */
  alreadyThere: number;
  /** Of those, the ones the sheet disagrees with, in the sheet's order. */
  differing: ImportDifference[];
  failed: ImportFailure[];
}
