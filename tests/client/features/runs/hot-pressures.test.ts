import { describe, expect, it } from 'vitest';
import { METRIC_PREFERENCES, IMPERIAL_PREFERENCES } from '../../../../shared/calc/units.calc';
import { emptyCornerText, readPressures } from '@/features/runs/utils/hot-pressures';

describe('hot pressures typed at the car', () => {
  it('when a corner is not a number, then the example in its message is in the unit the driver types in', () => {
    const texts = { ...emptyCornerText(), lf: '3o', rr: '225' };
    // 1 psi = 6.894 757 kPa (NIST SP 811): 224 kPa is 32.5 psi to one decimal.
    expect(readPressures(texts, METRIC_PREFERENCES).errors).toEqual({ lf: 'Type a number, e.g. 224 kPa' });
    expect(readPressures({ ...texts, rr: '32.6' }, IMPERIAL_PREFERENCES).errors).toEqual({ lf: 'Type a number, e.g. 32.5 psi' });
  });

  it('when corners are typed in psi, then they are kept in kPa, and an empty corner is left out', () => {
    const { kpa, errors } = readPressures({ lf: '30', rf: '', lr: '28.5', rr: '' }, IMPERIAL_PREFERENCES);
    expect(errors).toEqual({});
    // 30 psi × 6.894 757 = 206.84 kPa; 28.5 psi = 196.50 kPa (NIST SP 811).
    expect(kpa!.lf).toBeCloseTo(206.843, 2);
    expect(kpa!.lr).toBeCloseTo(196.501, 2);
    expect(Object.keys(kpa!)).toEqual(['lf', 'lr']);
  });
});
