import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ShopGrant } from '@shared/collab/shop.schema';
import { api } from '@/lib/api-client';
import { grantKeys } from './grant-keys';

/** The shops the car's owner has let see the car's season. */
export function getShopGrants(carId: string, { signal }: { signal?: AbortSignal } = {}): Promise<{ items: ShopGrant[]; count: number }> {
  return api.get(`/api/cars/${encodeURIComponent(carId)}/shop-grants`, { signal });
}

export function shopGrantsQueryOptions(carId: string) {
  return queryOptions({
    queryKey: grantKeys.ofCar(carId),
    queryFn: ({ signal }) => getShopGrants(carId, { signal }),
    // The screen says so itself when this cannot be loaded.
    meta: { errorsShownInline: true },
  });
}

export function useShopGrants(carId: string) {
  return useQuery(shopGrantsQueryOptions(carId));
}
