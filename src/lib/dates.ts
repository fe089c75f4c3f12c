import { intlFormat, isToday, parseISO } from 'date-fns';

/*
 * Dates and times for people, in the browser's locale (date-fns' intlFormat uses the platform's
 * Intl, so a user in Germany reads 12.6.2026 and one in the US 6/12/2026).
 */

const toDate = (value: string | Date) => (typeof value === 'string' ? parseISO(value) : value);

/** "12 Jun 2026" */
export function formatDay(value: string | Date): string {
  return intlFormat(toDate(value), { day: 'numeric', month: 'short', year: 'numeric' });
}

/** "Sat, 12 Jun 2026" */
export function formatLongDay(value: string | Date): string {
  return intlFormat(toDate(value), { weekday: 'short', day: 'numeric', month: 'short', year: 'numeric' });
}

/** "12 Jun 2026, 09:42" */
export function formatDateTime(value: string | Date): string {
  return intlFormat(toDate(value), { day: 'numeric', month: 'short', year: 'numeric', hour: '2-digit', minute: '2-digit' });
}

/** "09:42" */
export function formatClock(value: string | Date): string {
  return intlFormat(toDate(value), { hour: '2-digit', minute: '2-digit' });
}

/** Whether a calendar date ("2026-06-12") is today on this device. */
export function isTodayDate(isoDate: string): boolean {
  return isToday(parseISO(isoDate));
}

const pad = (n: number) => String(n).padStart(2, '0');
// Machine formats for inputs, built by hand: date-fns' format() would pull its whole locale into the trackside page.
const localDay = (d: Date) => `${d.getFullYear()}-${pad(d.getMonth() + 1)}-${pad(d.getDate())}`;

/** Today on this device as "2026-06-12". */
export function todayIsoDate(): string {
  return localDay(new Date());
}

/** A moment as a datetime-local input's value, in this device's time zone: "2026-06-12T09:42". */
export function toLocalInputValue(value: string | Date): string {
  const d = toDate(value);
  return `${localDay(d)}T${pad(d.getHours())}:${pad(d.getMinutes())}`;
}

/** A datetime-local input's value as an ISO timestamp; null when empty or not a date. */
export function fromLocalInputValue(value: string): string | null {
  if (!value) return null;
  const date = new Date(value);
  return Number.isNaN(date.getTime()) ? null : date.toISOString();
}
