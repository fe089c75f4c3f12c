import { BasicPlatform, Chart, type ChartConfiguration } from 'chart.js';

/** What a page hands react-chartjs-2's `Scatter`: its data and options. */
export type ScatterProps = Pick<ChartConfiguration<'scatter'>, 'data' | 'options'>;

/**
 * Chart.js 4 laying out a page's chart with no real canvas (jsdom has none): BasicPlatform, and a 2D context whose
 * methods do nothing and whose text is 10 px wide. The scales' ticks are then Chart.js's own, from the page's options.
 * The caller registers the controller and scales, as the page's chart module does on import.
 */
export function layOutChart(config: ScatterProps, size = { width: 390, height: 320 }): Chart<'scatter'> {
  const canvas: Record<string, unknown> = { ...size, style: {}, addEventListener() {}, removeEventListener() {} };
  const context = new Proxy({ canvas } as Record<string | symbol, unknown>, {
    get: (target, key) => (key in target ? target[key] : key === 'measureText' ? () => ({ width: 10 }) : () => undefined),
  });
  canvas.getContext = () => context;
  return new Chart(canvas as unknown as HTMLCanvasElement, {
    type: 'scatter',
    platform: BasicPlatform,
    data: config.data,
    options: { ...config.options, responsive: false },
  });
}

/** The label a scale's tick callback gives each of its ticks. */
export function tickLabels(chart: Chart<'scatter'>, axis: 'x' | 'y'): string[] {
  const scale = chart.scales[axis]!;
  const callback = (scale.options as unknown as { ticks: { callback: (this: unknown, value: number, index: number, ticks: unknown[]) => string } }).ticks.callback;
  return scale.ticks.map((t, i) => String(callback.call(scale, t.value, i, scale.ticks)));
}

/** What each chart on the page was last given, by its description (`aria-label`). */
export const chartsGiven = new Map<string, ScatterProps>();

/** What the chart whose description starts so was last given. */
export function chartGiven(start = ''): ScatterProps {
  const found = [...chartsGiven].find(([label]) => label.startsWith(start));
  if (!found) throw new Error(`No chart described as "${start}…" was drawn`);
  return found[1];
}

/**
 * Stands in for react-chartjs-2 (a canvas draws nothing in jsdom): shows each dataset's label and number of points,
 * and keeps what the chart was given. Use as `vi.mock('react-chartjs-2', async () => (await import('…/chart-layout')).chartStandIn)`.
 */
export const chartStandIn = {
  Scatter: (props: ScatterProps & { 'aria-label'?: string }) => {
    chartsGiven.set(props['aria-label'] ?? '', { data: props.data, options: props.options });
    return (
      <div role="img" aria-label={props['aria-label']}>
        {props.data.datasets.map((d) => `${d.label}: ${d.data.length}`).join('; ')}
      </div>
    );
  },
};
