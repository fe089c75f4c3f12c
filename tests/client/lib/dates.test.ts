import { endOfDay, intlFormat, isSameDay, isToday, parseISO } from 'date-fns';
import { describe, expect, it } from 'vitest';
import { formatClock, formatDateTime, formatDay, formatLongDay, formatShortDay, isDayEnd, isOnDate, isTodayDate, parseIsoDate, runMoment, toLocalInputValue } from '@/lib/dates';

// The app reads and shows dates without date-fns (a few KB less on every page); date-fns, an
// independent library from npm, is the reference each case is checked against.
const DATES = ['2026-06-12', '2024-02-29', '1999-12-31', '0026-06-12', '2026-03-29', '2026-10-25', '2026-09-06'];
const TIMESTAMPS = [
  '2026-06-12T09:30:00Z', '2026-06-12T09:30:00.123Z', '2026-06-12T09:30:00+02:00', '2026-06-12T23:59:59-07:00',
  '2026-06-12T09:30', '2026-06-12T09:30:00', '2026-06-12 09:30:00', '2026-03-29T01:30:00', '2026-03-29T02:30:00', '2026-03-08T02:30:00', '2026-10-25T02:30:00',
];
const NOT_DATES = ['2026-02-29', '2026-13-01', '2026-00-10', '2026-04-31', '2026-6-1', 'nope', ''];
const time = (d: Date) => d.getTime();

describe('parseIsoDate', () => {
  it.each([...DATES, ...TIMESTAMPS])('when %j is read, then it is the moment date-fns parseISO reads', (value) => {
    expect(time(parseIsoDate(value))).toBe(time(parseISO(value)));
  });

  it.each(NOT_DATES)('when %j is read, then it is an Invalid Date, as with parseISO', (value) => {
    expect(Number.isNaN(time(parseIsoDate(value)))).toBe(true);
    expect(Number.isNaN(time(parseISO(value)))).toBe(true);
  });
});

describe('formatting', () => {
  it.each([...DATES, ...TIMESTAMPS])('when %j is shown, then it reads as date-fns intlFormat shows it', (value) => {
    const d = parseISO(value);
    expect(formatDay(value)).toBe(intlFormat(d, { day: 'numeric', month: 'short', year: 'numeric' }));
    expect(formatShortDay(value)).toBe(intlFormat(d, { day: 'numeric', month: 'short' }));
    expect(formatLongDay(value)).toBe(intlFormat(d, { weekday: 'short', day: 'numeric', month: 'short', year: 'numeric' }));
    expect(formatDateTime(value)).toBe(intlFormat(d, { day: 'numeric', month: 'short', year: 'numeric', hour: '2-digit', minute: '2-digit' }));
    expect(formatClock(value)).toBe(intlFormat(d, { hour: '2-digit', minute: '2-digit' }));
  });

  it('when a calendar date is today or not, then isTodayDate agrees with date-fns isToday', () => {
    const today = toLocalInputValue(new Date()).slice(0, 10);
    for (const value of [today, '2026-06-12', '1999-12-31']) expect(isTodayDate(value)).toBe(isToday(parseISO(value)));
  });

  it.each(TIMESTAMPS)('when %j is checked against the days around it, then isOnDate agrees with date-fns isSameDay', (value) => {
    const d = parseISO(value);
    const local = toLocalInputValue(d).slice(0, 10);
    const [y, m, day] = local.split('-').map(Number) as [number, number, number];
    const around = [-1, 0, 1].map((k) => toLocalInputValue(new Date(y, m - 1, day + k, 12)).slice(0, 10));
    for (const date of around) expect(isOnDate(value, date)).toBe(isSameDay(d, parseISO(date)));
    expect(around.filter((date) => isOnDate(value, date))).toEqual([local]);
  });
});

describe('runMoment', () => {
  it.each(DATES)('when a run is logged at an event on %j after that day, then it counts at the day\'s last moment, date-fns endOfDay', (date) => {
    const end = endOfDay(parseISO(date));
    const later = new Date(end.getTime() + 1);
    expect(runMoment(date, later)).toEqual({ at: end, dayOver: true });
    expect(isDayEnd(runMoment(date, later).at)).toBe(true);
    expect(isDayEnd(runMoment(date, later).at.toISOString())).toBe(true);
  });

  it.each(DATES)('when a run is logged at an event on %j during that day or before it, then it counts now', (date) => {
    const end = endOfDay(parseISO(date));
    for (const now of [end, new Date(end.getTime() - 1), parseISO(date), new Date(parseISO(date).getTime() - 86_400_000)]) {
      expect(runMoment(date, now)).toEqual({ at: now, dayOver: false });
    }
  });

  it('when the event\'s date cannot be read, then the run counts now', () => {
    const now = new Date();
    expect(runMoment('2026-02-30', now)).toEqual({ at: now, dayOver: false });
  });

  it.each(TIMESTAMPS)('when %j is checked, then it is not taken for a day\'s end, nor is the millisecond before one', (value) => {
    expect(isDayEnd(value)).toBe(false);
    expect(isDayEnd(new Date(endOfDay(parseISO(value)).getTime() - 1))).toBe(false);
  });
});
