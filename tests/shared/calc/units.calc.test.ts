import { describe, expect, expectTypeOf, it } from 'vitest';
import fc from 'fast-check';
import { unit as mathUnit, multiply, gravity, type Unit as MathUnit } from 'mathjs';
import type { z } from 'zod';
import {
  ALL_UNITS,
  IMPERIAL_PREFERENCES,
  KPA_PER_PSI,
  METRIC_PREFERENCES,
  QUANTITIES,
  QUANTITY_UNITS,
  SI_UNITS,
  UNIT_DECIMALS,
  UNIT_SYMBOLS,
  convert,
  formatInUnit,
  formatQuantity,
  fromDisplay,
  toDisplay,
  unitFor,
  unitPreferencesSchema,
  type Quantity,
  type Unit,
  type UnitPreferences,
} from '../../../shared/calc/units.calc';

// Sources: exact definitions in NIST Handbook 44 App. C and NIST SP 811 App. B (1959 international yard and pound):
// in = 25.4 mm; lb = 0.453 592 37 kg; g_n = 9.806 65 m/s²; lbf = lb·g_n; kgf = kg·g_n; psi = lbf/in²; bar = 100 kPa;
// °F = °C·9/5 + 32. Worked values from those exact definitions, allowing ±0.5 in the last digit shown.
const NIST = 'NIST Handbook 44 App. C / NIST SP 811';

/** |actual − expected| ≤ half a unit in the last decimal of `expected` as written. */
function expectToDigits(actual: number, expected: string) {
  const decimals = expected.split('.')[1]?.length ?? 0;
  expect(Math.abs(actual - Number(expected))).toBeLessThanOrEqual(0.5 * 10 ** -decimals + 1e-12);
}

/** Relative agreement, with an absolute floor for values near zero (temperatures cross 0). */
function expectClose(actual: number, expected: number, rel: number, absFloor = 1e-12) {
  expect(Math.abs(actual - expected)).toBeLessThanOrEqual(rel * Math.max(Math.abs(actual), Math.abs(expected)) + absFloor);
}

const pairsWithin = (units: readonly Unit[]) => units.flatMap((a) => units.map((b) => [a, b] as const));

// Every unit grouped by what it measures (physical dimension): these convert into each other, nothing else does.
const DIMENSIONS: readonly (readonly Unit[])[] = [
  ['kPa', 'bar', 'psi'],
  ['mm', 'in', 'in32'],
  ['kg', 'lb'],
  ['N/mm', 'kgf/mm', 'lbf/in'],
  ['degC', 'degF'],
  ['deg'],
  ['s'],
];
const dimensionOf = (u: Unit) => DIMENSIONS.findIndex((d) => d.includes(u));

