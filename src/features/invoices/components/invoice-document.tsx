import type { Invoice } from '@shared/service/invoice.schema';
import { formatDay } from '@/lib/dates';
import { invoiceCarWords } from '../utils/invoice-words';
import { InvoiceLines } from './invoice-lines';

/**
 * The invoice as a document to print or file: the shop and its own lines, the number and dates, who it is for and
 * which car, the work asked for, the lines and totals, and whether it is paid, all as the invoice was issued.
 */
export function InvoiceDocument({ invoice }: { invoice: Invoice }) {
  return (
    <article
      aria-labelledby="invoice-title"
      className="flex flex-col gap-5 rounded-lg border border-line bg-surface p-4 sm:p-6 print:gap-3 print:border-0 print:p-0 print:text-[10pt]"
    >
      <header className="flex flex-col gap-4 sm:flex-row sm:justify-between">
        <div className="min-w-0">
          <p className="text-xl font-extrabold wrap-anywhere print:text-[14pt]">{invoice.issuer.name}</p>
          {invoice.issuer.details ? (
            <p aria-label="Shop details" className="text-sm wrap-anywhere whitespace-pre-line">
              {invoice.issuer.details}
            </p>
          ) : null}
        </div>
        <div className="sm:text-right">
          <h1 id="invoice-title" className="tabular-figures text-2xl font-bold print:text-[16pt]">
            Invoice {invoice.number}
          </h1>
          <dl aria-label="Invoice dates" className="tabular-figures grid grid-cols-[auto_1fr] gap-x-2 text-sm sm:justify-end">
            <dt className="text-ink-muted">Issued</dt>
            <dd>{formatDay(invoice.createdAt)}</dd>
            <dt className="text-ink-muted">Work done</dt>
            <dd>{formatDay(invoice.visitDate)}</dd>
          </dl>
        </div>
      </header>

      <section aria-labelledby="invoice-bill-to" className="flex flex-col gap-0.5">
        <h2 id="invoice-bill-to" className="text-sm font-bold text-ink-muted uppercase">
          For
        </h2>
        <p className="font-semibold wrap-anywhere">{invoice.billTo}</p>
        <p className="text-sm wrap-anywhere">{invoiceCarWords(invoice)}</p>
      </section>

      <section aria-labelledby="invoice-work" className="flex flex-col gap-0.5">
        <h2 id="invoice-work" className="text-sm font-bold text-ink-muted uppercase">
          Work asked for
        </h2>
        <p className="text-sm wrap-anywhere whitespace-pre-line">{invoice.requestedWork}</p>
      </section>

      <InvoiceLines invoice={invoice} caption={`Lines of invoice ${invoice.number}`} />
    </article>
  );
}
