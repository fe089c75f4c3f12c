/**
 * Checks on a coilover build sheet, per corner (common practice), from the three checks in droop.calc:
 * - compressed length against a reference (original equipment) length, within the shop's tolerance;
 * - whether the main spring stays seated at full droop, and what a helper spring must make up;
 * - bump travel left at the wheel: (stroke − droop at the damper − bump stop) / MR, droop at the damper = wheel droop × MR.
 * A check whose inputs are missing answers null. Values that cannot work together (droop and bump stop longer than the
 * stroke) are reported as problems rather than thrown.
 *
 * Cautions: compress springs only with a proper spring compressor; support the car on stands, never a jack alone;
 * check clearances with the spring removed and the suspension cycled through its travel. The damper and spring
 * makers' figures and instructions come first.
 */
import { CORNERS, cornerWeights, type Corner, type CornerWeightSummary } from './corner-weights.calc';
import { bumpTravelAtWheelMm, compressedLengthCheck, droopCheck, type CompressedLengthCheck, type DroopCheck } from './droop.calc';
import { STANDARD_GRAVITY } from './units.calc';

/** What the checks read from one corner of the sheet (mm, N/mm, kg); null or absent = not measured yet. */
export interface BuildSheetCheckInput {
  damperCompressedLengthMm?: number | null;
  referenceCompressedLengthMm?: number | null;
  strokeMm?: number | null;
  mainSpringRateNPerMm?: number | null;
  wheelLoadKg?: number | null;
  wheelDroopMm?: number | null;
  bumpStopMm?: number | null;
}

export interface BuildSheetCornerResult {
  compressedLength: CompressedLengthCheck | null;
  droop: DroopCheck | null;
  bumpTravelAtWheelMm: number | null;
  problems: string[];
}

const known = (v: number | null | undefined): v is number => typeof v === 'number' && Number.isFinite(v);

function attempt<T>(problems: string[], run: () => T): T | null {
  try {
    return run();
  } catch (err) {
    if (err instanceof RangeError || err instanceof TypeError) {
      problems.push(err.message);
      return null;
    }
    throw err;
  }
}

/** The three checks for one corner, given that corner's motion ratio (spring/damper travel per wheel travel). */
export function buildSheetCornerChecks(c: BuildSheetCheckInput, motionRatio: number | null | undefined, toleranceMm: number): BuildSheetCornerResult {
  const problems: string[] = [];
  const compressedLength =
    known(c.damperCompressedLengthMm) && known(c.referenceCompressedLengthMm)
      ? attempt(problems, () =>
          compressedLengthCheck({ compressedLengthMm: c.damperCompressedLengthMm!, referenceLengthMm: c.referenceCompressedLengthMm!, toleranceMm }),
        )
      : null;
  const droop =
    known(c.wheelLoadKg) && known(motionRatio) && known(c.mainSpringRateNPerMm) && known(c.wheelDroopMm)
      ? attempt(problems, () =>
          droopCheck({
            wheelLoadN: c.wheelLoadKg! * STANDARD_GRAVITY,
            motionRatio,
            springRateNPerMm: c.mainSpringRateNPerMm!,
            wheelDroopMm: c.wheelDroopMm!,
          }),
        )
      : null;
  const bump =
    known(c.strokeMm) && known(c.wheelDroopMm) && known(c.bumpStopMm) && known(motionRatio)
      ? attempt(problems, () =>
          bumpTravelAtWheelMm({ strokeMm: c.strokeMm!, droopAtDamperMm: c.wheelDroopMm! * motionRatio, bumpStopMm: c.bumpStopMm!, motionRatio }),
        )
      : null;
  return { compressedLength, droop, bumpTravelAtWheelMm: bump, problems };
}

/**
 * Every corner's checks. Front corners use `motionRatio.front`, rear corners `motionRatio.rear` (from the car);
 * `toleranceMm` is how much shorter than the reference a compressed length may be (the shop's setting).
 */
export function buildSheetChecks(input: {
  corners: Partial<Record<Corner, BuildSheetCheckInput | null>>;
  motionRatio: { front: number | null | undefined; rear: number | null | undefined };
  toleranceMm: number;
}): Record<Corner, BuildSheetCornerResult | null> {
  const out = {} as Record<Corner, BuildSheetCornerResult | null>;
  for (const corner of CORNERS) {
    const c = input.corners[corner];
    const mr = corner === 'lf' || corner === 'rf' ? input.motionRatio.front : input.motionRatio.rear;
    out[corner] = c ? buildSheetCornerChecks(c, mr, input.toleranceMm) : null;
  }
  return out;
}

/** Cross, front and left % (with the total) once all four corner weights are known; otherwise null. */
export function balanceIfComplete(weights: Partial<Record<Corner, number | null | undefined>>): CornerWeightSummary | null {
  const { lf, rf, lr, rr } = weights;
  if (!known(lf) || !known(rf) || !known(lr) || !known(rr)) return null;
  try {
    return cornerWeights({ lf, rf, lr, rr });
  } catch (err) {
    if (err instanceof RangeError) return null;
    throw err;
  }
}