describe('convert: worked values against the exact definitions', () => {
  // [value, from, to, expected as worked from NIST SP 811's exact factors]
  const cases: [number, Unit, Unit, string][] = [
    [32, 'psi', 'kPa', '220.632'],
    [32, 'psi', 'bar', '2.20632'],
    [2.4, 'bar', 'psi', '34.8091'],
    [10, 'in32', 'mm', '7.9375'],
    [7.0, 'mm', 'in32', '8.8189'],
    [3000, 'lb', 'kg', '1360.77711'],
    [500, 'lbf/in', 'N/mm', '87.5634'],
    [500, 'lbf/in', 'kgf/mm', '8.92898'],
    [10, 'kgf/mm', 'N/mm', '98.0665'],
    [10, 'kgf/mm', 'lbf/in', '559.974'],
    [1, 'lbf/in', 'N/mm', '0.175126835'],
    [1, 'in32', 'mm', '0.79375'],
    [20, 'degC', 'degF', '68'],
    [-40, 'degC', 'degF', '-40'],
  ];
  it.each(cases)(`when %s %s is converted to %s, then %s (${NIST} exact definitions)`, (value, from, to, expected) => {
    expectToDigits(convert(value, from, to), expected);
  });

  it(`when 1 psi is converted to kPa, then 6.894757293168 to 12 significant digits (${NIST}: psi = 6894.757 293 168 Pa)`, () => {
    const kpa = convert(1, 'psi', 'kPa');
    expect(kpa.toPrecision(12)).toBe((6.894757293168).toPrecision(12));
    expectClose(kpa, 6.894757293168, 1e-12, 0);
    expect(KPA_PER_PSI.toPrecision(13)).toBe('6.894757293168'); // built from lb, g_n and in, not typed in rounded
  });

  it(`when whole inches are converted to mm, then exactly 25.4 each (${NIST})`, () => {
    expect(convert(1, 'in', 'mm')).toBe(25.4);
    expect(convert(10, 'in', 'mm')).toBe(254);
    expect(convert(32, 'in32', 'in')).toBeCloseTo(1, 14);
  });

  it(`when 2 bar is converted to kPa, then 200 (${NIST}: bar = 100 kPa)`, () => {
    expect(convert(2, 'bar', 'kPa')).toBe(200);
  });

  it(`when temperatures are converted, then as points on the scale, not differences (${NIST}: °F = °C·9/5 + 32)`, () => {
    expect(convert(20, 'degC', 'degF')).toBe(68);
    expect(convert(68, 'degF', 'degC')).toBe(20);
    expect(convert(-40, 'degF', 'degC')).toBe(-40);
    expect(convert(0, 'degC', 'degF')).toBe(32);
    expect(convert(100, 'degC', 'degF')).toBe(212);
    expect(convert(10, 'degC', 'degF')).not.toBe(18); // a 10 K difference is 18 °F, but a point 10 °C is 50 °F
  });

  it('when a scale reads "lb" as force, then its number equals lb mass at g_n (NIST SP 811; common practice)', () => {
    // 1 lbf / g_n = 1 lb: a corner weight of 700 "lb" is 317.5 kg either way.
    expectToDigits(convert(700, 'lb', 'kg'), '317.515');
  });
});

describe('convert: refusals', () => {
  it('when the two units measure different kinds of quantity, then a TypeError names both', () => {
    expect(() => convert(200, 'kPa', 'mm')).toThrow(TypeError);
    expect(() => convert(200, 'kPa', 'mm')).toThrow(/kPa.*mm/);
    expect(() => convert(1, 'deg', 's')).toThrow(TypeError);
    expect(() => convert(1, 'lb', 'lbf/in')).toThrow(TypeError);
  });

  it('when any two units of different kinds are paired, then convert throws (property)', () => {
    const mismatched = pairsWithin(ALL_UNITS).filter(([a, b]) => dimensionOf(a) !== dimensionOf(b));
    expect(mismatched.length).toBeGreaterThan(100);
    fc.assert(
      fc.property(fc.constantFrom(...mismatched), fc.double({ noNaN: true, noDefaultInfinity: true }), ([a, b], x) => {
        expect(() => convert(x, a, b)).toThrow(TypeError);
      }),
    );
  });

  it.each([NaN, Infinity, -Infinity])('when the value is %s, then a RangeError', (value) => {
    expect(() => convert(value, 'psi', 'kPa')).toThrow(RangeError);
    expect(() => convert(value, 'kPa', 'kPa')).toThrow(RangeError);
  });

  it('when a unit is not one the app knows, then a TypeError', () => {
    expect(() => convert(1, 'atm' as Unit, 'kPa')).toThrow(/Unknown unit "atm"/);
  });
});

describe('convert: mathjs as an independent oracle over generated values', () => {
  // mathjs names (its psi is 6894.7572928 Pa, so agreement is checked at 1e-9 relative).
  function toMath(value: number, u: Unit): MathUnit {
    switch (u) {
      case 'in':
        return mathUnit(value, 'inch');
      case 'in32':
        return mathUnit(value / 32, 'inch');
      case 'lb':
        return mathUnit(value, 'lbm');
      case 'kgf/mm':
        return multiply(mathUnit(value, 'kg/mm'), gravity) as MathUnit; // mathjs's standard gravity
      default:
        return mathUnit(value, u);
    }
  }
  function fromMath(m: MathUnit, u: Unit): number {
    switch (u) {
      case 'in':
        return m.toNumber('inch');
      case 'in32':
        return m.toNumber('inch') * 32;
      case 'lb':
        return m.toNumber('lbm');
      case 'kgf/mm':
        return m.toNumber('N/mm') / gravity.toNumber('m/s^2');
      default:
        return m.toNumber(u);
    }
  }

  it('when mathjs knows kgf, then it agrees that kgf = 9.806 65 N (mathjs built-in)', () => {
    expect(mathUnit(10, 'kgf/mm').toNumber('N/mm')).toBeCloseTo(98.0665, 10);
  });

  const pairs = DIMENSIONS.flatMap(pairsWithin);
  it.each(pairs)('when %s → %s is converted for many values, then mathjs agrees to 1e-9 relative', (from, to) => {
    fc.assert(
      fc.property(fc.double({ min: -1e6, max: 1e6, noNaN: true }), (x) => {
        expectClose(convert(x, from, to), fromMath(toMath(x, from), to), 1e-9);
      }),
      { numRuns: 200 },
    );
  });
});

