import { lazy, Suspense, useId, useMemo, useState } from 'react';
import {
  CORNER_OR_AXLE,
  SCATTER_METRICS,
  SCATTER_PARAMS,
  type CornerOrAxle,
  type ScatterMetric,
  type ScatterParam,
  type ScatterResult,
} from '@shared/analysis/analysis.schema';
import type { UnitPreferences } from '@shared/calc/units.calc';
import { EmptyState } from '@/components/ui/empty-state';
import { SegmentedControl } from '@/components/ui/segmented-control';
import { SelectField } from '@/components/ui/select-field';
import { formatDay } from '@/lib/dates';
import { formatFixed } from '@shared/calc/display';
import { FIELD_INFO } from '@/lib/setup-fields';
import { useUnits } from '@/lib/units-context';
import { useSetups } from '@/features/setups/api/get-setups';
import { useScatter } from '../api/get-scatter';
import { useColourScheme } from '../hooks/use-colour-scheme';
import { firstVariedSetting } from '../utils/pick-setting';
import { axisTick, METRIC_INFO, PARAM_INFO, rateUnitWords, runsText, xAxis, yAxis, type Axis } from '../utils/analysis-format';
import { buildScatterPlot, wholeStepAxis, type ScatterPlot } from '../utils/scatter-plot';
import type { ChartSeries } from './analysis-chart';
import { ChartLoading } from './chart-loading';
import { PerValueSummary } from './per-value-summary';
import type { PointRow } from './points-table';
import { ShowTableToggle, TableLoading } from './show-table-toggle';

const AnalysisChart = lazy(() => import('./analysis-chart').then((m) => ({ default: m.AnalysisChart })));
// Loaded on "Show as table", like the chart: most visits never open it.
const PointsTable = lazy(() => import('./points-table').then((m) => ({ default: m.PointsTable })));

export const WHERE_LABELS: Record<CornerOrAxle, string> = {
  lf: 'Left front',
  rf: 'Right front',
  lr: 'Left rear',
  rr: 'Right rear',
  front: 'Front axle (LF and RF)',
  rear: 'Rear axle (LR and RR)',
};

const PARAM_OPTIONS = SCATTER_PARAMS.map((p) => ({ value: p, label: PARAM_INFO[p].label }));
const WHERE_OPTIONS = CORNER_OR_AXLE.map((c) => ({ value: c, label: WHERE_LABELS[c] }));

function metricOptions(units: UnitPreferences) {
  const rate = rateUnitWords(units);
  return SCATTER_METRICS.map((m) => ({
    value: m,
    label: m === 'time' ? METRIC_INFO.time.label : m === 'wear' ? `Wear: ${rate}` : `Inner minus outer: ${rate}`,
  }));
}

type ClicksAs = 'count' | 'share';

/** What the tooltip and the table say about one point. */
function describePoint(result: ScatterResult, index: number, x: Axis, y: Axis): string[] {
  const p = result.points[index]!;
  const event = p.eventName ? `${p.eventName}${p.eventDate ? `, ${formatDay(p.eventDate)}` : ''}` : 'No event';
  return [
    event,
    // A time point is one run: whose and which, as on its event's page; a wear point covers the runs between readings.
    p.runs === null ? (p.driver && p.runNumber !== null ? `${p.driver.displayName} · run ${p.runNumber}` : runsText(p)) : `Over ${runsText(p)}`,
    `Setup: ${p.setupLabel ?? '—'}`,
    ...(p.corner ? [`Corner: ${p.corner.toUpperCase()}`] : []),
    `${x.short}: ${x.format(p)}`,
    `${y.short}: ${y.format(p)}`,
  ];
}

/** The table's rows, in the chart's order (event by event), every value written out in the user's units. */
function pointRows(result: ScatterResult, plot: ScatterPlot, x: Axis, y: Axis): PointRow[] {
  const wear = result.y.metric !== 'time';
  return plot.series.flatMap((s) =>
    s.points.map((pt) => {
      const p = result.points[pt.index]!;
      return {
        key: pt.index,
        marker: { glyph: s.style.glyph, color: s.style.color, name: s.style.shapeName },
        event: s.label,
        runs: runsText(p),
        ...(p.driver ? { driver: p.driver.displayName } : {}),
        ...(p.runNumber !== null ? { runNumber: p.runNumber } : {}),
        setup: p.setupLabel ?? '—',
        ...(wear ? { corner: p.corner?.toUpperCase() ?? '—' } : {}),
        x: x.format(p),
        y: y.format(p),
      };
    }),
  );
}

