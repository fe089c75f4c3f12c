// @vitest-environment jsdom
import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import { IMPERIAL_PREFERENCES, METRIC_PREFERENCES } from '../../../../shared/calc/units.calc';
import { CORNERS, type Corner } from '../../../../shared/season/corners';
import {
  BUILD_SHEET_FIELDS,
  type BuildSheetField,
  type BuildSheetInput,
  type MeasuredCorner,
  type MeasurementsInput,
  type WorkOrderStage,
} from '../../../../shared/service/work-order.schema';
import { errorResponse, jsonResponse, renderApp, requestsTo, setUpAppTests } from '../../test-utils';
import { formatDateTime, formatDay } from '@/lib/dates';
import { invoice, SERVICE_IDS, stubDriver, stubStaff, WO, WORK_ORDER_PATH, workOrder } from './service-fixtures';
import { COLLAB_IDS, SHOP } from '../../fixtures/collab';

const PATH = WORK_ORDER_PATH;
const BUILD_SHEET_PUT = `PUT ${WO}/build-sheet`;
const MAKE_INVOICE = `POST ${WO}/invoice`;
const MARK_PAID = `POST /api/invoices/${SERVICE_IDS.invoice}/mark-paid`;
const CLOSED = { status: 'closed', handoverAt: '2026-06-10T16:30:00.000Z', setupId: SERVICE_IDS.newSetup, version: 3 } as const;
const NO_INVOICE = errorResponse(404, 'not_found', 'There is no invoice for this work order yet.');

setUpAppTests([() => import('@/app/routes/work-orders/work-order')]);

/** The build-sheet form, once the page has loaded. */
async function buildSheetForm() {
  return screen.findByRole('form', { name: 'Edit the build sheet' });
}

/** The fields of the corner the build-sheet editor shows now (a group named after the corner). */
function cornerFields(form: HTMLElement, name: string) {
  return within(within(form).getByRole('group', { name }));
}

/** The unit printed beside an input (its first aria-describedby element). */
function unitBeside(input: HTMLElement): string {
  const unitId = input.getAttribute('aria-describedby')?.split(' ')[0] ?? '';
  return document.getElementById(unitId)?.textContent ?? '';
}

function stage(corners: Partial<Record<Corner, Partial<MeasuredCorner>>>): WorkOrderStage {
  const empty: MeasuredCorner = { camberDeg: null, toeMm: null, casterDeg: null, rideHeightMm: null, cornerWeightKg: null };
  return {
    measuredAt: null,
    driverInCar: false,
    driverWeightKg: null,
    fuelLevelPct: null,
    corners: { lf: { ...empty, ...corners.lf }, rf: { ...empty, ...corners.rf }, lr: { ...empty, ...corners.lr }, rr: { ...empty, ...corners.rr } },
    balance: null,
  };
}

