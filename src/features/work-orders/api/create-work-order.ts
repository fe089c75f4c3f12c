import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CreateWorkOrderInput, WorkOrder } from '@shared/service/work-order.schema';
import { api } from '@/lib/api-client';
import { workOrderKeys } from './work-order-keys';
import { refreshAfterWrite } from '@/lib/refresh-after-write';

/** Always sent with an id made on the device, so sending twice never opens two visits. */
export type CreateWorkOrderBody = CreateWorkOrderInput & { id: string };

export function createWorkOrder(carId: string, body: CreateWorkOrderBody): Promise<WorkOrder> {
  return api.post(`/api/cars/${encodeURIComponent(carId)}/work-orders`, body);
}

/** Shop staff open a visit for a customer's car. */
export function useCreateWorkOrder(carId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: CreateWorkOrderBody) => createWorkOrder(carId, body),
    networkMode: 'always',
    meta: { errorsShownInline: true },
    onSuccess: () => refreshAfterWrite(queryClient, { queryKey: workOrderKeys.all }),
  });
}
