import type { ScatterResult } from '@shared/analysis/analysis.schema';
import { formatDay } from '@/lib/dates';
import type { Axis } from './analysis-format';
import { seriesStyle, type ColourScheme, type SeriesStyle } from './series-styles';

/** One plotted point, in the plotted units; `index` points back into the answer's `points`. */
export interface PlotPoint {
  x: number;
  y: number;
  index: number;
}

/** One event's points, drawn in its own colour and shape. */
export interface PlotSeries {
  key: string;
  label: string;
  style: SeriesStyle;
  points: PlotPoint[];
}

export interface ScatterPlot {
  series: PlotSeries[];
  /** The two ends of the least-squares line, in the plotted units; null when the server fitted none. */
  fit: { x: number; y: number }[] | null;
}

/**
 * Groups the points by event (oldest event first, each in its season place's colour and shape, so an event keeps
 * them in every plot and as the season grows) and
 * converts them to the plotted units. The fitted line is drawn between the lowest and highest setting: its ends are
 * the server's line evaluated there, converted like the points (every conversion here is proportional, and the
 * clicks share is a straight-line function of the clicks, so the line stays straight). The colours are the ones for
 * the page's colour scheme.
 */
export function buildScatterPlot(result: ScatterResult, x: Axis, y: Axis, scheme: ColourScheme = 'light'): ScatterPlot {
  const groups = new Map<string, { label: string; date: string; points: PlotPoint[] }>();
  result.points.forEach((p, index) => {
    const px = x.value(p);
    const py = y.value(p);
    if (px === null || py === null || !Number.isFinite(px) || !Number.isFinite(py)) return;
    const key = p.eventId ?? 'none';
    const label = p.eventName ? `${p.eventName}${p.eventDate ? ` (${formatDay(p.eventDate)})` : ''}` : 'No event';
    const group = groups.get(key) ?? { label, date: p.eventDate ?? '', points: [] };
    group.points.push({ x: px, y: py, index });
    groups.set(key, group);
  });
  // The event's place in the car's season, not in this plot: a plot without some event's points (no clean run, an
  // interval left out) would otherwise hand its marker to the next event.
  const seasonOrder = result.eventIds ?? [];
  const series = [...groups.entries()]
    .sort(([, a], [, b]) => a.date.localeCompare(b.date))
    .map(([key, g], i) => ({ key, label: g.label, style: seriesStyle(seasonOrder.includes(key) ? seasonOrder.indexOf(key) : i, scheme), points: g.points }));

  let fit: ScatterPlot['fit'] = null;
  if (result.fit && result.points.length > 0) {
    const { slope, intercept } = result.fit;
    let low = result.points[0]!;
    let high = low;
    for (const p of result.points) {
      if (p.x < low.x) low = p;
      if (p.x > high.x) high = p;
    }
    const lowX = x.value(low);
    const highX = x.value(high);
    if (lowX !== null && highX !== null && low.x !== high.x) {
      fit = [
        { x: lowX, y: y.fromSi(slope * low.x + intercept) },
        { x: highX, y: y.fromSi(slope * high.x + intercept) },
      ];
    }
  }
  return { series, fit };
}

/**
 * An axis on which only whole values exist (clicks): from half a step below the lowest plotted value to half a
 * step above the highest, ticked at each whole value between, so no tick reads "6.4 clicks" and no point sits on
 * the plot's edge.
 */
export function wholeStepAxis(plot: ScatterPlot): { min: number; max: number; ticks: number[] } | null {
  const xs = plot.series.flatMap((s) => s.points.map((p) => p.x));
  if (xs.length === 0) return null;
  const low = Math.floor(Math.min(...xs));
  const high = Math.ceil(Math.max(...xs));
  return { min: low - 0.5, max: high + 0.5, ticks: Array.from({ length: high - low + 1 }, (_, i) => low + i) };
}
