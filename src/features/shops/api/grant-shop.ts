import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { GrantShopInput } from '@shared/collab/shop.schema';
import { api } from '@/lib/api-client';
import { grantKeys } from './grant-keys';
import { refreshAfterWrite } from '@/lib/refresh-after-write';

export function grantShop(carId: string, input: GrantShopInput): Promise<unknown> {
  return api.post(`/api/cars/${encodeURIComponent(carId)}/shop-grants`, input);
}

/** The owner lets a shop in (an online write; errors are shown where it was asked). */
export function useGrantShop(carId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: GrantShopInput) => grantShop(carId, input),
    networkMode: 'always',
    meta: { errorsShownInline: true },
    onSuccess: () => refreshAfterWrite(queryClient, { queryKey: grantKeys.ofCar(carId) }),
  });
}
