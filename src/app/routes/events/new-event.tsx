import { useCallback } from 'react';
import { useNavigate } from 'react-router-dom';
import { paths, pathTo } from '@/config/paths';
import { NewEventForm } from '@/features/events/components/new-event-form';
import { BackLink } from '@/components/ui/back-link';

/** A new event, then straight to its event-day screen (which works before the event is uploaded). */
export function NewEventPage() {
  const navigate = useNavigate();
  const onSaved = useCallback((eventId: string) => void navigate(pathTo.event(eventId), { replace: true }), [navigate]);
  return (
    <div className="flex flex-col gap-6">
      <title>New event · Scrubline</title>
      <div className="flex flex-col gap-2">
        <BackLink to={paths.events}>Events</BackLink>
        <h1 className="text-3xl font-extrabold">New event</h1>
      </div>
      <NewEventForm onSaved={onSaved} />
    </div>
  );
}
