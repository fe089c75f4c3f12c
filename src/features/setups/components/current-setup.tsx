import { Wrench } from 'lucide-react';
import { PendingBadge } from '@/components/ui/pending-badge';
import { formatClock, formatDay } from '@/lib/dates';
import type { SetupView } from '../utils/setup-views';

/**
 * The setup on the car right now, in one line; the next run will be tied to it. `loading`: the car's
 * setups have not come yet (no signal so far), which is not the same as "none recorded".
 */
export function CurrentSetup({ setup, loading = false }: { setup: SetupView | null; loading?: boolean }) {
  return (
    <div className="flex min-w-0 items-center gap-2">
      <Wrench aria-hidden="true" className="size-5 shrink-0 text-ink-muted" />
      <div className="flex min-w-0 flex-col">
        <p className="text-sm">
          <span className="text-ink-muted">Setup now: </span>
          <span className="font-bold break-words">{setup ? setup.label : loading ? 'not known yet' : 'none recorded'}</span>
        </p>
        {setup ? (
          <p className="tabular-figures flex flex-wrap items-center gap-x-2 text-xs text-ink-muted">
            since {formatDay(setup.effectiveFrom)}, {formatClock(setup.effectiveFrom)}
            {setup.pending ? <PendingBadge state={setup.pending.state} /> : null}
          </p>
        ) : null}
      </div>
    </div>
  );
}
