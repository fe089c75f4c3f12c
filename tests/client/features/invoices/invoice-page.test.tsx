// @vitest-environment jsdom
import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it, vi } from 'vitest';
import { errorResponse, jsonResponse, renderApp, requestsTo, setUpAppTests } from '../../test-utils';
import { formatDateTime, formatDay } from '@/lib/dates';
import { invoice, SERVICE_IDS, stubDriver, stubStaff, WO, WORK_ORDER_PATH, workOrder } from '../work-orders/service-fixtures';
import { METRIC_PREFERENCES } from '../../../../shared/calc/units.calc';
import { list } from '../../fixtures/season';
import { COLLAB_IDS } from '../../fixtures/collab';
import type { ShopInvoiceRow } from '../../../../shared/service/invoice.schema';

setUpAppTests([() => import('@/app/routes/work-orders/work-order'), () => import('@/app/routes/invoices/invoice'), () => import('@/app/routes/shop/shop')]);

const INVOICE_PATH = `/invoices/${SERVICE_IDS.invoice}`;
const INVOICE_API = `GET /api/invoices/${SERVICE_IDS.invoice}`;
const MARK_PAID = `POST /api/invoices/${SERVICE_IDS.invoice}/mark-paid`;
const CLOSED = { status: 'closed', handoverAt: '2026-06-10T16:30:00.000Z', requestedWork: 'Four-wheel alignment\nand corner weights' } as const;

