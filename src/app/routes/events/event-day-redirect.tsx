import { Link, Navigate } from 'react-router-dom';
import { paths, pathTo } from '@/config/paths';
import { EmptyState } from '@/components/ui/empty-state';
import { useEvents } from '@/features/events/api/get-events';
import { currentEvent } from '@/features/events/utils/current-event';

/** "Event day" in the navigation: straight to today's event, or the latest one. */
export function EventDayRedirect() {
  const { data, isPending, isError } = useEvents();
  if (isPending) return <p className="text-ink-muted">Finding today’s event…</p>;
  if (isError) {
    return (
      <EmptyState message="Events could not be loaded, and none are kept on this phone yet. Try again when you have signal." />
    );
  }
  const current = currentEvent(data.items);
  if (!current) {
    return (
      <div className="flex flex-col gap-4">
        <title>Event day · Scrubline</title>
        <h1 className="text-3xl font-extrabold">Event day</h1>
        <EmptyState message="No events yet. An event you or your co-drivers enter will show here.">
          <Link to={paths.events} className="font-semibold text-link underline">
            All events
          </Link>
        </EmptyState>
      </div>
    );
  }
  return <Navigate to={pathTo.event(current.event.id)} replace />;
}
