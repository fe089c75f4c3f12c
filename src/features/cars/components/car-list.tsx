import { Car as CarIcon, ChevronRight } from 'lucide-react';
import { Link } from 'react-router-dom';
import { pathTo } from '@/config/paths';
import { EmptyState } from '@/components/ui/empty-state';
import { useCars } from '../api/get-cars';

/** The cars this driver owns or co-drives, each opening its page. */
export function CarList({ currentUserId }: { currentUserId: string }) {
  const { data, isPending, isError } = useCars();
  if (isPending) return <p className="text-ink-muted">Loading your cars…</p>;
  if (isError) return <p className="text-ink-muted">Your cars could not be loaded. Pull to refresh or try again shortly.</p>;
  if (data.count === 0) return <EmptyState message="No cars yet. A car you own or co-drive will show here." />;
  return (
    <ul className="flex flex-col gap-2">
      {data.items.map((car) => {
        const others = [car.owner, ...car.coDrivers].filter((p) => p.id !== currentUserId).map((p) => p.displayName);
        return (
          <li key={car.id}>
            <Link
              to={pathTo.car(car.id)}
              className="flex min-h-tap items-center gap-3 rounded border border-line p-3 hover:bg-surface-raised"
            >
              <CarIcon aria-hidden className="size-6 shrink-0 text-accent" />
              <div className="flex min-w-0 flex-1 flex-col">
                <span className="truncate font-bold">
                  {car.name}
                  {car.carNumber ? <span className="tabular-figures font-semibold text-ink-muted"> #{car.carNumber}</span> : null}
                </span>
                <span className="text-sm text-ink-muted">
                  Class {car.classCode}
                  {car.tyreSize ? ` · ${car.tyreSize}` : ''}
                  {others.length ? ` · shared with ${others.join(', ')}` : ''}
                </span>
              </div>
              <ChevronRight aria-hidden="true" className="size-5 shrink-0 text-ink-muted" />
            </Link>
          </li>
        );
      })}
    </ul>
  );
}
