import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CreateSuggestionInput, Suggestion } from '@shared/collab/suggestion.schema';
import { api } from '@/lib/api-client';
import { suggestionKeys } from './suggestion-keys';
import { refreshAfterWrite } from '@/lib/refresh-after-write';

/** Sent with an id made on the device, so sending again after a lost answer never makes two. */
export type CreateSuggestionBody = CreateSuggestionInput & { id: string };

export function createSuggestion(carId: string, body: CreateSuggestionBody): Promise<Suggestion> {
  return api.post(`/api/cars/${encodeURIComponent(carId)}/suggestions`, body);
}

/** Shop staff propose a change; the form shows the server's field errors beside their inputs. */
export function useCreateSuggestion(carId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: CreateSuggestionBody) => createSuggestion(carId, body),
    networkMode: 'always',
    meta: { errorsShownInline: true },
    onSuccess: () => refreshAfterWrite(queryClient, { queryKey: suggestionKeys.ofCar(carId) }),
  });
}
