import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { linearRegression, linearRegressionLine, rSquared } from 'simple-statistics';
import { corr } from 'mathjs';
import { correlation, leastSquaresSlope, movedTogether, MOVED_TOGETHER_R, straightLineFit } from '../../../shared/calc/trend.calc';
import { expectClose } from './expect-digits';

describe('leastSquaresSlope', () => {
  it('when the points are (1, 2), (2, 3), (3, 7), then the slope is 2.5 (worked by hand)', () => {
    // x̄ = 2, ȳ = 4; Σ(x − x̄)(y − ȳ) = (−1)(−2) + 0·(−1) + (1)(3) = 5; Σ(x − x̄)² = 1 + 0 + 1 = 2; slope = 5 / 2.
    expect(leastSquaresSlope([[1, 2], [2, 3], [3, 7]])).toBeCloseTo(2.5, 12);
  });

  it('when % off falls 4.0, 2.5, 2.0 over events 1, 2, 4, then the slope is −0.6 % per event (worked by hand)', () => {
    // x̄ = 7/3, ȳ = 8.5/3; Σ(x − x̄)(y − ȳ) = Σxy − n·x̄·ȳ = (4 + 5 + 8) − 3·(7/3)·(8.5/3) = 17 − 59.5/3 = −8.5/3;
    // Σ(x − x̄)² = Σx² − n·x̄² = 21 − 49/3 = 14/3; slope = −8.5/14 = −0.607142857…
    expect(leastSquaresSlope([[1, 4], [2, 2.5], [4, 2]])).toBeCloseTo(-8.5 / 14, 12);
  });

  it('when two points are given, then the slope is the line through them (rise over run)', () => {
    expect(leastSquaresSlope([[3, 1.2], [5, 0.2]])).toBeCloseTo(-0.5, 12);
  });

  it('when there are fewer than 2 points or every x is the same, then there is no slope', () => {
    expect(leastSquaresSlope([])).toBeNull();
    expect(leastSquaresSlope([[1, 5]])).toBeNull();
    expect(leastSquaresSlope([[2, 1], [2, 3]])).toBeNull();
  });

  it('when compared with simple-statistics linearRegression on random points, then the slopes agree (independent library)', () => {
    const point = fc.tuple(fc.integer({ min: 1, max: 30 }), fc.double({ min: -50, max: 50, noNaN: true }));
    fc.assert(
      fc.property(fc.array(point, { minLength: 2, maxLength: 20 }), (points) => {
        fc.pre(new Set(points.map(([x]) => x)).size >= 2);
        const ours = leastSquaresSlope(points)!;
        const theirs = linearRegression(points.map(([x, y]) => [x, y])).m;
        expectClose(ours, theirs, 1e-9, 1e-9);
      }),
    );
  });

  it('when every y is shifted by a constant, then the slope is unchanged (property)', () => {
    fc.assert(
      fc.property(
        fc.array(fc.double({ min: -50, max: 50, noNaN: true }), { minLength: 2, maxLength: 12 }),
        fc.double({ min: -100, max: 100, noNaN: true }),
        (ys, shift) => {
          const points = ys.map((y, i) => [i + 1, y] as const);
          const shifted = ys.map((y, i) => [i + 1, y + shift] as const);
          expectClose(leastSquaresSlope(shifted)!, leastSquaresSlope(points)!, 1e-9, 1e-9);
        },
      ),
    );
  });
});

