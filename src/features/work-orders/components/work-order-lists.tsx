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

const STATUS_WORDS = { open: 'Open', closed: 'Closed' } as const;

/** The car's shop visits, newest first, each linking to its work order and the snapshot it wrote. */
export function CarVisits({ carId }: { carId: string }) {
  const { data, isPending, isError } = useCarWorkOrders(carId);
  if (isPending) return <p className="text-ink-muted">Loading shop visits…</p>;
  if (isError) return <p className="text-ink-muted">The shop visits could not be loaded. Try again shortly.</p>;
  if (data.items.length === 0) return <EmptyState message="No shop visits yet." />;
  return (
    <ol className="flex flex-col gap-2" aria-label="Shop visits">
      {data.items.map((visit) => (
        <li key={visit.id} className="flex flex-col gap-1 rounded border border-line p-3">
          <Link to={recordPath.workOrder(visit.id)} className="font-bold break-words text-link">
            {visit.shop.name} · {formatDay(visit.visitDate)}
          </Link>
          <p className="text-sm break-words">{visit.requestedWork}</p>
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
        </li>
      ))}
    </ol>
  );
}

/** The shop's open work orders. */
export function ShopBoard({ shopId }: { shopId: string }) {
  const { data, isPending, isError } = useShopWorkOrders(shopId, 'open');
  if (isPending) return <p className="text-ink-muted">Loading open work orders…</p>;
  if (isError) return <p className="text-ink-muted">The open work orders could not be loaded. Try again shortly.</p>;
  if (data.items.length === 0) return <EmptyState message="No open work orders. Open one from a customer’s car." />;
  return (
    <ol className="flex flex-col gap-2" aria-label="Open work orders">
      {data.items.map((row) => (
        <li key={row.id} className="flex flex-col gap-1 rounded border border-line p-3">
          <Link to={recordPath.workOrder(row.id)} className="font-bold break-words text-link">
            {row.car.name} · {formatDay(row.visitDate)}
          </Link>
          <p className="text-sm text-ink-muted">{row.owner.displayName}</p>
          <p className="text-sm break-words">{row.requestedWork}</p>
        </li>
      ))}
    </ol>
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
