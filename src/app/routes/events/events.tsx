import { Link, useSearchParams } from 'react-router-dom';
import { Plus } from 'lucide-react';
import { buttonClasses } from '@/components/ui/button';
import { SectionBoundary } from '@/components/errors/section-boundary';
import { EventList } from '@/features/events/components/event-list';
import { NEW_EVENT_PARAM, NEW_EVENT_PATH } from '@/features/events/utils/new-event-path';
import { NewEventPage } from './new-event';

/** Every event; `?new=1` opens the new-event form. */
export function EventsPage() {
  const [params] = useSearchParams();
  if (params.get(NEW_EVENT_PARAM)) return <NewEventPage />;
  return (
    <div className="flex flex-col gap-6">
      <title>Events · Scrubline</title>
      <div className="flex flex-wrap items-center justify-between gap-3">
        <h1 className="text-3xl font-extrabold">Events</h1>
        <Link to={NEW_EVENT_PATH} className={buttonClasses('primary')}>
          <Plus aria-hidden="true" className="size-5" /> New event
        </Link>
      </div>
      <SectionBoundary title="Events">
        <EventList />
      </SectionBoundary>
    </div>
  );
}
