import { parseDecimal } from '@/lib/numbers';

/** How many minor units (cents) the currency's major unit has: 2 for USD and EUR, 0 for JPY. */
export function minorDigits(currency: string): number {
  try {
    return new Intl.NumberFormat('en', { style: 'currency', currency: currency.toUpperCase() }).resolvedOptions().maximumFractionDigits ?? 2;
  } catch {
    return 2;
  }
}

/** "12.50" typed in dollars → 1250 cents; null when empty, 'invalid' when not a number or finer than a cent. */
export function majorToCents(text: string, currency: string): number | null | 'invalid' {
  const parsed = parseDecimal(text);
  if (parsed.kind === 'empty') return null;
  if (parsed.kind === 'invalid') return 'invalid';
  const factor = 10 ** minorDigits(currency);
  const cents = parsed.value * factor;
  const rounded = Math.round(cents);
  if (Math.abs(cents - rounded) > 1e-6) return 'invalid';
  return rounded;
}

/** 1250 cents → "12.50", as it is typed back in. */
export function centsToMajorText(cents: number, currency: string): string {
  const digits = minorDigits(currency);
  return (cents / 10 ** digits).toFixed(digits);
}

/** 1250 cents → "$12.50" in the user's locale. */
export function formatMoney(cents: number, currency: string): string {
  const digits = minorDigits(currency);
  try {
    return new Intl.NumberFormat(undefined, { style: 'currency', currency: currency.toUpperCase() }).format(cents / 10 ** digits);
  } catch {
    return `${(cents / 10 ** digits).toFixed(digits)} ${currency.toUpperCase()}`;
  }
}
