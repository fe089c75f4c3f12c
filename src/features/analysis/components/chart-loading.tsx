import type { ChartSeries } from './analysis-chart';
import { ChartLegend } from './chart-legend';

const nothingHidden: ReadonlySet<string> = new Set();
const wait = () => undefined;

/**
 * Stands in for a chart while its code (chart.js, in its own chunk) arrives: a box the canvas's size and, below
 * it, the chart's key already written out but not yet pressable, so nothing under the chart moves when it lands.
 */
export function ChartLoading({ series }: { series: readonly ChartSeries[] }) {
  return (
    <div className="flex flex-col gap-2">
      <div className="flex h-80 items-center justify-center rounded border border-dashed border-line-strong text-ink-muted sm:h-96">
        Loading the chart…
      </div>
      <ChartLegend series={series} hidden={nothingHidden} onToggle={wait} onShowAll={wait} disabled />
    </div>
  );
}
