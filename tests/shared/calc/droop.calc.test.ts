import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { bumpTravelAtWheelMm, compressedLengthCheck, droopCheck } from '../../../shared/calc/droop.calc';
import { convert, NEWTONS_PER_POUND_FORCE } from '../../../shared/calc/units.calc';
import { expectToDigits } from './expect-digits';

// F_s = F_w/MR; x_s = F_s/k_s; d_s = d_w·MR; seated iff x_s ≥ d_s; bump = (stroke − droop − bump stop)/MR.
// Common practice; worked values computed by hand.
const SOURCE = 'worked example by hand (common practice)';
const lbf = (x: number) => x * NEWTONS_PER_POUND_FORCE;
const lbfPerIn = (x: number) => convert(x, 'lbf/in', 'N/mm');
const inch = (x: number) => convert(x, 'in', 'mm');
const toIn = (x: number) => convert(x, 'mm', 'in');

describe('droopCheck', () => {
  it(`when 700 lb sits on a 500 lbf/in spring at MR 0.65 with 3.5 in of wheel droop, then x_s 2.154 in, 2.275 in at the spring, 0.121 in short (${SOURCE})`, () => {
    const r = droopCheck({ wheelLoadN: lbf(700), motionRatio: 0.65, springRateNPerMm: lbfPerIn(500), wheelDroopMm: inch(3.5) });
    expectToDigits(toIn(r.staticCompressionMm), '2.154');
    expectToDigits(toIn(r.droopAtSpringMm), '2.275');
    expectToDigits(toIn(r.shortfallMm), '0.121');
    expect(r.seated).toBe(false);
  });

  it(`when 800 lbf sits on 400 lbf/in at MR 1 with 1.5 in of droop, then x_s 2.0 in: seated, with 200 lbf left at full droop (${SOURCE})`, () => {
    const k = lbfPerIn(400);
    const r = droopCheck({ wheelLoadN: lbf(800), motionRatio: 1, springRateNPerMm: k, wheelDroopMm: inch(1.5) });
    expectToDigits(toIn(r.staticCompressionMm), '2.0');
    expect(r.seated).toBe(true);
    expect(r.shortfallMm).toBe(0);
    expectToDigits(((r.staticCompressionMm - r.droopAtSpringMm) * k) / NEWTONS_PER_POUND_FORCE, '200');
  });

  const input = fc.record({
    wheelLoadN: fc.double({ min: 500, max: 8000, noNaN: true }),
    motionRatio: fc.double({ min: 0.4, max: 1.2, noNaN: true }),
    springRateNPerMm: fc.double({ min: 20, max: 300, noNaN: true }),
    wheelDroopMm: fc.double({ min: 0, max: 150, noNaN: true }),
  });

  it('when any corner is checked, then seated ⇔ no shortfall, and shortfall = max(0, d_s − x_s) (property)', () => {
    fc.assert(
      fc.property(input, (i) => {
        const r = droopCheck(i);
        expect(r.seated).toBe(r.shortfallMm === 0);
        expect(r.shortfallMm).toBe(Math.max(0, r.droopAtSpringMm - r.staticCompressionMm));
        expect(r.staticCompressionMm * i.springRateNPerMm * i.motionRatio).toBeCloseTo(i.wheelLoadN, 6);
      }),
    );
  });

  it('when a seated spring is swapped for a softer one, then it stays seated (property: softer springs sit more compressed)', () => {
    fc.assert(
      fc.property(input, fc.double({ min: 0.2, max: 1, noNaN: true }), (i, f) => {
        fc.pre(droopCheck(i).seated);
        expect(droopCheck({ ...i, springRateNPerMm: i.springRateNPerMm * f }).seated).toBe(true);
      }),
    );
  });

  it('when the motion ratio is 0 or the spring rate negative, then a RangeError', () => {
    expect(() => droopCheck({ wheelLoadN: 3000, motionRatio: 0, springRateNPerMm: 80, wheelDroopMm: 50 })).toThrow(RangeError);
    expect(() => droopCheck({ wheelLoadN: 3000, motionRatio: 0.7, springRateNPerMm: -80, wheelDroopMm: 50 })).toThrow(RangeError);
  });
});

describe('bumpTravelAtWheelMm', () => {
  it(`when the stroke is 5.0 in with 2.0 in of droop at the damper and MR 0.65, then 4.615 in of bump at the wheel (${SOURCE})`, () => {
    expectToDigits(toIn(bumpTravelAtWheelMm({ strokeMm: inch(5), droopAtDamperMm: inch(2), motionRatio: 0.65 })), '4.615');
  });

  it('when a bump stop takes part of the stroke, then its length comes off before dividing by MR (common practice)', () => {
    const r = bumpTravelAtWheelMm({ strokeMm: 127, droopAtDamperMm: 50.8, bumpStopMm: 25, motionRatio: 0.65 });
    expect(r).toBeCloseTo((127 - 50.8 - 25) / 0.65, 12);
  });

  it('when droop and bump stop take more than the stroke, then a RangeError', () => {
    expect(() => bumpTravelAtWheelMm({ strokeMm: 100, droopAtDamperMm: 80, bumpStopMm: 30, motionRatio: 0.7 })).toThrow(/more than the damper stroke/);
  });
});

describe('compressedLengthCheck', () => {
  // Common practice: an adjustable damper's compressed length stays close to the original's — a little shorter
  // at most, around 13–16 mm (common practice).
  it.each([
    { compressed: 400, reference: 400, tolerance: undefined, difference: 0, within: true, why: 'the same length' },
    { compressed: 390, reference: 400, tolerance: undefined, difference: -10, within: true, why: '10 mm shorter (inside 13)' },
    { compressed: 387, reference: 400, tolerance: undefined, difference: -13, within: true, why: 'exactly 13 mm shorter' },
    { compressed: 385, reference: 400, tolerance: undefined, difference: -15, within: false, why: '15 mm shorter with the default 13' },
    { compressed: 385, reference: 400, tolerance: 16, difference: -15, within: true, why: '15 mm shorter with a 16 mm tolerance' },
    { compressed: 405, reference: 400, tolerance: undefined, difference: 5, within: false, why: 'longer than original (bottoms first)' },
  ])('when the damper is $why, then the difference is $difference mm and within = $within (common practice)', (row) => {
    const r = compressedLengthCheck({ compressedLengthMm: row.compressed, referenceLengthMm: row.reference, toleranceMm: row.tolerance });
    expect(r.differenceMm).toBeCloseTo(row.difference, 12);
    expect(r.withinTolerance).toBe(row.within);
  });

  it('when the lengths were typed in inches, then exactly ½ in shorter (12.7 mm) is within the default (property of the slack)', () => {
    const r = compressedLengthCheck({ compressedLengthMm: inch(15.5), referenceLengthMm: inch(16) });
    expect(r.withinTolerance).toBe(true);
  });

  it('when the difference is between −tolerance and 0, then within; otherwise not (property)', () => {
    fc.assert(
      fc.property(fc.integer({ min: 200, max: 600 }), fc.integer({ min: -40, max: 20 }), fc.integer({ min: 0, max: 20 }), (ref, diff, tol) => {
        const r = compressedLengthCheck({ compressedLengthMm: ref + diff, referenceLengthMm: ref, toleranceMm: tol });
        expect(r.withinTolerance).toBe(diff <= 0 && diff >= -tol);
      }),
    );
  });
});