function Caption({ result }: { result: ScatterResult }) {
  const s = result.n === 1 ? '' : 's';
  // On an axle each corner's wear is its own point; the setting is the axle's (the mean of its two corners).
  const axle = result.x.corner === 'front' || result.x.corner === 'rear';
  const what = result.y.metric === 'time' ? `run${s}` : `wear interval${s} (between two tread readings${axle ? ', one point for each corner' : ''})`;
  return (
    <p className="tabular-figures text-sm">
      <span className="font-semibold">
        {result.n} {what}
      </span>
      {' · '}
      {result.fit ? (
        <>
          fitted straight line, r² = {result.fit.r2.toFixed(2)}
          <span className="text-ink-muted">
            {' '}
            (the share of the spread the line explains: near 0, the setting explains little; a trend, not proof of a cause)
          </span>
        </>
      ) : (
        <>not enough data yet for a fitted line (it needs at least 3 points and more than one value of the setting)</>
      )}
    </p>
  );
}

/** Wear intervals the setting changed within: said, with why, so the plot's count is not taken for all of them. */
function LeftOutNote({ result }: { result: ScatterResult }) {
  const n = result.leftOut?.mixedSetting ?? 0;
  if (n === 0) return null;
  const [them, their] = n === 1 ? ['interval', 'its'] : ['intervals', 'their'];
  return (
    <p className="tabular-figures text-sm">
      <span className="font-semibold">
        {n} wear {them} left out:
      </span>{' '}
      this setting was changed between {their} two tread readings, so {their} runs were on more than one value and the
      wear cannot be credited to any one of them.
    </p>
  );
}

/** Other settings that moved with the plotted one: the trend may be theirs, said with how closely each followed. */
function AlsoMovedNote({ result }: { result: ScatterResult }) {
  const moved = result.alsoMoved ?? [];
  if (moved.length === 0) return null;
  const plotted = PARAM_INFO[result.x.param].inSentence;
  const names = moved.map((m) => `${FIELD_INFO[m.field].label.toLowerCase()} (r = ${formatFixed(m.r, 2)})`);
  const list = names.length === 1 ? names[0] : `${names.slice(0, -1).join(', ')} and ${names.at(-1)}`;
  return (
    <p className="text-sm">
      <span className="font-semibold">Changed together:</span> across these points {list} moved with {plotted}, so a trend
      here may be theirs as much as {plotted}&apos;s. To tell them apart, change one at a time.
    </p>
  );
}

function ScatterBody({ result, clicksAs }: { result: ScatterResult; clicksAs: ClicksAs }) {
  const units = useUnits();
  const tableId = useId();
  const [showTable, setShowTable] = useState(false);
  const scheme = useColourScheme();
  const x = xAxis(result, units, clicksAs === 'share');
  const y = yAxis(result, units);
  const plot = buildScatterPlot(result, x, y, scheme);
  const wear = result.y.metric !== 'time';
  const series: ChartSeries[] = [
    ...plot.series.map((s) => ({
      label: s.label,
      color: s.style.color,
      outlined: s.style.outlined,
      shape: s.style.shape,
      glyph: s.style.glyph,
      points: s.points.map((pt) => ({ x: pt.x, y: pt.y, lines: describePoint(result, pt.index, x, y) })),
    })),
    ...(plot.fit
      ? [{ label: 'Fitted line', color: null, shape: 'line' as const, line: 'dashed' as const, hidePoints: true, points: plot.fit.map((p) => ({ ...p, lines: [] })) }]
      : []),
  ];

  return (
    <div className="flex flex-col gap-3">
      <p className="text-sm text-ink-muted">{result.y.description}</p>
      {result.n === 0 ? (
        <>
          <EmptyState message="Not enough data yet: no points with this setting recorded. Try another corner or setting." />
          <LeftOutNote result={result} />
        </>
      ) : (
        <>
          <Suspense fallback={<ChartLoading series={series} />}>
            <AnalysisChart
              series={series}
              // Room either side, so the lowest and highest settings are not drawn on the plot's edges.
              x={{ title: x.title, format: axisTick, grace: '5%', ...(x.whole ? wholeStepAxis(plot) : null) }}
              y={{ title: y.title, format: axisTick }}
              summary={`Scatter plot of ${x.title} against ${y.title}, ${result.n} ${result.n === 1 ? 'point' : 'points'}. Use "Show as table" for the values.`}
            />
          </Suspense>
          <Caption result={result} />
          <AlsoMovedNote result={result} />
          <LeftOutNote result={result} />
          <ShowTableToggle shown={showTable} onToggle={() => setShowTable((v) => !v)} controls={tableId} />
          {showTable ? (
            <Suspense fallback={<TableLoading />}>
              <PointsTable
                id={tableId}
                caption={`${x.short} against ${y.short.toLowerCase()}, ${result.n} ${result.n === 1 ? 'point' : 'points'}`}
                xHeading={x.short}
                yHeading={y.short}
                withCorner={wear}
                rows={pointRows(result, plot, x, y)}
              />
            </Suspense>
          ) : null}
          <PerValueSummary result={result} />
        </>
      )}
    </div>
  );
}

