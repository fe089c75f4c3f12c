import '@tanstack/react-query';

interface ScrublineMeta extends Record<string, unknown> {
  /** The screen that asked shows this query's or mutation's errors itself (a form, a route's error page). */
  errorsShownInline?: boolean;
  /** A `null` answer means the session is gone (the "who am I" query). */
  nullMeansSignedOut?: boolean;
}

declare module '@tanstack/react-query' {
  interface Register {
    queryMeta: ScrublineMeta;
    mutationMeta: ScrublineMeta;
  }
}
