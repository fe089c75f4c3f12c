// @vitest-environment jsdom
import { cleanup, render, screen } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { TrendChart } from '@/features/teams/components/trend-chart';
import { chartGiven, layOutChart, tickLabels } from '../../chart-layout';

vi.mock('react-chartjs-2', async () => (await import('../../chart-layout')).chartStandIn);

afterEach(cleanup);

const PCT_OFF = [0, 0, 0, 0, 1.41, 0.79, 1.09, 1.11];
const DAYS = ['12 Apr', '26 Apr', '10 May', '24 May', '14 Jun', '28 Jun', '12 Jul', '26 Jul'];

describe('the class board\'s trend line, as Chart.js lays it out', () => {
  it('when a car has eight events, then the event axis names each by its day, one tick per event and none at the padding', () => {
    render(<TrendChart points={PCT_OFF.map((y, i) => ({ x: i + 1, y, tick: DAYS[i]!, label: `Event ${i + 1}` }))} summary="Trend" />);
    screen.getByRole('img', { name: 'Trend' });
    const chart = layOutChart(chartGiven('Trend'), { width: 384, height: 128 });
    expect(chart.scales.x!.ticks.map((t) => t.value)).toEqual([1, 2, 3, 4, 5, 6, 7, 8]);
    expect(tickLabels(chart, 'x')).toEqual(DAYS);
    chart.destroy();
  });

  it('when a car has one event, then that event alone is ticked, with its day', () => {
    render(<TrendChart points={[{ x: 1, y: 0.4, tick: '7 Jun', label: 'Event 1' }]} summary="Trend" />);
    const chart = layOutChart(chartGiven('Trend'), { width: 384, height: 128 });
    expect(tickLabels(chart, 'x')).toEqual(['7 Jun']);
    chart.destroy();
  });
});
