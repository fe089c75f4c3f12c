import { useMemo } from 'react';
import { notYetFetched, useDeliveredEntries } from '@/lib/delivered-entries';
import { useOutboxEntries } from '@/lib/outbox-context';
import { useEvent } from '../api/get-event';
import { useEvents } from '../api/get-events';
import { eventFromEntry, isEventCreate, mergeEvents, type EventView } from '../utils/pending-events';

/** Every event the user can see, with the ones made on this phone that the server does not have yet. */
export function useEventViews() {
  const query = useEvents();
  const entries = useOutboxEntries();
  const delivered = useDeliveredEntries();
  const events = useMemo(
    () => mergeEvents(query.data?.items ?? [], entries, notYetFetched(delivered, query.dataUpdatedAt)),
    [query.data, query.dataUpdatedAt, entries, delivered],
  );
  const local = events.length > (query.data?.items.length ?? 0);
  return {
    events,
    /** Nothing to show yet: the list is loading and the phone holds no new event. */
    isPending: query.isPending && !local && !query.isError,
    /** The list could not be loaded and the phone holds no new event either. */
    isError: query.isError && !local,
  };
}

/**
 * One event for its event-day screen. An event made on this phone and not uploaded yet is shown
 * from the outbox — the server is not asked about it, since it cannot know it — and one just
 * uploaded stays in view until the server's copy arrives.
 */
export function useDayEvent(eventId: string): { event: EventView | null; isPending: boolean; isError: boolean; error: Error | null } {
  const entries = useOutboxEntries();
  const delivered = useDeliveredEntries();
  const waiting = entries.find((e) => isEventCreate(e) && e.recordId === eventId) ?? null;
  const query = useEvent(eventId, { enabled: waiting === null });
  const landed = waiting ? null : (notYetFetched(delivered, query.dataUpdatedAt).find((e) => isEventCreate(e) && e.recordId === eventId) ?? null);
  const event: EventView | null = query.data
    ? { ...query.data, pending: null }
    : waiting
      ? eventFromEntry(waiting, true)
      : landed
        ? eventFromEntry(landed, false)
        : null;
  return { event, isPending: event === null && query.isPending && !query.isError, isError: event === null && query.isError, error: query.error };
}
