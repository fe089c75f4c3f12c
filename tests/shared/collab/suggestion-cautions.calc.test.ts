import { describe, expect, it } from 'vitest';
import { IMPERIAL_PREFERENCES, METRIC_PREFERENCES } from '../../../shared/calc/units.calc';
import { cautionWords, cornersInWords, suggestionCautions } from '../../../shared/collab/suggestion-cautions.calc';
import type { SuggestionChange } from '../../../shared/collab/suggestion.schema';
import type { PerCorner } from '../../../shared/season/corners';
import type { SetupCorner } from '../../../shared/season/setup.schema';

// Unit conversions: NIST SP 811 (2008), Appendix B.8 — 1 psi = 6.894 757 kPa, 1 in = 25.4 mm (exact).
const KPA_PER_PSI = 6.894757;

// Thresholds are facts of the trade with no single published table:
const CAMBER = 'common practice: street and track-day tyres stop gaining past about −4°; beyond −5° is a dedicated race setup';
const POSITIVE_CAMBER = 'from memory: road cars’ factory camber ranges stop at about +1°';
const TOE = 'common practice: factory toe is a millimetre or two per wheel, race alignments seldom past 3 mm out per wheel';
const CASTER = 'from memory: road cars run about +3° to +10° of caster; below 0° the steering does not centre itself';
const PRESSURE = 'common practice: road cars on street or track tyres run about 180–260 kPa (26–38 psi) cold; from memory: many passenger tyres allow 300 or 350 kPa at most';
const STEP = 'common practice: pressure moves 5–20 kPa (1–3 psi) a step, ride height 5–10 mm, coilovers lower a car 25–50 mm';
const SPRING = 'common practice: ride frequency goes with √k (Barton & Fieldhouse 2018 §3.9), ×1.75 in rate takes a road car’s 1.5 Hz to about 2 Hz';

const on = (field: SuggestionChange['field'], corners: SuggestionChange['corners'], amount: { delta: number } | { value: number }): SuggestionChange => ({
  field,
  corners,
  ...amount,
});
const car = (values: SetupCorner): PerCorner<SetupCorner> => ({ lf: values, rf: values, lr: values, rr: values });
const rules = (changes: SuggestionChange[], current: PerCorner<SetupCorner> | null = null) => suggestionCautions(changes, current).map((c) => c.rule);

