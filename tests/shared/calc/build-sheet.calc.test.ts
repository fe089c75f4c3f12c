import { describe, expect, it } from 'vitest';
import { balanceIfComplete, buildSheetChecks, buildSheetCornerChecks } from '../../../shared/calc/build-sheet.calc';
import { expectToDigits } from './expect-digits';

// Unit conversions: NIST SP 811 (2008), Appendix B — 1 in = 25.4 mm (exact), 1 lbf = 4.448 221 6 N,
// 1 lbf/in = 0.175 126 85 N/mm; standard gravity g_n = 9.806 65 m/s² (exact, same source).
const MM_PER_IN = 25.4;
const N_PER_LBF = 4.4482216;
const N_PER_MM_PER_LBF_PER_IN = 0.17512685;
const G_N = 9.80665;
const inch = (x: number) => x * MM_PER_IN;
const toIn = (mm: number) => mm / MM_PER_IN;
/** A wheel load in lbf as the kg a scale shows (the sheet stores kg; the check multiplies by g_n). */
const lbfAsKg = (x: number) => (x * N_PER_LBF) / G_N;
const lbfPerIn = (x: number) => x * N_PER_MM_PER_LBF_PER_IN;

// Spring at full droop and bump travel: F_s = F_wheel/MR, x_s = F_s/k, droop at the spring = wheel droop × MR,
// bump at the wheel = (stroke − droop at the damper − bump stop)/MR. Worked cases: common practice.
const SOURCE = 'coilover droop and bump-travel worked example (common practice)';

describe('buildSheetCornerChecks', () => {
  it(`when 700 lbf sits on a 500 lbf/in spring at MR 0.65 with 3.5 in of wheel droop, then 2.154 in static, 2.275 in at the spring, a helper must make up 0.121 in (${SOURCE})`, () => {
    const r = buildSheetCornerChecks({ wheelLoadKg: lbfAsKg(700), mainSpringRateNPerMm: lbfPerIn(500), wheelDroopMm: inch(3.5) }, 0.65, 13);
    // 700 / 0.65 = 1076.92 lbf at the spring; / 500 = 2.154 in; 3.5 × 0.65 = 2.275 in; 2.275 − 2.154 = 0.121 in.
    expectToDigits(toIn(r.droop!.staticCompressionMm), '2.154');
    expectToDigits(toIn(r.droop!.droopAtSpringMm), '2.275');
    expectToDigits(toIn(r.droop!.shortfallMm), '0.121');
    expect(r.droop!.seated).toBe(false);
  });

  it(`when 800 lbf sits on 400 lbf/in at MR 1 with 1.5 in of droop, then 2.0 in of compression and the spring stays seated (${SOURCE})`, () => {
    const r = buildSheetCornerChecks({ wheelLoadKg: lbfAsKg(800), mainSpringRateNPerMm: lbfPerIn(400), wheelDroopMm: inch(1.5) }, 1, 13);
    expectToDigits(toIn(r.droop!.staticCompressionMm), '2.0');
    expect(r.droop!.seated).toBe(true);
    expect(r.droop!.shortfallMm).toBe(0);
  });

  it(`when the stroke is 5.0 in with 2.0 in of droop at the damper and no bump stop at MR 0.65, then 4.615 in of bump at the wheel (${SOURCE})`, () => {
    // Wheel droop that puts 2.0 in at the damper: 2.0 / 0.65 in. (5.0 − 2.0) / 0.65 = 4.615 in.
    const r = buildSheetCornerChecks({ strokeMm: inch(5), wheelDroopMm: inch(2 / 0.65), bumpStopMm: 0 }, 0.65, 13);
    expectToDigits(toIn(r.bumpTravelAtWheelMm!), '4.615');
  });

  it('when a bump stop takes 0.5 in of that stroke, then the wheel keeps (5.0 − 2.0 − 0.5)/0.65 = 3.846 in (same worked example, common practice)', () => {
    const r = buildSheetCornerChecks({ strokeMm: inch(5), wheelDroopMm: inch(2 / 0.65), bumpStopMm: inch(0.5) }, 0.65, 13);
    expectToDigits(toIn(r.bumpTravelAtWheelMm!), '3.846');
  });

  it('when the compressed length is 15 mm shorter than the reference with a 13 mm tolerance, then it is flagged; 10 mm shorter is fine (common practice: flag more than about 13–16 mm shorter)', () => {
    const short = buildSheetCornerChecks({ damperCompressedLengthMm: 335, referenceCompressedLengthMm: 350 }, 0.7, 13);
    expect(short.compressedLength).toEqual({ differenceMm: -15, withinTolerance: false });
    const fine = buildSheetCornerChecks({ damperCompressedLengthMm: 340, referenceCompressedLengthMm: 350 }, 0.7, 13);
    expect(fine.compressedLength).toEqual({ differenceMm: -10, withinTolerance: true });
    const looser = buildSheetCornerChecks({ damperCompressedLengthMm: 335, referenceCompressedLengthMm: 350 }, 0.7, 16);
    expect(looser.compressedLength?.withinTolerance).toBe(true);
  });

  it('when inputs are missing, then each check that needs them is null and nothing is reported', () => {
    expect(buildSheetCornerChecks({ strokeMm: 120 }, 0.7, 13)).toEqual({ compressedLength: null, droop: null, bumpTravelAtWheelMm: null, problems: [] });
    // No motion ratio on the car: droop and bump travel cannot be worked out.
    const noMr = buildSheetCornerChecks({ wheelLoadKg: 300, mainSpringRateNPerMm: 80, wheelDroopMm: 60, strokeMm: 120, bumpStopMm: 10 }, null, 13);
    expect(noMr.droop).toBeNull();
    expect(noMr.bumpTravelAtWheelMm).toBeNull();
  });

  it('when droop and bump stop take more than the stroke, then bump travel is null and the problem is reported', () => {
    const r = buildSheetCornerChecks({ strokeMm: 50, wheelDroopMm: 80, bumpStopMm: 10 }, 1, 13);
    expect(r.bumpTravelAtWheelMm).toBeNull();
    expect(r.problems).toEqual(['Droop and bump stop add up to more than the damper stroke']);
  });
});

