import { queryOptions, useQuery } from '@tanstack/react-query';
import type { WorkOrder } from '@shared/service/work-order.schema';
import { api } from '@/lib/api-client';
import { workOrderKeys } from './work-order-keys';

export function getWorkOrder(workOrderId: string, { signal }: { signal?: AbortSignal } = {}): Promise<WorkOrder> {
  return api.get(`/api/work-orders/${encodeURIComponent(workOrderId)}`, { signal });
}

export function workOrderQueryOptions(workOrderId: string) {
  return queryOptions({
    queryKey: workOrderKeys.detail(workOrderId),
    queryFn: ({ signal }) => getWorkOrder(workOrderId, { signal }),
    // The page says "not found" itself.
    meta: { errorsShownInline: true },
  });
}

export function useWorkOrder(workOrderId: string) {
  return useQuery(workOrderQueryOptions(workOrderId));
}
