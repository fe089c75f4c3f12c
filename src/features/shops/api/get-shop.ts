import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Shop } from '@shared/collab/shop.schema';
import { api } from '@/lib/api-client';
import { shopKeys } from './shop-keys';

/** One shop as its staff see it: staff, pending invitations, and the user's standing. */
export function getShop(shopId: string, { signal }: { signal?: AbortSignal } = {}): Promise<Shop> {
  return api.get(`/api/shops/${encodeURIComponent(shopId)}`, { signal });
}

export function shopQueryOptions(shopId: string) {
  return queryOptions({
    queryKey: shopKeys.detail(shopId),
    queryFn: ({ signal }) => getShop(shopId, { signal }),
    // The screen says so itself when this cannot be loaded.
    meta: { errorsShownInline: true },
  });
}

export function useShop(shopId: string) {
  return useQuery(shopQueryOptions(shopId));
}
