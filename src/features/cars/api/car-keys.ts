export const carKeys = {
  all: ['cars'] as const,
  list: () => [...carKeys.all, 'list'] as const,
};
