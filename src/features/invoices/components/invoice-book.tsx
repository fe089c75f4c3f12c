import { useState } from 'react';
import { Link } from 'react-router-dom';
import type { InvoiceStatus } from '@shared/service/invoice.schema';
import { recordPath } from '@/config/record-paths';
import { Button } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/empty-state';
import { SegmentedControl } from '@/components/ui/segmented-control';
import { formatDay } from '@/lib/dates';
import { formatMoney } from '@/lib/money';
import { useShopInvoices } from '../api/get-shop-invoices';
import { invoiceCarWords } from '../utils/invoice-words';

type Shown = 'open' | 'all';

/** How many invoices show before "Show all": the latest, which are the ones asked about. */
const INVOICES_SHOWN = 8;

const WORDS = {
  open: { none: 'No invoice is waiting to be paid.', list: 'Invoices not paid yet' },
  all: { none: 'No invoices yet. Make one from a closed work order.', list: 'All invoices' },
} as const;

/**
 * The shop's invoices, newest number first: those still to be paid, or all of them. Each opens the invoice's own
 * page, which stays the shop's record after the car it was for is deleted.
 */
export function InvoiceBook({ shopId }: { shopId: string }) {
  const [shown, setShown] = useState<Shown>('open');
  const [all, setAll] = useState(false);
  const status: InvoiceStatus | undefined = shown === 'open' ? 'open' : undefined;
  const { data, isPending, isError } = useShopInvoices(shopId, status);
  const rows = data ? (all ? data.items : data.items.slice(0, INVOICES_SHOWN)) : [];

  return (
    <div className="flex flex-col gap-3">
      <SegmentedControl<Shown>
        label="Show"
        options={[
          { value: 'open', label: 'Not paid yet' },
          { value: 'all', label: 'All' },
        ]}
        value={shown}
        onChange={(value) => {
          setShown(value);
          setAll(false);
        }}
      />
      {isPending ? (
        <p className="text-ink-muted">Loading the invoices…</p>
      ) : isError ? (
        <p className="text-ink-muted">The invoices could not be loaded. Try again shortly.</p>
      ) : data.items.length === 0 ? (
        <EmptyState message={WORDS[shown].none} />
      ) : (
        <>
          <ol className="flex flex-col gap-2" aria-label={WORDS[shown].list}>
            {rows.map((row) => (
              <li key={row.id}>
                <Link to={recordPath.invoice(row.id)} className="flex min-h-tap-lg flex-col gap-1 rounded border border-line p-3 hover:bg-surface-raised">
                  <span className="tabular-figures font-bold text-link">
                    Invoice {row.number} · {formatDay(row.createdAt)}
                  </span>
                  <span className="text-sm wrap-anywhere text-ink-muted">
                    {row.billTo} · {invoiceCarWords(row)}
                  </span>
                  <span className={row.status === 'paid' ? 'tabular-figures text-sm' : 'tabular-figures text-sm font-semibold'}>
                    {formatMoney(row.totalCents, row.currency)} · {row.status === 'paid' ? `paid${row.paidAt ? ` ${formatDay(row.paidAt)}` : ''}` : 'not paid'}
                  </span>
                </Link>
              </li>
            ))}
          </ol>
          {rows.length < data.items.length ? (
            <Button variant="quiet" className="self-start" onClick={() => setAll(true)}>
              Show all {data.items.length} invoices
            </Button>
          ) : null}
        </>
      )}
    </div>
  );
}
