/**
 * The public face of Scrubline's calculations: everything the client, the server and outside checks use.
 * Pure functions, SI units in and out (mm, N/mm, kg, N, degrees, kPa, °C, seconds).
 */
export * from './scoring.calc';
export * from './pressure.calc';
export * from './units.calc';
export * from './tyre.calc';
export * from './suspension.calc';
export * from './corner-weights.calc';
export * from './alignment.calc';
export * from './droop.calc';
export * from './wear.calc';
export * from './comparison.calc';
export * from './trend.calc';
export * from './build-sheet.calc';
export * from './invoice.calc';
