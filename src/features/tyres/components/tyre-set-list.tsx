import { Link } from 'react-router-dom';
import { formatQuantity } from '@shared/calc/units.calc';
import type { TyreSet } from '@shared/season/tyre.schema';
import { pathTo } from '@/config/paths';
import { buttonClasses } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/empty-state';
import { PendingBadge } from '@/components/ui/pending-badge';
import { formatDateTime } from '@/lib/dates';
import type { OutboxEntry } from '@/lib/outbox';
import { useUnits } from '@/lib/units-context';
import { latestReading } from '../utils/tread';
import { TreadDisplay } from './tread-display';

/** A car's tyre sets, each with its latest tread reading in the corner grid. */
export function TyreSetList({ carId, sets, entries }: { carId: string; sets: readonly TyreSet[]; entries: readonly OutboxEntry[] }) {
  const units = useUnits();
  if (sets.length === 0) return <EmptyState message="No tyre sets recorded for this car yet." />;
  return (
    <ul className="flex flex-col gap-4">
      {sets.map((set) => {
        const latest = latestReading(set, entries);
        return (
          <li key={set.id} className="flex flex-col gap-2 rounded border border-line p-3">
            <div className="flex flex-wrap items-baseline justify-between gap-2">
              <h3 className="font-bold">{set.label}</h3>
              <span className="tabular-figures text-sm text-ink-muted">
                {[set.size, set.startTreadMm !== null ? `new: ${formatQuantity(set.startTreadMm, 'treadDepth', units)}` : null]
                  .filter(Boolean)
                  .join(' · ')}
              </span>
            </div>
            {latest ? (
              <>
                <p className="tabular-figures flex flex-wrap items-center gap-2 text-sm text-ink-muted">
                  Latest reading: {formatDateTime(latest.takenAt)}
                  {latest.pending ? <PendingBadge state={latest.pending.state} /> : null}
                </p>
                <TreadDisplay corners={latest.corners} />
              </>
            ) : (
              <p className="text-sm text-ink-muted">No tread readings yet.</p>
            )}
            <div>
              <Link to={pathTo.tread(carId, set.id)} className={buttonClasses('secondary')}>
                Enter tread for this set
              </Link>
            </div>
          </li>
        );
      })}
    </ul>
  );
}
