import * as z from '../zod';
import { isoDate, isoDateTime } from '../api/dates.schema';
import { perCorner, type Corner } from '../season/corners';
import { LIMITS } from '../season/limits';
import { versionSchema } from '../season/car.schema';
import { invoiceLineCents } from '../calc/invoice.calc';
import type { InvoiceStatus } from './invoice.schema';

/**
 * Shop service visits (work orders): what the shop was asked to do, the parts and labour,
 * the car measured before and after, the coilover build sheet, and the handover that
 * writes a new setup snapshot. SI units; money in whole cents.
 */

const range = (name: string, unit: string, min: number, max: number) =>
  z
    .number({ error: `${name} must be a number` })
    .check(z.gte(min, `${name} must be between ${min} and ${max} ${unit}`), z.lte(max, `${name} must be between ${min} and ${max} ${unit}`));
const clearable = <T extends z.ZodMiniType>(schema: T) => z.optional(z.nullable(schema));
const text = (max: number) => z.string().check(z.trim(), z.maxLength(max, `Use at most ${max} characters`));
const requestedWork = z
  .string({ error: 'Say what the customer asked for' })
  .check(z.trim(), z.minLength(1, 'Say what the customer asked for'), z.maxLength(2000, 'Use at most 2000 characters'));

export const WORK_ORDER_STATUSES = ['open', 'closed'] as const;
export type WorkOrderStatus = (typeof WORK_ORDER_STATUSES)[number];
export const STAGES = ['before', 'after'] as const;
export type Stage = (typeof STAGES)[number];
export const stageSchema = z.enum(STAGES);
export const LINE_KINDS = ['part', 'labour'] as const;
export type LineKind = (typeof LINE_KINDS)[number];

export const createWorkOrderInputSchema = z.strictObject({
  /** Client-made id, so a resend never opens a second visit. */
  id: z.optional(z.uuid()),
  /** Which of the caller's shops; defaults to the (first) one holding a grant on the car. */
  shopId: z.optional(z.uuid()),
  visitDate: isoDate(),
  requestedWork,
  notes: clearable(text(4000)),
});
export type CreateWorkOrderInput = z.infer<typeof createWorkOrderInputSchema>;

export const updateWorkOrderInputSchema = z.strictObject({
  visitDate: z.optional(isoDate()),
  requestedWork: z.optional(requestedWork),
  notes: clearable(text(4000)),
  version: versionSchema,
});
export type UpdateWorkOrderInput = z.infer<typeof updateWorkOrderInputSchema>;

export const workOrderListQuerySchema = z.strictObject({ status: z.optional(z.enum(WORK_ORDER_STATUSES)) });

/**
 * A part (quantity × unit price) or labour (hours × hourly rate). A part either stays on the car (camber arms, springs)
 * or is used up in the work (brake fluid, thread locker, shop supplies): both are billed, only parts that stay
 * become changes on the car. Labour is never used up.
 */
export const workOrderLineSchema = z
  .strictObject({
    kind: z.enum(LINE_KINDS, { error: 'Pick part or labour' }),
    description: z
      .string({ error: 'Describe the line' })
      .check(z.trim(), z.minLength(1, 'Describe the line'), z.maxLength(200, 'Use at most 200 characters')),
    /** Pieces for a part, hours for labour; up to two decimals. */
    quantity: z
      .number({ error: 'Quantity must be a number' })
      .check(
        z.gt(0, 'Quantity must be above 0'),
        z.lte(99999, 'Quantity must be at most 99999'),
        z.refine((q) => Math.abs(q * 100 - Math.round(q * 100)) < 1e-6, 'Use at most two decimals'),
      ),
    unitPriceCents: z
      .number({ error: 'Price must be a number of cents' })
      .check(z.int('Price must be a whole number of cents'), z.gte(0, 'Price cannot be negative'), z.lte(100_000_000, 'Price is too large')),
    /** True for a part used up in the work; left out or false, the part stays on the car. */
    usedUp: z.optional(z.boolean({ error: 'Say whether the part is used up: true or false' })),
  })
  .check(
    z.refine((l) => !(l.kind === 'labour' && l.usedUp === true), {
      message: 'Only a part can be used up, not labour',
      path: ['usedUp'],
    }),
  );
export type WorkOrderLineInput = z.infer<typeof workOrderLineSchema>;

/**
 * The most a visit's lines may add up to, in the currency's smallest unit: with the highest tax rate a shop can set
 * (50 %), the invoice's total still fits the 32-bit integer it is kept in (2 147 483 647).
 */
export const LINES_TOTAL_MAX_CENTS = 1_000_000_000;

/** The lines' amounts added up; null while a line is not a valid amount (its own field says why). */
function linesTotalCents(lines: readonly { quantity: number; unitPriceCents: number }[]): number | null {
  try {
    return lines.reduce((sum, l) => sum + invoiceLineCents(l), 0);
  } catch {
    return null;
  }
}