describe('convert: properties', () => {
  const pairs = DIMENSIONS.flatMap(pairsWithin);

  it('when a value is converted there and back, then it returns (property)', () => {
    fc.assert(
      fc.property(fc.constantFrom(...pairs), fc.double({ min: -1e9, max: 1e9, noNaN: true }), ([a, b], x) => {
        expectClose(convert(convert(x, a, b), b, a), x, 1e-12);
      }),
      { numRuns: 2000 },
    );
  });

  it('when a value is converted to its own unit, then it is returned unchanged (property)', () => {
    fc.assert(
      fc.property(fc.constantFrom(...ALL_UNITS), fc.double({ noNaN: true, noDefaultInfinity: true }), (u, x) => {
        expect(Object.is(convert(x, u, u), x)).toBe(true);
      }),
    );
  });

  it('when a value is converted a → b → c, then it equals a → c (property)', () => {
    const triples = DIMENSIONS.flatMap((d) => d.flatMap((a) => d.flatMap((b) => d.map((c) => [a, b, c] as const))));
    fc.assert(
      fc.property(fc.constantFrom(...triples), fc.double({ min: -1e6, max: 1e6, noNaN: true }), ([a, b, c], x) => {
        expectClose(convert(convert(x, a, b), b, c), convert(x, a, c), 1e-12);
      }),
      { numRuns: 1000 },
    );
  });
});

describe('quantity metadata', () => {
  it('when the SI unit of each quantity is read, then kPa, mm, mm, N/mm, kg, °C, °, s (values are stored in SI)', () => {
    expect(SI_UNITS).toEqual({
      pressure: 'kPa',
      length: 'mm',
      treadDepth: 'mm',
      springRate: 'N/mm',
      mass: 'kg',
      temperature: 'degC',
      angle: 'deg',
      time: 's',
    });
    for (const q of QUANTITIES) expect(QUANTITY_UNITS[q][0]).toBe(SI_UNITS[q]);
  });

  it('when the choices are read, then each quantity offers its units and each choice converts to the SI unit', () => {
    expect(QUANTITY_UNITS.pressure).toEqual(['kPa', 'bar', 'psi']);
    expect(QUANTITY_UNITS.treadDepth).toEqual(['mm', 'in32']);
    expect(QUANTITY_UNITS.springRate).toEqual(['N/mm', 'kgf/mm', 'lbf/in']);
    expect(QUANTITY_UNITS.angle).toEqual(['deg']);
    expect(QUANTITY_UNITS.time).toEqual(['s']);
    for (const q of QUANTITIES) for (const u of QUANTITY_UNITS[q]) expect(() => convert(1, u, SI_UNITS[q])).not.toThrow();
  });

  it('when symbols and decimals are read, then every unit has both', () => {
    expect(UNIT_SYMBOLS).toMatchObject({ in32: '/32 in', 'lbf/in': 'lb/in', degC: '°C', degF: '°F', deg: '°', 'kgf/mm': 'kgf/mm' });
    expect(UNIT_DECIMALS).toMatchObject({ psi: 1, kPa: 0, bar: 2, mm: 1, in: 2, in32: 1, 'N/mm': 1, 'lbf/in': 0, degC: 0, degF: 0, kg: 1, lb: 0 });
    for (const u of ALL_UNITS) {
      expect(UNIT_SYMBOLS[u]).toBeTruthy();
      expect(Number.isInteger(UNIT_DECIMALS[u])).toBe(true);
    }
  });

  it('when the presets are read, then metric is SI and imperial is psi, in, 1/32 in, lbf/in, lb, °F', () => {
    expect(METRIC_PREFERENCES).toEqual(SI_UNITS);
    expect(IMPERIAL_PREFERENCES).toEqual({
      pressure: 'psi',
      length: 'in',
      treadDepth: 'in32',
      springRate: 'lbf/in',
      mass: 'lb',
      temperature: 'degF',
      angle: 'deg',
      time: 's',
    });
  });
});

