export const carKeys = {
  all: ['cars'] as const,
  list: () => [...carKeys.all, 'list'] as const,
  detail: (carId: string) => [...carKeys.all, 'detail', carId] as const,
};
