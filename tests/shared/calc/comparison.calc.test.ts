import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { tTestTwoSample } from 'simple-statistics';
import { mean as mathMean, std as mathStd } from 'mathjs';
import {
  compareSamples, regularizedIncompleteBeta, runOrderWithinDays, studentTTwoSidedP, summariseByValue, verdict, type SampleComparison,
} from '../../../shared/calc/comparison.calc';
import { expectClose } from './expect-digits';

// Upper critical values of Student's t: NIST/SEMATECH e-Handbook of Statistical Methods §1.3.6.7.2
// (itl.nist.gov/div898/handbook/eda/section3/eda3672.htm). P(T > t) = α, so the two-sided p at t is 2α.
const NIST_T = 'NIST/SEMATECH e-Handbook §1.3.6.7.2';
const ALPHAS = [0.1, 0.05, 0.025, 0.01, 0.005, 0.001] as const;
const NIST_TABLE: [number, number[]][] = [
  [1, [3.078, 6.314, 12.706, 31.821, 63.657]], // α = 0.001 printed 318.313; the exact value is tan(0.499π) = 318.309
  [2, [1.886, 2.92, 4.303, 6.965, 9.925, 22.327]],
  [5, [1.476, 2.015, 2.571, 3.365, 4.032, 5.893]],
  [10, [1.372, 1.812, 2.228, 2.764, 3.169]], // α = 0.001 printed 4.143; the exact value is 4.1437 (Biometrika tables print 4.144)
  [20, [1.325, 1.725, 2.086, 2.528, 2.845, 3.552]],
  [30, [1.31, 1.697, 2.042, 2.457, 2.75, 3.385]],
  [60, [1.296, 1.671, 2.0, 2.39, 2.66, 3.232]],
  [100, [1.29, 1.66, 1.984, 2.364, 2.626, 3.174]],
];
const tableCases = NIST_TABLE.flatMap(([df, ts]) => ts.map((t, i) => [df, ALPHAS[i]!, t] as const));

describe('studentTTwoSidedP', () => {
  it.each(tableCases)(`when df = %s and α = %s, then the table's t (%s, 3 decimals) brackets a two-sided p of 2α (${NIST_T})`, (df, alpha, t) => {
    // The table is rounded to 0.001: the true critical value lies within ±0.0005, so p there straddles 2α.
    expect(studentTTwoSidedP(t - 0.0005, df)).toBeGreaterThanOrEqual(2 * alpha);
    expect(studentTTwoSidedP(t + 0.0005, df)).toBeLessThanOrEqual(2 * alpha);
  });

  it.each([
    [2.228, 10, 0.05],
    [2.042, 30, 0.05],
    [1.812, 10, 0.1],
  ])(`when t = %s with df = %s, then two-sided p ≈ %s (${NIST_T})`, (t, df, p) => {
    expect(studentTTwoSidedP(t, df)).toBeCloseTo(p, 3);
    expect(studentTTwoSidedP(-t, df)).toBe(studentTTwoSidedP(t, df));
  });

  it('when df = 1 (Cauchy) or df = 2, then p matches the closed forms 1 − 2·atan|t|/π and 1 − |t|/√(2 + t²) (property, exact formulas)', () => {
    fc.assert(
      fc.property(fc.double({ min: -500, max: 500, noNaN: true }), (t) => {
        expectClose(studentTTwoSidedP(t, 1), 1 - (2 * Math.atan(Math.abs(t))) / Math.PI, 1e-10, 1e-14);
        expectClose(studentTTwoSidedP(t, 2), 1 - Math.abs(t) / Math.sqrt(2 + t * t), 1e-10, 1e-14);
      }),
    );
  });

  it('when df = 1 and t = tan(0.499π), then p = 0.002 exactly — the NIST entry 318.313 is a misprint for 318.309', () => {
    expect(studentTTwoSidedP(Math.tan(0.499 * Math.PI), 1)).toBeCloseTo(0.002, 12);
  });

  it('when t = 0, then p = 1; when |t| grows, then p falls (property)', () => {
    fc.assert(
      fc.property(fc.double({ min: 0.5, max: 200, noNaN: true }), fc.double({ min: 0, max: 20, noNaN: true }), fc.double({ min: 0.01, max: 5, noNaN: true }), (df, t, more) => {
        expect(studentTTwoSidedP(0, df)).toBe(1);
        const p = studentTTwoSidedP(t, df);
        expect(p).toBeGreaterThanOrEqual(0);
        expect(p).toBeLessThanOrEqual(1);
        // Far in the tail both are at the floor of double precision (e.g. df 105, t 10.0 gives 0 and t 10.2 gives
        // 1.6e-17): there the order is rounding, so it is checked to within 1e-15.
        expect(studentTTwoSidedP(t + more, df)).toBeLessThanOrEqual(p + 1e-15);
      }),
    );
  });
});

