/**
 * Invoices for closed service visits, the shop's tax settings, checkout on the local fake
 * payment service, and cash. Prices are invented; the arithmetic is written out by hand.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { makeTestApp, signedInClient, type TestApp } from '../test-app';
import { addCoDriver, expectError, expectFieldErrors } from '../season/season-fixtures';
import { addStaff, grantedCar, shopWithAdmin } from '../collab/shop-fixtures';
import { startFakePayments, type FakePayments } from '../../../scripts/lib/fake-payments';
import { fakeSettings, visit } from './invoice-fixtures';

let t: TestApp;
let fake: FakePayments;
beforeAll(async () => {
  fake = await startFakePayments();
  t = await makeTestApp({ payments: fakeSettings(fake) });
});
afterAll(async () => {
  await t.close();
  await fake.stop();
});

/** A granted car, its shop at 8.875 % tax in euros, and a closed visit with the three fixture lines. */
async function invoicedSetup(opts: { status?: 'open' | 'closed' } = {}) {
  const g = await grantedCar(t);
  const settings = await g.staff.c.patch(`/api/shops/${g.shopId}/settings`, { taxRatePct: 8.875, currency: 'EUR' });
  expect(settings.status, JSON.stringify(settings.body)).toBe(200);
  const workOrderId = await visit(t, { shopId: g.shopId, carId: g.driver.carId, staffId: g.staff.user.id }, opts);
  return { ...g, workOrderId };
}

describe('PATCH /api/shops/:shopId/settings', () => {
  it('when the shop admin sets tax, currency and tolerance, then GET of the shop shows them (currency in lower case)', async () => {
    const { shopId, admin } = await shopWithAdmin(t);
    const before = await admin.c.get(`/api/shops/${shopId}`);
    expect(before.body.settings).toEqual({ taxRatePct: 0, currency: 'usd', compressedLengthToleranceMm: 15 });
    const res = await admin.c.patch(`/api/shops/${shopId}/settings`, { taxRatePct: 20, currency: 'GBP', compressedLengthToleranceMm: 13 });
    expect(res.status).toBe(200);
    expect(res.body.settings).toEqual({ taxRatePct: 20, currency: 'gbp', compressedLengthToleranceMm: 13 });
    // A field left out stays as it was.
    await admin.c.patch(`/api/shops/${shopId}/settings`, { taxRatePct: 7.5 });
    expect((await admin.c.get(`/api/shops/${shopId}`)).body.settings).toEqual({ taxRatePct: 7.5, currency: 'gbp', compressedLengthToleranceMm: 13 });
  });

  it('when the values are out of range or malformed, then 400 names each field and nothing changes', async () => {
    const { shopId, admin } = await shopWithAdmin(t);
    const res = await admin.c.patch(`/api/shops/${shopId}/settings`, { taxRatePct: 51, currency: 'euro', compressedLengthToleranceMm: -1 });
    expectFieldErrors(res, ['taxRatePct', 'currency', 'compressedLengthToleranceMm']);
    expectFieldErrors(await admin.c.patch(`/api/shops/${shopId}/settings`, { taxRatePct: 8.8755 }), ['taxRatePct']);
    expect((await admin.c.get(`/api/shops/${shopId}`)).body.settings.taxRatePct).toBe(0);
  });

  it('when staff who are not admins or people outside the shop try, then 403 and 404', async () => {
    const { shopId } = await shopWithAdmin(t);
    const staff = await addStaff(t, shopId);
    expectError(await staff.c.patch(`/api/shops/${shopId}/settings`, { taxRatePct: 5 }), 403, 'forbidden');
    const outsider = await signedInClient(t);
    expectError(await outsider.c.patch(`/api/shops/${shopId}/settings`, { taxRatePct: 5 }), 404, 'not_found');
  });
});

