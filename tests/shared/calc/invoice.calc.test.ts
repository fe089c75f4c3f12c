import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { add, bignumber, divide, multiply, round, type BigNumber } from 'mathjs';
import { invoiceLineCents, invoiceTotals, roundedTaxRate } from '../../../shared/calc/invoice.calc';

// Hand-worked examples: the arithmetic is written out beside each one (worked by hand, common practice:
// money in whole cents, each line and the tax rounded to the cent, halves away from zero).
const HAND = 'worked by hand';
// The independent check: mathjs BigNumber (decimal arithmetic, mathjs 15 on npm), whose round() sends halves
// away from zero (decimal.js ROUND_HALF_UP, its default rounding mode).
const MATHJS = 'independent: mathjs bignumber';

describe('invoiceLineCents', () => {
  it(`when 2 parts at 1999 ¢ each, then 2 × 1999 = 3998 ¢ (${HAND})`, () => {
    expect(invoiceLineCents({ quantity: 2, unitPriceCents: 1999 })).toBe(3998);
  });

  it(`when 0.29 h at 50 ¢, then 0.29 × 50 = 14.5 → 15 ¢, a half rounded up (${HAND}; binary floating point gives 14.4999… and 14)`, () => {
    expect(0.29 * 50).toBeLessThan(14.5);
    expect(invoiceLineCents({ quantity: 0.29, unitPriceCents: 50 })).toBe(15);
  });

  it(`when 1.25 × 1 ¢ and 0.25 × 2 ¢, then 1.25 → 1 ¢ and 0.5 → 1 ¢ (${HAND})`, () => {
    expect(invoiceLineCents({ quantity: 1.25, unitPriceCents: 1 })).toBe(1);
    expect(invoiceLineCents({ quantity: 0.25, unitPriceCents: 2 })).toBe(1);
  });

  it(`when a credit of 1.5 × −3 ¢, then −4.5 → −5 ¢, the half going away from zero (${HAND})`, () => {
    expect(invoiceLineCents({ quantity: 1.5, unitPriceCents: -3 })).toBe(-5);
  });

  it('when the quantity has three decimals or the price a fraction of a cent, then a RangeError naming it', () => {
    expect(() => invoiceLineCents({ quantity: 1.234, unitPriceCents: 100 })).toThrow(/Quantity may have at most two decimals/);
    expect(() => invoiceLineCents({ quantity: 1, unitPriceCents: 10.5 })).toThrow(/Unit price/);
    expect(() => invoiceLineCents({ quantity: Number.NaN, unitPriceCents: 10 })).toThrow(RangeError);
  });
});

