// @vitest-environment jsdom
import { screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it, vi } from 'vitest';
import { IMPERIAL_PREFERENCES, METRIC_PREFERENCES, type UnitPreferences } from '../../../../shared/calc/units.calc';
import type { Setup } from '../../../../shared/season/setup.schema';
import { formatDateTime } from '@/lib/dates';
import { errorResponse, jsonResponse, renderApp, setUpAppTests, stubFetch } from '../../test-utils';
import { BASE_SETUP, CAR, IDS, user } from '../../fixtures/season';

setUpAppTests([() => import('@/app/routes/setups/setup-sheet')]);

const SHEET = `/setups/${IDS.setupBase}/sheet`;
const SETUP: Setup = {
  ...BASE_SETUP,
  notes: 'Front bar stiffer for the tight course.',
  corners: {
    ...BASE_SETUP.corners,
    lf: {
      camberDeg: -1.2, toeMm: -0.5, casterDeg: 6.5, springRateNPerMm: 70, rideHeightMm: 120,
      damperClicks: 8, damperReboundClicks: 11, coldPressureKpa: 200, cornerWeightKg: 262.5,
    },
  },
};

function stub(units: UnitPreferences) {
  return stubFetch({
    'GET /api/auth/session': jsonResponse(200, { user: user(units) }),
    [`GET /api/setups/${IDS.setupBase}`]: jsonResponse(200, SETUP),
    [`GET /api/cars/${IDS.car}`]: jsonResponse(200, CAR),
  });
}

const valueOf = (corner: HTMLElement, label: string) => within(corner).getByText(label).nextElementSibling?.textContent;

describe('the printable setup sheet', () => {
  it('when the user reads imperial units, then every corner value shows converted, with the car, the snapshot and its date', async () => {
    stub(IMPERIAL_PREFERENCES);
    renderApp(SHEET);

    expect(await screen.findByRole('heading', { level: 1, name: 'Grey roadster' })).toBeTruthy();
    expect(screen.getByText('Class SM · No. 47 · Tyres 205/50R15')).toBeTruthy();
    expect(screen.getByRole('heading', { name: 'Spring baseline' })).toBeTruthy();
    expect(screen.getByText(formatDateTime('2026-04-01T08:00:00.000Z'))).toBeTruthy();
    const snapshot = screen.getByRole('region', { name: 'The snapshot' });
    expect(within(snapshot).getByText('Recorded by').nextElementSibling?.textContent).toBe('Maren Holt');

    // Factors from the exact definitions (NIST SP 811, App. B): 1 in = 25.4 mm, 1 lb = 0.453 592 37 kg,
    // 1 psi = 6.894 757 kPa, 1 lbf/in = 0.175 126 835 N/mm.
    const lf = screen.getByRole('group', { name: 'Left front' });
    expect(valueOf(lf, 'Cold pressure')).toBe('29.0 psi'); // 200 kPa ÷ 6.894 757 = 29.008 psi
    expect(valueOf(lf, 'Ride height')).toBe('4.72 in'); // 120 mm ÷ 25.4 = 4.724 in
    expect(valueOf(lf, 'Spring rate')).toBe('400 lb/in'); // 70 N/mm ÷ 0.175 126 835 = 399.71 lbf/in
    expect(valueOf(lf, 'Corner weight')).toBe('579 lb'); // 262.5 kg ÷ 0.453 592 37 = 578.71 lb
    expect(valueOf(lf, 'Toe')).toMatch(/^[-−]0\.02 in$/); // −0.5 mm ÷ 25.4 = −0.0197 in
    expect(valueOf(lf, 'Camber')).toMatch(/^[-−]1\.20°$/); // angles stay in degrees
    expect(valueOf(lf, 'Rebound clicks')).toBe('11 clicks');
    // A value never recorded says so rather than showing zero.
    expect(valueOf(screen.getByRole('group', { name: 'Right rear' }), 'Spring rate')).toBe('—');
    expect(valueOf(screen.getByRole('group', { name: 'Right rear' }), 'Cold pressure')).toBe('27.6 psi'); // 190 kPa

    const axles = screen.getByRole('region', { name: 'Axles' });
    expect(within(axles).getByText('Front').nextElementSibling?.textContent).toBe('hole 2');
    expect(within(axles).getByText('Rear').nextElementSibling?.textContent).toBe('—');
    expect(screen.getByText('Front bar stiffer for the tight course.')).toBeTruthy();
    expect(screen.getByRole('complementary', { name: 'A record, not instructions' }).textContent).toMatch(/vehicle maker.s figures and torque specs/);
  });

  it('when the user reads metric units, then the stored SI values show as they are', async () => {
    stub(METRIC_PREFERENCES);
    renderApp(SHEET);
    const lf = await screen.findByRole('group', { name: 'Left front' });
    expect(valueOf(lf, 'Cold pressure')).toBe('200 kPa');
    expect(valueOf(lf, 'Ride height')).toBe('120.0 mm');
    expect(valueOf(lf, 'Spring rate')).toBe('70.0 N/mm');
    expect(valueOf(lf, 'Corner weight')).toBe('262.5 kg');
  });

  it('when Print is pressed, then the browser prints the page', async () => {
    stub(METRIC_PREFERENCES);
    const print = vi.fn();
    vi.stubGlobal('print', print);
    renderApp(SHEET);
    await userEvent.setup().click(await screen.findByRole('button', { name: 'Print' }));
    expect(print).toHaveBeenCalledTimes(1);
  });

  it('when the setup is not visible to this user, then the page says it was not found', async () => {
    stubFetch({
      'GET /api/auth/session': jsonResponse(200, { user: user() }),
      [`GET /api/setups/${IDS.setupBase}`]: errorResponse(404, 'not_found', 'That setup was not found.'),
    });
    renderApp(SHEET);
    expect(await screen.findByRole('heading', { name: 'Setup not found' })).toBeTruthy();
  });
});
