/**
 * Before/after comparisons: did a change (pressure, camber, a new driver line) move a measurement, or could the
 * difference be chance?
 *
 * Welch's two-sample t-test, which does not assume the two groups vary equally:
 *   t = (mean_after − mean_before) / √(s_b²/n_b + s_a²/n_a)
 *   df = (s_b²/n_b + s_a²/n_a)² / [ (s_b²/n_b)²/(n_b − 1) + (s_a²/n_a)²/(n_a − 1) ]   (Welch–Satterthwaite)
 *   two-sided p = I_{df/(df + t²)}(df/2, 1/2), I the regularized incomplete beta function.
 * simple-statistics offers only the equal-variance test and no t distribution, so both are computed here; the
 * incomplete beta uses the continued fraction of Numerical Recipes (Press et al., §6.4 "betacf", modified Lentz).
 */
import { gammaln, mean, sampleStandardDeviation, sampleVariance } from 'simple-statistics';
import { requireFinite, requirePositive } from './input-checks.calc';
import { formatFixed } from './display';

export interface SampleSummary {
  n: number;
  /** Null with no readings. */
  mean: number | null;
  /** Sample standard deviation (n − 1); null with fewer than two readings. */
  sd: number | null;
}

export interface SampleComparison {
  before: SampleSummary;
  after: SampleSummary;
  /** after mean − before mean; null when either group is empty. */
  difference: number | null;
  /** Welch's t, positive when `after` is higher; null when it cannot be computed. */
  tStatistic: number | null;
  /** Welch–Satterthwaite degrees of freedom (not a whole number). */
  degreesOfFreedom: number | null;
  /** Two-sided p-value. */
  pValue: number | null;
  /** At least 3 readings in each group — fewer, and the verdict says there is not enough data. */
  enough: boolean;
}

export const MINIMUM_READINGS_PER_GROUP = 3;

const MAX_ITERATIONS = 10_000;
const EPSILON = 1e-15;
const TINY = 1e-300;

/** Continued fraction for the incomplete beta function (Numerical Recipes §6.4, modified Lentz's method). */
function betaContinuedFraction(a: number, b: number, x: number): number {
  const qab = a + b;
  const qap = a + 1;
  const qam = a - 1;
  let c = 1;
  let d = 1 - (qab * x) / qap;
  if (Math.abs(d) < TINY) d = TINY;
  d = 1 / d;
  let h = d;
  for (let m = 1; m <= MAX_ITERATIONS; m++) {
    const m2 = 2 * m;
    // even step
    let aa = (m * (b - m) * x) / ((qam + m2) * (a + m2));
    d = 1 + aa * d;
    if (Math.abs(d) < TINY) d = TINY;
    c = 1 + aa / c;
    if (Math.abs(c) < TINY) c = TINY;
    d = 1 / d;
    h *= d * c;
    // odd step
    aa = (-(a + m) * (qab + m) * x) / ((a + m2) * (qap + m2));
    d = 1 + aa * d;
    if (Math.abs(d) < TINY) d = TINY;
    c = 1 + aa / c;
    if (Math.abs(c) < TINY) c = TINY;
    d = 1 / d;
    const step = d * c;
    h *= step;
    if (Math.abs(step - 1) < EPSILON) return h;
  }
  throw new RangeError(`The incomplete beta function did not converge for a = ${a}, b = ${b}`);
}

/** The regularized incomplete beta function I_x(a, b), for 0 ≤ x ≤ 1 and a, b > 0. */
export function regularizedIncompleteBeta(x: number, a: number, b: number): number {
  requireFinite('x', x);
  requirePositive('a', a);
  requirePositive('b', b);
  if (x < 0 || x > 1) throw new RangeError('x must be between 0 and 1');
  if (x === 0) return 0;
  if (x === 1) return 1;
  const logFront = gammaln(a + b) - gammaln(a) - gammaln(b) + a * Math.log(x) + b * Math.log1p(-x);
  const front = Math.exp(logFront);
  // The continued fraction converges fast for x < (a + 1)/(a + b + 2); otherwise use I_x(a, b) = 1 − I_{1−x}(b, a).
  if (x < (a + 1) / (a + b + 2)) return (front * betaContinuedFraction(a, b, x)) / a;
  return 1 - (front * betaContinuedFraction(b, a, 1 - x)) / b;
}

/** Two-sided p-value of Student's t distribution: P(|T| ≥ |t|) with `degreesOfFreedom` (> 0, need not be whole). */
export function studentTTwoSidedP(t: number, degreesOfFreedom: number): number {
  requireFinite('t', t);
  const df = requirePositive('Degrees of freedom', degreesOfFreedom);
  const t2 = t * t;
  // p = I_{df/(df+t²)}(df/2, 1/2) = 1 − I_{t²/(df+t²)}(1/2, df/2). Small |t| uses the second form, so a p-value
  // near 1 is not lost to rounding in df/(df + t²) ≈ 1.
  const p = t2 < df ? 1 - regularizedIncompleteBeta(t2 / (df + t2), 0.5, df / 2) : regularizedIncompleteBeta(df / (df + t2), df / 2, 0.5);
  return Math.min(1, Math.max(0, p));
}

