import { useMutation, useQueryClient } from '@tanstack/react-query';
import type * as z from '@shared/zod';
import type { addCoDriverInputSchema, Car } from '@shared/season/car.schema';
import { api } from '@/lib/api-client';
import { carKeys } from './car-keys';
import { refreshAfterWrite } from '@/lib/refresh-after-write';

export type AddCoDriverInput = z.output<typeof addCoDriverInputSchema>;

/** Adds the person with this e-mail as a co-driver (owner only); answers the car as it is now. */
export function addCoDriver(carId: string, input: AddCoDriverInput): Promise<Car> {
  return api.post(`/api/cars/${encodeURIComponent(carId)}/co-drivers`, input);
}

/**
 * An online write: it needs the server to find the account, so it is tried at once (never
 * paused for later) and its errors — a field error, no connection — are shown on the form.
 */
export function useAddCoDriver(carId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: AddCoDriverInput) => addCoDriver(carId, input),
    networkMode: 'always',
    meta: { errorsShownInline: true },
    onSuccess: (car) => {
      queryClient.setQueryData(carKeys.detail(carId), car);
      return refreshAfterWrite(queryClient, { queryKey: carKeys.all });
    },
  });
}
