// @vitest-environment jsdom
import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import { IMPERIAL_PREFERENCES, METRIC_PREFERENCES, type UnitPreferences } from '../../../../shared/calc/units.calc';
import type { Suggestion } from '../../../../shared/collab/suggestion.schema';
import { jsonResponse, renderApp, requestsTo, setUpAppTests, stubFetch } from '../../test-utils';
import { BASE_SETUP, CAR, IDS, list, user } from '../../fixtures/season';
import { COLLAB_IDS, staffUser, suggestion } from '../../fixtures/collab';

// BASE_SETUP: camber −1.2° front; cold pressure 200 kPa front, 190 kPa rear; ride height 120 mm front, 125 mm rear.
// Conversions: NIST SP 811 (2008), Appendix B.8 — 1 in = 25.4 mm, 1 psi = 6.894 757 kPa.
// Thresholds (common practice): camber beyond −5°, cold pressure below 140 kPa, a pressure step past 50 kPa,
// a ride-height step past 50 mm.

setUpAppTests([() => import('@/app/routes/suggestions/new-suggestion'), () => import('@/app/routes/suggestions/suggestion')]);

const FORM = `/shop/customers/${IDS.car}/suggestions/new?from=${IDS.setupBase}`;
const POST = `POST /api/cars/${IDS.car}/suggestions`;
const PAGE = `/suggestions/${COLLAB_IDS.suggestion}`;

const unusual = () => screen.queryByRole('complementary', { name: 'Unusual values' });
const change = (n: number) => screen.getByRole('group', { name: `Change ${n}` });
type U = ReturnType<typeof userEvent.setup>;

function stubForm(units: UnitPreferences) {
  return stubFetch({
    'GET /api/auth/session': jsonResponse(200, { user: { ...staffUser(), preferences: { units } } }),
    [`GET /api/cars/${IDS.car}`]: jsonResponse(200, CAR),
    [`GET /api/cars/${IDS.car}/setups`]: list([BASE_SETUP]),
    [POST]: ({ body }) => jsonResponse(201, suggestion({ id: (body as { id: string }).id })),
    [`GET /api/suggestions/${COLLAB_IDS.suggestion}`]: jsonResponse(200, suggestion()),
  });
}

async function fillWords(u: U) {
  await u.click(await screen.findByLabelText('Title'));
  await u.paste('Much more camber');
  await u.click(screen.getByLabelText('Why'));
  await u.paste('For the wet event.');
}

describe('unusual values on the shop’s suggestion form', () => {
  it('when camber is set to −7° on the front pair, then a caution names it before sending, and the suggestion can still be sent', async () => {
    const fetchMock = stubForm(METRIC_PREFERENCES);
    renderApp(FORM);
    const u = userEvent.setup();
    await fillWords(u);
    await u.click(within(change(1)).getByRole('button', { name: 'Front pair' }));
    await u.click(within(change(1)).getByRole('radio', { name: 'Set to' }));
    const amount = within(change(1)).getByLabelText('Set camber to');

    await u.type(amount, '-4.5');
    expect(unusual()).toBeNull();

    await u.clear(amount);
    await u.type(amount, '-7');
    const caution = unusual()!;
    expect(within(caution).getByRole('listitem').textContent).toMatch(/^Front pair camber \u22127\.00°: more negative than \u22125\.00°/);
    expect(caution.textContent).toContain('Check each one before sending');
    expect(caution.textContent).toContain('vehicle and tyre makers’ figures');
    expect(caution.textContent).toContain('re-check wheel and suspension torque and the alignment');
    expect(caution.textContent).toContain('set pressures cold');

    // It warns; it does not stop the shop.
    await u.click(screen.getByRole('button', { name: 'Send the suggestion' }));
    await waitFor(() => expect(requestsTo(fetchMock, POST)).toHaveLength(1));
  });

  it('when ride height is changed by −2.50 in on the front pair in inches, then the step from the car’s 4.72 in is named in inches; by −1.50 in, then nothing', async () => {
    stubForm(IMPERIAL_PREFERENCES);
    renderApp(FORM);
    const u = userEvent.setup();
    const row = within(await screen.findByRole('group', { name: 'Change 1' }));
    await u.selectOptions(row.getByLabelText('What'), 'Ride height');
    await u.click(row.getByRole('button', { name: 'Front pair' }));
    const amount = row.getByLabelText('Change ride height by');

    // 1.50 in = 38.1 mm: a big step, but not past 50 mm.
    await u.type(amount, '-1.5');
    expect(unusual()).toBeNull();

    // 2.50 in = 63.5 mm; 120 mm = 4.72 in → 56.5 mm = 2.22 in; 50 mm = 1.97 in.
    await u.clear(amount);
    await u.type(amount, '-2.5');
    expect(within(unusual()!).getByRole('listitem').textContent).toMatch(/^Front pair ride height lowered 2\.50 in at once \(4\.72 in → 2\.22 in\): more than 1\.97 in/);
  });
});

