// @vitest-environment jsdom
import { cleanup, render, screen } from '@testing-library/react';
import { afterEach, describe, expect, it } from 'vitest';
import type { Car } from '../../../../shared/season/car.schema';
import type { SetupChange } from '../../../../shared/season/setup.schema';
import { METRIC_PREFERENCES } from '../../../../shared/calc/units.calc';
import { SetupChangeList } from '@/features/setups/components/setup-change-list';
import { UnitsProvider } from '@/lib/units-context';

const change = (corner: 'lf' | 'rf' | 'lr' | 'rr', field: string, from: number, to: number): SetupChange => ({
  path: `corners.${corner}.${field}`,
  corner,
  axle: null,
  field,
  from,
  to,
  delta: Number((to - from).toFixed(6)),
});

function lines(changes: SetupChange[], adjusters?: Car['damperAdjusters']) {
  render(
    <UnitsProvider units={METRIC_PREFERENCES}>
      <SetupChangeList changes={changes} adjusters={adjusters} />
    </UnitsProvider>,
  );
  return screen.getAllByRole('listitem').map((li) => li.textContent);
}

afterEach(cleanup);

describe('the setup-change summary', () => {
  it('when diagonal corners change by the same amount, then each corner is its own line with its from → to, never "LF + RR"', () => {
    // A corner-weight session: LF and RR down 2 mm, RF and LR down 1 mm (plain arithmetic on the values).
    const text = lines([
      change('lf', 'rideHeightMm', 120, 118),
      change('rf', 'rideHeightMm', 121, 120),
      change('lr', 'rideHeightMm', 125, 124),
      change('rr', 'rideHeightMm', 126, 124),
    ]);
    expect(text.some((t) => t!.includes('+'))).toBe(false);
    expect(text).toEqual([
      'LF ride height▼ 2.0 mm(120.0 mm → 118.0 mm)',
      'RR ride height▼ 2.0 mm(126.0 mm → 124.0 mm)',
      'RF ride height▼ 1.0 mm(121.0 mm → 120.0 mm)',
      'LR ride height▼ 1.0 mm(125.0 mm → 124.0 mm)',
    ]);
  });

  it('when an axle or a side changes together, then it is one line; with different starting values, each corner\'s from → to is listed', () => {
    const text = lines([
      change('lf', 'rideHeightMm', 120, 118),
      change('rf', 'rideHeightMm', 122, 120),
      change('lr', 'coldPressureKpa', 200, 190),
      change('rr', 'coldPressureKpa', 210, 200),
      change('lf', 'toeMm', 0, 1),
      change('lr', 'toeMm', 0, 1),
    ]);
    expect(text).toEqual([
      'Front ride height▼ 2.0 mm(LF 120.0 mm → 118.0 mm, RF 122.0 mm → 120.0 mm)',
      'Rear cold pressure▼ 10 kPa(LR 200 kPa → 190 kPa, RR 210 kPa → 200 kPa)',
      'Left side toe▲ 1.0 mm(0.0 mm → 1.0 mm)',
    ]);
  });

  it('when front camber goes from −2.40° to −1.80°, then it says "0.60° less negative", not an up arrow; the other way, "more negative"', () => {
    // −1.80 − (−2.40) = 0.60 (plain arithmetic).
    const text = lines([change('lf', 'camberDeg', -2.4, -1.8), change('rf', 'camberDeg', -2.4, -1.8), change('lr', 'camberDeg', -1.5, -2)]);
    expect(text[0]).toBe('Front camber0.60° less negative(\u22122.40° → \u22121.80°)');
    expect(text[1]).toBe('LR camber0.50° more negative(\u22121.50° → \u22122.00°)');
    expect(text.join(' ')).not.toMatch(/[▲▼]/);
  });

  it('when the rear dampers\' bump clicks count from full soft and their rebound adjuster\'s from full stiff, then two more of each read stiffer and softer', () => {
    // From full soft more clicks are stiffer, from full stiff softer (common practice; the damper maker's manual says which end).
    const text = lines(
      [change('lr', 'damperClicks', 6, 8), change('rr', 'damperClicks', 6, 8), change('lr', 'damperReboundClicks', 10, 12), change('rr', 'damperReboundClicks', 10, 12)],
      { front: null, rear: { positions: 12, countFrom: 'full_soft', rebound: { positions: 20, countFrom: 'full_stiff' } } },
    );
    expect(text).toEqual(['Rear clicks▲ 2 clicksstiffer(6 clicks → 8 clicks)', 'Rear rebound clicks▲ 2 clickssofter(10 clicks → 12 clicks)']);
  });
});
