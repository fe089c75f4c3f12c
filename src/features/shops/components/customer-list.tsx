import { Link } from 'react-router-dom';
import { ChevronRight } from 'lucide-react';
import type { Customer } from '@shared/collab/shop.schema';
import { recordPath } from '@/config/record-paths';
import { EmptyState } from '@/components/ui/empty-state';
import { RelativeTime } from '@/lib/relative-time';
import { useCustomers } from '../api/get-customers';

function CustomerItem({ customer }: { customer: Customer }) {
  const { car, owner, latestActivity, openSuggestions } = customer;
  return (
    <li>
      <Link to={recordPath.shopCustomer(car.id)} className="flex min-h-tap-lg items-center gap-3 rounded border border-line p-3 hover:bg-surface-raised">
        <span className="flex min-w-0 flex-1 flex-col gap-0.5">
          <span className="font-bold wrap-anywhere">
            {car.name}
            {car.carNumber ? <span className="tabular-figures font-semibold text-ink-muted"> #{car.carNumber}</span> : null}
          </span>
          <span className="text-sm text-ink-muted">
            Class {car.classCode} · {owner.displayName}
          </span>
          {latestActivity ? (
            <span className="text-sm">
              {latestActivity.summary} ·{' '}
              <RelativeTime iso={latestActivity.at} className="tabular-figures text-ink-muted" />
            </span>
          ) : (
            <span className="text-sm text-ink-muted">Nothing recorded yet.</span>
          )}
          {openSuggestions > 0 ? (
            <span className="self-start rounded bg-accent-soft px-2 text-sm font-semibold">
              {openSuggestions} open suggestion{openSuggestions === 1 ? '' : 's'}
            </span>
          ) : null}
        </span>
        <ChevronRight aria-hidden="true" className="size-5 shrink-0 text-ink-muted" />
      </Link>
    </li>
  );
}

/** The cars whose owners let the shop in, each with what happened last. */
export function CustomerList({ shopId }: { shopId: string }) {
  const { data, isPending, isError } = useCustomers(shopId);
  if (isPending) return <p className="text-ink-muted">Loading customers…</p>;
  if (isError) return <p className="text-ink-muted">Customers could not be loaded. Try again shortly.</p>;
  if (data.items.length === 0) {
    return <EmptyState message="No cars yet. A driver lets your shop in from their car’s page, and the car shows here." />;
  }
  return (
    <ul className="flex flex-col gap-2" aria-label="Customers">
      {data.items.map((customer) => (
        <CustomerItem key={customer.car.id} customer={customer} />
      ))}
    </ul>
  );
}
