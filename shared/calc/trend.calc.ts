/**
 * Trends over a season: the ordinary least-squares slope of y on x,
 * slope = Σ(x − x̄)(y − ȳ) / Σ(x − x̄)² (standard statistics; e.g. the NIST/SEMATECH
 * e-Handbook of Statistical Methods, "Linear least squares regression", from memory).
 */

type Points = readonly (readonly [number, number])[];

/** The means and the sums of squares and products about them that a least-squares line is made of. */
function centred(points: Points) {
  const n = points.length;
  const meanX = points.reduce((sum, [x]) => sum + x, 0) / n;
  const meanY = points.reduce((sum, [, y]) => sum + y, 0) / n;
  let sxy = 0;
  let sxx = 0;
  let syy = 0;
  for (const [x, y] of points) {
    sxy += (x - meanX) * (y - meanY);
    sxx += (x - meanX) ** 2;
    syy += (y - meanY) ** 2;
  }
  return { meanX, meanY, sxy, sxx, syy };
}

/** The least-squares slope through [x, y] points; null with fewer than 2 points or when every x is the same. */
export function leastSquaresSlope(points: Points): number | null {
  if (points.length < 2) return null;
  const { sxy, sxx } = centred(points);
  return sxx === 0 ? null : sxy / sxx;
}

export interface StraightLine {
  slope: number;
  intercept: number;
  /** r² = 1 − SS_res / SS_tot, the share of the spread in y the line explains, 0–1. */
  r2: number;
}

/**
 * The least-squares line y = slope·x + intercept through [x, y] points, with its r² (same sources as above).
 * Null with fewer than 2 points or when every x is the same. When every y is the same the flat line fits them
 * exactly: SS_tot is 0, the formula's 0/0 has no value, and r² is taken as 1.
 */
export function straightLineFit(points: Points): StraightLine | null {
  if (points.length < 2) return null;
  const { meanX, meanY, sxy, sxx, syy } = centred(points);
  if (sxx === 0) return null;
  const slope = sxy / sxx;
  const intercept = meanY - slope * meanX;
  let ssRes = 0;
  for (const [x, y] of points) ssRes += (y - (slope * x + intercept)) ** 2;
  // Every y the same, compared as given: their mean can differ from each in the last bit, leaving 0/0 as noise.
  const flat = points.every(([, y]) => y === points[0]![1]);
  return { slope, intercept, r2: flat || syy === 0 ? 1 : Math.max(0, 1 - ssRes / syy) };
}

/**
 * Pearson's correlation coefficient, r = Σ(x − x̄)(y − ȳ) / √(Σ(x − x̄)² · Σ(y − ȳ)²), −1 to 1 (same sources as
 * above). Null with fewer than 3 points (two always line up exactly) or when either side never varies.
 */
export function correlation(points: Points): number | null {
  if (points.length < 3) return null;
  const { sxy, sxx, syy } = centred(points);
  if (sxx === 0 || syy === 0) return null;
  return Math.max(-1, Math.min(1, sxy / Math.sqrt(sxx * syy)));
}

/**
 * How strongly another setting must follow the plotted one, as |r|, before a trend is said to be possibly its:
 * 0.7 is the usual threshold for a strong correlation (from memory; a rule of thumb, not a test).
 */
export const MOVED_TOGETHER_R = 0.7;

/**
 * Of other settings, each given as [plotted value, its own value] at every point, those that moved with the
 * plotted one (|r| ≥ MOVED_TOGETHER_R), strongest first. A point where a setting was not recorded is left out
 * of that setting's pairs.
 */
export function movedTogether<K extends string>(others: Record<K, readonly (readonly [number, number | null])[]>): { field: K; r: number }[] {
  const found: { field: K; r: number }[] = [];
  for (const field of Object.keys(others) as K[]) {
    const pairs = others[field].filter((p): p is readonly [number, number] => p[1] !== null);
    const r = correlation(pairs);
    if (r !== null && Math.abs(r) >= MOVED_TOGETHER_R) found.push({ field, r });
  }
  return found.sort((a, b) => Math.abs(b.r) - Math.abs(a.r));
}
