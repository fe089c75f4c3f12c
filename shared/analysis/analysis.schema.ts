import * as z from '../zod';
import { isoDate, isoDateTime } from '../api/dates.schema';
import type { Corner } from '../season/corners';
import type { SetupChange, SetupCorner, SetupCornerField } from '../season/setup.schema';
import type { BetterWhen, RunOrderCheck, ValueSummary } from '../calc/comparison.calc';

export const SCATTER_PARAMS = ['camber', 'springRate', 'damperClicks', 'coldPressure', 'rideHeight'] as const;
export const SCATTER_METRICS = ['time', 'wear', 'wearSkew'] as const;
export const CORNER_OR_AXLE = ['lf', 'rf', 'lr', 'rr', 'front', 'rear'] as const;

export type ScatterParam = (typeof SCATTER_PARAMS)[number];
export type ScatterMetric = (typeof SCATTER_METRICS)[number];
export type CornerOrAxle = (typeof CORNER_OR_AXLE)[number];

/** The setup field each setting on the x axis reads, corner by corner. */
export const SCATTER_PARAM_FIELD = {
  camber: 'camberDeg',
  springRate: 'springRateNPerMm',
  damperClicks: 'damperClicks',
  coldPressure: 'coldPressureKpa',
  rideHeight: 'rideHeightMm',
} as const satisfies Record<ScatterParam, keyof SetupCorner>;

export const scatterQuerySchema = z.strictObject({
  x: z.enum(SCATTER_PARAMS, { error: `Pick x from ${SCATTER_PARAMS.join(', ')}` }),
  y: z.enum(SCATTER_METRICS, { error: `Pick y from ${SCATTER_METRICS.join(', ')}` }),
  /** A corner, or an axle (the mean of its two corners). Defaults to the front axle. */
  corner: z._default(z.enum(CORNER_OR_AXLE), 'front'),
  from: z.optional(isoDate()),
  to: z.optional(isoDate()),
});
export type ScatterQuery = z.infer<typeof scatterQuerySchema>;

export const compareQuerySchema = z
  .strictObject({ changeId: z.optional(z.uuid()), at: z.optional(z.union([isoDateTime(), isoDate()])) })
  .check(
    z.refine((q) => (q.changeId === undefined) !== (q.at === undefined), {
      message: 'Give either a change from the log (changeId) or a date (at)',
      path: ['changeId'],
    }),
  );
export type CompareQuery = z.infer<typeof compareQuerySchema>;

export const seasonQuerySchema = z.strictObject({
  /** The depth a driver retires a tyre at; 1.6 mm (2/32 in) is where wear indicators sit. */
  minDepthMm: z._default(z.coerce.number().check(z.gte(0), z.lte(10)), 1.6),
});

export interface ScatterPoint {
  x: number;
  /** Clicks only: 0 = softest end of the adjuster, 1 = stiffest. */
  xNormalized: number | null;
  y: number;
  runId: string | null;
  /** Time points: the run's driver and number, so a point can be found on its event's page. */
  driver: { id: string; displayName: string } | null;
  runNumber: number | null;
  /** Wear points: the runs between the two readings. */
  runs: number | null;
  eventId: string | null;
  eventName: string | null;
  eventDate: string | null;
  setupId: string | null;
  setupLabel: string | null;
  corner: Corner | null;
}

export interface LineFit {
  slope: number;
  intercept: number;
  r2: number;
}

export interface ScatterResult {
  x: { param: ScatterParam; corner: CornerOrAxle; unit: string };
  y: { metric: ScatterMetric; unit: string; description: string };
  points: ScatterPoint[];
  n: number;
  /** Null with fewer than 3 points or no spread in x. */
  fit: LineFit | null;
  /**
   * Wear only (0 for time): the intervals between two tread readings left out because their runs were on more than
   * one value of the setting, so the wear cannot be credited to one value. Absent from answers before it was added.
   */
  leftOut?: { mixedSetting: number };
  /**
   * Time only (null for wear): each value of the setting with its runs, events, and the mean and spread of y, lowest
   * value first; and how many days the setting changed during the day with each value's runs in one block.
   */
  perValue?: { values: ValueSummary[]; runOrder: RunOrderCheck } | null;
  /**
   * Every event the car ran at, oldest first, whether or not it has a point in this plot: an event is drawn in the
   * same colour and shape in every plot. Absent from answers before it was added.
   */
  eventIds?: string[];
  /**
   * Other settings at the same corner or axle whose values moved with x across the points (|r| ≥ 0.7 between the
   * two, strongest first): a trend in the plot may be theirs as much as x's. Absent from answers before it was added.
   */
  alsoMoved?: { field: SetupCornerField; r: number }[];
}

export interface SampleStats {
  n: number;
  mean: number | null;
  sd: number | null;
}

export interface Comparison {
  before: SampleStats;
  after: SampleStats;
  difference: number | null;
  tStatistic: number | null;
  degreesOfFreedom: number | null;
  pValue: number | null;
  enough: boolean;
  /** The verdict in words, in the API's units (mm, %). */
  verdict: string;
  /**
   * What was measured, which way is better and what each group counts (runs, or intervals between two tread
   * readings): enough for a client to say the verdict again in the user's units.
   */
  about?: { what: string; betterWhen: BetterWhen; counted: string };
}

export interface CompareResult {
  splitAt: string;
  change: { id: string; what: string; changedOn: string } | null;
  corners: Record<Corner, { wear: Comparison; innerWear: Comparison; skew: Comparison }>;
  /**
   * Time is compared within the days a driver ran on both sides of the change: `days` is how many events had such
   * a day, `leftOut` how many clean runs fell on days wholly before or after it.
   */
  time: Comparison;
  timeScope: { days: number; leftOut: number };
}

export interface SeasonResult {
  carId: string;
  events: {
    eventId: string;
    name: string;
    date: string;
    venue: string | null;
    drivers: { driver: { id: string; displayName: string }; bestRawSec: number | null; bestAdjustedSec: number | null; runCount: number; cones: number; classPosition: number | null }[];
  }[];
  setupChanges: { setupId: string; label: string; effectiveFrom: string; createdBy: string; changes: SetupChange[] }[];
  changeLog: { id: string; changedOn: string; what: string; location: string; setupId: string | null }[];
  tyreLife: {
    tyreSetId: string;
    label: string;
    minDepthMm: number;
    latestReadingAt: string | null;
    worst: { corner: Corner; position: 'inner' | 'middle' | 'outer'; depthMm: number } | null;
    mmPerRun: number | null;
    r2: number | null;
    n: number;
    /** Runs left now: those left at the latest reading, less the runs made on the set since it. */
    runsLeft: number | null;
    /** Runs made on the set since its latest reading (0 without a reading). */
    runsSinceReading: number;
    /**
     * The latest change of camber, toe or caster at the worst spot's corner while this tyre was read: `since`, the
     * line starts at the last reading before it; `whole`, too few readings since, so every reading is used.
     */
    alignmentChange: { at: string; label: string; fitted: 'since' | 'whole' } | null;
  }[];
}
