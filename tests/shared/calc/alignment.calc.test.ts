import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { unit as mathUnit } from 'mathjs';
import { camberDeg, toeAngleDeg, toeLengthMm } from '../../../shared/calc/alignment.calc';
import { convert } from '../../../shared/calc/units.calc';
import { expectClose, expectToDigits } from './expect-digits';

// θ = atan(L/D) per wheel, total = sum; camber negative when the top leans inboard. Sources: SAE J670 Vehicle
// Dynamics Terminology (sign conventions, from memory); alignment shop guides (x = D·sin θ per side). Worked values: the same, computed by hand.
const SOURCE = 'alignment shop guides, x = D·sin θ; SAE J670 signs (from memory)';
const inch = (x: number) => convert(x, 'in', 'mm');

describe('toeAngleDeg / toeLengthMm', () => {
  it(`when one wheel toes in 1/16 in across 24 in, then 0.1492° (${SOURCE})`, () => {
    expectToDigits(toeAngleDeg({ toeMm: inch(1 / 16), diameterMm: inch(24) }), '0.1492');
  });

  it(`when one wheel should toe 0.15° across 24 in, then 0.0628 in front-minus-rear (${SOURCE})`, () => {
    expectToDigits(convert(toeLengthMm({ angleDeg: 0.15, diameterMm: inch(24) }), 'mm', 'in'), '0.0628');
  });

  it(`when the car has 2 mm total toe-in at a 17 in rim (1 mm a wheel), then 0.2654° total (${SOURCE})`, () => {
    const perWheel = toeAngleDeg({ toeMm: 1, diameterMm: 431.8 });
    expectToDigits(perWheel + perWheel, '0.2654');
  });

  it('when 2 mm total is converted, then the "mm per degree = πD/360" rule (0.5308°, twice too big) is NOT what comes back (a radius/diameter mix-up)', () => {
    const total = 2 * toeAngleDeg({ toeMm: 1, diameterMm: 431.8 });
    const wrongRule = 2 / ((Math.PI * 431.8) / 360);
    expectToDigits(wrongRule, '0.5308');
    expect(Math.abs(total - wrongRule)).toBeGreaterThan(0.2);
    // …while the correct small-angle rule, mm per degree = πD/180, agrees to 1e-5°
    expect(Math.abs(total - 2 / ((Math.PI * 431.8) / 180))).toBeLessThan(1e-5);
  });

  it('when a toe length is turned into an angle, then mathjs\'s atan in radians converted to degrees agrees (independent oracle)', () => {
    fc.assert(
      fc.property(fc.double({ min: -20, max: 20, noNaN: true }), fc.double({ min: 300, max: 800, noNaN: true }), (toe, d) => {
        expectClose(toeAngleDeg({ toeMm: toe, diameterMm: d }), mathUnit(Math.atan(toe / d), 'rad').toNumber('deg'), 1e-12, 1e-15);
      }),
    );
  });

  it('when a toe length becomes an angle and back, then the length returns; and angle → length → angle too (property)', () => {
    fc.assert(
      fc.property(fc.double({ min: -20, max: 20, noNaN: true }), fc.double({ min: 300, max: 800, noNaN: true }), fc.double({ min: -3, max: 3, noNaN: true }), (toe, d, angle) => {
        expectClose(toeLengthMm({ angleDeg: toeAngleDeg({ toeMm: toe, diameterMm: d }), diameterMm: d }), toe, 1e-12, 1e-12);
        expectClose(toeAngleDeg({ toeMm: toeLengthMm({ angleDeg: angle, diameterMm: d }), diameterMm: d }), angle, 1e-12, 1e-12);
      }),
    );
  });

  it('when the wheel toes out, then the angle is negative, the mirror of the same toe-in (property, SAE J670 sign, from memory)', () => {
    fc.assert(
      fc.property(fc.double({ min: 0.01, max: 20, noNaN: true }), fc.double({ min: 300, max: 800, noNaN: true }), (toe, d) => {
        const toeIn = toeAngleDeg({ toeMm: toe, diameterMm: d });
        expect(toeIn).toBeGreaterThan(0);
        expect(toeAngleDeg({ toeMm: -toe, diameterMm: d })).toBe(-toeIn);
      }),
    );
  });

  it('when the diameter is not above 0, then a RangeError', () => {
    expect(() => toeAngleDeg({ toeMm: 1, diameterMm: 0 })).toThrow(RangeError);
    expect(() => toeLengthMm({ angleDeg: 0.1, diameterMm: -5 })).toThrow(RangeError);
    expect(() => toeLengthMm({ angleDeg: 90, diameterMm: 400 })).toThrow(RangeError);
  });
});

describe('camberDeg', () => {
  it(`when the top sits 10 mm inboard over 431.8 mm, then −1.3267° (${SOURCE})`, () => {
    expectToDigits(camberDeg({ topInboardMm: 10, heightMm: 431.8 }), '-1.3267');
  });

  it('when the wheel is upright, then 0° (no minus sign)', () => {
    expect(Object.is(camberDeg({ topInboardMm: 0, heightMm: 431.8 }), 0)).toBe(true);
  });

  it('when the top leans inboard, then camber is negative; outboard, then positive — the same size either way (property)', () => {
    fc.assert(
      fc.property(fc.double({ min: 0.01, max: 40, noNaN: true }), fc.double({ min: 200, max: 800, noNaN: true }), (dx, h) => {
        const inboard = camberDeg({ topInboardMm: dx, heightMm: h });
        expect(inboard).toBeLessThan(0);
        expect(camberDeg({ topInboardMm: -dx, heightMm: h })).toBe(-inboard);
        expectClose(inboard, -mathUnit(Math.atan2(dx, h), 'rad').toNumber('deg'), 1e-12);
      }),
    );
  });
});
