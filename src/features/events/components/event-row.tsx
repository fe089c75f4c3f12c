import type { ReactNode } from 'react';
import { ChevronRight } from 'lucide-react';
import { Link } from 'react-router-dom';
import { pathTo } from '@/config/paths';
import { PendingBadge } from '@/components/ui/pending-badge';
import type { EventView } from '../utils/pending-events';
import { EventConditions, EventFacts } from './event-facts';

/** One event as a link to its event-day screen: its name (marked while still on this phone) and its facts; on a card or on the page. */
export function EventRow({ event, before, caption }: { event: EventView; before?: ReactNode; caption?: string }) {
  return (
    <Link to={pathTo.event(event.id)} className="flex min-h-tap items-center gap-3 rounded border border-line bg-surface p-3 hover:bg-surface-raised">
      {before}
      <div className="flex min-w-0 flex-1 flex-col">
        {caption ? <span className="text-sm font-bold text-ink-muted">{caption}</span> : null}
        <span className="flex flex-wrap items-center gap-2">
          <span className="font-bold wrap-anywhere">{event.name}</span>
          {event.pending ? <PendingBadge state={event.pending.state} /> : null}
        </span>
        <EventFacts event={event} />
        <EventConditions event={event} />
      </div>
      <ChevronRight aria-hidden="true" className="size-5 shrink-0 text-ink-muted" />
    </Link>
  );
}
