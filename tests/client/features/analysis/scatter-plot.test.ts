import { describe, expect, it } from 'vitest';
import type { ScatterPoint, ScatterResult } from '@shared/analysis/analysis.schema';
import { METRIC_PREFERENCES } from '@shared/calc/units.calc';
import { xAxis, yAxis } from '@/features/analysis/utils/analysis-format';
import { buildScatterPlot } from '@/features/analysis/utils/scatter-plot';
import { seriesStyle } from '@/features/analysis/utils/series-styles';

const EVENTS = [
  { eventId: 'e1', eventName: 'Round 1', eventDate: '2026-04-12' },
  { eventId: 'e2', eventName: 'Round 2', eventDate: '2026-05-03' },
  { eventId: 'e3', eventName: 'Round 3', eventDate: '2026-06-07' },
];

const point = (event: (typeof EVENTS)[number], x: number, y: number): ScatterPoint => ({
  x, y, xNormalized: null, runId: null, driver: null, runNumber: null, runs: 5, setupId: null, setupLabel: null, corner: 'lf', ...event,
});

function plotOf(points: ScatterPoint[], eventIds?: string[]) {
  const result: ScatterResult = {
    x: { param: 'camber', corner: 'front', unit: '°' },
    y: { metric: 'wear', unit: 'mm/run', description: '' },
    points,
    n: points.length,
    fit: null,
    ...(eventIds ? { eventIds } : {}),
  };
  return buildScatterPlot(result, xAxis(result, METRIC_PREFERENCES, false), yAxis(result, METRIC_PREFERENCES));
}

describe('the scatter plot\'s series', () => {
  it('when a plot has no point at the season\'s second event, then the third keeps its own marker, the one it has in a plot with all three', () => {
    const all = plotOf([point(EVENTS[0]!, -1.2, 0.05), point(EVENTS[1]!, -1.2, 0.06), point(EVENTS[2]!, -2.4, 0.04)], ['e1', 'e2', 'e3']);
    const gap = plotOf([point(EVENTS[0]!, -1.2, 0.05), point(EVENTS[2]!, -2.4, 0.04)], ['e1', 'e2', 'e3']);
    const third = (plot: ReturnType<typeof plotOf>) => plot.series.find((s) => s.key === 'e3')!.style;
    expect(third(gap)).toEqual(third(all));
    expect(third(gap)).toEqual(seriesStyle(2));
    expect(gap.series.map((s) => s.key)).toEqual(['e1', 'e3']);
  });

  it('when an answer lists no events (an older server), then the events present are styled in date order', () => {
    const plot = plotOf([point(EVENTS[2]!, -2.4, 0.04), point(EVENTS[0]!, -1.2, 0.05)]);
    expect(plot.series.map((s) => [s.key, s.style])).toEqual([['e1', seriesStyle(0)], ['e3', seriesStyle(1)]]);
  });
});
