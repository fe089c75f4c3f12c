// @vitest-environment jsdom
import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it, vi } from 'vitest';
import { IMPERIAL_PREFERENCES, METRIC_PREFERENCES } from '../../../../shared/calc/units.calc';
import { BUILD_SHEET_FIELDS, type BuildSheetCorner, type MeasurementsInput, type ReplaceLinesInput } from '../../../../shared/service/work-order.schema';
import { errorResponse, jsonResponse, renderApp, requestsTo, setUpAppTests } from '../../test-utils';
import { BASE_SETUP, CAR, list } from '../../fixtures/season';
import { SHOP_NAME } from '../../fixtures/collab';
import { checkoutNavigation } from '@/features/invoices/api/pay-invoice';
import { invoice, SERVICE_IDS, stubDriver, stubStaff, WO, WORK_ORDER_PATH, workOrder } from './service-fixtures';

const PATH = WORK_ORDER_PATH;

setUpAppTests([() => import('@/app/routes/work-orders/work-order')]);

describe('the work order page for shop staff', () => {
  it('when before readings are typed in inches and pounds, then the measurements are sent in millimetres and kilograms', async () => {
    const PUT = `PUT ${WO}/measurements/before`;
    const fetchMock = stubStaff(IMPERIAL_PREFERENCES, { [PUT]: jsonResponse(200, workOrder({ version: 2 })) });
    renderApp(PATH);
    const u = userEvent.setup();
    const form = await screen.findByRole('form', { name: 'Before measurements' });
    const lf = within(within(form).getByRole('group', { name: 'Before: per corner' })).getByRole('group', { name: 'Left front' });
    // Toe and ride height are lengths: both typed in inches.
    expect(within(lf).getAllByText('in', { selector: 'span' })).toHaveLength(2);
    await u.type(within(lf).getByLabelText('Ride height'), '5');
    await u.type(within(lf).getByLabelText('Corner weight'), '700');
    await u.type(within(lf).getByLabelText('Camber'), '-1.5');
    await u.click(within(form).getByLabelText('Driver in the car'));
    await u.type(within(form).getByLabelText('Driver weight'), '180');
    await u.type(within(form).getByLabelText('Fuel level'), '50');
    await u.click(within(form).getByRole('button', { name: 'Save before measurements' }));

    await waitFor(() => expect(requestsTo(fetchMock, PUT)).toHaveLength(1));
    const body = requestsTo(fetchMock, PUT)[0]!.body as MeasurementsInput;
    // 1 in = 2.54 × 10⁻² m exactly; 1 lb (avoirdupois) = 4.535 924 37 × 10⁻¹ kg exactly
    // (NIST SP 811, 2008 edition, Appendix B.8, "inch to meter" and "pound (avoirdupois) to kilogram").
    expect(body.corners.lf?.rideHeightMm).toBeCloseTo(127, 6);
    expect(body.corners.lf?.cornerWeightKg).toBeCloseTo(317.514659, 5);
    expect(body.corners.lf?.camberDeg).toBe(-1.5);
    expect(body.corners.rf?.rideHeightMm).toBeNull();
    expect(body.driverInCar).toBe(true);
    expect(body.driverWeightKg).toBeCloseTo(81.6466266, 5);
    expect(body.fuelLevelPct).toBe(50);
  });

  it('when a part is priced in dollars, then its price is sent in whole cents', async () => {
    const PUT = `PUT ${WO}/lines`;
    const fetchMock = stubStaff(METRIC_PREFERENCES, { [PUT]: jsonResponse(200, workOrder({ version: 2 })) });
    renderApp(PATH);
    const u = userEvent.setup();
    await u.click(await screen.findByRole('button', { name: 'Add a part' }));
    const line = screen.getByRole('group', { name: 'Line 1' });
    await u.type(within(line).getByLabelText('Description'), 'Camber bolts');
    await u.clear(within(line).getByLabelText('Quantity'));
    await u.type(within(line).getByLabelText('Quantity'), '2');
    await u.type(within(line).getByLabelText('Price each'), '24.35');
    await u.click(screen.getByRole('button', { name: 'Add labour' }));
    const labour = screen.getByRole('group', { name: 'Line 2' });
    await u.type(within(labour).getByLabelText('Description'), 'Alignment');
    await u.type(within(labour).getByLabelText('Hours'), '1.5');
    await u.type(within(labour).getByLabelText('Rate per hour'), '90');
    await u.click(screen.getByRole('button', { name: 'Save parts and labour' }));

    await waitFor(() => expect(requestsTo(fetchMock, PUT)).toHaveLength(1));
    expect((requestsTo(fetchMock, PUT)[0]!.body as ReplaceLinesInput).lines).toEqual([
      // 24.35 × 100 is 2434.9999… in binary floating point: the cents must still come out whole and right.
      { kind: 'part', description: 'Camber bolts', quantity: 2, unitPriceCents: 2435, usedUp: false },
      { kind: 'labour', description: 'Alignment', quantity: 1.5, unitPriceCents: 9000 },
    ]);
  });

  it('when the server refuses a line, then its message shows beside that field', async () => {
    const PUT = `PUT ${WO}/lines`;
    stubStaff(METRIC_PREFERENCES, {
      [PUT]: errorResponse(400, 'validation_failed', 'Some fields need attention.', { 'lines.0.quantity': ['Use at most two decimals'] }),
    });
    renderApp(PATH);
    const u = userEvent.setup();
    await u.click(await screen.findByRole('button', { name: 'Add a part' }));
    const line = screen.getByRole('group', { name: 'Line 1' });
    await u.type(within(line).getByLabelText('Description'), 'Shims');
    await u.clear(within(line).getByLabelText('Quantity'));
    await u.type(within(line).getByLabelText('Quantity'), '1.234');
    await u.type(within(line).getByLabelText('Price each'), '3');
    await u.click(screen.getByRole('button', { name: 'Save parts and labour' }));

    const quantity = within(line).getByLabelText('Quantity');
    await waitFor(() => expect(quantity.getAttribute('aria-invalid')).toBe('true'));
    expect(within(line).getByText('Use at most two decimals')).toBeTruthy();
  });

  it('when the car is handed over, then the close carries the handover time and the page links to the new snapshot', async () => {
    const POST = `POST ${WO}/close`;
    const closed = workOrder({ status: 'closed', handoverAt: '2026-06-10T16:30:00.000Z', setupId: SERVICE_IDS.newSetup, version: 3 });
    const fetchMock = stubStaff(METRIC_PREFERENCES, {
      [POST]: jsonResponse(200, closed),
      [`GET ${WO}/invoice`]: errorResponse(404, 'not_found', 'There is no invoice for this work order yet.'),
    });
    renderApp(PATH);
    const u = userEvent.setup();
    const form = await screen.findByRole('form', { name: 'Close and hand over' });
    const handover = within(form).getByLabelText('Handover');
    await u.clear(handover);
    await u.type(handover, '2026-06-10T18:30');
    await u.click(within(form).getByRole('button', { name: 'Close and hand over…' }));
    // Asked once more: closing cannot be undone.
    const confirm = within(form).getByRole('group', { name: 'Confirm the handover' });
    expect(requestsTo(fetchMock, POST)).toHaveLength(0);
    await u.click(within(confirm).getByRole('button', { name: 'Yes, close and hand over' }));

    await waitFor(() => expect(requestsTo(fetchMock, POST)).toHaveLength(1));
    const body = requestsTo(fetchMock, POST)[0]!.body as { handoverAt: string; label?: string };
    expect(body.handoverAt).toBe(new Date('2026-06-10T18:30').toISOString());
    expect(body.label).toBeUndefined();
    const link = await screen.findByRole('link', { name: 'See the setup snapshot it wrote' });
    expect(link.getAttribute('href')).toBe(`/shop/customers/${CAR.id}#setup-${SERVICE_IDS.newSetup}`);
    expect(screen.queryByRole('form', { name: 'Close and hand over' })).toBeNull();
    expect(screen.getByRole('button', { name: 'Make the invoice' })).toBeTruthy();
  });
});

