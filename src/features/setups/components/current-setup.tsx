import { Wrench } from 'lucide-react';
import { PendingBadge } from '@/components/ui/pending-badge';
import { formatClock, formatDay } from '@/lib/dates';
import type { SetupView } from '../utils/setup-views';

/**
 * The setup on the car right now, in one line; the next run will be tied to it. While the car's
 * setups are still on their way (`loading`), it says so in the same two lines, so nothing below
 * moves when they arrive and "none recorded" is never shown for a car that has some.
 */
export function CurrentSetup({ setup, loading = false }: { setup: SetupView | null; loading?: boolean }) {
  const shown = loading ? null : setup;
  return (
    <div className="flex min-w-0 items-center gap-2">
      <Wrench aria-hidden="true" className="size-5 shrink-0 text-ink-muted" />
      <div className="flex min-w-0 flex-col">
        <p className="text-sm">
          <span className="text-ink-muted">Setup now: </span>
          <span className={loading ? 'text-ink-muted' : 'font-bold break-words'}>{loading ? 'checking…' : (setup?.label ?? 'none recorded')}</span>
        </p>
        {/* Always there, so the height never changes. */}
        <p className="tabular-figures flex flex-wrap items-center gap-x-2 text-xs text-ink-muted">
          {shown ? `since ${formatDay(shown.effectiveFrom)}, ${formatClock(shown.effectiveFrom)}` : '\u00a0'}
          {shown?.pending ? <PendingBadge state={shown.pending.state} /> : null}
        </p>
      </div>
    </div>
  );
}
