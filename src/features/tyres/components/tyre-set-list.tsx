import { useState } from 'react';
import { Link } from 'react-router-dom';
import { RotateCw } from 'lucide-react';
import { formatQuantity } from '@shared/calc/units.calc';
import { recordPath } from '@/config/record-paths';
import { Button, buttonClasses } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/empty-state';
import { PendingBadge } from '@/components/ui/pending-badge';
import { formatDateTime } from '@/lib/dates';
import type { OutboxEntry } from '@/lib/outbox';
import { useUnits } from '@/lib/units-context';
import { latestReading } from '../utils/tread';
import { currentPositions, positionsText, type TyreSetView } from '../utils/tyre-set-views';
import { RotationForm } from './rotation-form';
import { TreadDisplay } from './tread-display';

/** When a set was last fitted: its latest rotation, or, fitted as it came, when it was recorded. */
const fittedAt = (set: TyreSetView) => Date.parse(currentPositions(set).mountedAt ?? set.createdAt);

/**
 * Where the set's tyres sit, and since when. One set is on the car at a time: the one fitted last; the others are off
 * it, with the places their tyres had.
 */
function PositionsLine({ set, onCar }: { set: TyreSetView; onCar: boolean }) {
  const now = currentPositions(set);
  return (
    <p className="tabular-figures flex flex-wrap items-center gap-2 text-sm text-ink-muted">
      <span>
        {onCar ? 'On the car' : 'Off the car; last fitted'}: {positionsText(now.positions)}
        {now.mountedAt ? ` · ${onCar ? 'since' : 'from'} ${formatDateTime(now.mountedAt)}` : ''}
      </span>
      {now.pending ? <PendingBadge state={now.pending.state} /> : null}
    </p>
  );
}

interface TyreSetListProps {
  carId: string;
  sets: readonly TyreSetView[];
  entries: readonly OutboxEntry[];
  /** For a shop reading a customer's car: the sets and their tread, with no way to enter tread or move tyres. */
  readOnly?: boolean;
}

/**
 * A car's tyre sets, each with where its tyres sit, its latest tread reading in the corner grid,
 * and a way to record a rotation. Sets and rotations still on this phone are marked.
 */
export function TyreSetList({ carId, sets, entries, readOnly = false }: TyreSetListProps) {
  const units = useUnits();
  const [rotating, setRotating] = useState<string | null>(null);
  if (sets.length === 0) return <EmptyState message="No tyre sets recorded for this car yet." />;
  const onCar = sets.reduce((last, set) => (fittedAt(set) > fittedAt(last) ? set : last)).id;
  return (
    <ul className="flex flex-col gap-4">
      {sets.map((set) => {
        const latest = latestReading(set, entries);
        return (
          <li key={set.id} className="flex flex-col gap-2 rounded border border-line p-3">
            <div className="flex flex-wrap items-baseline justify-between gap-2">
              <h3 className="flex flex-wrap items-center gap-2 font-bold wrap-anywhere">
                {set.label}
                {set.pending ? <PendingBadge state={set.pending.state} /> : null}
              </h3>
              <span className="tabular-figures text-sm text-ink-muted">
                {[set.size, set.startTreadMm !== null ? `new: ${formatQuantity(set.startTreadMm, 'treadDepth', units)}` : null]
                  .filter(Boolean)
                  .join(' · ')}
              </span>
            </div>
            {set.pending?.state === 'failed' ? (
              <p className="text-sm font-semibold text-warning">Refused: {set.pending.error?.message ?? 'the server did not accept it'}</p>
            ) : null}
            <PositionsLine set={set} onCar={set.id === onCar} />
            {/* The server counts a run for the set fitted last before it; a set still on this phone has none yet. */}
            {set.runs !== undefined ? (
              <p className="tabular-figures text-sm text-ink-muted">
                {set.runs === 1 ? '1 run' : `${set.runs} runs`} on this set
              </p>
            ) : null}
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
            {readOnly ? null : rotating === set.id ? (
              <RotationForm carId={carId} set={set} onSaved={() => setRotating(null)} onCancel={() => setRotating(null)} />
            ) : (
              <div className="flex flex-wrap gap-2">
                <Link to={recordPath.tread(carId, set.id)} className={buttonClasses('secondary')}>
                  Enter tread for this set
                </Link>
                {/* Fitting a set that is off the car is recorded as its tyres' places from then on. */}
                <Button variant="secondary" onClick={() => setRotating(set.id)}>
                  <RotateCw aria-hidden="true" className="size-5" /> {set.id === onCar ? 'Rotate tyres' : 'Fit to the car'}
                  <span className="sr-only"> of {set.label}</span>
                </Button>
              </div>
            )}
          </li>
        );
      })}
    </ul>
  );
}
