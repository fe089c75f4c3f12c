/*
 * The one module that imports chart.js. Sections load it with React.lazy, so chart.js lands in a chunk of its own
 * that only the season review page asks for — never in the trackside bundle.
 */
import { useState } from 'react';
import {
  Chart as ChartJS,
  LinearScale,
  LineElement,
  PointElement,
  ScatterController,
  Tooltip,
  type ChartData,
  type ChartOptions,
  type Plugin,
  type TooltipItem,
} from 'chart.js';
import { Scatter } from 'react-chartjs-2';
import { isHollow, type MarkerShape } from '../utils/series-styles';
import { ChartLegend } from './chart-legend';

// Only the pieces these charts use: the scatter controller (which also draws the fitted and per-driver lines),
// linear axes, points, lines and the tooltip. The key is ours, in HTML below the canvas: Chart.js's own gives a
// bottom legend at most half the chart's height and cuts the rest off on a narrow screen.
ChartJS.register(ScatterController, LinearScale, PointElement, LineElement, Tooltip);

export interface ChartSeries {
  label: string;
  /** A hex colour, or null for the theme's ink colour. */
  color: string | null;
  shape: MarkerShape | 'line';
  /** The marker as text, for the key below the chart (a series drawn as a line alone shows its line there). */
  glyph?: string;
  /** Points in the plotted units; `lines` is what the tooltip says about the point. */
  points: { x: number; y: number; lines: string[] }[];
  /** Join the points with a line (a fitted line, a driver's season). */
  line?: 'solid' | 'dashed';
  /** Draw no markers (a fitted line). */
  hidePoints?: boolean;
  /** Draw a vertical line across the plot at each point (a setup change, a change-log entry). */
  verticalLines?: 'dashed' | 'dotted';
  /** Turn the marker, e.g. 180 for a triangle pointing down. */
  rotation?: number;
}

export interface ChartAxis {
  title: string;
  format: (value: number) => string;
  min?: number;
  max?: number;
  /** Where the ticks go; without them, Chart.js's own round steps. */
  ticks?: readonly number[];
  /** Room beyond the data at each end when min and max are not given, e.g. "5%" of the range. */
  grace?: string;
}

interface AnalysisChartProps {
  series: ChartSeries[];
  x: ChartAxis;
  y: ChartAxis;
  /** Read out for the canvas; the data itself is in the table beside it. */
  summary: string;
}

function themeColour(name: string, fallback: string): string {
  if (typeof window === 'undefined') return fallback;
  const value = window.getComputedStyle(document.documentElement).getPropertyValue(`--sl-${name}`).trim();
  return value || fallback;
}

const DASH = { dashed: [6, 4], dotted: [2, 3] } as const;

/** Vertical lines at the x of every point of a series that asks for them, behind the data. */
const verticalLines: Plugin<'scatter'> = {
  id: 'scrublineVerticalLines',
  beforeDatasetsDraw(chart) {
    const xScale = chart.scales.x;
    if (!xScale) return;
    const { ctx, chartArea } = chart;
    ctx.save();
    ctx.lineWidth = 1.5;
    chart.data.datasets.forEach((dataset) => {
      const style = (dataset as { scrublineVertical?: 'dashed' | 'dotted' }).scrublineVertical;
      if (!style) return;
      ctx.setLineDash([...DASH[style]]);
      ctx.strokeStyle = String(dataset.borderColor);
      for (const point of dataset.data) {
        if (point === null || typeof point !== 'object' || point.x === null) continue;
        const px = xScale.getPixelForValue(point.x);
        if (px < chartArea.left || px > chartArea.right) continue;
        ctx.beginPath();
        ctx.moveTo(px, chartArea.top);
        ctx.lineTo(px, chartArea.bottom);
        ctx.stroke();
      }
    });
    ctx.restore();
  },
};

/** A scatter plot (with optional joined series and markers) in the page's colours, with its key below it. */
export function AnalysisChart({ series, x, y, summary }: AnalysisChartProps) {
  const [hidden, setHidden] = useState<ReadonlySet<string>>(() => new Set());
  const toggle = (label: string) =>
    setHidden((was) => {
      const next = new Set(was);
      if (!next.delete(label)) next.add(label);
      return next;
    });
  const ink = themeColour('ink', '#131a24');
  const muted = themeColour('ink-muted', '#4a5566');
  const grid = themeColour('line', '#d3dae3');

  const data: ChartData<'scatter'> = {
    datasets: series.map((s) => {
      const colour = s.color ?? ink;
      return {
        label: s.label,
        hidden: hidden.has(s.label),
        data: s.points.map((p) => ({ x: p.x, y: p.y })),
        backgroundColor: colour,
        pointBackgroundColor: isHollow(s.shape) ? 'transparent' : colour,
        borderColor: colour,
        pointStyle: s.shape === 'line' ? 'line' : s.shape,
        pointRotation: s.rotation ?? 0,
        pointRadius: s.hidePoints ? 0 : 6,
        pointHoverRadius: s.hidePoints ? 0 : 8,
        pointHitRadius: s.hidePoints ? 0 : 8,
        pointBorderWidth: 2,
        showLine: s.line !== undefined,
        borderDash: s.line === 'dashed' ? [...DASH.dashed] : [],
        borderWidth: 2,
        clip: s.verticalLines ? false : undefined,
        // Read by the vertical-lines plugin above.
        scrublineVertical: s.verticalLines,
      };
    }),
  };

  const lines = (item: TooltipItem<'scatter'>) => series[item.datasetIndex]?.points[item.dataIndex]?.lines ?? [];

  // Ticks at round steps only: with a set min and max, Chart.js would also label the two ends (e.g. 42.645 and 54.358).
  const axis = (a: ChartAxis) => ({
    type: 'linear' as const,
    min: a.min,
    max: a.max,
    grace: a.grace,
    title: { display: true, text: a.title, color: ink },
    ticks: { color: muted, includeBounds: false, callback: (value: number | string) => a.format(Number(value)) },
    grid: { color: grid },
    afterBuildTicks: a.ticks
      ? (scale: { ticks: { value: number }[] }) => {
          scale.ticks = a.ticks!.map((value) => ({ value }));
        }
      : undefined,
  });

  const options: ChartOptions<'scatter'> = {
    animation: false,
    maintainAspectRatio: false,
    interaction: { mode: 'nearest', intersect: true },
    scales: { x: axis(x), y: axis(y) },
    plugins: {
      tooltip: {
        filter: (item) => !series[item.datasetIndex]?.hidePoints,
        callbacks: {
          title: (items) => (items[0] ? (lines(items[0])[0] ?? '') : ''),
          label: (item) => lines(item).slice(1),
        },
      },
    },
  };

  return (
    <div className="flex flex-col gap-2">
      <div className="relative h-80 w-full sm:h-96">
        <Scatter data={data} options={options} plugins={[verticalLines]} role="img" aria-label={summary} />
      </div>
      <ChartLegend series={series} hidden={hidden} onToggle={toggle} onShowAll={() => setHidden(new Set())} />
    </div>
  );
}
