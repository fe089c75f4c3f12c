import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { lusolve } from 'mathjs';
import { CORNERS, cornerWeights, wedgeChange, type Corner, type CornerValues } from '../../../shared/calc/corner-weights.calc';
import { convert, STANDARD_GRAVITY } from '../../../shared/calc/units.calc';
import { expectClose, expectToDigits } from './expect-digits';

// Percentages: definitions, common practice (Hotchkis on weight distribution; Schroeder "Understanding Corner Weights");
// worked example computed by hand. Perch change: rigid-chassis statics, no published source (the app
// labels it an approximation); checked here against an independent first-principles solve with mathjs.
const CORNER_SOURCE = 'worked example by hand; common practice';

const CAR = { lf: 720, rf: 680, lr: 610, rr: 590 }; // "lb" scale readings; percentages do not depend on the unit

describe('cornerWeights', () => {
  it(`when LF 720, RF 680, LR 610, RR 590 are weighed, then 2600 total, 53.85 % front, 51.15 % left, 50.38 % cross (${CORNER_SOURCE})`, () => {
    const w = cornerWeights(CAR);
    expect(w.totalKg).toBe(2600);
    expectToDigits(w.frontPct, '53.85');
    expectToDigits(w.rearPct, '46.15');
    expectToDigits(w.leftPct, '51.15');
    expectToDigits(w.rightPct, '48.85');
    expectToDigits(w.crossPct, '50.38');
  });

  it('when cross is computed, then it is LF + RR (Scrubline\'s convention), NOT the oval-track "wedge" RF + LR (common practice)', () => {
    const w = cornerWeights({ lf: 300, rf: 250, lr: 250, rr: 300 });
    expect(w.crossPct).toBeCloseTo((600 / 1100) * 100, 12);
    expect(Math.abs(w.crossPct - (500 / 1100) * 100)).toBeGreaterThan(5);
  });

  const weights = fc.record({
    lf: fc.double({ min: 100, max: 1000, noNaN: true }),
    rf: fc.double({ min: 100, max: 1000, noNaN: true }),
    lr: fc.double({ min: 100, max: 1000, noNaN: true }),
    rr: fc.double({ min: 100, max: 1000, noNaN: true }),
  });

  it('when any car is weighed, then front + rear = left + right = 100 % and the percentages are shares of the total (property)', () => {
    fc.assert(
      fc.property(weights, (w) => {
        const s = cornerWeights(w);
        expectClose(s.frontPct + s.rearPct, 100, 1e-12);
        expectClose(s.leftPct + s.rightPct, 100, 1e-12);
        expectClose(s.totalKg, w.lf + w.rf + w.lr + w.rr, 1e-12);
        expectClose((s.crossPct / 100) * s.totalKg, w.lf + w.rr, 1e-12);
      }),
    );
  });

  it('when the car is mirrored left to right, then cross becomes 100 − cross and left becomes right (property)', () => {
    fc.assert(
      fc.property(weights, (w) => {
        const a = cornerWeights(w);
        const b = cornerWeights({ lf: w.rf, rf: w.lf, lr: w.rr, rr: w.lr });
        expectClose(b.crossPct, 100 - a.crossPct, 1e-12);
        expectClose(b.leftPct, a.rightPct, 1e-12);
      }),
    );
  });

  it('when every reading is scaled (kg ↔ lb), then the percentages do not change (property)', () => {
    fc.assert(
      fc.property(weights, fc.double({ min: 0.1, max: 10, noNaN: true }), (w, f) => {
        const a = cornerWeights(w);
        const b = cornerWeights({ lf: w.lf * f, rf: w.rf * f, lr: w.lr * f, rr: w.rr * f });
        expectClose(b.crossPct, a.crossPct, 1e-12);
        expectClose(b.frontPct, a.frontPct, 1e-12);
      }),
    );
  });

  it.each([
    [{ lf: 0, rf: 0, lr: 0, rr: 0 }, /more than 0/],
    [{ lf: 700, rf: -5, lr: 600, rr: 600 }, /Right front weight must be 0 or more/],
    [{ lf: Number.NaN, rf: 600, lr: 600, rr: 600 }, /Left front weight must be a number/],
  ])('when the readings are %o, then a RangeError (%s)', (w, message) => {
    expect(() => cornerWeights(w)).toThrow(RangeError);
    expect(() => cornerWeights(w)).toThrow(message);
  });
});

/**
 * Independent oracle: a rigid chassis on four springs, solved from first principles with mathjs. Unknowns: heave z,
 * roll φ, pitch θ of the chassis; load change at each corner ΔF = k·(δ_corner − (z + y·φ + x·θ)). Equilibrium: the
 * load changes sum to zero and their roll and pitch moments are zero (the car's weight does not change).
 */