describe('POST /api/work-orders/:workOrderId/invoice', () => {
  it('when the shop invoices a closed visit, then lines, subtotal, 8.875 % tax and total are in whole cents, rounded half away from zero', async () => {
    const g = await invoicedSetup();
    const res = await g.staff.c.post(`/api/work-orders/${g.workOrderId}/invoice`);
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    // By hand: 2 × 18950 = 37900; 2.5 × 9500 = 23750; 0.33 × 1999 = 659.67 → 660.
    // Subtotal 37900 + 23750 + 660 = 62310; tax 62310 × 0.08875 = 5530.0125 → 5530; total 62310 + 5530 = 67840.
    expect(res.body).toMatchObject({
      workOrderId: g.workOrderId,
      shopId: g.shopId,
      carId: g.driver.carId,
      currency: 'eur',
      subtotalCents: 62310,
      taxRatePct: 8.875,
      taxCents: 5530,
      totalCents: 67840,
      status: 'open',
      paidAt: null,
      paidMethod: null,
      checkoutStarted: false,
    });
    expect(res.body.lines.map((l: { amountCents: number }) => l.amountCents)).toEqual([37900, 23750, 660]);
    expect(res.body.lines[1]).toMatchObject({ kind: 'labour', quantity: 2.5, unitPriceCents: 9500 });
  });

  it('when asked again, then the same invoice answers 200 and there is still one row', async () => {
    const g = await invoicedSetup();
    const first = await g.staff.c.post(`/api/work-orders/${g.workOrderId}/invoice`);
    const again = await g.staff.c.post(`/api/work-orders/${g.workOrderId}/invoice`);
    expect(first.status).toBe(201);
    expect(again.status).toBe(200);
    expect(again.body.id).toBe(first.body.id);
    const rows = await t.ds.query('SELECT count(*)::int AS n FROM invoices WHERE work_order_id = $1', [g.workOrderId]);
    expect(rows[0].n).toBe(1);
  });

  it('when the shop changes its tax rate afterwards, then the invoice keeps the totals it was issued with', async () => {
    const g = await invoicedSetup();
    await g.staff.c.post(`/api/work-orders/${g.workOrderId}/invoice`);
    await g.staff.c.patch(`/api/shops/${g.shopId}/settings`, { taxRatePct: 20 });
    const res = await g.driver.c.get(`/api/work-orders/${g.workOrderId}/invoice`);
    expect(res.body).toMatchObject({ taxRatePct: 8.875, taxCents: 5530, totalCents: 67840 });
  });

  it('when the visit is still open, then 409 and no invoice is made', async () => {
    const g = await invoicedSetup({ status: 'open' });
    expectError(await g.staff.c.post(`/api/work-orders/${g.workOrderId}/invoice`), 409, 'conflict');
    const rows = await t.ds.query('SELECT count(*)::int AS n FROM invoices WHERE work_order_id = $1', [g.workOrderId]);
    expect(rows[0].n).toBe(0);
  });

  it('when a driver, another shop or a stranger asks, then 403, 404 and 404; the unknown id is 404', async () => {
    const g = await invoicedSetup();
    expectError(await g.driver.c.post(`/api/work-orders/${g.workOrderId}/invoice`), 403, 'forbidden');
    const other = await shopWithAdmin(t, 'Other bench');
    expectError(await other.admin.c.post(`/api/work-orders/${g.workOrderId}/invoice`), 404, 'not_found');
    const stranger = await signedInClient(t);
    expectError(await stranger.c.post(`/api/work-orders/${g.workOrderId}/invoice`), 404, 'not_found');
    expectError(await g.staff.c.post('/api/work-orders/00000000-0000-4000-8000-000000000000/invoice'), 404, 'not_found');
  });
});

describe('GET /api/work-orders/:workOrderId/invoice', () => {
  it('when there is no invoice yet, then 404; once made, the drivers and the shop read it and a stranger gets 404', async () => {
    const g = await invoicedSetup();
    const co = await addCoDriver(t, g.driver);
    expectError(await g.driver.c.get(`/api/work-orders/${g.workOrderId}/invoice`), 404, 'not_found');
    await g.staff.c.post(`/api/work-orders/${g.workOrderId}/invoice`);
    for (const c of [g.driver.c, co.c, g.staff.c]) {
      const res = await c.get(`/api/work-orders/${g.workOrderId}/invoice`);
      expect(res.status).toBe(200);
      expect(res.body.totalCents).toBe(67840);
    }
    const stranger = await signedInClient(t);
    expectError(await stranger.c.get(`/api/work-orders/${g.workOrderId}/invoice`), 404, 'not_found');
  });
  it('when the visit used up a part, then that invoice line says usedUp and the fitted part and the labour do not', async () => {
    const g = await grantedCar(t);
    const workOrderId = await visit(
      t,
      { shopId: g.shopId, carId: g.driver.carId, staffId: g.staff.user.id },
      {
        lines: [
          { kind: 'part', description: 'Rear toe arm', quantity: 2, unitPriceCents: 9900 },
          { kind: 'part', description: 'Brake fluid, 1 l', quantity: 1, unitPriceCents: 1800, usedUp: true },
          { kind: 'labour', description: 'Bleed brakes', quantity: 0.5, unitPriceCents: 9500 },
        ],
      },
    );
    await g.staff.c.post(`/api/work-orders/${workOrderId}/invoice`);
    const res = await g.driver.c.get(`/api/work-orders/${workOrderId}/invoice`);
    expect(res.status).toBe(200);
    expect(res.body.lines.map((l: { description: string; usedUp: boolean }) => [l.description, l.usedUp])).toEqual([
      ['Rear toe arm', false],
      ['Brake fluid, 1 l', true],
      ['Bleed brakes', false],
    ]);
  });
});

