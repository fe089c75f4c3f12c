import { z } from 'zod';
import { CORNERS, perCorner, type Corner } from './corners';
import { LIMITS } from './limits';
import { versionSchema } from './car.schema';

const range = (name: string, unit: string, min: number, max: number) =>
  z
    .number({ error: `${name} must be a number` })
    .min(min, `${name} must be between ${min} and ${max} ${unit}`)
    .max(max, `${name} must be between ${min} and ${max} ${unit}`);

const clicks = z
  .number({ error: 'Clicks must be a whole number' })
  .int('Clicks must be a whole number')
  .min(LIMITS.damperClicks.min, 'Clicks cannot be negative')
  .max(LIMITS.damperClicks.max, `Clicks must be at most ${LIMITS.damperClicks.max}`);

export const pressureKpaSchema = range('Pressure', 'kPa', LIMITS.pressureKpa.min, LIMITS.pressureKpa.max);

/** One corner's setup, SI units. Every field optional: record what you know. */
export const setupCornerSchema = z.strictObject({
  camberDeg: range('Camber', '°', LIMITS.camberDeg.min, LIMITS.camberDeg.max).nullable().optional(),
  /** Per wheel, toe-in positive. */
  toeMm: range('Toe', 'mm', LIMITS.toeMm.min, LIMITS.toeMm.max).nullable().optional(),
  casterDeg: range('Caster', '°', LIMITS.casterDeg.min, LIMITS.casterDeg.max).nullable().optional(),
  springRateNPerMm: range('Spring rate', 'N/mm', LIMITS.springRateNPerMm.min, LIMITS.springRateNPerMm.max).nullable().optional(),
  rideHeightMm: range('Ride height', 'mm', LIMITS.rideHeightMm.min, LIMITS.rideHeightMm.max).nullable().optional(),
  /** Bump (or single) adjuster clicks, counted from the end the car's adjuster says. */
  damperClicks: clicks.nullable().optional(),
  /** Double-adjustable dampers only. */
  damperReboundClicks: clicks.nullable().optional(),
  coldPressureKpa: pressureKpaSchema.nullable().optional(),
  cornerWeightKg: range('Corner weight', 'kg', LIMITS.cornerWeightKg.min, LIMITS.cornerWeightKg.max).nullable().optional(),
});
export type SetupCorner = z.infer<typeof setupCornerSchema>;
export const SETUP_CORNER_FIELDS = [
  'camberDeg', 'toeMm', 'casterDeg', 'springRateNPerMm', 'rideHeightMm',
  'damperClicks', 'damperReboundClicks', 'coldPressureKpa', 'cornerWeightKg',
] as const satisfies readonly (keyof SetupCorner)[];
export type SetupCornerField = (typeof SETUP_CORNER_FIELDS)[number];

/** Anti-roll bar setting: free text or a hole number. */
export const setupAxleSchema = z.strictObject({
  antiRollBar: z.string().trim().max(40, 'Use at most 40 characters').nullable().optional(),
});

const isoDateTime = z.iso.datetime({ offset: true, error: 'Use a date and time such as 2026-06-12T09:30:00Z' });

export const createSetupInputSchema = z.strictObject({
  /** Client-made id, so an offline replay never makes a second snapshot. */
  id: z.uuid().optional(),
  label: z.string().trim().min(1, 'Give the setup a label').max(80, 'Use at most 80 characters'),
  effectiveFrom: isoDateTime,
  corners: perCorner(setupCornerSchema).default({}),
  axles: z.strictObject({ front: setupAxleSchema.optional(), rear: setupAxleSchema.optional() }).default({}),
  derivedFromId: z.uuid().nullable().optional(),
  notes: z.string().trim().max(2000).nullable().optional(),
});
export type CreateSetupInput = z.infer<typeof createSetupInputSchema>;

export const updateSetupInputSchema = createSetupInputSchema.omit({ id: true }).partial().extend({ version: versionSchema });
export type UpdateSetupInput = z.infer<typeof updateSetupInputSchema>;

/** A small change applied to the active setup, e.g. rear damperClicks +2, or cold pressure −7 kPa all round. */
export const QUICK_CHANGE_FIELDS = ['damperClicks', 'damperReboundClicks', 'coldPressureKpa', 'camberDeg', 'toeMm', 'rideHeightMm'] as const;
export const quickChangeInputSchema = z.strictObject({
  id: z.uuid().optional(),
  label: z.string().trim().min(1).max(80).optional(),
  effectiveFrom: isoDateTime.optional(),
  changes: z
    .array(
      z
        .strictObject({
          field: z.enum(QUICK_CHANGE_FIELDS),
          corners: z.array(z.enum(CORNERS)).min(1, 'Pick at least one corner'),
          delta: z.number().optional(),
          value: z.number().optional(),
        })
        .refine((c) => (c.delta === undefined) !== (c.value === undefined), {
          message: 'Give either a change (delta) or a new value, not both',
          path: ['delta'],
        }),
    )
    .min(1, 'Make at least one change')
    .max(20),
  notes: z.string().trim().max(2000).nullable().optional(),
});
export type QuickChangeInput = z.infer<typeof quickChangeInputSchema>;

export interface Setup {
  id: string;
  carId: string;
  label: string;
  effectiveFrom: string;
  createdBy: { id: string; displayName: string };
  derivedFromId: string | null;
  notes: string | null;
  corners: Record<Corner, SetupCorner>;
  axles: { front: { antiRollBar: string | null }; rear: { antiRollBar: string | null } };
  version: number;
  createdAt: string;
  updatedAt: string;
}

export interface SetupChange {
  /** `corners.lf.camberDeg` or `axles.front.antiRollBar` */
  path: string;
  corner: Corner | null;
  axle: 'front' | 'rear' | null;
  field: string;
  from: number | string | null;
  to: number | string | null;
  /** to − from, when both are numbers. */
  delta: number | null;
}

export interface SetupDiff {
  fromId: string;
  toId: string;
  changes: SetupChange[];
}
