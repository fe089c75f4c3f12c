import type { Invoice } from '@shared/service/invoice.schema';
import { LineItemsTable } from '@/components/line-items/line-items-table';
import { invoiceStatusWords } from '../utils/invoice-words';

/** An invoice's lines with its subtotal, tax and total as issued, and under them whether it is paid. */
export function InvoiceLines({ invoice, caption }: { invoice: Invoice; caption: string }) {
  return (
    <>
      <LineItemsTable
        caption={caption}
        currency={invoice.currency}
        lines={invoice.lines}
        totals={[
          { label: 'Subtotal', cents: invoice.subtotalCents },
          { label: `Tax (${invoice.taxRatePct} %)`, cents: invoice.taxCents },
          { label: 'Total', cents: invoice.totalCents, weight: 'total' },
        ]}
      />
      <p className="font-bold" aria-label="Invoice status">
        {invoiceStatusWords(invoice)}
      </p>
    </>
  );
}
