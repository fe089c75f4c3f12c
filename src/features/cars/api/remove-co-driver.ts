import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { carKeys } from './car-keys';
import { refreshAfterWrite } from '@/lib/refresh-after-write';

export function removeCoDriver(carId: string, userId: string): Promise<void> {
  return api.delete(`/api/cars/${encodeURIComponent(carId)}/co-drivers/${encodeURIComponent(userId)}`);
}

/** Takes a co-driver off the car (owner only); an online write, its errors shown where it was asked. */
export function useRemoveCoDriver(carId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (userId: string) => removeCoDriver(carId, userId),
    networkMode: 'always',
    meta: { errorsShownInline: true },
    onSuccess: () => refreshAfterWrite(queryClient, { queryKey: carKeys.all }),
  });
}
