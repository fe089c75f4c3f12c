/**
 * Tyre pressure against temperature at constant volume (Gay-Lussac's law): the
 * ratio of ABSOLUTE pressures equals the ratio of ABSOLUTE temperatures. Gauges
 * read pressure above the atmosphere, so the atmosphere is added before scaling
 * and taken away after. Real tyres rise a little less (the carcass stretches).
 */

export const STANDARD_ATMOSPHERE_KPA = 101.325;
const KELVIN_OFFSET = 273.15;

function scaleGauge(gaugeKpa: number, fromC: number, toC: number, atmosphericKpa: number): number {
  const fromK = fromC + KELVIN_OFFSET;
  const toK = toC + KELVIN_OFFSET;
  if (!(fromK > 0) || !(toK > 0)) throw new RangeError('Temperatures must be above absolute zero');
  if (!(atmosphericKpa > 0)) throw new RangeError('Atmospheric pressure must be above 0');
  return ((gaugeKpa + atmosphericKpa) * toK) / fromK - atmosphericKpa;
}

export function hotPressureKpa(input: { coldGaugeKpa: number; coldTempC: number; hotTempC: number; atmosphericKpa?: number }): number {
  return scaleGauge(input.coldGaugeKpa, input.coldTempC, input.hotTempC, input.atmosphericKpa ?? STANDARD_ATMOSPHERE_KPA);
}

export function coldPressureKpa(input: { hotGaugeKpa: number; hotTempC: number; coldTempC: number; atmosphericKpa?: number }): number {
  return scaleGauge(input.hotGaugeKpa, input.hotTempC, input.coldTempC, input.atmosphericKpa ?? STANDARD_ATMOSPHERE_KPA);
}
