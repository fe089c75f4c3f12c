import { lazy, Suspense, useId, useState, type ReactNode } from 'react';
import { parseISO } from 'date-fns';
import type { SeasonResult } from '@shared/analysis/analysis.schema';
import type { SetupChange } from '@shared/season/setup.schema';
import { formatRunTime } from '@shared/season/run-time';
import { EmptyState } from '@/components/ui/empty-state';
import { formatDateTime, formatDay } from '@/lib/dates';
import { LOCATION_WORDS } from '../utils/analysis-format';
import { useColourScheme } from '../hooks/use-colour-scheme';
import { seriesStyle, type ColourScheme, type SeriesStyle } from '../utils/series-styles';
import { timeTickLabel, timeTicks } from '../utils/time-ticks';
import type { ChartSeries } from './analysis-chart';
import { ChartLoading } from './chart-loading';
import { ShowTableToggle, TableLoading } from './show-table-toggle';

const AnalysisChart = lazy(() => import('./analysis-chart').then((m) => ({ default: m.AnalysisChart })));
// Loaded on "Show as table", like the chart: most visits never open it.
const EventsTable = lazy(() => import('./events-table').then((m) => ({ default: m.EventsTable })));

const DAY_MS = 24 * 60 * 60 * 1000;

/** An axis tick in seconds with no trailing zeros ("54", "44.5"): the ticks are round steps, not run times. */
const axisSeconds = (value: number) => String(Number(Math.max(0, value).toFixed(3)));

export interface DriverSeries {
  id: string;
  name: string;
  style: SeriesStyle;
  points: { x: number; y: number; lines: string[] }[];
}

/**
 * Each driver's best adjusted time per event, one colour and shape per driver, in the order they first ran; the
 * colours are the ones for the page's colour scheme.
 */
function driverSeries(season: SeasonResult, scheme: ColourScheme): DriverSeries[] {
  const byId = new Map<string, DriverSeries>();
  const events = [...season.events].sort((a, b) => a.date.localeCompare(b.date));
  for (const event of events) {
    for (const d of event.drivers) {
      if (d.bestAdjustedSec === null) continue;
      let series = byId.get(d.driver.id);
      if (!series) {
        series = { id: d.driver.id, name: d.driver.displayName, style: seriesStyle(byId.size, scheme), points: [] };
        byId.set(d.driver.id, series);
      }
      series.points.push({
        x: parseISO(event.date).getTime(),
        y: d.bestAdjustedSec,
        lines: [
          `${event.name}, ${formatDay(event.date)}`,
          `${d.driver.displayName}: best adjusted ${formatRunTime(d.bestAdjustedSec)} s`,
          `${d.runCount} ${d.runCount === 1 ? 'run' : 'runs'}, ${d.cones} ${d.cones === 1 ? 'cone' : 'cones'}`,
        ],
      });
    }
  }
  return [...byId.values()];
}

function TimelineChart({ season, drivers }: { season: SeasonResult; drivers: DriverSeries[] }) {
  const times = drivers.flatMap((d) => d.points.map((p) => p.y));
  const low = Math.min(...times);
  const high = Math.max(...times);
  const pad = Math.max(0.5, (high - low) * 0.1);
  const yMin = low - pad;
  const yMax = high + pad;

  const setupMarks = season.setupChanges.map((s) => ({
    x: parseISO(s.effectiveFrom).getTime(),
    y: yMax,
    lines: [`Setup: ${s.label}`, formatDateTime(s.effectiveFrom), `by ${s.createdBy}`],
  }));
  const logMarks = season.changeLog.map((c) => ({
    x: parseISO(c.changedOn).getTime(),
    y: yMin,
    lines: [`Change log: ${c.what}`, formatDay(c.changedOn), LOCATION_WORDS[c.location] ?? c.location],
  }));

  const xs = [...drivers.flatMap((d) => d.points.map((p) => p.x)), ...setupMarks.map((m) => m.x), ...logMarks.map((m) => m.x)];
  const first = Math.min(...xs);
  const last = Math.max(...xs);
  const xPad = Math.max(2 * DAY_MS, (last - first) * 0.04);
  const xTicks = timeTicks(first - xPad, last + xPad);

  const series: ChartSeries[] = [
    ...drivers.map((d) => ({ label: d.name, color: d.style.color, outlined: d.style.outlined, shape: d.style.shape, glyph: d.style.glyph, line: 'solid' as const, points: d.points })),
    ...(setupMarks.length
      ? [{ label: 'Setup change', color: null, shape: 'triangle' as const, glyph: '▼', rotation: 180, verticalLines: 'dashed' as const, points: setupMarks }]
      : []),
    ...(logMarks.length
      ? [{ label: 'Change-log entry', color: null, shape: 'rectRot' as const, glyph: '◆', verticalLines: 'dotted' as const, points: logMarks }]
      : []),
  ];

  return (
    <Suspense fallback={<ChartLoading series={series} />}>
      <AnalysisChart
        series={series}
        x={{ title: 'Date', format: timeTickLabel(xTicks), min: first - xPad, max: last + xPad, ticks: xTicks }}
        y={{ title: 'Best adjusted time (s)', format: axisSeconds, min: yMin, max: yMax }}
        summary={`Best adjusted time per event for ${drivers.map((d) => d.name).join(' and ')}, with ${setupMarks.length} setup changes and ${logMarks.length} change-log entries marked. Use "Show as table" for the values.`}
      />
    </Suspense>
  );
}

