import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { innerOuterSkewMm, MINIMUM_TREAD_MM, runsLeft, wearPattern, wearRateMmPerRun, type WearPattern } from '../../../shared/calc/wear.calc';
import { convert } from '../../../shared/calc/units.calc';
import { expectClose, expectToDigits } from './expect-digits';

// Wear rate = depth lost per run; runs left = (depth now − limit)/rate (common practice). Wear indicators 2/32 in
// (FMVSS 109/119); EU 1.6 mm (Directive 89/459/EEC, from memory). Patterns: ASE study guides. Wear rate and runs left: common practice.
const in32 = (x: number) => convert(x, 'in32', 'mm');

/** Least squares by hand: slope = Sxy/Sxx, intercept = ȳ − slope·x̄, R² = Sxy²/(Sxx·Syy) (independent of simple-statistics). */
function byHand(points: { runs: number; depthMm: number }[]) {
  const n = points.length;
  const mx = points.reduce((s, p) => s + p.runs, 0) / n;
  const my = points.reduce((s, p) => s + p.depthMm, 0) / n;
  let sxx = 0;
  let sxy = 0;
  let syy = 0;
  for (const p of points) {
    sxx += (p.runs - mx) ** 2;
    sxy += (p.runs - mx) * (p.depthMm - my);
    syy += (p.depthMm - my) ** 2;
  }
  const slope = sxy / sxx;
  return { slope, intercept: my - slope * mx, r2: (sxy * sxy) / (sxx * syy) };
}

describe('wearRateMmPerRun', () => {
  it('when the tread goes 7.0 → 5.8 mm over 24 runs, then 0.050 mm per run (common practice, worked by hand)', () => {
    const r = wearRateMmPerRun([
      { runs: 0, depthMm: 7.0 },
      { runs: 24, depthMm: 5.8 },
    ]);
    expectToDigits(r!.mmPerRun, '0.050');
    expect(r).toMatchObject({ n: 2, r2: 1 });
    expectToDigits(r!.intercept, '7.0');
  });

  it('when 9/32 → 6/32 in over 3 heat cycles, then 0.79375 mm per cycle (common practice, worked by hand)', () => {
    const r = wearRateMmPerRun([
      { runs: 0, depthMm: in32(9) },
      { runs: 3, depthMm: in32(6) },
    ]);
    expectToDigits(r!.mmPerRun, '0.79375');
  });

  it('when readings scatter around a line, then slope, intercept and R² match least squares worked by hand (independent oracle)', () => {
    const points = [
      { runs: 0, depthMm: 7.0 },
      { runs: 6, depthMm: 6.74 },
      { runs: 12, depthMm: 6.38 },
      { runs: 18, depthMm: 6.12 },
      { runs: 24, depthMm: 5.81 },
    ];
    const r = wearRateMmPerRun(points)!;
    const h = byHand(points);
    expectClose(r.mmPerRun, -h.slope, 1e-12);
    expectClose(r.intercept, h.intercept, 1e-12);
    expectClose(r.r2, h.r2, 1e-12);
    expect(r.n).toBe(5);
    expect(r.r2).toBeLessThan(1);
  });

  it('when any readings are given, then the fit agrees with least squares by hand, R² in [0, 1] (property)', () => {
    // Depths as a gauge reads them (hundredths of a mm), so the spread is never a rounding error.
    const point = fc.record({ runs: fc.integer({ min: 0, max: 200 }), depthMm: fc.integer({ min: 100, max: 1000 }).map((h) => h / 100) });
    fc.assert(
      fc.property(fc.array(point, { minLength: 3, maxLength: 12 }), (points) => {
        fc.pre(new Set(points.map((p) => p.runs)).size > 1 && new Set(points.map((p) => p.depthMm)).size > 1);
        const r = wearRateMmPerRun(points)!;
        const h = byHand(points);
        expectClose(r.mmPerRun, -h.slope, 1e-9, 1e-12);
        expectClose(r.r2, h.r2, 1e-9, 1e-12);
        expect(r.r2).toBeGreaterThanOrEqual(-1e-12);
        expect(r.r2).toBeLessThanOrEqual(1 + 1e-12);
      }),
    );
  });

  it('when readings lie exactly on a wearing line, then that rate comes back with R² = 1 (property)', () => {
    fc.assert(
      fc.property(fc.double({ min: 0.001, max: 0.5, noNaN: true }), fc.uniqueArray(fc.integer({ min: 0, max: 60 }), { minLength: 2, maxLength: 8 }), (rate, runs) => {
        const r = wearRateMmPerRun(runs.map((x) => ({ runs: x, depthMm: 40 - rate * x })))!;
        expectClose(r.mmPerRun, rate, 1e-9);
        expect(r.r2).toBeCloseTo(1, 9);
      }),
    );
  });

  it('when there are fewer than two readings, or all at the same run count, then null', () => {
    expect(wearRateMmPerRun([])).toBeNull();
    expect(wearRateMmPerRun([{ runs: 3, depthMm: 6 }])).toBeNull();
    expect(wearRateMmPerRun([{ runs: 3, depthMm: 6 }, { runs: 3, depthMm: 5.5 }])).toBeNull();
  });

  it('when the depth has not changed, then 0 mm per run and a perfect (flat) fit, not NaN', () => {
    expect(wearRateMmPerRun([{ runs: 0, depthMm: 6 }, { runs: 10, depthMm: 6 }, { runs: 20, depthMm: 6 }])).toEqual({ mmPerRun: 0, intercept: 6, r2: 1, n: 3 });
  });

  it('when a depth is negative or not a number, then a RangeError', () => {
    expect(() => wearRateMmPerRun([{ runs: 0, depthMm: 6 }, { runs: 2, depthMm: -1 }])).toThrow(RangeError);
    expect(() => wearRateMmPerRun([{ runs: Number.NaN, depthMm: 6 }, { runs: 2, depthMm: 5 }])).toThrow(RangeError);
  });
});

