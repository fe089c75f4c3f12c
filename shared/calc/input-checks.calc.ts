/**
 * Input checks shared by the calculations in this folder (not part of the public face in index.ts).
 * Each throws a RangeError whose message names the input in plain words, e.g. "Motion ratio must be above 0".
 */

/** The value is a finite number. */
export function requireFinite(label: string, value: number): number {
  if (typeof value !== 'number' || !Number.isFinite(value)) throw new RangeError(`${label} must be a number`);
  return value;
}

/** The value is a finite number above 0. */
export function requirePositive(label: string, value: number): number {
  requireFinite(label, value);
  if (!(value > 0)) throw new RangeError(`${label} must be above 0`);
  return value;
}

/** The value is a finite number of 0 or more. */
export function requireNonNegative(label: string, value: number): number {
  requireFinite(label, value);
  if (value < 0) throw new RangeError(`${label} must be 0 or more`);
  return value;
}

/** Turns −0 into 0, so results never show a minus sign on nothing. */
export const noNegativeZero = (value: number): number => value + 0;
