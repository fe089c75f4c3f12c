import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Suggestion } from '@shared/collab/suggestion.schema';
import { api } from '@/lib/api-client';
import { suggestionKeys } from './suggestion-keys';

/** The setup changes shops have suggested for one car, newest first. */
export function getSuggestions(carId: string, { signal }: { signal?: AbortSignal } = {}): Promise<{ items: Suggestion[]; count: number }> {
  return api.get(`/api/cars/${encodeURIComponent(carId)}/suggestions`, { signal });
}

export function suggestionsQueryOptions(carId: string) {
  return queryOptions({
    queryKey: suggestionKeys.ofCar(carId),
    queryFn: ({ signal }) => getSuggestions(carId, { signal }),
    // The screen says so itself when this cannot be loaded.
    meta: { errorsShownInline: true },
  });
}

export function useSuggestions(carId: string) {
  return useQuery(suggestionsQueryOptions(carId));
}
