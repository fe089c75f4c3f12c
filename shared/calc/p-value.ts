/**
 * A p-value as the app writes it, in the sentence under a comparison and on the line beside it alike: two
 * significant figures ("p = 0.0055", "p = 0.08"), and "p < 0.001" below that.
 */
export function formatP(p: number): string {
  if (p < 0.001) return 'p < 0.001';
  return `p = ${Number(p.toPrecision(2))}`;
}
