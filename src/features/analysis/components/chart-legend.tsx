import { cn } from '@/lib/cn';
import type { ChartSeries } from './analysis-chart';

/** A series' mark as the chart draws it: its marker's glyph in its colour, or a short line for a line alone. */
function SeriesMark({ series }: { series: ChartSeries }) {
  const colour = series.color ? { color: series.color } : undefined;
  if (series.shape === 'line') {
    return (
      <svg viewBox="0 0 24 8" className="h-2 w-6 shrink-0" style={colour} aria-hidden="true" focusable="false">
        <line x1="1" y1="4" x2="23" y2="4" stroke="currentColor" strokeWidth="2.5" strokeDasharray={series.line === 'dashed' ? '6 4' : undefined} />
      </svg>
    );
  }
  return (
    <span className="w-6 shrink-0 text-center text-lg leading-none" style={colour} aria-hidden="true">
      {series.glyph ?? '●'}
    </span>
  );
}

interface ChartLegendProps {
  series: readonly ChartSeries[];
  /** Labels of the series the reader has hidden. */
  hidden: ReadonlySet<string>;
  onToggle: (label: string) => void;
  onShowAll: () => void;
  /** Drawn while the chart is still on its way: the same key, its toggles not yet working. */
  disabled?: boolean;
}

/**
 * The chart's key, written below the canvas as a list that wraps, so every series stays readable however many
 * there are and however narrow the screen. Each entry is a toggle, pressed while its series is drawn.
 */
export function ChartLegend({ series, hidden, onToggle, onShowAll, disabled = false }: ChartLegendProps) {
  const anyHidden = series.some((s) => hidden.has(s.label));
  return (
    <div className="flex flex-col gap-1">
      <ul aria-label="Series on the chart" className="flex flex-wrap gap-x-3">
        {series.map((s, i) => {
          const shown = !hidden.has(s.label);
          return (
            <li key={`${i}-${s.label}`} className="max-w-full min-w-0">
              <button
                type="button"
                aria-pressed={shown}
                disabled={disabled}
                onClick={() => onToggle(s.label)}
                className={cn('flex min-h-tap max-w-full items-center gap-2 rounded px-1 text-left text-sm hover:bg-surface-raised', !shown && 'text-ink-muted')}
              >
                <span className={cn('flex', !shown && 'opacity-40')}>
                  <SeriesMark series={s} />
                </span>
                <span className={cn('min-w-0 wrap-anywhere', !shown && 'line-through')}>{s.label}</span>
              </button>
            </li>
          );
        })}
      </ul>
      <div className="flex flex-wrap items-center gap-x-3 text-xs text-ink-muted">
        <p>Tap or click a name to hide or show it on the chart.</p>
        {anyHidden ? (
          <button type="button" onClick={onShowAll} className="min-h-tap font-semibold text-link">
            Show all
          </button>
        ) : null}
      </div>
    </div>
  );
}