describe('the build sheet editor', () => {
  it('when lengths and spring rates are typed in inches and lb/in on two corners, then exactly those values are sent in mm and N/mm', async () => {
    // Under IMPERIAL_PREFERENCES spring rates are 'lbf/in', which the app labels "lb/in".
    const fetchMock = stubStaff(IMPERIAL_PREFERENCES, { [BUILD_SHEET_PUT]: jsonResponse(200, workOrder({ version: 2 })) });
    renderApp(PATH);
    const u = userEvent.setup();
    const form = await buildSheetForm();

    const lf = cornerFields(form, 'Left front');
    expect(unitBeside(lf.getByLabelText('Stroke'))).toBe('in');
    expect(unitBeside(lf.getByLabelText('Main spring rate'))).toBe('lb/in');
    await u.type(lf.getByLabelText('Stroke'), '4');
    await u.type(lf.getByLabelText('Main spring rate'), '500');

    await u.click(within(form).getByRole('radio', { name: 'RR' }));
    const rr = cornerFields(form, 'Right rear');
    // The other corner's values are not shown here: each corner has its own inputs.
    expect((rr.getByLabelText('Stroke') as HTMLInputElement).value).toBe('');
    await u.type(rr.getByLabelText('Main spring free length'), '8.25');
    await u.type(rr.getByLabelText('Helper spring rate'), '50');
    await u.click(within(form).getByRole('button', { name: 'Save the build sheet' }));

    await waitFor(() => expect(requestsTo(fetchMock, BUILD_SHEET_PUT)).toHaveLength(1));
    const body = requestsTo(fetchMock, BUILD_SHEET_PUT)[0]!.body as BuildSheetInput;
    // NIST SP 811 (2008), Appendix B.8: 1 in = 2.54 × 10⁻² m exactly (25.4 mm), and
    // 1 lbf = 4.448 221 615 260 5 N exactly, so 1 lbf/in = 4.448 221 615 260 5 / 25.4 N/mm.
    const N_PER_MM_PER_LBF_PER_IN = 4.4482216152605 / 25.4;
    const expected: Partial<Record<Corner, Partial<Record<BuildSheetField, number>>>> = {
      lf: { strokeMm: 4 * 25.4, mainSpringRateNPerMm: 500 * N_PER_MM_PER_LBF_PER_IN }, // 101.6 mm; 87.563 418 N/mm
      rr: { mainSpringFreeLengthMm: 8.25 * 25.4, helperSpringRateNPerMm: 50 * N_PER_MM_PER_LBF_PER_IN }, // 209.55 mm; 8.756 342 N/mm
    };
    expect(Object.keys(body.corners).sort()).toEqual([...CORNERS].sort());
    for (const corner of CORNERS) {
      const sent = body.corners[corner]!;
      for (const field of BUILD_SHEET_FIELDS) {
        const want = expected[corner]?.[field];
        if (want === undefined) expect(sent[field], `${corner}.${field}`).toBeNull();
        else expect(sent[field], `${corner}.${field}`).toBeCloseTo(want, 5);
      }
    }
    expect(await within(form).findByRole('status')).toBeTruthy();
  });

  it('when a corner not on screen has a fractional click count, then nothing is sent and the editor turns to that corner with the error', async () => {
    const fetchMock = stubStaff(METRIC_PREFERENCES, { [BUILD_SHEET_PUT]: jsonResponse(200, workOrder({ version: 2 })) });
    renderApp(PATH);
    const u = userEvent.setup();
    const form = await buildSheetForm();

    await u.click(within(form).getByRole('radio', { name: 'RR' }));
    await u.type(cornerFields(form, 'Right rear').getByLabelText('Bump clicks as delivered'), '8.5');
    await u.click(within(form).getByRole('radio', { name: 'LF' }));
    await u.type(cornerFields(form, 'Left front').getByLabelText('Rebound clicks as delivered'), '12');
    await u.click(within(form).getByRole('button', { name: 'Save the build sheet' }));

    const rr = cornerFields(form, 'Right rear');
    const bump = rr.getByLabelText('Bump clicks as delivered') as HTMLInputElement;
    expect(bump.getAttribute('aria-invalid')).toBe('true');
    expect(bump.value).toBe('8.5');
    expect(rr.getByText('Enter a whole number')).toBeTruthy();
    expect((within(form).getByRole('radio', { name: 'RR' }) as HTMLInputElement).checked).toBe(true);
    expect(within(form).queryByRole('group', { name: 'Left front' })).toBeNull();
    // The whole-number clicks beside it are fine.
    expect(rr.getByLabelText('Rebound clicks as delivered').getAttribute('aria-invalid')).toBeNull();
    expect(requestsTo(fetchMock, BUILD_SHEET_PUT)).toHaveLength(0);
  });

  it('when the server refuses a corner value, then its message shows beside that corner’s field', async () => {
    const message = 'Stroke must be between 0 and 2000 mm';
    const fetchMock = stubStaff(METRIC_PREFERENCES, {
      [BUILD_SHEET_PUT]: errorResponse(400, 'validation_failed', 'Some fields need attention.', { 'corners.lf.strokeMm': [message] }),
    });
    renderApp(PATH);
    const u = userEvent.setup();
    const form = await buildSheetForm();
    const lf = cornerFields(form, 'Left front');
    await u.type(lf.getByLabelText('Stroke'), '120');
    await u.click(within(form).getByRole('button', { name: 'Save the build sheet' }));

    await waitFor(() => expect(requestsTo(fetchMock, BUILD_SHEET_PUT)).toHaveLength(1));
    expect((requestsTo(fetchMock, BUILD_SHEET_PUT)[0]!.body as BuildSheetInput).corners.lf?.strokeMm).toBe(120);
    const stroke = lf.getByLabelText('Stroke');
    await waitFor(() => expect(stroke.getAttribute('aria-invalid')).toBe('true'));
    const shown = lf.getByText(message);
    // Read out with the input, not only drawn near it.
    expect(stroke.getAttribute('aria-describedby')?.split(' ')).toContain(shown.id);
    expect(lf.getByLabelText('Damper free length').getAttribute('aria-invalid')).toBeNull();
    expect((stroke as HTMLInputElement).value).toBe('120');
  });

  it('when the server refuses a value on a corner not on screen, then the editor turns to that corner and shows the message', async () => {
    const message = 'Stroke must be between 0 and 2000 mm';
    stubStaff(METRIC_PREFERENCES, {
      [BUILD_SHEET_PUT]: errorResponse(400, 'validation_failed', 'Some fields need attention.', { 'corners.rr.strokeMm': [message] }),
    });
    renderApp(PATH);
    const u = userEvent.setup();
    const form = await buildSheetForm();
    await u.type(cornerFields(form, 'Left front').getByLabelText('Stroke'), '120');
    await u.click(within(form).getByRole('button', { name: 'Save the build sheet' }));

    const rr = await waitFor(() => cornerFields(form, 'Right rear'));
    await waitFor(() => expect(rr.getByLabelText('Stroke').getAttribute('aria-invalid')).toBe('true'));
    expect(rr.getByText(message)).toBeTruthy();
    // The refused field takes the focus, and the Save button says there is something above to fix.
    await waitFor(() => expect(document.activeElement).toBe(rr.getByLabelText('Stroke')));
    expect(within(form).getByRole('alert').textContent).toBe('One value needs attention; it is marked above.');
  });
});

