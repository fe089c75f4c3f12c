/*
 * Dates and times for people, in the browser's locale (the platform's Intl, so a user in Germany
 * reads 12.6.2026 and one in the US 6/12/2026). Written by hand rather than with date-fns, which
 * would add a few KB to every page for the same results (tests/client/lib/dates.test.ts checks
 * them against date-fns).
 */

const DATE_ONLY = /^(\d{4})-(\d{2})-(\d{2})$/;

/**
 * An ISO date or timestamp as a Date, read as date-fns' parseISO reads the ones the app stores: a
 * calendar date ("2026-06-12") is local midnight, a timestamp keeps its offset (none: local time).
 * Anything else, or a day that does not exist, is an Invalid Date.
 */
export function parseIsoDate(value: string): Date {
  const day = DATE_ONLY.exec(value);
  if (!day) return /^\d{4}-\d{2}-\d{2}[T ]\d/.test(value) ? new Date(value.replace(' ', 'T')) : new Date(Number.NaN);
  const [year, month, date] = [Number(day[1]), Number(day[2]) - 1, Number(day[3])];
  const d = new Date(0);
  d.setFullYear(year, month, date);
  d.setHours(0, 0, 0, 0);
  return d.getMonth() === month && d.getDate() === date ? d : new Date(Number.NaN);
}

const toDate = (value: string | Date) => (typeof value === 'string' ? parseIsoDate(value) : value);
// Building an Intl.DateTimeFormat costs far more than formatting with one: keep one per pattern.
const formatters: Record<string, Intl.DateTimeFormat> = {};
const intlFormat = (date: Date, options: Intl.DateTimeFormatOptions) =>
  (formatters[JSON.stringify(options)] ??= new Intl.DateTimeFormat(undefined, options)).format(date);
const sameDay = (a: Date, b: Date) => a.getFullYear() === b.getFullYear() && a.getMonth() === b.getMonth() && a.getDate() === b.getDate();

/** "12 Jun 2026" */
export function formatDay(value: string | Date): string {
  return intlFormat(toDate(value), { day: 'numeric', month: 'short', year: 'numeric' });
}

/** "12 Jun": a day within a season already named, as on a chart's axis. */
export function formatShortDay(value: string | Date): string {
  return intlFormat(toDate(value), { day: 'numeric', month: 'short' });
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

/**
 * Builds the formatters ahead of need. The browser's first one loads its locale and time-zone data
 * (about 60 ms on a desktop, four times that on a slow phone), so the app does it while it waits for
 * the device and the network rather than when the first page with dates is drawn.
 */
export function prepareDateFormats(): void {
  const d = new Date();
  formatLongDay(d);
  formatDay(d);
  formatDateTime(d);
  formatClock(d);
}

/** Whether a calendar date ("2026-06-12") is today on this device. */
export function isTodayDate(isoDate: string): boolean {
  return sameDay(parseIsoDate(isoDate), new Date());
}

/** Whether a moment falls on a calendar date ("2026-06-12") on this device. */
export function isOnDate(value: string | Date, isoDate: string): boolean {
  return sameDay(toDate(value), parseIsoDate(isoDate));
}

/**
 * When a run logged now at an event on a calendar date counts as run, which ties it to the car's setup: now,
 * until that day is over; later, the day's last millisecond, so runs typed in from notes after the event are
 * tied to the setup the car ended the day with, not today's. `dayOver` says which.
 */
export function runMoment(isoDate: string, now = new Date()): { at: Date; dayOver: boolean } {
  const end = parseIsoDate(isoDate);
  end.setHours(23, 59, 59, 999);
  return now > end ? { at: end, dayOver: true } : { at: now, dayOver: false };
}

/** Whether a moment is a day's last millisecond: a run typed in after its day, whose time of day is not known. */
export function isDayEnd(value: string | Date): boolean {
  const d = toDate(value);
  return d.getHours() === 23 && d.getMinutes() === 59 && d.getSeconds() === 59 && d.getMilliseconds() === 999;
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