describe('regularizedIncompleteBeta', () => {
  it('when a or b is 1, then the closed forms x^a and 1 − (1 − x)^b hold; and I_x(a, b) = 1 − I_{1−x}(b, a) (property, exact identities)', () => {
    fc.assert(
      fc.property(fc.double({ min: 0, max: 1, noNaN: true }), fc.double({ min: 0.1, max: 60, noNaN: true }), fc.double({ min: 0.1, max: 60, noNaN: true }), (x, a, b) => {
        expectClose(regularizedIncompleteBeta(x, a, 1), x ** a, 1e-10, 1e-14);
        expectClose(regularizedIncompleteBeta(x, 1, b), 1 - (1 - x) ** b, 1e-10, 1e-14);
        // 1 − x is rounded to the nearest double, so the mirror identity is checked away from the ends, to 1e-9 absolute
        if (x >= 1e-6 && x <= 1 - 1e-6) {
          expect(Math.abs(regularizedIncompleteBeta(x, a, b) - (1 - regularizedIncompleteBeta(1 - x, b, a)))).toBeLessThan(1e-9);
        }
      }),
    );
  });

  it('when x is outside [0, 1] or a parameter is not above 0, then a RangeError', () => {
    expect(() => regularizedIncompleteBeta(1.5, 2, 2)).toThrow(RangeError);
    expect(() => regularizedIncompleteBeta(0.5, 0, 2)).toThrow(RangeError);
  });
});

/** Welch's test worked from its definitions with plain arithmetic (independent of the code under test). */
function welchByHand(before: number[], after: number[]) {
  const stats = (xs: number[]) => {
    const m = xs.reduce((s, x) => s + x, 0) / xs.length;
    const v = xs.reduce((s, x) => s + (x - m) ** 2, 0) / (xs.length - 1);
    return { m, v, n: xs.length };
  };
  const b = stats(before);
  const a = stats(after);
  const qb = b.v / b.n;
  const qa = a.v / a.n;
  return { t: (a.m - b.m) / Math.sqrt(qb + qa), df: (qb + qa) ** 2 / (qb ** 2 / (b.n - 1) + qa ** 2 / (a.n - 1)), sdB: Math.sqrt(b.v), sdA: Math.sqrt(a.v) };
}

