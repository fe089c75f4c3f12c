/* Numbers as people read them on screen and paper (not as a form field takes them: see toInputText). */

/** A number to fixed decimals with a true minus (U+2212) below zero, and none for a value that rounds to zero ("-0.0"). */
export function formatFixed(value: number, decimals: number): string {
  const text = value.toFixed(decimals);
  return /^-0(\.0*)?$/.test(text) ? text.slice(1) : text.replace(/^-/, '\u2212');
}

/**
 * A p-value as the app writes it, in the sentence under a comparison and on the line beside it alike: two
 * significant figures ("p = 0.0055", "p = 0.08"), and "p < 0.001" below that.
 */
export function formatP(p: number): string {
  if (p < 0.001) return 'p < 0.001';
  return `p = ${Number(p.toPrecision(2))}`;
}
