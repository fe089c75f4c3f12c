import * as z from '../zod';
import { isoDateTime } from '../api/dates.schema';
import { CORNERS, perCorner, type Corner } from './corners';
import { LIMITS } from './limits';
import { versionSchema } from './car.schema';

const range = (name: string, unit: string, min: number, max: number) =>
  z
    .number({ error: `${name} must be a number` })
    .check(z.gte(min, `${name} must be between ${min} and ${max} ${unit}`), z.lte(max, `${name} must be between ${min} and ${max} ${unit}`));

const clicks = z
  .number({ error: 'Clicks must be a whole number' })
  .check(
    z.int('Clicks must be a whole number'),
    z.gte(LIMITS.damperClicks.min, 'Clicks cannot be negative'),
    z.lte(LIMITS.damperClicks.max, `Clicks must be at most ${LIMITS.damperClicks.max}`),
  );

/** Optional, and null clears it. */
const clearable = <T extends z.ZodMiniType>(schema: T) => z.optional(z.nullable(schema));
/** Trimmed free text of at most `max` characters. */
const text = (max: number, message?: string) => z.string().check(z.trim(), z.maxLength(max, message));

export const pressureKpaSchema = range('Pressure', 'kPa', LIMITS.pressureKpa.min, LIMITS.pressureKpa.max);

/** One corner's setup, SI units. Every field optional: record what you know. */
export const setupCornerSchema = z.strictObject({
  camberDeg: clearable(range('Camber', '°', LIMITS.camberDeg.min, LIMITS.camberDeg.max)),
  /** Per wheel, toe-in positive. */
  toeMm: clearable(range('Toe', 'mm', LIMITS.toeMm.min, LIMITS.toeMm.max)),
  casterDeg: clearable(range('Caster', '°', LIMITS.casterDeg.min, LIMITS.casterDeg.max)),
  springRateNPerMm: clearable(range('Spring rate', 'N/mm', LIMITS.springRateNPerMm.min, LIMITS.springRateNPerMm.max)),
  rideHeightMm: clearable(range('Ride height', 'mm', LIMITS.rideHeightMm.min, LIMITS.rideHeightMm.max)),
  /** Bump (or single) adjuster clicks, counted from the end the car's adjuster says. */
  damperClicks: clearable(clicks),
  /** Double-adjustable dampers only. */
  damperReboundClicks: clearable(clicks),
  coldPressureKpa: clearable(pressureKpaSchema),
  cornerWeightKg: clearable(range('Corner weight', 'kg', LIMITS.cornerWeightKg.min, LIMITS.cornerWeightKg.max)),
});
export type SetupCorner = z.infer<typeof setupCornerSchema>;
export const SETUP_CORNER_FIELDS = [
  'camberDeg', 'toeMm', 'casterDeg', 'springRateNPerMm', 'rideHeightMm',
  'damperClicks', 'damperReboundClicks', 'coldPressureKpa', 'cornerWeightKg',
] as const satisfies readonly (keyof SetupCorner)[];
export type SetupCornerField = (typeof SETUP_CORNER_FIELDS)[number];

/** Anti-roll bar setting: free text or a hole number. */
export const setupAxleSchema = z.strictObject({
  antiRollBar: clearable(text(40, 'Use at most 40 characters')),
});


export const createSetupInputSchema = z.strictObject({
  /** Client-made id, so an offline replay never makes a second snapshot. */
  id: z.optional(z.uuid()),
  label: z.string().check(z.trim(), z.minLength(1, 'Give the setup a label'), z.maxLength(80, 'Use at most 80 characters')),
  effectiveFrom: isoDateTime(),
  corners: z._default(perCorner(setupCornerSchema), {}),
  axles: z._default(z.strictObject({ front: z.optional(setupAxleSchema), rear: z.optional(setupAxleSchema) }), {}),
  derivedFromId: clearable(z.uuid()),
  notes: clearable(text(2000)),
});
export type CreateSetupInput = z.infer<typeof createSetupInputSchema>;

export const updateSetupInputSchema = z.extend(z.partial(z.omit(createSetupInputSchema, { id: true })), { version: versionSchema });
export type UpdateSetupInput = z.infer<typeof updateSetupInputSchema>;

/** A small change applied to the active setup, e.g. rear damperClicks +2, or cold pressure −7 kPa all round. */
export const QUICK_CHANGE_FIELDS = ['damperClicks', 'damperReboundClicks', 'coldPressureKpa', 'camberDeg', 'toeMm', 'rideHeightMm'] as const;
export const quickChangeInputSchema = z.strictObject({
  id: z.optional(z.uuid()),
  label: z.optional(z.string().check(z.trim(), z.minLength(1), z.maxLength(80))),
  effectiveFrom: z.optional(isoDateTime()),
  changes: z
    .array(
      z
        .strictObject({
          field: z.enum(QUICK_CHANGE_FIELDS),
          corners: z.array(z.enum(CORNERS)).check(z.minLength(1, 'Pick at least one corner')),
          delta: z.optional(z.number()),
          value: z.optional(z.number()),
        })
        .check(
          z.refine((c) => (c.delta === undefined) !== (c.value === undefined), {
            message: 'Give either a change (delta) or a new value, not both',
            path: ['delta'],
          }),
        ),
    )
    .check(z.minLength(1, 'Make at least one change'), z.maxLength(20)),
  notes: clearable(text(2000)),
});
export type QuickChangeInput = z.infer<typeof quickChangeInputSchema>;

export interface Setup {
  id: string;
  carId: string;
  label: string;
  effectiveFrom: string;
  createdBy: { id: string; displayName: string };
  derivedFromId: string | null;
  /** Set when the snapshot was made by accepting a shop's suggestion. */
  suggestion: { id: string; title: string; shopName: string } | null;
  /** Set when the snapshot was written by closing a shop's work order (the car as handed back). */
  workOrder: { id: string; shopName: string; visitDate: string } | null;
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
