import { describe, expect, it } from 'vitest';
import { formatFixed, formatP } from '../../../shared/calc/display';

describe('formatP', () => {
  it.each([
    // Two significant figures, as Number.prototype.toPrecision(2) rounds them (ECMA-262).
    [0.00549, 'p = 0.0055'],
    [0.0764, 'p = 0.076'],
    [0.05, 'p = 0.05'],
    [0.001, 'p = 0.001'],
    [0.999, 'p = 1'],
    [1, 'p = 1'],
  ])('when p is %s, then it is written %j', (p, text) => {
    expect(formatP(p)).toBe(text);
  });

  it('when p is below 0.001, then only that is said', () => {
    expect(formatP(0.000_99)).toBe('p < 0.001');
    expect(formatP(0)).toBe('p < 0.001');
  });
});

describe('formatFixed', () => {
  it.each([
    [-1.25, 2, '\u22121.25'],
    [1.25, 2, '1.25'],
    [-0.04, 1, '0.0'],
    [-0.06, 1, '\u22120.1'],
    [0, 3, '0.000'],
  ])('when %s is written to %s decimals, then %j (toFixed rounding, ECMA-262; a true minus, U+2212)', (value, decimals, text) => {
    expect(formatFixed(value, decimals)).toBe(text);
  });
});