function summarise(label: string, values: readonly number[]): SampleSummary {
  values.forEach((v, i) => requireFinite(`${label} reading ${i + 1}`, v));
  const n = values.length;
  return {
    n,
    mean: n > 0 ? mean(values) : null,
    sd: n > 1 ? Math.sqrt(sampleVariance(values)) : null,
  };
}

/**
 * Compares readings taken before a change with readings taken after it (Welch's t-test, two-sided).
 * With fewer than two readings in either group — or no spread at all in either — t, df and p are null, never NaN.
 */
export function compareSamples(before: readonly number[], after: readonly number[]): SampleComparison {
  const b = summarise('Before', before);
  const a = summarise('After', after);
  const difference = a.mean !== null && b.mean !== null ? a.mean - b.mean : null;
  const enough = b.n >= MINIMUM_READINGS_PER_GROUP && a.n >= MINIMUM_READINGS_PER_GROUP;
  const none = { before: b, after: a, difference, tStatistic: null, degreesOfFreedom: null, pValue: null, enough };
  if (difference === null || b.sd === null || a.sd === null) return none;

  const vb = (b.sd * b.sd) / b.n;
  const va = (a.sd * a.sd) / a.n;
  const se2 = vb + va;
  // No spread at all within either group: the uncertainty cannot be judged (and t would be infinite).
  if (!(se2 > 0) || !Number.isFinite(se2)) return none;
  const tStatistic = difference / Math.sqrt(se2);
  // Welch–Satterthwaite on the two variances scaled by the larger, so tiny spreads cannot underflow to 0/0.
  const scale = Math.max(vb, va);
  const rb = vb / scale;
  const ra = va / scale;
  const degreesOfFreedom = ((rb + ra) * (rb + ra)) / ((rb * rb) / (b.n - 1) + (ra * ra) / (a.n - 1));
  return { ...none, tStatistic, degreesOfFreedom, pValue: studentTTwoSidedP(tStatistic, degreesOfFreedom) };
}

// ── Plain-English verdict ───────────────────────────────────────────────────

/** Below this p: "a clear change". */
export const CLEAR_P = 0.05;
/** Up to this p: "a hint, not yet sure"; above it: "could be chance". */
export const HINT_P = 0.2;

/** "1 run", "5 intervals": a count and what it counts. */
export const plural = (n: number, word: string) => `${n} ${word}${n === 1 ? '' : 's'}`;

/** Decimals for showing two means: enough for 2 significant figures of their difference (or 3 of the mean). */
function autoDecimals(before: number, after: number): number {
  const change = Math.abs(after - before);
  const scale = change > 0 ? change : Math.max(Math.abs(before), Math.abs(after));
  if (!(scale > 0)) return 0;
  const sig = change > 0 ? 2 : 3;
  return Math.min(6, Math.max(0, sig - 1 - Math.floor(Math.log10(scale))));
}


/** Which way a measurement is better: smaller, larger, or closer to zero (a balance). */
export type BetterWhen = 'lower' | 'higher' | 'nearZero';

/**
 * One plain sentence on a before/after comparison, e.g.
 * "Inner-edge wear fell from 0.088 to 0.046 mm per run: a clear change. That's an improvement."
 * p < 0.05 → "a clear change"; 0.05–0.2 → "a hint, not yet sure"; above → "could be chance". The counts and p are
 * shown beside it, not in it. With fewer than 3 in a group: "Not enough data yet: 2 readings before and 1 after."
 * `counted` names what each group holds (one reading, run or interval; "reading" when not given); `decimals`
 * writes the means as the page beside it does, unless both would then read the same (the automatic number, two
 * significant figures of the change, takes over). `betterWhen: 'nearZero'` is for a balance such as inner minus
 * outer wear, where even (0) is the aim and a swing past it is no gain.
 */
