import { describe, expect, it } from 'vitest';
import { formatP } from '../../../shared/calc/p-value';

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
