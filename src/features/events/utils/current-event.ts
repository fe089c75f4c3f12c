import type { SeasonEvent } from '@shared/season/event.schema';
import { isTodayDate } from '@/lib/dates';

/**
 * Today's event if there is one; else the next one planned (the soonest after today); else the latest one before
 * today (the list comes newest first). `upcoming` says it is a planned one, not one that has been.
 */
export function currentEvent<T extends Pick<SeasonEvent, 'date'>>(events: readonly T[]): { event: T; isToday: boolean; upcoming: boolean } | null {
  const today = events.find((e) => isTodayDate(e.date));
  if (today) return { event: today, isToday: true, upcoming: false };
  const d = new Date();
  // This device's calendar date, as the events' dates are written ("2026-06-12").
  const now = `${d.getFullYear()}-${String(d.getMonth() + 1).padStart(2, '0')}-${String(d.getDate()).padStart(2, '0')}`;
  const next = events.filter((e) => e.date > now).at(-1);
  if (next) return { event: next, isToday: false, upcoming: true };
  const latest = events[0];
  return latest ? { event: latest, isToday: false, upcoming: false } : null;
}

/** The words above the event on Home and on Event day. */
export const currentEventCaption = (c: { isToday: boolean; upcoming: boolean }) => (c.isToday ? 'Today' : c.upcoming ? 'Next event' : 'Latest event');
