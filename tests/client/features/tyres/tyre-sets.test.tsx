// @vitest-environment jsdom
import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import { IMPERIAL_PREFERENCES, METRIC_PREFERENCES, MM_PER_INCH, type UnitPreferences } from '../../../../shared/calc/units.calc';
import type { OutboxEntry } from '@/lib/outbox';
import { jsonResponse, renderApp, requestsTo, setUpAppTests, stubFetch } from '../../test-utils';
import { CAR, IDS, list, TYRE_SET, user, UUID } from '../../fixtures/season';

const CAR_PAGE = `/cars/${IDS.car}`;
const offline = () => Promise.reject(new TypeError('Failed to fetch'));

setUpAppTests([() => import('@/app/routes/cars/car')]);

/** The car page with one saved tyre set (tyres as first fitted); uploads find no signal. */
function stubCarPage(units: UnitPreferences) {
  return stubFetch({
    'GET /api/auth/session': jsonResponse(200, { user: user(units) }),
    [`GET /api/cars/${IDS.car}`]: jsonResponse(200, CAR),
    [`GET /api/cars/${IDS.car}/setups`]: list([]),
    [`GET /api/cars/${IDS.car}/tyre-sets`]: list([TYRE_SET]),
    [`GET /api/cars/${IDS.car}/changes`]: list([]),
    [`POST /api/cars/${IDS.car}/tyre-sets`]: offline,
    [`POST /api/tyre-sets/${IDS.tyreSet}/mountings`]: offline,
  });
}

describe('new tyre set', () => {
  it('when the starting depth is typed in /32 in, then the outbox entry holds it in mm with a device-made id, and the set shows as waiting', async () => {
    stubCarPage(IMPERIAL_PREFERENCES);
    const { outbox } = renderApp(CAR_PAGE);
    const u = userEvent.setup();

    await u.click(await screen.findByRole('button', { name: 'New tyre set' }));
    const form = screen.getByRole('form', { name: 'New tyre set' });
    // The car's tyre size is offered.
    expect((within(form).getByLabelText('Size (optional)') as HTMLInputElement).value).toBe(CAR.tyreSize);
    expect(within(form).getByText('/32 in')).toBeTruthy();
    await u.type(within(form).getByLabelText('Label'), 'Set C (2026)');
    await u.type(within(form).getByLabelText('Bought on (optional)'), '2026-06-01');
    await u.type(within(form).getByLabelText('Depth when new (optional)'), '10');
    await u.click(within(form).getByRole('button', { name: 'Save tyre set' }));

    await waitFor(() => expect(outbox.getSnapshot()).toHaveLength(1));
    const [entry] = outbox.getSnapshot() as OutboxEntry[];
    const body = entry!.body as Record<string, unknown>;
    expect(body.id).toMatch(UUID);
    expect(entry).toMatchObject({
      kind: 'tyreSet.create',
      method: 'POST',
      path: `/api/cars/${IDS.car}/tyre-sets`,
      recordId: body.id,
      scope: { carId: IDS.car, tyreSetId: body.id },
    });
    expect(body).toMatchObject({ label: 'Set C (2026)', size: CAR.tyreSize, boughtOn: '2026-06-01' });
    // 10/32 in = 10 × 25.4 / 32 mm = 7.9375 mm (1 in = 25.4 mm exactly, NIST SP 811).
    expect(body.startTreadMm as number).toBeCloseTo((10 * MM_PER_INCH) / 32, 6);

    const item = (await screen.findByRole('heading', { name: /Set C \(2026\)/ })).closest('li')!;
    expect(within(item).getByText('Waiting to upload')).toBeTruthy();
  });
});

