import { useMutation, useQueryClient } from '@tanstack/react-query';
import type {
  BuildSheetInput,
  CloseWorkOrderInput,
  MeasurementsInput,
  ReplaceLinesInput,
  Stage,
  WorkOrder,
} from '@shared/service/work-order.schema';
import { api } from '@/lib/api-client';
import { workOrderKeys } from './work-order-keys';
import { refreshAfterWrite } from '@/lib/refresh-after-write';

const base = (workOrderId: string) => `/api/work-orders/${encodeURIComponent(workOrderId)}`;

export function replaceLines(workOrderId: string, input: ReplaceLinesInput): Promise<WorkOrder> {
  return api.put(`${base(workOrderId)}/lines`, input);
}

export function putMeasurements(workOrderId: string, stage: Stage, input: MeasurementsInput): Promise<WorkOrder> {
  return api.put(`${base(workOrderId)}/measurements/${stage}`, input);
}

export function putBuildSheet(workOrderId: string, input: BuildSheetInput): Promise<WorkOrder> {
  return api.put(`${base(workOrderId)}/build-sheet`, input);
}

export function closeWorkOrder(workOrderId: string, input: CloseWorkOrderInput): Promise<WorkOrder> {
  return api.post(`${base(workOrderId)}/close`, input);
}

/** Every edit answers the whole work order: show it at once, and refresh the lists it appears in. */
function useEdit<I>(workOrderId: string, send: (input: I) => Promise<WorkOrder>) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: send,
    networkMode: 'always',
    meta: { errorsShownInline: true },
    onSuccess: (workOrder) => {
      queryClient.setQueryData(workOrderKeys.detail(workOrderId), workOrder);
      return Promise.all([
        refreshAfterWrite(queryClient, { queryKey: [...workOrderKeys.all, 'car'] }),
        refreshAfterWrite(queryClient, { queryKey: [...workOrderKeys.all, 'shop'] }),
      ]);
    },
  });
}

export const useReplaceLines = (workOrderId: string) =>
  useEdit(workOrderId, (input: ReplaceLinesInput) => replaceLines(workOrderId, input));

export const usePutMeasurements = (workOrderId: string, stage: Stage) =>
  useEdit(workOrderId, (input: MeasurementsInput) => putMeasurements(workOrderId, stage, input));

export const usePutBuildSheet = (workOrderId: string) =>
  useEdit(workOrderId, (input: BuildSheetInput) => putBuildSheet(workOrderId, input));

export const useCloseWorkOrder = (workOrderId: string) =>
  useEdit(workOrderId, (input: CloseWorkOrderInput) => closeWorkOrder(workOrderId, input));
