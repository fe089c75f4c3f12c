import { z } from 'zod';
import { LIMITS } from './limits';
import { emailSchema } from '../auth/auth.schema';

export const DAMPER_COUNT_FROM = ['full_stiff', 'full_soft'] as const;

export const damperAdjusterSchema = z.strictObject({
  /** Number of click positions the adjuster has. */
  positions: z.number().int().min(LIMITS.damperPositions.min).max(LIMITS.damperPositions.max),
  /** Which end click 0 is counted from. */
  countFrom: z.enum(DAMPER_COUNT_FROM),
});
export type DamperAdjuster = z.infer<typeof damperAdjusterSchema>;

const motionRatio = z.number().min(LIMITS.motionRatio.min).max(LIMITS.motionRatio.max);
const text = (max: number) => z.string().trim().max(max, `Use at most ${max} characters`);

const carFields = {
  name: text(80).min(1, 'Give the car a name'),
  classCode: text(20).min(1, 'Enter the class'),
  carNumber: text(10).nullable().optional(),
  tyreSize: text(40).nullable().optional(),
  damperAdjusters: z
    .strictObject({ front: damperAdjusterSchema.nullable().optional(), rear: damperAdjusterSchema.nullable().optional() })
    .optional(),
  motionRatios: z.strictObject({ front: motionRatio.nullable().optional(), rear: motionRatio.nullable().optional() }).optional(),
  notes: text(2000).nullable().optional(),
};

export const createCarInputSchema = z.strictObject({ id: z.uuid().optional(), ...carFields });
export type CreateCarInput = z.infer<typeof createCarInputSchema>;

export const versionSchema = z.number({ error: 'Send the version this edit is based on' }).int().min(1);

export const updateCarInputSchema = createCarInputSchema.omit({ id: true }).partial().extend({ version: versionSchema });
export type UpdateCarInput = z.infer<typeof updateCarInputSchema>;

export const addCoDriverInputSchema = z.strictObject({ email: emailSchema });

export const personSchema = z.object({ id: z.string(), displayName: z.string() });
export type Person = z.infer<typeof personSchema>;

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
