import { describe, expect, it } from 'vitest';
import { axisTick, PARAM_INFO } from '@/features/analysis/utils/analysis-format';

describe('axisTick', () => {
  it.each([
    [-2.5, '\u22122.5'],
    [-2, '\u22122'],
    [3, '3'],
    [0.125, '0.125'],
    [0.12345, '0.123'],
    [1.1000000000000001, '1.1'],
    [-0.0001, '0'],
  ])('when a tick falls at %s, then it reads %j (a true minus, U+2212; at most three decimals, toFixed rounding per ECMA-262)', (v, text) => {
    expect(axisTick(v)).toBe(text);
  });
});

describe('PARAM_INFO', () => {
  it.each([
    ['camber', 'camber'],
    ['springRate', 'spring rate'],
    ['damperClicks', 'damper clicks'],
    ['coldPressure', 'cold pressure'],
    ['rideHeight', 'ride height'],
  ] as const)('when %s is named in a sentence, then it reads %j', (param, words) => {
    expect(PARAM_INFO[param].inSentence).toBe(words);
  });
});
