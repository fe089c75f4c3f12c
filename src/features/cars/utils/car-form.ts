import * as z from '@shared/zod';
import { AXLES, type Axle } from '@shared/season/corners';
import { createCarInputSchema, DAMPER_COUNT_FROM, type Car, type ClickAdjuster, type CreateCarInput, type DamperAdjusterInput } from '@shared/season/car.schema';
import { LIMITS } from '@shared/season/limits';
import { parseDecimal, typeANumber } from '@/lib/numbers';
import { addIssue } from '@/lib/form-schema';

export type DamperCountFrom = (typeof DAMPER_COUNT_FROM)[number];

/** One adjuster as typed: its number of clicks, and which end click 0 is. */
interface AdjusterTexts {
  positions: string;
  countFrom: DamperCountFrom;
}

/** What the new-car form holds, as typed. */
export interface CarFormValues {
  name: string;
  classCode: string;
  carNumber: string;
  tyreSize: string;
  /** Each axle's adjuster, and its separate rebound adjuster when `rebound.on` (double-adjustable dampers). */
  damperAdjusters: Record<Axle, AdjusterTexts & { rebound: AdjusterTexts & { on: boolean } }>;
  motionRatios: Record<Axle, string>;
  notes: string;
}

export const COUNT_FROM_WORDS: Record<DamperCountFrom, string> = { full_stiff: 'Full stiff', full_soft: 'Full soft' };

const emptyAdjuster = () => ({ positions: '', countFrom: 'full_stiff' as const, rebound: { on: false, positions: '', countFrom: 'full_stiff' as const } });

export function emptyCarForm(): CarFormValues {
  return {
    name: '',
    classCode: '',
    carNumber: '',
    tyreSize: '',
    // Counting clicks out from full stiff (closed) is the usual way racing dampers are set; the driver picks.
    damperAdjusters: { front: emptyAdjuster(), rear: emptyAdjuster() },
    motionRatios: { front: '', rear: '' },
    notes: '',
  };
}

/** A saved car as the form shows it, to be edited: an axle with no adjuster has its clicks left empty. */
export function carToForm(car: Car): CarFormValues {
  const adjuster = (axle: Axle) => {
    const a = car.damperAdjusters[axle];
    const empty = emptyAdjuster();
    if (!a) return empty;
    const rebound = a.rebound ? { on: true, positions: String(a.rebound.positions), countFrom: a.rebound.countFrom } : empty.rebound;
    return { positions: String(a.positions), countFrom: a.countFrom, rebound };
  };
  const ratio = (axle: Axle) => (car.motionRatios[axle] === null ? '' : String(car.motionRatios[axle]));
  return {
    name: car.name,
    classCode: car.classCode,
    carNumber: car.carNumber ?? '',
    tyreSize: car.tyreSize ?? '',
    damperAdjusters: { front: adjuster('front'), rear: adjuster('rear') },
    motionRatios: { front: ratio('front'), rear: ratio('rear') },
    notes: car.notes ?? '',
  };
}

const optionalText = (s: string) => (s.trim() ? s.trim() : null);
const text = z.string();
const countFrom = z.enum(DAMPER_COUNT_FROM);
const adjusterTexts = z.object({ positions: text, countFrom, rebound: z.object({ on: z.boolean(), positions: text, countFrom }) });

/**
 * The form's values → the body of POST /api/cars, checked with the shared schema. An axle whose
 * click count is left empty has no adjuster; an empty motion ratio is unknown.
 */
export const carFormSchema = z.pipe(
  z.object({
    name: text,
    classCode: text,
    carNumber: text,
    tyreSize: text,
    damperAdjusters: z.object({ front: adjusterTexts, rear: adjusterTexts }),
    motionRatios: z.object({ front: text, rear: text }),
    notes: text,
  }),
  z.transform((v, ctx): CreateCarInput => {
    const local = new Set<string>();
    const problem = (path: string[], message: string) => {
      local.add(path.join('.'));
      addIssue(ctx, path, message);
    };
    /** An adjuster's clicks as typed, checked; null when left empty. */
    const clicks = (typed: AdjusterTexts, path: string[]): ClickAdjuster | null => {
      const positions = typed.positions.trim();
      if (!positions) return null;
      const { min, max } = LIMITS.damperPositions;
      // "−3" is a whole number too: a count of clicks below one is said as the range.
      if (/^[-−]\d+$/.test(positions)) problem(path, `Between ${min} and ${max} clicks`);
      else if (!/^\d+$/.test(positions)) problem(path, 'Type a whole number of clicks, e.g. 24');
      else if (Number(positions) < min || Number(positions) > max) problem(path, `Between ${min} and ${max} clicks`);
      return { positions: Number(positions), countFrom: typed.countFrom };
    };
    const adjuster = (axle: Axle): DamperAdjusterInput | null => {
      const typed = v.damperAdjusters[axle];
      const main = clicks(typed, ['damperAdjusters', axle, 'positions']);
      const reboundPath = ['damperAdjusters', axle, 'rebound', 'positions'];
      const rebound = typed.rebound.on ? clicks(typed.rebound, reboundPath) : null;
      if (typed.rebound.on && !rebound) problem(reboundPath, 'Give the number of rebound clicks, or untick the rebound adjuster');
      if (!main) {
        if (rebound) problem(['damperAdjusters', axle, 'positions'], 'Give these clicks too, or untick the rebound adjuster');
        return null;
      }
      // Null clears a rebound adjuster stored before.
      return { ...main, rebound };
    };
    const motionRatio = (axle: Axle): number | null => {
      const parsed = parseDecimal(v.motionRatios[axle]);
      if (parsed.kind === 'empty') return null;
      const path = ['motionRatios', axle];
      const { min, max } = LIMITS.motionRatio;
      if (parsed.kind === 'invalid') problem(path, typeANumber('0.75'));
      else if (parsed.value < min || parsed.value > max) problem(path, `Between ${min} and ${max}`);
      return parsed.kind === 'number' ? parsed.value : null;
    };
    const body = {
      name: v.name,
      classCode: v.classCode,
      carNumber: optionalText(v.carNumber),
      tyreSize: optionalText(v.tyreSize),
      damperAdjusters: Object.fromEntries(AXLES.map((a) => [a, adjuster(a)])) as Record<Axle, DamperAdjusterInput | null>,
      motionRatios: Object.fromEntries(AXLES.map((a) => [a, motionRatio(a)])) as Record<Axle, number | null>,
      notes: optionalText(v.notes),
    };
    const checked = createCarInputSchema.safeParse(body);
    if (!checked.success) {
      for (const issue of checked.error.issues) {
        const path = issue.path.map(String);
        if (!local.has(path.join('.'))) addIssue(ctx, path, issue.message);
      }
      return z.NEVER;
    }
    if (local.size > 0) return z.NEVER;
    return checked.data;
  }),
);
