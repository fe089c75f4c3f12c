import { queryOptions, useQuery } from '@tanstack/react-query';
import type { SeasonEvent } from '@shared/season/event.schema';
import { api } from '@/lib/api-client';
import { eventKeys } from './event-keys';
import { firstReads } from '@shared/api/first-reads';

export function getEvent(eventId: string, { signal }: { signal?: AbortSignal } = {}): Promise<SeasonEvent> {
  return api.get(firstReads.event(eventId), { signal });
}

export function eventQueryOptions(eventId: string) {
  return queryOptions({ queryKey: eventKeys.detail(eventId), queryFn: ({ signal }) => getEvent(eventId, { signal }) });
}

/** `enabled: false` while the event is only on this phone: the server cannot know it yet. */
export function useEvent(eventId: string, { enabled = true }: { enabled?: boolean } = {}) {
  return useQuery({ ...eventQueryOptions(eventId), enabled });
}
