import { describe, expect, it } from 'vitest';
import { clsOf, totalBlockingTime } from '../../scripts/lib/page-speed';

const task = (start: number, duration: number) => ({ start, end: start + duration });

describe('page-speed metrics', () => {
  it('when five long tasks run after the first paint, then TBT is the sum of each one\'s time over 50 ms', () => {
    // web.dev, "Total Blocking Time (TBT)" (https://web.dev/articles/tbt), worked example (from memory): tasks of
    // 250, 90, 35, 30 and 155 ms block for 200, 40, 0, 0 and 105 ms, a TBT of 345 ms.
    const tasks = [task(1000, 250), task(1400, 90), task(1600, 35), task(1700, 30), task(2000, 155)];
    expect(totalBlockingTime(tasks, 900, 5000)).toBe(345);
  });

  it('when a long task straddles the first paint or the end, then only its part inside counts', () => {
    // Common practice (Lighthouse counts between FCP and TTI): 120 ms of a task inside the span blocks 70 ms.
    expect(totalBlockingTime([task(900, 200)], 980, 5000)).toBe(70);
    expect(totalBlockingTime([task(4900, 200)], 0, 5020)).toBe(70);
    expect(totalBlockingTime([task(100, 40)], 0, 5000)).toBe(0);
  });

  it('when shifts come in bursts, then CLS is the largest session window: gaps under 1 s, at most 5 s long', () => {
    // web.dev, "Cumulative Layout Shift (CLS)" (https://web.dev/articles/cls): a session window closes after 1 s
    // with no shift or after 5 s in all; CLS is the largest window's sum.
    const burst = [{ time: 0, value: 0.05 }, { time: 400, value: 0.05 }, { time: 3000, value: 0.02 }, { time: 3500, value: 0.02 }];
    expect(clsOf(burst)).toBeCloseTo(0.1, 10);
    // A shift every 900 ms keeps one window open, but only for 5 s: shifts at 0…4500 ms (six of them), then a new window.
    const steady = Array.from({ length: 10 }, (_, i) => ({ time: i * 900, value: 0.01 }));
    expect(clsOf(steady)).toBeCloseTo(0.06, 10);
    expect(clsOf([])).toBe(0);
  });
});
