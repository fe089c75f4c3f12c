// @vitest-environment jsdom
import { describe, expect, it } from 'vitest';
import { IMPERIAL_PREFERENCES, METRIC_PREFERENCES } from '../../../shared/calc/units.calc';
import { formatFieldChange, formatFieldValue } from '@/lib/setup-fields';

// 1 psi = 6.894 757 kPa (NIST SP 811, appendix B; from memory).
const KPA_PER_PSI = 6.894757;

describe('formatFieldChange', () => {
  it('when 200 kPa goes to 190 kPa and the user reads psi, then the change is the one between the two numbers shown, 29.0 → 27.6 psi: ▼ 1.4 psi', () => {
    expect(formatFieldValue('coldPressureKpa', 200, IMPERIAL_PREFERENCES)).toBe(`${(200 / KPA_PER_PSI).toFixed(1)} psi`);
    expect(formatFieldValue('coldPressureKpa', 190, IMPERIAL_PREFERENCES)).toBe(`${(190 / KPA_PER_PSI).toFixed(1)} psi`);
    const shownDiff = Number((200 / KPA_PER_PSI).toFixed(1)) - Number((190 / KPA_PER_PSI).toFixed(1));
    expect(formatFieldChange('coldPressureKpa', 200, 190, IMPERIAL_PREFERENCES)).toBe(`▼ ${shownDiff.toFixed(1)} psi`);
    expect(shownDiff.toFixed(1)).toBe('1.4');
  });

  it('when the user reads kPa, then the same change is the stored one, ▼ 10 kPa', () => {
    expect(formatFieldChange('coldPressureKpa', 200, 190, METRIC_PREFERENCES)).toBe('▼ 10 kPa');
  });

  it('when two values differ by less than the unit shows, then the change reads as none, like the two equal numbers beside it', () => {
    // 200 and 200.1 kPa are both 29.0 psi.
    expect(formatFieldChange('coldPressureKpa', 200, 200.1, IMPERIAL_PREFERENCES)).toBe('no change');
  });

  it('when clicks change, then the change is in whole clicks', () => {
    expect(formatFieldChange('damperClicks', 7, 9, METRIC_PREFERENCES)).toBe('▲ 2 clicks');
  });
});

describe('a setup change in a list, read in psi', () => {
  it('when a change shows its two ends, then the amount beside them adds up with them', async () => {
    const { render, screen } = await import('@testing-library/react');
    const { SetupChangeList } = await import('@/features/setups/components/setup-change-list');
    const { UnitsProvider } = await import('@/lib/units-context');
    render(
      <UnitsProvider units={IMPERIAL_PREFERENCES}>
        <SetupChangeList changes={(['lf', 'rf'] as const).map((corner) => ({ path: `corners.${corner}.coldPressureKpa`, corner, axle: null, field: 'coldPressureKpa', from: 200, to: 190, delta: -10 }))} />
      </UnitsProvider>,
    );
    const item = screen.getByRole('listitem');
    expect(item.textContent).toContain('▼ 1.4 psi');
    expect(item.textContent).toContain('(29.0 psi → 27.6 psi)');
  });
});