export const replaceLinesInputSchema = z.strictObject({
  lines: z
    .array(workOrderLineSchema)
    .check(
      z.maxLength(100, 'Use at most 100 lines'),
      z.refine((lines) => (linesTotalCents(lines) ?? 0) <= LINES_TOTAL_MAX_CENTS, 'These lines add up to more than one invoice can hold; split the work into smaller orders'),
    ),
});
export type ReplaceLinesInput = z.infer<typeof replaceLinesInputSchema>;

export const MEASUREMENT_FIELDS = ['camberDeg', 'toeMm', 'casterDeg', 'rideHeightMm', 'cornerWeightKg'] as const;
export type MeasurementField = (typeof MEASUREMENT_FIELDS)[number];

export const measurementCornerSchema = z.strictObject({
  camberDeg: clearable(range('Camber', '°', LIMITS.camberDeg.min, LIMITS.camberDeg.max)),
  /** Per wheel, toe-in positive. */
  toeMm: clearable(range('Toe', 'mm', LIMITS.toeMm.min, LIMITS.toeMm.max)),
  casterDeg: clearable(range('Caster', '°', LIMITS.casterDeg.min, LIMITS.casterDeg.max)),
  rideHeightMm: clearable(range('Ride height', 'mm', LIMITS.rideHeightMm.min, LIMITS.rideHeightMm.max)),
  cornerWeightKg: clearable(range('Corner weight', 'kg', LIMITS.cornerWeightKg.min, LIMITS.cornerWeightKg.max)),
});
export type MeasurementCorner = z.infer<typeof measurementCornerSchema>;

/** PUT …/measurements/:stage replaces that stage: how the car sat, and each corner's readings. */
export const measurementsInputSchema = z
  .strictObject({
    measuredAt: clearable(isoDateTime('Use a date and time such as 2026-06-12T16:30:00Z')),
    driverInCar: z.boolean({ error: 'Say whether the driver was in the car' }),
    driverWeightKg: clearable(range('Driver weight', 'kg', 20, 250)),
    fuelLevelPct: clearable(range('Fuel level', '%', 0, 100)),
    corners: z._default(perCorner(measurementCornerSchema), {}),
  })
  .check(
    z.refine((m) => !m.driverInCar || (m.driverWeightKg !== undefined && m.driverWeightKg !== null), {
      message: 'Give the driver\'s weight when they sat in the car',
      path: ['driverWeightKg'],
    }),
  );
export type MeasurementsInput = z.infer<typeof measurementsInputSchema>;

const length = (name: string) => clearable(range(name, 'mm', 0, 2000));
/** A spring's rate, in the range a setup takes: the main spring's goes into the setup handed over. */
const rate = (name: string) => clearable(range(name, 'N/mm', LIMITS.springRateNPerMm.min, LIMITS.springRateNPerMm.max));
const clicks = clearable(
  z
    .number({ error: 'Clicks must be a whole number' })
    .check(z.int('Clicks must be a whole number'), z.gte(0, 'Clicks cannot be negative'), z.lte(LIMITS.damperClicks.max, `Clicks must be at most ${LIMITS.damperClicks.max}`)),
);

/** One corner of a coilover build sheet. Every field optional: the sheet fills in as the work goes. */
export const buildSheetCornerSchema = z.strictObject({
  damperFreeLengthMm: length('Free length'),
  damperCompressedLengthMm: length('Compressed length'),
  /** What the compressed length is checked against, e.g. the original damper's. */
  referenceCompressedLengthMm: length('Reference length'),
  strokeMm: length('Stroke'),
  bodyLengthSetting: clearable(text(40)),
  mainSpringRateNPerMm: rate('Main spring rate'),
  mainSpringFreeLengthMm: length('Main spring free length'),
  helperSpringRateNPerMm: rate('Helper spring rate'),
  helperSpringFreeLengthMm: length('Helper spring free length'),
  perchPositionMm: length('Perch position'),
  preloadMm: clearable(range('Preload', 'mm', 0, 200)),
  bumpClicks: clicks,
  reboundClicks: clicks,
  /** Static load at the wheel, for the droop check. */
  wheelLoadKg: clearable(range('Wheel load', 'kg', 0, LIMITS.cornerWeightKg.max)),
  /** Wheel travel from ride height to full droop. */
  wheelDroopMm: clearable(range('Wheel droop', 'mm', 0, 500)),
  bumpStopMm: clearable(range('Bump stop', 'mm', 0, 500)),
  notes: clearable(text(500)),
});
export type BuildSheetCornerInput = z.infer<typeof buildSheetCornerSchema>;
export const BUILD_SHEET_FIELDS = [
  'damperFreeLengthMm', 'damperCompressedLengthMm', 'referenceCompressedLengthMm', 'strokeMm', 'bodyLengthSetting',
  'mainSpringRateNPerMm', 'mainSpringFreeLengthMm', 'helperSpringRateNPerMm', 'helperSpringFreeLengthMm',
  'perchPositionMm', 'preloadMm', 'bumpClicks', 'reboundClicks', 'wheelLoadKg', 'wheelDroopMm', 'bumpStopMm', 'notes',
] as const satisfies readonly (keyof BuildSheetCornerInput)[];
export type BuildSheetField = (typeof BUILD_SHEET_FIELDS)[number];

