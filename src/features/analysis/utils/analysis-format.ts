import type { ScatterMetric, ScatterParam, ScatterPoint, ScatterResult } from '@shared/analysis/analysis.schema';
import { formatFixed } from '@shared/calc/display';
import {
  formatQuantity,
  SI_UNITS,
  toDisplay,
  UNIT_SYMBOLS,
  unitFor,
  type Quantity,
  type UnitPreferences,
} from '@shared/calc/units.calc';
import { formatPercent, tidy } from '@/lib/numbers';

/*
 * Analysis values in the user's units. The server sends SI (°, N/mm, kPa, mm, mm per run, %); every value is
 * converted with the shared unit functions before it is drawn or written.
 */

/**
 * Each setting on the x axis: `label` heads a field or a column ("Clicks"); `inSentence` names it in a sentence after
 * the axle or corner ("Time for each value of rear damper clicks").
 */
export const PARAM_INFO: Record<ScatterParam, { label: string; inSentence: string; quantity: Quantity | null }> = {
  camber: { label: 'Camber', inSentence: 'camber', quantity: 'angle' },
  springRate: { label: 'Spring rate', inSentence: 'spring rate', quantity: 'springRate' },
  damperClicks: { label: 'Clicks', inSentence: 'damper clicks', quantity: null },
  coldPressure: { label: 'Cold pressure', inSentence: 'cold pressure', quantity: 'pressure' },
  rideHeight: { label: 'Ride height', inSentence: 'ride height', quantity: 'length' },
};

export const METRIC_INFO: Record<ScatterMetric, { label: string }> = {
  time: { label: "Time: % off the day's best" },
  wear: { label: 'Wear per run' },
  wearSkew: { label: 'Inner minus outer wear per run' },
};

/** A minus sign that reads as one ("−0.012"), not a hyphen. */
const signed = (text: string) => text.replace(/^-/, '−');

/** A chart axis's tick: up to three decimals, no trailing zeros, a true minus: "−2.5", "0.125", "3". */
export const axisTick = (v: number) => signed(String(Number(v.toFixed(3))));

/** "mm per run" or "1/32 in per run", in the user's tread-depth unit. */
export function rateUnitWords(units: UnitPreferences): string {
  return unitFor('treadDepth', units) === 'in32' ? '1/32 in per run' : 'mm per run';
}

/** A wear rate (mm per run, SI) in the user's tread unit, to three decimals: "0.050 mm per run", "0.063/32 in per run". */
export function formatWearRate(mmPerRun: number, units: UnitPreferences): string {
  return `${wearRateNumber(mmPerRun, units)}${wearRateSuffix(units)}`;
}

/** A wear rate's number in the user's tread unit, without the unit: "0.050", "−0.012". */
export function wearRateNumber(mmPerRun: number, units: UnitPreferences): string {
  return formatFixed(tidy(toDisplay(mmPerRun, 'treadDepth', units)), 3);
}

/** The unit after a wear-rate number: " mm per run" or "/32 in per run" (as in "0.063/32 in per run"). */
export function wearRateSuffix(units: UnitPreferences): string {
  return unitFor('treadDepth', units) === 'in32' ? `${UNIT_SYMBOLS.in32} per run` : ' mm per run';
}

/** A wear rate as a plain number in the user's tread unit (for chart axes). */
export const wearRateInUnit = (mmPerRun: number, units: UnitPreferences) => toDisplay(mmPerRun, 'treadDepth', units);

const clicksText = (n: number) => {
  const text = Number.isInteger(n) ? String(n) : n.toFixed(1);
  return `${text} ${text === '1' ? 'click' : 'clicks'}`;
};

/** How one axis of the scatter plot turns a point into a number and into words. */
export interface Axis {
  /** Axis title with its unit: "Camber (°)", "Wear (mm per run)". */
  title: string;
  /** The column heading in the table: "Camber (°)". */
  short: string;
  value: (p: ScatterPoint) => number | null;
  format: (p: ScatterPoint) => string;
  /** An SI value on this axis (for the fitted line), in the plotted unit. */
  fromSi: (si: number) => number;
  /** Only whole values exist on it (clicks): ticked at whole numbers, with half a step of room at each end. */
  whole?: boolean;
}

