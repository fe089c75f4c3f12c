import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { coldPressureKpa, hotPressureKpa } from '../../../shared/calc/pressure.calc';

// 1 psi = 6.894 757 293 168 kPa exactly (NIST SP 811 / Handbook 44 App. C); standard atmosphere 101.325 kPa.
const PSI = 6.894757293168;

describe('hotPressureKpa / coldPressureKpa (constant volume, absolute pressure and temperature)', () => {
  it('when 30 psi cold at 20 °C warms to 50 °C, then 34.574 psi (ideal gas law worked by hand); the naive 33.070 is not returned', () => {
    const hot = hotPressureKpa({ coldGaugeKpa: 30 * PSI, coldTempC: 20, hotTempC: 50 }) / PSI;
    expect(hot).toBeCloseTo(34.574, 3);
    expect(Math.abs(hot - (30 * 323.15) / 293.15)).toBeGreaterThan(1); // scaling the gauge reading is wrong
  });

  it('when 200 kPa at 15 °C warms to 60 °C, then 247.058 kPa', () => {
    expect(hotPressureKpa({ coldGaugeKpa: 200, coldTempC: 15, hotTempC: 60 })).toBeCloseTo(247.058, 3);
  });

  it('when 36 psi hot at 60 °C cools to 20 °C, then 29.913 psi cold', () => {
    expect(coldPressureKpa({ hotGaugeKpa: 36 * PSI, hotTempC: 60, coldTempC: 20 }) / PSI).toBeCloseTo(29.913, 3);
  });

  it('when 2.50e5 Pa gauge at 35.0 °C cools to −40.0 °C, then 1.64e5 Pa gauge (OpenStax College Physics §13.3, Problem 22)', () => {
    expect(coldPressureKpa({ hotGaugeKpa: 250, hotTempC: 35, coldTempC: -40 })).toBeCloseTo(164, 0);
  });

  it('when warmed then cooled back, then the pressure returns (property)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 50, max: 450, noNaN: true }),
        fc.double({ min: -20, max: 40, noNaN: true }),
        fc.double({ min: 0, max: 120, noNaN: true }),
        (p, cold, hot) => {
          const up = hotPressureKpa({ coldGaugeKpa: p, coldTempC: cold, hotTempC: hot });
          expect(coldPressureKpa({ hotGaugeKpa: up, hotTempC: hot, coldTempC: cold })).toBeCloseTo(p, 9);
        },
      ),
    );
  });
});
