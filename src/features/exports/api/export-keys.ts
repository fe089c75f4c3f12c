export const exportKeys = {
  all: ['exports'] as const,
  /** One setup snapshot, read for its printable sheet. */
  setup: (setupId: string) => [...exportKeys.all, 'setup', setupId] as const,
};
