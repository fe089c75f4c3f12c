import { Link, useParams } from 'react-router-dom';
import { ArrowLeft, Printer } from 'lucide-react';
import { Button } from '@/components/ui/button';
import { PageMessage } from '@/components/ui/page-message';
import { isApiError } from '@/lib/api-client';
import { useWorkOrder } from '@/features/work-orders/api/get-work-order';
import { useWorkOrderInvoice } from '@/features/invoices/api/get-invoice';
import { InvoiceDocument } from '@/features/invoices/components/invoice-document';

/** A visit's invoice as a page of its own, to print or save as a PDF. */
export function InvoicePage() {
  const { workOrderId = '' } = useParams();
  const workOrder = useWorkOrder(workOrderId);
  const invoice = useWorkOrderInvoice(workOrderId);
  const back = `/work-orders/${workOrderId}`;

  if (workOrder.isError || invoice.isError) {
    const missing = isApiError(workOrder.error) && workOrder.error.status === 404;
    return (
      <PageMessage variant="in-shell" title={missing ? 'Work order not found' : 'The invoice could not be loaded'}>
        <p>{missing ? 'It may be for a car you no longer have access to.' : 'Try again when you have signal.'}</p>
      </PageMessage>
    );
  }
  if (workOrder.isPending || invoice.isPending) return <p className="text-ink-muted">Loading the invoice…</p>;
  if (invoice.data === null) {
    return (
      <PageMessage variant="in-shell" title="No invoice yet">
        <p>
          The shop makes the invoice once the visit is closed. <Link to={back} className="font-semibold text-link underline">Back to the work order</Link>
        </p>
      </PageMessage>
    );
  }

  return (
    <div className="mx-auto flex w-full max-w-3xl flex-col gap-4 print:max-w-none">
      <title>{`Invoice ${invoice.data.number} · ${invoice.data.issuer.name} · Scrubline`}</title>
      <div className="flex flex-wrap items-center gap-3 print:hidden">
        <Link to={back} className="inline-flex min-h-tap items-center gap-1 font-semibold text-link">
          <ArrowLeft aria-hidden="true" className="size-5" /> Work order
        </Link>
        <Button variant="primary" onClick={() => window.print()}>
          <Printer aria-hidden="true" className="size-5" /> Print or save as PDF
        </Button>
      </div>
      <InvoiceDocument invoice={invoice.data} workOrder={workOrder.data} />
    </div>
  );
}