describe('the measurement forms', () => {
  it('when the before readings are saved, then the after readings typed but not saved stay in their form', async () => {
    const PUT_BEFORE = `PUT ${WO}/measurements/before`;
    const saved = workOrder({ version: 2, updatedAt: '2026-06-10T09:00:00.000Z', stages: { before: stage({ lf: { rideHeightMm: 127 } }), after: null } });
    const fetchMock = stubStaff(METRIC_PREFERENCES, { [PUT_BEFORE]: jsonResponse(200, saved) });
    renderApp(PATH);
    const u = userEvent.setup();

    const after = await screen.findByRole('form', { name: 'After measurements' });
    const afterLf = within(within(after).getByRole('group', { name: 'After: per corner' })).getByRole('group', { name: 'Left front' });
    await u.type(within(afterLf).getByLabelText('Ride height'), '121.5');
    await u.type(within(afterLf).getByLabelText('Camber'), '-2.1');
    await u.type(within(after).getByLabelText('Fuel level'), '40');

    const before = screen.getByRole('form', { name: 'Before measurements' });
    const beforeLf = within(within(before).getByRole('group', { name: 'Before: per corner' })).getByRole('group', { name: 'Left front' });
    await u.type(within(beforeLf).getByLabelText('Ride height'), '127');
    await u.click(within(before).getByRole('button', { name: 'Save before measurements' }));

    await waitFor(() => expect(requestsTo(fetchMock, PUT_BEFORE)).toHaveLength(1));
    expect((requestsTo(fetchMock, PUT_BEFORE)[0]!.body as MeasurementsInput).corners.lf?.rideHeightMm).toBe(127);
    // The saved work order (version 2) is on screen: the comparison now shows the before reading.
    expect(await within(before).findByRole('status')).toBeTruthy();
    expect(await screen.findByRole('heading', { name: 'Before' })).toBeTruthy();

    const afterNow = screen.getByRole('form', { name: 'After measurements' });
    const afterLfNow = within(within(afterNow).getByRole('group', { name: 'After: per corner' })).getByRole('group', { name: 'Left front' });
    expect((within(afterLfNow).getByLabelText('Ride height') as HTMLInputElement).value).toBe('121.5');
    expect((within(afterLfNow).getByLabelText('Camber') as HTMLInputElement).value).toBe('-2.1');
    expect((within(afterNow).getByLabelText('Fuel level') as HTMLInputElement).value).toBe('40');
    expect(requestsTo(fetchMock, `PUT ${WO}/measurements/after`)).toHaveLength(0);
  });
  it('when a screen reader moves through the readings, then each input names its corner and stage while the grid still shows the short label', async () => {
    stubStaff(METRIC_PREFERENCES);
    renderApp(PATH);
    const before = await screen.findByRole('form', { name: 'Before measurements' });
    const after = screen.getByRole('form', { name: 'After measurements' });
    // Each reading found by its full name, once only (getByRole refuses a name two inputs share).
    const corners = { lf: 'Left front', rf: 'Right front', lr: 'Left rear', rr: 'Right rear' } as const;
    const fields = ['camber', 'toe (in +)', 'caster', 'ride height', 'corner weight'];
    for (const [stageName, form] of [['before', before], ['after', after]] as const) {
      const grid = within(form).getByRole('group', { name: /per corner/ });
      expect(within(grid).getAllByRole('textbox')).toHaveLength(4 * fields.length);
      for (const corner of CORNERS) {
        for (const field of fields) {
          const input = within(grid).getByRole('textbox', { name: `${corners[corner]} ${field}, ${stageName}` });
          expect(within(grid).getByRole('group', { name: corners[corner] }).contains(input)).toBe(true);
        }
      }
    }

    const rf = within(within(after).getByRole('group', { name: 'After: per corner' })).getByRole('group', { name: 'Right front' });
    const camber = within(rf).getByRole('textbox', { name: 'Right front camber, after' });
    // The label drawn beside it stays one word.
    expect(within(rf).getByText('Camber', { selector: 'label' }).getAttribute('for')).toBe(camber.id);
  });
});

