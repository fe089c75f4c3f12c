// @vitest-environment jsdom
import { screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it, vi } from 'vitest';
import { errorResponse, jsonResponse, renderApp, setUpAppTests } from '../../test-utils';
import { formatDateTime, formatDay } from '@/lib/dates';
import { invoice, stubDriver, WO, WORK_ORDER_PATH, workOrder } from '../work-orders/service-fixtures';

setUpAppTests([() => import('@/app/routes/work-orders/work-order'), () => import('@/app/routes/work-orders/invoice')]);

const INVOICE_PATH = `${WORK_ORDER_PATH}/invoice`;
const CLOSED = { status: 'closed', handoverAt: '2026-06-10T16:30:00.000Z', requestedWork: 'Four-wheel alignment\nand corner weights' } as const;

describe('the invoice as a page to print', () => {
  it('when the driver opens it from the work order, then it names the shop with its lines, the number, the dates, the owner, the car, the work and the totals', async () => {
    stubDriver({ [`GET ${WO}`]: jsonResponse(200, workOrder(CLOSED)), [`GET ${WO}/invoice`]: jsonResponse(200, invoice()) });
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
    stubDriver({
      [`GET ${WO}`]: jsonResponse(200, workOrder(CLOSED)),
      [`GET ${WO}/invoice`]: jsonResponse(200, invoice({ status: 'paid', paidMethod: 'card', paidAt })),
    });
    const print = vi.fn();
    vi.stubGlobal('print', print);
    renderApp(INVOICE_PATH);
    expect((await screen.findByLabelText('Invoice status')).textContent).toBe(`Paid by card on ${formatDateTime(paidAt)}`);
    await userEvent.setup().click(screen.getByRole('button', { name: 'Print or save as PDF' }));
    expect(print).toHaveBeenCalledTimes(1);
    // The way back and the button are left off the paper.
    expect(screen.getByRole('button', { name: 'Print or save as PDF' }).parentElement!.className).toContain('print:hidden');
  });

  it('when the shop has not made it yet, then the page says so and leads back to the work order', async () => {
    stubDriver({
      [`GET ${WO}`]: jsonResponse(200, workOrder(CLOSED)),
      [`GET ${WO}/invoice`]: errorResponse(404, 'not_found', 'There is no invoice for this work order yet.'),
    });
    renderApp(INVOICE_PATH);
    expect(await screen.findByRole('heading', { name: 'No invoice yet' })).toBeTruthy();
    expect(screen.getByRole('link', { name: 'Back to the work order' }).getAttribute('href')).toBe(WORK_ORDER_PATH);
    expect(screen.queryByRole('button', { name: /Print/ })).toBeNull();
  });
});