function rigidChassisOracle(k: CornerValues, corner: Corner, deltaMm: number, tf: number, tr: number, a: number, b: number): CornerValues {
  const pos: Record<Corner, { x: number; y: number }> = {
    lf: { x: a, y: tf / 2 },
    rf: { x: a, y: -tf / 2 },
    lr: { x: -b, y: tr / 2 },
    rr: { x: -b, y: -tr / 2 },
  };
  // Σ k(1, y, x)·(1, y, x)ᵀ · [z φ θ] = Σ k·δ·(1, y, x)
  const A = [
    [0, 0, 0],
    [0, 0, 0],
    [0, 0, 0],
  ];
  const rhs = [0, 0, 0];
  for (const c of CORNERS) {
    const v = [1, pos[c].y, pos[c].x];
    const d = c === corner ? deltaMm : 0;
    for (let i = 0; i < 3; i++) {
      rhs[i]! += k[c] * d * v[i]!;
      for (let j = 0; j < 3; j++) A[i]![j]! += k[c] * v[i]! * v[j]!;
    }
  }
  const [z, phi, theta] = (lusolve(A, rhs) as number[][]).map((r) => r[0]!);
  const out = { lf: 0, rf: 0, lr: 0, rr: 0 };
  for (const c of CORNERS) {
    const d = c === corner ? deltaMm : 0;
    out[c] = (k[c] * (d - (z! + pos[c].y * phi! + pos[c].x * theta!))) / STANDARD_GRAVITY;
  }
  return out;
}

