import { CalendarDays, Plus } from 'lucide-react';
import { Link } from 'react-router-dom';
import { buttonClasses } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/empty-state';
import { useEventViews } from '../hooks/use-event-views';
import { currentEvent, currentEventCaption } from '../utils/current-event';
import { NEW_EVENT_PATH } from '../utils/new-event-path';
import { EventRow } from './event-row';
import { isTodayDate } from '@/lib/dates';

function StartTodayLink() {
  return (
    <Link to={NEW_EVENT_PATH} className={buttonClasses('primary', 'self-start')}>
      <Plus aria-hidden="true" className="size-5" /> Start today’s event
    </Link>
  );
}

/** Today's event (or the next planned, or the latest), one tap from its event-day screen; with none today, a way to start one. */
export function CurrentEventCard() {
  const { events, isPending, isError } = useEventViews();
  if (isPending) return <p className="text-ink-muted">Loading events…</p>;
  if (isError) return <p className="text-ink-muted">Events could not be loaded. Try again shortly.</p>;
  const current = currentEvent(events);
  if (!current) {
    return (
      <EmptyState message="No events yet. Start one at the venue, or an event you or your co-drivers enter will show here.">
        <StartTodayLink />
      </EmptyState>
    );
  }
  const { event, isToday } = current;
  // A second event the same day (a morning and an afternoon round) is as near as the first.
  const alsoToday = isToday ? events.filter((e) => e.id !== event.id && isTodayDate(e.date)) : [];
  return (
    <div className="flex flex-col gap-3">
      {[event, ...alsoToday].map((e) => (
        <EventRow
          key={e.id}
          event={e}
          caption={currentEventCaption(current)}
          before={<CalendarDays aria-hidden="true" className="size-6 shrink-0 text-accent" />}
        />
      ))}
      {isToday ? null : <StartTodayLink />}
    </div>
  );
}