describe('unitPreferencesSchema', () => {
  it('when the schema parses to a value, then its type is UnitPreferences', () => {
    expectTypeOf<z.output<typeof unitPreferencesSchema>>().toEqualTypeOf<UnitPreferences>();
  });

  it('when nothing is given, then every quantity defaults to metric', () => {
    expect(unitPreferencesSchema.parse({})).toEqual(METRIC_PREFERENCES);
  });

  it('when some units are given, then they are kept and the rest default to metric', () => {
    expect(unitPreferencesSchema.parse({ pressure: 'psi', treadDepth: 'in32' })).toEqual({
      ...METRIC_PREFERENCES,
      pressure: 'psi',
      treadDepth: 'in32',
    });
    expect(unitPreferencesSchema.parse(IMPERIAL_PREFERENCES)).toEqual(IMPERIAL_PREFERENCES);
  });

  it('when a unit is not one of that quantity\'s choices, then it is refused with a message naming the choices', () => {
    const result = unitPreferencesSchema.safeParse({ treadDepth: 'in' });
    expect(result.success).toBe(false);
    expect(result.error?.issues[0]?.path).toEqual(['treadDepth']);
    expect(result.error?.issues[0]?.message).toMatch(/'mm' or 'in32'/);
    expect(unitPreferencesSchema.safeParse({ pressure: 'mm' }).success).toBe(false);
    expect(unitPreferencesSchema.safeParse({ angle: 'rad' }).success).toBe(false);
  });

  it('when an unknown key is sent, then it is refused (strict object)', () => {
    expect(unitPreferencesSchema.safeParse({ speed: 'mph' }).success).toBe(false);
  });
});

