import * as z from '@shared/zod';
import { CORNERS, type Corner } from '@shared/season/corners';
import { createMountingInputSchema, type CreateMountingInput } from '@shared/season/tyre.schema';
import { fromLocalInputValue } from '@/lib/dates';
import { addIssue } from '@/lib/form-schema';

export type RotationPreset = 'frontToRear' | 'crossRearToFront' | 'sideToSide';

/** For each corner, the corner whose tyre moves onto it. */
const MOVES: Record<RotationPreset, Record<Corner, Corner>> = {
  // Each tyre stays on its side: fronts go back, rears come forward.
  frontToRear: { lf: 'lr', rf: 'rr', lr: 'lf', rr: 'rf' },
  // Rears cross to the opposite front; fronts go straight back.
  crossRearToFront: { lf: 'rr', rf: 'lr', lr: 'lf', rr: 'rf' },
  // Left and right swap on each axle.
  sideToSide: { lf: 'rf', rf: 'lf', lr: 'rr', rr: 'lr' },
};

export const PRESET_WORDS: Record<RotationPreset, string> = {
  frontToRear: 'Front to rear, same side',
  crossRearToFront: 'Cross rear to front',
  sideToSide: 'Side to side',
};

export const PRESETS = Object.keys(MOVES) as RotationPreset[];

/** Where each tyre goes under a preset, starting from where they are now. */
export function applyPreset(preset: RotationPreset, now: Record<Corner, number>): Record<Corner, number> {
  return Object.fromEntries(CORNERS.map((c) => [c, now[MOVES[preset][c]]])) as Record<Corner, number>;
}

/** Tyre numbers a set may use: 1–4 on the car, 5 for a spare. */
export const TYRE_NUMBERS = [1, 2, 3, 4, 5] as const;

export interface RotationFormValues {
  /** A datetime-local value. */
  mountedAt: string;
  positions: Record<Corner, string>;
}

const CORNER_WORDS: Record<Corner, string> = { lf: 'left front', rf: 'right front', lr: 'left rear', rr: 'right rear' };

/**
 * The form's values → the body of POST /api/tyre-sets/:id/mountings, checked with the shared schema.
 * A tyre picked for two corners is marked on both; a "rotation" that moves nothing is refused.
 */
export function rotationFormSchema(now: Record<Corner, number>) {
  return z.pipe(
    z.object({
      mountedAt: z.string(),
      positions: z.object({ lf: z.string(), rf: z.string(), lr: z.string(), rr: z.string() }),
    }),
    z.transform((v, ctx): CreateMountingInput => {
      let failed = false;
      const mountedAt = fromLocalInputValue(v.mountedAt);
      if (!mountedAt) {
        failed = true;
        addIssue(ctx, ['mountedAt'], 'Pick when the tyres were moved');
      }
      const positions = Object.fromEntries(CORNERS.map((c) => [c, Number(v.positions[c])])) as Record<Corner, number>;
      for (const corner of CORNERS) {
        const others = CORNERS.filter((c) => c !== corner && positions[c] === positions[corner]);
        if (others.length) {
          failed = true;
          addIssue(ctx, ['positions', corner], `Tyre ${positions[corner]} is also on the ${others.map((c) => CORNER_WORDS[c]).join(' and ')}`);
        }
      }
      if (!failed && CORNERS.every((c) => positions[c] === now[c])) {
        addIssue(ctx, ['positions'], 'That is how the tyres sit now: pick where each one goes.');
        return z.NEVER;
      }
      const checked = createMountingInputSchema.safeParse({ mountedAt, positions });
      if (!checked.success) {
        if (!failed) for (const issue of checked.error.issues) addIssue(ctx, issue.path.map(String), issue.message);
        return z.NEVER;
      }
      return failed ? z.NEVER : checked.data;
    }),
  );
}
