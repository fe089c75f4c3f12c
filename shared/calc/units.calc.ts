/**
 * Every unit conversion in Scrubline. Values are stored and sent in SI (the SI
 * unit of each quantity below); the client converts for display and for input.
 *
 * Factors are the exact definitions (NIST SP 811 App. B; NIST Handbook 44 App. C;
 * the 1959 international yard and pound agreement), and the derived ones (psi,
 * lbf/in) are computed from them, never typed in rounded.
 */
import * as z from '../zod';
import { formatFixed } from './display';

// ── Exact definitions ────────────────────────────────────────────────────────
export const MM_PER_INCH = 25.4;
export const KG_PER_POUND = 0.45359237;
/** Standard acceleration of gravity g_n, m/s². */
export const STANDARD_GRAVITY = 9.80665;
/** 1 lbf = 1 lb × g_n = 4.448 221 615 260 5 N. */
export const NEWTONS_PER_POUND_FORCE = KG_PER_POUND * STANDARD_GRAVITY;
/** 1 kgf = 1 kg × g_n. */
export const NEWTONS_PER_KILOGRAM_FORCE = STANDARD_GRAVITY;
/** 1 psi = 1 lbf/in² = 6.894 757 293 168… kPa (N/mm² is MPa, × 1000 for kPa). */
export const KPA_PER_PSI = (NEWTONS_PER_POUND_FORCE / (MM_PER_INCH * MM_PER_INCH)) * 1000;
export const KPA_PER_BAR = 100;

// ── Units ────────────────────────────────────────────────────────────────────
export type Unit =
  | 'kPa'
  | 'psi'
  | 'bar'
  | 'mm'
  | 'in'
  /** 1/32 inch, the tread-depth unit. */
  | 'in32'
  | 'kg'
  | 'lb'
  | 'N/mm'
  | 'lbf/in'
  | 'kgf/mm'
  | 'degC'
  | 'degF'
  /** Plane angle in degrees (camber, caster). */
  | 'deg'
  /** Time in seconds. */
  | 's';

/** What a unit measures physically; units of the same dimension convert into each other. */
type Dimension = 'pressure' | 'length' | 'mass' | 'springRate' | 'temperature' | 'angle' | 'time';

interface UnitDefinition {
  dimension: Dimension;
  /** Multiply by this to get the dimension's SI unit (kPa, mm, kg, N/mm, °, s). Unused for temperatures (affine). */
  toSi: number;
  /** Shown after the number. */
  symbol: string;
  /** Decimals shown on screen. */
  decimals: number;
  /** Whether a space separates number and symbol ("32.0 psi", but "−1.25°" and "8.8/32 in"). */
  spaced: boolean;
}

const UNITS: Readonly<Record<Unit, UnitDefinition>> = {
  kPa: { dimension: 'pressure', toSi: 1, symbol: 'kPa', decimals: 0, spaced: true },
  bar: { dimension: 'pressure', toSi: KPA_PER_BAR, symbol: 'bar', decimals: 2, spaced: true },
  psi: { dimension: 'pressure', toSi: KPA_PER_PSI, symbol: 'psi', decimals: 1, spaced: true },
  mm: { dimension: 'length', toSi: 1, symbol: 'mm', decimals: 1, spaced: true },
  in: { dimension: 'length', toSi: MM_PER_INCH, symbol: 'in', decimals: 2, spaced: true },
  in32: { dimension: 'length', toSi: MM_PER_INCH / 32, symbol: '/32 in', decimals: 1, spaced: false },
  kg: { dimension: 'mass', toSi: 1, symbol: 'kg', decimals: 1, spaced: true },
  lb: { dimension: 'mass', toSi: KG_PER_POUND, symbol: 'lb', decimals: 0, spaced: true },
  'N/mm': { dimension: 'springRate', toSi: 1, symbol: 'N/mm', decimals: 1, spaced: true },
  'kgf/mm': { dimension: 'springRate', toSi: NEWTONS_PER_KILOGRAM_FORCE, symbol: 'kgf/mm', decimals: 2, spaced: true },
  'lbf/in': { dimension: 'springRate', toSi: NEWTONS_PER_POUND_FORCE / MM_PER_INCH, symbol: 'lb/in', decimals: 0, spaced: true },
  degC: { dimension: 'temperature', toSi: 1, symbol: '°C', decimals: 0, spaced: true },
  degF: { dimension: 'temperature', toSi: 1, symbol: '°F', decimals: 0, spaced: true },
  deg: { dimension: 'angle', toSi: 1, symbol: '°', decimals: 2, spaced: false },
  s: { dimension: 'time', toSi: 1, symbol: 's', decimals: 3, spaced: true },
};

