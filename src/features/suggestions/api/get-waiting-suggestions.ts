import { queryOptions, useQuery } from '@tanstack/react-query';
import type { WaitingSuggestion } from '@shared/collab/suggestion.schema';
import { api } from '@/lib/api-client';
import { suggestionKeys } from './suggestion-keys';

/** The open suggestions on the cars the user drives, oldest first: what waits for their decision. */
export function getWaitingSuggestions({ signal }: { signal?: AbortSignal } = {}): Promise<{ items: WaitingSuggestion[]; count: number }> {
  return api.get('/api/suggestions/waiting', { signal });
}

export function waitingSuggestionsQueryOptions() {
  return queryOptions({
    queryKey: suggestionKeys.waiting(),
    queryFn: ({ signal }) => getWaitingSuggestions({ signal }),
    // A Home extra: when it cannot be loaded, the cars' own pages still list every suggestion.
    meta: { errorsShownInline: true },
  });
}

export function useWaitingSuggestions({ enabled = true }: { enabled?: boolean } = {}) {
  return useQuery({ ...waitingSuggestionsQueryOptions(), enabled });
}
