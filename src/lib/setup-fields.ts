/* How each per-corner setup value is named, measured and shown: the setup screens and the suggestions from shops share it. */
import type { Quantity, UnitPreferences } from '@shared/calc/units.calc';
import { formatQuantity, fromDisplay, toDisplay, UNIT_DECIMALS, unitFor } from '@shared/calc/units.calc';
import { LIMITS } from '@shared/season/limits';
import type { SetupCornerField } from '@shared/season/setup.schema';
import { formatDelta } from '@/lib/numbers';

export interface FieldInfo {
  label: string;
  /** The quantity the value measures; null for clicks (a count, no unit to convert). */
  quantity: Quantity | null;
  /** Can be below zero (phones then offer a minus key). */
  signed: boolean;
  /** Always-visible note under the field's grid. */
  note?: string;
  limits: { min: number; max: number };
}

/** Every per-corner setup value, in the order the editor and the displays list them. */
export const FIELD_INFO: Record<SetupCornerField, FieldInfo> = {
  camberDeg: { label: 'Camber', quantity: 'angle', signed: true, note: 'Negative: top of the wheel leans in.', limits: LIMITS.camberDeg },
  toeMm: { label: 'Toe', quantity: 'length', signed: true, note: 'Per wheel, toe-in positive.', limits: LIMITS.toeMm },
  casterDeg: { label: 'Caster', quantity: 'angle', signed: true, limits: LIMITS.casterDeg },
  springRateNPerMm: { label: 'Spring rate', quantity: 'springRate', signed: false, limits: LIMITS.springRateNPerMm },
  rideHeightMm: { label: 'Ride height', quantity: 'length', signed: false, limits: LIMITS.rideHeightMm },
  damperClicks: { label: 'Clicks', quantity: null, signed: false, note: 'Bump, or the only adjuster.', limits: LIMITS.damperClicks },
  damperReboundClicks: { label: 'Rebound clicks', quantity: null, signed: false, note: 'Double-adjustable dampers only.', limits: LIMITS.damperClicks },
  coldPressureKpa: { label: 'Cold pressure', quantity: 'pressure', signed: false, limits: LIMITS.pressureKpa },
  cornerWeightKg: { label: 'Corner weight', quantity: 'mass', signed: false, limits: LIMITS.cornerWeightKg },
};

/** "1 click", "6 clicks". */
export const clicks = (n: number) => `${n} ${Math.abs(n) === 1 ? 'click' : 'clicks'}`;

/** A stored (SI) value in the user's units: "−1.20°", "31.9 psi", "12 clicks"; "—" when not recorded. */
export function formatFieldValue(field: SetupCornerField, si: number | null | undefined, units: UnitPreferences): string {
  const { quantity } = FIELD_INFO[field];
  if (si === null || si === undefined) return '—';
  return quantity ? formatQuantity(si, quantity, units) : clicks(si);
}

/** A change in the user's units with ▲/▼: "▲ 0.5 psi", "▼ 2 clicks". */
export function formatFieldDelta(field: SetupCornerField, deltaSi: number, units: UnitPreferences): string {
  const { quantity } = FIELD_INFO[field];
  if (quantity) return formatDelta(deltaSi, quantity, units);
  if (deltaSi === 0) return 'no change';
  return `${deltaSi > 0 ? '▲' : '▼'} ${clicks(Math.abs(deltaSi))}`;
}

/**
 * The change between two stored values as the pair is shown: each is rounded in the user's unit first, so the change
 * adds up with the two numbers beside it ("29.0 → 27.6 psi, ▼ 1.4 psi"; −10 kPa on its own would read ▼ 1.5 psi).
 */
export function formatFieldChange(field: SetupCornerField, fromSi: number, toSi: number, units: UnitPreferences): string {
  const { quantity } = FIELD_INFO[field];
  if (!quantity) return formatFieldDelta(field, toSi - fromSi, units);
  const decimals = UNIT_DECIMALS[unitFor(quantity, units)];
  const shown = (si: number) => Number(toDisplay(si, quantity, units).toFixed(decimals));
  const deltaSi = fromDisplay(shown(toSi) - shown(fromSi), quantity, units);
  if (field === 'camberDeg') return camberChangeWords(deltaSi, [fromSi, toSi], units);
  return formatFieldDelta(field, deltaSi, units);
}

/**
 * A camber change in words, since an arrow up for "less negative" reads to a racer as "more camber": "0.60° less
 * negative" or "0.30° more negative" while the values stay negative, "more/less positive" while they stay positive,
 * and "toward positive/negative" across zero or when the values are not known.
 */
export function camberChangeWords(deltaSi: number, valuesSi: readonly number[], units: UnitPreferences): string {
  const amount = formatDelta(deltaSi, 'angle', units);
  if (!/^[▲▼]/.test(amount)) return amount;
  const size = amount.replace(/^[▲▼] /, '');
  const up = deltaSi > 0;
  if (valuesSi.length > 0 && valuesSi.every((v) => v <= 0)) return `${size} ${up ? 'less negative' : 'more negative'}`;
  if (valuesSi.length > 0 && valuesSi.every((v) => v >= 0)) return `${size} ${up ? 'more positive' : 'less positive'}`;
  return `${size} toward ${up ? 'positive' : 'negative'}`;
}