describe('suggestionCautions: values far from the usual', () => {
  it.each([
    { field: 'camberDeg', inside: -5, outside: -5.01, rule: 'camber-negative', source: CAMBER },
    { field: 'camberDeg', inside: 1, outside: 1.01, rule: 'camber-positive', source: POSITIVE_CAMBER },
    { field: 'toeMm', inside: 5, outside: 5.1, rule: 'toe', source: TOE },
    { field: 'toeMm', inside: -5, outside: -5.1, rule: 'toe', source: TOE },
    { field: 'casterDeg', inside: 0, outside: -0.1, rule: 'caster-low', source: CASTER },
    { field: 'casterDeg', inside: 12, outside: 12.1, rule: 'caster-high', source: CASTER },
    { field: 'coldPressureKpa', inside: 140, outside: 139.9, rule: 'pressure-low', source: PRESSURE },
    { field: 'coldPressureKpa', inside: 310, outside: 310.1, rule: 'pressure-high', source: PRESSURE },
  ] as const)('when $field is set to $inside, then no caution; at $outside, then "$rule" ($source)', ({ field, inside, outside, rule }) => {
    expect(rules([on(field, ['lf'], { value: inside })])).toEqual([]);
    const [caution] = suggestionCautions([on(field, ['lf'], { value: outside })], null);
    expect(caution).toMatchObject({ rule, field, corners: ['lf'], to: outside });
  });

  it(`when a change by an amount takes camber from −4.8° to −5.1°, then it is cautioned; to −5.0°, then not (${CAMBER})`, () => {
    const now = car({ camberDeg: -4.8 });
    expect(rules([on('camberDeg', ['lf', 'rf'], { delta: -0.3 })], now)).toEqual(['camber-negative']);
    expect(rules([on('camberDeg', ['lf', 'rf'], { delta: -0.2 })], now)).toEqual([]);
  });

  it(`when cold pressures are typed in psi, then 45.0 psi (310.26 kPa) is past 310 kPa and 44.0 psi (303.37 kPa) is not (${PRESSURE}; NIST SP 811 B.8)`, () => {
    expect(rules([on('coldPressureKpa', ['rr'], { value: 45 * KPA_PER_PSI })])).toEqual(['pressure-high']);
    expect(rules([on('coldPressureKpa', ['rr'], { value: 44 * KPA_PER_PSI })])).toEqual([]);
  });

  it('when a value is past the limits a setup may hold (camber −20°, 500 kPa), then it has no caution, being refused as a typo elsewhere; just inside them (−9.9°, 450 kPa), then it has', () => {
    expect(rules([on('camberDeg', ['lf'], { value: -20 }), on('coldPressureKpa', ['lf'], { value: 500 })])).toEqual([]);
    expect(rules([on('camberDeg', ['lf'], { value: -9.9 }), on('coldPressureKpa', ['lf'], { value: 450 })])).toEqual(['camber-negative', 'pressure-high']);
  });

  it('when clicks or corner weights change by a lot beside a large camber change, then only the camber is cautioned: their range depends on the damper and the car', () => {
    const changes = [on('damperClicks', ['lf'], { value: 30 }), on('cornerWeightKg', ['lf'], { delta: 200 }), on('camberDeg', ['lf'], { delta: -5 })];
    expect(rules(changes, car({ damperClicks: 2, cornerWeightKg: 300, camberDeg: -1 }))).toEqual(['camber-negative']);
  });
});