/** Every unit the app knows. */
export const ALL_UNITS = Object.keys(UNITS) as Unit[];

/** Display symbol per unit: kPa, bar, psi, mm, in, /32 in, N/mm, kgf/mm, lb/in, kg, lb, °C, °F, °, s. */
export const UNIT_SYMBOLS = Object.fromEntries(ALL_UNITS.map((u) => [u, UNITS[u].symbol])) as Readonly<Record<Unit, string>>;

/** Decimals shown on screen per unit (psi 1, kPa 0, bar 2, mm 1, in 2, /32 in 1, N/mm 1, lb/in 0, °C 0, °F 0, kg 1, lb 0 …). */
export const UNIT_DECIMALS = Object.fromEntries(ALL_UNITS.map((u) => [u, UNITS[u].decimals])) as Readonly<Record<Unit, number>>;

export function isUnit(value: unknown): value is Unit {
  return typeof value === 'string' && Object.hasOwn(UNITS, value);
}

function definitionOf(unit: Unit): UnitDefinition {
  if (!isUnit(unit)) throw new TypeError(`Unknown unit "${String(unit)}"`);
  return UNITS[unit];
}

/**
 * Converts a value from one unit to another of the same kind of quantity.
 * Temperatures are converted as points on the scale (20 °C → 68 °F), not as differences.
 * @throws TypeError when a unit is unknown or the two units measure different kinds of quantity.
 * @throws RangeError when the value is not a finite number.
 */
export function convert(value: number, from: Unit, to: Unit): number {
  const a = definitionOf(from);
  const b = definitionOf(to);
  if (a.dimension !== b.dimension) {
    throw new TypeError(`Cannot convert ${from} to ${to}: ${from} measures ${a.dimension}, ${to} measures ${b.dimension}`);
  }
  if (typeof value !== 'number' || !Number.isFinite(value)) {
    throw new RangeError(`Cannot convert ${String(value)} ${from}: the value must be a finite number`);
  }
  if (from === to) return value;
  if (a.dimension === 'temperature') {
    const celsius = from === 'degF' ? ((value - 32) * 5) / 9 : value;
    return to === 'degF' ? (celsius * 9) / 5 + 32 : celsius;
  }
  if (b.toSi === 1) return value * a.toSi;
  if (a.toSi === 1) return value / b.toSi;
  return (value * a.toSi) / b.toSi;
}

// ── Quantities (what a field means) and the units a user may choose for each ──
export type Quantity = 'pressure' | 'length' | 'treadDepth' | 'springRate' | 'mass' | 'temperature' | 'angle' | 'time';

/**
 * The units offered for each quantity, SI unit first. A toe value in mm is a length;
 * a camber or caster in degrees is an angle; tread depth has its own choices (1/32 in).
 */
export const QUANTITY_UNITS = {
  pressure: ['kPa', 'bar', 'psi'],
  length: ['mm', 'in'],
  treadDepth: ['mm', 'in32'],
  springRate: ['N/mm', 'kgf/mm', 'lbf/in'],
  mass: ['kg', 'lb'],
  temperature: ['degC', 'degF'],
  angle: ['deg'],
  time: ['s'],
} as const satisfies Record<Quantity, readonly [Unit, ...Unit[]]>;

/** A unit offered for quantity Q. */
export type QuantityUnit<Q extends Quantity> = (typeof QUANTITY_UNITS)[Q][number];

/** The unit a chosen quantity is stored and sent in. */
export const SI_UNITS = {
  pressure: 'kPa',
  length: 'mm',
  treadDepth: 'mm',
  springRate: 'N/mm',
  mass: 'kg',
  temperature: 'degC',
  angle: 'deg',
  time: 's',
} as const satisfies { [Q in Quantity]: QuantityUnit<Q> };

export const QUANTITIES = Object.keys(SI_UNITS) as Quantity[];

/** The unit the user reads and types each quantity in. */
export type UnitPreferences = { [Q in Quantity]: QuantityUnit<Q> };

