import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { carKeys } from './car-keys';

export function deleteCar(carId: string): Promise<void> {
  return api.delete(`/api/cars/${encodeURIComponent(carId)}`);
}

/** Deletes the car and its whole season (owner only); every answer kept about it is dropped. */
export function useDeleteCar(carId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => deleteCar(carId),
    networkMode: 'always',
    meta: { errorsShownInline: true },
    onSuccess: () => {
      queryClient.removeQueries({ queryKey: carKeys.detail(carId) });
      return queryClient.invalidateQueries();
    },
  });
}
