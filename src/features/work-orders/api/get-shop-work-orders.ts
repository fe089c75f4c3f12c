import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ShopWorkOrderRow, WorkOrderStatus } from '@shared/service/work-order.schema';
import { api } from '@/lib/api-client';
import { workOrderKeys } from './work-order-keys';

/** The shop's board: its work orders, optionally only the open or the closed ones. */
export function getShopWorkOrders(
  shopId: string,
  status: WorkOrderStatus | undefined,
  { signal }: { signal?: AbortSignal } = {},
): Promise<{ items: ShopWorkOrderRow[]; count: number }> {
  const query = status ? `?status=${status}` : '';
  return api.get(`/api/shops/${encodeURIComponent(shopId)}/work-orders${query}`, { signal });
}

export function shopWorkOrdersQueryOptions(shopId: string, status?: WorkOrderStatus) {
  return queryOptions({
    queryKey: workOrderKeys.ofShop(shopId, status),
    queryFn: ({ signal }) => getShopWorkOrders(shopId, status, { signal }),
    meta: { errorsShownInline: true },
  });
}

export function useShopWorkOrders(shopId: string, status?: WorkOrderStatus) {
  return useQuery(shopWorkOrdersQueryOptions(shopId, status));
}
