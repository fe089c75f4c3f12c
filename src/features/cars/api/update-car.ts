import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Car, UpdateCarInput } from '@shared/season/car.schema';
import { api } from '@/lib/api-client';
import { refreshAfterWrite } from '@/lib/refresh-after-write';
import { carKeys } from './car-keys';

export function updateCar(carId: string, body: UpdateCarInput): Promise<Car> {
  return api.patch(`/api/cars/${encodeURIComponent(carId)}`, body);
}

/**
 * Saves the car's own details (owner only). An online write: a stale version comes back as a 409, and the car
 * is read again so the form can start from what is stored now.
 */
export function useUpdateCar(carId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: UpdateCarInput) => updateCar(carId, body),
    networkMode: 'always',
    meta: { errorsShownInline: true },
    onSettled: () => refreshAfterWrite(queryClient, { queryKey: carKeys.all }),
  });
}