export function verdict(
  comparison: SampleComparison,
  options: { betterWhen: BetterWhen; what: string; unit: string; counted?: string; decimals?: number },
): string {
  const { before, after, difference, pValue } = comparison;
  const counted = options.counted ?? 'reading';
  if (!comparison.enough || before.mean === null || after.mean === null || difference === null) {
    return `Not enough data yet: ${plural(before.n, counted)} before and ${after.n} after.`;
  }
  const what = options.what.trim();
  const subject = what.charAt(0).toUpperCase() + what.slice(1);
  const unit = options.unit.trim() ? ` ${options.unit.trim()}` : '';
  const fixed = options.decimals;
  const decimals =
    fixed !== undefined && formatFixed(before.mean, fixed) !== formatFixed(after.mean, fixed) ? fixed : autoDecimals(before.mean, after.mean);
  const from = formatFixed(before.mean, decimals);
  const to = formatFixed(after.mean, decimals);

  const same = difference === 0 || from === to;
  const change = same
    ? `${subject} was ${to}${unit} before and after`
    : `${subject} ${difference < 0 ? 'fell' : 'rose'} from ${from} to ${to}${unit}`;

  if (pValue === null) {
    return `${change}, but each side's ${counted}s were all the same, so chance cannot be judged.`;
  }
  // Judged on the numbers as written: 0.0201 → −0.0199, shown as 0.020 → −0.020, is no nearer even.
  const shown = (v: number) => Math.abs(Number(v.toFixed(decimals)));
  const better =
    options.betterWhen === 'nearZero' ? shown(after.mean) < shown(before.mean) : (options.betterWhen === 'lower') === difference < 0;
  const level = options.betterWhen === 'nearZero' && shown(after.mean) === shown(before.mean);
  const direction = same || level ? '' : better ? "that's an improvement." : "that's a step back.";
  if (pValue < CLEAR_P) {
    return `${change}: a clear change.${direction ? ` ${direction.charAt(0).toUpperCase()}${direction.slice(1)}` : ''}`;
  }
  if (pValue <= HINT_P) {
    return `${change}: a hint, not yet sure.${direction ? ` If it holds, ${direction}` : ''}`;
  }
  return `${change}: could be chance.`;
}

// ── Per value of a setting ──────────────────────────────────────────────────

/** One reading (a run's time measure) taken on one value of a setting, on one day, at one place in that day. */
export interface SettingReading {
  /** The setting's value the run was made on. */
  value: number;
  /** The run's time measure. */
  y: number;
  /** Which day (event) it was made on. */
  day: string;
  /** Its place in that day: any number that sorts the day's runs in the order they were made (e.g. ms since 1970). */
  order: number;
}

export interface ValueSummary {
  value: number;
  /** Readings on this value. */
  n: number;
  /** Days (events) they came from. */
  days: number;
  mean: number;
  /** Sample standard deviation (n − 1); null with one reading. */
  sd: number | null;
}

/** The readings grouped by the setting's value, lowest value first: each value's count, days, mean and spread. */
export function summariseByValue(readings: readonly Pick<SettingReading, 'value' | 'y' | 'day'>[]): ValueSummary[] {
  const groups = new Map<number, { ys: number[]; days: Set<string> }>();
  readings.forEach((r, i) => {
    requireFinite(`Reading ${i + 1} value`, r.value);
    requireFinite(`Reading ${i + 1}`, r.y);
    const g = groups.get(r.value) ?? { ys: [], days: new Set<string>() };
    g.ys.push(r.y);
    g.days.add(r.day);
    groups.set(r.value, g);
  });
  return [...groups.entries()]
    .sort(([a], [b]) => a - b)
    .map(([value, g]) => ({
      value,
      n: g.ys.length,
      days: g.days.size,
      mean: mean(g.ys),
      sd: g.ys.length > 1 ? sampleStandardDeviation(g.ys) : null,
    }));
}

export interface RunOrderCheck {
  /** Days on which the readings were on more than one value of the setting. */
  daysChanged: number;
  /**
   * Of those, the days on which each value's readings came in one unbroken run of the day's order (the setting
   * was changed and not changed back and forth), so every reading on a later value came after every reading on
   * an earlier one.
   */
  daysInBlocks: number;
}

/**
 * Whether the values of a setting are tied to the order of the day's runs. Drivers usually get quicker through a
 * day (they learn the course, the tyres come in), so a value tried only after another on the same day is helped
 * by the order, not only by the setting (common practice: alternate the settings to be compared). This counts the
 * days on which that happened; it does not correct for it.
 */
export function runOrderWithinDays(readings: readonly Pick<SettingReading, 'value' | 'day' | 'order'>[]): RunOrderCheck {
  const byDay = new Map<string, { value: number; order: number }[]>();
  readings.forEach((r, i) => {
    requireFinite(`Reading ${i + 1} value`, r.value);
    requireFinite(`Reading ${i + 1} place in the day`, r.order);
    byDay.set(r.day, [...(byDay.get(r.day) ?? []), { value: r.value, order: r.order }]);
  });
  let daysChanged = 0;
  let daysInBlocks = 0;
  for (const day of byDay.values()) {
    const values = new Set(day.map((r) => r.value));
    if (values.size < 2) continue;
    daysChanged++;
    const inOrder = [...day].sort((a, b) => a.order - b.order);
    const blocks = inOrder.filter((r, i) => i === 0 || r.value !== inOrder[i - 1]!.value).length;
    if (blocks === values.size) daysInBlocks++;
  }
  return { daysChanged, daysInBlocks };
}
