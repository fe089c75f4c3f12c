import { formatInUnit, toDisplay, UNIT_DECIMALS, unitFor, type Unit, type UnitPreferences } from '@shared/calc/units.calc';
import { CORNERS, type Corner } from '@shared/season/corners';
import type { Setup, SetupCornerField } from '@shared/season/setup.schema';
import { clicks, FIELD_INFO } from '@/lib/setup-fields';

/**
 * A typical single step for each value in each unit a user may choose, for the example under "Change … by"
 * (common practice: half a degree of camber, a psi or 10 kPa of pressure, a couple of clicks).
 */
const STEPS: Record<SetupCornerField, Partial<Record<Unit, number>> & { clicks?: number }> = {
  camberDeg: { deg: 0.5 },
  casterDeg: { deg: 0.5 },
  toeMm: { mm: 1, in: 0.04 },
  rideHeightMm: { mm: 5, in: 0.25 },
  springRateNPerMm: { 'N/mm': 10, 'kgf/mm': 1, 'lbf/in': 50 },
  coldPressureKpa: { kPa: 10, bar: 0.1, psi: 1 },
  cornerWeightKg: { kg: 5, lb: 10 },
  damperClicks: { clicks: 2 },
  damperReboundClicks: { clicks: 2 },
};

/** The usual step for a value, in the user's unit (a count for clicks). */
export function exampleStep(field: SetupCornerField, units: UnitPreferences): number {
  const { quantity } = FIELD_INFO[field];
  return (quantity ? STEPS[field][unitFor(quantity, units)] : STEPS[field].clicks) ?? 1;
}

/**
 * How a change by an amount works, said with the value chosen, in the user's units, on a value the car has now: the
 * first chosen corner that has one recorded, else any corner that does. "Added to each corner’s value: −1.0 psi takes
 * LR’s 27.6 psi to 26.6 psi, +1.0 psi takes it to 28.6 psi."
 */
export function deltaHint(field: SetupCornerField, base: Pick<Setup, 'corners'>, chosen: readonly Corner[], units: UnitPreferences): string {
  const { quantity } = FIELD_INFO[field];
  const step = exampleStep(field, units);
  const unit = quantity ? unitFor(quantity, units) : null;
  // Worked in the unit shown, from the value as shown, so the example adds up as read.
  const shown = (si: number) => (unit && quantity ? Number(toDisplay(si, quantity, units).toFixed(UNIT_DECIMALS[unit])) : si);
  const say = (v: number) => (unit ? formatInUnit(v, unit) : clicks(v));
  const signed = (v: number) => `${v < 0 ? '−' : '+'}${say(Math.abs(v))}`;
  const tidy = (v: number) => Number(v.toFixed(unit ? UNIT_DECIMALS[unit] : 0));

  const order = [...CORNERS.filter((c) => chosen.includes(c)), ...CORNERS.filter((c) => !chosen.includes(c))];
  const at = order.find((c) => typeof base.corners[c]?.[field] === 'number');
  if (at === undefined) return `Added to each corner’s value: ${signed(-step)} lowers it, ${signed(step)} raises it.`;
  const now = shown(base.corners[at]![field]!);
  const lower = tidy(now - step);
  const higher = tidy(now + step);
  // A pressure, weight, rate or height cannot go below zero: the example then only raises it.
  const canLower = FIELD_INFO[field].signed || lower >= 0;
  return canLower
    ? `Added to each corner’s value: ${signed(-step)} takes ${at.toUpperCase()}’s ${say(now)} to ${say(lower)}, ${signed(step)} takes it to ${say(higher)}.`
    : `Added to each corner’s value: ${signed(step)} takes ${at.toUpperCase()}’s ${say(now)} to ${say(higher)}.`;
}

/** What to show in an empty "Change … by" box: a step the user could type ("-10", "-0.5"). */
export const examplePlaceholder = (field: SetupCornerField, units: UnitPreferences) => `e.g. -${exampleStep(field, units)}`;
