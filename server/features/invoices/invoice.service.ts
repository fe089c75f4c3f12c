import type Stripe from 'stripe';
import type { DataSource, EntityManager } from 'typeorm';
import type { User } from '@shared/auth/auth.schema';
import type { CheckoutRedirect, Invoice, InvoiceLine, InvoiceStatus, PaymentMethod, ShopInvoiceRow } from '@shared/service/invoice.schema';
import type { LineKind } from '@shared/service/work-order.schema';
import { invoiceLineCents, invoiceTotals, roundedTaxRate } from '@shared/calc/invoice.calc';
import { AppError } from '../../lib/app-error';
import { logger } from '../../lib/logger';
import { assertShopAccess, assertWorkOrderAccess, type Queryable, type WorkOrderAction } from '../../auth/access';
import type { PaymentSettings } from '../payments/payment-settings';

/** The largest amount the invoices table holds (a PostgreSQL integer), in cents. */
const MAX_CENTS = 2_147_483_647;

interface InvoiceRow {
  id: string;
  /** Null once the visit, or its car, was deleted: the invoice stays the shop's record. */
  work_order_id: string | null;
  shop_id: string;
  car_id: string | null;
  currency: string;
  subtotal_cents: number;
  tax_rate_pct: number;
  tax_cents: number;
  total_cents: number;
  status: InvoiceStatus;
  paid_at: Date | null;
  paid_method: PaymentMethod | null;
  checkout_session_id: string | null;
  created_at: Date;
  number: number;
  issuer_name: string;
  issuer_details: string;
  bill_to: string;
  car_name: string;
  car_number: string | null;
  car_class_code: string;
  /** `visit_date::text`. */
  visit_day: string;
  requested_work: string;
}

interface LineRow {
  kind: LineKind;
  description: string;
  quantity: string;
  unit_price_cents: number;
  used_up: boolean;
}

const invoiceNotFound = () => new AppError('not_found', 'That invoice was not found.');

/** The visit's lines, as the invoice copies them when it is made. */
async function visitLines(db: Queryable, workOrderId: string): Promise<LineRow[]> {
  return db.query(
    'SELECT kind, description, quantity, unit_price_cents, used_up FROM work_order_lines WHERE work_order_id = $1 ORDER BY position, id',
    [workOrderId],
  );
}

async function loadInvoice(db: Queryable, where: { id: string } | { workOrderId: string }): Promise<Invoice | null> {
  const rows: InvoiceRow[] = await db.query(
    `SELECT *, visit_date::text AS visit_day FROM invoices WHERE ${'id' in where ? 'id' : 'work_order_id'} = $1`,
    ['id' in where ? where.id : where.workOrderId],
  );
  const r = rows[0];
  if (!r) return null;
  const lineRows: (LineRow & { amount_cents: number })[] = await db.query(
    'SELECT kind, description, quantity, unit_price_cents, used_up, amount_cents FROM invoice_lines WHERE invoice_id = $1 ORDER BY position',
    [r.id],
  );
  const lines: InvoiceLine[] = lineRows.map((l) => ({
    kind: l.kind,
    description: l.description,
    quantity: Number(l.quantity),
    unitPriceCents: l.unit_price_cents,
    usedUp: l.used_up,
    amountCents: l.amount_cents,
  }));
  return {
    id: r.id,
    number: r.number,
    workOrderId: r.work_order_id,
    shopId: r.shop_id,
    carId: r.car_id,
    currency: r.currency,
    lines,
    subtotalCents: r.subtotal_cents,
    taxRatePct: r.tax_rate_pct,
    taxCents: r.tax_cents,
    totalCents: r.total_cents,
    status: r.status,
    paidAt: r.paid_at?.toISOString() ?? null,
    paidMethod: r.paid_method,
    checkoutStarted: r.checkout_session_id !== null,
    createdAt: r.created_at.toISOString(),
    issuer: { name: r.issuer_name, details: r.issuer_details },
    billTo: r.bill_to,
    car: { name: r.car_name, carNumber: r.car_number, classCode: r.car_class_code },
    visitDate: r.visit_day,
    requestedWork: r.requested_work,
  };
}

