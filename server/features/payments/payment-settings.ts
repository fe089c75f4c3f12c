import Stripe from 'stripe';

/**
 * How the app reaches the payment service: the SDK client, the secret that signs its
 * webhook events, and the app's own address for the checkout's return links. In
 * development and tests the client points at the local fake (scripts/lib/fake-payments.ts);
 * without an API URL it talks to the real service.
 */
export interface PaymentSettings {
  stripe: Stripe;
  webhookSecret: string;
  /** The origin the checkout sends the driver back to, e.g. https://scrubline.example.org. */
  publicUrl: string;
}

export interface PaymentConfig {
  secretKey: string;
  webhookSecret: string;
  /** http://127.0.0.1:PORT for the local fake; absent for the real service. */
  apiUrl?: string;
  publicUrl: string;
}

export function createPaymentSettings(config: PaymentConfig): PaymentSettings {
  const target = config.apiUrl ? new URL(config.apiUrl) : undefined;
  const stripe = new Stripe(config.secretKey, {
    ...(target
      ? {
          host: target.hostname,
          port: target.port || (target.protocol === 'https:' ? 443 : 80),
          protocol: target.protocol === 'https:' ? 'https' : 'http',
        }
      : {}),
    maxNetworkRetries: 1,
    timeout: 20_000,
    telemetry: false,
  });
  return { stripe, webhookSecret: config.webhookSecret, publicUrl: config.publicUrl.replace(/\/+$/, '') };
}
