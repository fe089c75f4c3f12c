import { formatFixed } from '@shared/calc/display';
import { formatInUnit, fromDisplay, toDisplay, UNIT_DECIMALS, unitFor, type Quantity, type UnitPreferences } from '@shared/calc/units.calc';
import { parseDecimal, tidy, typeANumber } from '@/lib/numbers';

/*
 * Calculator fields: text typed in the user's unit, read into SI for the shared calculations, and results written
 * back in the user's unit. The calculations check their own inputs and throw errors that name the input
 * ("Motion ratio must be above 0"); those messages are shown beside the field they name.
 */

/** What one typed field holds. */
export type Reading = { kind: 'empty' } | { kind: 'value'; si: number } | { kind: 'invalid'; message: string };

/**
 * "Type a number, e.g. 400": each field gives a typical value of its own, shown in the user's unit to two
 * significant figures and written as it would be typed ("0.059", "-0.5").
 */
function notANumber(example: number): Reading {
  return { kind: 'invalid', message: typeANumber(String(Number(example.toPrecision(2)))) };
}

/** A field typed in the user's unit for a quantity, in SI; `exampleSi` is a typical value for it, in SI. */
export function readQuantity(text: string, quantity: Quantity, units: UnitPreferences, exampleSi: number): Reading {
  const parsed = parseDecimal(text);
  if (parsed.kind === 'empty') return { kind: 'empty' };
  if (parsed.kind === 'invalid') return notANumber(toDisplay(exampleSi, quantity, units));
  return { kind: 'value', si: fromDisplay(parsed.value, quantity, units) };
}

/** A field with no unit to convert (motion ratio, frequency in Hz, degrees); `example` is a typical value. */
export function readNumber(text: string, example: number): Reading {
  const parsed = parseDecimal(text);
  if (parsed.kind === 'empty') return { kind: 'empty' };
  if (parsed.kind === 'invalid') return notANumber(example);
  return { kind: 'value', si: parsed.value };
}

/**
 * A reading that must be above 0 (a scale reading, a length): 0 or less is the field's own error, said per field,
 * rather than a result worked out from it.
 */
export function aboveZero(reading: Reading, label: string): Reading {
  return reading.kind === 'value' && !(reading.si > 0) ? { kind: 'invalid', message: `${label} must be above 0` } : reading;
}

/** A value already known in SI (a result of another calculator), as a reading. */
export const knownValue = (si: number): Reading => ({ kind: 'value', si });

export type Outcome<T, K extends string> =
  /** A required field is empty: nothing to show yet (no error either). */
  | { status: 'incomplete'; errors: Partial<Record<K, string>> }
  | { status: 'ok'; value: T; errors: Partial<Record<K, string>> }
  /** A field is not a number, or the calculation refused the inputs; `message` when no one field is to blame. */
  | { status: 'error'; errors: Partial<Record<K, string>>; message: string | null };

/**
 * Runs a shared calculation on the typed fields. Fields that are not numbers get "Enter a number"; an error the
 * calculation throws goes to the field whose label starts its message (`blame`: message prefix → field), or to
 * the whole calculator when none matches.
 */
export function runCalc<K extends string, R extends K, T>(
  readings: Record<K, Reading>,
  required: readonly R[],
  compute: (values: Record<R, number> & Partial<Record<K, number>>) => T,
  blame: readonly (readonly [prefix: string, field: NoInfer<K>])[] = [],
): Outcome<T, K> {
  const errors: Partial<Record<K, string>> = {};
  const values: Partial<Record<K, number>> = {};
  let invalid = false;
  for (const key of Object.keys(readings) as K[]) {
    const reading = readings[key];
    if (reading.kind === 'invalid') {
      errors[key] = reading.message;
      invalid = true;
    } else if (reading.kind === 'value') {
      values[key] = reading.si;
    }
  }
  if (invalid) return { status: 'error', errors, message: null };
  if (required.some((key) => values[key] === undefined)) return { status: 'incomplete', errors };
  try {
    return { status: 'ok', value: compute(values as Record<R, number> & Partial<Record<K, number>>), errors };
  } catch (error) {
    const message = error instanceof Error ? error.message : String(error);
    const field = blame.find(([prefix]) => message.startsWith(prefix))?.[1];
    if (field !== undefined) return { status: 'error', errors: { [field]: message } as Partial<Record<K, string>>, message: null };
    return { status: 'error', errors, message };
  }
}

/**
 * An SI result in the user's unit with more decimals than the everyday display (a calculator's answer is read
 * closely): "211.3 lb/in", "37.00 N/mm", "0.063 in", "−1.327°". `signed` puts + on positive values.
 */
export function formatPrecise(
  si: number,
  quantity: Quantity,
  units: UnitPreferences,
  { extraDecimals = 1, signed = false }: { extraDecimals?: number; signed?: boolean } = {},
): string {
  const unit = unitFor(quantity, units);
  const value = tidy(toDisplay(si, quantity, units));
  let text = Math.abs(value).toFixed(UNIT_DECIMALS[unit] + extraDecimals);
  const zero = Number(text) === 0;
  // The unit's own symbol and spacing, as the everyday display writes them ("0 lb/in", "0°", "0/32 in").
  const suffix = formatInUnit(0, unit).replace(/^[\d.]+/, '');
  if (!zero && value < 0) text = `−${text}`;
  else if (!zero && signed) text = `+${text}`;
  return `${text}${suffix}`;
}

/** A plain number to a few decimals with a typographic minus: "1.72", "−0.50". */
export const formatNumber = formatFixed;

/** A percentage to two decimals: "50.38 %". */
export const formatPct = (pct: number) => `${formatNumber(pct, 2)} %`;