export const METRIC_PREFERENCES: Readonly<UnitPreferences> = Object.freeze({ ...SI_UNITS });

export const IMPERIAL_PREFERENCES: Readonly<UnitPreferences> = Object.freeze({
  pressure: 'psi',
  length: 'in',
  treadDepth: 'in32',
  springRate: 'lbf/in',
  mass: 'lb',
  temperature: 'degF',
  angle: 'deg',
  time: 's',
});

const choiceMessage = (label: string, q: Quantity) =>
  `${label} unit must be ${QUANTITY_UNITS[q].map((u) => `'${u}'`).join(' or ')}`;

/** A user's unit preferences; every field optional, missing ones default to metric (SI). */
export const unitPreferencesSchema = z.strictObject({
  pressure: z._default(z.enum(QUANTITY_UNITS.pressure, { error: choiceMessage('Pressure', 'pressure') }), SI_UNITS.pressure),
  length: z._default(z.enum(QUANTITY_UNITS.length, { error: choiceMessage('Length', 'length') }), SI_UNITS.length),
  treadDepth: z._default(z.enum(QUANTITY_UNITS.treadDepth, { error: choiceMessage('Tread depth', 'treadDepth') }), SI_UNITS.treadDepth),
  springRate: z._default(z.enum(QUANTITY_UNITS.springRate, { error: choiceMessage('Spring rate', 'springRate') }), SI_UNITS.springRate),
  mass: z._default(z.enum(QUANTITY_UNITS.mass, { error: choiceMessage('Mass', 'mass') }), SI_UNITS.mass),
  temperature: z._default(z.enum(QUANTITY_UNITS.temperature, { error: choiceMessage('Temperature', 'temperature') }), SI_UNITS.temperature),
  angle: z._default(z.enum(QUANTITY_UNITS.angle, { error: choiceMessage('Angle', 'angle') }), SI_UNITS.angle),
  time: z._default(z.enum(QUANTITY_UNITS.time, { error: choiceMessage('Time', 'time') }), SI_UNITS.time),
});
export type UnitPreferencesInput = z.input<typeof unitPreferencesSchema>;

/**
 * The unit the user has chosen for a quantity.
 * @throws RangeError when the preference is not one of the quantity's choices (preferences not parsed with the schema).
 */
export function unitFor<Q extends Quantity>(quantity: Q, prefs: UnitPreferences): QuantityUnit<Q> {
  const choices: readonly Unit[] = QUANTITY_UNITS[quantity];
  if (choices === undefined) throw new TypeError(`Unknown quantity "${String(quantity)}"`);
  const unit = prefs[quantity];
  if (!choices.includes(unit)) {
    throw new RangeError(`'${String(unit)}' is not a unit for ${quantity}; choose ${choices.join(', ')}`);
  }
  return unit;
}

/** An SI value (as stored) in the user's chosen unit. */
export function toDisplay(siValue: number, quantity: Quantity, prefs: UnitPreferences): number {
  return convert(siValue, SI_UNITS[quantity], unitFor(quantity, prefs));
}

/** A value typed in the user's chosen unit, in SI (to store or send). */
export function fromDisplay(userValue: number, quantity: Quantity, prefs: UnitPreferences): number {
  return convert(userValue, unitFor(quantity, prefs), SI_UNITS[quantity]);
}

/**
 * A value already in `unit`, rounded to that unit's decimals, with its symbol, for people to read: "32.0 psi",
 * "−1.25°" (a true minus, U+2212, not the hyphen a form field takes), "8.8/32 in".
 */
export function formatInUnit(value: number, unit: Unit): string {
  const def = definitionOf(unit);
  if (!Number.isFinite(value)) throw new RangeError(`Cannot format ${String(value)} ${unit}: the value must be a finite number`);
  const text = formatFixed(value, def.decimals);
  return def.spaced ? `${text} ${def.symbol}` : `${text}${def.symbol}`;
}

/** An SI value for display in the user's unit, e.g. 220.632 kPa → "32.0 psi"; null or undefined → "—". */
export function formatQuantity(siValue: number | null | undefined, quantity: Quantity, prefs: UnitPreferences): string {
  if (siValue === null || siValue === undefined) return '—';
  const unit = unitFor(quantity, prefs);
  return formatInUnit(convert(siValue, SI_UNITS[quantity], unit), unit);
}
