export const runKeys = {
  all: ['runs'] as const,
  list: (filter: { carId: string; eventId: string }) => [...runKeys.all, 'list', filter] as const,
};
