/**
 * A car's season as one file: what `GET /api/cars/:carId/export.json` writes and
 * `POST /api/cars/import` reads back (into a new car of whoever imports it).
 *
 * Ids are the ones the records had where the file was made; they only tie the file's
 * records together (a run to its event, a snapshot to the one it was derived from) and are
 * replaced on import. Values are SI, as stored. Left out on purpose: comments (other
 * people's words), co-drivers and shop grants (other people's accounts), attached files,
 * and links to a shop's suggestions or work orders.
 */
import * as z from '../zod';
import { isoDateTime } from '../api/dates.schema';
import { createCarInputSchema } from '../season/car.schema';
import { createChangeInputSchema } from '../season/change-log.schema';
import { perCorner } from '../season/corners';
import { createEventInputSchema } from '../season/event.schema';
import { conesSchema, rawTimeSecSchema, runStatusSchema } from '../season/run.schema';
import { setupAxleSchema, setupCornerSchema } from '../season/setup.schema';
import { createMountingInputSchema, createPressureReadingInputSchema, createTreadReadingInputSchema, createTyreSetInputSchema } from '../season/tyre.schema';

import { SEASON_FILE_FORMAT, SEASON_FILE_VERSION } from './season-file';

export { SEASON_FILE_FORMAT, SEASON_FILE_MAX_BYTES, SEASON_FILE_VERSION, type SeasonImportResult } from './season-file';

/** An id inside the file: only compared with the file's other ids, never looked up. */
const ref = z.string().check(z.minLength(1, 'Give the record an id'), z.maxLength(100, 'Use an id of at most 100 characters'));
const optionalText = (max: number) => z.optional(z.nullable(z.string().check(z.trim(), z.maxLength(max))));
/** Who recorded a record where the file was made; shown for reference, not imported (the importer becomes the recorder). */
const personName = optionalText(80);
const many = <T extends z.ZodMiniType>(schema: T, max: number, what: string) =>
  z._default(z.array(schema).check(z.maxLength(max, `A season file holds at most ${max} ${what}`)), []);

export const exportedCarSchema = z.extend(z.omit(createCarInputSchema, { id: true }), { id: ref });

export const exportedSetupSchema = z.strictObject({
  id: ref,
  label: z.string().check(z.trim(), z.minLength(1, 'Give the setup a label'), z.maxLength(80, 'Use at most 80 characters')),
  effectiveFrom: isoDateTime(),
  recordedBy: personName,
  derivedFromId: z._default(z.nullable(ref), null),
  notes: optionalText(2000),
  corners: z._default(perCorner(setupCornerSchema), {}),
  axles: z._default(z.strictObject({ front: z.optional(setupAxleSchema), rear: z.optional(setupAxleSchema) }), {}),
});

export const exportedChangeSchema = z.extend(z.omit(createChangeInputSchema, { id: true, setupId: true }), {
  id: ref,
  setupId: z._default(z.nullable(ref), null),
  recordedBy: personName,
});

export const exportedEventSchema = z.extend(z.omit(createEventInputSchema, { id: true, teamId: true }), { id: ref });

export const exportedRunSchema = z
  .strictObject({
    id: ref,
    eventId: ref,
    runNumber: z.number().check(z.int('Run numbers are whole numbers'), z.gte(1, 'Run numbers start at 1'), z.lte(999)),
    /** Null for a DNF or off-course run with no time taken. */
    rawTimeSec: z.nullable(rawTimeSecSchema),
    cones: z._default(conesSchema, 0),
    status: z._default(runStatusSchema, 'finished'),
    recordedAt: isoDateTime(),
    driverName: personName,
    notes: optionalText(2000),
  })
  .check(
    z.refine((r) => r.status !== 'finished' || r.rawTimeSec !== null, { message: 'A finished run needs its time', path: ['rawTimeSec'] }),
  );

export const exportedPressureSchema = z.extend(z.omit(createPressureReadingInputSchema, { id: true, runId: true }), {
  id: ref,
  runId: z._default(z.nullable(ref), null),
});

export const exportedMountingSchema = z.extend(z.omit(createMountingInputSchema, { id: true }), { id: ref });

export const exportedTreadReadingSchema = z.extend(z.omit(createTreadReadingInputSchema, { id: true, eventId: true }), {
  id: ref,
  eventId: z._default(z.nullable(ref), null),
  recordedBy: personName,
});

export const exportedTyreSetSchema = z.extend(z.omit(createTyreSetInputSchema, { id: true }), {
  id: ref,
  mountings: many(exportedMountingSchema, 500, 'rotations per set'),
  readings: many(exportedTreadReadingSchema, 2000, 'tread readings per set'),
});

export const seasonExportSchema = z.strictObject({
  format: z.literal(SEASON_FILE_FORMAT, { error: 'This is not a Scrubline season file' }),
  version: z.literal(SEASON_FILE_VERSION, { error: `Scrubline reads season files of version ${SEASON_FILE_VERSION}` }),
  exportedAt: z.optional(isoDateTime()),
  car: exportedCarSchema,
  setups: many(exportedSetupSchema, 5000, 'setups'),
  changes: many(exportedChangeSchema, 5000, 'change-log entries'),
  events: many(exportedEventSchema, 2000, 'events'),
  runs: many(exportedRunSchema, 20000, 'runs'),
  pressures: many(exportedPressureSchema, 20000, 'pressure readings'),
  tyreSets: many(exportedTyreSetSchema, 500, 'tyre sets'),
});

/** The file as written by the export (every field present). */
export type SeasonExport = z.output<typeof seasonExportSchema>;
/** The file as an import may receive it (defaults not yet filled in). */
export type SeasonExportInput = z.input<typeof seasonExportSchema>;

/**
 * Reads just the file's header, before the full check, so a file that is not ours (or is from
 * a newer version) gets one clear message rather than a page of field errors.
 */
export function seasonFileHeaderProblem(body: unknown): { field: 'format' | 'version' | '_'; message: string } | null {
  if (typeof body !== 'object' || body === null || Array.isArray(body)) {
    return { field: '_', message: 'This is not a Scrubline season file: expected a JSON object.' };
  }
  const { format, version } = body as { format?: unknown; version?: unknown };
  if (format !== SEASON_FILE_FORMAT) {
    return { field: 'format', message: `This is not a Scrubline season file (its "format" should be "${SEASON_FILE_FORMAT}").` };
  }
  if (version !== SEASON_FILE_VERSION) {
    const newer = typeof version === 'number' && version > SEASON_FILE_VERSION;
    return {
      field: 'version',
      message: newer
        ? `This file was written by a newer Scrubline (file version ${version}); this one reads version ${SEASON_FILE_VERSION}.`
        : `This season file has an unknown version (${JSON.stringify(version) ?? 'none'}); Scrubline reads version ${SEASON_FILE_VERSION}.`,
    };
  }
  return null;
}
