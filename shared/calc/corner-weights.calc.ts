/**
 * Corner weights and the effect of a spring-perch change on them.
 *
 * W = LF + RF + LR + RR; front % = (LF + RF)/W; left % = (LF + LR)/W; cross % = (LF + RR)/W. The other diagonal is
 * 100 − cross (oval-track writing calls RF + LR "wedge"; Scrubline uses LF + RR and says so on screen). Aim for about
 * 50 % cross on a car that turns both ways, weighed as raced: driver in, fuel as run (common practice).
 */
import { requireFinite, requireNonNegative, requirePositive, noNegativeZero } from './input-checks.calc';
import { STANDARD_GRAVITY } from './units.calc';

export type Corner = 'lf' | 'rf' | 'lr' | 'rr';
export const CORNERS: readonly Corner[] = ['lf', 'rf', 'lr', 'rr'];

/** One value per corner: left/right front, left/right rear. */
export interface CornerValues {
  lf: number;
  rf: number;
  lr: number;
  rr: number;
}

export interface CornerWeightSummary {
  totalKg: number;
  frontPct: number;
  rearPct: number;
  leftPct: number;
  rightPct: number;
  /** (LF + RR) / total × 100. */
  crossPct: number;
}

const CORNER_NAMES: Record<Corner, string> = { lf: 'Left front', rf: 'Right front', lr: 'Left rear', rr: 'Right rear' };

/**
 * Totals and percentages from the four scale readings (kg; a scale's "lb" reading works the same, the result is a ratio).
 * @throws RangeError when a reading is negative or not a number, or the total is not above 0.
 */
export function cornerWeights(weights: CornerValues): CornerWeightSummary {
  for (const c of CORNERS) requireNonNegative(`${CORNER_NAMES[c]} weight`, weights[c]);
  const { lf, rf, lr, rr } = weights;
  const totalKg = lf + rf + lr + rr;
  if (!(totalKg > 0)) throw new RangeError('The four corner weights must add up to more than 0');
  const pct = (part: number) => (part / totalKg) * 100;
  return {
    totalKg,
    frontPct: pct(lf + rf),
    rearPct: pct(lr + rr),
    leftPct: pct(lf + lr),
    rightPct: pct(rf + rr),
    crossPct: pct(lf + rr),
  };
}

/** For each corner: the other corner on its axle, the corner diagonally opposite, the corner behind/in front of it. */
const NEIGHBOURS: Record<Corner, { partner: Corner; diagonal: Corner; sameSide: Corner; front: boolean }> = {
  lf: { partner: 'rf', diagonal: 'rr', sameSide: 'lr', front: true },
  rf: { partner: 'lf', diagonal: 'lr', sameSide: 'rr', front: true },
  lr: { partner: 'rr', diagonal: 'rf', sameSide: 'lf', front: false },
  rr: { partner: 'lr', diagonal: 'lf', sameSide: 'rf', front: false },
};

/**
 * The change in load at each corner (kg, positive = that corner carries more) when `corner`'s spring perch is raised
 * so that its wheel moves by `wheelOffsetMm` (negative = lowered). A perch moved Δs at the spring moves the wheel by
 * Δs/MR. Wheel rates are in N/mm; give both track widths or neither (equal tracks).
 *
 * Rigid-chassis statics: each axle's load changes sum to zero and the roll moments balance, so for a front corner
 *   X = δ / [(1/k_LF + 1/k_RF) + (t_f/t_r)²·(1/k_LR + 1/k_RR)],
 *   ΔLF = +X, ΔRF = −X, ΔRR = +X·t_f/t_r, ΔLR = −X·t_f/t_r,
 * and the same with front and rear exchanged for a rear corner: raising a corner adds load to it and to its
 * diagonal and takes it from the other two. Forces become kg through g_n = 9.806 65 m/s².
 *
 * An APPROXIMATION: it ignores anti-roll bars, tyre compliance and chassis flex, all of which change the answer.
 * Re-weigh the car after any change. (Derived and checked numerically; no stored published source.)
 */
export function wedgeChange(input: {
  wheelRatesNPerMm: CornerValues;
  corner: Corner;
  wheelOffsetMm: number;
  trackFrontMm?: number;
  trackRearMm?: number;
}): CornerValues {
  const k = input.wheelRatesNPerMm;
  for (const c of CORNERS) requirePositive(`${CORNER_NAMES[c]} wheel rate`, k[c]);
  const n = NEIGHBOURS[input.corner];
  if (n === undefined) throw new TypeError(`Unknown corner "${String(input.corner)}": use lf, rf, lr or rr`);
  const delta = requireFinite('Wheel offset', input.wheelOffsetMm);
  if ((input.trackFrontMm === undefined) !== (input.trackRearMm === undefined)) {
    throw new RangeError('Give both track widths, or neither for equal tracks');
  }
  const tf = input.trackFrontMm === undefined ? 1 : requirePositive('Front track', input.trackFrontMm);
  const tr = input.trackRearMm === undefined ? 1 : requirePositive('Rear track', input.trackRearMm);

  // ratio = (track of the raised corner's axle) / (track of the other axle)
  const ratio = n.front ? tf / tr : tr / tf;
  const ownAxleCompliance = 1 / k[input.corner] + 1 / k[n.partner];
  const otherAxleCompliance = 1 / k[n.diagonal] + 1 / k[n.sameSide];
  const xN = delta / (ownAxleCompliance + ratio * ratio * otherAxleCompliance);
  const xKg = xN / STANDARD_GRAVITY;

  const change = { lf: 0, rf: 0, lr: 0, rr: 0 };
  change[input.corner] = noNegativeZero(xKg);
  change[n.partner] = noNegativeZero(-xKg);
  change[n.diagonal] = noNegativeZero(xKg * ratio);
  change[n.sameSide] = noNegativeZero(-xKg * ratio);
  return change;
}
