/**
 * Plausible ranges: a value outside them is almost certainly a typo or a unit
 * mix-up (psi typed into a kPa field), so it is refused with a field error.
 */
export const LIMITS = {
  camberDeg: { min: -10, max: 5 },
  toeMm: { min: -20, max: 20 },
  casterDeg: { min: -5, max: 15 },
  springRateNPerMm: { min: 1, max: 1000 },
  rideHeightMm: { min: 0, max: 1000 },
  damperClicks: { min: 0, max: 100 },
  pressureKpa: { min: 50, max: 450 },
  cornerWeightKg: { min: 0, max: 2000 },
  /** Times are kept to the millisecond: anything shorter would be scored as 0 s. */
  rawTimeSec: { min: 0.001, maxExclusive: 1800 },
  cones: { min: 0, max: 50 },
  treadMm: { min: 0, max: 20 },
  /** A middle reading may exceed the set's starting depth by at most this much (gauge tolerance). */
  treadAboveStartMm: 1,
  conePenaltySec: { min: 0, max: 60 },
  temperatureC: { min: -40, max: 90 },
  motionRatio: { min: 0.1, max: 2 },
  damperPositions: { min: 1, max: 100 },
} as const;