describe('runsLeft', () => {
  it('when 6/32 in is left and wear is 0.79375 mm per cycle, then 4 more cycles to 2/32 in (common practice, worked by hand)', () => {
    expect(runsLeft({ depthNowMm: in32(6), minimumDepthMm: in32(2), mmPerRun: in32(1) })).toBe(4);
  });

  it('when 5.8 mm is left at 0.05 mm per run, then 84 runs to the default 1.6 mm ((5.8 − 1.6)/0.05, common practice)', () => {
    expect(runsLeft({ depthNowMm: 5.8, mmPerRun: 0.05 })).toBe(84);
  });

  it('when the rate is 0 or negative, then null (no estimate); when already at or below the limit, then 0', () => {
    expect(runsLeft({ depthNowMm: 6, mmPerRun: 0 })).toBeNull();
    expect(runsLeft({ depthNowMm: 6, mmPerRun: -0.01 })).toBeNull();
    expect(runsLeft({ depthNowMm: 1.6, mmPerRun: 0.05 })).toBe(0);
    expect(runsLeft({ depthNowMm: 1.2, mmPerRun: 0.05 })).toBe(0);
  });

  it('when any depth and rate are given, then the whole runs left fit: n·rate ≤ depth − limit < (n + 1)·rate (property)', () => {
    fc.assert(
      fc.property(fc.double({ min: 2, max: 12, noNaN: true }), fc.double({ min: 0.01, max: 1, noNaN: true }), (now, rate) => {
        const n = runsLeft({ depthNowMm: now, mmPerRun: rate })!;
        expect(Number.isInteger(n)).toBe(true);
        expect(n * rate).toBeLessThanOrEqual(now - MINIMUM_TREAD_MM + 1e-9);
        expect((n + 1) * rate).toBeGreaterThan(now - MINIMUM_TREAD_MM);
      }),
    );
  });

  it('when the default minimum is compared with 2/32 in, then it is the 1.6 mm the wear bars stand for (FMVSS 109/119; EU 1.6 mm, from memory)', () => {
    expect(Math.abs(MINIMUM_TREAD_MM - in32(2))).toBeLessThan(0.02);
    expect(runsLeft({ depthNowMm: 2.6, mmPerRun: 0.1 })).toBe(Math.floor((2.6 - MINIMUM_TREAD_MM) / 0.1 + 1e-9));
  });
});

