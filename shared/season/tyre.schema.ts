import { z } from 'zod';
import { CORNERS, perCorner, type Corner } from './corners';
import { LIMITS } from './limits';

const depth = (label: string) =>
  z
    .number({ error: `${label} depth must be a number` })
    .min(LIMITS.treadMm.min, `${label} depth cannot be negative`)
    .max(LIMITS.treadMm.max, `${label} depth must be at most ${LIMITS.treadMm.max} mm`);

export const TYRE_POSITIONS = [...CORNERS, 'spare', 'off'] as const;

export const createTyreSetInputSchema = z.strictObject({
  id: z.uuid().optional(),
  label: z.string().trim().min(1, 'Give the set a label').max(80),
  size: z.string().trim().max(40).nullable().optional(),
  boughtOn: z.iso.date().nullable().optional(),
  startTreadMm: depth('Starting').nullable().optional(),
  notes: z.string().trim().max(2000).nullable().optional(),
});
export type CreateTyreSetInput = z.infer<typeof createTyreSetInputSchema>;

/** Which of the set's tyres (1–4, marked on the sidewall) sits on which corner from a date: a rotation. */
export const createMountingInputSchema = z.strictObject({
  mountedAt: z.iso.datetime({ offset: true }),
  positions: z.strictObject({
    lf: z.number().int().min(1).max(5),
    rf: z.number().int().min(1).max(5),
    lr: z.number().int().min(1).max(5),
    rr: z.number().int().min(1).max(5),
  }).refine((p) => new Set(Object.values(p)).size === 4, { message: 'Each tyre can be on one corner only' }),
});
export type CreateMountingInput = z.infer<typeof createMountingInputSchema>;

export const treadCornerSchema = z.strictObject({
  innerMm: depth('Inner'),
  middleMm: depth('Middle'),
  outerMm: depth('Outer'),
});
export type TreadCorner = z.infer<typeof treadCornerSchema>;

export const createTreadReadingInputSchema = z.strictObject({
  id: z.uuid().optional(),
  takenAt: z.iso.datetime({ offset: true }),
  corners: perCorner(treadCornerSchema).refine((c) => Object.keys(c).length > 0, { message: 'Enter at least one corner' }),
  eventId: z.uuid().nullable().optional(),
  notes: z.string().trim().max(2000).nullable().optional(),
});
export type CreateTreadReadingInput = z.infer<typeof createTreadReadingInputSchema>;

export const createPressureReadingInputSchema = z.strictObject({
  id: z.uuid().optional(),
  kind: z.enum(['cold', 'hot']),
  takenAt: z.iso.datetime({ offset: true }),
  runId: z.uuid().nullable().optional(),
  corners: perCorner(
    z.number().min(LIMITS.pressureKpa.min, `Pressure must be between ${LIMITS.pressureKpa.min} and ${LIMITS.pressureKpa.max} kPa`)
      .max(LIMITS.pressureKpa.max, `Pressure must be between ${LIMITS.pressureKpa.min} and ${LIMITS.pressureKpa.max} kPa`),
  ).refine((c) => Object.keys(c).length > 0, { message: 'Enter at least one corner' }),
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
  createdAt: string;
}

export interface TreadReading {
  id: string;
  tyreSetId: string;
  takenAt: string;
  eventId: string | null;
  corners: Partial<Record<Corner, TreadCorner & { tyreNumber: number | null }>>;
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
