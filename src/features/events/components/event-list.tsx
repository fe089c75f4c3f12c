import { ChevronRight } from 'lucide-react';
import { Link } from 'react-router-dom';
import { paths, pathTo } from '@/config/paths';
import { EmptyState } from '@/components/ui/empty-state';
import { PendingBadge } from '@/components/ui/pending-badge';
import { useEventViews } from '../hooks/use-event-views';
import { EventFacts } from './event-facts';

/** Every event the user can see, newest first, each opening its event-day screen; new ones still on this phone are marked. */
export function EventList() {
  const { events, isPending, isError } = useEventViews();
  if (isPending) return <p className="text-ink-muted">Loading events…</p>;
  if (isError) return <p className="text-ink-muted">Events could not be loaded. Try again shortly.</p>;
  if (events.length === 0) {
    // A captain without a car of their own sees the team's events on its class board, not here.
    return (
      <EmptyState message="No events yet. An event shows here once you or a co-driver enter it, or a car you can read runs at it.">
        <Link to={paths.teams} className="inline-flex min-h-tap items-center self-start font-bold text-link underline">
          Team results are on each class board
        </Link>
      </EmptyState>
    );
  }
  return (
    <ul className="flex flex-col gap-2">
      {events.map((event) => (
        <li key={event.id}>
          <Link to={pathTo.event(event.id)} className="flex min-h-tap items-center gap-3 rounded border border-line p-3 hover:bg-surface-raised">
            <div className="flex min-w-0 flex-1 flex-col">
              <span className="flex flex-wrap items-center gap-2">
                <span className="font-bold break-words">{event.name}</span>
                {event.pending ? <PendingBadge state={event.pending.state} /> : null}
              </span>
              <EventFacts event={event} />
            </div>
            <ChevronRight aria-hidden="true" className="size-5 shrink-0 text-ink-muted" />
          </Link>
        </li>
      ))}
    </ul>
  );
}
