import { ChevronRight } from 'lucide-react';
import { Link } from 'react-router-dom';
import { pathTo } from '@/config/paths';
import { EmptyState } from '@/components/ui/empty-state';
import { PendingBadge } from '@/components/ui/pending-badge';
import { useEventViews } from '../hooks/use-event-views';
import { EventFacts } from './event-facts';

/** Every event the user can see, newest first, each opening its event-day screen; new ones still on this phone are marked. */
export function EventList() {
  const { events, isPending, isError } = useEventViews();
  if (isPending) return <p className="text-ink-muted">Loading events…</p>;
  if (isError) return <p className="text-ink-muted">Events could not be loaded. Try again shortly.</p>;
  if (events.length === 0) return <EmptyState message="No events yet." />;
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
