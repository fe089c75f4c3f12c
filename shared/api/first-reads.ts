/**
 * The addresses of the reads a page makes before it can draw. The client asks for them here, and the
 * server names the same addresses in the page's document (`<link rel="preload" as="fetch">`,
 * server/lib/page-preload.ts): a preloaded answer is taken only by a request for the very same
 * address, query order included, so both sides build them with these.
 */
export const firstReads = {
  me: '/api/auth/session',
  cars: '/api/cars',
  event: (eventId: string) => `/api/events/${encodeURIComponent(eventId)}`,
  setups: (carId: string) => `/api/cars/${encodeURIComponent(carId)}/setups`,
  runs: ({ carId, eventId }: { carId: string; eventId: string }) => `/api/runs?${new URLSearchParams({ carId, eventId }).toString()}`,
} as const;
