import { CalendarDays, ChevronRight } from 'lucide-react';
import { Link } from 'react-router-dom';
import { pathTo } from '@/config/paths';
import { EmptyState } from '@/components/ui/empty-state';
import { useEvents } from '../api/get-events';
import { currentEvent } from '../utils/current-event';
import { EventFacts } from './event-facts';

/** Today's event (or the latest one), one tap from its event-day screen. */
export function CurrentEventCard() {
  const { data, isPending, isError } = useEvents();
  if (isPending) return <p className="text-ink-muted">Loading events…</p>;
  if (isError) return <p className="text-ink-muted">Events could not be loaded. Try again shortly.</p>;
  const current = currentEvent(data.items);
  if (!current) return <EmptyState message="No events yet. An event you or your co-drivers enter will show here." />;
  const { event, isToday } = current;
  return (
    <Link to={pathTo.event(event.id)} className="flex min-h-tap items-center gap-3 rounded border border-line p-3 hover:bg-surface-raised">
      <CalendarDays aria-hidden="true" className="size-6 shrink-0 text-accent" />
      <div className="flex min-w-0 flex-1 flex-col">
        <span className="text-sm font-bold text-ink-muted">{isToday ? 'Today' : 'Latest event'}</span>
        <span className="font-bold">{event.name}</span>
        <EventFacts event={event} />
      </div>
      <ChevronRight aria-hidden="true" className="size-5 shrink-0 text-ink-muted" />
    </Link>
  );
}
