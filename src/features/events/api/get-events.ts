import { queryOptions, useQuery } from '@tanstack/react-query';
import type { SeasonEvent } from '@shared/season/event.schema';
import { api } from '@/lib/api-client';
import { eventKeys } from './event-keys';

/** The events the user can see, newest first. */
export function getEvents({ signal }: { signal?: AbortSignal } = {}): Promise<{ items: SeasonEvent[]; count: number }> {
  return api.get('/api/events', { signal });
}

export function eventsQueryOptions() {
  return queryOptions({ queryKey: eventKeys.list(), queryFn: ({ signal }) => getEvents({ signal }) });
}

export function useEvents() {
  return useQuery(eventsQueryOptions());
}
