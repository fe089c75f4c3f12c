import { Car as CarIcon, ChevronRight, Plus } from 'lucide-react';
import { Link } from 'react-router-dom';
import { pathTo } from '@/config/paths';
import { buttonClasses } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/empty-state';
import { PendingBadge } from '@/components/ui/pending-badge';
import { useCarViews } from '../hooks/use-car-views';
import { NEW_CAR_PATH } from '../utils/new-car-path';
import type { CarView } from '../utils/pending-cars';

function CarSummary({ car, currentUserId }: { car: CarView; currentUserId: string }) {
  const others = [car.owner, ...car.coDrivers].filter((p) => p.id !== currentUserId).map((p) => p.displayName);
  return (
    <div className="flex min-w-0 flex-1 flex-col">
      <span className="flex flex-wrap items-center gap-x-2 gap-y-1">
        <span className="min-w-0 font-bold wrap-anywhere">
          {car.name}
          {car.carNumber ? <span className="tabular-figures font-semibold text-ink-muted"> #{car.carNumber}</span> : null}
        </span>
        {car.pending ? <PendingBadge state={car.pending.state} /> : null}
      </span>
      <span className="text-sm text-ink-muted">
        Class {car.classCode}
        {car.tyreSize ? ` · ${car.tyreSize}` : ''}
        {others.length ? ` · shared with ${others.join(', ')}` : ''}
      </span>
      {car.pending?.state === 'failed' ? (
        <span className="text-sm font-semibold text-warning">Refused: {car.pending.error?.message ?? 'the server did not accept it'}</span>
      ) : car.pending ? (
        <span className="text-sm text-ink-muted">Saved on this phone; its page opens once it has uploaded.</span>
      ) : null}
    </div>
  );
}

/**
 * The cars this driver owns or co-drives, each opening its page. A car made on this phone and not
 * uploaded yet is listed as waiting to upload. With no cars at all, the way to add one.
 */
export function CarList({ currentUserId, addWhenEmpty = true }: { currentUserId: string; addWhenEmpty?: boolean }) {
  const { cars, isPending, isError } = useCarViews({ id: currentUserId, displayName: 'You' });
  if (isPending) return <p className="text-ink-muted">Loading your cars…</p>;
  if (isError) return <p className="text-ink-muted">Your cars could not be loaded. Pull to refresh or try again shortly.</p>;
  if (cars.length === 0) {
    return (
      <EmptyState message="No cars yet. Add your car to start logging; a car you co-drive shows here once its owner adds you.">
        {addWhenEmpty ? (
          <Link to={NEW_CAR_PATH} className={buttonClasses('primary', 'self-start')}>
            <Plus aria-hidden="true" className="size-5" /> Add a car
          </Link>
        ) : null}
      </EmptyState>
    );
  }
  return (
    <ul className="flex flex-col gap-2">
      {cars.map((car) => (
        <li key={car.id}>
          {car.pending ? (
            <div className="flex min-h-tap items-center gap-3 rounded border border-dashed border-line-strong p-3">
              <CarIcon aria-hidden className="size-6 shrink-0 text-ink-muted" />
              <CarSummary car={car} currentUserId={currentUserId} />
            </div>
          ) : (
            <Link to={pathTo.car(car.id)} className="flex min-h-tap items-center gap-3 rounded border border-line p-3 hover:bg-surface-raised">
              <CarIcon aria-hidden className="size-6 shrink-0 text-accent" />
              <CarSummary car={car} currentUserId={currentUserId} />
              <ChevronRight aria-hidden="true" className="size-5 shrink-0 text-ink-muted" />
            </Link>
          )}
        </li>
      ))}
    </ul>
  );
}
