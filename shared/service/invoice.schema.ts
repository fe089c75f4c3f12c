import * as z from '../zod';
import type { LineKind } from './work-order.schema';

/**
 * The invoice for a closed service visit: its parts and labour, tax at the shop's rate and the
 * total, worked out once when the invoice is made and kept as issued. Money in whole cents;
 * currency as the lower-case ISO 4217 code the payment service uses ('usd').
 */

export const INVOICE_STATUSES = ['open', 'paid'] as const;
export type InvoiceStatus = (typeof INVOICE_STATUSES)[number];
export const PAYMENT_METHODS = ['card', 'cash'] as const;
export type PaymentMethod = (typeof PAYMENT_METHODS)[number];

export interface InvoiceLine {
  kind: LineKind;
  description: string;
  /** Parts: how many; labour: hours. */
  quantity: number;
  unitPriceCents: number;
  /** A part used up in the work, billed but not fitted to the car; always false for labour. */
  usedUp: boolean;
  /** quantity × unit price, rounded to the cent. */
  amountCents: number;
}

/** Who issued an invoice, to whom and for which car, as they stood when it was made. */
export interface InvoiceParties {
  issuer: { name: string; /** The shop's own lines: address, telephone, tax number; '' for none. */ details: string };
  /** The car's owner. */
  billTo: string;
  car: { name: string; carNumber: string | null; classCode: string };
}

export interface Invoice extends InvoiceParties {
  id: string;
  /** The shop's own sequence: 1, 2, 3 … in the order its invoices were made, with no gaps. */
  number: number;
  /** Null once the visit, or its car, was deleted: the invoice stays the shop's record. */
  workOrderId: string | null;
  shopId: string;
  carId: string | null;
  currency: string;
  lines: InvoiceLine[];
  subtotalCents: number;
  taxRatePct: number;
  taxCents: number;
  totalCents: number;
  status: InvoiceStatus;
  paidAt: string | null;
  paidMethod: PaymentMethod | null;
  /** A driver has opened the hosted checkout at least once. */
  checkoutStarted: boolean;
  createdAt: string;
  /** The visit's day and what was asked for, as they stood when the invoice was made. */
  visitDate: string;
  requestedWork: string;
}

/** A line of the shop's invoice book. */
export interface ShopInvoiceRow extends Pick<InvoiceParties, 'billTo' | 'car'> {
  id: string;
  number: number;
  workOrderId: string | null;
  totalCents: number;
  currency: string;
  status: InvoiceStatus;
  paidAt: string | null;
  createdAt: string;
  visitDate: string;
}

/** POST /api/invoices/:invoiceId/checkout answers where to send the driver to pay. */
export interface CheckoutRedirect {
  url: string;
}

/** `GET /api/shops/:shopId/invoices?status=`: all of them, or only those not paid yet (`open`) or `paid`. */
export const invoiceListQuerySchema = z.strictObject({ status: z.optional(z.enum(INVOICE_STATUSES)) });

/** The shop took the money over the counter. */
export const markPaidInputSchema = z.strictObject({
  method: z.literal('cash', { error: 'Only cash can be marked here; cards are paid through the checkout' }),
});
export type MarkPaidInput = z.infer<typeof markPaidInputSchema>;
