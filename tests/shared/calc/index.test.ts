import { describe, expect, it } from 'vitest';
import * as calc from '../../../shared/calc';
import * as alignment from '../../../shared/calc/alignment.calc';
import * as buildSheet from '../../../shared/calc/build-sheet.calc';
import * as comparison from '../../../shared/calc/comparison.calc';
import * as cornerWeights from '../../../shared/calc/corner-weights.calc';
import * as droop from '../../../shared/calc/droop.calc';
import * as invoice from '../../../shared/calc/invoice.calc';
import * as pressure from '../../../shared/calc/pressure.calc';
import * as scoring from '../../../shared/calc/scoring.calc';
import * as suspension from '../../../shared/calc/suspension.calc';
import * as trend from '../../../shared/calc/trend.calc';
import * as tyre from '../../../shared/calc/tyre.calc';
import * as units from '../../../shared/calc/units.calc';
import * as wear from '../../../shared/calc/wear.calc';

// shared/calc/index.ts is the one public face outside checks import from: every name must be there, unchanged.
const REQUIRED_FUNCTIONS = [
  'tyreDimensions',
  'hotPressureKpa',
  'coldPressureKpa',
  'convert',
  'wheelRateNPerMm',
  'rideFrequencyHz',
  'wheelRateForFrequencyNPerMm',
  'cornerWeights',
  'wedgeChange',
  'toeAngleDeg',
  'toeLengthMm',
  'camberDeg',
  'droopCheck',
  'bumpTravelAtWheelMm',
  'compressedLengthCheck',
  'buildSheetChecks',
  'buildSheetCornerChecks',
  'balanceIfComplete',
  'invoiceTotals',
  'invoiceLineCents',
  'wearRateMmPerRun',
  'runsLeft',
  'innerOuterSkewMm',
  'wearPattern',
  'compareSamples',
  'verdict',
  'leastSquaresSlope',
] as const;

describe('shared/calc/index.ts', () => {
  it.each(REQUIRED_FUNCTIONS)('when %s is imported from the index, then it is a function', (name) => {
    expect(typeof calc[name]).toBe('function');
  });

  it('when the index is read, then MINIMUM_TREAD_MM is exported as the 1.6 mm wear-bar depth', () => {
    expect(calc.MINIMUM_TREAD_MM).toBe(wear.MINIMUM_TREAD_MM);
    expect(typeof calc.MINIMUM_TREAD_MM).toBe('number');
  });

  it('when every topic module is compared with the index, then each of its exports is re-exported as the same value', () => {
    const modules = { alignment, buildSheet, comparison, cornerWeights, droop, invoice, pressure, scoring, suspension, trend, tyre, units, wear };
    for (const [file, mod] of Object.entries(modules)) {
      for (const [name, value] of Object.entries(mod)) {
        expect(Object.hasOwn(calc, name), `${file}.${name} is missing from the index`).toBe(true);
        expect((calc as Record<string, unknown>)[name]).toBe(value);
      }
    }
  });
});
