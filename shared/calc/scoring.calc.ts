/**
 * Autocross scoring: time plus penalties. A run's adjusted (corrected) time is its
 * raw time plus a penalty per cone; DNF and off-course runs have no time and are
 * never a best run. Common practice, as in club rulebooks ("time plus penalties").
 */

export type ScoredStatus = 'finished' | 'dnf' | 'off_course';

export interface ScorableRun {
  rawTimeSec: number | null;
  cones: number;
  status: ScoredStatus;
}

/** Rounds to the millisecond, the resolution timing gear reports. */
export const roundMs = (sec: number) => Math.round(sec * 1000) / 1000;

export function adjustedTimeSec(run: ScorableRun, conePenaltySec: number): number | null {
  if (run.status !== 'finished' || run.rawTimeSec === null) return null;
  return roundMs(run.rawTimeSec + run.cones * conePenaltySec);
}

/** The run with the lowest adjusted time; ties go to the earlier run in the list. */
export function bestRun<T extends ScorableRun>(runs: readonly T[], conePenaltySec: number): T | null {
  let best: T | null = null;
  let bestTime = Infinity;
  for (const run of runs) {
    const t = adjustedTimeSec(run, conePenaltySec);
    if (t !== null && t < bestTime) {
      best = run;
      bestTime = t;
    }
  }
  return best;
}

/** (t − best) / best × 100. */
export function pctOffBest(timeSec: number, bestSec: number): number {
  if (!(bestSec > 0)) throw new RangeError('The best time must be above 0');
  return ((timeSec - bestSec) / bestSec) * 100;
}

/** Time × the class's index factor (factors are entered by users each season). */
export function indexTimeSec(timeSec: number, factor: number): number {
  if (!(factor > 0)) throw new RangeError('The index factor must be above 0');
  return roundMs(timeSec * factor);
}

/** best / time × 10 000, rounded to a whole point (a common regional scheme). */
export function points(timeSec: number, bestSec: number): number {
  if (!(timeSec > 0)) throw new RangeError('The time must be above 0');
  return Math.round((bestSec / timeSec) * 10_000);
}

export interface ScoredRun<T> {
  run: T;
  adjustedTimeSec: number | null;
  pctOffBest: number | null;
  isBest: boolean;
}

/**
 * Scores one driver's runs at one event: adjusted times, the best, and each run's
 * % off that best. The one place runs are scored; the API and the screens use it.
 */
export function scoreRuns<T extends ScorableRun>(runs: readonly T[], conePenaltySec: number): ScoredRun<T>[] {
  const best = bestRun(runs, conePenaltySec);
  const bestTime = best ? adjustedTimeSec(best, conePenaltySec) : null;
  return runs.map((run) => {
    const t = adjustedTimeSec(run, conePenaltySec);
    return {
      run,
      adjustedTimeSec: t,
      // A best of 0 s (a time under half a millisecond, stored before times had to be 0.001 s or more) has no % off.
      pctOffBest: t !== null && bestTime !== null && bestTime > 0 ? pctOffBest(t, bestTime) : null,
      isBest: run === best,
    };
  });
}
