import { queryOptions, useQuery } from '@tanstack/react-query';
import type { MyShop } from '@shared/collab/shop.schema';
import { api } from '@/lib/api-client';
import { shopKeys } from './shop-keys';

/** The shops the user staffs. */
export function getMyShops({ signal }: { signal?: AbortSignal } = {}): Promise<{ items: MyShop[]; count: number }> {
  return api.get('/api/shops/mine', { signal });
}

export function myShopsQueryOptions() {
  return queryOptions({
    queryKey: shopKeys.mine(),
    queryFn: ({ signal }) => getMyShops({ signal }),
    // The screen says so itself when this cannot be loaded.
    meta: { errorsShownInline: true },
  });
}

export function useMyShops() {
  return useQuery(myShopsQueryOptions());
}