/**
 * The invoice's work order, after checking the user may do `action` to it; 404 for an invoice they cannot see. Staff
 * of the invoice's shop read it always: it is the shop's record, kept after the visit, the car or the grant is gone.
 * With the visit gone, they alone may also take cash for it; nobody may pay it online.
 */
async function assertInvoiceAccess(db: Queryable, user: User, invoiceId: string, action: WorkOrderAction): Promise<string | null> {
  const rows: { work_order_id: string | null; staff: boolean }[] = await db.query(
    `SELECT i.work_order_id, EXISTS (SELECT 1 FROM shop_members m WHERE m.shop_id = i.shop_id AND m.user_id = $2) AS staff
       FROM invoices i WHERE i.id = $1`,
    [invoiceId, user.id],
  );
  const row = rows[0];
  if (!row) throw invoiceNotFound();
  if (row.staff && (action === 'read' || (action === 'mark_paid' && row.work_order_id === null))) return row.work_order_id;
  if (!row.work_order_id) {
    if (row.staff) throw new AppError('forbidden', 'This invoice\'s visit was deleted with its car; it can no longer be paid online.');
    throw invoiceNotFound();
  }
  try {
    await assertWorkOrderAccess(db, user, row.work_order_id, action);
  } catch (err) {
    if (err instanceof AppError && err.code === 'not_found') throw invoiceNotFound();
    throw err;
  }
  return row.work_order_id;
}

/**
 * The shop invoices a closed visit: parts and labour from its lines, tax at the shop's rate, totals kept as issued,
 * and the shop's next number. The shop's row is locked while the number is taken, so two invoices made at once get
 * consecutive numbers and a failed one leaves no gap. The shop's name and lines, the owner's name and the car are
 * copied onto the invoice. Asking again answers the invoice already made.
 */
export async function createInvoice(ds: DataSource, user: User, workOrderId: string): Promise<{ invoice: Invoice; created: boolean }> {
  await assertWorkOrderAccess(ds, user, workOrderId, 'mark_paid');
  const { id, created } = await ds.transaction(async (m) => {
    const orders: { status: string; shop_id: string; car_id: string; visit_date: string; requested_work: string }[] = await m.query(
      'SELECT status, shop_id, car_id, visit_date::text AS visit_date, requested_work FROM work_orders WHERE id = $1 FOR UPDATE',
      [workOrderId],
    );
    const order = orders[0];
    if (!order) throw new AppError('not_found', 'That work order was not found.');
    const existing: { id: string }[] = await m.query('SELECT id FROM invoices WHERE work_order_id = $1', [workOrderId]);
    if (existing[0]) return { id: existing[0].id, created: false };
    if (order.status !== 'closed') throw new AppError('conflict', 'Close the work order first; the invoice is made from the finished visit.');

    // The shop's row first, then its last number: read after the lock, in a statement of its own, the number sees
    // every invoice committed by whoever held the lock before (a subquery in the locking statement would not).
    const shops: { name: string; invoice_details: string; tax_rate_pct: number; currency: string }[] = await m.query(
      'SELECT name, invoice_details, tax_rate_pct, currency FROM shops WHERE id = $1 FOR NO KEY UPDATE',
      [order.shop_id],
    );
    const last: { number: number | null }[] = await m.query('SELECT max(number) AS number FROM invoices WHERE shop_id = $1', [order.shop_id]);
    const shop = shops[0]!;
    const taxRatePct = roundedTaxRate(shop.tax_rate_pct);
    const lines = (await visitLines(m, workOrderId)).map((l) => ({ ...l, quantity: Number(l.quantity) }));
    const totals = invoiceTotals(lines.map((l) => ({ quantity: l.quantity, unitPriceCents: l.unit_price_cents })), taxRatePct);
    if (totals.totalCents > MAX_CENTS) throw new AppError('conflict', 'This invoice would be too large to keep; split the work into smaller orders.');
    const rows: { id: string }[] = await m.query(
      `INSERT INTO invoices (work_order_id, shop_id, car_id, currency, subtotal_cents, tax_rate_pct, tax_cents, total_cents,
                             number, issuer_name, issuer_details, bill_to, car_name, car_number, car_class_code, visit_date, requested_work)
       SELECT $1, $2, c.id, $4, $5, $6, $7, $8, $9, $10, $11, u.display_name, c.name, c.car_number, c.class_code, $12, $13
         FROM cars c JOIN users u ON u.id = c.owner_id WHERE c.id = $3
       RETURNING id`,
      [
        workOrderId, order.shop_id, order.car_id, shop.currency, totals.subtotalCents, taxRatePct, totals.taxCents, totals.totalCents,
        (last[0]?.number ?? 0) + 1, shop.name, shop.invoice_details, order.visit_date, order.requested_work,
      ],
    );
    const id = rows[0]!.id;
    // The lines as billed, on the invoice itself, so they outlive the visit.
    for (const [position, l] of lines.entries()) {
      await m.query(
        `INSERT INTO invoice_lines (invoice_id, position, kind, description, quantity, unit_price_cents, used_up, amount_cents)
         VALUES ($1, $2, $3, $4, $5, $6, $7, $8)`,
        [id, position, l.kind, l.description, l.quantity, l.unit_price_cents, l.used_up, invoiceLineCents({ quantity: l.quantity, unitPriceCents: l.unit_price_cents })],
      );
    }
    return { id, created: true };
  });
  return { invoice: (await loadInvoice(ds, { id }))!, created };
}

