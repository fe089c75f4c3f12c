/**
 * Trends over a season: the ordinary least-squares slope of y on x,
 * slope = Σ(x − x̄)(y − ȳ) / Σ(x − x̄)² (standard statistics; e.g. the NIST/SEMATECH
 * e-Handbook of Statistical Methods, "Linear least squares regression", from memory).
 */

/** The least-squares slope through [x, y] points; null with fewer than 2 points or when every x is the same. */
export function leastSquaresSlope(points: readonly (readonly [number, number])[]): number | null {
  if (points.length < 2) return null;
  const n = points.length;
  let sumX = 0;
  let sumY = 0;
  for (const [x, y] of points) {
    sumX += x;
    sumY += y;
  }
  const meanX = sumX / n;
  const meanY = sumY / n;
  let sxy = 0;
  let sxx = 0;
  for (const [x, y] of points) {
    sxy += (x - meanX) * (y - meanY);
    sxx += (x - meanX) ** 2;
  }
  if (sxx === 0) return null;
  return sxy / sxx;
}