describe('a measurement the form or the server refuses', () => {
  it('when the server refuses a ride height, then by the Save button the form says how many values need attention, and the first refused one takes the focus', async () => {
    const PUT_BEFORE = `PUT ${WO}/measurements/before`;
    stubStaff(METRIC_PREFERENCES, {
      [PUT_BEFORE]: errorResponse(400, 'validation_failed', 'Some fields need attention.', {
        'corners.lf.rideHeightMm': ['Ride height must be between 0 and 1000 mm'],
        'corners.rr.rideHeightMm': ['Ride height must be between 0 and 1000 mm'],
      }),
    });
    renderApp(PATH);
    const u = userEvent.setup();
    const before = await screen.findByRole('form', { name: 'Before measurements' });
    const corner = (name: string) => within(within(before).getByRole('group', { name: 'Before: per corner' })).getByRole('group', { name });
    await u.type(within(corner('Left front')).getByLabelText('Ride height'), '9999');
    await u.type(within(corner('Right rear')).getByLabelText('Ride height'), '9999');
    await u.click(within(before).getByRole('button', { name: 'Save before measurements' }));

    const lf = within(corner('Left front')).getByLabelText('Ride height');
    await waitFor(() => expect(document.activeElement).toBe(lf));
    expect(lf.getAttribute('aria-invalid')).toBe('true');
    expect(within(before).getByRole('alert').textContent).toBe('2 values need attention; they are marked above.');
  });

  it('when a value is not a number, then nothing is sent, the field takes the focus and the Save button says so', async () => {
    const PUT_BEFORE = `PUT ${WO}/measurements/before`;
    const fetchMock = stubStaff(METRIC_PREFERENCES, { [PUT_BEFORE]: jsonResponse(200, workOrder({ version: 2 })) });
    renderApp(PATH);
    const u = userEvent.setup();
    const before = await screen.findByRole('form', { name: 'Before measurements' });
    await u.type(within(before).getByLabelText('Fuel level'), 'half');
    await u.click(within(before).getByRole('button', { name: 'Save before measurements' }));

    await waitFor(() => expect(document.activeElement).toBe(within(before).getByLabelText('Fuel level')));
    expect(within(before).getByRole('alert').textContent).toBe('One value needs attention; it is marked above.');
    expect(requestsTo(fetchMock, PUT_BEFORE)).toHaveLength(0);
  });
});