describe('invoiceTotals', () => {
  it(`when 2 × 1999 ¢ of parts and 1.5 h × 9500 ¢ of labour at 8.25 % tax, then 3998 + 14250 = 18248, tax 18248 × 0.0825 = 1505.46 → 1505, total 19753 (${HAND})`, () => {
    expect(invoiceTotals([{ quantity: 2, unitPriceCents: 1999 }, { quantity: 1.5, unitPriceCents: 9500 }], 8.25)).toEqual({
      lineCents: [3998, 14250],
      subtotalCents: 18248,
      taxCents: 1505,
      totalCents: 19753,
    });
  });

  it(`when 10 ¢ at 5 % tax, then 10 × 0.05 = 0.5 → 1 ¢ tax (half away from zero, not to even), total 11 (${HAND})`, () => {
    expect(invoiceTotals([{ quantity: 1, unitPriceCents: 10 }], 5)).toMatchObject({ subtotalCents: 10, taxCents: 1, totalCents: 11 });
  });

  it(`when 1000 ¢ at 8.875 % tax, then 1000 × 0.08875 = 88.75 → 89 ¢, total 1089 (${HAND})`, () => {
    expect(invoiceTotals([{ quantity: 1, unitPriceCents: 1000 }], 8.875)).toMatchObject({ taxCents: 89, totalCents: 1089 });
  });

  it(`when each line rounds on its own, then the subtotal sums the rounded lines: 0.5 × 3 = 1.5 → 2, twice, = 4 ¢ (not 3) (${HAND})`, () => {
    expect(invoiceTotals([{ quantity: 0.5, unitPriceCents: 3 }, { quantity: 0.5, unitPriceCents: 3 }], 0)).toEqual({
      lineCents: [2, 2],
      subtotalCents: 4,
      taxCents: 0,
      totalCents: 4,
    });
  });

  it(`when there are no lines, then every total is 0 (${HAND})`, () => {
    expect(invoiceTotals([], 20)).toEqual({ lineCents: [], subtotalCents: 0, taxCents: 0, totalCents: 0 });
  });

  it('when the tax rate is negative or has five decimals, then a RangeError', () => {
    expect(() => invoiceTotals([], -1)).toThrow(/Tax rate must be 0 or more/);
    expect(() => invoiceTotals([], 8.12345)).toThrow(/Tax rate may have at most four decimals/);
  });

  it(`checks its reference: mathjs rounds BigNumber halves away from zero (2.5 → 3, −2.5 → −3) (${MATHJS})`, () => {
    expect(round(bignumber('2.5')).toString()).toBe('3');
    expect(round(bignumber('-2.5')).toString()).toBe('-3');
  });

  // Quantities as decimal text with two places, prices in whole cents, rates with three places: the shapes
  // the shop types in. The same text goes to mathjs, so neither side sees a binary fraction the other does not.
  const line = fc.record({
    hundredths: fc.integer({ min: 1, max: 100_000 }),
    unitPriceCents: fc.integer({ min: -50_000, max: 500_000 }),
  });
  const rateThousandths = fc.integer({ min: 0, max: 50_000 });
  const decimalText = (n: number, places: number) => (n / 10 ** places).toFixed(places);

  it(`when random lines and a random rate are totalled, then every amount equals the decimal reference (${MATHJS}; property)`, () => {
    fc.assert(
      fc.property(fc.array(line, { maxLength: 12 }), rateThousandths, (lines, rate) => {
        const quantities = lines.map((l) => decimalText(l.hundredths, 2));
        const rateText = decimalText(rate, 3);
        const got = invoiceTotals(
          lines.map((l, i) => ({ quantity: Number(quantities[i]), unitPriceCents: l.unitPriceCents })),
          Number(rateText),
        );

        const refLines = lines.map((l, i) => round(multiply(bignumber(quantities[i]!), bignumber(l.unitPriceCents)) as BigNumber));
        const refSubtotal = refLines.reduce<BigNumber>((sum, x) => add(sum, x) as BigNumber, bignumber(0));
        const refTax = round(divide(multiply(refSubtotal, bignumber(rateText)), bignumber(100)) as BigNumber);
        const refTotal = add(refSubtotal, refTax) as BigNumber;

        expect(got.lineCents.map(String)).toEqual(refLines.map((x) => x.toString()));
        expect(String(got.subtotalCents)).toBe(refSubtotal.toString());
        expect(String(got.taxCents)).toBe(refTax.toString());
        expect(String(got.totalCents)).toBe(refTotal.toString());
      }),
      { numRuns: 500 },
    );
  });

  it('when any invoice is totalled, then total = subtotal + tax and the tax is within half a cent of subtotal × rate (property)', () => {
    fc.assert(
      fc.property(fc.array(line, { maxLength: 12 }), rateThousandths, (lines, rate) => {
        const r = invoiceTotals(lines.map((l) => ({ quantity: l.hundredths / 100, unitPriceCents: l.unitPriceCents })), rate / 1000);
        expect(r.totalCents).toBe(r.subtotalCents + r.taxCents);
        expect(Math.abs(r.taxCents - (r.subtotalCents * rate) / 100_000)).toBeLessThanOrEqual(0.5 + 1e-9);
      }),
    );
  });
});

describe('roundedTaxRate', () => {
  it('when a stored rate has more than four decimals, then the rounded one is worked with (to 4 decimals, halves up), where the raw one is refused', () => {
    const lines = [{ quantity: 1, unitPriceCents: 10_000 }];
    expect(() => invoiceTotals(lines, 8.123456)).toThrow(RangeError);
    expect(roundedTaxRate(8.123456)).toBe(8.1235);
    // mathjs, an independent decimal library: 10 000 cents × 8.1235 % = 812.35 → 812 cents.
    const expected = Number(round(divide(multiply(bignumber(10_000), bignumber('8.1235')), bignumber(100)) as BigNumber, 0));
    expect(invoiceTotals(lines, roundedTaxRate(8.123456)).taxCents).toBe(expected);
    expect(roundedTaxRate(8.25)).toBe(8.25);
  });
});
