import { Link, Navigate } from 'react-router-dom';
import { CalendarDays, ChevronRight, Plus } from 'lucide-react';
import { paths, pathTo } from '@/config/paths';
import { buttonClasses } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/empty-state';
import { PendingBadge } from '@/components/ui/pending-badge';
import { EventFacts } from '@/features/events/components/event-facts';
import { useEventViews } from '@/features/events/hooks/use-event-views';
import { currentEvent } from '@/features/events/utils/current-event';
import { NEW_EVENT_PATH } from '@/features/events/utils/new-event-path';

/** "Event day" in the navigation: straight to today's event; with none today, start one or open the latest. */
export function EventDayRedirect() {
  const { events, isPending, isError } = useEventViews();
  if (isPending) return <p className="text-ink-muted">Finding today’s event…</p>;
  const current = isError ? null : currentEvent(events);
  if (current?.isToday) return <Navigate to={pathTo.event(current.event.id)} replace />;
  const latest = current?.event ?? null;
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
      {latest ? (
        <Link to={pathTo.event(latest.id)} className="flex min-h-tap items-center gap-3 rounded border border-line bg-surface p-3 hover:bg-surface-raised">
          <CalendarDays aria-hidden="true" className="size-6 shrink-0 text-accent" />
          <div className="flex min-w-0 flex-1 flex-col">
            <span className="text-sm font-bold text-ink-muted">Latest event</span>
            <span className="flex flex-wrap items-center gap-2">
              <span className="font-bold break-words">{latest.name}</span>
              {latest.pending ? <PendingBadge state={latest.pending.state} /> : null}
            </span>
            <EventFacts event={latest} />
          </div>
          <ChevronRight aria-hidden="true" className="size-5 shrink-0 text-ink-muted" />
        </Link>
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
