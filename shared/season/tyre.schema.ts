import * as z from '../zod';
import { isoDate, isoDateTime } from '../api/dates.schema';
import { CORNERS, perCorner, type Corner } from './corners';
import { LIMITS } from './limits';

const depth = (label: string) =>
  z
    .number({ error: `${label} depth must be a number` })
    .check(
      z.gte(LIMITS.treadMm.min, `${label} depth cannot be negative`),
      z.lte(LIMITS.treadMm.max, `${label} depth must be at most ${LIMITS.treadMm.max} mm`),
    );

/** Optional, and null clears it. */
const clearable = <T extends z.ZodMiniType>(schema: T) => z.optional(z.nullable(schema));
/** Trimmed free text of at most `max` characters. */
const text = (max: number) => z.string().check(z.trim(), z.maxLength(max));
const tyreNumber = () => z.number().check(z.int(), z.gte(1), z.lte(5));

export const TYRE_POSITIONS = [...CORNERS, 'spare', 'off'] as const;

export const createTyreSetInputSchema = z.strictObject({
  id: z.optional(z.uuid()),
  label: z.string().check(z.trim(), z.minLength(1, 'Give the set a label'), z.maxLength(80)),
  size: clearable(text(40)),
  boughtOn: clearable(isoDate()),
  startTreadMm: clearable(depth('Starting')),
  notes: clearable(text(2000)),
});
export type CreateTyreSetInput = z.infer<typeof createTyreSetInputSchema>;

/** Which of the set's tyres (1–4, marked on the sidewall) sits on which corner from a date: a rotation. */
export const createMountingInputSchema = z.strictObject({
  /** Client-made id, so a rotation sent twice is recorded once. */
  id: z.optional(z.uuid()),
  mountedAt: isoDateTime(),
  positions: z
    .strictObject({ lf: tyreNumber(), rf: tyreNumber(), lr: tyreNumber(), rr: tyreNumber() })
    .check(z.refine((p) => new Set(Object.values(p)).size === 4, { message: 'Each tyre can be on one corner only' })),
});
export type CreateMountingInput = z.infer<typeof createMountingInputSchema>;

const atLeastOneCorner = <T extends object>() => z.refine<T>((c) => Object.keys(c).length > 0, { message: 'Enter at least one corner' });

export const treadCornerSchema = z.strictObject({
  innerMm: depth('Inner'),
  middleMm: depth('Middle'),
  outerMm: depth('Outer'),
});
export type TreadCorner = z.infer<typeof treadCornerSchema>;

export const createTreadReadingInputSchema = z.strictObject({
  id: z.optional(z.uuid()),
  takenAt: isoDateTime(),
  corners: perCorner(treadCornerSchema).check(atLeastOneCorner()),
  eventId: clearable(z.uuid()),
  notes: clearable(text(2000)),
});
export type CreateTreadReadingInput = z.infer<typeof createTreadReadingInputSchema>;

export const createPressureReadingInputSchema = z.strictObject({
  id: z.optional(z.uuid()),
  kind: z.enum(['cold', 'hot']),
  takenAt: isoDateTime(),
  runId: clearable(z.uuid()),
  corners: perCorner(
    z.number().check(
      z.gte(LIMITS.pressureKpa.min, `Pressure must be between ${LIMITS.pressureKpa.min} and ${LIMITS.pressureKpa.max} kPa`),
      z.lte(LIMITS.pressureKpa.max, `Pressure must be between ${LIMITS.pressureKpa.min} and ${LIMITS.pressureKpa.max} kPa`),
    ),
  ).check(atLeastOneCorner()),
});
export type CreatePressureReadingInput = z.infer<typeof createPressureReadingInputSchema>;

export interface TyreMounting {
  id: string;
  mountedAt: string;
  positions: Record<Corner, number>;
}

export interface TyreSet {
  id: string;
  carId: string;
  label: string;
  size: string | null;
  boughtOn: string | null;
  startTreadMm: number | null;
  notes: string | null;
  mountings: TyreMounting[];
  latestReading: TreadReading | null;
  /** Runs the car made while this set was the one fitted last. Absent from answers before it was added. */
  runs?: number;
  createdAt: string;
}

export interface TreadReading {
  id: string;
  tyreSetId: string;
  takenAt: string;
  eventId: string | null;
  corners: Partial<Record<Corner, TreadCorner & { tyreNumber: number | null }>>;
  /** Runs the car made on this set up to the reading. Absent from answers before it was added. */
  runsOnSet?: number;
  notes: string | null;
  createdAt: string;
}

export interface PressureReading {
  id: string;
  carId: string;
  kind: 'cold' | 'hot';
  takenAt: string;
  runId: string | null;
  corners: Partial<Record<Corner, number>>;
}
