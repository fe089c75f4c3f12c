// A stand-in for the payment service, for development and tests: a small HTTP server on
// 127.0.0.1 that answers the few API calls the app makes through the `stripe` SDK (create and
// read a checkout session), shows a plain hosted checkout page with a Pay button, and on Pay
// sends the app a signed `checkout.session.completed` event — signed the way the real service
// signs, so the app's verification runs unchanged. No card is asked for and no money moves.
// The server never imports this; `npm start` and the e2e set-up start it and pass its address
// as STRIPE_API_URL.
import { createServer, type IncomingMessage, type ServerResponse } from 'node:http';
import type { AddressInfo } from 'node:net';
import { randomBytes } from 'node:crypto';
import Stripe from 'stripe';

export interface FakeCheckoutSession {
  id: string;
  object: 'checkout.session';
  mode: string;
  status: 'open' | 'complete' | 'expired';
  payment_status: 'unpaid' | 'paid';
  amount_subtotal: number;
  amount_total: number;
  currency: string;
  metadata: Record<string, string>;
  client_reference_id: string | null;
  success_url: string | null;
  cancel_url: string | null;
  url: string | null;
  line_items_summary: { name: string; quantity: number; unit_amount: number }[];
  created: number;
  livemode: false;
}

export interface FakeDelivery {
  eventId: string;
  type: string;
  /** The app's answer, or 0 when it could not be reached. */
  status: number;
}

export interface FakePayments {
  /** For STRIPE_API_URL: http://127.0.0.1:PORT */
  url: string;
  port: number;
  /** For STRIPE_SECRET_KEY: the only key this fake accepts. */
  secretKey: string;
  /** For STRIPE_WEBHOOK_SECRET: what the events are signed with. */
  webhookSecret: string;
  /** Where completed checkouts are reported: the app's /api/payments/webhook (known once the app listens). */
  setWebhookUrl: (url: string) => void;
  sessions: Map<string, FakeCheckoutSession>;
  /** Every event sent, oldest first. */
  deliveries: FakeDelivery[];
  stop: () => Promise<void>;
}

const token = (prefix: string) => `${prefix}${randomBytes(12).toString('hex')}`;

/**
 * The SDK sends form bodies with bracketed keys (`line_items[0][price_data][unit_amount]=1234`);
 * this turns them back into the nested object it came from, arrays where the keys are numbers.
 */
export function parseFormBody(body: string): Record<string, unknown> {
  const root: Record<string, unknown> = {};
  for (const [key, value] of new URLSearchParams(body)) {
    const path = key.split('[').map((part) => part.replace(/\]$/, ''));
    let node: Record<string, unknown> = root;
    path.forEach((part, i) => {
      if (i === path.length - 1) {
        node[part] = value;
        return;
      }
      const nextIsIndex = /^\d+$/.test(path[i + 1]!);
      node[part] ??= nextIsIndex ? [] : {};
      node = node[part] as Record<string, unknown>;
    });
  }
  return root;
}

const escapeHtml = (s: string) =>
  s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);

function money(cents: number, currency: string): string {
  try {
    return new Intl.NumberFormat('en', { style: 'currency', currency: currency.toUpperCase() }).format(cents / 100);
  } catch {
    return `${(cents / 100).toFixed(2)} ${currency.toUpperCase()}`;
  }
}

function readBody(req: IncomingMessage, limit = 1_000_000): Promise<string> {
  return new Promise((resolve, reject) => {
    let size = 0;
    const chunks: Buffer[] = [];
    req.on('data', (chunk: Buffer) => {
      size += chunk.length;
      if (size > limit) {
        reject(new Error('body too large'));
        req.destroy();
      } else chunks.push(chunk);
    });
    req.on('end', () => resolve(Buffer.concat(chunks).toString('utf8')));
    req.on('error', reject);
  });
}

function json(res: ServerResponse, status: number, body: unknown) {
  res.writeHead(status, { 'Content-Type': 'application/json' });
  res.end(JSON.stringify(body));
}

/** The error shape the SDK turns into its own error classes. */
const apiError = (res: ServerResponse, status: number, message: string, code?: string) =>
  json(res, status, { error: { type: 'invalid_request_error', message, ...(code ? { code } : {}) } });

