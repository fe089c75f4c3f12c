import { Wrench } from 'lucide-react';
import { PendingBadge } from '@/components/ui/pending-badge';
import { formatClock, formatDay, isOnDate } from '@/lib/dates';
import { QUICK_CHANGE_PREFIX, type SetupView } from '../utils/setup-views';

const shortLabel = (label: string) => (label.startsWith(QUICK_CHANGE_PREFIX) ? label.slice(QUICK_CHANGE_PREFIX.length) : label);

/**
 * The setup the next run will be tied to, in two lines at most: the one on the car now, or, once the event's
 * day is over (`dayOver`), the one it ended that day with. `loading`: the car's setups have not come yet (no
 * signal so far), which is not the same as "none recorded". `day` (yyyy-MM-dd, the event's): a setup made
 * that day says only the time it started.
 */
export function CurrentSetup({ setup, loading = false, day, dayOver = false }: { setup: SetupView | null; loading?: boolean; day?: string; dayOver?: boolean }) {
  const sameDay = setup !== null && day !== undefined && isOnDate(setup.effectiveFrom, day);
  return (
    <div className="flex min-w-0 items-center gap-2">
      <Wrench aria-hidden="true" className="size-5 shrink-0 text-ink-muted" />
      <div className="flex min-w-0 flex-col">
        {/* Kept to two lines, so the keypad below stays whole on a phone's first screen (each run shows the full name). */}
        <p className="line-clamp-2 text-sm">
          <span className="text-ink-muted">{dayOver ? 'Setup that day: ' : 'Setup now: '}</span>
          {/* Beside the Quick change button, a quick change's own name starts with what changed, so the two lines keep the value. */}
          <span className="font-bold wrap-anywhere">{setup ? shortLabel(setup.label) : loading ? 'not known yet' : 'none recorded'}</span>
        </p>
        {setup ? (
          <p className="tabular-figures flex flex-wrap items-center gap-x-2 text-xs text-ink-muted">
            {sameDay ? `since ${formatClock(setup.effectiveFrom)}` : `since ${formatDay(setup.effectiveFrom)}, ${formatClock(setup.effectiveFrom)}`}
            {setup.pending ? <PendingBadge state={setup.pending.state} /> : null}
          </p>
        ) : null}
      </div>
    </div>
  );
}