describe('the before and after comparison', () => {
  /** The visit with one left-front value measured before and after, and the server's change: that value's line. */
  async function leftFrontLine(field: 'rideHeightMm' | 'camberDeg', before: number, after: number, label: string) {
    const diff = workOrder().diff;
    stubStaff(METRIC_PREFERENCES, {
      [`GET ${WO}`]: jsonResponse(
        200,
        workOrder({
          stages: { before: stage({ lf: { [field]: before } }), after: stage({ lf: { [field]: after } }) },
          diff: { ...diff, lf: { ...diff.lf, [field]: Math.round((after - before) * 1e6) / 1e6 } },
        }),
      ),
    });
    renderApp(PATH);
    const grid = await screen.findByRole('group', { name: 'Before → after, per corner' });
    return within(within(grid).getByRole('group', { name: 'Left front' })).getByText(label).parentElement!;
  }

  it('when a corner was measured twice, then each reading keeps its unit and the change keeps its arrow on one line', async () => {
    const ride = await leftFrontLine('rideHeightMm', 127, 121.5, 'Ride height');
    // Text wraps only at ordinary spaces; a no-break space holds a number to its unit (common typographic practice).
    expect(ride.textContent).toBe('Ride height127.0\u00a0mm\u00a0→ 121.5\u00a0mm ▼\u00a05.5\u00a0mm');
  });

  it('when camber was measured twice, then its change reads as the setups say it, "more negative", not an arrow', async () => {
    const camber = await leftFrontLine('camberDeg', -1.1, -2.4, 'Camber');
    expect(camber.textContent).toMatch(/→ −2\.40° 1\.30° more negative$/);
  });
});

