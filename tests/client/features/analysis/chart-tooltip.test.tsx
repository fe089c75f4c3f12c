// @vitest-environment jsdom
import { cleanup, render } from '@testing-library/react';
import type { Chart } from 'chart.js';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { AnalysisChart, type ChartSeries } from '@/features/analysis/components/analysis-chart';
import { chartGiven, layOutChart } from '../../chart-layout';

vi.mock('react-chartjs-2', async () => (await import('../../chart-layout')).chartStandIn);

afterEach(cleanup);

const LINES = [
  'Tallow Creek MC — Spring Round 1, Apr 12, 2026',
  'Over 6 runs',
  'Setup: Quick change: rear clicks +2 and front camber −0.5°',
  'Camber (°): −1.50°',
  "Off the day's best (%): +1.23 %",
];

/** Three points: near the right edge high up, in the middle low down, and near the left edge high up. */
const SERIES: ChartSeries[] = [
  {
    label: 'Tallow Creek MC — Spring Round 1 (Apr 12, 2026)',
    color: '#E69F00',
    shape: 'circle',
    points: [
      { x: 9.5, y: 6.5, lines: LINES },
      { x: 5, y: 3, lines: LINES },
      { x: 0.5, y: 6.5, lines: LINES },
    ],
  },
];

/** The chart as Chart.js lays it out at this width, its text 7 px a character (jsdom measures no text). */
function chartAt(width: number): Chart<'scatter'> {
  render(
    <AnalysisChart
      series={SERIES}
      x={{ title: 'Camber (°)', format: String, min: 0, max: 10 }}
      y={{ title: "Off the day's best (%)", format: String, min: 0, max: 10 }}
      summary="Scatter plot for the tooltip"
    />,
  );
  const chart = layOutChart(chartGiven('Scatter plot for the tooltip'), { width, height: 320 });
  Object.assign(chart.ctx, { measureText: (text: string) => ({ width: text.length * 7 }) });
  return chart;
}

/** The tooltip Chart.js draws when the point is tapped. */
function tapped(chart: Chart<'scatter'>, index: number) {
  const point = chart.getDatasetMeta(0).data[index]!;
  chart.tooltip!.setActiveElements([{ datasetIndex: 0, index }], { x: point.x, y: point.y });
  const { x, y, width, height, title, body, caretY, yAlign } = chart.tooltip!;
  return { x, y, width, height, title, lines: body.flatMap((b) => b.lines), caretY, yAlign, pointY: point.y };
}

describe("the charts' tooltips", () => {
  it('when a point near the right edge is tapped on a phone, then the long lines wrap (the event line after its name) and the whole tooltip stays on the canvas; on a wide chart they stay whole', () => {
    const phone = chartAt(324);
    const tip = tapped(phone, 0);
    expect(tip.title).toEqual(['Tallow Creek MC — Spring Round 1,', 'Apr 12, 2026']);
    expect(tip.lines.join(' ')).toBe(LINES.slice(1).join(' '));
    expect(tip.lines.length).toBeGreaterThan(LINES.length - 1);
    expect(tip.x).toBeGreaterThanOrEqual(0);
    expect(tip.x + tip.width).toBeLessThanOrEqual(324);
    phone.destroy();
    cleanup();

    const wide = chartAt(900);
    const whole = tapped(wide, 0);
    expect(whole.title).toEqual([LINES[0]]);
    expect(whole.lines).toEqual(LINES.slice(1));
    wide.destroy();
  });

  it("when a point in the plot's upper half is tapped, then the tooltip opens below it, and above a point in the lower half, never over it", () => {
    const chart = chartAt(324);

    for (const index of [0, 2]) {
      const high = tapped(chart, index);
      expect(high.yAlign).toBe('top');
      expect(high.y).toBeGreaterThan(high.pointY);
    }
    const low = tapped(chart, 1);
    expect(low.yAlign).toBe('bottom');
    expect(low.y + low.height).toBeLessThan(low.pointY);
    chart.destroy();
  });
});
