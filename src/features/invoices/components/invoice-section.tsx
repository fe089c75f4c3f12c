import { Link, useSearchParams } from 'react-router-dom';
import { useQuery } from '@tanstack/react-query';
import { CreditCard, FileText } from 'lucide-react';
import type { Invoice } from '@shared/service/invoice.schema';
import { Button, buttonClasses } from '@/components/ui/button';
import { FormAlert } from '@/components/ui/form-alert';
import { SectionCard } from '@/components/ui/section-card';
import { paths } from '@/config/paths';
import { recordPath } from '@/config/record-paths';
import { shopQueryOptions } from '@/features/shops/api/get-shop';
import { formatDay } from '@/lib/dates';
import { useWorkOrderInvoice } from '../api/get-invoice';
import { useMakeInvoice, useMarkPaidInCash, useStartCheckout } from '../api/pay-invoice';
import { invoiceErrorText } from '../utils/invoice-words';
import { InvoiceLines } from './invoice-lines';

/** After coming back from the checkout, ask a few times while the payment service tells the server. */
const PAID_POLL_MS = 2000;
const PAID_POLL_TRIES = 5;


function InvoiceDetails({ invoice }: { invoice: Invoice }) {
  return (
    <div className="flex flex-col gap-2">
      <p className="tabular-figures text-sm">
        <span className="font-semibold">Invoice {invoice.number}</span> · issued {formatDay(invoice.createdAt)} · for {invoice.billTo}
      </p>
      <InvoiceLines invoice={invoice} caption="Invoice lines" />
      <Link to={recordPath.invoice(invoice.id)} className={buttonClasses('secondary', 'self-start')}>
        <FileText aria-hidden="true" className="size-4" /> Open the invoice to print
      </Link>
    </div>
  );
}

/** Before the first invoice goes out bare: says so when the shop has not written its address and tax number. */
function ShopLinesMissing({ shopId }: { shopId: string }) {
  const { data: shop } = useQuery(shopQueryOptions(shopId));
  if (!shop || shop.settings.invoiceDetails !== '') return null;
  return (
    <p className="text-sm">
      Invoices carry only the shop’s name so far: no address or tax number. {shop.isShopAdmin ? 'Add them' : 'A shop admin adds them'} under
      “Invoices and build sheets” on the{' '}
      <Link to={paths.shop} className="font-semibold text-link underline">
        Shop page
      </Link>
      .
    </p>
  );
}

/** The visit's invoice: staff make it and take cash; drivers pay online. */
export function InvoiceSection({ workOrderId, shopId, isStaff }: { workOrderId: string; shopId: string; isStaff: boolean }) {
  const [params] = useSearchParams();
  const returnedPaid = params.get('paid') === '1';
  const { data: invoice, isPending, isError, isFetching } = useWorkOrderInvoice(workOrderId, {
    pollUntilPaid: returnedPaid ? { everyMs: PAID_POLL_MS, tries: PAID_POLL_TRIES } : null,
  });
  const waitingForPayment = returnedPaid && invoice?.status !== 'paid' && isFetching;
  const make = useMakeInvoice(workOrderId);
  const checkout = useStartCheckout();
  const cash = useMarkPaidInCash();

  return (
    <SectionCard title="Invoice">
      {isPending ? (
        <p className="text-ink-muted">Loading the invoice…</p>
      ) : isError ? (
        <p className="text-ink-muted">The invoice could not be loaded. Try again shortly.</p>
      ) : invoice === null ? (
        isStaff ? (
          <div className="flex flex-col gap-2">
            <p className="text-ink-muted">No invoice yet. It lists the parts and labour with tax at the shop’s rate.</p>
            <ShopLinesMissing shopId={shopId} />
            <FormAlert message={invoiceErrorText(make.error)} />
            <Button className="self-start" isPending={make.isPending} pendingLabel="Making the invoice…" onClick={() => make.mutate()}>
              Make the invoice
            </Button>
          </div>
        ) : (
          <p className="text-ink-muted">The shop has not sent an invoice yet.</p>
        )
      ) : (
        <div className="flex flex-col gap-3">
          {returnedPaid && invoice.status === 'paid' ? (
            <p role="status" className="font-bold">
              Payment received — thank you
            </p>
          ) : waitingForPayment ? (
            <p role="status" className="text-ink-muted">
              Checking the payment…
            </p>
          ) : returnedPaid && invoice.status !== 'paid' ? (
            <p role="status" className="text-ink-muted">
              The payment has not reached the shop yet. Reload this page in a minute.
            </p>
          ) : null}
          <InvoiceDetails invoice={invoice} />
          {invoice.status === 'open' ? (
            <>
              <FormAlert message={invoiceErrorText(checkout.error) ?? invoiceErrorText(cash.error)} />
              <div className="flex flex-wrap gap-2">
                {isStaff ? (
                  <Button variant="secondary" isPending={cash.isPending} pendingLabel="Saving…" onClick={() => cash.mutate(invoice.id)}>
                    Record a cash payment
                  </Button>
                ) : (
                  <Button isPending={checkout.isPending} pendingLabel="Opening the checkout…" onClick={() => checkout.mutate(invoice.id)}>
                    <CreditCard aria-hidden="true" className="size-5" /> Pay online
                  </Button>
                )}
              </div>
            </>
          ) : null}
        </div>
      )}
    </SectionCard>
  );
}
