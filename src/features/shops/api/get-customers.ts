import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Customer } from '@shared/collab/shop.schema';
import { api } from '@/lib/api-client';
import { shopKeys } from './shop-keys';

/** The cars granted to the shop, each with what happened last. */
export function getCustomers(shopId: string, { signal }: { signal?: AbortSignal } = {}): Promise<{ items: Customer[]; count: number }> {
  return api.get(`/api/shops/${encodeURIComponent(shopId)}/customers`, { signal });
}

export function customersQueryOptions(shopId: string) {
  return queryOptions({
    queryKey: shopKeys.customers(shopId),
    queryFn: ({ signal }) => getCustomers(shopId, { signal }),
    // The screen says so itself when this cannot be loaded.
    meta: { errorsShownInline: true },
  });
}

export function useCustomers(shopId: string) {
  return useQuery(customersQueryOptions(shopId));
}
