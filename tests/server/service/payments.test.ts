/**
 * The payment service's webhook: signatures checked over the raw body, a completed checkout
 * marks the invoice paid by card once, a replayed event changes nothing; and the whole round
 * trip through the local fake (checkout page → Pay → signed event → back to the app).
 */
import type { Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { randomUUID } from 'node:crypto';
import request from 'supertest';
import Stripe from 'stripe';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { captureMail, makeTestApp, type TestApp } from '../test-app';
import { loadConfig } from '../../../server/config';
import { expectError } from '../season/season-fixtures';
import { addStaff, grantedCar } from '../collab/shop-fixtures';
import { startFakePayments, type FakePayments } from '../../../scripts/lib/fake-payments';
import { fakeSettings, visit } from './invoice-fixtures';
import { startCheckout } from '../../../server/features/invoices/invoice.service';
import type { PaymentSettings } from '../../../server/features/payments/payment-settings';

let t: TestApp;
let fake: FakePayments;
let server: Server;
let mail: ReturnType<typeof captureMail>;
const signer = new Stripe('sk_test_signer_only');

beforeAll(async () => {
  fake = await startFakePayments();
  mail = captureMail();
  t = await makeTestApp({ payments: fakeSettings(fake), mail: mail.settings });
  // Listening for real, so the fake can deliver its events to the webhook.
  server = await new Promise<Server>((resolve) => {
    const s = t.app.listen(0, '127.0.0.1', () => resolve(s));
  });
  fake.setWebhookUrl(`http://127.0.0.1:${(server.address() as AddressInfo).port}/api/payments/webhook`);
});
afterAll(async () => {
  await new Promise<void>((resolve) => {
    server.close(() => resolve());
    server.closeAllConnections();
  });
  await t.close();
  await fake.stop();
});

/** A granted car, a closed visit and its open invoice (62310 + 0 % tax = 62310 cents, in dollars). */
async function openInvoice() {
  const g = await grantedCar(t);
  const second = await addStaff(t, g.shopId, 'Wren Iyer');
  const workOrderId = await visit(t, { shopId: g.shopId, carId: g.driver.carId, staffId: g.staff.user.id });
  const res = await g.staff.c.post(`/api/work-orders/${workOrderId}/invoice`);
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return { ...g, second, workOrderId, invoice: res.body as { id: string; totalCents: number; currency: string } };
}

function completedEvent(invoice: { id: string; totalCents: number; currency: string }, over: Record<string, unknown> = {}) {
  return {
    id: `evt_test_${randomUUID().replaceAll('-', '')}`,
    object: 'event',
    type: 'checkout.session.completed',
    created: Math.floor(Date.now() / 1000),
    livemode: false,
    data: {
      object: {
        id: `cs_test_${randomUUID().replaceAll('-', '')}`,
        object: 'checkout.session',
        mode: 'payment',
        status: 'complete',
        payment_status: 'paid',
        amount_total: invoice.totalCents,
        currency: invoice.currency,
        metadata: { invoiceId: invoice.id },
        client_reference_id: invoice.id,
        ...over,
      },
    },
  };
}

function postEvent(payload: string, signature?: string) {
  const req = request(t.app).post('/api/payments/webhook').set('Content-Type', 'application/json');
  return (signature ? req.set('Stripe-Signature', signature) : req).send(payload);
}

const sign = (payload: string, secret = fake.webhookSecret) => signer.webhooks.generateTestHeaderString({ payload, secret });

async function invoiceRow(id: string) {
  const rows: { status: string; paid_at: Date | null; paid_method: string | null }[] = await t.ds.query(
    'SELECT status, paid_at, paid_method FROM invoices WHERE id = $1',
    [id],
  );
  return rows[0]!;
}

async function eventRows(id: string) {
  const rows: { id: string; invoice_id: string | null }[] = await t.ds.query('SELECT id, invoice_id FROM payment_events WHERE id = $1', [id]);
  return rows;
}

describe('POST /api/payments/webhook', () => {
  it('when the signature is made with another secret, is missing, or the body was changed after signing, then 400 and nothing changes', async () => {
    const { invoice } = await openInvoice();
    const event = completedEvent(invoice);
    const payload = JSON.stringify(event);
    expectError(await postEvent(payload, sign(payload, 'whsec_not_the_right_one')), 400, 'validation_failed');
    expectError(await postEvent(payload), 400, 'validation_failed');
    const tampered = JSON.stringify({ ...event, data: { object: { ...event.data.object, amount_total: 1 } } });
    expectError(await postEvent(tampered, sign(payload)), 400, 'validation_failed');
    expect(await invoiceRow(invoice.id)).toMatchObject({ status: 'open', paid_at: null, paid_method: null });
    expect(await eventRows(event.id)).toEqual([]);
  });

  it('when a signed checkout.session.completed arrives, then the invoice is paid by card, the event is kept, and the shop\'s staff are told', async () => {
    const g = await openInvoice();
    const event = completedEvent(g.invoice);
    const payload = JSON.stringify(event);
    const res = await postEvent(payload, sign(payload));
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    const row = await invoiceRow(g.invoice.id);
    expect(row).toMatchObject({ status: 'paid', paid_method: 'card' });
    expect(row.paid_at).toBeInstanceOf(Date);
    expect(await eventRows(event.id)).toEqual([{ id: event.id, invoice_id: g.invoice.id }]);

    const notes: { user_id: string; kind: string; work_order_id: string; link: string }[] = await t.ds.query(
      `SELECT user_id, kind, work_order_id, link FROM notifications WHERE work_order_id = $1 AND kind = 'invoice_paid' ORDER BY user_id`,
      [g.workOrderId],
    );
    expect(notes.map((n) => n.user_id).sort()).toEqual([g.staff.user.id, g.second.user.id].sort());
    expect(notes[0]).toMatchObject({ link: `/work-orders/${g.workOrderId}` });
    const staffSees = await g.staff.c.get('/api/notifications');
    expect(staffSees.body.items[0]).toMatchObject({ kind: 'invoice_paid' });
    expect(staffSees.body.items[0].summary).toContain('$623.10');
  });

  it('when a card payment is confirmed after the owner deleted the car, then the shop\'s kept invoice reads paid by card and nobody is told of a car that is gone', async () => {
    const g = await openInvoice();
    expect((await g.driver.c.delete(`/api/cars/${g.driver.carId}`)).status).toBe(204);
    const event = completedEvent(g.invoice);
    const payload = JSON.stringify(event);
    const res = await postEvent(payload, sign(payload));
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(await invoiceRow(g.invoice.id)).toMatchObject({ status: 'paid', paid_method: 'card' });
    expect(await eventRows(event.id)).toEqual([{ id: event.id, invoice_id: g.invoice.id }]);
    const notes: { n: number }[] = await t.ds.query(`SELECT count(*)::int AS n FROM notifications WHERE user_id = ANY($1) AND kind = 'invoice_paid'`, [
      [g.staff.user.id, g.second.user.id],
    ]);
    expect(notes[0]!.n).toBe(0);
    expect((await g.staff.c.get(`/api/invoices/${g.invoice.id}`)).body).toMatchObject({ status: 'paid', paidMethod: 'card', workOrderId: null });
  });

  it('when the same event is delivered again, then 200 and nothing changes: paid_at as before, one event row, no second notification', async () => {
    const g = await openInvoice();
    const payload = JSON.stringify(completedEvent(g.invoice));
    const eventId = (JSON.parse(payload) as { id: string }).id;
    expect((await postEvent(payload, sign(payload))).status).toBe(200);
    const first = await invoiceRow(g.invoice.id);
    const replay = await postEvent(payload, sign(payload));
    expect(replay.status).toBe(200);
    expect((await invoiceRow(g.invoice.id)).paid_at).toEqual(first.paid_at);
    expect(await eventRows(eventId)).toHaveLength(1);
    const notes = await t.ds.query(`SELECT count(*)::int AS n FROM notifications WHERE work_order_id = $1 AND kind = 'invoice_paid'`, [g.workOrderId]);
    expect(notes[0].n).toBe(2);
  });

  it('when a second, different event completes an invoice already paid in cash, then it stays paid in cash', async () => {
    const g = await openInvoice();
    const cash = await g.staff.c.post(`/api/invoices/${g.invoice.id}/mark-paid`, { method: 'cash' });
    const payload = JSON.stringify(completedEvent(g.invoice));
    expect((await postEvent(payload, sign(payload))).status).toBe(200);
    const row = await invoiceRow(g.invoice.id);
    expect(row.paid_method).toBe('cash');
    expect(row.paid_at?.toISOString()).toBe(cash.body.paidAt);
  });

  it('when the paid amount or currency does not match the invoice, or the session is unpaid, then the invoice stays open', async () => {
    const g = await openInvoice();
    for (const over of [{ amount_total: g.invoice.totalCents - 1 }, { currency: 'eur' }, { payment_status: 'unpaid' }]) {
      const payload = JSON.stringify(completedEvent(g.invoice, over));
      expect((await postEvent(payload, sign(payload))).status).toBe(200);
    }
    expect((await invoiceRow(g.invoice.id)).status).toBe('open');
  });

  it('when an event of another type arrives, then it is acknowledged and recorded without touching invoices', async () => {
    const g = await openInvoice();
    const event = { ...completedEvent(g.invoice), type: 'checkout.session.expired' };
    const payload = JSON.stringify(event);
    expect((await postEvent(payload, sign(payload))).status).toBe(200);
    expect((await invoiceRow(g.invoice.id)).status).toBe('open');
    expect(await eventRows(event.id)).toHaveLength(1);
  });
});

describe('the round trip through the local fake', () => {
  it('when the driver opens the checkout page and presses Pay, then the fake sends a signed event, redirects back, and both sides read the invoice as paid by card', async () => {
    const g = await openInvoice();
    const checkout = await g.driver.c.post(`/api/invoices/${g.invoice.id}/checkout`);
    expect(checkout.status, JSON.stringify(checkout.body)).toBe(200);
    const url = checkout.body.url as string;

    const pageRes = await fetch(url);
    const html = await pageRes.text();
    expect(pageRes.status).toBe(200);
    expect(html).toContain('$623.10');
    expect(html).not.toMatch(/<script/i);
    expect(html).toMatch(/<form method="post" action="\/pay\/cs_test_[0-9a-f]+"><button type="submit">Pay/);

    const paid = await fetch(url, { method: 'POST', redirect: 'manual' });
    expect(paid.status).toBe(303);
    expect(paid.headers.get('location')).toBe(`http://scrubline.test/work-orders/${g.workOrderId}?paid=1`);
    expect(fake.deliveries.at(-1)).toMatchObject({ type: 'checkout.session.completed', status: 200 });

    for (const c of [g.driver.c, g.staff.c]) {
      expect((await c.get(`/api/work-orders/${g.workOrderId}/invoice`)).body).toMatchObject({ status: 'paid', paidMethod: 'card' });
    }
  });
});

describe('cash while a card checkout is open', () => {
  const sessionOf = (url: string) => fake.sessions.get(/\/pay\/([A-Za-z0-9_]+)$/.exec(url)![1]!)!;

  it('when the shop marks an invoice paid in cash while the driver\'s checkout is open, then that checkout is closed and takes no payment, and the invoice stays paid in cash', async () => {
    const g = await openInvoice();
    const url = (await g.driver.c.post(`/api/invoices/${g.invoice.id}/checkout`)).body.url as string;
    const sent = fake.deliveries.length;

    const cash = await g.staff.c.post(`/api/invoices/${g.invoice.id}/mark-paid`, { method: 'cash' });
    expect(cash.status, JSON.stringify(cash.body)).toBe(200);
    expect(cash.body).toMatchObject({ status: 'paid', paidMethod: 'cash' });
    expect(sessionOf(url).status).toBe('expired');

    const late = await fetch(url, { method: 'POST', redirect: 'manual' });
    expect(late.status).toBe(410);
    expect(fake.deliveries).toHaveLength(sent);
    expect(sessionOf(url).payment_status).toBe('unpaid');
    expect((await invoiceRow(g.invoice.id)).paid_method).toBe('cash');
    // And no new checkout is opened for it.
    expect((await g.driver.c.post(`/api/invoices/${g.invoice.id}/checkout`)).status).toBe(409);
  });

  it('when the driver has paid by card and the payment\'s event has not arrived yet, then cash is refused with 409, the invoice is marked paid by card from the checkout itself, and the late event changes nothing', async () => {
    const g = await openInvoice();
    const url = (await g.driver.c.post(`/api/invoices/${g.invoice.id}/checkout`)).body.url as string;
    const webhook = `http://127.0.0.1:${(server.address() as AddressInfo).port}/api/payments/webhook`;
    fake.setWebhookUrl('http://127.0.0.1:9/api/payments/webhook');
    try {
      expect((await fetch(url, { method: 'POST', redirect: 'manual' })).status).toBe(303);
    } finally {
      fake.setWebhookUrl(webhook);
    }
    expect(fake.deliveries.at(-1)!.status).toBe(0);

    const cash = await g.staff.c.post(`/api/invoices/${g.invoice.id}/mark-paid`, { method: 'cash' });
    expect(cash.status).toBe(409);
    expect(cash.body.error.message).toBe('The driver has already paid this invoice by card; it is now marked paid by card. Take no cash for it.');
    const paid = await invoiceRow(g.invoice.id);
    expect(paid).toMatchObject({ status: 'paid', paid_method: 'card' });

    const payload = JSON.stringify(completedEvent(g.invoice, { id: sessionOf(url).id }));
    expect((await postEvent(payload, sign(payload))).status).toBe(200);
    expect(await invoiceRow(g.invoice.id)).toEqual(paid);
  });

  it('when the owner and a co-driver press Pay at the same moment, then both are sent to one checkout, and the other one made is closed', async () => {
    const g = await openInvoice();
    const real = fakeSettings(fake);
    // Both requests read the invoice (no checkout yet) before either checkout is made.
    let made = 0;
    let release!: () => void;
    const gate = new Promise<void>((resolve) => (release = resolve));
    const sessions = real.stripe.checkout.sessions;
    const slowed = {
      ...real,
      stripe: {
        checkout: {
          sessions: {
            retrieve: sessions.retrieve.bind(sessions),
            expire: sessions.expire.bind(sessions),
            create: async (...args: Parameters<typeof sessions.create>) => {
              made++;
              await gate;
              return sessions.create(...args);
            },
          },
        },
      },
    } as unknown as PaymentSettings;
    const asking = [startCheckout(t.ds, slowed, g.driver.user, g.invoice.id), startCheckout(t.ds, slowed, g.driver.user, g.invoice.id)];
    await expect.poll(() => made).toBe(2);
    release();
    const [a, b] = await Promise.all(asking);

    expect(a!.url).toBe(b!.url);
    const open = [...fake.sessions.values()].filter((x) => x.metadata.invoiceId === g.invoice.id);
    expect(open.map((x) => x.status).sort()).toEqual(['expired', 'open']);
    expect(open.find((x) => x.status === 'open')!.url).toBe(a!.url);
    const [row] = await t.ds.query('SELECT checkout_session_id FROM invoices WHERE id = $1', [g.invoice.id]);
    expect(row.checkout_session_id).toBe(open.find((x) => x.status === 'open')!.id);
  });
});

describe('payment configuration', () => {
  const BASE = { DATABASE_URL: 'postgres://x@127.0.0.1/x', SESSION_SECRET: 's'.repeat(32) };
  const PROD = { ...BASE, NODE_ENV: 'production', SMTP_URL: 'smtp://u:p@mail.example.org:587', PUBLIC_URL: 'https://scrubline.example.org' };

  it('when NODE_ENV is production, then STRIPE_SECRET_KEY and STRIPE_WEBHOOK_SECRET are required and STRIPE_API_URL is refused', () => {
    expect(() => loadConfig(PROD)).toThrow(/STRIPE_SECRET_KEY: STRIPE_SECRET_KEY is required in production[\s\S]*STRIPE_WEBHOOK_SECRET: STRIPE_WEBHOOK_SECRET is required/);
    const keys = { STRIPE_SECRET_KEY: 'sk_live_abc123', STRIPE_WEBHOOK_SECRET: 'whsec_abc123' };
    expect(loadConfig({ ...PROD, ...keys }).STRIPE_API_URL).toBeUndefined();
    expect(() => loadConfig({ ...PROD, ...keys, STRIPE_API_URL: 'http://127.0.0.1:12111' })).toThrow(/STRIPE_API_URL points at a local fake/);
  });

  it('when only one of the two secrets is set, or one is malformed, then start-up stops naming the variable', () => {
    expect(() => loadConfig({ ...BASE, STRIPE_SECRET_KEY: 'sk_test_abc' })).toThrow(/STRIPE_WEBHOOK_SECRET: Set STRIPE_SECRET_KEY and STRIPE_WEBHOOK_SECRET together/);
    expect(() => loadConfig({ ...BASE, STRIPE_WEBHOOK_SECRET: 'whsec_abc' })).toThrow(/STRIPE_SECRET_KEY: Set STRIPE_SECRET_KEY/);
    expect(() => loadConfig({ ...BASE, STRIPE_SECRET_KEY: 'pk_test_abc', STRIPE_WEBHOOK_SECRET: 'whsec_abc' })).toThrow(/STRIPE_SECRET_KEY must be a secret key/);
    expect(loadConfig(BASE).STRIPE_SECRET_KEY).toBeUndefined();
  });
});
