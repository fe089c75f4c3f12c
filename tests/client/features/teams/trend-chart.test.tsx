// @vitest-environment jsdom
import { cleanup, render, screen } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { TrendChart } from '@/features/teams/components/trend-chart';
import { chartGiven, layOutChart, tickLabels } from '../../chart-layout';

vi.mock('react-chartjs-2', async () => (await import('../../chart-layout')).chartStandIn);

afterEach(cleanup);

const PCT_OFF = [0, 0, 0, 0, 1.41, 0.79, 1.09, 1.11];

describe('the class board\'s trend line, as Chart.js lays it out', () => {
  it('when a car has eight events, then the event axis is numbered 1 to 8, one tick per event and none at the padding', () => {
    render(<TrendChart points={PCT_OFF.map((y, i) => ({ x: i + 1, y, label: `Event ${i + 1}` }))} summary="Trend" />);
    screen.getByRole('img', { name: 'Trend' });
    const chart = layOutChart(chartGiven('Trend'), { width: 384, height: 128 });
    expect(chart.scales.x!.ticks.map((t) => t.value)).toEqual([1, 2, 3, 4, 5, 6, 7, 8]);
    expect(tickLabels(chart, 'x')).toEqual(['1', '2', '3', '4', '5', '6', '7', '8']);
    chart.destroy();
  });

  it('when a car has one event, then that event alone is ticked', () => {
    render(<TrendChart points={[{ x: 1, y: 0.4, label: 'Event 1' }]} summary="Trend" />);
    const chart = layOutChart(chartGiven('Trend'), { width: 384, height: 128 });
    expect(tickLabels(chart, 'x')).toEqual(['1']);
    chart.destroy();
  });
});
