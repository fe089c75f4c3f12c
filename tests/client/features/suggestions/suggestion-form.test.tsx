// @vitest-environment jsdom
import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import { IMPERIAL_PREFERENCES, METRIC_PREFERENCES, type UnitPreferences } from '../../../../shared/calc/units.calc';
import { errorResponse, jsonResponse, renderApp, requestsTo, setUpAppTests, stubFetch } from '../../test-utils';
import type { Car } from '../../../../shared/season/car.schema';
import type { Setup } from '../../../../shared/season/setup.schema';
import { BASE_SETUP, CAR, IDS, list, UUID } from '../../fixtures/season';
import { COLLAB_IDS, staffUser, suggestion } from '../../fixtures/collab';

const PATH = `/shop/customers/${IDS.car}/suggestions/new?from=${IDS.setupBase}`;
const POST = `POST /api/cars/${IDS.car}/suggestions`;

setUpAppTests([() => import('@/app/routes/suggestions/new-suggestion')]);

function stub(units: UnitPreferences, extra: Parameters<typeof stubFetch>[0] = {}, car: Car = CAR, base: Setup = BASE_SETUP) {
  return stubFetch({
    'GET /api/auth/session': jsonResponse(200, { user: { ...staffUser(), preferences: { units } } }),
    [`GET /api/cars/${IDS.car}`]: jsonResponse(200, car),
    [`GET /api/cars/${IDS.car}/setups`]: list([base]),
    [`GET /api/suggestions/${COLLAB_IDS.suggestion}`]: jsonResponse(200, suggestion()),
    ...extra,
  });
}

type U = ReturnType<typeof userEvent.setup>;
const change = (n: number) => screen.getByRole('group', { name: `Change ${n}` });
const whatOptions = (n: number) => within(within(change(n)).getByLabelText('What')).getAllByRole('option').map((o) => o.textContent);

/** BASE_SETUP with rebound clicks recorded at every corner: the car's dampers are double-adjustable. */
const DOUBLE_ADJUSTABLE: Setup = {
  ...BASE_SETUP,
  corners: Object.fromEntries(Object.entries(BASE_SETUP.corners).map(([c, v]) => [c, { ...v, damperReboundClicks: 12 }])) as Setup['corners'],
};

async function fillWords(u: U) {
  await u.click(await screen.findByLabelText('Title'));
  await u.paste('More front camber, softer pressures');
  await u.click(screen.getByLabelText('Why'));
  await u.paste('The outside front edges wear faster than the middle.');
}