/**
 * A setting's value in words and the user's unit: "7 clicks", "−1.50°", "28.0 psi". When the server's unit is not the
 * SI unit we expect, the number as sent, with its unit.
 */
export function settingText(x: Pick<ScatterResult['x'], 'param' | 'unit'>, value: number, units: UnitPreferences): string {
  const { quantity } = PARAM_INFO[x.param];
  if (quantity === null) return clicksText(value);
  if (x.unit !== UNIT_SYMBOLS[SI_UNITS[quantity]]) return `${value} ${x.unit}`;
  return formatQuantity(value, quantity, units);
}

/**
 * The x axis: the setup value in the user's unit, or for clicks optionally the share of the adjuster's range
 * (0 = softest). When the server's unit is not the SI unit we expect, the numbers are shown as sent, with its unit.
 */
export function xAxis(result: Pick<ScatterResult, 'x'>, units: UnitPreferences, normalized: boolean): Axis {
  const { label, quantity } = PARAM_INFO[result.x.param];
  if (result.x.param === 'damperClicks' && normalized) {
    return {
      title: 'Clicks: share of the range (0 = softest, 1 = stiffest)',
      short: 'Clicks (0 = softest, 1 = stiffest)',
      value: (p) => p.xNormalized,
      format: (p) => (p.xNormalized === null ? '—' : `${p.xNormalized.toFixed(2)} of the range (${clicksText(p.x)})`),
      fromSi: (si) => si,
    };
  }
  const format = (p: ScatterPoint) => settingText(result.x, p.x, units);
  if (quantity === null) {
    return { title: 'Damper clicks', short: 'Clicks', value: (p) => p.x, format, fromSi: (si) => si, whole: true };
  }
  if (result.x.unit !== UNIT_SYMBOLS[SI_UNITS[quantity]]) {
    return { title: `${label} (${result.x.unit})`, short: `${label} (${result.x.unit})`, value: (p) => p.x, format, fromSi: (si) => si };
  }
  const symbol = UNIT_SYMBOLS[unitFor(quantity, units)];
  return {
    title: `${label} (${symbol})`,
    short: `${label} (${symbol})`,
    value: (p) => toDisplay(p.x, quantity, units),
    format,
    fromSi: (si) => toDisplay(si, quantity, units),
  };
}

/** The y axis: % off the day's best (no unit to convert) or a wear rate in the user's tread unit. */
export function yAxis(result: Pick<ScatterResult, 'y'>, units: UnitPreferences): Axis {
  if (result.y.metric === 'time') {
    return { title: "% off the day's best", short: "Off the day's best (%)", value: (p) => p.y, format: (p) => formatPercent(p.y), fromSi: (si) => si };
  }
  const words = rateUnitWords(units);
  const label = result.y.metric === 'wear' ? 'Wear' : 'Inner minus outer wear';
  return {
    title: `${label} (${words})`,
    short: `${label} (${words})`,
    value: (p) => wearRateInUnit(p.y, units),
    format: (p) => formatWearRate(p.y, units),
    fromSi: (si) => wearRateInUnit(si, units),
  };
}

/** "Run", or "Over 6 runs" for a wear interval between two tread readings. */
export function runsText(p: ScatterPoint): string {
  if (p.runs === null) return p.runId ? '1 run' : '—';
  return `${p.runs} ${p.runs === 1 ? 'run' : 'runs'}`;
}

/** Where a change-log entry was made, in words. */
export const LOCATION_WORDS: Record<string, string> = {
  lf: 'left front',
  rf: 'right front',
  lr: 'left rear',
  rr: 'right rear',
  front: 'front',
  rear: 'rear',
  car: 'whole car',
};

/** Where a change made between events can be judged ("judge it …"), as % off the day's best cannot show it. */
export const BETWEEN_EVENTS_ADVICE = "against another car on the same days, such as on the team's class board if this car is entered in a team.";
