import type { SeasonEvent } from '@shared/season/event.schema';
import { isTodayDate } from '@/lib/dates';

/** Today's event if there is one, else the latest (the list comes newest first). */
export function currentEvent<T extends Pick<SeasonEvent, 'date'>>(events: readonly T[]): { event: T; isToday: boolean } | null {
  const today = events.find((e) => isTodayDate(e.date));
  if (today) return { event: today, isToday: true };
  const latest = events[0];
  return latest ? { event: latest, isToday: false } : null;
}
