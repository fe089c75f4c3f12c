import { expect } from 'vitest';

/**
 * |actual − expected| ≤ half a unit in the last decimal of `expected` as written: a value quoted to a fixed number of
 * decimals is good to ±0.5 in the last digit shown (common practice).
 */
export function expectToDigits(actual: number, expected: string): void {
  const decimals = expected.split('.')[1]?.length ?? 0;
  expect(Math.abs(actual - Number(expected))).toBeLessThanOrEqual(0.5 * 10 ** -decimals + 1e-12);
}

/** Relative agreement with an absolute floor for values near zero. */
export function expectClose(actual: number, expected: number, rel: number, absFloor = 1e-12): void {
  expect(Math.abs(actual - expected)).toBeLessThanOrEqual(rel * Math.max(Math.abs(actual), Math.abs(expected)) + absFloor);
}