/** The visit's invoice, for its drivers and its shop; 404 while there is none. */
export async function getWorkOrderInvoice(ds: DataSource, user: User, workOrderId: string): Promise<Invoice> {
  await assertWorkOrderAccess(ds, user, workOrderId, 'read');
  const invoice = await loadInvoice(ds, { workOrderId });
  if (!invoice) throw new AppError('not_found', 'There is no invoice for this work order yet.');
  return invoice;
}

/** One invoice by its id: the shop's staff always, the car's drivers while the visit is there. */
export async function getInvoice(ds: DataSource, user: User, invoiceId: string): Promise<Invoice> {
  await assertInvoiceAccess(ds, user, invoiceId, 'read');
  return (await loadInvoice(ds, { id: invoiceId }))!;
}

/** The shop's invoice book, newest number first: all, or only those `open` (not paid yet) or `paid`. */
export async function listShopInvoices(ds: DataSource, user: User, shopId: string, status?: InvoiceStatus): Promise<ShopInvoiceRow[]> {
  await assertShopAccess(ds, user, shopId, 'read');
  const rows: Pick<InvoiceRow, 'id' | 'number' | 'work_order_id' | 'bill_to' | 'car_name' | 'car_number' | 'car_class_code' | 'total_cents' | 'currency' | 'status' | 'paid_at' | 'created_at' | 'visit_day'>[] =
    await ds.query(
      `SELECT id, number, work_order_id, bill_to, car_name, car_number, car_class_code, total_cents, currency, status, paid_at, created_at,
              visit_date::text AS visit_day
         FROM invoices WHERE shop_id = $1 AND ($2::text IS NULL OR status = $2) ORDER BY number DESC`,
      [shopId, status ?? null],
    );
  return rows.map((r) => ({
    id: r.id,
    number: r.number,
    workOrderId: r.work_order_id,
    billTo: r.bill_to,
    car: { name: r.car_name, carNumber: r.car_number, classCode: r.car_class_code },
    totalCents: r.total_cents,
    currency: r.currency,
    status: r.status,
    paidAt: r.paid_at?.toISOString() ?? null,
    createdAt: r.created_at.toISOString(),
    visitDate: r.visit_day,
  }));
}

/**
 * A driver starts paying: a hosted checkout session for the invoice's total on the payment
 * service, which sends them back to the work order afterwards. An open session already made
 * for the invoice is reused.
 */
