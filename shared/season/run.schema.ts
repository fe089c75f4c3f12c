import * as z from '../zod';
import { isoDateTime } from '../api/dates.schema';
import { perCorner, type PerCorner } from './corners';
import { LIMITS } from './limits';
import { pressureKpaSchema } from './setup.schema';
import { versionSchema } from './car.schema';

export const RUN_STATUSES = ['finished', 'dnf', 'off_course'] as const;
export const runStatusSchema = z.enum(RUN_STATUSES);
export type RunStatus = z.infer<typeof runStatusSchema>;

export const rawTimeSecSchema = z
  .number({ error: 'Enter the time in seconds' })
  .check(
    z.gte(LIMITS.rawTimeSec.min, 'The time must be at least 0.001 s'),
    z.lt(LIMITS.rawTimeSec.maxExclusive, 'The time must be under 1800 s (30 min)'),
  );

export const conesSchema = z
  .number({ error: 'Cones must be a whole number' })
  .check(
    z.int('Cones must be a whole number'),
    z.gte(LIMITS.cones.min, 'Cones cannot be negative'),
    z.lte(LIMITS.cones.max, `Cones must be at most ${LIMITS.cones.max}`),
  );

const runFields = {
  runNumber: z.number().check(z.int('Run numbers are whole numbers'), z.gte(1, 'Run numbers start at 1'), z.lte(999)),
  /** Null for a DNF or off-course run with no time taken. */
  rawTimeSec: z.nullable(rawTimeSecSchema),
  cones: z._default(conesSchema, 0),
  status: z._default(runStatusSchema, 'finished'),
  recordedAt: isoDateTime(),
  driverId: z.optional(z.uuid()),
  hotPressuresKpa: z.optional(z.nullable(perCorner(pressureKpaSchema))),
  notes: z.optional(z.nullable(z.string().check(z.trim(), z.maxLength(2000)))),
};

const needsTime = (r: { status?: RunStatus; rawTimeSec?: number | null }) =>
  r.status !== 'finished' || (r.rawTimeSec !== null && r.rawTimeSec !== undefined);
const timeMessage = { message: 'A finished run needs its time', path: ['rawTimeSec'] };

export const createRunInputSchema = z
  .strictObject({
    /** Made by the client (UUID), so a replay of the same run is recognised. */
    id: z.uuid({ error: 'The run id must be a UUID' }),
    carId: z.uuid(),
    eventId: z.uuid(),
    ...runFields,
  })
  .check(z.refine(needsTime, timeMessage));
export type CreateRunInput = z.infer<typeof createRunInputSchema>;

// Marked pure (as is the list query below): the server checks with it, the client never does, so the client's
// bundles leave it out.
export const updateRunInputSchema = /* @__PURE__ */ z
  .strictObject({
    runNumber: z.optional(runFields.runNumber),
    rawTimeSec: z.optional(runFields.rawTimeSec),
    cones: z.optional(conesSchema),
    status: z.optional(runStatusSchema),
    recordedAt: z.optional(runFields.recordedAt),
    driverId: z.optional(z.uuid()),
    hotPressuresKpa: runFields.hotPressuresKpa,
    notes: runFields.notes,
    version: versionSchema,
  })
  .check(z.refine((r) => r.status !== 'finished' || r.rawTimeSec !== null, timeMessage));
export type UpdateRunInput = z.infer<typeof updateRunInputSchema>;

export const listRunsQuerySchema = /* @__PURE__ */ z.strictObject({
  carId: z.optional(z.uuid()),
  eventId: z.optional(z.uuid()),
});

export interface Run {
  id: string;
  carId: string;
  eventId: string;
  driver: { id: string; displayName: string };
  runNumber: number;
  rawTimeSec: number | null;
  cones: number;
  status: RunStatus;
  recordedAt: string;
  hotPressuresKpa: PerCorner<number> | null;
  notes: string | null;
  /** The car's setup snapshot in force at recordedAt; null when none was. */
  setupId: string | null;
  /** raw + cones × the event's cone penalty; null for a DNF or off-course run. */
  adjustedTimeSec: number | null;
  /** % off this driver's best adjusted time at this event; null when there is none. */
  pctOffBest: number | null;
  isBest: boolean;
  /** Comments in the run's thread, for the "Comments (n)" control; absent from servers that do not count them. */
  commentCount?: number;
  version: number;
  createdAt: string;
  updatedAt: string;
}