describe('POST /api/invoices/:invoiceId/checkout', () => {
  it('when a driver pays online, then the answer is a page on the fake service whose session carries the total, currency, invoice and return links', async () => {
    const g = await invoicedSetup();
    const invoice = (await g.staff.c.post(`/api/work-orders/${g.workOrderId}/invoice`)).body;
    const res = await g.driver.c.post(`/api/invoices/${invoice.id}/checkout`);
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body.url).toMatch(new RegExp(`^${fake.url}/pay/cs_test_[0-9a-f]+$`));
    const sessionId = String(res.body.url).split('/pay/')[1]!;
    const session = fake.sessions.get(sessionId)!;
    expect(session).toMatchObject({
      mode: 'payment',
      amount_total: 67840,
      currency: 'eur',
      metadata: { invoiceId: invoice.id },
      client_reference_id: invoice.id,
      success_url: `http://scrubline.test/work-orders/${g.workOrderId}?paid=1`,
      cancel_url: `http://scrubline.test/work-orders/${g.workOrderId}`,
      status: 'open',
    });
    const rows = await t.ds.query('SELECT checkout_session_id FROM invoices WHERE id = $1', [invoice.id]);
    expect(rows[0].checkout_session_id).toBe(sessionId);
    expect((await g.driver.c.get(`/api/work-orders/${g.workOrderId}/invoice`)).body.checkoutStarted).toBe(true);

    // Asking again while that session is open sends the driver to the same page.
    const again = await g.driver.c.post(`/api/invoices/${invoice.id}/checkout`);
    expect(again.body.url).toBe(res.body.url);
  });

  it('when the shop, a stranger, or anyone on a paid invoice asks, then 403, 404 and 409', async () => {
    const g = await invoicedSetup();
    const invoice = (await g.staff.c.post(`/api/work-orders/${g.workOrderId}/invoice`)).body;
    expectError(await g.staff.c.post(`/api/invoices/${invoice.id}/checkout`), 403, 'forbidden');
    const stranger = await signedInClient(t);
    expectError(await stranger.c.post(`/api/invoices/${invoice.id}/checkout`), 404, 'not_found');
    await g.staff.c.post(`/api/invoices/${invoice.id}/mark-paid`, { method: 'cash' });
    expectError(await g.driver.c.post(`/api/invoices/${invoice.id}/checkout`), 409, 'conflict');
  });

  it('when the server has no payment service set up, then 503 and the invoice is untouched', async () => {
    const bare = await makeTestApp();
    try {
      const g = await grantedCar(bare);
      const workOrderId = await visit(bare, { shopId: g.shopId, carId: g.driver.carId, staffId: g.staff.user.id });
      const invoice = (await g.staff.c.post(`/api/work-orders/${workOrderId}/invoice`)).body;
      expectError(await g.driver.c.post(`/api/invoices/${invoice.id}/checkout`), 503, 'unavailable');
      expect((await g.driver.c.get(`/api/work-orders/${workOrderId}/invoice`)).body.checkoutStarted).toBe(false);
    } finally {
      await bare.close();
    }
  });
});

describe('POST /api/invoices/:invoiceId/mark-paid', () => {
  it('when the shop takes cash, then both sides see it paid in cash; a second marking is 409', async () => {
    const g = await invoicedSetup();
    const invoice = (await g.staff.c.post(`/api/work-orders/${g.workOrderId}/invoice`)).body;
    const res = await g.staff.c.post(`/api/invoices/${invoice.id}/mark-paid`, { method: 'cash' });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body).toMatchObject({ status: 'paid', paidMethod: 'cash' });
    expect(Date.parse(res.body.paidAt)).not.toBeNaN();
    for (const c of [g.driver.c, g.staff.c]) {
      expect((await c.get(`/api/work-orders/${g.workOrderId}/invoice`)).body).toMatchObject({ status: 'paid', paidMethod: 'cash', paidAt: res.body.paidAt });
    }
    expectError(await g.staff.c.post(`/api/invoices/${invoice.id}/mark-paid`, { method: 'cash' }), 409, 'conflict');
  });

  it('when a driver marks it, or the method is not cash, then 403 and 400, and it stays open', async () => {
    const g = await invoicedSetup();
    const invoice = (await g.staff.c.post(`/api/work-orders/${g.workOrderId}/invoice`)).body;
    expectError(await g.driver.c.post(`/api/invoices/${invoice.id}/mark-paid`, { method: 'cash' }), 403, 'forbidden');
    expectFieldErrors(await g.staff.c.post(`/api/invoices/${invoice.id}/mark-paid`, { method: 'card' }), ['method']);
    expect((await g.staff.c.get(`/api/work-orders/${g.workOrderId}/invoice`)).body.status).toBe('open');
  });
});
