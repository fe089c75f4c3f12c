/** Every invoice query key. */
export const invoiceKeys = {
  all: ['invoices'] as const,
  ofWorkOrder: (workOrderId: string) => [...invoiceKeys.all, 'work-order', workOrderId] as const,
  detail: (invoiceId: string) => [...invoiceKeys.all, 'detail', invoiceId] as const,
  shops: () => [...invoiceKeys.all, 'shop'] as const,
  ofShop: (shopId: string, status?: string) => [...invoiceKeys.shops(), shopId, status ?? 'all'] as const,
};