describe('unusual values for the shop reading back what it sent', () => {
  it('when shop staff open their open suggestion of −7° front camber, then the caution the driver reads is there for them too, in their words', async () => {
    stubPage(
      suggestion({
        title: 'Lots of camber',
        changes: [{ field: 'camberDeg', corners: ['lf', 'rf'], value: -7 }],
        preview: [
          { field: 'camberDeg', corner: 'lf', from: -1.2, to: -7 },
          { field: 'camberDeg', corner: 'rf', from: -1.2, to: -7 },
        ],
      }),
      METRIC_PREFERENCES,
      [BASE_SETUP],
      staffUser(),
    );
    renderApp(PAGE);

    const caution = await within(await decision()).findByRole('complementary', { name: 'Unusual values' });
    expect(within(caution).getByRole('listitem').textContent).toMatch(/^Front pair camber \u22127\.00°: more negative than \u22125\.00°/);
    expect(caution.textContent).toContain('The driver sees this caution before deciding');
    expect(caution.textContent).not.toContain('Before you accept');
    expect(within(await decision()).queryByRole('button', { name: /Accept|Decline/ })).toBeNull();
  });

  it('when shop staff open an ordinary suggestion, then there is no caution', async () => {
    stubPage(suggestion(), METRIC_PREFERENCES, [BASE_SETUP], staffUser());
    renderApp(PAGE);
    await screen.findByRole('heading', { level: 1, name: 'More front camber' });
    await within(await decision()).findByText('The car’s drivers have not decided yet.');
    expect(screen.queryByRole('complementary', { name: 'Unusual values' })).toBeNull();
  });
});

function stubPage(current: Suggestion, units: UnitPreferences = METRIC_PREFERENCES, setups = [BASE_SETUP], me: ReturnType<typeof user> | ReturnType<typeof staffUser> = user(units)) {
  return stubFetch({
    'GET /api/auth/session': jsonResponse(200, { user: me }),
    [`GET /api/cars/${IDS.car}`]: jsonResponse(200, CAR),
    [`GET /api/suggestions/${COLLAB_IDS.suggestion}`]: jsonResponse(200, current),
    [`GET /api/cars/${IDS.car}/setups`]: list(setups),
  });
}

const decision = () => screen.findByRole('region', { name: 'Decision' });

describe('unusual values for the driver deciding on a suggestion', () => {
  it('when a suggestion drops the front pressures 60 kPa at once and the driver reads psi, then the caution gives the step in psi and asks to confirm with the shop', async () => {
    // 60 kPa = 8.7 psi; 200 kPa = 29.0 psi → 140 kPa = 20.3 psi (not below 140 kPa); 50 kPa = 7.3 psi.
    stubPage(
      suggestion({
        title: 'Soft fronts',
        changes: [{ field: 'coldPressureKpa', corners: ['lf', 'rf'], delta: -60 }],
        preview: [
          { field: 'coldPressureKpa', corner: 'lf', from: 200, to: 140 },
          { field: 'coldPressureKpa', corner: 'rf', from: 200, to: 140 },
        ],
      }),
      IMPERIAL_PREFERENCES,
    );
    renderApp(PAGE);

    const caution = await within(await decision()).findByRole('complementary', { name: 'Unusual values' });
    const items = within(caution).getAllByRole('listitem');
    expect(items).toHaveLength(1);
    expect(items[0]!.textContent).toMatch(/^Front pair cold pressure down 8\.7 psi at once \(29\.0 psi → 20\.3 psi\): more than 7\.3 psi/);
    expect(caution.textContent).toContain('Before you accept, ask the shop to confirm them.');
    expect(caution.textContent).toContain('event’s rules and local law come first');
    expect(caution.textContent).toContain('Have the change made by someone qualified, re-check wheel and suspension torque and the alignment afterwards, and set pressures cold.');
    expect(caution.textContent).not.toContain('before sending');
  });

  it('when the car runs on a setup with −4.8° of camber by the time chosen, then accepting −0.5° more is cautioned against that setup (−5.30°); taking effect before it, then not', async () => {
    const since = {
      ...BASE_SETUP,
      id: '5e7e7e7e-0000-4000-8000-0000000000d1',
      label: 'Rain setup',
      effectiveFrom: '2026-06-01T10:00:00.000Z',
      corners: { ...BASE_SETUP.corners, lf: { ...BASE_SETUP.corners.lf, camberDeg: -4.8 }, rf: { ...BASE_SETUP.corners.rf, camberDeg: -4.8 } },
    };
    stubPage(suggestion(), METRIC_PREFERENCES, [since, BASE_SETUP]);
    renderApp(PAGE);
    const u = userEvent.setup();

    // Against the shop's base (−1.2° → −1.7°) nothing is unusual.
    const panel = await decision();
    await within(panel).findByRole('button', { name: 'Accept' });
    expect(unusual()).toBeNull();

    await u.click(within(panel).getByRole('button', { name: 'Accept' }));
    await screen.findByRole('region', { name: 'What accepting records now' });
    expect(within(unusual()!).getByRole('listitem').textContent).toMatch(/^Front pair camber \u22125\.30°: more negative than \u22125\.00°/);

    // Before the rain setup, the base (−1.2° → −1.7°) is in force: nothing unusual.
    const when = screen.getByLabelText('Takes effect from');
    await u.clear(when);
    await u.type(when, '2026-05-20T09:30');
    expect(screen.queryByRole('region', { name: 'What accepting records now' })).toBeNull();
    expect(unusual()).toBeNull();
  });
});