/**
 * The season at a glance: each driver's best adjusted time per event, with setup changes and change-log entries
 * marked, then every setup change in order with what it changed.
 */
export function SeasonTimeline({
  season,
  renderChanges,
}: {
  season: SeasonResult;
  /** Writes one snapshot's changes (▲/▼ with the amount in the user's units); the page passes the setups' own list. */
  renderChanges: (changes: SetupChange[]) => ReactNode;
}) {
  const tableId = useId();
  const [showTable, setShowTable] = useState(false);
  const scheme = useColourScheme();
  const drivers = driverSeries(season, scheme);
  const setupChanges = [...season.setupChanges].sort((a, b) => a.effectiveFrom.localeCompare(b.effectiveFrom));
  const changeLog = [...season.changeLog].sort((a, b) => a.changedOn.localeCompare(b.changedOn));

  return (
    <div className="flex flex-col gap-4">
      <p className="text-sm text-ink-muted">
        Courses differ from event to event, so these times show when you ran and the broad trend — not whether one day was
        faster than another. For setup against time on a like-for-like basis, use % off the day&apos;s best above.
      </p>
      {drivers.length === 0 ? (
        <EmptyState message="Not enough data yet: no timed runs this season." />
      ) : (
        <>
          <TimelineChart season={season} drivers={drivers} />
          <p className="text-sm text-ink-muted">
            ▼ dashed line: a setup change. ◆ dotted line: a change-log entry. Hover or tap a marker for what it was.
          </p>
          <ShowTableToggle shown={showTable} onToggle={() => setShowTable((v) => !v)} controls={tableId} />
          {showTable ? (
            <Suspense fallback={<TableLoading />}>
              <EventsTable id={tableId} season={season} drivers={drivers} />
            </Suspense>
          ) : null}
        </>
      )}
      <div className="flex flex-col gap-2">
        <h3 className="text-lg font-bold">Setup changes, in order</h3>
        {setupChanges.length === 0 ? (
          <p className="text-sm text-ink-muted">No setup snapshots recorded yet.</p>
        ) : (
          <ol className="flex flex-col gap-3">
            {setupChanges.map((s, i) => (
              <li key={s.setupId} className="flex flex-col gap-1 border-l-2 border-line-strong pl-3">
                <p>
                  <span className="font-bold">{s.label}</span>{' '}
                  <span className="tabular-figures text-sm text-ink-muted">
                    from {formatDateTime(s.effectiveFrom)} · by {s.createdBy}
                  </span>
                </p>
                {i === 0 && s.changes.length === 0 ? (
                  <p className="text-sm text-ink-muted">The first snapshot of the season: the starting point.</p>
                ) : (
                  renderChanges(s.changes)
                )}
              </li>
            ))}
          </ol>
        )}
      </div>
      {changeLog.length > 0 ? (
        <div className="flex flex-col gap-2">
          <h3 className="text-lg font-bold">Change log</h3>
          <ul className="flex flex-col gap-1 text-sm">
            {changeLog.map((c) => (
              <li key={c.id}>
                <span className="tabular-figures text-ink-muted">{formatDay(c.changedOn)}</span> · {c.what}{' '}
                <span className="text-ink-muted">({LOCATION_WORDS[c.location] ?? c.location})</span>
              </li>
            ))}
          </ul>
        </div>
      ) : null}
    </div>
  );
}