describe('compareSamples', () => {
  it('when R\'s Welch example is run (10 and 10 readings), then t = 1.8325, df = 17.9, p = 0.08356 (R t.test output quoted in a Cross Validated answer; sign: after − before)', () => {
    const r = compareSamples([11, 9, 10, 11, 10, 12, 9, 11, 12, 9], [11, 13, 10, 13, 12, 9, 11, 12, 12, 11]);
    expect(r.tStatistic).toBeCloseTo(1.8325, 4);
    expect(r.degreesOfFreedom).toBeCloseTo(17.9, 1);
    expect(r.pValue).toBeCloseTo(0.08356, 5);
    expect(r.difference).toBeCloseTo(1, 12);
  });

  it.each([
    { before: [3.0, 4.0, 1.0, 2.1], after: [490.2, 340.0, 433.9], p: 0.010751561149784 },
    {
      before: [27.5, 21.0, 19.0, 23.6, 17.0, 17.9, 16.9, 20.1, 21.9, 22.6, 23.1, 19.6, 19.0, 21.7, 21.4],
      after: [27.1, 22.0, 20.8, 23.4, 23.4, 23.5, 25.8, 22.0, 24.8, 20.2, 21.9, 22.1, 22.9, 20.5, 24.4],
      p: 0.021378001462867,
    },
  ])('when Rosetta Code\'s Welch data set is run, then p = $p as R gives it (Rosetta Code "Welch\'s t-test", expected values from memory)', ({ before, after, p }) => {
    expect(compareSamples(before, after).pValue).toBeCloseTo(p, 10);
  });

  it('when inner-edge wear is compared before and after a camber change, then t and df match Welch\'s definitions worked by hand', () => {
    const before = [0.085, 0.09, 0.088, 0.089];
    const after = [0.044, 0.048, 0.046, 0.047, 0.041];
    const r = compareSamples(before, after);
    const h = welchByHand(before, after);
    expectClose(r.tStatistic!, h.t, 1e-12);
    expectClose(r.degreesOfFreedom!, h.df, 1e-12);
    expectClose(r.before.sd!, h.sdB, 1e-12);
    expectClose(r.after.sd!, h.sdA, 1e-12);
    expect(r.before).toMatchObject({ n: 4 });
    expectClose(r.before.mean!, 0.088, 1e-12);
    expect(r.enough).toBe(true);
  });

  it('when the groups differ in size and spread, then the equal-variance (Student) t and its df = n₁ + n₂ − 2 are NOT returned (the common wrong test)', () => {
    const before = [10.1, 10.4, 9.8, 10.0, 10.3, 9.9, 10.2, 10.1];
    const after = [9.0, 11.5, 8.2];
    const r = compareSamples(before, after);
    const pooled = tTestTwoSample(after, before, 0)!;
    expect(Math.abs(r.tStatistic! - pooled)).toBeGreaterThan(0.1);
    expect(Math.abs(r.degreesOfFreedom! - (before.length + after.length - 2))).toBeGreaterThan(3);
    expectClose(r.tStatistic!, welchByHand(before, after).t, 1e-12);
  });

  // Readings as a gauge gives them: hundredths between −100 and 100 (no subnormal spreads for the hand-worked oracle).
  const reading = fc.integer({ min: -10_000, max: 10_000 }).map((x) => x / 100);
  const sample = (min: number, max: number) => fc.array(reading, { minLength: min, maxLength: max });

  it('when both groups have the same size, then Welch\'s t equals the pooled t of simple-statistics (property, known identity)', () => {
    fc.assert(
      fc.property(fc.integer({ min: 2, max: 12 }).chain((n) => fc.tuple(sample(n, n), sample(n, n))), ([before, after]) => {
        const r = compareSamples(before, after);
        fc.pre(r.tStatistic !== null);
        expectClose(r.tStatistic!, tTestTwoSample(after, before, 0)!, 1e-8, 1e-8);
      }),
    );
  });

  it('when any two groups are compared, then t and df match the definitions, min(n)−1 ≤ df ≤ n₁+n₂−2, and swapping flips t but not p (property)', () => {
    fc.assert(
      fc.property(sample(2, 10), sample(2, 10), (before, after) => {
        const r = compareSamples(before, after);
        fc.pre(r.tStatistic !== null);
        const h = welchByHand(before, after);
        expectClose(r.tStatistic!, h.t, 1e-9, 1e-9);
        expectClose(r.degreesOfFreedom!, h.df, 1e-9);
        expect(r.degreesOfFreedom!).toBeGreaterThanOrEqual(Math.min(before.length, after.length) - 1 - 1e-9);
        expect(r.degreesOfFreedom!).toBeLessThanOrEqual(before.length + after.length - 2 + 1e-9);
        const s = compareSamples(after, before);
        expectClose(s.tStatistic!, -r.tStatistic!, 1e-12, 1e-12);
        expectClose(s.pValue!, r.pValue!, 1e-12, 1e-15);
      }),
    );
  });

  it('when a group has fewer than two readings, then t, df and p are null (not NaN) and there is not enough data', () => {
    for (const [before, after] of [[[1, 2, 3], [4]], [[], [1, 2, 3]], [[5], [6]]] as number[][][]) {
      const r = compareSamples(before!, after!);
      expect(r).toMatchObject({ tStatistic: null, degreesOfFreedom: null, pValue: null, enough: false });
    }
    expect(compareSamples([], [1]).before).toEqual({ n: 0, mean: null, sd: null });
    expect(compareSamples([2], [1]).before).toEqual({ n: 1, mean: 2, sd: null });
  });

  it('when there are two readings in each group, then t is computed but it is not enough; three each is enough', () => {
    const two = compareSamples([1, 2], [3, 5]);
    expect(two.tStatistic).not.toBeNull();
    expect(two.enough).toBe(false);
    expect(compareSamples([1, 2, 3], [3, 5, 4]).enough).toBe(true);
  });

  it('when every reading in each group is identical, then t, df and p are null rather than infinite', () => {
    expect(compareSamples([2, 2, 2], [3, 3, 3])).toMatchObject({ difference: 1, tStatistic: null, degreesOfFreedom: null, pValue: null, enough: true });
  });

  it('when a reading is not a number, then a RangeError', () => {
    expect(() => compareSamples([1, Number.NaN, 3], [1, 2, 3])).toThrow(RangeError);
  });
});

