import type { Invoice } from '@shared/service/invoice.schema';
import type { InvoiceStanding } from '@shared/service/work-order.schema';
import { formatDateTime } from '@/lib/dates';
import { formatMoney } from '@/lib/money';
import { isApiError } from '@/lib/api-client';

/** "Paid in cash on 12 Jun 2026, 16:05", or "Not paid yet". */
export function invoiceStatusWords(invoice: Pick<Invoice, 'status' | 'paidMethod' | 'paidAt'>): string {
  if (invoice.status !== 'paid') return 'Not paid yet';
  const how = invoice.paidMethod === 'cash' ? ' in cash' : invoice.paidMethod === 'card' ? ' by card' : '';
  return `Paid${how}${invoice.paidAt ? ` on ${formatDateTime(invoice.paidAt)}` : ''}`;
}

/** The car as the invoice names it: "Pebble #42 · class SR". */
export function invoiceCarWords({ car }: Pick<Invoice, 'car'>): string {
  return `${car.name}${car.carNumber ? ` #${car.carNumber}` : ''} · class ${car.classCode}`;
}

/** A visit's invoice in the lists: "Invoice 3 · $156.96 · not paid", or that there is none yet. */
export function invoiceStandingWords(invoice: InvoiceStanding | null): string {
  if (!invoice) return 'No invoice yet';
  return `Invoice ${invoice.number} · ${formatMoney(invoice.totalCents, invoice.currency)} · ${invoice.status === 'paid' ? 'paid' : 'not paid'}`;
}

/** What an invoice action's failure says beside its button: the server's words, else a plain retry; null without one. */
export const invoiceErrorText = (error: unknown): string | null =>
  error ? (isApiError(error) ? error.message : 'Something went wrong; try again.') : null;
