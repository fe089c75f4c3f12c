import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Suggestion } from '@shared/collab/suggestion.schema';
import { api } from '@/lib/api-client';
import { suggestionKeys } from './suggestion-keys';

export function getSuggestion(suggestionId: string, { signal }: { signal?: AbortSignal } = {}): Promise<Suggestion> {
  return api.get(`/api/suggestions/${encodeURIComponent(suggestionId)}`, { signal });
}

export function suggestionQueryOptions(suggestionId: string) {
  return queryOptions({
    queryKey: suggestionKeys.detail(suggestionId),
    queryFn: ({ signal }) => getSuggestion(suggestionId, { signal }),
    // The page says "not found" itself.
    meta: { errorsShownInline: true },
  });
}

export function useSuggestion(suggestionId: string) {
  return useQuery(suggestionQueryOptions(suggestionId));
}
