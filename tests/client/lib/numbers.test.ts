import { describe, expect, it } from 'vitest';
import { METRIC_PREFERENCES } from '@shared/calc/units.calc';
import { parseDecimal, typeANumber } from '@/lib/numbers';
import { readNumber } from '@/features/calculators/utils/calc-fields';
import { rowToChange } from '@/features/suggestions/utils/change-rows';
import { emptyCornerText, readPressures } from '@/features/runs/utils/hot-pressures';
import { tyreSetFormSchema } from '@/features/tyres/utils/tyre-set-form';

describe('parseDecimal', () => {
  it.each([
    ['32.5', 32.5],
    ['32,5', 32.5],
    [' 7 ', 7],
    ['+2', 2],
    ['-0.5', -0.5],
    ['−0.5', -0.5], // U+2212, the minus a copied value carries
    ['–0.5', -0.5], // U+2013, what some keyboards give for a dash
    ['.5', 0.5],
  ])('when "%s" is typed, then it reads %d', (text, value) => {
    expect(parseDecimal(text)).toEqual({ kind: 'number', value });
  });

  it.each(['abc', '1.2.3', '1e3', '--1', '12 psi', '0x10', 'Infinity'])('when "%s" is typed, then it is refused, not guessed at', (text) => {
    expect(parseDecimal(text)).toEqual({ kind: 'invalid' });
  });

  it('when nothing but spaces is typed, then the field is empty', () => {
    expect(parseDecimal('   ')).toEqual({ kind: 'empty' });
  });
});

describe('typeANumber', () => {
  it('when given an example, then the message shows it as typed', () => {
    expect(typeANumber('-0.5')).toBe('Type a number, e.g. -0.5');
    expect(typeANumber()).toBe('Type a number');
  });

  it('when text that is not a number is typed in a calculator, a suggested change, a hot pressure or a tyre set, then every form says it the same way', () => {
    const calculator = readNumber('abc', 0.8);
    const messages = [
      calculator.kind === 'invalid' ? calculator.message : null,
      rowToChange({ key: 'k', field: 'camberDeg', corners: ['lf'], mode: 'delta', amount: 'abc' }, METRIC_PREFERENCES).problems.find((p) => p.path === 'delta')?.message,
      readPressures({ ...emptyCornerText(), lf: 'abc' }, METRIC_PREFERENCES).errors.lf,
      tyreSetFormSchema(METRIC_PREFERENCES)
        .safeParse({ label: 'Set A', size: '', boughtOn: '', startTreadMm: 'abc' })
        .error?.issues.find((i) => i.path.join('.') === 'startTreadMm')?.message,
    ];
    for (const message of messages) expect(message).toMatch(/^Type a number(, e\.g\. \S.*)?$/);
  });
});
