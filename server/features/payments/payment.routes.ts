import express, { Router } from 'express';
import type { DataSource } from 'typeorm';
import type { MailSettings } from '../../mail/mailer';
import type { PaymentSettings } from './payment-settings';
import { handlePaymentEvent, verifyPaymentEvent } from './payment.service';

/**
 * Routes under /api/payments: the payment service's webhook. Mounted before the JSON body,
 * session and CSRF middleware: the service signs the raw bytes and sends no cookie.
 */
export function paymentWebhookRoutes(ds: DataSource, payments?: PaymentSettings, mail?: MailSettings) {
  const router = Router();
  router.post('/webhook', express.raw({ type: 'application/json', limit: '256kb' }), async (req, res) => {
    const event = verifyPaymentEvent(payments, req.body, req.header('stripe-signature'));
    await handlePaymentEvent(ds, mail, event);
    res.json({ received: true });
  });
  return router;
}
