import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { grantKeys } from './grant-keys';
import { refreshAfterWrite } from '@/lib/refresh-after-write';

export function revokeShop(carId: string, shopId: string): Promise<void> {
  return api.delete(`/api/cars/${encodeURIComponent(carId)}/shop-grants/${encodeURIComponent(shopId)}`);
}

/** The owner takes a shop's access away. */
export function useRevokeShop(carId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (shopId: string) => revokeShop(carId, shopId),
    networkMode: 'always',
    meta: { errorsShownInline: true },
    onSuccess: () => refreshAfterWrite(queryClient, { queryKey: grantKeys.ofCar(carId) }),
  });
}