describe('wedgeChange', () => {
  const k200 = convert(200, 'lbf/in', 'N/mm');
  const allK200 = { lf: k200, rf: k200, lr: k200, rr: k200 };

  it('when LF is raised 0.25 in on 200 lbf/in all round, then X = 12.5 lb: LF and RR gain, RF and LR lose (rigid-chassis statics, worked by hand)', () => {
    const change = wedgeChange({ wheelRatesNPerMm: allK200, corner: 'lf', wheelOffsetMm: convert(0.25, 'in', 'mm') });
    for (const [c, sign] of [['lf', 1], ['rf', -1], ['lr', -1], ['rr', 1]] as const) {
      expectToDigits(convert(change[c], 'kg', 'lb'), String(12.5 * sign));
    }
  });

  it('when that change is applied to the 2600 lb car, then cross goes from 50.38 % to 51.35 % (rigid-chassis statics, worked by hand)', () => {
    const change = wedgeChange({ wheelRatesNPerMm: allK200, corner: 'lf', wheelOffsetMm: convert(0.25, 'in', 'mm') });
    const lb = (c: Corner) => convert(change[c], 'kg', 'lb');
    const after = cornerWeights({ lf: CAR.lf + lb('lf'), rf: CAR.rf + lb('rf'), lr: CAR.lr + lb('lr'), rr: CAR.rr + lb('rr') });
    expectToDigits(cornerWeights(CAR).crossPct, '50.38');
    expectToDigits(after.crossPct, '51.35');
  });

  it('when the front track is wider, then the rear corners change by X·t_f/t_r (rigid-chassis statics)', () => {
    const k = { lf: 40, rf: 30, lr: 25, rr: 35 };
    const change = wedgeChange({ wheelRatesNPerMm: k, corner: 'lf', wheelOffsetMm: 5, trackFrontMm: 1500, trackRearMm: 1450 });
    const r = 1500 / 1450;
    const xN = 5 / (1 / 40 + 1 / 30 + r * r * (1 / 25 + 1 / 35)); // the formula worked by hand
    expectClose(change.lf, xN / 9.80665, 1e-12);
    expectClose(change.rr, (xN * r) / 9.80665, 1e-12);
    expectClose(change.lr, (-xN * r) / 9.80665, 1e-12);
  });

  const rate = fc.double({ min: 10, max: 300, noNaN: true });
  const rates = fc.record({ lf: rate, rf: rate, lr: rate, rr: rate });
  const track = fc.double({ min: 1200, max: 1800, noNaN: true });
  const offset = fc.double({ min: -30, max: 30, noNaN: true });

  it('when any corner is moved on any car, then the result matches a first-principles rigid-chassis solve (independent oracle: mathjs lusolve)', () => {
    fc.assert(
      fc.property(rates, fc.constantFrom(...CORNERS), offset, track, track, fc.double({ min: 800, max: 1800, noNaN: true }), fc.double({ min: 800, max: 1800, noNaN: true }), (k, corner, d, tf, tr, a, b) => {
        const got = wedgeChange({ wheelRatesNPerMm: k, corner, wheelOffsetMm: d, trackFrontMm: tf, trackRearMm: tr });
        const want = rigidChassisOracle(k, corner, d, tf, tr, a, b);
        for (const c of CORNERS) expectClose(got[c], want[c], 1e-8, 1e-9);
      }),
      { numRuns: 300 },
    );
  });

  it('when any corner is moved, then the changes sum to zero, each axle\'s changes cancel and the roll moments balance (property)', () => {
    fc.assert(
      fc.property(rates, fc.constantFrom(...CORNERS), offset, track, track, (k, corner, d, tf, tr) => {
        const c = wedgeChange({ wheelRatesNPerMm: k, corner, wheelOffsetMm: d, trackFrontMm: tf, trackRearMm: tr });
        const scale = Math.abs(c.lf) + Math.abs(c.rf) + Math.abs(c.lr) + Math.abs(c.rr) + 1e-12;
        expect(Math.abs(c.lf + c.rf + c.lr + c.rr)).toBeLessThan(1e-12 * scale);
        expect(Math.abs(c.lf + c.rf)).toBeLessThan(1e-12 * scale);
        expect(Math.abs(c.lr + c.rr)).toBeLessThan(1e-12 * scale);
        // front and rear are equal and opposite per the track ratio: (ΔLF − ΔRF)·t_f = −(ΔLR − ΔRR)·t_r
        expectClose((c.lf - c.rf) * tf, -(c.lr - c.rr) * tr, 1e-12, 1e-9);
      }),
    );
  });

  it('when a corner is raised, then it and its diagonal gain and the other two lose, so cross moves the right way (property)', () => {
    fc.assert(
      fc.property(rates, fc.constantFrom(...CORNERS), fc.double({ min: 0.5, max: 30, noNaN: true }), (k, corner, d) => {
        const c = wedgeChange({ wheelRatesNPerMm: k, corner, wheelOffsetMm: d });
        const diagonal = { lf: 'rr', rr: 'lf', rf: 'lr', lr: 'rf' } as const;
        for (const x of CORNERS) {
          const gains = x === corner || x === diagonal[corner];
          expect(Math.sign(c[x])).toBe(gains ? 1 : -1);
        }
        const before = cornerWeights(CAR);
        const after = cornerWeights({ lf: CAR.lf + c.lf, rf: CAR.rf + c.rf, lr: CAR.lr + c.lr, rr: CAR.rr + c.rr });
        expect(Math.sign(after.crossPct - before.crossPct)).toBe(corner === 'lf' || corner === 'rr' ? 1 : -1);
      }),
    );
  });

  it('when LF is raised by δ, then it equals lowering RF by δ and raising RR by δ·t_r/t_f (property, symmetry of the rigid chassis)', () => {
    fc.assert(
      fc.property(rates, offset, track, track, (k, d, tf, tr) => {
        const tracks = { trackFrontMm: tf, trackRearMm: tr };
        const lf = wedgeChange({ wheelRatesNPerMm: k, corner: 'lf', wheelOffsetMm: d, ...tracks });
        const rf = wedgeChange({ wheelRatesNPerMm: k, corner: 'rf', wheelOffsetMm: -d, ...tracks });
        const rr = wedgeChange({ wheelRatesNPerMm: k, corner: 'rr', wheelOffsetMm: (d * tr) / tf, ...tracks });
        for (const c of CORNERS) {
          expectClose(rf[c], lf[c], 1e-12, 1e-12);
          expectClose(rr[c], lf[c], 1e-12, 1e-12);
        }
      }),
    );
  });

  it('when the offset doubles, then every change doubles; when it is zero, then nothing changes (property, linear statics)', () => {
    fc.assert(
      fc.property(rates, fc.constantFrom(...CORNERS), offset, (k, corner, d) => {
        const one = wedgeChange({ wheelRatesNPerMm: k, corner, wheelOffsetMm: d });
        const two = wedgeChange({ wheelRatesNPerMm: k, corner, wheelOffsetMm: 2 * d });
        for (const c of CORNERS) expectClose(two[c], 2 * one[c], 1e-12, 1e-15);
      }),
    );
    expect(wedgeChange({ wheelRatesNPerMm: allK200, corner: 'rr', wheelOffsetMm: 0 })).toEqual({ lf: 0, rf: 0, lr: 0, rr: 0 });
  });

  it('when only one track is given, a rate is not above 0 or the corner is unknown, then it refuses', () => {
    expect(() => wedgeChange({ wheelRatesNPerMm: allK200, corner: 'lf', wheelOffsetMm: 5, trackFrontMm: 1500 })).toThrow(/both track widths/);
    expect(() => wedgeChange({ wheelRatesNPerMm: { ...allK200, lr: 0 }, corner: 'lf', wheelOffsetMm: 5 })).toThrow(RangeError);
    expect(() => wedgeChange({ wheelRatesNPerMm: allK200, corner: 'xx' as Corner, wheelOffsetMm: 5 })).toThrow(TypeError);
  });
});