describe('the invoice for shop staff', () => {
  it('when staff make the invoice for a closed visit, then it is posted and its lines, totals and status appear', async () => {
    const fetchMock = stubStaff(METRIC_PREFERENCES, {
      [`GET ${WO}`]: jsonResponse(200, workOrder(CLOSED)),
      [`GET ${WO}/invoice`]: NO_INVOICE,
      [MAKE_INVOICE]: jsonResponse(201, invoice()),
    });
    renderApp(PATH);
    const u = userEvent.setup();
    expect(await screen.findByText(/^No invoice yet\./)).toBeTruthy();
    // The shop has not written its address and tax number: said before the first invoice goes out without them.
    const missing = await screen.findByText(/^Invoices carry only the shop’s name so far/);
    expect(missing.textContent).toBe('Invoices carry only the shop’s name so far: no address or tax number. Add them under “Invoices and build sheets” on the Shop page.');
    expect(within(missing).getByRole('link', { name: 'Shop page' }).getAttribute('href')).toBe('/shop');
    expect(screen.queryByRole('table', { name: 'Invoice lines' })).toBeNull();
    await u.click(screen.getByRole('button', { name: 'Make the invoice' }));

    const table = await screen.findByRole('table', { name: 'Invoice lines' });
    expect(requestsTo(fetchMock, MAKE_INVOICE)).toHaveLength(1);
    // The shop's own number, when it was made, and for whom.
    expect(screen.getByText(/^Invoice 14/).closest('p')!.textContent).toBe(`Invoice 14 · issued ${formatDay('2026-06-10T17:00:00.000Z')} · for Maren Holt`);
    expect(within(table).getByRole('cell', { name: 'Labour: Alignment' })).toBeTruthy();
    expect(within(within(table).getByRole('row', { name: /^Subtotal/ })).getByText('$135.00')).toBeTruthy();
    expect(within(within(table).getByRole('row', { name: /^Tax \(8\.875 %\)/ })).getByText('$11.98')).toBeTruthy();
    expect(within(within(table).getByRole('row', { name: /^Total/ })).getByText('$146.98')).toBeTruthy();
    expect(screen.getByLabelText('Invoice status').textContent).toBe('Not paid yet');
    expect(screen.queryByRole('button', { name: 'Make the invoice' })).toBeNull();
    expect(screen.getByRole('button', { name: 'Record a cash payment' })).toBeTruthy();
  });

  it('when the shop has written its lines for invoices, then nothing is said of them before the invoice is made', async () => {
    const fetchMock = stubStaff(METRIC_PREFERENCES, {
      [`GET ${WO}`]: jsonResponse(200, workOrder(CLOSED)),
      [`GET ${WO}/invoice`]: NO_INVOICE,
      [`GET /api/shops/${COLLAB_IDS.shop}`]: jsonResponse(200, { ...SHOP, settings: { ...SHOP.settings, invoiceDetails: '12 Kettle Lane' } }),
    });
    renderApp(PATH);
    expect(await screen.findByRole('button', { name: 'Make the invoice' })).toBeTruthy();
    await waitFor(() => expect(requestsTo(fetchMock, `GET /api/shops/${COLLAB_IDS.shop}`).length).toBeGreaterThan(0));
    expect(screen.queryByText(/Invoices carry only the shop’s name/)).toBeNull();
  });

  it('when staff take cash, then the invoice is marked paid in cash and no payment buttons remain', async () => {
    const paidAt = '2026-06-10T17:10:00.000Z';
    const fetchMock = stubStaff(METRIC_PREFERENCES, {
      [`GET ${WO}`]: jsonResponse(200, workOrder(CLOSED)),
      [`GET ${WO}/invoice`]: jsonResponse(200, invoice()),
      [MARK_PAID]: jsonResponse(200, invoice({ status: 'paid', paidMethod: 'cash', paidAt })),
    });
    renderApp(PATH);
    const u = userEvent.setup();
    expect((await screen.findByLabelText('Invoice status')).textContent).toBe('Not paid yet');
    expect(screen.queryByRole('button', { name: 'Pay online' })).toBeNull();
    await u.click(screen.getByRole('button', { name: 'Record a cash payment' }));

    await waitFor(() => expect(screen.getByLabelText('Invoice status').textContent).toBe(`Paid in cash on ${formatDateTime(paidAt)}`));
    expect(requestsTo(fetchMock, MARK_PAID).map((r) => r.body)).toEqual([{ method: 'cash' }]);
    expect(screen.queryByRole('button', { name: 'Record a cash payment' })).toBeNull();
    expect(screen.queryByRole('button', { name: 'Pay online' })).toBeNull();
  });

  it('when the invoice was paid online meanwhile, then the refusal is followed by the invoice read again, now paid by card', async () => {
    const paidAt = '2026-06-10T17:12:00.000Z';
    // The driver's card payment lands between the page loading and the click.
    let paidOnline = false;
    const fetchMock = stubStaff(METRIC_PREFERENCES, {
      [`GET ${WO}`]: jsonResponse(200, workOrder(CLOSED)),
      [`GET ${WO}/invoice`]: () => jsonResponse(200, paidOnline ? invoice({ status: 'paid', paidMethod: 'card', paidAt }) : invoice()),
      [MARK_PAID]: () => {
        paidOnline = true;
        return errorResponse(409, 'conflict', 'This invoice is already paid.');
      },
    });
    renderApp(PATH);
    const u = userEvent.setup();
    await u.click(await screen.findByRole('button', { name: 'Record a cash payment' }));

    await waitFor(() => expect(screen.getByLabelText('Invoice status').textContent).toBe(`Paid by card on ${formatDateTime(paidAt)}`));
    expect(requestsTo(fetchMock, MARK_PAID)).toHaveLength(1);
    // The work order and its invoice are still there; nothing is left to pay.
    expect(screen.getByRole('heading', { name: 'Grey roadster' })).toBeTruthy();
    expect(screen.getByRole('table', { name: 'Invoice lines' })).toBeTruthy();
    expect(screen.queryByRole('button', { name: 'Record a cash payment' })).toBeNull();
  });

  it('when the server cannot be reached, then the message shows in the form and the button works again', async () => {
    const paidAt = '2026-06-10T17:12:00.000Z';
    const fetchMock = stubStaff(METRIC_PREFERENCES, {
      [`GET ${WO}`]: jsonResponse(200, workOrder(CLOSED)),
      [`GET ${WO}/invoice`]: jsonResponse(200, invoice()),
      [MARK_PAID]: [errorResponse(503, 'unavailable', 'The server is busy; try again in a moment.'), jsonResponse(200, invoice({ status: 'paid', paidMethod: 'cash', paidAt }))],
    });
    renderApp(PATH);
    const u = userEvent.setup();
    await u.click(await screen.findByRole('button', { name: 'Record a cash payment' }));

    const invoiceSection = screen.getByRole('region', { name: 'Invoice' });
    await waitFor(() => expect(within(invoiceSection).getByRole('alert').textContent).toBe('The server is busy; try again in a moment.'));
    const again = within(invoiceSection).getByRole('button', { name: 'Record a cash payment' }) as HTMLButtonElement;
    expect(again.disabled).toBe(false);
    await u.click(again);
    await waitFor(() => expect(screen.getByLabelText('Invoice status').textContent).toBe(`Paid in cash on ${formatDateTime(paidAt)}`));
    expect(requestsTo(fetchMock, MARK_PAID)).toHaveLength(2);
  });
});