describe('toDisplay / fromDisplay / formatQuantity', () => {
  const anyPreferences = fc.record(
    Object.fromEntries(QUANTITIES.map((q) => [q, fc.constantFrom(...QUANTITY_UNITS[q])])) as {
      [Q in Quantity]: fc.Arbitrary<UnitPreferences[Q]>;
    },
  );

  it(`when 220.632 kPa is shown to an imperial user, then 32 psi (${NIST})`, () => {
    expectToDigits(toDisplay(220.632, 'pressure', IMPERIAL_PREFERENCES), '32.0000');
    expectToDigits(fromDisplay(32, 'pressure', IMPERIAL_PREFERENCES), '220.632');
  });

  it(`when a tread depth of 7.9375 mm is shown in 1/32 in, then 10 (${NIST})`, () => {
    expectToDigits(toDisplay(7.9375, 'treadDepth', IMPERIAL_PREFERENCES), '10.0000');
    expectToDigits(fromDisplay(2, 'treadDepth', IMPERIAL_PREFERENCES), '1.5875'); // 2/32 in wear bars
  });

  it('when a metric user reads or types a value, then it is the SI value unchanged', () => {
    for (const q of QUANTITIES) {
      expect(toDisplay(12.345, q, METRIC_PREFERENCES)).toBe(12.345);
      expect(fromDisplay(12.345, q, METRIC_PREFERENCES)).toBe(12.345);
    }
  });

  it('when a toe of 2 mm is shown to an imperial user, then as a length in inches; camber stays in degrees', () => {
    expectToDigits(toDisplay(2, 'length', IMPERIAL_PREFERENCES), '0.0787');
    expect(toDisplay(-1.5, 'angle', IMPERIAL_PREFERENCES)).toBe(-1.5);
  });

  it('when a value is shown and typed back in any preference, then the SI value returns (property)', () => {
    fc.assert(
      fc.property(
        anyPreferences,
        fc.constantFrom(...QUANTITIES),
        fc.double({ min: -1e6, max: 1e6, noNaN: true }),
        (prefs, q, x) => {
          expectClose(fromDisplay(toDisplay(x, q, prefs), q, prefs), x, 1e-12);
        },
      ),
      { numRuns: 2000 },
    );
  });

  it('when preferences were not parsed and hold a unit of the wrong quantity, then a RangeError', () => {
    const bad = { ...METRIC_PREFERENCES, treadDepth: 'in' } as unknown as UnitPreferences;
    expect(() => toDisplay(5, 'treadDepth', bad)).toThrow(RangeError);
    expect(() => unitFor('treadDepth', bad)).toThrow(/'in' is not a unit for treadDepth/);
  });

  const PRESETS: Record<string, UnitPreferences> = {
    imperial: IMPERIAL_PREFERENCES,
    metric: METRIC_PREFERENCES,
    'metric with bar': { ...METRIC_PREFERENCES, pressure: 'bar' },
    'metric with kgf/mm': { ...METRIC_PREFERENCES, springRate: 'kgf/mm' },
  };
  it.each<[number, Quantity, string, string]>([
    [220.632, 'pressure', 'imperial', '32.0 psi'],
    [220.632, 'pressure', 'metric', '221 kPa'],
    [220.632, 'pressure', 'metric with bar', '2.21 bar'],
    [7.0, 'treadDepth', 'imperial', '8.8/32 in'],
    [7.0, 'treadDepth', 'metric', '7.0 mm'],
    [2, 'length', 'imperial', '0.08 in'],
    [87.5634, 'springRate', 'imperial', '500 lb/in'],
    [98.0665, 'springRate', 'metric with kgf/mm', '10.00 kgf/mm'],
    [1360.77711, 'mass', 'imperial', '3000 lb'],
    [1360.77711, 'mass', 'metric', '1360.8 kg'],
    [20, 'temperature', 'imperial', '68 °F'],
    [20, 'temperature', 'metric', '20 °C'],
    [-1.25, 'angle', 'imperial', '\u22121.25°'],
    [45.678, 'time', 'metric', '45.678 s'],
  ])(`when %s (SI) of %s is formatted for a %s user, then "%s" (${NIST} for the factors)`, (si, q, preset, expected) => {
    expect(formatQuantity(si, q, PRESETS[preset]!)).toBe(expected);
  });

  it('when there is no value, then an em dash', () => {
    expect(formatQuantity(null, 'pressure', IMPERIAL_PREFERENCES)).toBe('—');
    expect(formatQuantity(undefined, 'mass', METRIC_PREFERENCES)).toBe('—');
  });

  it('when a small negative value rounds to zero, then no minus sign is shown', () => {
    expect(formatQuantity(-0.004, 'angle', METRIC_PREFERENCES)).toBe('0.00°');
    expect(formatInUnit(-0.04, 'mm')).toBe('0.0 mm');
    // Below zero: a true minus (U+2212), as people read it.
    expect(formatInUnit(-0.06, 'mm')).toBe('\u22120.1 mm');
  });

  it('when any value is formatted, then it is the display value to the unit\'s decimals followed by its symbol (property)', () => {
    fc.assert(
      fc.property(anyPreferences, fc.constantFrom(...QUANTITIES), fc.double({ min: -1e5, max: 1e5, noNaN: true }), (prefs, q, x) => {
        const u = prefs[q];
        const text = formatQuantity(x, q, prefs);
        const symbol = UNIT_SYMBOLS[u];
        expect(text.endsWith(symbol)).toBe(true);
        const shown = text.slice(0, -symbol.length).trimEnd();
        expect(shown).not.toContain('-');
        const number = shown.replace('\u2212', '-');
        const decimals = UNIT_DECIMALS[u];
        expect(number).toMatch(decimals === 0 ? /^-?\d+$/ : new RegExp(`^-?\\d+\\.\\d{${decimals}}$`));
        expect(Math.abs(Number(number) - toDisplay(x, q, prefs))).toBeLessThanOrEqual(0.5 * 10 ** -decimals * (1 + 1e-9));
      }),
      { numRuns: 1000 },
    );
  });
});