describe('straightLineFit', () => {
  it('when given Anscombe’s first data set, then the line is y = 3.00 + 0.500x with r² = 0.67 (Anscombe 1973, The American Statistician 27(1), from memory)', () => {
    const x = [10, 8, 13, 9, 11, 14, 6, 4, 12, 7, 5];
    const y = [8.04, 6.95, 7.58, 8.81, 8.33, 9.96, 7.24, 4.26, 10.84, 4.82, 5.68];
    const line = straightLineFit(x.map((xi, i) => [xi, y[i]!]))!;
    expect(line.slope).toBeCloseTo(0.5, 3);
    expect(line.intercept).toBeCloseTo(3.0, 2);
    expect(line.r2).toBeCloseTo(0.67, 2);
  });

  it('when every y is the same, then the flat line fits exactly: r² is 1, not the formula’s 0/0', () => {
    // Three events, one run each: each run is its day's best, 0 % off.
    expect(straightLineFit([[-1.2, 0], [-1.8, 0], [-2.4, 0]])).toEqual({ slope: 0, intercept: 0, r2: 1 });
    // A mean of 0.1s that is not exactly 0.1 in binary must not turn the exact fit into noise.
    expect(straightLineFit([[1, 0.1], [2, 0.1], [3, 0.1], [4, 0.1], [5, 0.1]])!.r2).toBe(1);
    // simple-statistics answers NaN here, which JSON would send as null.
    expect(rSquared([[1, 0], [2, 0], [3, 0]], linearRegressionLine(linearRegression([[1, 0], [2, 0], [3, 0]])))).toBeNaN();
  });

  it('when there are fewer than 2 points or every x is the same, then there is no line', () => {
    expect(straightLineFit([])).toBeNull();
    expect(straightLineFit([[1, 5]])).toBeNull();
    expect(straightLineFit([[2, 1], [2, 3]])).toBeNull();
  });

  it('when compared with simple-statistics on random points, then slope, intercept and r² agree (independent library)', () => {
    const point = fc.tuple(fc.integer({ min: 1, max: 30 }), fc.integer({ min: -5000, max: 5000 }).map((v) => v / 100));
    fc.assert(
      fc.property(fc.array(point, { minLength: 3, maxLength: 20 }), (points) => {
        fc.pre(new Set(points.map(([x]) => x)).size >= 2 && new Set(points.map(([, y]) => y)).size >= 2);
        const ours = straightLineFit(points)!;
        const pairs = points.map(([x, y]) => [x, y]);
        const theirs = linearRegression(pairs);
        expectClose(ours.slope, theirs.m, 1e-9, 1e-9);
        expectClose(ours.intercept, theirs.b, 1e-9, 1e-9);
        expectClose(ours.r2, rSquared(pairs, linearRegressionLine(theirs)), 1e-9, 1e-9);
      }),
    );
  });
});

describe('correlation', () => {
  it('when the points are (1, 2), (2, 3), (3, 7), then r = 5 / √(2 · 14) (worked by hand)', () => {
    // x̄ = 2, ȳ = 4; Σ(x − x̄)(y − ȳ) = 5; Σ(x − x̄)² = 2; Σ(y − ȳ)² = 4 + 1 + 9 = 14.
    expect(correlation([[1, 2], [2, 3], [3, 7]])).toBeCloseTo(5 / Math.sqrt(28), 12);
  });

  it('when one side never varies, or there are fewer than three points, then there is no r', () => {
    expect(correlation([[1, 2], [2, 2], [3, 2]])).toBeNull();
    expect(correlation([[1, 2], [1, 3], [1, 4]])).toBeNull();
    expect(correlation([[1, 2], [2, 3]])).toBeNull();
  });

  it('when compared with mathjs on random points, then r agrees (independent library)', () => {
    const point = fc.tuple(fc.integer({ min: -30, max: 30 }).map((v) => v / 10), fc.integer({ min: -5000, max: 5000 }).map((v) => v / 100));
    fc.assert(
      fc.property(fc.array(point, { minLength: 3, maxLength: 20 }), (points) => {
        fc.pre(new Set(points.map(([x]) => x)).size >= 2 && new Set(points.map(([, y]) => y)).size >= 2);
        const theirs = corr(points.map(([x]) => x), points.map(([, y]) => y)) as number;
        expectClose(correlation(points)!, theirs, 1e-9, 1e-9);
      }),
    );
  });
});

describe('movedTogether', () => {
  it('when toe followed camber exactly, pressure only loosely and clicks never changed, then toe alone is named, with its r from mathjs', () => {
    const camber = [-1.5, -1.5, -1.5, -2.5, -2.5, -2.5, -2.5];
    const toe = [0, 0, 0, -1, -1, -1, -1];
    const pressure = [220, 230, 210, 220, 230, 210, 225];
    const found = movedTogether({
      toeMm: camber.map((x, i) => [x, toe[i]!] as const),
      coldPressureKpa: camber.map((x, i) => [x, pressure[i]!] as const),
      damperClicks: camber.map((x) => [x, 4] as const),
    });
    expect(found.map((f) => f.field)).toEqual(['toeMm']);
    expect(found[0]!.r).toBeCloseTo(corr(camber, toe) as number, 12);
    // The loose one is under the line, as mathjs has it.
    expect(Math.abs(corr(camber, pressure) as number)).toBeLessThan(MOVED_TOGETHER_R);
  });

  it('when a setting was not recorded at some points, then those points are left out of its pairs, and the strongest comes first', () => {
    const found = movedTogether({
      rideHeightMm: [[1, 100], [2, null], [3, 120], [4, 131]] as const,
      springRateNPerMm: [[1, 80], [2, 70], [3, 60], [4, 50]] as const,
    });
    expect(found.map((f) => f.field)).toEqual(['springRateNPerMm', 'rideHeightMm']);
    expect(found[0]!.r).toBeCloseTo(-1, 12);
    expect(found[1]!.r).toBeCloseTo(corr([1, 3, 4], [100, 120, 131]) as number, 12);
  });
});
