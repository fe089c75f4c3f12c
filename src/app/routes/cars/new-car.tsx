import { useCallback } from 'react';
import { useLocation, useNavigate } from 'react-router-dom';
import { paths, pathTo } from '@/config/paths';
import { useMe } from '@/features/auth/api/get-me';
import { NewCarForm } from '@/features/cars/components/new-car-form';
import { BackLink } from '@/components/ui/back-link';

/**
 * The event a driver left to add a car, as the event-day page passes it in the history entry's state:
 * only an id, so nothing in it can lead outside the app.
 */
function eventLeftFrom(state: unknown): string | null {
  return typeof state === 'string' && /^[\w-]{1,64}$/.test(state) ? state : null;
}

/**
 * A new car; then back to the cars, where it shows as waiting to upload until the server has it. Reached
 * from an event with no car to log for, it goes back to that event instead, with the new car and its
 * driver (whoever made it) chosen, so the next tap logs a run.
 */
export function NewCarPage() {
  const navigate = useNavigate();
  const eventId = eventLeftFrom(useLocation().state);
  const { data: me } = useMe();
  const meId = me?.id;
  const onSaved = useCallback(
    (carId: string) => {
      const next = eventId && meId ? `${pathTo.event(eventId, carId)}&driverId=${encodeURIComponent(meId)}` : paths.cars;
      void navigate(next, { replace: true });
    },
    [navigate, eventId, meId],
  );
  return (
    <div className="flex flex-col gap-6">
      <title>New car · Scrubline</title>
      <div className="flex flex-col gap-2">
        <BackLink to={eventId ? pathTo.event(eventId) : paths.cars}>{eventId ? 'Back to the event' : 'Cars'}</BackLink>
        <h1 className="text-3xl font-extrabold">New car</h1>
      </div>
      <NewCarForm onSaved={onSaved} />
    </div>
  );
}