function page(res: ServerResponse, status: number, title: string, body: string) {
  res.writeHead(status, {
    'Content-Type': 'text/html; charset=utf-8',
    // Plain HTML: no scripts from anywhere, styles only from the page itself.
    'Content-Security-Policy': "default-src 'none'; style-src 'unsafe-inline'; base-uri 'none'; frame-ancestors 'none'",
    'Cache-Control': 'no-store',
  });
  res.end(`<!doctype html>
<html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1">
<title>${escapeHtml(title)}</title>
<style>
  body { font: 16px/1.5 system-ui, sans-serif; margin: 0; background: #f4f4f5; color: #18181b; }
  main { max-width: 26rem; margin: 3rem auto; padding: 1.5rem; background: #fff; border-radius: 0.75rem; }
  .note { font-size: 0.875rem; color: #52525b; }
  .total { font-size: 2rem; font-weight: 600; margin: 0.5rem 0 1rem; }
  button { font: inherit; width: 100%; padding: 0.75rem; border: 0; border-radius: 0.5rem; background: #18181b; color: #fff; cursor: pointer; }
  a { color: inherit; }
</style></head>
<body><main>${body}</main></body></html>`);
}

export async function startFakePayments(opts: { webhookUrl?: string; host?: string; port?: number } = {}): Promise<FakePayments> {
  const secretKey = token('sk_test_fake_');
  const webhookSecret = token('whsec_fake_');
  const signer = new Stripe(secretKey);
  const sessions = new Map<string, FakeCheckoutSession>();
  const deliveries: FakeDelivery[] = [];
  let webhookUrl = opts.webhookUrl;
  let base = '';

  function createSession(params: Record<string, unknown>): FakeCheckoutSession | string {
    if (params.mode !== 'payment') return 'Only mode=payment is supported by the local fake';
    const items = Array.isArray(params.line_items) ? (params.line_items as Record<string, unknown>[]) : [];
    if (items.length === 0) return 'line_items is required';
    if (typeof params.success_url !== 'string') return 'success_url is required';
    const lines = items.map((item) => {
      const price = (item.price_data ?? {}) as Record<string, unknown>;
      const product = (price.product_data ?? {}) as Record<string, unknown>;
      return {
        name: String(product.name ?? 'Item'),
        quantity: Number(item.quantity ?? 1),
        unit_amount: Number(price.unit_amount),
        currency: String(price.currency ?? '').toLowerCase(),
      };
    });
    if (lines.some((l) => !Number.isInteger(l.unit_amount) || l.unit_amount < 0 || !Number.isInteger(l.quantity) || l.quantity < 1)) {
      return 'Each line item needs a whole quantity of 1 or more and a unit_amount in the smallest currency unit';
    }
    const currency = lines[0]!.currency;
    if (!/^[a-z]{3}$/.test(currency) || lines.some((l) => l.currency !== currency)) return 'Every line item needs the same three-letter currency';
    const amount = lines.reduce((sum, l) => sum + l.quantity * l.unit_amount, 0);
    const id = token('cs_test_');
    const session: FakeCheckoutSession = {
      id,
      object: 'checkout.session',
      mode: 'payment',
      status: 'open',
      payment_status: 'unpaid',
      amount_subtotal: amount,
      amount_total: amount,
      currency,
      metadata: (params.metadata ?? {}) as Record<string, string>,
      client_reference_id: typeof params.client_reference_id === 'string' ? params.client_reference_id : null,
      success_url: params.success_url,
      cancel_url: typeof params.cancel_url === 'string' ? params.cancel_url : null,
      url: `${base}/pay/${id}`,
      line_items_summary: lines.map(({ name, quantity, unit_amount }) => ({ name, quantity, unit_amount })),
      created: Math.floor(Date.now() / 1000),
      livemode: false,
    };
    sessions.set(id, session);
    return session;
  }

  /** Sends the signed event and waits for the app's answer, so the redirect lands on a paid invoice. */
  async function sendCompleted(session: FakeCheckoutSession) {
    const event = {
      id: token('evt_test_'),
      object: 'event',
      type: 'checkout.session.completed',
      api_version: null,
      created: Math.floor(Date.now() / 1000),
      livemode: false,
      pending_webhooks: 1,
      request: { id: null, idempotency_key: null },
      data: { object: { ...session, url: null } },
    };
    const payload = JSON.stringify(event);
    const signature = signer.webhooks.generateTestHeaderString({ payload, secret: webhookSecret });
    let status = 0;
    if (webhookUrl) {
      try {
        const res = await fetch(webhookUrl, {
          method: 'POST',
          headers: { 'Content-Type': 'application/json', 'Stripe-Signature': signature },
          body: payload,
          signal: AbortSignal.timeout(10_000),
        });
        status = res.status;
      } catch {
        status = 0;
      }
    }
    deliveries.push({ eventId: event.id, type: event.type, status });
    if (status < 200 || status >= 300) {
      console.error(`[fake-payments] the app did not accept ${event.type} ${event.id} (${status || 'unreachable'}) at ${webhookUrl ?? '(no webhook URL set)'}`);
    }
  }

  async function handle(req: IncomingMessage, res: ServerResponse) {
    const url = new URL(req.url ?? '/', base);
    const method = req.method ?? 'GET';

    if (url.pathname.startsWith('/v1/')) {
      if (req.headers.authorization !== `Bearer ${secretKey}`) return apiError(res, 401, 'Invalid API Key provided');
      if (method === 'POST' && url.pathname === '/v1/checkout/sessions') {
        const created = createSession(parseFormBody(await readBody(req)));
        return typeof created === 'string' ? apiError(res, 400, created, 'parameter_invalid') : json(res, 200, created);
      }
      const found = /^\/v1\/checkout\/sessions\/([A-Za-z0-9_]+)(\/expire)?$/.exec(url.pathname);
      const session = found ? sessions.get(found[1]!) : undefined;
      if (found && !session) return apiError(res, 404, `No such checkout.session: '${found[1]}'`, 'resource_missing');
      if (method === 'GET' && session && !found![2]) return json(res, 200, session);
      // Closing a checkout nobody has paid: its page stops taking payment. One already paid cannot be closed.
      if (method === 'POST' && session && found![2]) {
        await readBody(req);
        if (session.status !== 'open') return apiError(res, 400, `Only checkout sessions that are open can be expired; this one is ${session.status}.`);
        session.status = 'expired';
        session.url = null;
        return json(res, 200, session);
      }
      return apiError(res, 404, `Unrecognized request URL (${method}: ${url.pathname}). The local fake answers only checkout sessions.`);
    }

    const pay = /^\/pay\/([A-Za-z0-9_]+)$/.exec(url.pathname);
    const session = pay ? sessions.get(pay[1]!) : undefined;
    if (!pay || !session) return page(res, 404, 'Not found', '<h1>No such checkout</h1>');

    if (session.status === 'expired') return page(res, 410, 'Closed', '<h1>This checkout is closed</h1><p>Nothing was paid here.</p>');
    if (method === 'GET') {
      if (session.status === 'complete') {
        return page(res, 200, 'Paid', `<h1>Already paid</h1><p><a href="${escapeHtml(session.success_url ?? '/')}">Back to Scrubline</a></p>`);
      }
      const items = session.line_items_summary
        .map((l) => `<li>${escapeHtml(l.name)}${l.quantity > 1 ? ` × ${l.quantity}` : ''}</li>`)
        .join('');
      return page(
        res,
        200,
        'Test checkout',
        `<p class="note">Test checkout on this computer: no card is asked for and no money moves.</p>
<ul>${items}</ul>
<p class="total">${escapeHtml(money(session.amount_total, session.currency))}</p>
<form method="post" action="/pay/${escapeHtml(session.id)}"><button type="submit">Pay ${escapeHtml(money(session.amount_total, session.currency))}</button></form>
${session.cancel_url ? `<p><a href="${escapeHtml(session.cancel_url)}">Cancel and go back</a></p>` : ''}`,
      );
    }
    if (method === 'POST') {
      await readBody(req);
      if (session.status !== 'complete') {
        session.status = 'complete';
        session.payment_status = 'paid';
        await sendCompleted(session);
      }
      res.writeHead(303, { Location: session.success_url ?? '/' });
      return res.end();
    }
    res.writeHead(405, { Allow: 'GET, POST' });
    res.end();
  }

  const server = createServer((req, res) => {
    handle(req, res).catch((err: unknown) => {
      if (!res.headersSent) apiError(res, 500, err instanceof Error ? err.message : String(err));
      else res.end();
    });
  });
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(opts.port ?? 0, opts.host ?? '127.0.0.1', () => resolve());
  });
  const port = (server.address() as AddressInfo).port;
  base = `http://${opts.host ?? '127.0.0.1'}:${port}`;

  return {
    url: base,
    port,
    secretKey,
    webhookSecret,
    setWebhookUrl: (next) => {
      webhookUrl = next;
    },
    sessions,
    deliveries,
    stop: () =>
      new Promise<void>((resolve) => {
        server.close(() => resolve());
        server.closeAllConnections();
      }),
  };
}
