/** Every work-order query key. */
export const workOrderKeys = {
  all: ['work-orders'] as const,
  ofCar: (carId: string) => [...workOrderKeys.all, 'car', carId] as const,
  ofShop: (shopId: string, status?: string) => [...workOrderKeys.all, 'shop', shopId, status ?? 'all'] as const,
  detail: (workOrderId: string) => [...workOrderKeys.all, 'detail', workOrderId] as const,
};
