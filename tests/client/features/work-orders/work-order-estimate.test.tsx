// @vitest-environment jsdom
import { screen, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { METRIC_PREFERENCES } from '../../../../shared/calc/units.calc';
import { jsonResponse, renderApp, setUpAppTests } from '../../test-utils';
import { stubStaff, WO, WORK_ORDER_PATH, workOrder } from './service-fixtures';

setUpAppTests([() => import('@/app/routes/work-orders/work-order')]);

// Worked by hand (common practice: money in whole cents, each line and the tax rounded to the cent, halves away from
// zero): 2 × $19.99 = $39.98; 1.5 h × $95.00 = $142.50; subtotal $182.48; tax 8.25 % of $182.48 = $15.0546 → $15.05;
// total $197.53. The same arithmetic is checked against mathjs, an independent decimal library, in
// tests/shared/calc/invoice.calc.test.ts.
const OPEN = workOrder({
  shop: { ...workOrder().shop, taxRatePct: 8.25 },
  lines: [
    { kind: 'part', description: 'Camber bolts', quantity: 2, unitPriceCents: 1999, usedUp: false, totalCents: 3998 },
    { kind: 'labour', description: 'Alignment', quantity: 1.5, unitPriceCents: 9500, usedUp: false, totalCents: 14250 },
  ],
  totals: { partsCents: 3998, labourCents: 14250, subtotalCents: 18248 },
});

describe('an open work order’s parts and labour', () => {
  it('when staff open a visit with lines, then a running estimate shows each amount, the subtotal, tax at the shop’s rate and the total, labelled as an estimate (worked by hand)', async () => {
    stubStaff(METRIC_PREFERENCES, { [`GET ${WO}`]: jsonResponse(200, OPEN) });
    renderApp(WORK_ORDER_PATH);

    const table = await screen.findByRole('table', { name: 'Parts and labour, estimate' });
    const row = (name: string | RegExp) => within(table).getByRole('row', { name });
    expect(row(/Camber bolts/).textContent).toContain('$39.98');
    expect(row(/Alignment/).textContent).toContain('$142.50');
    expect(row(/Subtotal \(estimate\)/).textContent).toContain('$182.48');
    expect(row(/Tax at 8.25 % \(estimate\)/).textContent).toContain('$15.05');
    expect(row(/Estimated total/).textContent).toContain('$197.53');
    expect(screen.getByText(/Estimate: the amounts are final once the work order is closed/)).toBeTruthy();
    // The form that edits the lines is still there.
    expect(screen.getByRole('button', { name: 'Save parts and labour' })).toBeTruthy();
  });

  it('when the shop has set no tax rate, then the estimate says so instead of claiming 0 % tax, and the total is the subtotal', async () => {
    stubStaff(METRIC_PREFERENCES, { [`GET ${WO}`]: jsonResponse(200, { ...OPEN, shop: { ...OPEN.shop, taxRatePct: 0 } }) });
    renderApp(WORK_ORDER_PATH);

    const table = await screen.findByRole('table', { name: 'Parts and labour, estimate' });
    expect(within(table).getByRole('row', { name: /Tax: no rate set by the shop/ }).textContent).toContain('$0.00');
    expect(within(table).queryByRole('row', { name: /Tax at 0 %/ })).toBeNull();
    expect(within(table).getByRole('row', { name: /Estimated total/ }).textContent).toContain('$182.48');
  });
});
