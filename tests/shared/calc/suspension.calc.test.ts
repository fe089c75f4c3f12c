import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { divide, sqrt, unit as mathUnit, type Unit as MathUnit } from 'mathjs';
import { rideFrequencyHz, wheelRateForFrequencyNPerMm, wheelRateNPerMm } from '../../../shared/calc/suspension.calc';
import { convert } from '../../../shared/calc/units.calc';
import { expectClose, expectToDigits } from './expect-digits';

// Sources: Barton & Fieldhouse, Automotive Chassis Engineering (Springer 2018) §3.9 eqs 3.29–3.33 (k_w = k_s·MR²·cos²θ;
// f = (1/2π)√(k/m)); Mark Ortiz, Chassis Newsletter Jan 2002 (f = .159·√(S/m)). Worked values computed by hand from those equations.
const BARTON = 'Barton & Fieldhouse §3.9, eqs 3.29–3.33';
const lbfPerIn = (x: number) => convert(x, 'lbf/in', 'N/mm');
const toLbfPerIn = (x: number) => convert(x, 'N/mm', 'lbf/in');

describe('wheelRateNPerMm', () => {
  it(`when 500 lbf/in acts at MR 0.65, then 211.25 lbf/in = 36.9955 N/mm (${BARTON})`, () => {
    const k = wheelRateNPerMm({ springRateNPerMm: lbfPerIn(500), motionRatio: 0.65 });
    expectToDigits(toLbfPerIn(k), '211.25');
    expectToDigits(k, '36.9955');
  });

  it(`when 80 N/mm acts at MR 0.75 inclined 10°, then 43.643 N/mm, and the single-cos 44.316 is NOT returned (${BARTON})`, () => {
    const k = wheelRateNPerMm({ springRateNPerMm: 80, motionRatio: 0.75, springAngleDeg: 10 });
    expectToDigits(k, '43.643');
    const singleCos = 80 * 0.75 ** 2 * Math.cos((10 * Math.PI) / 180);
    expectToDigits(singleCos, '44.316'); // the common error, worked by hand
    expect(Math.abs(k - singleCos)).toBeGreaterThan(0.5);
  });

  it('when the motion ratio doubles, then the wheel rate quadruples; when the spring tilts, then it falls as cos² (property, k·MR²·cos²θ)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 5, max: 500, noNaN: true }),
        fc.double({ min: 0.2, max: 1.2, noNaN: true }),
        fc.double({ min: -60, max: 60, noNaN: true }),
        (k, mr, angle) => {
          const base = wheelRateNPerMm({ springRateNPerMm: k, motionRatio: mr });
          expectClose(wheelRateNPerMm({ springRateNPerMm: k, motionRatio: 2 * mr }), 4 * base, 1e-12);
          const tilted = wheelRateNPerMm({ springRateNPerMm: k, motionRatio: mr, springAngleDeg: angle });
          expectClose(tilted, base * Math.cos((angle * Math.PI) / 180) ** 2, 1e-12);
          expect(tilted).toBeLessThanOrEqual(base * (1 + 1e-12));
        },
      ),
    );
  });

  it.each([
    [{ springRateNPerMm: 80, motionRatio: 0 }],
    [{ springRateNPerMm: 80, motionRatio: -0.7 }],
    [{ springRateNPerMm: -80, motionRatio: 0.7 }],
    [{ springRateNPerMm: 80, motionRatio: 0.7, springAngleDeg: 90 }],
    [{ springRateNPerMm: Number.NaN, motionRatio: 0.7 }],
  ])('when the input %o is impossible, then a RangeError', (input) => {
    expect(() => wheelRateNPerMm(input)).toThrow(RangeError);
  });
});