export async function startCheckout(
  ds: DataSource,
  payments: PaymentSettings | undefined,
  user: User,
  invoiceId: string,
): Promise<CheckoutRedirect> {
  // Paying online needs the visit: without it the access check has refused already.
  const workOrderId = (await assertInvoiceAccess(ds, user, invoiceId, 'pay'))!;
  if (!payments) throw new AppError('unavailable', 'Paying online is not set up on this server; pay the shop directly.');
  const rows: (InvoiceRow & { shop_name: string; car_name: string })[] = await ds.query(
    `SELECT i.*, s.name AS shop_name, c.name AS car_name
       FROM invoices i JOIN shops s ON s.id = i.shop_id JOIN cars c ON c.id = i.car_id WHERE i.id = $1`,
    [invoiceId],
  );
  const invoice = rows[0];
  if (!invoice) throw invoiceNotFound();
  if (invoice.status !== 'open') throw new AppError('conflict', 'This invoice is already paid.');
  if (invoice.total_cents <= 0) throw new AppError('conflict', 'There is nothing to pay on this invoice.');

  const session = await askPayments(invoiceId, async () => {
    if (invoice.checkout_session_id) {
      const previous = await payments.stripe.checkout.sessions.retrieve(invoice.checkout_session_id);
      if (previous.status === 'open' && previous.url) return { id: previous.id, url: previous.url, reused: true };
    }
    const back = `${payments.publicUrl}/work-orders/${workOrderId}`;
    const made = await payments.stripe.checkout.sessions.create({
      mode: 'payment',
      line_items: [
        {
          quantity: 1,
          price_data: {
            currency: invoice.currency,
            unit_amount: invoice.total_cents,
            product_data: { name: `${invoice.shop_name}: service visit on ${invoice.car_name}` },
          },
        },
      ],
      metadata: { invoiceId, workOrderId },
      client_reference_id: invoiceId,
      success_url: `${back}?paid=1`,
      cancel_url: back,
    });
    if (!made.url) throw new Error('The checkout session came back without a payment page address');
    return { id: made.id, url: made.url, reused: false };
  });
  if (session.reused) return { url: session.url };
  // Kept only if nobody else stored a checkout meanwhile (a co-driver pressing Pay at the same moment) and the invoice
  // is still open: an invoice never has two checkouts that can take its money.
  const kept: { id: string }[] = await ds.query(
    `WITH kept AS (
       UPDATE invoices SET checkout_session_id = $2
        WHERE id = $1 AND status = 'open' AND checkout_session_id IS NOT DISTINCT FROM $3 RETURNING id
     ) SELECT id FROM kept`,
    [invoiceId, session.id, invoice.checkout_session_id],
  );
  if (kept[0]) return { url: session.url };
  await askPayments(invoiceId, () => payments.stripe.checkout.sessions.expire(session.id));
  const now: Pick<InvoiceRow, 'status' | 'checkout_session_id'>[] = await ds.query('SELECT status, checkout_session_id FROM invoices WHERE id = $1', [invoiceId]);
  if (now[0]?.status !== 'open') throw new AppError('conflict', 'This invoice is already paid.');
  // The other checkout won: the driver is sent to that one.
  const winner = now[0].checkout_session_id ? await askPayments(invoiceId, () => payments.stripe.checkout.sessions.retrieve(now[0]!.checkout_session_id!)) : null;
  if (winner?.status === 'open' && winner.url) return { url: winner.url };
  throw new AppError('conflict', 'A checkout for this invoice was opened on another device just now; try again.');
}

/** A call to the payment service; when it fails, a 503 that says so. */
async function askPayments<T>(invoiceId: string, call: () => Promise<T>): Promise<T> {
  try {
    return await call();
  } catch (err) {
    logger.error({ err, invoiceId }, 'a call to the payment service failed');
    throw new AppError('unavailable', 'The payment service did not answer; try again in a minute.');
  }
}

/**
 * The shop took cash (or any payment outside Scrubline) for an open invoice. A card checkout the driver opened for it
 * is closed first on the payment service, so the same invoice cannot also be paid there. That call is made outside
 * any transaction (the service may be slow; a closed checkout cannot open again); then, with the invoice locked, the
 * cash is recorded only if no other checkout was stored meanwhile, else the round is made again. A checkout the driver
 * has already paid marks the invoice paid by card instead, and the answer is a 409 that says so. When the payment
 * service cannot be reached nothing changes (503).
 */
