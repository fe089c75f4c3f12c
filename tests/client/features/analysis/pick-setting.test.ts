import { describe, expect, it } from 'vitest';
import type { Setup } from '../../../../shared/season/setup.schema';
import { firstVariedSetting } from '@/features/analysis/utils/pick-setting';
import { BASE_SETUP } from '../../fixtures/season';

const withCorners = (over: Partial<Record<'lf' | 'rf' | 'lr' | 'rr', Partial<Setup['corners']['lf']>>>): Pick<Setup, 'corners'> => ({
  corners: {
    lf: { ...BASE_SETUP.corners.lf, ...over.lf },
    rf: { ...BASE_SETUP.corners.rf, ...over.rf },
    lr: { ...BASE_SETUP.corners.lr, ...over.lr },
    rr: { ...BASE_SETUP.corners.rr, ...over.rr },
  },
});

describe('firstVariedSetting', () => {
  it('when only the rear clicks changed over the season, then the plot opens on rear clicks', () => {
    expect(firstVariedSetting([BASE_SETUP, withCorners({ lr: { damperClicks: 12 }, rr: { damperClicks: 12 } })])).toEqual({ param: 'damperClicks', corner: 'rear' });
  });

  it('when camber and pressures both changed, then camber comes first, as the list orders them', () => {
    const later = withCorners({ lf: { camberDeg: -2.4, coldPressureKpa: 190 }, rf: { camberDeg: -2.4, coldPressureKpa: 190 } });
    expect(firstVariedSetting([BASE_SETUP, later])).toEqual({ param: 'camber', corner: 'front' });
  });

  it('when a change moved one corner but kept the axle’s mean, or nothing changed, or a value is missing, then it falls back to front camber', () => {
    // −1.0 and −1.4 average −1.2, as the baseline's −1.2 and −1.2 do: the axle's value did not change.
    const crossed = withCorners({ lf: { camberDeg: -1.0 }, rf: { camberDeg: -1.4 } });
    expect(firstVariedSetting([BASE_SETUP, crossed])).toEqual({ param: 'camber', corner: 'front' });
    expect(firstVariedSetting([BASE_SETUP, BASE_SETUP])).toEqual({ param: 'camber', corner: 'front' });
    expect(firstVariedSetting([])).toEqual({ param: 'camber', corner: 'front' });
    expect(firstVariedSetting([BASE_SETUP, withCorners({ lr: { springRateNPerMm: null }, rr: { springRateNPerMm: 60 } })])).toEqual({ param: 'camber', corner: 'front' });
  });
});