describe('closing a visit, asked twice', () => {
  it('when the handover is dated before a setup the driver recorded since, then the question says so, "Not yet" sends nothing, and the default label ends on a whole word', async () => {
    const POST = `POST ${WO}/close`;
    const requestedWork = 'Fit adjustable-body coilovers, set ride height and corner weights with the driver in, then align to the sheet';
    const since = { ...BASE_SETUP, id: '5e7e7e7e-0000-4000-8000-0000000000b1', label: 'Softer rear for the wet', effectiveFrom: '2026-06-20T09:00:00.000Z' };
    const fetchMock = stubStaff(METRIC_PREFERENCES, {
      [`GET ${WO}`]: jsonResponse(200, workOrder({ requestedWork })),
      [`GET /api/cars/${CAR.id}/setups`]: list([since, BASE_SETUP]),
    });
    renderApp(PATH);
    const u = userEvent.setup();
    const form = await screen.findByRole('form', { name: 'Close and hand over' });

    // The label the server will write, "<shop>: <work>" shortened to 80 characters at a word's end.
    const hint = within(form).getByText(/^By default/).textContent!;
    const label = /“(.+)”/.exec(hint)![1]!;
    expect(label.length).toBeLessThanOrEqual(80);
    expect(label.endsWith('…')).toBe(true);
    expect(`${SHOP_NAME}: ${requestedWork}`.startsWith(label.slice(0, -1))).toBe(true);
    expect(`${SHOP_NAME}: ${requestedWork}`[label.length - 1]).toBe(' ');

    const handover = within(form).getByLabelText('Handover');
    await u.clear(handover);
    await u.type(handover, '2026-06-10T18:30');
    await u.click(within(form).getByRole('button', { name: 'Close and hand over…' }));
    const confirm = within(form).getByRole('group', { name: 'Confirm the handover' });
    // The focus goes with the question, to its answer.
    await waitFor(() => expect(document.activeElement).toBe(within(confirm).getByRole('button', { name: 'Yes, close and hand over' })));
    expect(confirm.textContent).toContain(`“${label}” becomes Grey roadster’s setup from`);
    expect(await within(confirm).findByText(/One setup on the car starts later \(the latest “Softer rear for the wet”/)).toBeTruthy();

    await u.click(within(confirm).getByRole('button', { name: 'Not yet' }));
    expect(within(form).queryByRole('group', { name: 'Confirm the handover' })).toBeNull();
    await waitFor(() => expect(document.activeElement).toBe(within(form).getByRole('button', { name: 'Close and hand over…' })));
    expect(requestsTo(fetchMock, POST)).toHaveLength(0);
  });
  it('when the build sheet has a failed check and an empty corner, then the question lists them by corner first, and closing is still allowed', async () => {
    const POST = `POST ${WO}/close`;
    const visit = workOrder();
    const empty = Object.fromEntries(BUILD_SHEET_FIELDS.map((f) => [f, null])) as BuildSheetCorner;
    const checked = { compressedLength: null, droop: null, bumpTravelAtWheelMm: null, problems: [] };
    const fetchMock = stubStaff(METRIC_PREFERENCES, {
      [`GET ${WO}`]: jsonResponse(
        200,
        workOrder({
          shop: { ...visit.shop, compressedLengthToleranceMm: 15 },
          buildSheet: {
            motionRatio: { front: 0.9, rear: 0.7 },
            // Invented: the left front 20 mm shorter than the reference, its spring lifting at full droop; the left rear
            // saved with nothing in it, the right front never saved; the right rear passes.
            corners: { lf: { ...empty, strokeMm: 100 }, rf: null, lr: empty, rr: { ...empty, strokeMm: 100 } },
            checks: {
              lf: {
                ...checked,
                compressedLength: { differenceMm: -20, withinTolerance: false },
                droop: { staticCompressionMm: 30, droopAtSpringMm: 42, seated: false, shortfallMm: 12 },
              },
              rf: null,
              lr: checked,
              rr: { ...checked, compressedLength: { differenceMm: -5, withinTolerance: true } },
            },
          },
        }),
      ),
      [POST]: jsonResponse(200, workOrder({ status: 'closed', handoverAt: '2026-06-10T16:30:00.000Z', setupId: SERVICE_IDS.newSetup, version: 3 })),
      [`GET ${WO}/invoice`]: errorResponse(404, 'not_found', 'There is no invoice for this work order yet.'),
    });
    renderApp(PATH);
    const u = userEvent.setup();
    const form = await screen.findByRole('form', { name: 'Close and hand over' });
    await u.click(within(form).getByRole('button', { name: 'Close and hand over…' }));

    const confirm = within(form).getByRole('group', { name: 'Confirm the handover' });
    expect(within(confirm).getAllByRole('listitem').map((li) => li.textContent)).toEqual([
      'Left front: compressed length 20.0 mm shorter than the reference (tolerance 15.0 mm)',
      'Left front: main spring comes off its seat at full droop',
      'Right front: not filled in',
      'Left rear: not filled in',
    ]);
    // Read out with the question, and said before it.
    const list = within(confirm).getByRole('list');
    const describedBy = confirm.getAttribute('aria-describedby')!;
    expect(document.getElementById(describedBy)!.contains(list)).toBe(true);
    expect(confirm.textContent!.indexOf('Left front:')).toBeLessThan(confirm.textContent!.indexOf('Close this visit for good?'));

    await u.click(within(confirm).getByRole('button', { name: 'Yes, close and hand over' }));
    await waitFor(() => expect(requestsTo(fetchMock, POST)).toHaveLength(1));
  });

  it('when the visit has no build sheet at all, then the question lists nothing to check', async () => {
    stubStaff(METRIC_PREFERENCES);
    renderApp(PATH);
    const u = userEvent.setup();
    const form = await screen.findByRole('form', { name: 'Close and hand over' });
    await u.click(within(form).getByRole('button', { name: 'Close and hand over…' }));
    const confirm = within(form).getByRole('group', { name: 'Confirm the handover' });
    expect(within(confirm).queryByRole('list')).toBeNull();
    expect(confirm.getAttribute('aria-describedby')).toBeNull();
  });

  it('when closing is refused for a click count on the build sheet, then the refusal shows by the form, and the label field is not marked', async () => {
    const POST = `POST ${WO}/close`;
    const why = 'The setup this visit hands over would not be valid (RR bump clicks: This adjuster has 12 clicks; use 0 to 12). Correct the build sheet or the after measurements, then close it.';
    const fetchMock = stubStaff(METRIC_PREFERENCES, {
      [POST]: errorResponse(400, 'validation_failed', why, { 'corners.rr.damperClicks': ['This adjuster has 12 clicks; use 0 to 12'] }),
    });
    renderApp(PATH);
    const u = userEvent.setup();
    const form = await screen.findByRole('form', { name: 'Close and hand over' });
    await u.click(within(form).getByRole('button', { name: 'Close and hand over…' }));
    await u.click(within(form).getByRole('button', { name: 'Yes, close and hand over' }));

    await waitFor(() => expect(requestsTo(fetchMock, POST)).toHaveLength(1));
    expect((await within(form).findByRole('alert')).textContent).toBe(why);
    // Still open, and nothing on the form itself is wrong.
    expect(within(form).getByRole('button', { name: 'Close and hand over…' })).toBeTruthy();
    expect(within(form).getByLabelText('Setup label (optional)').getAttribute('aria-invalid')).not.toBe('true');
  });
});

describe('the work order page for the driver', () => {
  it('when the driver opens an open work order, then it reads without any edit controls and offers comments', async () => {
    stubDriver({ [`GET ${WO}`]: jsonResponse(200, workOrder({ lines: [{ kind: 'part', description: 'Camber bolts', quantity: 2, unitPriceCents: 2435, usedUp: false, totalCents: 4870 }], totals: { partsCents: 4870, labourCents: 0, subtotalCents: 4870 } })) });
    renderApp(PATH);
    expect(await screen.findByRole('heading', { name: 'Grey roadster' })).toBeTruthy();
    expect(screen.getByText('Camber bolts')).toBeTruthy();
    expect(screen.getAllByText('$48.70').length).toBeGreaterThan(0);
    expect(screen.queryByRole('button', { name: 'Save parts and labour' })).toBeNull();
    expect(screen.queryByRole('button', { name: /Save before measurements/ })).toBeNull();
    expect(screen.queryByRole('button', { name: 'Save the build sheet' })).toBeNull();
    expect(screen.queryByRole('form', { name: 'Close and hand over' })).toBeNull();
    expect(screen.queryByRole('textbox')).toBeNull();
    expect(screen.getByRole('button', { name: /Comments/ })).toBeTruthy();
  });

  it('when the driver pays online, then the checkout is started and the browser is sent to its address', async () => {
    const POST = `POST /api/invoices/${SERVICE_IDS.invoice}/checkout`;
    const url = 'http://localhost:4010/checkout/cs_test_1';
    const fetchMock = stubDriver({
      [`GET ${WO}`]: jsonResponse(200, workOrder({ status: 'closed', handoverAt: '2026-06-10T16:30:00.000Z', setupId: SERVICE_IDS.newSetup })),
      [`GET ${WO}/invoice`]: jsonResponse(200, invoice()),
      [POST]: jsonResponse(200, { url }),
    });
    const go = vi.spyOn(checkoutNavigation, 'go').mockImplementation(() => undefined);
    renderApp(PATH);
    const u = userEvent.setup();
    expect(await screen.findByText('$146.98')).toBeTruthy();
    expect(screen.getByText('Tax (8.875 %)')).toBeTruthy();
    expect(screen.queryByRole('button', { name: 'Record a cash payment' })).toBeNull();
    await u.click(screen.getByRole('button', { name: 'Pay online' }));

    await waitFor(() => expect(go).toHaveBeenCalledWith(url));
    expect(requestsTo(fetchMock, POST)).toHaveLength(1);
  });

  it('when the driver comes back from the checkout, then the invoice is asked again until it reads paid', async () => {
    stubDriver({
      [`GET ${WO}`]: jsonResponse(200, workOrder({ status: 'closed', handoverAt: '2026-06-10T16:30:00.000Z', setupId: SERVICE_IDS.newSetup })),
      [`GET ${WO}/invoice`]: [
        jsonResponse(200, invoice()),
        jsonResponse(200, invoice({ status: 'paid', paidMethod: 'card', paidAt: '2026-06-10T17:05:00.000Z' })),
      ],
    });
    renderApp(`${PATH}?paid=1`);
    expect(await screen.findByText('Payment received — thank you', undefined, { timeout: 5000 })).toBeTruthy();
    expect(screen.queryByRole('button', { name: 'Pay online' })).toBeNull();
  });
});