/** A setup value (x) against time or tyre wear (y) over the season, one colour and shape per event. */
export function ScatterSection({ carId }: { carId: string }) {
  const units = useUnits();
  const setups = useSetups(carId);
  // Until the reader picks, the plot opens on a setting that changed over the season (once the setups are in).
  const opening = useMemo(() => firstVariedSetting(setups.data?.items ?? []), [setups.data]);
  const [pickedParam, setParam] = useState<ScatterParam | null>(null);
  const [pickedCorner, setCorner] = useState<CornerOrAxle | null>(null);
  const param = pickedParam ?? opening.param;
  const corner = pickedCorner ?? opening.corner;
  const [metric, setMetric] = useState<ScatterMetric>('time');
  const [clicksAs, setClicksAs] = useState<ClicksAs>('count');
  const scatter = useScatter(carId, { x: param, y: metric, corner }, { enabled: !setups.isPending });
  const result = scatter.data;
  // The answer on screen may still be the last one while a new choice loads; only offer the clicks toggle for clicks.
  const clicksShown = param === 'damperClicks' && result?.x.param === 'damperClicks';
  const canNormalize = clicksShown && result.points.length > 0 && result.points.every((p) => p.xNormalized !== null);

  return (
    <div className="flex flex-col gap-4">
      <div className="grid grid-cols-1 gap-3 sm:grid-cols-3">
        <SelectField label="Setting (x)" options={PARAM_OPTIONS} value={param} onChange={(e) => setParam(e.target.value as ScatterParam)} />
        <SelectField label="Where" options={WHERE_OPTIONS} value={corner} onChange={(e) => setCorner(e.target.value as CornerOrAxle)} />
        <SelectField
          label="Measured (y)"
          options={metricOptions(units)}
          value={metric}
          onChange={(e) => setMetric(e.target.value as ScatterMetric)}
        />
      </div>
      {clicksShown ? (
        canNormalize ? (
          <SegmentedControl<ClicksAs>
            label="Plot clicks as"
            options={[
              { value: 'count', label: 'Clicks' },
              { value: 'share', label: 'Share of range (0 = softest)' },
            ]}
            value={clicksAs}
            onChange={setClicksAs}
          />
        ) : (
          <p className="text-sm text-ink-muted">
            Clicks are plotted as counted. Record the adjuster&apos;s range on the car to plot them from softest (0) to stiffest (1).
          </p>
        )
      ) : null}
      {scatter.isPending ? (
        <p className="text-ink-muted">Loading the season’s points…</p>
      ) : scatter.isError ? (
        <EmptyState message="The plot could not be loaded. Try again shortly." />
      ) : (
        <div className="flex flex-col gap-2" aria-busy={scatter.isPlaceholderData || undefined}>
          {scatter.isPlaceholderData ? <p className="text-sm text-ink-muted">Updating the plot…</p> : null}
          <ScatterBody result={scatter.data} clicksAs={canNormalize ? clicksAs : 'count'} />
        </div>
      )}
    </div>
  );
}
