import { queryOptions, useQuery } from '@tanstack/react-query';
import type { CarWorkOrderSummary } from '@shared/service/work-order.schema';
import { api } from '@/lib/api-client';
import { workOrderKeys } from './work-order-keys';

/** The car's shop visits, for its timeline. */
export function getCarWorkOrders(carId: string, { signal }: { signal?: AbortSignal } = {}): Promise<{ items: CarWorkOrderSummary[]; count: number }> {
  return api.get(`/api/cars/${encodeURIComponent(carId)}/work-orders`, { signal });
}

export function carWorkOrdersQueryOptions(carId: string) {
  return queryOptions({
    queryKey: workOrderKeys.ofCar(carId),
    queryFn: ({ signal }) => getCarWorkOrders(carId, { signal }),
    meta: { errorsShownInline: true },
  });
}

export function useCarWorkOrders(carId: string) {
  return useQuery(carWorkOrdersQueryOptions(carId));
}
