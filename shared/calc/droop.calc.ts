/**
 * Springs at full droop, bump travel, damper compressed length (common practice).
 *
 * Force at the spring F_s = F_wheel/MR; static compression x_s = F_s/k_s; droop at the spring d_s = d_wheel·MR.
 * The main spring stays seated at full droop iff x_s ≥ d_s; the shortfall d_s − x_s needs a helper spring with that
 * much travel, or limited droop. Bump at the wheel = (stroke − droop at the damper − bump-stop length)/MR.
 * Check clearances (tyre to body, bars, steering links, chassis to ground) with the spring removed and the
 * suspension compressed — with the car on stands, never on a jack alone.
 */
import { requireNonNegative, requirePositive } from './input-checks.calc';

export interface DroopCheck {
  /** How far the spring is compressed at ride height, mm. */
  staticCompressionMm: number;
  /** How far the spring extends from ride height to full droop, mm. */
  droopAtSpringMm: number;
  /** Whether the spring stays in contact with both perches at full droop. */
  seated: boolean;
  /** Extra extension the spring would need (0 when seated), mm: helper-spring travel or droop to limit. */
  shortfallMm: number;
}

/**
 * Whether the main spring stays seated at full droop, from the static load at the wheel (N), the motion ratio
 * (spring travel / wheel travel), the spring rate (N/mm) and the wheel's droop travel from ride height (mm).
 */
export function droopCheck(input: { wheelLoadN: number; motionRatio: number; springRateNPerMm: number; wheelDroopMm: number }): DroopCheck {
  const load = requireNonNegative('Wheel load', input.wheelLoadN);
  const mr = requirePositive('Motion ratio', input.motionRatio);
  const k = requirePositive('Spring rate', input.springRateNPerMm);
  const droop = requireNonNegative('Wheel droop', input.wheelDroopMm);
  const staticCompressionMm = load / mr / k;
  const droopAtSpringMm = droop * mr;
  return {
    staticCompressionMm,
    droopAtSpringMm,
    seated: staticCompressionMm >= droopAtSpringMm,
    shortfallMm: Math.max(0, droopAtSpringMm - staticCompressionMm),
  };
}

/**
 * Bump travel left at the wheel (mm): (damper stroke − droop at the damper − bump-stop length) / the damper's
 * motion ratio. The bump stop's length is its free length unless told otherwise.
 * @throws RangeError when droop and bump stop take more than the stroke.
 */
export function bumpTravelAtWheelMm(input: { strokeMm: number; droopAtDamperMm: number; bumpStopMm?: number; motionRatio: number }): number {
  const stroke = requirePositive('Stroke', input.strokeMm);
  const droop = requireNonNegative('Droop at the damper', input.droopAtDamperMm);
  const bumpStop = requireNonNegative('Bump stop', input.bumpStopMm ?? 0);
  const mr = requirePositive('Motion ratio', input.motionRatio);
  const atDamper = stroke - droop - bumpStop;
  if (atDamper < 0) throw new RangeError('Droop and bump stop add up to more than the damper stroke');
  return atDamper / mr;
}

export interface CompressedLengthCheck {
  /** Compressed length minus the reference (original equipment) length, mm; negative = shorter. */
  differenceMm: number;
  withinTolerance: boolean;
}

/** Rounding slack for lengths typed in another unit (mm). */
const SLACK_MM = 1e-9;

/**
 * Compares an adjustable damper's compressed length with the original equipment's. Common practice: it should not be
 * longer (the damper would bottom before the original stop) and at most a little shorter — around 13–16 mm — or
 * the wheel can travel into the body. `toleranceMm` (default 13) is how much shorter is accepted.
 */
export function compressedLengthCheck(input: { compressedLengthMm: number; referenceLengthMm: number; toleranceMm?: number }): CompressedLengthCheck {
  const compressed = requirePositive('Compressed length', input.compressedLengthMm);
  const reference = requirePositive('Reference length', input.referenceLengthMm);
  const tolerance = requireNonNegative('Tolerance', input.toleranceMm ?? 13);
  const differenceMm = compressed - reference;
  return { differenceMm, withinTolerance: differenceMm <= SLACK_MM && differenceMm >= -tolerance - SLACK_MM };
}
