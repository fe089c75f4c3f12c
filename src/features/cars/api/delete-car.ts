import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { carKeys } from './car-keys';

export function deleteCar(carId: string): Promise<void> {
  return api.delete(`/api/cars/${encodeURIComponent(carId)}`);
}

/** Deletes the car and its whole season (owner only). */
export function useDeleteCar(carId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => deleteCar(carId),
    networkMode: 'always',
    meta: { errorsShownInline: true },
    // Only the list is read again, and not waited for: the page leaves for it at once, and the page still shown
    // does not ask for the deleted car (a 404 would flash "Car not found" on the way out).
    onSuccess: () => void queryClient.invalidateQueries({ queryKey: carKeys.list() }),
  });
}
