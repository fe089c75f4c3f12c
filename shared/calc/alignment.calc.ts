/**
 * Toe and camber from shop measurements, per wheel.
 *
 * Toe: θ = atan(L/D), L = that wheel's front-minus-rear difference and D the diameter it was measured across (say
 * which: rim or tyre). Toe-in positive; total toe = θ_left + θ_right. Camber: negative when the top of the wheel
 * leans inboard, camber = −atan(Δx/h) with Δx the inboard lean of the top over a height h.
 * Do not use "mm per degree = πD/360": it mixes radius and diameter and is out by a factor of two.
 * Sources: SAE J670 Vehicle Dynamics Terminology (sign conventions, from memory); alignment shop guides.
 */
import { requireFinite, requirePositive, noNegativeZero } from './input-checks.calc';

const DEG_PER_RAD = 180 / Math.PI;

/** One wheel's toe angle (degrees, toe-in positive) from its front-minus-rear difference over a diameter (mm). */
export function toeAngleDeg(input: { toeMm: number; diameterMm: number }): number {
  const toe = requireFinite('Toe', input.toeMm);
  const d = requirePositive('Diameter', input.diameterMm);
  return noNegativeZero(Math.atan(toe / d) * DEG_PER_RAD);
}

/** One wheel's front-minus-rear difference (mm, toe-in positive) across a diameter (mm) for a toe angle (degrees). */
export function toeLengthMm(input: { angleDeg: number; diameterMm: number }): number {
  const angle = requireFinite('Toe angle', input.angleDeg);
  if (!(Math.abs(angle) < 90)) throw new RangeError('Toe angle must be between −90° and 90°');
  const d = requirePositive('Diameter', input.diameterMm);
  return noNegativeZero(d * Math.tan(angle / DEG_PER_RAD));
}

/** Camber (degrees, negative = top inboard) from how far the top sits inboard of the bottom over a height (mm). */
export function camberDeg(input: { topInboardMm: number; heightMm: number }): number {
  const dx = requireFinite('Top inboard', input.topInboardMm);
  const h = requirePositive('Height', input.heightMm);
  return noNegativeZero(-Math.atan(dx / h) * DEG_PER_RAD);
}
