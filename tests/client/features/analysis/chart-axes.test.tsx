// @vitest-environment jsdom
import { cleanup, render, screen } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import type { SeasonResult } from '@shared/analysis/analysis.schema';
import { SeasonTimeline } from '@/features/analysis/components/season-timeline';
import { chartGiven, layOutChart, tickLabels } from '../../chart-layout';

vi.mock('react-chartjs-2', async () => (await import('../../chart-layout')).chartStandIn);

afterEach(cleanup);

const driver = { id: 'a1111111-1111-4111-8111-111111111111', displayName: 'Maren Holt' };
// Five events from 12 April to 20 September. The chart pads each axis past its data: the dates by 4 % of the span
// (161 days, so 6.4 days: 5 April to 26 September), the times by a tenth of their range.
const BESTS: [string, number][] = [['2026-04-12', 46.453], ['2026-05-03', 51.335], ['2026-06-07', 48.617], ['2026-07-19', 53.187], ['2026-09-20', 44.301]];
const SEASON: SeasonResult = {
  carId: 'c1111111-1111-4111-8111-111111111111',
  events: BESTS.map(([date, best], i) => ({
    eventId: `e${i}111111-1111-4111-8111-111111111111`, name: `Round ${i + 1}`, date, venue: null,
    drivers: [{ driver, bestRawSec: best, bestAdjustedSec: best, runCount: 6, cones: 0, classPosition: null }],
  })),
  setupChanges: [],
  changeLog: [],
  tyreLife: [],
};

describe('the season timeline\'s axes, as Chart.js lays them out', () => {
  it('when the season runs 12 April to 20 September, then the date axis is ticked on the first of each month within it, labelled by month', async () => {
    render(<SeasonTimeline season={SEASON} renderChanges={() => null} />);
    await screen.findByRole('img', { name: /Best adjusted time per event/ });
    const chart = layOutChart(chartGiven('Best adjusted time per event'));
    const x = chart.scales.x!;
    expect(x.ticks.map((t) => new Date(t.value).toDateString())).toEqual(
      [5, 6, 7, 8, 9].map((m) => new Date(2026, m - 1, 1).toDateString()),
    );
    expect(tickLabels(chart, 'x')).toEqual(['May', 'Jun', 'Jul', 'Aug', 'Sep']);
    chart.destroy();
  });

  it('when the time axis is padded past the data, then its ticks are whole steps only, not the padded ends', async () => {
    render(<SeasonTimeline season={SEASON} renderChanges={() => null} />);
    await screen.findByRole('img', { name: /Best adjusted time per event/ });
    const chart = layOutChart(chartGiven('Best adjusted time per event'));
    const y = chart.scales.y!;
    // The ends: 44.301 − 0.8886 and 53.187 + 0.8886 (a tenth of the range), neither a round number.
    expect(y.min).toBeCloseTo(44.301 - (53.187 - 44.301) * 0.1, 9);
    expect(y.max).toBeCloseTo(53.187 + (53.187 - 44.301) * 0.1, 9);
    const values = y.ticks.map((t) => t.value);
    expect(values.length).toBeGreaterThanOrEqual(3);
    const step = values[1]! - values[0]!;
    for (const v of values) expect(Math.abs(v / step - Math.round(v / step))).toBeLessThan(1e-9);
    expect(values).not.toContain(y.min);
    expect(values).not.toContain(y.max);
    // Labelled as the round numbers they are, not as run times to the thousandth ("46", not "46.000").
    expect(tickLabels(chart, 'y')).toEqual(values.map((v) => String(v)));
    chart.destroy();
  });
});
