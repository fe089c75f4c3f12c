/** Every invoice query key. */
export const invoiceKeys = {
  all: ['invoices'] as const,
  ofWorkOrder: (workOrderId: string) => [...invoiceKeys.all, 'work-order', workOrderId] as const,
};
