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
  type ChartType,
  type FontSpec,
  type Plugin,
  type TooltipItem,
  type TooltipModel,
  type TooltipPositionerFunction,
} from 'chart.js';
import { toFont } from 'chart.js/helpers';
import { Scatter } from 'react-chartjs-2';
import { isHollow, type MarkerShape } from '../utils/series-styles';
import { ChartLegend } from './chart-legend';

// Only the pieces these charts use: the scatter controller (which also draws the fitted and per-driver lines),
// linear axes, points, lines and the tooltip. The key is ours, in HTML below the canvas: Chart.js's own gives a
// bottom legend at most half the chart's height and cuts the rest off on a narrow screen.
ChartJS.register(ScatterController, LinearScale, PointElement, LineElement, Tooltip);

declare module 'chart.js' {
  interface TooltipPositionerMap {
    aboveOrBelow: TooltipPositionerFunction<ChartType>;
  }
}

/**
 * The tooltip centred over its point, below it when the point is in the plot's upper half and above it otherwise.
 * Chart.js's own choice puts a wide tooltip beside the point, or on top of it when there is no room beside it, as
 * on a phone; centred, it is then kept inside the canvas (as long as it is narrower: see `wrapLine`).
 */
Tooltip.positioners.aboveOrBelow = function (items, eventPosition) {
  const at = Tooltip.positioners.nearest.call(this, items, eventPosition);
  if (!at) return false;
  const { top, bottom } = this.chart.chartArea;
  const y = at.y ?? (top + bottom) / 2;
  return { x: at.x, y, xAlign: 'center', yAlign: y < (top + bottom) / 2 ? 'top' : 'bottom' };
};

/**
 * A tooltip line in lines that each fit `fits`: broken after the first comma that leaves a first line short
 * enough ("Tallow Creek MC — Spring Round 1," / "Apr 12, 2026"), else between words. A single word wider than
 * the room stays whole.
 */
function wrapLine(text: string, fits: (line: string) => boolean): string[] {
  const lines: string[] = [];
  let rest = text;
  while (!fits(rest)) {
    let cut = -1;
    for (let i = rest.indexOf(', '); i !== -1; i = rest.indexOf(', ', i + 1)) {
      if (fits(rest.slice(0, i + 1))) {
        cut = i + 1;
        break;
      }
    }
    if (cut === -1) {
      for (let i = rest.lastIndexOf(' '); i > 0; i = rest.lastIndexOf(' ', i - 1)) {
        if (fits(rest.slice(0, i))) {
          cut = i;
          break;
        }
      }
    }
    if (cut <= 0) break;
    lines.push(rest.slice(0, cut).trimEnd());
    rest = rest.slice(cut).trimStart();
  }
  lines.push(rest);
  return lines;
}

/** The tooltip's box and type, set here so that the lines can be measured as Chart.js will draw them. */
const TIP = {
  padding: 8,
  titleFont: { size: 13, weight: 'bold' as const },
  bodyFont: { size: 13 },
  /** The series' colour swatch before the first line of the body (Chart.js adds 2 px to it), and the gap after it. */
  boxWidth: 12,
  boxPadding: 4,
};

/** Tells whether a line of the tooltip, in the given font, fits the canvas's width less the tooltip's own room. */
function fitsTooltip(tooltip: TooltipModel<'scatter'>, font: Partial<FontSpec>, besideText = 0) {
  const { ctx, width } = tooltip.chart;
  // A little short of the canvas's width, so the box never touches its edges.
  const room = width - 2 * TIP.padding - besideText - 8;
  const fontString = toFont(font).string;
  return (line: string) => {
    ctx.save();
    ctx.font = fontString;
    const measured = ctx.measureText(line).width;
    ctx.restore();
    return measured <= room;
  };
}

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
  /** Edge the marker in the theme's ink: a pale colour that would not stand out from the background alone. */
  outlined?: boolean;
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
        pointBorderColor: s.outlined ? ink : colour,
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
        position: 'aboveOrBelow',
        padding: TIP.padding,
        titleFont: TIP.titleFont,
        bodyFont: TIP.bodyFont,
        boxWidth: TIP.boxWidth,
        boxHeight: TIP.boxWidth,
        boxPadding: TIP.boxPadding,
        callbacks: {
          // Long lines wrap to the canvas's width, so the tooltip stays whole on a phone.
          title(items) {
            const title = items[0] ? (lines(items[0])[0] ?? '') : '';
            return wrapLine(title, fitsTooltip(this, TIP.titleFont));
          },
          label(item) {
            const fits = fitsTooltip(this, TIP.bodyFont, TIP.boxWidth + 2 + TIP.boxPadding);
            return lines(item)
              .slice(1)
              .flatMap((line) => wrapLine(line, fits));
          },
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
