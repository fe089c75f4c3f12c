import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { refreshAfterWrite } from '@/lib/refresh-after-write';

export function deleteTreadReading(tyreSetId: string, readingId: string): Promise<void> {
  return api.delete(`/api/tyre-sets/${encodeURIComponent(tyreSetId)}/readings/${encodeURIComponent(readingId)}`);
}

/**
 * Deletes a mistyped reading (drivers of the car; it needs signal). Everything worked out from readings (the
 * sets' latest, the season review's wear) is read again.
 */
export function useDeleteTreadReading(tyreSetId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (readingId: string) => deleteTreadReading(tyreSetId, readingId),
    networkMode: 'always',
    meta: { errorsShownInline: true },
    onSuccess: () => refreshAfterWrite(queryClient, {}),
  });
}
