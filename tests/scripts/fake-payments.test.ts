import { createServer, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import Stripe from 'stripe';
import { afterEach, describe, expect, it } from 'vitest';
import { parseFormBody, startFakePayments, type FakePayments } from '../../scripts/lib/fake-payments';

const started: FakePayments[] = [];
const servers: Server[] = [];
afterEach(async () => {
  for (const f of started.splice(0)) await f.stop();
  for (const s of servers.splice(0)) await new Promise<void>((resolve) => s.close(() => resolve()));
});

async function fakeService() {
  const fake = await startFakePayments();
  started.push(fake);
  return fake;
}

/** The SDK as the app builds it: pointed at the fake by host, port and protocol. */
function sdkFor(fake: FakePayments, key = fake.secretKey) {
  return new Stripe(key, { host: '127.0.0.1', port: fake.port, protocol: 'http', maxNetworkRetries: 0 });
}

/** A stand-in for the app's webhook: keeps each request's raw body and signature header. */
async function receiver() {
  const got: { body: string; signature: string | undefined; contentType: string | undefined }[] = [];
  const server = createServer((req, res) => {
    let body = '';
    req.on('data', (c: Buffer) => (body += c.toString('utf8')));
    req.on('end', () => {
      got.push({ body, signature: req.headers['stripe-signature'] as string | undefined, contentType: req.headers['content-type'] });
      res.writeHead(200, { 'Content-Type': 'application/json' }).end('{"received":true}');
    });
  });
  servers.push(server);
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', () => resolve()));
  return { got, url: `http://127.0.0.1:${(server.address() as AddressInfo).port}/api/payments/webhook` };
}

const SESSION: Stripe.Checkout.SessionCreateParams = {
  mode: 'payment',
  line_items: [{ quantity: 1, price_data: { currency: 'usd', unit_amount: 67840, product_data: { name: 'Kettle Lane: service visit' } } }],
  metadata: { invoiceId: 'inv-1' },
  client_reference_id: 'inv-1',
  success_url: 'http://app.test/work-orders/wo-1?paid=1',
  cancel_url: 'http://app.test/work-orders/wo-1',
};

describe('the local fake payment service', () => {
  it('when the SDK creates a checkout session, then it answers an open cs_test_ session with its own payment page, and reads it back', async () => {
    const fake = await fakeService();
    const sdk = sdkFor(fake);
    const session = await sdk.checkout.sessions.create(SESSION);
    expect(session.id).toMatch(/^cs_test_[0-9a-f]+$/);
    expect(session).toMatchObject({
      url: `${fake.url}/pay/${session.id}`,
      amount_total: 67840,
      currency: 'usd',
      metadata: { invoiceId: 'inv-1' },
      client_reference_id: 'inv-1',
      status: 'open',
      payment_status: 'unpaid',
    });
    expect((await sdk.checkout.sessions.retrieve(session.id)).id).toBe(session.id);
  });

  it('when the SDK uses another key or asks for an unknown session, then it gets the service\'s errors', async () => {
    const fake = await fakeService();
    await expect(sdkFor(fake, 'sk_test_wrong').checkout.sessions.create(SESSION)).rejects.toMatchObject({ statusCode: 401 });
    await expect(sdkFor(fake).checkout.sessions.retrieve('cs_test_nothing')).rejects.toMatchObject({ statusCode: 404, code: 'resource_missing' });
  });

  it('when Pay is pressed, then a checkout.session.completed event arrives signed with the webhook secret, and the browser goes to success_url', async () => {
    const fake = await fakeService();
    const app = await receiver();
    fake.setWebhookUrl(app.url);
    const sdk = sdkFor(fake);
    const session = await sdk.checkout.sessions.create(SESSION);

    const page = await fetch(session.url!);
    const html = await page.text();
    expect(page.headers.get('content-security-policy')).toContain("default-src 'none'");
    expect(html).toContain('$678.40');
    expect(html).not.toMatch(/<script/i);

    const pay = await fetch(session.url!, { method: 'POST', redirect: 'manual' });
    expect(pay.status).toBe(303);
    expect(pay.headers.get('location')).toBe(SESSION.success_url);

    expect(app.got).toHaveLength(1);
    const delivery = app.got[0]!;
    expect(delivery.contentType).toBe('application/json');
    const event = sdk.webhooks.constructEvent(delivery.body, delivery.signature!, fake.webhookSecret);
    expect(event.type).toBe('checkout.session.completed');
    const paid = event.data.object as Stripe.Checkout.Session;
    expect(paid).toMatchObject({ id: session.id, amount_total: 67840, currency: 'usd', payment_status: 'paid', status: 'complete', metadata: { invoiceId: 'inv-1' } });
    expect(() => sdk.webhooks.constructEvent(delivery.body, delivery.signature!, 'whsec_someone_else')).toThrow();
    expect(fake.deliveries).toEqual([{ eventId: event.id, type: 'checkout.session.completed', status: 200 }]);

    // Pressing Pay again (a double click, the back button) sends nothing more.
    expect((await fetch(session.url!, { method: 'POST', redirect: 'manual' })).status).toBe(303);
    expect(app.got).toHaveLength(1);
    expect((await sdk.checkout.sessions.retrieve(session.id)).status).toBe('complete');
  });

  it('when a form body has bracketed keys, then it becomes the nested object the SDK flattened', () => {
    expect(parseFormBody('mode=payment&line_items[0][quantity]=1&line_items[0][price_data][unit_amount]=5&metadata[invoiceId]=a%2Fb')).toEqual({
      mode: 'payment',
      line_items: [{ quantity: '1', price_data: { unit_amount: '5' } }],
      metadata: { invoiceId: 'a/b' },
    });
  });
});
