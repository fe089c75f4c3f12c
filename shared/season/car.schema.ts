import * as z from '../zod';
import { LIMITS } from './limits';
import { emailSchema } from '../auth/auth.schema';

export const DAMPER_COUNT_FROM = ['full_stiff', 'full_soft'] as const;

const clickAdjusterFields = {
  /** Number of click positions the adjuster has. */
  positions: z.number().check(z.int(), z.gte(LIMITS.damperPositions.min), z.lte(LIMITS.damperPositions.max)),
  /** Which end click 0 is counted from. */
  countFrom: z.enum(DAMPER_COUNT_FROM),
};
/** One adjuster's clicks: how many, and which end click 0 is. */
export const clickAdjusterSchema = z.strictObject(clickAdjusterFields);
export type ClickAdjuster = z.infer<typeof clickAdjusterSchema>;

/** Optional, and null clears it. */
const clearable = <T extends z.ZodMiniType>(schema: T) => z.optional(z.nullable(schema));

/**
 * An axle's dampers: their adjuster (bump, or their only one), and on double-adjustable dampers a separate rebound
 * adjuster with clicks of its own. Left out of an edit, the rebound adjuster stays as it was; null clears it.
 */
export const damperAdjusterSchema = z.strictObject({ ...clickAdjusterFields, rebound: clearable(clickAdjusterSchema) });
export type DamperAdjusterInput = z.infer<typeof damperAdjusterSchema>;
/** An axle's dampers as the car holds them: `rebound` is null unless they are double-adjustable. */
export type DamperAdjuster = ClickAdjuster & { rebound: ClickAdjuster | null };

const motionRatio = z.number().check(z.gte(LIMITS.motionRatio.min), z.lte(LIMITS.motionRatio.max));
const text = (max: number) => z.string().check(z.trim(), z.maxLength(max, `Use at most ${max} characters`));

const carFields = {
  name: text(80).check(z.minLength(1, 'Give the car a name')),
  classCode: text(20).check(z.minLength(1, 'Enter the class')),
  carNumber: clearable(text(10)),
  tyreSize: clearable(text(40)),
  damperAdjusters: z.optional(z.strictObject({ front: clearable(damperAdjusterSchema), rear: clearable(damperAdjusterSchema) })),
  motionRatios: z.optional(z.strictObject({ front: clearable(motionRatio), rear: clearable(motionRatio) })),
  notes: clearable(text(2000)),
};

export const createCarInputSchema = z.strictObject({ id: z.optional(z.uuid()), ...carFields });
export type CreateCarInput = z.infer<typeof createCarInputSchema>;

export const versionSchema = z.number({ error: 'Send the version this edit is based on' }).check(z.int(), z.gte(1));

export const updateCarInputSchema = z.extend(z.partial(z.omit(createCarInputSchema, { id: true })), { version: versionSchema });
export type UpdateCarInput = z.infer<typeof updateCarInputSchema>;

export const addCoDriverInputSchema = z.strictObject({ email: emailSchema });

export interface Person {
  id: string;
  displayName: string;
}

export interface Car {
  id: string;
  owner: Person;
  coDrivers: Person[];
  name: string;
  classCode: string;
  carNumber: string | null;
  tyreSize: string | null;
  damperAdjusters: { front: DamperAdjuster | null; rear: DamperAdjuster | null };
  motionRatios: { front: number | null; rear: number | null };
  notes: string | null;
  /** Send back with edits; a stale version gets 409. */
  version: number;
  createdAt: string;
  updatedAt: string;
}
