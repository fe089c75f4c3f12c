/**
 * Invoice totals in whole cents (common practice for money: integers, never binary fractions).
 *
 * Each line's amount = quantity × unit price, rounded to the cent, halves away from zero;
 * subtotal = the sum of the line amounts; tax = subtotal × rate ÷ 100, rounded to the cent the same way;
 * total = subtotal + tax. Quantities count to the hundredth (1.25 h of labour) and tax rates to the
 * ten-thousandth of a percent (8.875 %); the arithmetic is exact (BigInt), so no half cent is lost to
 * floating point.
 */
import { requireFinite } from './input-checks.calc';

export interface InvoiceLineInput {
  /** Parts: how many; labour: hours. At most two decimals. */
  quantity: number;
  /** Price of one, or the hourly rate, in cents. */
  unitPriceCents: number;
}

export interface InvoiceTotals {
  /** Each line's amount in cents, in the order given. */
  lineCents: number[];
  subtotalCents: number;
  taxCents: number;
  totalCents: number;
}

const QUANTITY_SCALE = 100n;
/** Tax rates are held in ten-thousandths of a percent, so 100 % is 1 000 000 of them. */
const RATE_SCALE = 10_000n;
const PERCENT = 100n;

/** n ÷ d (d > 0) rounded to the nearest integer, halves away from zero. */
function divideRounded(n: bigint, d: bigint): bigint {
  const magnitude = ((n < 0n ? -n : n) * 2n + d) / (2n * d);
  return n < 0n ? -magnitude : magnitude;
}

/** The value × scale as an exact integer; a RangeError when it has more decimals than the scale holds. */
function scaled(label: string, value: number, scale: bigint, decimals: string): bigint {
  requireFinite(label, value);
  const x = value * Number(scale);
  const whole = Math.round(x);
  if (Math.abs(x - whole) > 1e-6 * Math.max(1, Math.abs(x))) throw new RangeError(`${label} may have at most ${decimals}`);
  if (!Number.isSafeInteger(whole)) throw new RangeError(`${label} is too large`);
  return BigInt(whole);
}

function toNumber(label: string, value: bigint): number {
  const n = Number(value);
  if (!Number.isSafeInteger(n)) throw new RangeError(`${label} is too large`);
  return n + 0;
}

/** One line's amount in cents: quantity × unit price, rounded to the cent, halves away from zero. */
export function invoiceLineCents(line: InvoiceLineInput): number {
  const quantity = scaled('Quantity', line.quantity, QUANTITY_SCALE, 'two decimals');
  const price = scaled('Unit price (cents)', line.unitPriceCents, 1n, 'no decimals');
  return toNumber('Line amount', divideRounded(quantity * price, QUANTITY_SCALE));
}

/**
 * A stored tax rate as invoices use it: to four decimals (rates are entered to at most three), so an odd stored
 * value neither stops an invoice nor the estimate of an open visit.
 */
export const roundedTaxRate = (ratePct: number): number => Math.round(ratePct * 10_000) / 10_000;

/** Line amounts, subtotal, tax at `taxRatePct` percent and total, all in cents. */
export function invoiceTotals(lines: readonly InvoiceLineInput[], taxRatePct: number): InvoiceTotals {
  const rate = scaled('Tax rate', taxRatePct, RATE_SCALE, 'four decimals');
  if (rate < 0n) throw new RangeError('Tax rate must be 0 or more');
  const lineCents = lines.map(invoiceLineCents);
  const subtotal = lineCents.reduce((sum, cents) => sum + BigInt(cents), 0n);
  const tax = divideRounded(subtotal * rate, RATE_SCALE * PERCENT);
  return {
    lineCents,
    subtotalCents: toNumber('Subtotal', subtotal),
    taxCents: toNumber('Tax', tax),
    totalCents: toNumber('Total', subtotal + tax),
  };
}