describe('suggesting a setup change', () => {
  it('when changes are typed in imperial units, then each corner previews from → to and the request carries SI values', async () => {
    const fetchMock = stub(IMPERIAL_PREFERENCES, {
      [POST]: ({ body }) => jsonResponse(201, suggestion({ id: (body as { id: string }).id })),
    });
    const { router } = renderApp(PATH);
    const u = userEvent.setup();
    await fillWords(u);

    // Change 1: front pair camber by −0.5° (degrees need no conversion).
    await u.click(within(change(1)).getByRole('button', { name: 'Front pair' }));
    await u.type(within(change(1)).getByLabelText('Change camber by'), '-0.5');
    const lf = within(within(change(1)).getByRole('group', { name: 'Left front' })).getByRole('button');
    expect(lf.getAttribute('aria-pressed')).toBe('true');
    // −1.20° now, −1.70° after, 0.50° less (the base snapshot has −1.2° on the front).
    expect(lf.textContent).toContain('\u22121.20°');
    expect(lf.textContent).toContain('→ \u22121.70°');
    expect(lf.textContent).toContain('0.50° more negative');
    const lr = within(within(change(1)).getByRole('group', { name: 'Left rear' })).getByRole('button');
    expect(lr.getAttribute('aria-pressed')).toBe('false');

    // Change 2: all four cold pressures down 1 psi.
    await u.click(screen.getByRole('button', { name: 'Another change' }));
    await u.selectOptions(within(change(2)).getByLabelText('What'), 'Cold pressure');
    await u.click(within(change(2)).getByRole('button', { name: 'All four' }));
    await u.type(within(change(2)).getByLabelText('Change cold pressure by'), '-1');
    // The rear has 190 kPa, 27.6 psi; 1 psi less is 26.6 psi.
    const rr = within(within(change(2)).getByRole('group', { name: 'Right rear' })).getByRole('button');
    expect(rr.textContent).toContain('→ 26.6 psi');

    await u.click(screen.getByRole('button', { name: 'Send the suggestion' }));

    await waitFor(() => expect(requestsTo(fetchMock, POST)).toHaveLength(1));
    const body = requestsTo(fetchMock, POST)[0]!.body as {
      id: string;
      baseSetupId: string;
      title: string;
      changes: { field: string; corners: string[]; delta?: number; value?: number }[];
    };
    expect(body.id).toMatch(UUID);
    expect(body.baseSetupId).toBe(IDS.setupBase);
    expect(body.title).toBe('More front camber, softer pressures');
    expect(body.changes[0]).toEqual({ field: 'camberDeg', corners: ['lf', 'rf'], delta: -0.5 });
    expect(body.changes[1]).toMatchObject({ field: 'coldPressureKpa', corners: ['lf', 'rf', 'lr', 'rr'] });
    // 1 psi = 6.894 757 kPa (NIST SP 811, 2008, Appendix B.8: pound-force per square inch to pascal, 6.894 757 E+03).
    expect(body.changes[1]!.delta).toBeCloseTo(-6.894757, 6);
    expect(body.changes[1]!.value).toBeUndefined();

    // Then the new suggestion's own page.
    await waitFor(() => expect(router.state.location.pathname).toBe(`/suggestions/${body.id}`));
  }, 15_000);

  it('when "Set to" is used for rebound clicks, then the value is sent as a whole number of clicks, not a change', async () => {
    const fetchMock = stub(
      METRIC_PREFERENCES,
      { [POST]: ({ body }) => jsonResponse(201, suggestion({ id: (body as { id: string }).id })) },
      CAR,
      DOUBLE_ADJUSTABLE,
    );
    renderApp(PATH);
    const u = userEvent.setup();
    await fillWords(u);

    await u.selectOptions(within(change(1)).getByLabelText('What'), 'Rebound clicks');
    await u.click(within(change(1)).getByRole('button', { name: 'Rear pair' }));
    await u.click(within(change(1)).getByRole('radio', { name: 'Set to' }));
    await u.type(within(change(1)).getByLabelText('Set rebound clicks to'), '6');
    await u.click(screen.getByRole('button', { name: 'Send the suggestion' }));

    await waitFor(() => expect(requestsTo(fetchMock, POST)).toHaveLength(1));
    expect((requestsTo(fetchMock, POST)[0]!.body as { changes: unknown[] }).changes).toEqual([
      { field: 'damperReboundClicks', corners: ['lr', 'rr'], value: 6 },
    ]);
  });

  it('when the car\'s dampers have one adjuster, then the clicks are named as the setups name them and no rebound clicks are offered', async () => {
    stub(METRIC_PREFERENCES);
    renderApp(PATH);
    await screen.findByRole('group', { name: 'Change 1' });

    // BASE_SETUP records clicks but no rebound clicks: one adjuster per damper.
    expect(whatOptions(1)).toEqual(['Camber', 'Toe', 'Caster', 'Spring rate', 'Ride height', 'Clicks', 'Cold pressure', 'Corner weight']);
    expect(screen.queryByText(/bump clicks/i)).toBeNull();
  });

  it('when the setup records rebound clicks as well, then both adjusters are offered, under the setups\' names', async () => {
    stub(METRIC_PREFERENCES, {}, CAR, DOUBLE_ADJUSTABLE);
    renderApp(PATH);
    await screen.findByRole('group', { name: 'Change 1' });
    expect(whatOptions(1)).toContain('Clicks');
    expect(whatOptions(1)).toContain('Rebound clicks');
  });

  it('when the car describes a rebound adjuster on the front dampers, then rebound clicks are offered there before any are recorded, and sent as typed', async () => {
    const frontDouble: Car = {
      ...CAR,
      damperAdjusters: { ...CAR.damperAdjusters, front: { positions: 24, countFrom: 'full_soft', rebound: { positions: 20, countFrom: 'full_stiff' } } },
    };
    const fetchMock = stub(METRIC_PREFERENCES, { [POST]: ({ body }) => jsonResponse(201, suggestion({ id: (body as { id: string }).id })) }, frontDouble);
    renderApp(PATH);
    const u = userEvent.setup();
    await fillWords(u);
    const row = within(change(1));
    const cornerButton = (name: string) => within(row.getByRole('group', { name })).getByRole('button') as HTMLButtonElement;

    // BASE_SETUP records no rebound clicks: the car alone says the front dampers have them.
    expect(whatOptions(1)).toContain('Rebound clicks');
    await u.selectOptions(row.getByLabelText('What'), 'Rebound clicks');
    expect(row.getByText('Only the front dampers have this adjuster on this car.')).toBeTruthy();
    expect(cornerButton('Left rear').disabled).toBe(true);
    await u.click(row.getByRole('button', { name: 'Front pair' }));
    await u.click(row.getByRole('radio', { name: 'Set to' }));
    await u.type(row.getByLabelText('Set rebound clicks to'), '14');
    await u.click(screen.getByRole('button', { name: 'Send the suggestion' }));

    await waitFor(() => expect(requestsTo(fetchMock, POST)).toHaveLength(1));
    expect((requestsTo(fetchMock, POST)[0]!.body as { changes: unknown[] }).changes).toEqual([
      { field: 'damperReboundClicks', corners: ['lf', 'rf'], value: 14 },
    ]);
  });

  it('when only the front dampers adjust, then clicks can be chosen on the front corners only, and rear corners chosen before are let go of', async () => {
    const frontOnly: Car = { ...CAR, damperAdjusters: { front: CAR.damperAdjusters.front, rear: null } };
    const noRearClicks: Setup = {
      ...BASE_SETUP,
      corners: { ...BASE_SETUP.corners, lr: { ...BASE_SETUP.corners.lr, damperClicks: null }, rr: { ...BASE_SETUP.corners.rr, damperClicks: null } },
    };
    stub(METRIC_PREFERENCES, {}, frontOnly, noRearClicks);
    renderApp(PATH);
    const u = userEvent.setup();
    const row = within(await screen.findByRole('group', { name: 'Change 1' }));
    const cornerButton = (name: string) => within(row.getByRole('group', { name })).getByRole('button');

    await u.click(row.getByRole('button', { name: 'All four' }));
    await u.selectOptions(row.getByLabelText('What'), 'Clicks');

    expect(row.getByText('Only the front dampers have this adjuster on this car.')).toBeTruthy();
    expect((row.getByRole('button', { name: 'Front pair' }) as HTMLButtonElement).disabled).toBe(false);
    for (const name of ['Rear pair', 'All four']) expect((row.getByRole('button', { name }) as HTMLButtonElement).disabled).toBe(true);
    expect((cornerButton('Left rear') as HTMLButtonElement).disabled).toBe(true);
    expect(cornerButton('Left rear').getAttribute('aria-pressed')).toBe('false');
    expect(cornerButton('Left front').getAttribute('aria-pressed')).toBe('true');

    // Back on a value every corner has, every corner can be chosen again.
    await u.selectOptions(row.getByLabelText('What'), 'Cold pressure');
    expect((cornerButton('Left rear') as HTMLButtonElement).disabled).toBe(false);
    expect(row.queryByText(/dampers have this adjuster/)).toBeNull();
  });

  it('when the car\'s dampers are fixed and no clicks are recorded, then no clicks are offered at all', async () => {
    const fixed: Car = { ...CAR, damperAdjusters: { front: null, rear: null } };
    const noClicks: Setup = {
      ...BASE_SETUP,
      corners: Object.fromEntries(Object.entries(BASE_SETUP.corners).map(([c, v]) => [c, { ...v, damperClicks: null }])) as Setup['corners'],
    };
    stub(METRIC_PREFERENCES, {}, fixed, noClicks);
    renderApp(PATH);
    await screen.findByRole('group', { name: 'Change 1' });
    expect(whatOptions(1).filter((o) => /clicks/i.test(o ?? ''))).toEqual([]);
  });

  it('when the form is sent empty, then nothing goes to the server and each field says what is missing', async () => {
    const fetchMock = stub(METRIC_PREFERENCES);
    renderApp(PATH);
    const u = userEvent.setup();

    await u.click(await screen.findByRole('button', { name: 'Send the suggestion' }));

    expect(await screen.findByText('Give the suggestion a title')).toBeTruthy();
    expect(screen.getByText('Say why')).toBeTruthy();
    expect(within(change(1)).getByText('Pick at least one corner')).toBeTruthy();
    expect(within(change(1)).getByText('Say how much to change it by')).toBeTruthy();
    expect(screen.getByLabelText('Title').getAttribute('aria-invalid')).toBe('true');
    expect(requestsTo(fetchMock, POST)).toHaveLength(0);
  });

  it('when the server refuses with field errors, then each shows beside its own input and the same id is used to send again', async () => {
    const fetchMock = stub(METRIC_PREFERENCES, {
      [POST]: [
        errorResponse(400, 'validation_failed', 'Some fields are not valid.', {
          title: ['Use at most 120 characters'],
          'changes.0.delta': ['Camber must be between -10 and 5 °'],
        }),
        jsonResponse(201, suggestion()),
      ],
    });
    renderApp(PATH);
    const u = userEvent.setup();
    await fillWords(u);
    await u.click(within(change(1)).getByRole('button', { name: 'All four' }));
    // The server's own limits decide here (the stub refuses what the form took).
    await u.type(within(change(1)).getByLabelText('Change camber by'), '-0.5');
    await u.click(screen.getByRole('button', { name: 'Send the suggestion' }));

    const camberError = await within(change(1)).findByText('Camber must be between -10 and 5 °');
    const amount = within(change(1)).getByLabelText('Change camber by');
    expect(amount.getAttribute('aria-invalid')).toBe('true');
    expect(amount.getAttribute('aria-describedby')).toContain(camberError.id);
    expect(screen.getByText('Use at most 120 characters')).toBeTruthy();
    // Not a toast: the form says it.
    expect(screen.getByText('The server could not take some answers; they are marked above.')).toBeTruthy();

    await u.clear(amount);
    await u.type(amount, '-2');
    await u.click(screen.getByRole('button', { name: 'Send the suggestion' }));
    await waitFor(() => expect(requestsTo(fetchMock, POST)).toHaveLength(2));
    const [first, second] = requestsTo(fetchMock, POST).map((r) => (r.body as { id: string }).id);
    expect(second).toBe(first);
  });

  it('when a change would take a corner out of range, then the form says which corner as it is typed and sends nothing', async () => {
    const fetchMock = stub(METRIC_PREFERENCES);
    renderApp(PATH);
    const u = userEvent.setup();
    await fillWords(u);
    await u.click(within(change(1)).getByRole('button', { name: 'All four' }));
    const amount = within(change(1)).getByLabelText('Change camber by');
    await u.type(amount, '-20');

    // Camber is held to −10° … +5° (the same limit the server applies); every corner would pass it.
    expect(amount.getAttribute('aria-invalid')).toBe('true');
    const said = within(change(1)).getByText(/Left front: Camber must be between -10 and 5/);
    expect(said.textContent).toMatch(/Right rear: Camber must be between/);
    await u.click(screen.getByRole('button', { name: 'Send the suggestion' }));
    expect(requestsTo(fetchMock, POST)).toHaveLength(0);
    expect(screen.getByText('Some answers need another look; they are marked above.')).toBeTruthy();

    await u.clear(amount);
    await u.type(amount, '-0.5');
    expect(within(change(1)).queryByText(/Camber must be between/)).toBeNull();
  });

  // BASE_SETUP: 200 kPa front, 190 kPa rear; ride height 120 mm front, 125 mm rear; camber −1.2° front.
  // 1 psi = 6.894 757 kPa and 1 in = 25.4 mm (NIST SP 811, 2008, Appendix B.8): 190 kPa = 27.56 psi, shown 27.6 psi;
  // 125 mm = 4.921 in, shown 4.92 in.
  it.each([
    {
      units: METRIC_PREFERENCES,
      what: 'Cold pressure',
      corners: 'Rear pair',
      hint: 'Added to each corner’s value: −10 kPa takes LR’s 190 kPa to 180 kPa, +10 kPa takes it to 200 kPa.',
    },
    {
      units: IMPERIAL_PREFERENCES,
      what: 'Cold pressure',
      corners: 'Rear pair',
      hint: 'Added to each corner’s value: −1.0 psi takes LR’s 27.6 psi to 26.6 psi, +1.0 psi takes it to 28.6 psi.',
    },
    {
      units: IMPERIAL_PREFERENCES,
      what: 'Ride height',
      corners: 'Rear pair',
      hint: 'Added to each corner’s value: −0.25 in takes LR’s 4.92 in to 4.67 in, +0.25 in takes it to 5.17 in.',
    },
    {
      units: METRIC_PREFERENCES,
      what: 'Camber',
      corners: 'Front pair',
      hint: 'Added to each corner’s value: −0.50° takes LF’s \u22121.20° to \u22121.70°, +0.50° takes it to \u22120.70°.',
    },
    // No caster recorded on any corner: the example says which way each sign goes, with no made-up reading.
    { units: METRIC_PREFERENCES, what: 'Caster', corners: 'All four', hint: 'Added to each corner’s value: −0.50° lowers it, +0.50° raises it.' },
  ])('when $what is changed by an amount on the $corners ($units.pressure, $units.length), then the example under the amount uses that value, its unit and the car’s own reading', async ({ units, what, corners, hint }) => {
    stub(units);
    renderApp(PATH);
    const u = userEvent.setup();
    const row = within(await screen.findByRole('group', { name: 'Change 1' }));
    await u.selectOptions(row.getByLabelText('What'), what);
    await u.click(row.getByRole('button', { name: corners }));
    const amount = row.getByLabelText(`Change ${what.toLowerCase()} by`);
    await u.type(amount, '7');
    const hintId = amount.getAttribute('aria-describedby')!.split(' ').find((id) => id.endsWith('-hint'))!;
    expect(document.getElementById(hintId)!.textContent).toBe(hint);
  });

  it('shows the caution that such changes follow the maker’s data and are made by someone competent', async () => {
    stub(METRIC_PREFERENCES);
    renderApp(PATH);
    const caution = await screen.findByRole('complementary', { name: 'Caution' });
    expect(caution.textContent).toMatch(/makers’ data/);
    expect(caution.textContent).toMatch(/someone competent/);
  });
});
