export const eventKeys = {
  all: ['events'] as const,
  list: () => [...eventKeys.all, 'list'] as const,
  detail: (eventId: string) => [...eventKeys.all, 'detail', eventId] as const,
};
