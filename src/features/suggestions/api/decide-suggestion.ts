import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { AcceptedSuggestion, AcceptSuggestionInput, DeclineSuggestionInput, Suggestion } from '@shared/collab/suggestion.schema';
import { api } from '@/lib/api-client';
import { suggestionKeys } from './suggestion-keys';
import { refreshAfterWrite } from '@/lib/refresh-after-write';

/** Always sent with the new snapshot's id made on the device, so accepting twice never records two setups. */
export type AcceptSuggestionBody = AcceptSuggestionInput & { setupId: string };

export function acceptSuggestion(suggestionId: string, body: AcceptSuggestionBody): Promise<AcceptedSuggestion> {
  return api.post(`/api/suggestions/${encodeURIComponent(suggestionId)}/accept`, body);
}

export function declineSuggestion(suggestionId: string, input: DeclineSuggestionInput): Promise<Suggestion> {
  return api.post(`/api/suggestions/${encodeURIComponent(suggestionId)}/decline`, input);
}

function useRefresh(suggestion: Pick<Suggestion, 'id' | 'carId'>) {
  const queryClient = useQueryClient();
  return () =>
    Promise.all([
      refreshAfterWrite(queryClient, { queryKey: suggestionKeys.detail(suggestion.id) }),
      refreshAfterWrite(queryClient, { queryKey: suggestionKeys.ofCar(suggestion.carId) }),
      refreshAfterWrite(queryClient, { queryKey: suggestionKeys.waiting() }),
    ]);
}

/** A driver takes the suggestion: the server records it as a new setup snapshot. */
export function useAcceptSuggestion(suggestion: Pick<Suggestion, 'id' | 'carId'>) {
  const refresh = useRefresh(suggestion);
  return useMutation({
    mutationFn: (body: AcceptSuggestionBody) => acceptSuggestion(suggestion.id, body),
    networkMode: 'always',
    meta: { errorsShownInline: true },
    onSuccess: refresh,
  });
}

/** A driver turns it down, saying why. */
export function useDeclineSuggestion(suggestion: Pick<Suggestion, 'id' | 'carId'>) {
  const refresh = useRefresh(suggestion);
  return useMutation({
    mutationFn: (input: DeclineSuggestionInput) => declineSuggestion(suggestion.id, input),
    networkMode: 'always',
    meta: { errorsShownInline: true },
    onSuccess: refresh,
  });
}
