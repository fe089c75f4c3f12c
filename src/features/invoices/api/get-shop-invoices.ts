import { useQuery } from '@tanstack/react-query';
import type { InvoiceStatus, ShopInvoiceRow } from '@shared/service/invoice.schema';
import { api } from '@/lib/api-client';
import { invoiceKeys } from './invoice-keys';

/** The shop's invoice book, newest number first: all, or only the open (not paid) or paid ones. */
export function useShopInvoices(shopId: string, status?: InvoiceStatus) {
  return useQuery({
    queryKey: invoiceKeys.ofShop(shopId, status),
    queryFn: ({ signal }) =>
      api.get<{ items: ShopInvoiceRow[]; count: number }>(`/api/shops/${encodeURIComponent(shopId)}/invoices${status ? `?status=${status}` : ''}`, { signal }),
    meta: { errorsShownInline: true },
  });
}
