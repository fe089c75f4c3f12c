import { SectionBoundary } from '@/components/errors/section-boundary';
import { EventList } from '@/features/events/components/event-list';

export function EventsPage() {
  return (
    <div className="flex flex-col gap-6">
      <title>Events · Scrubline</title>
      <h1 className="text-3xl font-extrabold">Events</h1>
      <SectionBoundary title="Events">
        <EventList />
      </SectionBoundary>
    </div>
  );
}
