import { useCallback } from 'react';
import { Link, useNavigate } from 'react-router-dom';
import { ArrowLeft } from 'lucide-react';
import { paths, pathTo } from '@/config/paths';
import { NewEventForm } from '@/features/events/components/new-event-form';

/** A new event, then straight to its event-day screen (which works before the event is uploaded). */
export function NewEventPage() {
  const navigate = useNavigate();
  const onSaved = useCallback((eventId: string) => void navigate(pathTo.event(eventId), { replace: true }), [navigate]);
  return (
    <div className="flex flex-col gap-6">
      <title>New event · Scrubline</title>
      <div className="flex flex-col gap-2">
        <Link to={paths.events} className="inline-flex min-h-tap items-center gap-1 self-start font-semibold text-link wrap-anywhere">
          <ArrowLeft aria-hidden="true" className="size-4" /> Events
        </Link>
        <h1 className="text-3xl font-extrabold">New event</h1>
      </div>
      <NewEventForm onSaved={onSaved} />
    </div>
  );
}