describe('suggestionCautions: steps far larger than usual', () => {
  it(`when cold pressure changes by 50 kPa, then no caution; by 51 kPa or −50.1 kPa, then a caution even with no value on the car (${STEP})`, () => {
    expect(rules([on('coldPressureKpa', ['lf'], { delta: 50 })], car({ coldPressureKpa: 200 }))).toEqual([]);
    expect(rules([on('coldPressureKpa', ['lf'], { delta: 51 })], car({ coldPressureKpa: 200 }))).toEqual(['pressure-step']);
    const [caution] = suggestionCautions([on('coldPressureKpa', ['lf'], { delta: -50.1 })], null);
    expect(caution).toMatchObject({ rule: 'pressure-step', from: null, to: null, change: -50.1 });
  });

  it(`when cold pressure is set from 250 kPa to 170 kPa, then the 80 kPa step is cautioned, and from 210 kPa it is not (${STEP})`, () => {
    const [caution] = suggestionCautions([on('coldPressureKpa', ['lr', 'rr'], { value: 170 })], car({ coldPressureKpa: 250 }));
    expect(caution).toMatchObject({ rule: 'pressure-step', corners: ['lr', 'rr'], from: 250, to: 170, change: -80 });
    expect(rules([on('coldPressureKpa', ['lr', 'rr'], { value: 170 })], car({ coldPressureKpa: 210 }))).toEqual([]);
  });

  it(`when a value is set with nothing recorded on the car, then its step is unknown and not cautioned; with 150 kPa recorded, then 150 → 210 kPa is (${STEP})`, () => {
    const changes = [on('coldPressureKpa', ['lf'], { value: 200 }), on('coldPressureKpa', ['lf'], { delta: 10 })];
    expect(rules(changes, null)).toEqual([]);
    expect(suggestionCautions(changes, car({ coldPressureKpa: 150 }))).toMatchObject([{ rule: 'pressure-step', from: 150, to: 210, change: 60 }]);
  });

  it(`when two changes of −30 kPa each fall on the same corner, then they count as one −60 kPa step (${STEP})`, () => {
    const changes = [on('coldPressureKpa', ['lf'], { delta: -30 }), on('coldPressureKpa', ['lf', 'rf'], { delta: -30 })];
    const cautions = suggestionCautions(changes, car({ coldPressureKpa: 220 }));
    expect(cautions).toHaveLength(1);
    expect(cautions[0]).toMatchObject({ rule: 'pressure-step', corners: ['lf'], from: 220, to: 160, change: -60 });
  });

  it(`when ride height goes down 50 mm, then no caution; down 50.1 mm, up 51 mm, or set from 120 mm to 60 mm, then a caution (${STEP})`, () => {
    const now = car({ rideHeightMm: 120 });
    expect(rules([on('rideHeightMm', ['lf'], { delta: -50 })], now)).toEqual([]);
    expect(rules([on('rideHeightMm', ['lf'], { delta: -50.1 })], now)).toEqual(['ride-height-step']);
    expect(rules([on('rideHeightMm', ['lf'], { delta: 51 })], now)).toEqual(['ride-height-step']);
    expect(suggestionCautions([on('rideHeightMm', ['lf', 'rf'], { value: 60 })], now)[0]).toMatchObject({ rule: 'ride-height-step', change: -60 });
  });

  it(`when a spring goes from 40 to 70 N/mm (1.75 times), then no caution; to 70.1 N/mm, or doubled, then a caution (${SPRING})`, () => {
    const now = car({ springRateNPerMm: 40 });
    expect(rules([on('springRateNPerMm', ['lr'], { value: 70 })], now)).toEqual([]);
    expect(rules([on('springRateNPerMm', ['lr'], { value: 70.1 })], now)).toEqual(['spring-step']);
    expect(rules([on('springRateNPerMm', ['lr'], { delta: 40 })], now)).toEqual(['spring-step']);
  });

  it(`when a spring goes from 70 to 40 N/mm, then no caution; to 39.9 N/mm, then a caution; with no rate on the car, then none (${SPRING})`, () => {
    const now = car({ springRateNPerMm: 70 });
    expect(rules([on('springRateNPerMm', ['rr'], { value: 40 })], now)).toEqual([]);
    expect(rules([on('springRateNPerMm', ['rr'], { value: 39.9 })], now)).toEqual(['spring-step']);
    expect(rules([on('springRateNPerMm', ['rr'], { value: 10 })], null)).toEqual([]);
  });
});

describe('suggestionCautions: grouping', () => {
  it('when all four corners end on the same unusual value, then one caution names all four; different values stay apart', () => {
    const one = suggestionCautions([on('coldPressureKpa', ['rr', 'lf', 'lr', 'rf'], { value: 70 })], null);
    expect(one).toHaveLength(1);
    expect(one[0]!.corners).toEqual(['lf', 'rf', 'lr', 'rr']);

    const apart = suggestionCautions([on('camberDeg', ['lf'], { value: -7 }), on('camberDeg', ['rf'], { value: -6 })], null);
    expect(apart.map((c) => c.corners)).toEqual([['lf'], ['rf']]);
  });

  it('when all four go to one unusual value from different values now, then the value\'s caution names all four; a step from each stays per axle', () => {
    // Front at 220 kPa, rear at 200 kPa; all four set to 100 kPa.
    const now = { lf: { coldPressureKpa: 220 }, rf: { coldPressureKpa: 220 }, lr: { coldPressureKpa: 200 }, rr: { coldPressureKpa: 200 } };
    const found = suggestionCautions([on('coldPressureKpa', ['lf', 'rf', 'lr', 'rr'], { value: 100 })], now);
    expect(found.map((c) => [c.rule, cornersInWords(c.corners)])).toEqual([
      ['pressure-low', 'All four'],
      ['pressure-step', 'Front pair'], // 120 kPa down
      ['pressure-step', 'Rear pair'], // 100 kPa down
    ]);
  });

  it('when corners are named, then pairs and all four read as such and others by name', () => {
    expect(cornersInWords(['rf', 'lf'])).toBe('Front pair');
    expect(cornersInWords(['lr', 'rr'])).toBe('Rear pair');
    expect(cornersInWords(['rr', 'lr', 'rf', 'lf'])).toBe('All four');
    expect(cornersInWords(['rr', 'lf'])).toBe('LF + RR');
  });
});

