// @vitest-environment jsdom
import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import { IMPERIAL_PREFERENCES, KPA_PER_PSI, MM_PER_INCH } from '../../../../shared/calc/units.calc';
import { errorResponse, jsonResponse, renderApp, requestsTo, setUpAppTests, stubFetch } from '../../test-utils';
import { BASE_SETUP, CAR, IDS, list, user, UUID } from '../../fixtures/season';

setUpAppTests([() => import('@/app/routes/cars/new-setup')]);

const SETUPS = `POST /api/cars/${IDS.car}/setups`;

function stub(answer: Parameters<typeof stubFetch>[0][string]) {
  return stubFetch({
    'GET /api/auth/session': jsonResponse(200, { user: user(IMPERIAL_PREFERENCES) }),
    [`GET /api/cars/${IDS.car}`]: jsonResponse(200, CAR),
    [`GET /api/cars/${IDS.car}/setups`]: list([BASE_SETUP]),
    [SETUPS]: answer,
  });
}

describe('setup editor', () => {
  it('when values are typed in psi and inches, then the snapshot is sent in kPa and mm, untouched values keep their stored numbers, and the diff shows the change in psi', async () => {
    const fetchMock = stub(jsonResponse(201, { ...BASE_SETUP, id: IDS.setupBase }));
    const { outbox, router } = renderApp(`/cars/${IDS.car}/setups/new`);
    const u = userEvent.setup();

    const pressure = (await screen.findByLabelText('Left front cold pressure')) as HTMLInputElement;
    // 200 kPa shown in psi, to the unit's one decimal.
    expect(pressure.value).toBe('29.0');
    await u.type(screen.getByLabelText('Label'), 'Softer front for the wet');
    await u.clear(pressure);
    await u.type(pressure, '32');
    const height = screen.getByLabelText('Left front ride height');
    await u.clear(height);
    await u.type(height, '4.5');

    // Live diff against "Spring baseline", in the user's units.
    const diff = screen.getByRole('region', { name: 'Changes from the starting setup' });
    expect(within(diff).getByText('LF cold pressure')).toBeTruthy();
    expect(within(diff).getByText('▲ 3.0 psi')).toBeTruthy();

    await u.click(screen.getByRole('button', { name: 'Save as new setup' }));

    await waitFor(() => expect(requestsTo(fetchMock, SETUPS)).toHaveLength(1));
    const body = requestsTo(fetchMock, SETUPS)[0]!.body as {
      id: string;
      label: string;
      derivedFromId: string;
      corners: Record<string, Record<string, number | null>>;
    };
    expect(body.id).toMatch(UUID);
    expect(body.label).toBe('Softer front for the wet');
    expect(body.derivedFromId).toBe(IDS.setupBase);
    expect(body.corners.lf!.coldPressureKpa).toBeCloseTo(32 * KPA_PER_PSI, 5);
    expect(body.corners.lf!.rideHeightMm).toBeCloseTo(4.5 * MM_PER_INCH, 6);
    // Not touched: the stored SI values, exactly (no psi round trip).
    expect(body.corners.rf!.coldPressureKpa).toBe(200);
    expect(body.corners.lf!.camberDeg).toBe(-1.2);
    expect(body.corners.lf!.damperClicks).toBe(8);
    await waitFor(() => expect(outbox.getSnapshot()).toHaveLength(0));
    // Saved: back on the car page at the new setup, not at the editor's scroll position.
    await waitFor(() => expect(`${router.state.location.pathname}${router.state.location.hash}`).toBe(`/cars/${IDS.car}#setup-${body.id}`));
  });

  it('when the server refuses a value, then its message sits on that input and everything typed stays', async () => {
    stub(
      errorResponse(400, 'validation_failed', 'Some fields need attention.', {
        'corners.lf.camberDeg': ['Camber must be between -10 and 5 °'],
      }),
    );
    const { outbox } = renderApp(`/cars/${IDS.car}/setups/new`);
    const u = userEvent.setup();

    const camber = await screen.findByLabelText('Left front camber');
    await u.type(screen.getByLabelText('Label'), 'More camber');
    await u.clear(camber);
    await u.type(camber, '-4.5');
    await u.click(screen.getByRole('button', { name: 'Save as new setup' }));

    const message = await screen.findByText('Camber must be between -10 and 5 °');
    expect(camber.getAttribute('aria-invalid')).toBe('true');
    expect(camber.getAttribute('aria-describedby')).toContain(message.id);
    expect((camber as HTMLInputElement).value).toBe('-4.5');
    expect((screen.getByLabelText('Label') as HTMLInputElement).value).toBe('More camber');
    // Refused, kept on the phone to be fixed or discarded — never dropped.
    expect(outbox.getSnapshot()[0]?.state).toBe('failed');
    expect(screen.getByRole('button', { name: 'Fix and send again' })).toBeTruthy();
  });

  it('when the server refuses the setup as a whole (403), then its own reason shows, not a pointer to marked fields that are not there', async () => {
    stub(errorResponse(403, 'forbidden', 'Only the car’s drivers can record its setups.'));
    renderApp(`/cars/${IDS.car}/setups/new`);
    const u = userEvent.setup();

    await screen.findByLabelText('Left front camber');
    await u.type(screen.getByLabelText('Label'), 'From the shop');
    await u.click(screen.getByRole('button', { name: 'Save as new setup' }));

    expect(await screen.findByText('Only the car’s drivers can record its setups.')).toBeTruthy();
    expect(screen.queryByText(/marked above/)).toBeNull();
  });

  it('when a value is out of range in the user’s unit, then the form says so in that unit and sends nothing', async () => {
    const fetchMock = stub(jsonResponse(201, BASE_SETUP));
    renderApp(`/cars/${IDS.car}/setups/new`);
    const u = userEvent.setup();

    const pressure = await screen.findByLabelText('Right rear cold pressure');
    await u.type(screen.getByLabelText('Label'), 'Typo');
    await u.clear(pressure);
    await u.type(pressure, '210'); // kPa typed into a psi field
    await u.click(screen.getByRole('button', { name: 'Save as new setup' }));

    expect(await screen.findByText('Cold pressure must be between 7.3 psi and 65.3 psi')).toBeTruthy();
    expect(requestsTo(fetchMock, SETUPS)).toHaveLength(0);
    // A value the form cannot take is not a change yet, and certainly not a cleared one.
    const diff = screen.getByRole('region', { name: 'Changes from the starting setup' });
    expect(within(diff).queryByText(/cleared/)).toBeNull();
    await u.clear(pressure);
    await u.type(pressure, 'abc');
    expect(within(diff).queryByText(/cleared/)).toBeNull();
    expect(within(diff).getByText('Nothing changed yet.')).toBeTruthy();
  });

  it('when the front dampers have a rebound adjuster of 30 clicks, then rebound clicks there are checked against its 30 and named under their grid', async () => {
    const car = { ...CAR, damperAdjusters: { ...CAR.damperAdjusters, front: { positions: 24, countFrom: 'full_soft' as const, rebound: { positions: 30, countFrom: 'full_stiff' as const } } } };
    const fetchMock = stubFetch({
      'GET /api/auth/session': jsonResponse(200, { user: user(IMPERIAL_PREFERENCES) }),
      [`GET /api/cars/${IDS.car}`]: jsonResponse(200, car),
      [`GET /api/cars/${IDS.car}/setups`]: list([BASE_SETUP]),
      [SETUPS]: jsonResponse(201, BASE_SETUP),
    });
    renderApp(`/cars/${IDS.car}/setups/new`);
    const u = userEvent.setup();

    const rebound = await screen.findByRole('region', { name: 'Rebound clicks' });
    // The rear has one adjuster: its rebound clicks are that adjuster's, and the hint says so.
    expect(
      within(rebound).getByText('Front: 0 to 30, counted from full stiff · Rear: 0 to 24, counted from full soft (no rebound adjuster of its own: the same adjuster as its clicks)'),
    ).toBeTruthy();
    expect(within(screen.getByRole('region', { name: 'Clicks' })).getByText('Front: 0 to 24, counted from full soft · Rear: 0 to 24, counted from full soft')).toBeTruthy();

    await u.type(screen.getByLabelText('Label'), 'More rebound');
    // 28 is past the front's 24 bump clicks but within its rebound adjuster's 30; 31 is past it.
    await u.type(screen.getByLabelText('Left front rebound clicks'), '28');
    await u.type(screen.getByLabelText('Right front rebound clicks'), '31');
    await u.click(screen.getByRole('button', { name: 'Save as new setup' }));

    expect(await screen.findByText('Use 0 to 30 clicks')).toBeTruthy();
    expect(screen.getByLabelText('Left front rebound clicks').getAttribute('aria-invalid')).toBeNull();
    expect(requestsTo(fetchMock, SETUPS)).toHaveLength(0);
  });

  it('when the label is missing and a value is out of range, then the focus goes to the label, the first marked box on the page', async () => {
    const fetchMock = stub(jsonResponse(201, BASE_SETUP));
    renderApp(`/cars/${IDS.car}/setups/new`);
    const u = userEvent.setup();

    const pressure = await screen.findByLabelText('Right rear cold pressure');
    await u.clear(pressure);
    await u.type(pressure, '210');
    await u.click(screen.getByRole('button', { name: 'Save as new setup' }));

    const label = screen.getByLabelText('Label');
    await waitFor(() => expect(document.activeElement).toBe(label));
    expect(label.getAttribute('aria-invalid')).toBe('true');
    expect(pressure.getAttribute('aria-invalid')).toBe('true');
    expect(requestsTo(fetchMock, SETUPS)).toHaveLength(0);
  });

  it('when words are typed where a number goes, then the example offered is one in the user’s unit for that box', async () => {
    const fetchMock = stub(jsonResponse(201, BASE_SETUP));
    renderApp(`/cars/${IDS.car}/setups/new`);
    const u = userEvent.setup();

    await u.type(await screen.findByLabelText('Label'), 'Typo');
    for (const box of ['Right rear cold pressure', 'Right rear spring rate', 'Right rear ride height']) {
      await u.clear(screen.getByLabelText(box));
      await u.type(screen.getByLabelText(box), 'thirty');
    }
    await u.click(screen.getByRole('button', { name: 'Save as new setup' }));

    // 200 kPa = 29.0 psi (1 psi = 6.894 757 kPa); 70 N/mm = 399.7 lb/in (1 lbf/in = 0.175 127 N/mm);
    // 120 mm = 4.72 in (1 in = 25.4 mm): NIST SP 811, appendix B, each to two significant figures.
    expect(await screen.findByText('Type a number, e.g. 29')).toBeTruthy();
    expect(screen.getByText('Type a number, e.g. 400')).toBeTruthy();
    expect(screen.getByText('Type a number, e.g. 4.7')).toBeTruthy();
    expect(screen.queryByText('Type a number, e.g. 1.5')).toBeNull();
    expect(requestsTo(fetchMock, SETUPS)).toHaveLength(0);
  });
});

describe('setup editor headings', () => {
  it('names each grid’s unit in the user’s units, and a count of clicks only once', async () => {
    stub(jsonResponse(201, BASE_SETUP));
    renderApp(`/cars/${IDS.car}/setups/new`);

    await screen.findByLabelText('Left front cold pressure');
    const grids = screen.getAllByRole('group').map((g) => g.getAttribute('aria-label')).filter((name) => !/^(Left|Right) /.test(name ?? ''));
    expect(grids).toEqual(expect.arrayContaining(['Cold pressure (psi)', 'Ride height (in)', 'Clicks', 'Rebound clicks']));
    expect(grids.filter((name) => /\(clicks\)/.test(name ?? ''))).toEqual([]);
    expect(screen.queryByText('(clicks)')).toBeNull();
  });
});
