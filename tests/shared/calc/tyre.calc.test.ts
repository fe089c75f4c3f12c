import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { unit as mathUnit } from 'mathjs';
import { tyreDimensions } from '../../../shared/calc/tyre.calc';
import { expectClose, expectToDigits } from './expect-digits';

// Formula: ETRTO / Tire and Rim Association conventions (from memory, consistent with ETRTO Engineering Design
// Information); aspect ratio = height / width × 100 (Yokohama "Basic Tyre Knowledge"). Worked values computed by hand from that formula.
const SOURCE = 'ETRTO/TRA nominal design values (formula from memory)';

describe('tyreDimensions: nominal values', () => {
  it.each([
    { size: '245/40R18', sidewall: '98.0', od: '653.2', odIn: '25.717', c: '2052.1', perKm: '487.3', perMile: '784.2' },
    { size: '225/60R16', sidewall: '135.0', od: '676.4', odIn: '26.630', c: '2125.0', perKm: '470.6', perMile: '757.3' },
    { size: '205/60R15', sidewall: '123.0', od: '627.0', odIn: '24.685', c: '1969.8', perKm: '507.7', perMile: '817.0' },
  ])(`when the size is $size, then sidewall $sidewall mm, OD $od mm ($odIn in), C $c mm, $perKm rev/km, $perMile rev/mile (${SOURCE})`, (row) => {
    const d = tyreDimensions(row.size);
    expectToDigits(d.sidewallMm, row.sidewall);
    expectToDigits(d.overallDiameterMm, row.od);
    expectToDigits(d.overallDiameterMm / 25.4, row.odIn);
    expectToDigits(d.circumferenceMm, row.c);
    expectToDigits(d.revsPerKm, row.perKm);
    expectToDigits(d.revsPerMile, row.perMile);
  });

  it('when the size is 205/60R15, then the OD rounds to the Tire and Rim Association design value 24.69 in (Tire and Rim Association, from memory)', () => {
    expectToDigits(tyreDimensions('205/60R15').overallDiameterMm / 25.4, '24.69');
  });

  it('when a size is read, then width, aspect ratio and rim diameter are the numbers written on the sidewall', () => {
    expect(tyreDimensions('245/40R18')).toMatchObject({ sectionWidthMm: 245, aspectRatio: 40, rimDiameterIn: 18 });
  });

  it('when any size is given, then rev/mile agrees with mathjs\'s mile over the circumference (independent oracle, international mile)', () => {
    fc.assert(
      fc.property(fc.integer({ min: 125, max: 355 }), fc.integer({ min: 25, max: 80 }), fc.integer({ min: 13, max: 22 }), (w, ar, rim) => {
        const d = tyreDimensions(`${w}/${ar}R${rim}`);
        const odMm = mathUnit(rim, 'inch').toNumber('mm') + (2 * w * ar) / 100;
        expectClose(d.overallDiameterMm, odMm, 1e-12);
        expectClose(d.revsPerMile, mathUnit(1, 'mile').toNumber('mm') / (Math.PI * odMm), 1e-12);
        expectClose(d.revsPerKm, mathUnit(1, 'km').toNumber('mm') / (Math.PI * odMm), 1e-12);
      }),
    );
  });

  it('when any size is given, then OD = rim + 2 × sidewall and rev/mile ÷ rev/km = 1.609 344 (property, definitions)', () => {
    fc.assert(
      fc.property(fc.integer({ min: 125, max: 355 }), fc.integer({ min: 25, max: 80 }), fc.integer({ min: 13, max: 22 }), (w, ar, rim) => {
        const d = tyreDimensions(`${w}/${ar}R${rim}`);
        expectClose(d.overallDiameterMm, d.rimDiameterIn * 25.4 + 2 * d.sidewallMm, 1e-12);
        expectClose(d.sidewallMm / d.sectionWidthMm, ar / 100, 1e-12);
        expectClose(d.revsPerMile / d.revsPerKm, 1.609344, 1e-12);
      }),
    );
  });
});

describe('tyreDimensions: reading the size', () => {
  it.each(['245/40R18', '245/40 R 18', '245/40ZR18', '245/40 ZR 18', '245/40r18', '  245/40R18  ', '245 / 40 R18', 'P245/40R18'])(
    'when the size is written "%s", then it reads as 245/40R18',
    (written) => {
      expect(tyreDimensions(written)).toEqual(tyreDimensions('245/40R18'));
    },
  );

  it.each(['', '245/40', '245R18', '245/40R', '245-40-18', '245/40R18 97Y', 'abc/40R18', '245/4R18', '245/40X18', '31x10.50R15', '000/00R00'])(
    'when the size is "%s", then an Error says "Use a size like 245/40R18"',
    (bad) => {
      expect(() => tyreDimensions(bad)).toThrow(Error);
      expect(() => tyreDimensions(bad)).toThrow(/Use a size like 245\/40R18/);
    },
  );

  it('when the size is not a string at all, then the same clear Error', () => {
    expect(() => tyreDimensions(undefined as unknown as string)).toThrow(/Use a size like 245\/40R18/);
  });

  it('when spaces and case vary around a valid size, then the result does not change (property)', () => {
    const space = fc.constantFrom('', ' ', '  ');
    fc.assert(
      fc.property(fc.integer({ min: 125, max: 355 }), fc.integer({ min: 25, max: 80 }), fc.integer({ min: 13, max: 22 }), space, space, space, fc.boolean(), fc.boolean(), (w, ar, rim, s1, s2, s3, z, lower) => {
        const r = `${z ? 'Z' : ''}R`;
        const written = `${s1}${w}/${ar}${s2}${lower ? r.toLowerCase() : r}${s3}${rim}${s1}`;
        expect(tyreDimensions(written)).toEqual(tyreDimensions(`${w}/${ar}R${rim}`));
      }),
    );
  });
});
