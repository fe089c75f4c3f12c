import type { Invoice } from '@shared/service/invoice.schema';
import { formatDateTime } from '@/lib/dates';

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
