import { eachDayOfInterval, eachMonthOfInterval, eachWeekOfInterval, format } from 'date-fns';

/**
 * Ticks for a time axis that a reader can name: the first of each month when the span holds two or more,
 * else each Monday, else each day (local time, as dates are shown). Only those within the axis's ends.
 */
export function timeTicks(min: number, max: number): number[] {
  const interval = { start: min, end: max };
  const within = (dates: Date[]) => dates.map((d) => d.getTime()).filter((t) => t >= min && t <= max);
  const months = within(eachMonthOfInterval(interval));
  if (months.length >= 2) return months;
  const weeks = within(eachWeekOfInterval(interval, { weekStartsOn: 1 }));
  if (weeks.length >= 2) return weeks;
  return within(eachDayOfInterval(interval));
}

/** How to label those ticks: "Apr" for month starts in one year, "Apr 2026" across years, "Apr 13" for weeks and days. */
export function timeTickLabel(ticks: readonly number[]): (value: number) => string {
  const monthly = ticks.length >= 2 && ticks.every((t) => new Date(t).getDate() === 1);
  const years = new Set(ticks.map((t) => new Date(t).getFullYear()));
  const pattern = monthly ? (years.size > 1 ? 'MMM yyyy' : 'MMM') : 'MMM d';
  return (value) => format(value, pattern);
}