export async function markPaidInCash(ds: DataSource, payments: PaymentSettings | undefined, user: User, invoiceId: string): Promise<Invoice> {
  await assertInvoiceAccess(ds, user, invoiceId, 'mark_paid');
  for (let round = 0; round < 3; round++) {
    const rows: Pick<InvoiceRow, 'status' | 'checkout_session_id'>[] = await ds.query('SELECT status, checkout_session_id FROM invoices WHERE id = $1', [invoiceId]);
    const seen = rows[0];
    if (!seen) throw invoiceNotFound();
    if (seen.status !== 'open') throw new AppError('conflict', 'This invoice is already paid.');
    const paidByCard = seen.checkout_session_id && payments ? await closeCheckout(payments, invoiceId, seen.checkout_session_id) : null;

    const outcome = await ds.transaction(async (m): Promise<'cash' | 'card' | 'card_mismatch' | 'paid' | 'again'> => {
      const locked: Pick<InvoiceRow, 'status' | 'checkout_session_id'>[] = await m.query(
        'SELECT status, checkout_session_id FROM invoices WHERE id = $1 FOR UPDATE',
        [invoiceId],
      );
      if (locked[0]!.status !== 'open') return 'paid';
      if (locked[0]!.checkout_session_id !== seen.checkout_session_id) return 'again';
      if (paidByCard) return (await markPaidByCard(m, { invoiceId, amountCents: paidByCard.amount_total, currency: paidByCard.currency })) ? 'card' : 'card_mismatch';
      await m.query(`UPDATE invoices SET status = 'paid', paid_at = now(), paid_method = 'cash' WHERE id = $1`, [invoiceId]);
      return 'cash';
    });
    if (outcome === 'cash') return (await loadInvoice(ds, { id: invoiceId }))!;
    if (outcome === 'paid') throw new AppError('conflict', 'This invoice is already paid.');
    if (outcome === 'card') throw new AppError('conflict', 'The driver has already paid this invoice by card; it is now marked paid by card. Take no cash for it.');
    if (outcome === 'card_mismatch') {
      throw new AppError('conflict', 'The driver paid by card an amount that does not match this invoice. Check the payment on the payment service before taking cash.');
    }
  }
  throw new AppError('conflict', 'A card checkout for this invoice keeps being opened; try again in a moment.');
}

/**
 * Closes an invoice's card checkout if it is still open. Answers the checkout when the driver has paid it (nothing to
 * close), null when it is closed; 409 while a paid checkout's money is still on its way.
 */
async function closeCheckout(payments: PaymentSettings, invoiceId: string, sessionId: string): Promise<Stripe.Checkout.Session | null> {
  let session = await askPayments(invoiceId, () => payments.stripe.checkout.sessions.retrieve(sessionId));
  if (session.status === 'open') {
    try {
      session = await payments.stripe.checkout.sessions.expire(sessionId);
    } catch (err) {
      // Paid between the two calls, the checkout cannot be closed: read it again to say which.
      logger.warn({ err, invoiceId }, 'closing a checkout failed; reading it again');
      session = await askPayments(invoiceId, () => payments.stripe.checkout.sessions.retrieve(sessionId));
      if (session.status === 'open') throw new AppError('unavailable', 'The payment service did not answer; try again in a minute.');
    }
  }
  if (session.status !== 'complete') return null;
  if (session.payment_status !== 'paid') {
    throw new AppError('conflict', 'The driver has paid this invoice by a method that is still settling; it shows as paid when the money arrives.');
  }
  return session;
}

export interface CardPayment {
  invoiceId: string;
  /** What the payment service took, in cents, and in which currency. */
  amountCents: number | null;
  currency: string | null;
}

/**
 * Marks an invoice paid by card from a completed checkout, inside the caller's transaction.
 * Answers the paid invoice's ids, or null when it was already paid or the amount does not match.
 */
export async function markPaidByCard(
  m: EntityManager,
  payment: CardPayment,
): Promise<{ workOrderId: string | null; carId: string | null; shopId: string; totalCents: number; currency: string } | null> {
  const rows: InvoiceRow[] = await m.query('SELECT * FROM invoices WHERE id = $1 FOR UPDATE', [payment.invoiceId]);
  const invoice = rows[0];
  if (!invoice || invoice.status !== 'open') return null;
  if (payment.amountCents !== invoice.total_cents || payment.currency?.toLowerCase() !== invoice.currency) {
    logger.warn({ invoiceId: invoice.id, paid: payment.amountCents, currency: payment.currency }, 'a completed checkout does not match its invoice; left open');
    return null;
  }
  await m.query(`UPDATE invoices SET status = 'paid', paid_at = now(), paid_method = 'card' WHERE id = $1`, [invoice.id]);
  return { workOrderId: invoice.work_order_id, carId: invoice.car_id, shopId: invoice.shop_id, totalCents: invoice.total_cents, currency: invoice.currency };
}