describe('rideFrequencyHz / wheelRateForFrequencyNPerMm', () => {
  it(`when 211.25 lbf/in carries a 700 lb sprung corner, then 1.718 Hz (${BARTON})`, () => {
    const f = rideFrequencyHz({ wheelRateNPerMm: lbfPerIn(211.25), sprungMassKg: convert(700, 'lb', 'kg') });
    expectToDigits(f, '1.718');
  });

  it(`when 50 N/mm at MR 0.75 carries 350 kg, then 1.427 Hz (${BARTON})`, () => {
    const kw = wheelRateNPerMm({ springRateNPerMm: 50, motionRatio: 0.75 });
    expectToDigits(rideFrequencyHz({ wheelRateNPerMm: kw, sprungMassKg: 350 }), '1.427');
  });

  it(`when 300 kg should ride at 2.0 Hz, then the wheel rate is 47.374 N/mm (${BARTON})`, () => {
    expectToDigits(wheelRateForFrequencyNPerMm({ frequencyHz: 2, sprungMassKg: 300 }), '47.374');
  });

  it('when any rate and mass are given, then mathjs\'s √(k/m) in Hz over 2π agrees (independent oracle, unit algebra)', () => {
    fc.assert(
      fc.property(fc.double({ min: 5, max: 400, noNaN: true }), fc.double({ min: 50, max: 900, noNaN: true }), (k, m) => {
        const omega = sqrt(divide(mathUnit(k, 'N/mm'), mathUnit(m, 'kg')) as MathUnit) as unknown as MathUnit;
        expectClose(rideFrequencyHz({ wheelRateNPerMm: k, sprungMassKg: m }), omega.toNumber('Hz') / (2 * Math.PI), 1e-12);
      }),
    );
  });

  it('when checked against Ortiz\'s rounded rule f = .159·√(S/m), then within its 0.1 % rounding (Ortiz, Chassis Newsletter Jan 2002)', () => {
    const f = rideFrequencyHz({ wheelRateNPerMm: 36.9955, sprungMassKg: 317.515 });
    expectClose(f, 0.159 * Math.sqrt(36995.5 / 317.515), 1e-3);
  });

  it('when a tyre rate is given, then it acts in series: the frequency matches k_w·k_t/(k_w + k_t) and is lower (Barton & Fieldhouse §3.9)', () => {
    fc.assert(
      fc.property(fc.double({ min: 10, max: 300, noNaN: true }), fc.double({ min: 100, max: 600, noNaN: true }), fc.double({ min: 100, max: 600, noNaN: true }), (kw, kt, m) => {
        const series = (kw * kt) / (kw + kt);
        const withTyre = rideFrequencyHz({ wheelRateNPerMm: kw, sprungMassKg: m, tyreRateNPerMm: kt });
        expectClose(withTyre, rideFrequencyHz({ wheelRateNPerMm: series, sprungMassKg: m }), 1e-12);
        expect(withTyre).toBeLessThan(rideFrequencyHz({ wheelRateNPerMm: kw, sprungMassKg: m }));
      }),
    );
  });

  it('when a wheel rate is found for a frequency and fed back, then that frequency returns, with or without a tyre (property)', () => {
    fc.assert(
      fc.property(fc.double({ min: 0.8, max: 3.5, noNaN: true }), fc.double({ min: 100, max: 600, noNaN: true }), (f, m) => {
        const kw = wheelRateForFrequencyNPerMm({ frequencyHz: f, sprungMassKg: m });
        expectClose(rideFrequencyHz({ wheelRateNPerMm: kw, sprungMassKg: m }), f, 1e-12);
        const kt = 4 * kw; // a tyre stiffer than the ride rate
        const kwTyre = wheelRateForFrequencyNPerMm({ frequencyHz: f, sprungMassKg: m, tyreRateNPerMm: kt });
        expect(kwTyre).toBeGreaterThan(kw);
        expectClose(rideFrequencyHz({ wheelRateNPerMm: kwTyre, sprungMassKg: m, tyreRateNPerMm: kt }), f, 1e-9);
      }),
    );
  });

  it('when the frequency needs a ride rate at or above the tyre\'s, then a RangeError (no spring can give it)', () => {
    expect(() => wheelRateForFrequencyNPerMm({ frequencyHz: 2, sprungMassKg: 300, tyreRateNPerMm: 40 })).toThrow(RangeError);
  });

  it('when the mass or rate is zero or negative, then a RangeError', () => {
    expect(() => rideFrequencyHz({ wheelRateNPerMm: 30, sprungMassKg: 0 })).toThrow(RangeError);
    expect(() => rideFrequencyHz({ wheelRateNPerMm: -30, sprungMassKg: 300 })).toThrow(RangeError);
    expect(() => rideFrequencyHz({ wheelRateNPerMm: 30, sprungMassKg: 300, tyreRateNPerMm: 0 })).toThrow(RangeError);
    expect(() => wheelRateForFrequencyNPerMm({ frequencyHz: 0, sprungMassKg: 300 })).toThrow(RangeError);
  });
});
