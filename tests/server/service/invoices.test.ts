/**
 * Invoices for closed service visits, the shop's tax settings, checkout on the local fake
 * payment service, and cash. Prices are invented; the arithmetic is written out by hand.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { makeTestApp, signedInClient, type TestApp } from '../test-app';
import { addCoDriver, expectError, expectFieldErrors } from '../season/season-fixtures';
import { addStaff, grantedCar, SHOP_NAME, shopWithAdmin } from '../collab/shop-fixtures';
import { startFakePayments, type FakePayments } from '../../../scripts/lib/fake-payments';
import { fakeSettings, visit } from './invoice-fixtures';
import { LINES_TOTAL_MAX_CENTS } from '../../../shared/service/work-order.schema';
import { seededDatabaseUrl } from '../support-seeded';
import { createDataSource } from '../../../server/db/data-source';
import { InvoiceNumbers1765843200000 } from '../../../server/db/migrations/1765843200000-invoice-numbers';
import { InvoiceBook1765929600000 } from '../../../server/db/migrations/1765929600000-invoice-book';

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
    expect(before.body.settings).toEqual({ taxRatePct: 0, currency: 'usd', compressedLengthToleranceMm: 15, invoiceDetails: '' });
    const res = await admin.c.patch(`/api/shops/${shopId}/settings`, {
      taxRatePct: 20,
      currency: 'GBP',
      compressedLengthToleranceMm: 13,
      invoiceDetails: '  Unit 4, Brindle Yard\nTel. 555 0143  ',
    });
    expect(res.status).toBe(200);
    const saved = { taxRatePct: 20, currency: 'gbp', compressedLengthToleranceMm: 13, invoiceDetails: 'Unit 4, Brindle Yard\nTel. 555 0143' };
    expect(res.body.settings).toEqual(saved);
    // A field left out stays as it was.
    await admin.c.patch(`/api/shops/${shopId}/settings`, { taxRatePct: 7.5 });
    expect((await admin.c.get(`/api/shops/${shopId}`)).body.settings).toEqual({ ...saved, taxRatePct: 7.5 });
    // An empty text clears the lines.
    await admin.c.patch(`/api/shops/${shopId}/settings`, { invoiceDetails: '' });
    expect((await admin.c.get(`/api/shops/${shopId}`)).body.settings.invoiceDetails).toBe('');
  });

  it('when the values are out of range or malformed, then 400 names each field and nothing changes', async () => {
    const { shopId, admin } = await shopWithAdmin(t);
    const res = await admin.c.patch(`/api/shops/${shopId}/settings`, { taxRatePct: 51, currency: 'euro', compressedLengthToleranceMm: -1 });
    expectFieldErrors(res, ['taxRatePct', 'currency', 'compressedLengthToleranceMm']);
    expectFieldErrors(await admin.c.patch(`/api/shops/${shopId}/settings`, { taxRatePct: 8.8755 }), ['taxRatePct']);
    await admin.c.patch(`/api/shops/${shopId}/settings`, { invoiceDetails: 'Unit 4, Brindle Yard' });
    expectFieldErrors(await admin.c.patch(`/api/shops/${shopId}/settings`, { invoiceDetails: 'x'.repeat(501) }), ['invoiceDetails']);
    expectFieldErrors(await admin.c.patch(`/api/shops/${shopId}/settings`, { invoiceDetails: 'line\n'.repeat(8) + 'ninth' }), ['invoiceDetails']);
    const after = (await admin.c.get(`/api/shops/${shopId}`)).body.settings;
    expect(after).toMatchObject({ taxRatePct: 0, invoiceDetails: 'Unit 4, Brindle Yard' });
  });

  it('when the code is three letters but no currency, then 400 at the currency and it stays as it was', async () => {
    const { shopId, admin } = await shopWithAdmin(t);
    // ISO 4217 has no XYZ; JPY is a currency, with no minor unit.
    const errors = expectFieldErrors(await admin.c.patch(`/api/shops/${shopId}/settings`, { currency: 'XYZ' }), ['currency']);
    expect(errors.currency![0]).toMatch(/not a currency code/);
    expect((await admin.c.get(`/api/shops/${shopId}`)).body.settings.currency).toBe('usd');
    expect((await admin.c.patch(`/api/shops/${shopId}/settings`, { currency: 'JPY' })).body.settings.currency).toBe('jpy');
  });

  it('when a visit not yet invoiced has prices, then the currency cannot change (nothing else in the request is saved either); once it is invoiced, it can', async () => {
    const g = await grantedCar(t);
    const ids = { shopId: g.shopId, carId: g.driver.carId, staffId: g.staff.user.id };
    const open = await visit(t, ids, { status: 'open' });
    const url = `/api/shops/${g.shopId}/settings`;
    const errors = expectFieldErrors(await g.staff.c.patch(url, { currency: 'JPY', taxRatePct: 10 }), ['currency']);
    expect(errors.currency).toEqual(['Visits not yet invoiced have prices in USD. Invoice them, or clear their prices, before changing the currency']);
    expect((await g.staff.c.get(`/api/shops/${g.shopId}`)).body.settings).toMatchObject({ currency: 'usd', taxRatePct: 0 });
    // The same currency again, or no currency at all, is not a change.
    expect((await g.staff.c.patch(url, { currency: 'usd', taxRatePct: 10 })).status).toBe(200);

    // A closed visit is not invoiced yet either.
    await t.ds.query(`UPDATE work_orders SET status = 'closed', handover_at = '2026-06-12T16:00:00Z', closed_by = $2 WHERE id = $1`, [open, g.staff.user.id]);
    expectFieldErrors(await g.staff.c.patch(url, { currency: 'EUR' }), ['currency']);
    const invoice = await g.staff.c.post(`/api/work-orders/${open}/invoice`);
    expect(invoice.status, JSON.stringify(invoice.body)).toBe(201);
    const changed = await g.staff.c.patch(url, { currency: 'EUR' });
    expect(changed.status, JSON.stringify(changed.body)).toBe(200);
    expect(changed.body.settings.currency).toBe('eur');
    // The invoice keeps the currency it was made in.
    expect((await g.staff.c.get(`/api/invoices/${invoice.body.id}`)).body.currency).toBe('usd');
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

  it('when a visit\'s lines are at the most they may add up to and the tax rate at its highest, then the invoice is still made', async () => {
    const g = await grantedCar(t);
    expect((await g.staff.c.patch(`/api/shops/${g.shopId}/settings`, { taxRatePct: 50 })).status).toBe(200);
    const lines = [{ kind: 'part' as const, description: 'Ten of the dearest', quantity: 10, unitPriceCents: LINES_TOTAL_MAX_CENTS / 10 }];
    const workOrderId = await visit(t, { shopId: g.shopId, carId: g.driver.carId, staffId: g.staff.user.id }, { lines });
    const res = await g.staff.c.post(`/api/work-orders/${workOrderId}/invoice`);
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    // By hand: 1 000 000 000 + 50 % = 1 500 000 000 cents, under the 2 147 483 647 a 32-bit integer holds.
    expect(res.body).toMatchObject({ subtotalCents: 1_000_000_000, taxCents: 500_000_000, totalCents: 1_500_000_000 });
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

describe('invoice numbers and the parties on an invoice', () => {
  const invoiceOf = async (g: Awaited<ReturnType<typeof grantedCar>>, workOrderId: string) => {
    const res = await g.staff.c.post(`/api/work-orders/${workOrderId}/invoice`);
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    return res.body;
  };

  it('when a shop invoices visits one after another, then they are numbered 1, 2, 3; another shop starts at 1; asking again keeps the number', async () => {
    const g = await grantedCar(t);
    const ids = { shopId: g.shopId, carId: g.driver.carId, staffId: g.staff.user.id };
    const numbers = [];
    for (let i = 0; i < 3; i++) numbers.push((await invoiceOf(g, await visit(t, ids))).number);
    expect(numbers).toEqual([1, 2, 3]);

    const other = await grantedCar(t, { shopName: 'Other bench' });
    const first = await visit(t, { shopId: other.shopId, carId: other.driver.carId, staffId: other.staff.user.id });
    expect((await invoiceOf(other, first)).number).toBe(1);
    expect((await other.staff.c.post(`/api/work-orders/${first}/invoice`)).body.number).toBe(1);
  });

  it('when five visits are invoiced at the same moment, then they take 1 to 5, each once, with no gap', async () => {
    const g = await grantedCar(t);
    const ids = { shopId: g.shopId, carId: g.driver.carId, staffId: g.staff.user.id };
    const visits = [];
    for (let i = 0; i < 5; i++) visits.push(await visit(t, ids));
    const answers = await Promise.all(visits.map((id) => g.staff.c.post(`/api/work-orders/${id}/invoice`)));
    expect(answers.map((r) => r.status)).toEqual([201, 201, 201, 201, 201]);
    expect(answers.map((r) => r.body.number as number).sort((a, b) => a - b)).toEqual([1, 2, 3, 4, 5]);
  });

  it('when an invoice cannot be made (the visit still open), then the next one still takes the next number', async () => {
    const g = await grantedCar(t);
    const ids = { shopId: g.shopId, carId: g.driver.carId, staffId: g.staff.user.id };
    expect((await invoiceOf(g, await visit(t, ids))).number).toBe(1);
    expectError(await g.staff.c.post(`/api/work-orders/${await visit(t, ids, { status: 'open' })}/invoice`), 409, 'conflict');
    expect((await invoiceOf(g, await visit(t, ids))).number).toBe(2);
  });

  it('when made, the invoice names the shop with its own lines, the owner and the car; renamed later, it keeps them as issued', async () => {
    const g = await grantedCar(t);
    await g.staff.c.patch(`/api/shops/${g.shopId}/settings`, { invoiceDetails: '12 Kettle Lane, Brindle\nTax no. BR-0042' });
    const made = await invoiceOf(g, await visit(t, { shopId: g.shopId, carId: g.driver.carId, staffId: g.staff.user.id }));
    const issued = {
      issuer: { name: SHOP_NAME, details: '12 Kettle Lane, Brindle\nTax no. BR-0042' },
      billTo: 'Nell Ashdown',
      car: { name: 'Blue roadster', carNumber: '42', classCode: 'SS' },
    };
    expect(made).toMatchObject(issued);

    await g.staff.c.patch(`/api/shops/${g.shopId}/settings`, { invoiceDetails: 'Moved: 3 Mill Row' });
    await t.ds.query(`UPDATE shops SET name = 'Renamed bench' WHERE id = $1`, [g.shopId]);
    await t.ds.query(`UPDATE cars SET name = 'Red roadster', car_number = NULL WHERE id = $1`, [g.driver.carId]);
    await t.ds.query(`UPDATE users SET display_name = 'Nell A.' WHERE id = $1`, [g.driver.user.id]);
    expect((await g.driver.c.get(`/api/work-orders/${made.workOrderId}/invoice`)).body).toMatchObject(issued);
  });

  it('when the shop and the drivers list the visits, then each closed one says where its invoice stands: none yet, not paid, paid', async () => {
    const g = await invoicedSetup();
    const bare = await visit(t, { shopId: g.shopId, carId: g.driver.carId, staffId: g.staff.user.id });
    const made = (await g.staff.c.post(`/api/work-orders/${g.workOrderId}/invoice`)).body;
    const standing = async () => {
      const board = (await g.staff.c.get(`/api/shops/${g.shopId}/work-orders?status=closed`)).body.items as { id: string; invoice: unknown }[];
      const car = (await g.driver.c.get(`/api/cars/${g.driver.carId}/work-orders`)).body.items as { id: string; invoice: unknown }[];
      expect(new Map(car.map((r) => [r.id, r.invoice]))).toEqual(new Map(board.map((r) => [r.id, r.invoice])));
      return new Map(board.map((r) => [r.id, r.invoice]));
    };
    expect(await standing()).toEqual(
      new Map<string, unknown>([
        [g.workOrderId, { number: made.number, status: 'open', totalCents: 67840, currency: 'eur' }],
        [bare, null],
      ]),
    );
    expect((await g.staff.c.post(`/api/invoices/${made.id}/mark-paid`, { method: 'cash' })).status).toBe(200);
    expect((await standing()).get(g.workOrderId)).toEqual({ number: made.number, status: 'paid', totalCents: 67840, currency: 'eur' });
  });

  it('when invoices were made before they had numbers, then adding the columns numbers each shop\'s in the order they were made and names the parties as they are now', async () => {
    const db = await seededDatabaseUrl();
    const ds = createDataSource(db.url, { poolSize: 1 });
    await ds.initialize();
    const migration = new InvoiceNumbers1765843200000();
    const book = new InvoiceBook1765929600000();
    const runner = ds.createQueryRunner();
    try {
      // Back to the invoices as they were before both: no numbers, no copies of lines or visit.
      await book.down(runner);
      await migration.down(runner);
      // The demo's own invoice goes: these two are made as the app made them then.
      await runner.query('DELETE FROM invoices');
      const orders: { id: string; shop_id: string; car_id: string }[] = await runner.query('SELECT id, shop_id, car_id FROM work_orders ORDER BY visit_date');
      expect(orders).toHaveLength(2);
      // The later visit invoiced first.
      for (const [order, madeAt] of [[orders[1]!, '2026-06-01T10:00:00Z'], [orders[0]!, '2026-06-02T10:00:00Z']] as const) {
        await runner.query(
          `INSERT INTO invoices (work_order_id, shop_id, car_id, currency, subtotal_cents, tax_rate_pct, tax_cents, total_cents, created_at)
           VALUES ($1, $2, $3, 'usd', 1000, 0, 0, 1000, $4)`,
          [order.id, order.shop_id, order.car_id, madeAt],
        );
      }
      await migration.up(runner);
      await book.up(runner);
      const rows = await runner.query(
        `SELECT i.work_order_id, i.number, i.issuer_name, i.issuer_details, i.bill_to, i.car_name, i.car_number, i.car_class_code
           FROM invoices i ORDER BY i.number`,
      );
      const expected = await runner.query(
        `SELECT s.name AS issuer_name, u.display_name AS bill_to, c.name AS car_name, c.car_number, c.class_code AS car_class_code
           FROM work_orders w JOIN shops s ON s.id = w.shop_id JOIN cars c ON c.id = w.car_id JOIN users u ON u.id = c.owner_id
          WHERE w.id = $1`,
        [orders[1]!.id],
      );
      expect(rows.map((r: { work_order_id: string; number: number }) => [r.work_order_id, r.number])).toEqual([
        [orders[1]!.id, 1],
        [orders[0]!.id, 2],
      ]);
      expect(rows[0]).toMatchObject({ ...expected[0], issuer_details: '' });
      // Each copied its visit's lines (by hand: the closed visit bills 2 × 189.50 and 2.5 h × 95.00, the open one
      // 2 × 89.00, 2 × 24.00 and 4 h × 95.00) and its day and request.
      const copied = await runner.query(
        `SELECT i.work_order_id, i.visit_date::text AS day, i.requested_work = w.requested_work AS same_words,
                array_agg(l.amount_cents ORDER BY l.position) AS amounts
           FROM invoices i JOIN work_orders w ON w.id = i.work_order_id JOIN invoice_lines l ON l.invoice_id = i.id
          GROUP BY i.work_order_id, i.visit_date, i.requested_work, w.requested_work`,
      );
      expect(new Map(copied.map((r: { work_order_id: string }) => [r.work_order_id, r]))).toEqual(
        new Map([
          [orders[0]!.id, { work_order_id: orders[0]!.id, day: '2026-06-12', same_words: true, amounts: [37900, 23750] }],
          [orders[1]!.id, { work_order_id: orders[1]!.id, day: '2026-09-03', same_words: true, amounts: [17800, 4800, 38000] }],
        ]),
      );
    } finally {
      await runner.release();
      await ds.destroy();
      await db.drop();
    }
  }, 60_000);
});

describe('the shop\'s invoice book', () => {
  it('when the shop lists its invoices, then newest number first, with whom, which car, the total and whether paid; `open` and `paid` filter it', async () => {
    const g = await invoicedSetup();
    const second = await visit(t, { shopId: g.shopId, carId: g.driver.carId, staffId: g.staff.user.id });
    const first = (await g.staff.c.post(`/api/work-orders/${g.workOrderId}/invoice`)).body;
    const next = (await g.staff.c.post(`/api/work-orders/${second}/invoice`)).body;
    await g.staff.c.post(`/api/invoices/${first.id}/mark-paid`, { method: 'cash' });

    const book = await g.staff.c.get(`/api/shops/${g.shopId}/invoices`);
    expect(book.status).toBe(200);
    expect(book.body.items.map((r: { number: number; status: string }) => [r.number, r.status])).toEqual([[2, 'open'], [1, 'paid']]);
    expect(book.body.items[0]).toEqual({
      id: next.id, number: 2, workOrderId: second, billTo: 'Nell Ashdown', car: { name: 'Blue roadster', carNumber: '42', classCode: 'SS' },
      totalCents: 67840, currency: 'eur', status: 'open', paidAt: null, createdAt: next.createdAt, visitDate: '2026-06-12',
    });
    expect((await g.staff.c.get(`/api/shops/${g.shopId}/invoices?status=open`)).body.items.map((r: { id: string }) => r.id)).toEqual([next.id]);
    expect((await g.staff.c.get(`/api/shops/${g.shopId}/invoices?status=paid`)).body.items.map((r: { id: string }) => r.id)).toEqual([first.id]);
    expectFieldErrors(await g.staff.c.get(`/api/shops/${g.shopId}/invoices?status=unpaid`), ['status']);
    expectError(await g.driver.c.get(`/api/shops/${g.shopId}/invoices`), 404, 'not_found');
  });

  it('when the owner withdraws the grant and then deletes the car, then the shop keeps the invoice whole: lines, day, request, parties; cash can still be taken', async () => {
    const g = await invoicedSetup();
    const made = (await g.staff.c.post(`/api/work-orders/${g.workOrderId}/invoice`)).body;
    expect((await g.driver.c.get(`/api/invoices/${made.id}`)).body.number).toBe(made.number);

    expect((await g.driver.c.delete(`/api/cars/${g.driver.carId}/shop-grants/${g.shopId}`)).status).toBe(204);
    expect((await g.staff.c.get(`/api/invoices/${made.id}`)).body).toEqual(made);

    expect((await g.driver.c.delete(`/api/cars/${g.driver.carId}`)).status).toBe(204);
    const kept = await g.staff.c.get(`/api/invoices/${made.id}`);
    expect(kept.status).toBe(200);
    expect(kept.body).toEqual({ ...made, workOrderId: null, carId: null });
    expect(kept.body).toMatchObject({
      visitDate: '2026-06-12', requestedWork: 'Fit camber arms and align', billTo: 'Nell Ashdown', totalCents: 67840,
    });
    expect(kept.body.lines.map((l: { amountCents: number }) => l.amountCents)).toEqual([37900, 23750, 660]);
    expect((await g.staff.c.get(`/api/shops/${g.shopId}/invoices`)).body.items.map((r: { id: string; workOrderId: string | null }) => [r.id, r.workOrderId])).toEqual([[made.id, null]]);
    // The driver's way to it went with the car; paying online needs the visit.
    expectError(await g.driver.c.get(`/api/invoices/${made.id}`), 404, 'not_found');
    expectError(await g.driver.c.post(`/api/invoices/${made.id}/checkout`), 404, 'not_found');
    expectError(await g.staff.c.post(`/api/invoices/${made.id}/checkout`), 403, 'forbidden');
    const cash = await g.staff.c.post(`/api/invoices/${made.id}/mark-paid`, { method: 'cash' });
    expect(cash.status, JSON.stringify(cash.body)).toBe(200);
    expect(cash.body).toMatchObject({ status: 'paid', paidMethod: 'cash' });
  });

  it('when someone outside the shop asks for an invoice by id, then 404; an unknown id is 404', async () => {
    const g = await invoicedSetup();
    const made = (await g.staff.c.post(`/api/work-orders/${g.workOrderId}/invoice`)).body;
    const other = await shopWithAdmin(t, 'Other bench');
    expectError(await other.admin.c.get(`/api/invoices/${made.id}`), 404, 'not_found');
    expectError(await (await signedInClient(t)).c.get(`/api/invoices/${made.id}`), 404, 'not_found');
    expectError(await g.staff.c.get('/api/invoices/00000000-0000-4000-8000-000000000000'), 404, 'not_found');
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
