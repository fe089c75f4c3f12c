import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Invoice } from '@shared/service/invoice.schema';
import { api, isApiError } from '@/lib/api-client';
import { invoiceKeys } from './invoice-keys';

/** The work order's invoice, or null when none has been made yet. */
export async function getWorkOrderInvoice(workOrderId: string, { signal }: { signal?: AbortSignal } = {}): Promise<Invoice | null> {
  try {
    return await api.get<Invoice>(`/api/work-orders/${encodeURIComponent(workOrderId)}/invoice`, { signal });
  } catch (error) {
    if (isApiError(error) && error.status === 404) return null;
    throw error;
  }
}

export function workOrderInvoiceQueryOptions(workOrderId: string) {
  return queryOptions({
    queryKey: invoiceKeys.ofWorkOrder(workOrderId),
    queryFn: ({ signal }) => getWorkOrderInvoice(workOrderId, { signal }),
    meta: { errorsShownInline: true },
  });
}

/** Asks again every `everyMs`, at most `tries` more times, until the invoice reads paid. */
export interface PollUntilPaid {
  everyMs: number;
  tries: number;
}

export function useWorkOrderInvoice(workOrderId: string, { pollUntilPaid = null }: { pollUntilPaid?: PollUntilPaid | null } = {}) {
  return useQuery({
    ...workOrderInvoiceQueryOptions(workOrderId),
    refetchInterval: (query) =>
      pollUntilPaid && query.state.data?.status !== 'paid' && query.state.dataUpdateCount <= pollUntilPaid.tries
        ? pollUntilPaid.everyMs
        : false,
  });
}

/** One invoice by its id: the shop's record, kept after its visit is gone. */
export function useInvoice(invoiceId: string) {
  return useQuery({
    queryKey: invoiceKeys.detail(invoiceId),
    queryFn: ({ signal }) => api.get<Invoice>(`/api/invoices/${encodeURIComponent(invoiceId)}`, { signal }),
    meta: { errorsShownInline: true },
  });
}