describe('cautionWords', () => {
  it('when camber is set to −7° on the front pair, then the words name the pair, the quantity, the value and why', () => {
    const [caution] = suggestionCautions([on('camberDeg', ['lf', 'rf'], { value: -7 })], null);
    const words = cautionWords(caution!, METRIC_PREFERENCES);
    expect(words).toMatch(/^Front pair camber \u22127\.00°: more negative than \u22125\.00°/);
    expect(words).toMatch(/road cars on street or track tyres/);
  });

  it('when toe is set to 15 mm toe-out, then it says toe-out', () => {
    const [caution] = suggestionCautions([on('toeMm', ['lf', 'rf'], { value: -15 })], null);
    expect(cautionWords(caution!, METRIC_PREFERENCES)).toMatch(/^Front pair toe-out 15\.0 mm per wheel: more than 5\.0 mm either way/);
  });

  it('when toe is set to 15 mm in and units are inches, then it reads "toe-in 0.59 in per wheel" (15 / 25.4 = 0.591, NIST SP 811 B.8)', () => {
    const [caution] = suggestionCautions([on('toeMm', ['lr'], { value: 15 })], null);
    expect(cautionWords(caution!, IMPERIAL_PREFERENCES)).toMatch(/^LR toe-in 0\.59 in per wheel: more than 0\.20 in either way/);
  });

  it('when 400 kPa is shown to someone reading psi, then 58.0 psi above 45.0 psi (400 / 6.894 757 = 58.02; 310 / 6.894 757 = 44.96, NIST SP 811 B.8)', () => {
    const [caution] = suggestionCautions([on('coldPressureKpa', ['rr', 'rf', 'lr', 'lf'], { value: 400 })], null);
    expect(cautionWords(caution!, IMPERIAL_PREFERENCES)).toMatch(/^All four cold pressure 58\.0 psi: above 45\.0 psi/);
  });

  it('when cold pressure drops 80 kPa at once, then the words give the step, from → to, and ask whether it is a cold pressure in the unit meant', () => {
    const [caution] = suggestionCautions([on('coldPressureKpa', ['lf'], { delta: -80 })], car({ coldPressureKpa: 250 }));
    expect(cautionWords(caution!, METRIC_PREFERENCES)).toBe(
      'LF cold pressure down 80 kPa at once (250 kPa → 170 kPa): more than 50 kPa, where a usual step is a few; check it is a cold pressure, in the unit meant.',
    );
  });

  it('when ride height is lowered 60 mm and units are inches, then "lowered 2.36 in" past 1.97 in (60 / 25.4 = 2.362, 50 / 25.4 = 1.969)', () => {
    const [caution] = suggestionCautions([on('rideHeightMm', ['lf', 'rf'], { delta: -60 })], car({ rideHeightMm: 130 }));
    expect(cautionWords(caution!, IMPERIAL_PREFERENCES)).toMatch(/^Front pair ride height lowered 2\.36 in at once \(5\.12 in → 2\.76 in\): more than 1\.97 in/);
  });

  it('when a rear spring is doubled, then the words say from → to in the user’s unit and "2.00 times as stiff" (50 N/mm = 285.5 lbf/in, NIST SP 811 B.8)', () => {
    const [caution] = suggestionCautions([on('springRateNPerMm', ['lr', 'rr'], { value: 100 })], car({ springRateNPerMm: 50 }));
    const words = cautionWords(caution!, IMPERIAL_PREFERENCES);
    expect(words).toMatch(/^Rear pair spring rate 286 lb\/in → 571 lb\/in at once: 2\.00 times as stiff/);
  });
});