describe('the invoice for the driver', () => {
  it('when the shop has made no invoice, then the driver reads so and cannot make one', async () => {
    const fetchMock = stubDriver({
      [`GET ${WO}`]: jsonResponse(200, workOrder(CLOSED)),
      [`GET ${WO}/invoice`]: NO_INVOICE,
    });
    renderApp(PATH);
    expect(await screen.findByText('The shop has not sent an invoice yet.')).toBeTruthy();
    expect(requestsTo(fetchMock, `GET ${WO}/invoice`).length).toBeGreaterThan(0);
    expect(screen.queryByRole('button', { name: 'Make the invoice' })).toBeNull();
    expect(screen.queryByRole('button', { name: 'Pay online' })).toBeNull();
    expect(requestsTo(fetchMock, MAKE_INVOICE)).toHaveLength(0);
  });
  it('when the invoice bills a used-up part, then its line says so and the fitted part and the labour do not', async () => {
    stubDriver({
      [`GET ${WO}`]: jsonResponse(200, workOrder(CLOSED)),
      [`GET ${WO}/invoice`]: jsonResponse(
        200,
        invoice({
          lines: [
            { kind: 'part', description: 'Rear toe arm', quantity: 2, unitPriceCents: 9900, usedUp: false, amountCents: 19800 },
            { kind: 'part', description: 'Brake fluid, 1 l', quantity: 1, unitPriceCents: 1800, usedUp: true, amountCents: 1800 },
            { kind: 'labour', description: 'Bleed brakes', quantity: 0.5, unitPriceCents: 9500, usedUp: false, amountCents: 4750 },
          ],
        }),
      ),
    });
    renderApp(PATH);
    const table = await screen.findByRole('table', { name: 'Invoice lines' });
    expect(within(table).getByRole('cell', { name: 'Part: Brake fluid, 1 l (used up in the work)' })).toBeTruthy();
    expect(within(table).getByRole('cell', { name: 'Part: Rear toe arm' })).toBeTruthy();
    expect(within(table).getByRole('cell', { name: 'Labour: Bleed brakes' })).toBeTruthy();
  });
});