describe('buildSheetChecks', () => {
  it('when front and rear motion ratios differ, then each corner uses its own axle\'s ratio, and corners with no sheet are null', () => {
    const corner = { strokeMm: 100, wheelDroopMm: 50, bumpStopMm: 0 };
    const r = buildSheetChecks({ corners: { lf: corner, rr: corner }, motionRatio: { front: 0.5, rear: 1 }, toleranceMm: 13 });
    // Front: (100 − 50 × 0.5)/0.5 = 150 mm; rear: (100 − 50 × 1)/1 = 50 mm.
    expect(r.lf?.bumpTravelAtWheelMm).toBeCloseTo(150, 9);
    expect(r.rr?.bumpTravelAtWheelMm).toBeCloseTo(50, 9);
    expect(r.rf).toBeNull();
    expect(r.lr).toBeNull();
  });
});

describe('balanceIfComplete', () => {
  it('when LF 300, RF 280, LR 260, RR 290 kg, then total 1130 kg, front 51.33 %, left 49.56 %, cross 52.21 % (hand-worked arithmetic)', () => {
    // Total 300 + 280 + 260 + 290 = 1130. Front (300 + 280)/1130 = 51.327 %; left (300 + 260)/1130 = 49.558 %;
    // cross (LF + RR) (300 + 290)/1130 = 52.212 %.
    const r = balanceIfComplete({ lf: 300, rf: 280, lr: 260, rr: 290 })!;
    expect(r.totalKg).toBe(1130);
    expectToDigits(r.frontPct, '51.33');
    expectToDigits(r.leftPct, '49.56');
    expectToDigits(r.crossPct, '52.21');
  });

  it('when a corner weight is missing or all are zero, then there is no balance', () => {
    expect(balanceIfComplete({ lf: 300, rf: 280, lr: 260, rr: null })).toBeNull();
    expect(balanceIfComplete({ lf: 0, rf: 0, lr: 0, rr: 0 })).toBeNull();
  });
});
