import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { adjustedTimeSec, bestRun, indexTimeSec, pctOffBest, points, scoreRuns, type ScorableRun } from '../../../shared/calc/scoring.calc';

const fin = (rawTimeSec: number, cones = 0): ScorableRun => ({ rawTimeSec, cones, status: 'finished' });

describe('adjustedTimeSec', () => {
  // Time plus penalties, 2 s per cone: common practice (club autocross rulebooks, e.g. SCCA Solo Rules §1.2.1;
  // Formula SAE Rules 2024 D.11.3 also uses 2 s a cone).
  it.each([
    { run: fin(45.678, 2), penalty: 2, expected: 49.678, source: 'worked example: 45.678 s + 2 cones × 2 s' },
    { run: fin(52.101, 1), penalty: 2, expected: 54.101, source: 'worked example: 52.101 s + 1 cone' },
    { run: fin(51.88, 0), penalty: 2, expected: 51.88, source: 'clean run: raw = adjusted' },
    { run: fin(60, 3), penalty: 1, expected: 63, source: 'a club with a 1 s cone penalty' },
  ])('when $source, then $expected s', ({ run, penalty, expected }) => {
    expect(adjustedTimeSec(run, penalty)).toBeCloseTo(expected, 9);
  });

  it('when the run is a DNF or off course, then there is no adjusted time', () => {
    expect(adjustedTimeSec({ rawTimeSec: 50, cones: 0, status: 'dnf' }, 2)).toBeNull();
    expect(adjustedTimeSec({ rawTimeSec: null, cones: 1, status: 'off_course' }, 2)).toBeNull();
  });
});

describe('bestRun', () => {
  it('when runs are [52.101 + 1 cone, DNF, 51.880], then the best is 51.880 (worked example, common practice)', () => {
    const runs = [fin(52.101, 1), { rawTimeSec: 49.0, cones: 0, status: 'dnf' as const }, fin(51.88)];
    expect(bestRun(runs, 2)).toBe(runs[2]);
  });

  it('when a faster raw time has cones, then a slower clean run can be best', () => {
    const runs = [fin(50.0, 1), fin(51.5)];
    expect(bestRun(runs, 2)).toBe(runs[1]);
  });

  it('when every run is a DNF, then there is no best', () => {
    expect(bestRun([{ rawTimeSec: null, cones: 0, status: 'dnf' }], 2)).toBeNull();
  });
});

describe('pctOffBest, indexTimeSec, points', () => {
  it('when 62.000 s × 0.844 is compared with 50.000 s, then index time 52.328 s is 4.656 % off (worked example)', () => {
    const indexed = indexTimeSec(62.0, 0.844);
    expect(indexed).toBeCloseTo(52.328, 9);
    expect(pctOffBest(indexed, 50.0)).toBeCloseTo(4.656, 3);
  });

  it('when 49.345 s is best and the run is 50.567 s, then it scores 9758 points (best/time × 10 000)', () => {
    expect(points(50.567, 49.345)).toBe(9758);
  });

  it('when the time is the best, then 0 % off and 10 000 points (property)', () => {
    fc.assert(
      fc.property(fc.double({ min: 10, max: 1000, noNaN: true }), (t) => {
        expect(pctOffBest(t, t)).toBe(0);
        expect(points(t, t)).toBe(10_000);
      }),
    );
  });

  it('when t ≥ best, then % off is ≥ 0 and t = best × (1 + pct/100) (property)', () => {
    fc.assert(
      fc.property(fc.double({ min: 10, max: 500, noNaN: true }), fc.double({ min: 0, max: 100, noNaN: true }), (best, extra) => {
        const t = best + extra;
        const pct = pctOffBest(t, best);
        expect(pct).toBeGreaterThanOrEqual(0);
        expect(best * (1 + pct / 100)).toBeCloseTo(t, 6);
      }),
    );
  });
});

describe('scoreRuns', () => {
  it('when a set of runs is scored, then exactly one is best and it is 0 % off; DNFs have nulls', () => {
    const runs = [fin(45.678, 2), fin(48.1), { rawTimeSec: null, cones: 0, status: 'dnf' as const }];
    const scored = scoreRuns(runs, 2);
    expect(scored.map((s) => s.adjustedTimeSec)).toEqual([49.678, 48.1, null]);
    expect(scored.filter((s) => s.isBest)).toHaveLength(1);
    expect(scored[1]).toMatchObject({ isBest: true, pctOffBest: 0 });
    expect(scored[0]!.pctOffBest).toBeCloseTo(((49.678 - 48.1) / 48.1) * 100, 9);
    expect(scored[2]).toMatchObject({ isBest: false, pctOffBest: null });
  });

  it('when the best time rounds to 0 s (a time under half a millisecond), then it is still the best and no run has a % off it, rather than an error', () => {
    const scored = scoreRuns([fin(47.5), fin(1e-300)], 2);
    expect(scored.map((s) => s.adjustedTimeSec)).toEqual([47.5, 0]);
    expect(scored.map((s) => s.isBest)).toEqual([false, true]);
    expect(scored.map((s) => s.pctOffBest)).toEqual([null, null]);
  });
});
