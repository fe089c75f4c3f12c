import { describe, expect, it } from 'vitest';
import { timeTickLabel, timeTicks } from '../../../../src/features/analysis/utils/time-ticks';

// Calendar facts checked against the Gregorian calendar (POSIX `date -d 2026-04-13 +%A` prints Monday);
// weeks start on Monday as in ISO 8601.
const day = (y: number, m: number, d: number) => new Date(y, m - 1, d).getTime();
const shown = (ticks: number[]) => ticks.map((t) => new Date(t).toDateString());

describe('ticks on the season timeline', () => {
  it('when the axis spans a season, then there is a tick on the first of each month inside it, and none at its ends', () => {
    const ticks = timeTicks(day(2026, 3, 26), day(2026, 9, 26));
    expect(shown(ticks)).toEqual(shown([day(2026, 4, 1), day(2026, 5, 1), day(2026, 6, 1), day(2026, 7, 1), day(2026, 8, 1), day(2026, 9, 1)]));
    expect(ticks.map(timeTickLabel(ticks))).toEqual(['Apr', 'May', 'Jun', 'Jul', 'Aug', 'Sep']);
  });

  it('when the months cross a new year, then each label carries its year', () => {
    const ticks = timeTicks(day(2025, 11, 20), day(2026, 2, 10));
    expect(ticks.map(timeTickLabel(ticks))).toEqual(['Dec 2025', 'Jan 2026', 'Feb 2026']);
  });

  it('when fewer than two months start inside it, then the ticks are Mondays', () => {
    // 2026-06-01, 06-08, 06-15 and 06-22 are Mondays; 06-01 is also the first of a month, but only one month starts here.
    const ticks = timeTicks(day(2026, 5, 29), day(2026, 6, 24));
    expect(shown(ticks)).toEqual(shown([day(2026, 6, 1), day(2026, 6, 8), day(2026, 6, 15), day(2026, 6, 22)]));
    expect(ticks.map(timeTickLabel(ticks))).toEqual(['Jun 1', 'Jun 8', 'Jun 15', 'Jun 22']);
  });

  it('when the axis holds less than two Mondays, then every day is a tick', () => {
    const ticks = timeTicks(day(2026, 4, 14), day(2026, 4, 17));
    expect(ticks.map(timeTickLabel(ticks))).toEqual(['Apr 14', 'Apr 15', 'Apr 16', 'Apr 17']);
  });
});
