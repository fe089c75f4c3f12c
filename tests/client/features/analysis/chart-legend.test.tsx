// @vitest-environment jsdom
import { cleanup, render, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { AnalysisChart, type ChartSeries } from '@/features/analysis/components/analysis-chart';
import { ChartLoading } from '@/features/analysis/components/chart-loading';
import { seriesStyle } from '@/features/analysis/utils/series-styles';

interface Dataset {
  label?: string;
  hidden?: boolean;
  pointStyle?: string;
  pointBackgroundColor?: string;
  borderColor?: string;
}
// The datasets the chart was last given.
const drawn = vi.hoisted(() => ({ datasets: [] as Dataset[] }));

// A canvas draws nothing in jsdom: stand in for the chart with the datasets it was given, and which are hidden.
vi.mock('react-chartjs-2', () => ({
  Scatter: (props: { 'aria-label'?: string; data: { datasets: Dataset[] } }) => {
    drawn.datasets = props.data.datasets;
    return (
      <div role="img" aria-label={props['aria-label']}>
        {props.data.datasets.map((d) => `${d.label}${d.hidden ? ' (hidden)' : ''}`).join('; ')}
      </div>
    );
  },
}));

afterEach(cleanup);

const point = (x: number, y: number) => ({ x, y, lines: [`${x}, ${y}`] });

// Nine series, as many as a full season of events and a fitted line: more than Chart.js's own legend shows on a phone.
const EVENTS = Array.from({ length: 8 }, (_, i) => `Harrow Flats — Round ${i + 1} (Apr ${i + 2}, 2026)`);
const SERIES: ChartSeries[] = [
  ...EVENTS.map((label, i) => ({ label, color: '#E69F00', shape: 'circle' as const, glyph: '●', points: [point(i, i)] })),
  { label: 'Fitted line', color: null, shape: 'line', line: 'dashed', hidePoints: true, points: [point(0, 0), point(7, 7)] },
];

function renderChart() {
  render(<AnalysisChart series={SERIES} x={{ title: 'Camber (°)', format: String }} y={{ title: '%', format: String }} summary="Scatter plot" />);
  return userEvent.setup();
}

describe('the chart key below the season review charts', () => {
  it('when a chart has nine series, then each is listed by name below the chart as a pressed toggle', () => {
    renderChart();
    const key = screen.getByRole('list', { name: 'Series on the chart' });
    const toggles = within(key).getAllByRole('button');
    expect(toggles.map((b) => b.textContent)).toEqual(SERIES.map((s) => expect.stringContaining(s.label)));
    expect(toggles.every((b) => b.getAttribute('aria-pressed') === 'true')).toBe(true);
    // Nothing is hidden yet.
    expect(screen.getByRole('img', { name: 'Scatter plot' }).textContent).not.toMatch(/hidden/);
  });

  it('when a series is pressed, then the chart hides it and its toggle is no longer pressed; "Show all" brings it back', async () => {
    const u = renderChart();
    const round3 = screen.getByRole('button', { name: EVENTS[2] });
    await u.click(round3);

    expect(round3.getAttribute('aria-pressed')).toBe('false');
    const chart = screen.getByRole('img', { name: 'Scatter plot' });
    expect(chart.textContent).toContain(`${EVENTS[2]} (hidden)`);
    expect(chart.textContent?.match(/\(hidden\)/g)).toHaveLength(1);

    await u.click(screen.getByRole('button', { name: 'Show all' }));
    expect(round3.getAttribute('aria-pressed')).toBe('true');
    expect(chart.textContent).not.toMatch(/hidden/);
    expect(screen.queryByRole('button', { name: 'Show all' })).toBeNull();
  });

  it('while the chart\'s code is on its way, then the same key is written below the placeholder, its entries not yet pressable', () => {
    render(<ChartLoading series={SERIES} />);
    const key = screen.getByRole('list', { name: 'Series on the chart' });
    const toggles = within(key).getAllByRole('button');
    expect(toggles.map((b) => b.textContent)).toEqual(SERIES.map((s) => expect.stringContaining(s.label)));
    expect(toggles.every((b) => (b as HTMLButtonElement).disabled)).toBe(true);
    expect(screen.getByText(/Tap or click a name/)).toBeTruthy();
  });

  it('when eight series take the eight shapes, then only the one whose glyph is an outline (▢) is drawn unfilled, and the rest are filled in their colour', () => {
    const styles = Array.from({ length: 8 }, (_, i) => seriesStyle(i));
    const series: ChartSeries[] = styles.map((st, i) => ({ label: `Event ${i + 1}`, color: st.color, shape: st.shape, glyph: st.glyph, points: [point(i, i)] }));
    render(<AnalysisChart series={series} x={{ title: 'x', format: String }} y={{ title: 'y', format: String }} summary="Scatter plot" />);

    const open = drawn.datasets.filter((d) => d.pointBackgroundColor === 'transparent');
    expect(open.map((d) => d.pointStyle)).toEqual(['rectRounded']);
    expect(styles.find((st) => st.shape === 'rectRounded')?.glyph).toBe('▢');
    // The outline keeps the series' colour; every other marker is filled with it.
    expect(open[0]!.borderColor).toBe(series.find((s) => s.shape === 'rectRounded')!.color);
    for (const d of drawn.datasets.filter((x) => x.pointStyle !== 'rectRounded')) expect(d.pointBackgroundColor).toBe(d.borderColor);
  });
});
