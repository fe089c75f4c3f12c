import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { ShopSummary } from '@shared/collab/shop.schema';
import { api } from '@/lib/api-client';
import { grantKeys } from './grant-keys';

/** Shops whose name matches, to pick one to grant. */
export function searchShops(q: string, { signal }: { signal?: AbortSignal } = {}): Promise<{ items: ShopSummary[]; count: number }> {
  return api.get(`/api/shops?${new URLSearchParams({ q }).toString()}`, { signal });
}

export function searchShopsQueryOptions(q: string) {
  return queryOptions({
    queryKey: grantKeys.search(q),
    queryFn: ({ signal }) => searchShops(q, { signal }),
    meta: { errorsShownInline: true },
  });
}

/** Asks only once at least two letters are typed; keeps the last answer in view while the next one comes. */
export function useShopSearch(q: string) {
  const term = q.trim();
  return useQuery({ ...searchShopsQueryOptions(term), enabled: term.length >= 2, placeholderData: keepPreviousData });
}
