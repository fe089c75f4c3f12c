import { useState } from 'react';
import { Link, useNavigate } from 'react-router-dom';
import { recordPath } from '@/config/record-paths';
import { Button } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/empty-state';
import { FormAlert } from '@/components/ui/form-alert';
import { TextField } from '@/components/ui/text-field';
import { isApiError } from '@/lib/api-client';
import { formatDay, todayIsoDate } from '@/lib/dates';
import { useCreateWorkOrder } from '../api/create-work-order';
import { useCarWorkOrders } from '../api/get-car-work-orders';
import { useShopWorkOrders } from '../api/get-shop-work-orders';
import { invoiceStandingWords } from '@/features/invoices/utils/invoice-words';
import type { WorkOrderStatus } from '@shared/service/work-order.schema';

const STATUS_WORDS = { open: 'Open', closed: 'Closed' } as const;

/** The car's shop visits, newest first, each linking to its work order and the snapshot it wrote. */
export function CarVisits({ carId }: { carId: string }) {
  const { data, isPending, isError } = useCarWorkOrders(carId);
  if (isPending) return <p className="text-ink-muted">Loading shop visits…</p>;
  if (isError) return <p className="text-ink-muted">The shop visits could not be loaded. Try again shortly.</p>;
  if (data.items.length === 0) return <EmptyState message="No shop visits yet." />;
  return (
    <ol className="flex flex-col gap-2" aria-label="Shop visits">
      {/* The server lists them oldest first; the latest visit is the one asked about. */}
      {[...data.items].reverse().map((visit) => (
        <li key={visit.id} className="flex flex-col gap-1 rounded border border-line p-3">
          <Link to={recordPath.workOrder(visit.id)} className="font-bold wrap-anywhere text-link">
            {visit.shop.name} · {formatDay(visit.visitDate)}
          </Link>
          <p className="text-sm wrap-anywhere">{visit.requestedWork}</p>
          <p className="text-sm text-ink-muted">
            {STATUS_WORDS[visit.status]}
            {visit.setupId ? (
              <>
                {' · '}
                {/* A finger-sized target; the history unfolds down to the snapshot when it is an old one. */}
                <Link to={{ hash: `#setup-${visit.setupId}` }} className="inline-flex min-h-tap items-center font-semibold text-link">
                  Setup it wrote
                </Link>
              </>
            ) : null}
          </p>
          {visit.status === 'closed' ? <p className="text-sm">{invoiceStandingWords(visit.invoice)}</p> : null}
        </li>
      ))}
    </ol>
  );
}

const BOARD_WORDS = {
  open: { list: 'Open work orders', loading: 'Loading open work orders…', failed: 'The open work orders could not be loaded. Try again shortly.', none: 'No open work orders. Open one from a customer’s car.' },
  closed: { list: 'Closed visits', loading: 'Loading closed visits…', failed: 'The closed visits could not be loaded. Try again shortly.', none: 'No closed visits yet. A work order shows here once it is handed over.' },
} as const;

/** How many closed visits show before "Show all": the latest, which are the ones asked about. */
const CLOSED_SHOWN = 8;

/**
 * The shop's work orders, newest visit first: the open ones it is working on, or the closed ones, whose build sheets
 * and invoices stay a tap away. Each is one finger-sized card.
 */
export function ShopBoard({ shopId, status = 'open' }: { shopId: string; status?: WorkOrderStatus }) {
  const { data, isPending, isError } = useShopWorkOrders(shopId, status);
  const [all, setAll] = useState(false);
  const words = BOARD_WORDS[status];
  if (isPending) return <p className="text-ink-muted">{words.loading}</p>;
  if (isError) return <p className="text-ink-muted">{words.failed}</p>;
  if (data.items.length === 0) return <EmptyState message={words.none} />;
  const shown = status === 'closed' && !all ? data.items.slice(0, CLOSED_SHOWN) : data.items;
  return (
    <div className="flex flex-col gap-2">
      <ol className="flex flex-col gap-2" aria-label={words.list}>
        {shown.map((row) => (
          <li key={row.id}>
            <Link to={recordPath.workOrder(row.id)} className="flex min-h-tap-lg flex-col gap-1 rounded border border-line p-3 hover:bg-surface-raised">
              <span className="font-bold wrap-anywhere text-link">
                {row.car.name} · {formatDay(row.visitDate)}
              </span>
              <span className="text-sm text-ink-muted">
                {row.owner.displayName}
                {row.handoverAt ? ` · handed over ${formatDay(row.handoverAt)}` : ''}
              </span>
              <span className="text-sm wrap-anywhere">{row.requestedWork}</span>
              {row.status === 'closed' ? (
                <span className={row.invoice?.status === 'paid' ? 'text-sm text-ink-muted' : 'text-sm font-semibold'}>{invoiceStandingWords(row.invoice)}</span>
              ) : null}
            </Link>
          </li>
        ))}
      </ol>
      {shown.length < data.items.length ? (
        <Button variant="quiet" className="self-start" onClick={() => setAll(true)}>
          Show all {data.items.length} closed visits
        </Button>
      ) : null}
    </div>
  );
}

/** Staff open a visit for a customer's car, then carry on on its page. */
export function OpenWorkOrderForm({ carId }: { carId: string }) {
  const navigate = useNavigate();
  const [id] = useState(() => crypto.randomUUID());
  const [visitDate, setVisitDate] = useState(todayIsoDate);
  const [requestedWork, setRequestedWork] = useState('');
  const create = useCreateWorkOrder(carId);
  const fieldError = (key: string) => (isApiError(create.error) ? create.error.fieldErrors[key]?.join(' ') : undefined);
  const formError = create.error && !(isApiError(create.error) && create.error.hasFieldErrors) ? create.error.message : null;
  return (
    <form
      aria-label="Open a work order"
      className="flex flex-col gap-3"
      onSubmit={(e) => {
        e.preventDefault();
        create.mutate({ id, visitDate, requestedWork }, { onSuccess: (wo) => navigate(recordPath.workOrder(wo.id)) });
      }}
    >
      <TextField label="Visit date" type="date" value={visitDate} error={fieldError('visitDate')} onChange={(e) => setVisitDate(e.target.value)} />
      <TextField
        label="Requested work"
        value={requestedWork}
        maxLength={2000}
        error={fieldError('requestedWork')}
        onChange={(e) => setRequestedWork(e.target.value)}
      />
      <FormAlert message={formError} />
      <Button type="submit" className="self-start" isPending={create.isPending} pendingLabel="Opening…">
        Open a work order
      </Button>
    </form>
  );
}
