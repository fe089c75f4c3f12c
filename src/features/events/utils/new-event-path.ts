import { paths } from '@/config/paths';

/** The events page opens its new-event form with this search parameter (`/events?new=1`). */
export const NEW_EVENT_PARAM = 'new';

/** Where "New event" and "Start today's event" lead. */
export const NEW_EVENT_PATH = `${paths.events}?${NEW_EVENT_PARAM}=1`;
