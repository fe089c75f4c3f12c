/** Stands in for a chart while its code (chart.js, in its own chunk) arrives. */
export function ChartLoading() {
  return (
    <div className="flex h-80 items-center justify-center rounded border border-dashed border-line-strong text-ink-muted sm:h-96">
      Loading the chart…
    </div>
  );
}
