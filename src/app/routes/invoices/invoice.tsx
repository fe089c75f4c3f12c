import { Link, useParams } from 'react-router-dom';
import { ArrowLeft, Printer } from 'lucide-react';
import { paths } from '@/config/paths';
import { recordPath } from '@/config/record-paths';
import { Button } from '@/components/ui/button';
import { FormAlert } from '@/components/ui/form-alert';
import { PageMessage } from '@/components/ui/page-message';
import { isApiError } from '@/lib/api-client';
import { useMyShops } from '@/features/shops/api/get-my-shops';
import { useInvoice } from '@/features/invoices/api/get-invoice';
import { useMarkPaidInCash } from '@/features/invoices/api/pay-invoice';
import { InvoiceDocument } from '@/features/invoices/components/invoice-document';
import { invoiceErrorText } from '@/features/invoices/utils/invoice-words';

/**
 * One invoice as a page of its own, to print or save as a PDF. The shop's staff reach it from their invoice book,
 * the drivers from the visit; staff also take cash here for one still open.
 */
export function InvoicePage() {
  const { invoiceId = '' } = useParams();
  const invoice = useInvoice(invoiceId);
  const myShops = useMyShops();
  const cash = useMarkPaidInCash();

  if (invoice.isError) {
    const missing = isApiError(invoice.error) && invoice.error.status === 404;
    return (
      <PageMessage variant="in-shell" title={missing ? 'Invoice not found' : 'The invoice could not be loaded'}>
        <p>{missing ? 'It may be for a car you no longer have access to.' : 'Try again when you have signal.'}</p>
      </PageMessage>
    );
  }
  if (invoice.isPending) return <p className="text-ink-muted">Loading the invoice…</p>;
  const isStaff = Boolean(myShops.data?.items.some((s) => s.id === invoice.data.shopId));
  const { workOrderId } = invoice.data;

  return (
    <div className="mx-auto flex w-full max-w-3xl flex-col gap-4 print:max-w-none">
      <title>{`Invoice ${invoice.data.number} · ${invoice.data.issuer.name} · Scrubline`}</title>
      <div className="flex flex-wrap items-center gap-3 print:hidden">
        {workOrderId ? (
          <Link to={recordPath.workOrder(workOrderId)} className="inline-flex min-h-tap items-center gap-1 font-semibold text-link wrap-anywhere">
            <ArrowLeft aria-hidden="true" className="size-5" /> Work order
          </Link>
        ) : isStaff ? (
          <Link to={paths.shop} className="inline-flex min-h-tap items-center gap-1 font-semibold text-link wrap-anywhere">
            <ArrowLeft aria-hidden="true" className="size-5" /> Shop
          </Link>
        ) : null}
        <Button variant="primary" onClick={() => window.print()}>
          <Printer aria-hidden="true" className="size-5" /> Print or save as PDF
        </Button>
        {isStaff && invoice.data.status === 'open' ? (
          <Button variant="secondary" isPending={cash.isPending} pendingLabel="Saving…" onClick={() => cash.mutate(invoice.data.id)}>
            Record a cash payment
          </Button>
        ) : null}
      </div>
      <div className="print:hidden">
        <FormAlert message={invoiceErrorText(cash.error)} />
      </div>
      {workOrderId ? null : (
        <p className="text-sm text-ink-muted print:hidden">Its car was deleted by its owner; the shop keeps the invoice as issued.</p>
      )}
      <InvoiceDocument invoice={invoice.data} />
    </div>
  );
}
