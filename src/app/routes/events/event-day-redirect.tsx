import { Link, Navigate } from 'react-router-dom';
import { CalendarDays, Plus } from 'lucide-react';
import { paths, pathTo } from '@/config/paths';
import { buttonClasses } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/empty-state';
import { EventRow } from '@/features/events/components/event-row';
import { useEventViews } from '@/features/events/hooks/use-event-views';
import { currentEvent, currentEventCaption } from '@/features/events/utils/current-event';
import { NEW_EVENT_PATH } from '@/features/events/utils/new-event-path';

/** "Event day" in the navigation: straight to today's event; with none today, start one or open the next planned or the latest. */
export function EventDayRedirect() {
  const { events, isPending, isError } = useEventViews();
  if (isPending) return <p className="text-ink-muted">Finding today’s event…</p>;
  const current = isError ? null : currentEvent(events);
  if (current?.isToday) return <Navigate to={pathTo.event(current.event.id)} replace />;
  const shown = current?.event ?? null;
  return (
    <div className="flex flex-col gap-5">
      <title>Event day · Scrubline</title>
      <h1 className="text-3xl font-extrabold">Event day</h1>
      <EmptyState
        message={
          isError
            ? 'Events could not be loaded (no signal?). You can still start today’s event: it is kept on this phone and uploads later.'
            : 'Nothing entered for today yet.'
        }
      />
      {shown ? (
        <EventRow
          event={shown}
          caption={currentEventCaption(current!)}
          before={<CalendarDays aria-hidden="true" className="size-6 shrink-0 text-accent" />}
        />
      ) : null}
      <Link to={NEW_EVENT_PATH} className={buttonClasses('primary', 'min-h-tap-lg w-full text-lg')}>
        <Plus aria-hidden="true" className="size-5" /> Start today’s event
      </Link>
      <Link to={paths.events} className="inline-flex min-h-tap items-center self-start font-semibold text-link underline">
        All events
      </Link>
    </div>
  );
}