/** PUT …/build-sheet: the corners given replace those corners; corners left out stay as they are. */
export const buildSheetInputSchema = z.strictObject({ corners: perCorner(buildSheetCornerSchema) });
export type BuildSheetInput = z.infer<typeof buildSheetInputSchema>;

export const closeWorkOrderInputSchema = z.strictObject({
  handoverAt: isoDateTime('Use a date and time such as 2026-06-12T16:30:00Z'),
  /** The new setup's label; by default "<shop>: <requested work>". */
  label: z.optional(z.string().check(z.trim(), z.minLength(1, 'Give the setup a label'), z.maxLength(80, 'Use at most 80 characters'))),
});
export type CloseWorkOrderInput = z.infer<typeof closeWorkOrderInputSchema>;

/* ---------- Responses ---------- */

/** A visit on the driver's car timeline. */
/** Where a visit's invoice stands, for the lists: null until the shop makes it. */
export interface InvoiceStanding {
  number: number;
  status: InvoiceStatus;
  totalCents: number;
  currency: string;
}

export interface CarWorkOrderSummary {
  id: string;
  shop: { id: string; name: string };
  visitDate: string;
  requestedWork: string;
  status: WorkOrderStatus;
  handoverAt: string | null;
  setupId: string | null;
  invoice: InvoiceStanding | null;
}

/** A row of the shop's board. */
export interface ShopWorkOrderRow {
  id: string;
  car: { id: string; name: string };
  owner: { id: string; displayName: string };
  visitDate: string;
  requestedWork: string;
  status: WorkOrderStatus;
  handoverAt: string | null;
  invoice: InvoiceStanding | null;
}

export interface WorkOrderLine {
  kind: LineKind;
  description: string;
  quantity: number;
  unitPriceCents: number;
  /** A part used up in the work, billed but not fitted to the car; always false for labour. */
  usedUp: boolean;
  /** quantity × unit price, rounded to the cent. */
  totalCents: number;
}

export type MeasuredCorner = Record<MeasurementField, number | null>;

export interface WorkOrderStage {
  measuredAt: string | null;
  driverInCar: boolean;
  driverWeightKg: number | null;
  fuelLevelPct: number | null;
  corners: Record<Corner, MeasuredCorner>;
  /** Worked out from the four corner weights; null until all four are in. */
  balance: { totalKg: number; crossPct: number; frontPct: number; leftPct: number } | null;
}

/** after − before, per corner and field; null where either is missing. */
export type StageDiff = Record<Corner, Record<MeasurementField, number | null>>;

export type BuildSheetCorner = { [K in BuildSheetField]: K extends 'bodyLengthSetting' | 'notes' ? string | null : number | null };

export interface BuildSheetCornerChecks {
  compressedLength: { differenceMm: number; withinTolerance: boolean } | null;
  droop: { staticCompressionMm: number; droopAtSpringMm: number; seated: boolean; shortfallMm: number } | null;
  bumpTravelAtWheelMm: number | null;
  /** Inputs that could not be worked with, e.g. droop and bump stop longer than the stroke. */
  problems: string[];
}

export interface WorkOrder {
  id: string;
  carId: string;
  carName: string;
  /**
   * `currency`: the shop's, for every amount on the visit (ISO 4217, lower case); `taxRatePct`: the shop's tax rate
   * now, for the estimate shown while the visit is open (the invoice keeps the rate it was made with).
   */
  shop: { id: string; name: string; compressedLengthToleranceMm: number; currency: string; taxRatePct: number };
  openedBy: { id: string; displayName: string };
  visitDate: string;
  requestedWork: string;
  notes: string | null;
  status: WorkOrderStatus;
  handoverAt: string | null;
  closedBy: { id: string; displayName: string } | null;
  setupId: string | null;
  lines: WorkOrderLine[];
  totals: { partsCents: number; labourCents: number; subtotalCents: number };
  stages: Record<Stage, WorkOrderStage | null>;
  diff: StageDiff;
  buildSheet: {
    motionRatio: { front: number | null; rear: number | null };
    corners: Record<Corner, BuildSheetCorner | null>;
    checks: Record<Corner, BuildSheetCornerChecks | null>;
  };
  version: number;
  createdAt: string;
  updatedAt: string;
}
