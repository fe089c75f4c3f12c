/** Whole minor units (cents) as money in the user's locale: 1250, 'usd' → "$12.50". */
export function formatMoney(cents: number, currency: string): string {
  const code = currency.toUpperCase();
  try {
    const format = new Intl.NumberFormat(undefined, { style: 'currency', currency: code });
    const digits = format.resolvedOptions().maximumFractionDigits ?? 2;
    return format.format(cents / 10 ** digits);
  } catch {
    return `${(cents / 100).toFixed(2)} ${code}`;
  }
}