describe('the invoice as a page to print', () => {
  it('when the driver opens it from the work order, then it names the shop with its lines, the number, the dates, the owner, the car, the work and the totals', async () => {
    stubDriver({
      [`GET ${WO}`]: jsonResponse(200, workOrder(CLOSED)),
      [`GET ${WO}/invoice`]: jsonResponse(200, invoice()),
      [INVOICE_API]: jsonResponse(200, invoice({ requestedWork: 'Four-wheel alignment\nand corner weights' })),
    });
    renderApp(WORK_ORDER_PATH);
    await userEvent.setup().click(await screen.findByRole('link', { name: 'Open the invoice to print' }));

    const doc = await screen.findByRole('article', { name: 'Invoice 14' });
    expect(within(doc).getByRole('heading', { level: 1 }).textContent).toBe('Invoice 14');
    expect(within(doc).getByText('Kettle Lane Chassis Works')).toBeTruthy();
    // The shop's own lines keep their line breaks.
    const details = within(doc).getByLabelText('Shop details');
    expect(details.textContent).toBe('12 Kettle Lane, Brindle\nTel. 555 0143');
    expect(details.className).toContain('whitespace-pre-line');
    const dates = within(doc).getByLabelText('Invoice dates');
    expect(dates.textContent).toBe(`Issued${formatDay('2026-06-10T17:00:00.000Z')}Work done${formatDay('2026-06-10')}`);
    const billTo = within(doc).getByRole('region', { name: 'For' });
    expect(billTo.textContent).toBe('ForMaren HoltGrey roadster #47 · class SM');
    expect(within(doc).getByRole('region', { name: 'Work asked for' }).textContent).toBe('Work asked forFour-wheel alignment\nand corner weights');
    const table = within(doc).getByRole('table', { name: 'Lines of invoice 14' });
    expect(within(table).getByRole('cell', { name: 'Labour: Alignment' })).toBeTruthy();
    expect(within(within(table).getByRole('row', { name: /^Total/ })).getByText('$146.98')).toBeTruthy();
    expect(within(doc).getByLabelText('Invoice status').textContent).toBe('Not paid yet');
    expect(document.title).toBe('Invoice 14 · Kettle Lane Chassis Works · Scrubline');
  });

  it('when it is paid, then the page says how and when; Print asks the browser to print', async () => {
    const paidAt = '2026-06-10T17:10:00.000Z';
    stubDriver({ [INVOICE_API]: jsonResponse(200, invoice({ status: 'paid', paidMethod: 'card', paidAt })) });
    const print = vi.fn();
    vi.stubGlobal('print', print);
    renderApp(INVOICE_PATH);
    expect((await screen.findByLabelText('Invoice status')).textContent).toBe(`Paid by card on ${formatDateTime(paidAt)}`);
    await userEvent.setup().click(screen.getByRole('button', { name: 'Print or save as PDF' }));
    expect(print).toHaveBeenCalledTimes(1);
    // The way back and the button are left off the paper.
    expect(screen.getByRole('button', { name: 'Print or save as PDF' }).parentElement!.className).toContain('print:hidden');
  });

  it('when the driver may not see it (the car deleted, or never theirs), then the page says it was not found', async () => {
    stubDriver({ [INVOICE_API]: errorResponse(404, 'not_found', 'That invoice was not found.') });
    renderApp(INVOICE_PATH);
    expect(await screen.findByRole('heading', { name: 'Invoice not found' })).toBeTruthy();
    expect(screen.queryByRole('button', { name: /Print/ })).toBeNull();
  });

  it('when its car was deleted, then the shop still opens it from its book, reads that it is kept, and takes cash for it there', async () => {
    const kept = invoice({ workOrderId: null, carId: null });
    const row: ShopInvoiceRow = {
      id: kept.id, number: kept.number, workOrderId: null, billTo: kept.billTo, car: kept.car, totalCents: kept.totalCents,
      currency: kept.currency, status: 'open', paidAt: null, createdAt: kept.createdAt, visitDate: kept.visitDate,
    };
    let paid = false;
    const fetchMock = stubStaff(METRIC_PREFERENCES, {
      [`GET /api/shops/${COLLAB_IDS.shop}/customers`]: list([]),
      [`GET /api/shops/${COLLAB_IDS.shop}/work-orders?status=open`]: list([]),
      [`GET /api/shops/${COLLAB_IDS.shop}/work-orders?status=closed`]: list([]),
      [`GET /api/shops/${COLLAB_IDS.shop}/invoices?status=open`]: () => (paid ? list([]) : list([row])),
      [`GET /api/shops/${COLLAB_IDS.shop}/invoices`]: list([{ ...row, status: 'paid', paidAt: '2026-06-11T09:00:00.000Z' }]),
      [INVOICE_API]: jsonResponse(200, kept),
      [MARK_PAID]: () => {
        paid = true;
        return jsonResponse(200, { ...kept, status: 'paid', paidMethod: 'cash', paidAt: '2026-06-11T09:00:00.000Z' });
      },
    });
    renderApp('/shop');
    const u = userEvent.setup();
    const book = await screen.findByRole('list', { name: 'Invoices not paid yet' });
    const link = within(book).getByRole('link');
    expect(link.textContent).toBe(`Invoice 14 · ${formatDay(kept.createdAt)}Maren Holt · Grey roadster #47 · class SM$146.98 · not paid`);
    await u.click(link);

    await screen.findByRole('article', { name: 'Invoice 14' });
    expect(screen.getByText('Its car was deleted by its owner; the shop keeps the invoice as issued.')).toBeTruthy();
    // No visit to go back to: the way back is the shop.
    const main = within(screen.getByRole('main'));
    expect(main.queryByRole('link', { name: 'Work order' })).toBeNull();
    expect(main.getByRole('link', { name: 'Shop' }).getAttribute('href')).toBe('/shop');
    await u.click(screen.getByRole('button', { name: 'Record a cash payment' }));
    await waitFor(() => expect(screen.getByLabelText('Invoice status').textContent).toMatch(/^Paid in cash on /));
    expect(requestsTo(fetchMock, MARK_PAID)[0]!.body).toEqual({ method: 'cash' });
    expect(screen.queryByRole('button', { name: 'Record a cash payment' })).toBeNull();

    // Back in the book, the paid invoice has left the unpaid list and shows as paid in the whole book.
    await u.click(main.getByRole('link', { name: 'Shop' }));
    expect(await screen.findByText('No invoice is waiting to be paid.')).toBeTruthy();
    await u.click(screen.getByRole('radio', { name: 'All' }));
    const whole = await screen.findByRole('list', { name: 'All invoices' });
    expect(within(whole).getByRole('link').textContent).toMatch(/\$146\.98 · paid /);
  });
});
