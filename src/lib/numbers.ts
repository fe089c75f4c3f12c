import {
  convert,
  formatInUnit,
  SI_UNITS,
  UNIT_DECIMALS,
  UNIT_SYMBOLS,
  unitFor,
  type Quantity,
  type UnitPreferences,
} from '@shared/calc/units.calc';

/** What a typed number turned out to be: nothing typed, a number, or not a number. */
export type ParsedDecimal = { kind: 'empty' } | { kind: 'number'; value: number } | { kind: 'invalid' };

/**
 * Reads a number as people type it at the car: "32.5", "32,5", "−1.2" (typographic minus), "+2".
 * Anything else is refused rather than guessed at.
 */
export function parseDecimal(text: string): ParsedDecimal {
  const s = text.trim().replace(/[−–]/g, '-').replace(',', '.');
  if (s === '') return { kind: 'empty' };
  if (!/^[-+]?(\d+\.?\d*|\.\d+)$/.test(s)) return { kind: 'invalid' };
  const value = Number(s);
  return Number.isFinite(value) ? { kind: 'number', value } : { kind: 'invalid' };
}

/**
 * The one message for a field whose text is not a number, with an example as the user would type it
 * (a hyphen for minus, the key every phone has: "-0.5"). Values the app shows use the true minus (formatSigned).
 */
export function typeANumber(example?: string): string {
  return example ? `Type a number, e.g. ${example}` : 'Type a number';
}

/** Removes the float noise a unit conversion leaves (1.5875000000000001 → 1.5875). */
export const tidy = (n: number) => Math.round(n * 1e6) / 1e6;

/** The symbol of the user's unit for a quantity: "psi", "mm", "/32 in". */
export function unitSymbol(quantity: Quantity, units: UnitPreferences): string {
  return UNIT_SYMBOLS[unitFor(quantity, units)];
}

/** An SI value as the user would type it, without the symbol: 220.632 kPa → "32.0" (psi). */
export function toInputText(siValue: number | null | undefined, quantity: Quantity, units: UnitPreferences): string {
  if (siValue === null || siValue === undefined) return '';
  const unit = unitFor(quantity, units);
  const text = convert(siValue, SI_UNITS[quantity], unit).toFixed(UNIT_DECIMALS[unit]);
  return /^-0(\.0*)?$/.test(text) ? text.slice(1) : text;
}

/** A typed value in the user's unit, in SI; null when nothing is typed; `invalid` when it is not a number. */
export function inputToSi(text: string, quantity: Quantity, units: UnitPreferences): number | null | 'invalid' {
  const parsed = parseDecimal(text);
  if (parsed.kind === 'empty') return null;
  if (parsed.kind === 'invalid') return 'invalid';
  return tidy(convert(parsed.value, unitFor(quantity, units), SI_UNITS[quantity]));
}

/**
 * A change (difference) between two SI values, in the user's unit, with ▲ or ▼: "▲ 0.5 psi", "▼ 0.20°"; "no change" when it
 * rounds to nothing in that unit.
 * Differences of linear units convert by the same factor as values (temperatures are never shown this way).
 */
export function formatDelta(deltaSi: number, quantity: Quantity, units: UnitPreferences): string {
  const unit = unitFor(quantity, units);
  const value = convert(Math.abs(deltaSi), SI_UNITS[quantity], unit);
  const text = formatInUnit(value, unit);
  // Not "± 0.0 mm", which reads as a tolerance.
  if (Number(value.toFixed(UNIT_DECIMALS[unit])) === 0) return 'no change';
  return `${deltaSi > 0 ? '▲' : '▼'} ${text}`;
}

/** A signed amount in the user's unit: "+2.0 psi", "−7 kPa" (typographic minus). */
export function formatSigned(valueInUnit: number, quantity: Quantity, units: UnitPreferences): string {
  const unit = unitFor(quantity, units);
  const text = formatInUnit(Math.abs(valueInUnit), unit);
  if (Number(Math.abs(valueInUnit).toFixed(UNIT_DECIMALS[unit])) === 0) return text;
  return `${valueInUnit > 0 ? '+' : '−'}${text}`;
}

/** "+1.84 %" for a percentage off the best; the best itself is "0.00 %". */
export function formatPercent(pct: number): string {
  const text = Math.abs(pct).toFixed(2);
  if (Number(text) === 0) return '0.00 %';
  return `${pct > 0 ? '+' : '−'}${text} %`;
}
