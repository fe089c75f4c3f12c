/**
 * Tread depth and wear.
 *
 * Wear indicators sit at 2/32 in (1.6 mm): FMVSS 109/119; most US states set 2/32 in as the in-use minimum; EU
 * minimum 1.6 mm (Directive 89/459/EEC, from memory). Wear rate = depth lost per run (or per km or heat cycle —
 * say which); runs left = (depth now − limit) / rate (common practice).
 * Three-point readings (inner / centre / outer, repeated around the tyre) show a pattern (ASE study guides; vehicle
 * makers' service text): centre worn → over-inflation; both shoulders → under-inflation; inner edge → too much
 * negative camber (or toe-out); outer edge → positive camber or roll.
 */
import { requireFinite, requireNonNegative, noNegativeZero } from './input-checks.calc';
import { straightLineFit } from './trend.calc';

/** Legal minimum / wear-bar depth, mm: 2/32 in = 1.5875 mm in the US (FMVSS 109/119 wear indicators); EU 1.6 mm (from memory). */
export const MINIMUM_TREAD_MM = 1.6;

export interface WearRate {
  /** Depth lost per run, mm (positive = wearing). */
  mmPerRun: number;
  /** Fitted depth at run 0, mm. */
  intercept: number;
  /** Share of the variation in depth the straight line explains, 0–1 (always 1 with two readings). */
  r2: number;
  /** Number of readings used. */
  n: number;
}

/**
 * Wear rate by a least-squares straight line through tread depth (mm) against cumulative runs (or heat cycles, or
 * km: the rate is per whatever `runs` counts). Null with fewer than two readings or when every reading has the same
 * run count (no line can be fitted).
 */
export function wearRateMmPerRun(points: readonly { runs: number; depthMm: number }[]): WearRate | null {
  const data = points.map((p, i) => [requireFinite(`Reading ${i + 1} runs`, p.runs), requireNonNegative(`Reading ${i + 1} depth`, p.depthMm)] as const);
  const line = straightLineFit(data);
  return line && { mmPerRun: noNegativeZero(-line.slope), intercept: line.intercept, r2: line.r2, n: data.length };
}

/**
 * Whole runs (or cycles) left before the tread reaches `minimumDepthMm` (default 1.6 mm) at `mmPerRun`; 0 when
 * already there. Null when the rate is 0 or negative (no wear seen, so no estimate).
 */
export function runsLeft(input: { depthNowMm: number; minimumDepthMm?: number; mmPerRun: number }): number | null {
  const now = requireNonNegative('Depth now', input.depthNowMm);
  const limit = requireNonNegative('Minimum depth', input.minimumDepthMm ?? MINIMUM_TREAD_MM);
  const rate = requireFinite('Wear rate', input.mmPerRun);
  if (!(rate > 0)) return null;
  const left = (now - limit) / rate;
  if (!(left > 0)) return 0;
  // Slack for values typed in 1/32 in: 3.175 mm / 0.79375 mm/cycle must be 4, not 3.999….
  return Math.floor(left + 1e-9);
}

/** Inner minus outer depth, mm: negative = the inner edge is more worn. */
export function innerOuterSkewMm(input: { innerMm: number; outerMm: number }): number {
  return noNegativeZero(requireFinite('Inner depth', input.innerMm) - requireFinite('Outer depth', input.outerMm));
}

export type WearPattern = 'even' | 'centre' | 'shoulders' | 'inner' | 'outer';

/**
 * The pattern in one set of inner / centre / outer depths (mm of tread left).
 * There is no published threshold for "uneven": Scrubline's own choice is that a difference must be MORE than
 * `thresholdMm` (default 0.5 mm) to count. Three signals are compared and the largest over the threshold wins:
 * - centre: the middle sits below BOTH edges (by the smaller of the two gaps) — over-inflation;
 * - shoulders: BOTH edges sit below the middle (by the smaller gap) — under-inflation;
 * - inner / outer: one edge below the other — camber, toe or roll.
 * A tie between a centre/shoulder signal and an edge signal goes to the centre/shoulder pattern.
 */
export function wearPattern(depths: { innerMm: number; middleMm: number; outerMm: number }, thresholdMm = 0.5): WearPattern {
  const inner = requireNonNegative('Inner depth', depths.innerMm);
  const middle = requireNonNegative('Centre depth', depths.middleMm);
  const outer = requireNonNegative('Outer depth', depths.outerMm);
  const threshold = requireNonNegative('Threshold', thresholdMm);

  const centreSignal = Math.min(inner, outer) - middle;
  const shoulderSignal = middle - Math.max(inner, outer);
  const edgeSignal = Math.abs(inner - outer);
  const [pressurePattern, pressureSignal]: [WearPattern, number] =
    centreSignal >= shoulderSignal ? ['centre', centreSignal] : ['shoulders', shoulderSignal];

  if (pressureSignal > threshold && pressureSignal >= edgeSignal) return pressurePattern;
  if (edgeSignal > threshold) return inner < outer ? 'inner' : 'outer';
  return 'even';
}
