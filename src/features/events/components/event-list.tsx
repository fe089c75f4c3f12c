import { Link } from 'react-router-dom';
import { paths } from '@/config/paths';
import { EmptyState } from '@/components/ui/empty-state';
import { useEventViews } from '../hooks/use-event-views';
import { EventRow } from './event-row';

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
          <EventRow event={event} />
        </li>
      ))}
    </ul>
  );
}
