/** Every key of the shop page's queries: the user's shops, one shop, its customers. */
export const shopKeys = {
  all: ['shops'] as const,
  mine: () => [...shopKeys.all, 'mine'] as const,
  detail: (shopId: string) => [...shopKeys.all, 'detail', shopId] as const,
  customers: (shopId: string) => [...shopKeys.all, 'detail', shopId, 'customers'] as const,
};
