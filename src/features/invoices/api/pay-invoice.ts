import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CheckoutRedirect, Invoice, MarkPaidInput } from '@shared/service/invoice.schema';
import { api, isApiError } from '@/lib/api-client';
import { invoiceKeys } from './invoice-keys';
import { refreshAfterWrite } from '@/lib/refresh-after-write';
import { workOrderKeys } from '@/features/work-orders/api/work-order-keys';

export function makeInvoice(workOrderId: string): Promise<Invoice> {
  return api.post(`/api/work-orders/${encodeURIComponent(workOrderId)}/invoice`);
}

export function startCheckout(invoiceId: string): Promise<CheckoutRedirect> {
  return api.post(`/api/invoices/${encodeURIComponent(invoiceId)}/checkout`);
}

export function markPaid(invoiceId: string, input: MarkPaidInput): Promise<Invoice> {
  return api.post(`/api/invoices/${encodeURIComponent(invoiceId)}/mark-paid`, input);
}

/**
 * An invoice as the server now has it, wherever the app shows it: on its visit, on its own page, and as a line
 * of the shop's book and of the visit lists, which are read again.
 */
function keepInvoice(queryClient: ReturnType<typeof useQueryClient>, invoice: Invoice) {
  if (invoice.workOrderId) queryClient.setQueryData(invoiceKeys.ofWorkOrder(invoice.workOrderId), invoice);
  queryClient.setQueryData(invoiceKeys.detail(invoice.id), invoice);
  void refreshAfterWrite(queryClient, { queryKey: invoiceKeys.shops() });
  void refreshAfterWrite(queryClient, { queryKey: [...workOrderKeys.all, 'shop'] });
  void refreshAfterWrite(queryClient, { queryKey: [...workOrderKeys.all, 'car'] });
}

/** Staff make the invoice for a closed visit (making it again answers the same one). */
export function useMakeInvoice(workOrderId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => makeInvoice(workOrderId),
    networkMode: 'always',
    meta: { errorsShownInline: true },
    onSuccess: (invoice) => keepInvoice(queryClient, invoice),
  });
}

/** Leaving the app for the hosted checkout; one object so a test can watch it. */
export const checkoutNavigation = {
  go: (url: string) => window.location.assign(url),
};

/** A 409 means the invoice changed elsewhere (paid meanwhile): read it again, so the page says so. */
function rereadOnConflict(queryClient: ReturnType<typeof useQueryClient>) {
  return (error: unknown) => {
    if (isApiError(error) && error.status === 409) void refreshAfterWrite(queryClient, { queryKey: invoiceKeys.all });
  };
}

/** The driver is sent to the hosted checkout; the page they come back to reads the result. */
export function useStartCheckout() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (invoiceId: string) => startCheckout(invoiceId),
    networkMode: 'always',
    meta: { errorsShownInline: true },
    onSuccess: ({ url }) => checkoutNavigation.go(url),
    onError: rereadOnConflict(queryClient),
  });
}

/** Staff took the money over the counter. */
export function useMarkPaidInCash() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (invoiceId: string) => markPaid(invoiceId, { method: 'cash' }),
    networkMode: 'always',
    meta: { errorsShownInline: true },
    onSuccess: (invoice) => keepInvoice(queryClient, invoice),
    onError: rereadOnConflict(queryClient),
  });
}