describe('tyre rotation', () => {
  it('when one tyre is picked for two corners, then the form refuses it, marks both corners, and saves nothing', async () => {
    const fetchMock = stubCarPage(METRIC_PREFERENCES);
    const { outbox } = renderApp(CAR_PAGE);
    const u = userEvent.setup();

    await u.click(await screen.findByRole('button', { name: `Rotate tyres of ${TYRE_SET.label}` }));
    // Tyre 2 is on the right front already.
    await u.selectOptions(screen.getByLabelText('Left front tyre'), '2');
    await u.click(screen.getByRole('button', { name: 'Save rotation' }));

    expect(await screen.findByText('Tyre 2 is also on the right front')).toBeTruthy();
    expect(screen.getByText('Tyre 2 is also on the left front')).toBeTruthy();
    expect(screen.getByText(/Each tyre can be on one corner only/)).toBeTruthy();
    expect(screen.getByLabelText('Left front tyre').getAttribute('aria-invalid')).toBe('true');
    expect(screen.getByLabelText('Right front tyre').getAttribute('aria-invalid')).toBe('true');
    expect(outbox.getSnapshot()).toHaveLength(0);
    expect(requestsTo(fetchMock, `POST /api/tyre-sets/${IDS.tyreSet}/mountings`)).toHaveLength(0);
  });

  it('when “cross rear to front” is picked, then the rears cross to the front, the fronts go straight back, and the rotation waits in the outbox', async () => {
    stubCarPage(METRIC_PREFERENCES);
    const { outbox } = renderApp(CAR_PAGE);
    const u = userEvent.setup();

    await u.click(await screen.findByRole('button', { name: `Rotate tyres of ${TYRE_SET.label}` }));
    // Where each tyre was, in words on a line of its own under the choice (beside a wrapped name it was cut to "wa…").
    const grid = screen.getByRole('group', { name: 'Which tyre is on each corner' });
    for (const [name, was] of [['Left front', 1], ['Right front', 2], ['Left rear', 3], ['Right rear', 4]] as const) {
      expect(within(within(grid).getByRole('group', { name })).getByText(`Was tyre ${was}`).tagName).toBe('P');
    }
    await u.click(screen.getByRole('button', { name: 'Cross rear to front' }));
    await u.click(screen.getByRole('button', { name: 'Save rotation' }));

    await waitFor(() => expect(outbox.getSnapshot()).toHaveLength(1));
    const [entry] = outbox.getSnapshot() as OutboxEntry[];
    expect(entry).toMatchObject({
      kind: 'tyreSet.rotate',
      method: 'POST',
      path: `/api/tyre-sets/${IDS.tyreSet}/mountings`,
      recordId: IDS.tyreSet,
      scope: { carId: IDS.car, tyreSetId: IDS.tyreSet },
    });
    const body = entry!.body as { mountedAt: string; positions: Record<string, number> };
    // From 1 LF, 2 RF, 3 LR, 4 RR: RR's tyre to LF, LR's to RF, LF's straight back to LR, RF's to RR (common practice).
    expect(body.positions).toEqual({ lf: 4, rf: 3, lr: 1, rr: 2 });
    expect(Number.isNaN(Date.parse(body.mountedAt))).toBe(false);
    const line = await screen.findByText(/On the car: LF 4 · RF 3 · LR 1 · RR 2/);
    expect(within(line.closest('p')!).getByText('Waiting to upload')).toBeTruthy();
  });
});

describe('which set is on the car', () => {
  it('when a second set is fitted after the first, then only the second reads as on the car; the first is off it with its last places, and offers to be fitted again', async () => {
    const summer = {
      ...TYRE_SET,
      id: 'e2e2e2e2-0000-4000-8000-0000000000a2',
      label: 'Summer set',
      latestReading: null,
      mountings: [{ id: 'e3e3e3e3-0000-4000-8000-0000000000a3', tyreSetId: 'e2e2e2e2-0000-4000-8000-0000000000a2', mountedAt: '2026-06-02T08:00:00.000Z', positions: { lf: 1, rf: 2, lr: 3, rr: 4 }, createdAt: '2026-06-02T08:00:00.000Z' }],
      createdAt: '2026-06-02T08:00:00.000Z',
    };
    stubFetch({
      'GET /api/auth/session': jsonResponse(200, { user: user(METRIC_PREFERENCES) }),
      [`GET /api/cars/${IDS.car}`]: jsonResponse(200, CAR),
      [`GET /api/cars/${IDS.car}/setups`]: list([]),
      [`GET /api/cars/${IDS.car}/tyre-sets`]: list([summer, TYRE_SET]),
      [`GET /api/cars/${IDS.car}/changes`]: list([]),
    });
    renderApp(CAR_PAGE);

    const onCar = await screen.findAllByText(/^On the car: /);
    expect(onCar).toHaveLength(1);
    expect(onCar[0]!.closest('li')!.textContent).toContain('Summer set');
    const off = screen.getByText(/^Off the car; last fitted: LF 1 · RF 2 · LR 3 · RR 4/);
    expect(off.closest('li')!.textContent).toContain(TYRE_SET.label);
    expect(screen.getByRole('button', { name: `Fit to the car of ${TYRE_SET.label}` })).toBeTruthy();
    expect(screen.getByRole('button', { name: 'Rotate tyres of Summer set' })).toBeTruthy();
  });

  it('when the server counts the runs made on each set, then each set says how many, in the singular for one; a set without a count says nothing', async () => {
    const spare = { ...TYRE_SET, id: 'e2e2e2e2-0000-4000-8000-0000000000b1', label: 'Spare set', latestReading: null, runs: 1 };
    const old = { ...TYRE_SET, id: 'e2e2e2e2-0000-4000-8000-0000000000b2', label: 'Old set', latestReading: null, runs: undefined };
    stubFetch({
      'GET /api/auth/session': jsonResponse(200, { user: user(METRIC_PREFERENCES) }),
      [`GET /api/cars/${IDS.car}`]: jsonResponse(200, CAR),
      [`GET /api/cars/${IDS.car}/setups`]: list([]),
      [`GET /api/cars/${IDS.car}/tyre-sets`]: list([{ ...TYRE_SET, runs: 42 }, spare, old]),
      [`GET /api/cars/${IDS.car}/changes`]: list([]),
    });
    renderApp(CAR_PAGE);

    const item = (label: string) => screen.getByRole('heading', { name: label }).closest('li')!;
    await screen.findByRole('heading', { name: 'Spare set' });
    expect(within(item(TYRE_SET.label)).getByText('42 runs on this set')).toBeTruthy();
    expect(within(item('Spare set')).getByText('1 run on this set')).toBeTruthy();
    expect(within(item('Old set')).queryByText(/on this set/)).toBeNull();
  });
});
