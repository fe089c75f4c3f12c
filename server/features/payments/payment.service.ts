import type Stripe from 'stripe';
import type { DataSource } from 'typeorm';
import { AppError } from '../../lib/app-error';
import { logger } from '../../lib/logger';
import type { MailSettings } from '../../mail/mailer';
import { carAudience, notify, sendOutbox, staffRecipients, type Outbox } from '../notifications/notify';
import { markPaidByCard } from '../invoices/invoice.service';
import type { PaymentSettings } from './payment-settings';

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/** Events that mean a checkout's money has arrived (cards at once; slower methods later). */
const PAID_EVENTS = new Set(['checkout.session.completed', 'checkout.session.async_payment_succeeded']);

export type PaymentEventOutcome = 'paid' | 'ignored' | 'duplicate';

/**
 * Checks the payment service's signature over the exact bytes it sent; anything else is a 400
 * and changes nothing.
 */
export function verifyPaymentEvent(payments: PaymentSettings | undefined, rawBody: unknown, signature: string | undefined): Stripe.Event {
  if (!payments) throw new AppError('unavailable', 'Paying online is not set up on this server.');
  if (!signature || !Buffer.isBuffer(rawBody)) throw new AppError('validation_failed', 'The payment event is not signed.');
  try {
    return payments.stripe.webhooks.constructEvent(rawBody, signature, payments.webhookSecret);
  } catch {
    throw new AppError('validation_failed', 'The payment event\'s signature does not match.');
  }
}

function money(cents: number, currency: string): string {
  try {
    return new Intl.NumberFormat('en', { style: 'currency', currency: currency.toUpperCase() }).format(cents / 100);
  } catch {
    return `${(cents / 100).toFixed(2)} ${currency.toUpperCase()}`;
  }
}

/**
 * Handles one verified event, once: its id goes into payment_events in the same transaction
 * that marks the invoice paid, so a replayed event finds its id there and changes nothing.
 * The shop's staff hear about a card payment.
 */
export async function handlePaymentEvent(ds: DataSource, mail: MailSettings | undefined, event: Stripe.Event): Promise<PaymentEventOutcome> {
  const session = PAID_EVENTS.has(event.type) ? (event.data.object as Stripe.Checkout.Session) : null;
  const reference = session?.metadata?.invoiceId ?? session?.client_reference_id ?? null;
  const { outcome, outbox } = await ds.transaction(async (m): Promise<{ outcome: PaymentEventOutcome; outbox: Outbox }> => {
    const invoices: { id: string }[] = reference && UUID.test(reference)
      ? await m.query('SELECT id FROM invoices WHERE id = $1 FOR UPDATE', [reference])
      : [];
    const invoiceId = invoices[0]?.id ?? null;
    const fresh: { id: string }[] = await m.query(
      'INSERT INTO payment_events (id, type, invoice_id) VALUES ($1, $2, $3) ON CONFLICT (id) DO NOTHING RETURNING id',
      [event.id, event.type, invoiceId],
    );
    if (!fresh[0]) return { outcome: 'duplicate', outbox: [] };
    if (!session || !invoiceId || session.payment_status !== 'paid') return { outcome: 'ignored', outbox: [] };

    const paid = await markPaidByCard(m, { invoiceId, amountCents: session.amount_total, currency: session.currency });
    if (!paid) return { outcome: 'ignored', outbox: [] };
    // A visit deleted with its car meanwhile leaves nobody to tell but the books.
    if (!paid.carId || !paid.workOrderId) return { outcome: 'paid', outbox: [] };
    const audience = await carAudience(m, paid.carId);
    const payer = audience.drivers[0];
    const box = payer
      ? await notify(m, mail, {
          kind: 'invoice_paid',
          actorId: payer,
          carId: paid.carId,
          workOrderId: paid.workOrderId,
          summary: `The invoice for ${audience.carName} was paid by card: ${money(paid.totalCents, paid.currency)}`,
          recipients: staffRecipients(audience, { shopId: paid.shopId, link: `/work-orders/${paid.workOrderId}` }),
        })
      : [];
    return { outcome: 'paid', outbox: box };
  });
  sendOutbox(mail, outbox);
  if (outcome !== 'paid') logger.info({ eventId: event.id, type: event.type, outcome }, 'payment event changed nothing');
  return outcome;
}
