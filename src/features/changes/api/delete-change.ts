import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { refreshAfterWrite } from '@/lib/refresh-after-write';

export function deleteChange(carId: string, changeId: string): Promise<void> {
  return api.delete(`/api/cars/${encodeURIComponent(carId)}/changes/${encodeURIComponent(changeId)}`);
}

/** Deletes a mistaken change-log entry (drivers of the car; it needs signal); the comparisons built on it are read again. */
export function useDeleteChange(carId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (changeId: string) => deleteChange(carId, changeId),
    networkMode: 'always',
    meta: { errorsShownInline: true },
    onSuccess: () => refreshAfterWrite(queryClient, {}),
  });
}