describe('verdict', () => {
  const comparison = (p: number | null, beforeMean: number, afterMean: number, n = 4): SampleComparison => ({
    before: { n, mean: beforeMean, sd: 0.01 },
    after: { n, mean: afterMean, sd: 0.01 },
    difference: afterMean - beforeMean,
    tStatistic: p === null ? null : 1,
    degreesOfFreedom: p === null ? null : 6,
    pValue: p,
    enough: n >= 3,
  });
  const wear = { betterWhen: 'lower' as const, what: 'inner-edge wear', unit: 'mm per run' };

  it.each([
    [0.01, 'Inner-edge wear fell from 0.088 to 0.046 mm per run: a clear change. That\'s an improvement.'],
    [0.1, 'Inner-edge wear fell from 0.088 to 0.046 mm per run: a hint, not yet sure. If it holds, that\'s an improvement.'],
    [0.4, 'Inner-edge wear fell from 0.088 to 0.046 mm per run: could be chance.'],
  ])('when p = %s, then "%s" (our wording: < 0.05 clear, 0.05–0.2 a hint, else chance)', (p, sentence) => {
    expect(verdict(comparison(p, 0.088, 0.046), wear)).toBe(sentence);
  });

  it('when the change goes the wrong way, then the sentence says it is a step back', () => {
    expect(verdict(comparison(0.003, 0.046, 0.088), wear)).toBe(
      'Inner-edge wear rose from 0.046 to 0.088 mm per run: a clear change. That\'s a step back.',
    );
    expect(verdict(comparison(0.003, 45.2, 44.1), { betterWhen: 'higher', what: 'grip', unit: 'g' })).toMatch(/fell from 45\.2 to 44\.1 g: .*step back/);
  });

  it('when a mean is below zero, then it is written with a true minus (U+2212), and a mean that rounds to zero with none', () => {
    const skew = { betterWhen: 'lower' as const, what: 'inner-minus-outer wear', unit: 'mm per run' };
    expect(verdict(comparison(0.11, 0.016, -0.003), skew)).toBe(
      'Inner-minus-outer wear fell from 0.016 to \u22120.003 mm per run: a hint, not yet sure. If it holds, that\'s an improvement.',
    );
    expect(verdict(comparison(0.11, 0.016, -0.0001), { ...skew, decimals: 3 })).toMatch(/ to 0\.000 mm per run/);
  });

  it('when the means are equal, then it says so and claims neither better nor worse', () => {
    expect(verdict(comparison(0.9, 0.05, 0.05), wear)).toBe('Inner-edge wear was 0.0500 mm per run before and after: could be chance.');
  });

  it('when a balance (inner minus outer) moves toward even, then it is an improvement; past even to the other side by more, a step back (common practice: even wear across the tread is the aim)', () => {
    const skew = { betterWhen: 'nearZero' as const, what: 'inner-minus-outer wear', unit: 'mm per run', decimals: 3 };
    expect(verdict(comparison(0.01, 0.02, -0.004), skew)).toBe("Inner-minus-outer wear fell from 0.020 to \u22120.004 mm per run: a clear change. That's an improvement.");
    expect(verdict(comparison(0.01, 0, -0.03), skew)).toBe("Inner-minus-outer wear fell from 0.000 to \u22120.030 mm per run: a clear change. That's a step back.");
    // As far from even on the other side: neither; judged on the numbers as written (0.0201 and −0.0199 both read 0.020).
    expect(verdict(comparison(0.01, 0.02, -0.02), skew)).toBe('Inner-minus-outer wear fell from 0.020 to \u22120.020 mm per run: a clear change.');
    expect(verdict(comparison(0.01, 0.0201, -0.0199), skew)).toBe('Inner-minus-outer wear fell from 0.020 to \u22120.020 mm per run: a clear change.');
  });

  it('when decimals are given and the means differ at that many, then they are written so; when they would read the same, then enough to tell them apart', () => {
    expect(verdict(comparison(0.01, 0.0339, 0.0366), { ...wear, decimals: 3 })).toMatch(/^Inner-edge wear rose from 0\.034 to 0\.037 mm per run/);
    expect(verdict(comparison(0.01, 0.0339, 0.0342), { ...wear, decimals: 3 })).toMatch(/^Inner-edge wear rose from 0\.03390 to 0\.03420 mm per run/);
  });

  it('when decimals are given, then the means are shown with that many', () => {
    expect(verdict(comparison(0.01, 0.088, 0.046), { ...wear, decimals: 2 })).toMatch(/^Inner-edge wear fell from 0\.09 to 0\.05 mm per run/);
  });

  it('when there are too few readings, then "Not enough data yet: 2 readings before and 1 after."', () => {
    expect(verdict(compareSamples([0.08, 0.09], [0.05]), wear)).toBe('Not enough data yet: 2 readings before and 1 after.');
    expect(verdict(compareSamples([0.08], [0.05, 0.06, 0.05]), wear)).toBe('Not enough data yet: 1 reading before and 3 after.');
    expect(verdict(compareSamples([0.08], [0.05]), { ...wear, counted: 'interval' })).toBe('Not enough data yet: 1 interval before and 1 after.');
  });

  it('when p is tiny, then the sentence is built from compareSamples and calls it clear, with no statistics in its words', () => {
    const r = compareSamples([0.085, 0.09, 0.088, 0.089], [0.044, 0.048, 0.046, 0.046]);
    expect(verdict(r, wear)).toBe('Inner-edge wear fell from 0.088 to 0.046 mm per run: a clear change. That\'s an improvement.');
  });

  it('when each group has no spread at all, then the verdict says chance cannot be judged instead of claiming a change', () => {
    expect(verdict(compareSamples([2, 2, 2], [3, 3, 3]), { betterWhen: 'lower', what: 'cones', unit: '' })).toBe(
      "Cones rose from 2.0 to 3.0, but each side's readings were all the same, so chance cannot be judged.",
    );
    expect(verdict(compareSamples([2, 2, 2], [3, 3, 3]), { betterWhen: 'lower', what: 'cones', unit: '', counted: 'run' })).toMatch(/each side's runs were all the same/);
  });

  it('when any comparison is described, then it claims "clear" only below p = 0.05, and never judges better/worse when it could be chance (property)', () => {
    fc.assert(
      fc.property(fc.double({ min: 0, max: 1, noNaN: true }), fc.double({ min: 1, max: 2, noNaN: true }), fc.double({ min: 1, max: 2, noNaN: true }), fc.constantFrom('lower' as const, 'higher' as const), (p, b, a, betterWhen) => {
        const text = verdict(comparison(p, b, a), { betterWhen, what: 'lap time', unit: 's' });
        expect(text.includes('a clear change')).toBe(p < 0.05);
        expect(text.includes('a hint, not yet sure')).toBe(p >= 0.05 && p <= 0.2);
        if (p > 0.2) expect(text).not.toMatch(/improvement|step back/);
        // The counts and p are shown beside the sentence (compare-section.tsx), not in it.
        expect(text).not.toMatch(/\bn = |\bp [=<] /);
      }),
    );
  });
});

describe('summariseByValue', () => {
  it('when eight readings share one value, then the mean is 5 and the sample spread √(32/7) (worked example: 2, 4, 4, 4, 5, 5, 7, 9; population sd 2 — "Standard deviation", Wikipedia, from memory)', () => {
    const ys = [2, 4, 4, 4, 5, 5, 7, 9];
    const [only, ...rest] = summariseByValue(ys.map((y, i) => ({ value: 6, y, day: i < 4 ? 'a' : 'b' })));
    expect(rest).toEqual([]);
    expect(only).toMatchObject({ value: 6, n: 8, days: 2, mean: 5 });
    expect(only!.sd).toBeCloseTo(Math.sqrt(32 / 7), 12);
  });

  it('when readings are on several values, then each value gets its own count, days, mean and sd, lowest value first, as mathjs computes them (property)', () => {
    const reading = fc.record({
      value: fc.constantFrom(179, 186, 193, 200),
      y: fc.double({ min: 0, max: 8, noNaN: true }),
      day: fc.constantFrom('e1', 'e2', 'e3'),
    });
    fc.assert(
      fc.property(fc.array(reading, { minLength: 1, maxLength: 40 }), (readings) => {
        const summary = summariseByValue(readings);
        const values = [...new Set(readings.map((r) => r.value))].sort((a, b) => a - b);
        expect(summary.map((s) => s.value)).toEqual(values);
        for (const s of summary) {
          const mine = readings.filter((r) => r.value === s.value);
          const ys = mine.map((r) => r.y);
          expect(s.n).toBe(mine.length);
          expect(s.days).toBe(new Set(mine.map((r) => r.day)).size);
          expectClose(s.mean, mathMean(ys), 1e-9, 1e-12);
          // mathjs std divides by n − 1 by default ("unbiased").
          if (ys.length === 1) expect(s.sd).toBeNull();
          else expectClose(s.sd!, Number(mathStd(ys)), 1e-9, 1e-12);
        }
      }),
    );
  });

  it('when there are no readings, then there are no values; when a reading is not a number, then it is refused', () => {
    expect(summariseByValue([])).toEqual([]);
    expect(() => summariseByValue([{ value: 5, y: Number.NaN, day: 'a' }])).toThrow(RangeError);
  });
});

describe('runOrderWithinDays', () => {
  const day = (id: string, values: number[]) => values.map((value, i) => ({ value, day: id, order: i }));

  it('when a setting was changed once during a day, then that day counts as changed and in blocks: every run on the new value came later', () => {
    expect(runOrderWithinDays(day('a', [5, 5, 5, 7, 7, 7, 7]))).toEqual({ daysChanged: 1, daysInBlocks: 1 });
  });

  it('when the values were alternated through a day, then the day counts as changed but not in blocks', () => {
    expect(runOrderWithinDays(day('a', [5, 7, 5, 7, 5, 7]))).toEqual({ daysChanged: 1, daysInBlocks: 0 });
    // Changed and changed back: 5 came both before and after 7.
    expect(runOrderWithinDays(day('a', [5, 5, 7, 7, 5]))).toEqual({ daysChanged: 1, daysInBlocks: 0 });
  });

  it('when a day ran on one value, then it is not counted; days are judged in the order of their runs, not the order given', () => {
    const shuffled = [{ value: 7, day: 'b', order: 40 }, { value: 5, day: 'b', order: 10 }, { value: 7, day: 'b', order: 30 }, { value: 5, day: 'b', order: 20 }];
    expect(runOrderWithinDays([...day('a', [7, 7, 7]), ...shuffled])).toEqual({ daysChanged: 1, daysInBlocks: 1 });
    expect(runOrderWithinDays([...day('a', [7, 7, 7]), ...day('c', [3, 4, 5])])).toEqual({ daysChanged: 1, daysInBlocks: 1 });
    expect(runOrderWithinDays([])).toEqual({ daysChanged: 0, daysInBlocks: 0 });
  });
});