describe('innerOuterSkewMm', () => {
  it.each([
    { inner: 4.2, outer: 5.6, skew: -1.4, why: 'inner edge more worn → negative' },
    { inner: 6.0, outer: 5.0, skew: 1.0, why: 'outer edge more worn → positive' },
    { inner: 5.5, outer: 5.5, skew: 0, why: 'even' },
  ])('when inner $inner and outer $outer mm ($why), then $skew mm (definition: inner − outer)', ({ inner, outer, skew }) => {
    expect(innerOuterSkewMm({ innerMm: inner, outerMm: outer })).toBeCloseTo(skew, 12);
  });
});

describe('wearPattern', () => {
  // Patterns: ASE study guides and vehicle makers' service text (from memory). The 0.5 mm threshold is
  // Scrubline's own choice — there is no published one.
  it.each<[number, number, number, WearPattern, string]>([
    [6.0, 6.0, 6.0, 'even', 'all the same'],
    [6.0, 6.4, 6.2, 'even', 'differences within 0.5 mm'],
    [6.5, 5.2, 6.4, 'centre', 'centre worn → over-inflation'],
    [5.0, 6.5, 5.2, 'shoulders', 'both shoulders worn → under-inflation'],
    [4.0, 5.6, 6.2, 'inner', 'inner edge worn → negative camber or toe-out'],
    [6.2, 5.6, 4.0, 'outer', 'outer edge worn → positive camber or roll'],
    [3.0, 6.0, 6.5, 'inner', 'inner far below, outer above the centre: one-sided, not shoulders'],
    [4.0, 6.0, 4.8, 'shoulders', 'both shoulders 1.2+ mm down, a smaller 0.8 mm skew'],
    [3.0, 6.0, 5.0, 'inner', 'shoulders 1 mm down, but the inner edge 2 mm below the outer: the larger signal wins'],
  ])('when inner %s, centre %s, outer %s mm, then "%s" (%s)', (inner, middle, outer, pattern) => {
    expect(wearPattern({ innerMm: inner, middleMm: middle, outerMm: outer })).toBe(pattern);
  });

  it('when the threshold is raised, then a 0.8 mm inner-edge difference stops counting (the threshold is ours to choose)', () => {
    const depths = { innerMm: 5.2, middleMm: 5.6, outerMm: 6.0 };
    expect(wearPattern(depths)).toBe('inner');
    expect(wearPattern(depths, 1.0)).toBe('even');
  });

  // Quarter-millimetre steps are exact in binary, so shifting by a constant cannot nudge a difference across the threshold.
  const quarter = fc.integer({ min: 4, max: 48 }).map((q) => q / 4);

  it('when inner and outer are swapped, then "inner" and "outer" swap and the other patterns stay (property)', () => {
    const mirror: Record<WearPattern, WearPattern> = { inner: 'outer', outer: 'inner', even: 'even', centre: 'centre', shoulders: 'shoulders' };
    fc.assert(
      fc.property(quarter, quarter, quarter, (i, m, o) => {
        expect(wearPattern({ innerMm: o, middleMm: m, outerMm: i })).toBe(mirror[wearPattern({ innerMm: i, middleMm: m, outerMm: o })]);
      }),
    );
  });

  it('when the same depth is added everywhere, then the pattern does not change; when all are within the threshold, then "even" (property)', () => {
    fc.assert(
      fc.property(quarter, quarter, quarter, fc.integer({ min: 0, max: 8 }).map((q) => q / 4), (i, m, o, shift) => {
        expect(wearPattern({ innerMm: i + shift, middleMm: m + shift, outerMm: o + shift })).toBe(wearPattern({ innerMm: i, middleMm: m, outerMm: o }));
        if (Math.max(i, m, o) - Math.min(i, m, o) <= 0.5) expect(wearPattern({ innerMm: i, middleMm: m, outerMm: o })).toBe('even');
      }),
    );
  });
});
