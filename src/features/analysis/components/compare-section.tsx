import { useId, useState, type ReactNode } from 'react';
import type { CompareResult, Comparison, SampleStats } from '@shared/analysis/analysis.schema';
import { formatFixed, formatP } from '@shared/calc/display';
import { unitFor, type UnitPreferences } from '@shared/calc/units.calc';
import { CLEAR_P, HINT_P, MINIMUM_READINGS_PER_GROUP as MIN_INTERVALS, plural, verdict } from '@shared/calc/comparison.calc';
import { CORNERS, type Corner } from '@shared/season/corners';
import type { Setup, SetupChange } from '@shared/season/setup.schema';
import { diffSetups } from '@shared/season/setup-diff';
import { CORNER_NAMES, CornerGrid } from '@/components/corner-grid/corner-grid';
import { EmptyState } from '@/components/ui/empty-state';
import { SelectField } from '@/components/ui/select-field';
import { formatDateTime, formatDay } from '@/lib/dates';
import { cn } from '@/lib/cn';
import { useUnits } from '@/lib/units-context';
import { setupInForce } from '@/features/setups/utils/setup-views';
import { useCompare, type CompareSplit } from '../api/get-compare';
import { useMediaQuery } from '../hooks/use-media-query';
import { BETWEEN_EVENTS_ADVICE, LOCATION_WORDS, wearRateInUnit, wearRateNumber, wearRateSuffix } from '../utils/analysis-format';
import { byDay, defaultChangeId, type ChangeOption } from '../utils/pick-change';

/**
 * How one measurement's numbers are written: the number alone, and the unit after it. `inUnit` and `unitWords`, when
 * the user's unit is not the API's: the value converted, and the unit as the verdict's sentence names it.
 */
interface Scale {
  number: (v: number) => string;
  suffix: string;
  inUnit?: (v: number) => number;
  unitWords?: string;
}

function wearScale(units: UnitPreferences): Scale {
  const scale: Scale = { number: (v) => wearRateNumber(v, units), suffix: wearRateSuffix(units) };
  return unitFor('treadDepth', units) === 'mm' ? scale : { ...scale, inUnit: (v) => wearRateInUnit(v, units), unitWords: wearRateSuffix(units).trim() };
}

/** The verdict in the user's units: said again from the numbers, converted, when they are not the API's. */
function verdictText(c: Comparison, scale: Scale): string {
  if (!scale.inUnit || !c.about) return c.verdict;
  const to = scale.inUnit;
  const at = (v: number | null) => (v === null ? null : to(v));
  const converted = {
    ...c,
    before: { ...c.before, mean: at(c.before.mean), sd: at(c.before.sd) },
    after: { ...c.after, mean: at(c.after.mean), sd: at(c.after.sd) },
    difference: at(c.difference),
  };
  // Written to 3 decimals, as the numbers beside it (wearRateNumber).
  return verdict(converted, { ...c.about, unit: scale.unitWords ?? '', decimals: 3 });
}

const PERCENT_SCALE: Scale = { number: (v) => formatFixed(v, 2), suffix: ' %' };

function statsText(s: SampleStats, scale: Scale, counted: string): string {
  if (s.n === 0 || s.mean === null) return `no ${counted}s yet`;
  if (s.sd === null) return `${scale.number(s.mean)}${scale.suffix} — no spread with one ${counted}`;
  return `${scale.number(s.mean)} ± ${scale.number(s.sd)}${scale.suffix}`;
}

function differenceText(c: Comparison, scale: Scale): string | null {
  if (c.difference === null) return null;
  const arrow = c.difference > 0 ? '▲' : c.difference < 0 ? '▼' : '±';
  const parts = [`Change ${arrow} ${scale.number(Math.abs(c.difference))}${scale.suffix}`];
  // p is only said beside a verdict that weighs it: with too few readings the verdict is "not enough data yet".
  if (c.pValue !== null && c.enough) parts.push(formatP(c.pValue));
  return parts.join(' · ');
}

/** Before → after for one measurement: the average ± spread and its count on each side, the change, and the verdict in the user's units. */
function Measure({ title, comparison, scale, counted, emphasis = false }: { title: string; comparison: Comparison; scale: Scale; counted: string; emphasis?: boolean }) {
  const difference = differenceText(comparison, scale);
  return (
    <div className={cn('flex flex-col gap-1', emphasis && 'rounded bg-surface-raised p-2')}>
      <p className="font-bold">{title}</p>
      <dl className="tabular-figures grid grid-cols-[auto_1fr] gap-x-2 gap-y-0.5 text-sm">
        <dt className="font-semibold">Before</dt>
        <dd>
          {statsText(comparison.before, scale, counted)} <span className="text-ink-muted">({plural(comparison.before.n, counted)})</span>
        </dd>
        <dt className="font-semibold">After</dt>
        <dd>
          {statsText(comparison.after, scale, counted)} <span className="text-ink-muted">({plural(comparison.after.n, counted)})</span>
        </dd>
      </dl>
      {difference ? <p className="tabular-figures text-xs text-ink-muted">{difference}</p> : null}
      <p className={cn('text-sm', comparison.enough ? 'font-semibold' : 'text-ink-muted')}>{verdictText(comparison, scale)}</p>
    </div>
  );
}

function changeLabel(c: ChangeOption): string {
  return `${formatDay(c.changedOn)} · ${c.what} (${LOCATION_WORDS[c.location] ?? c.location})`;
}

/** Where each wheel sits on the small car outline (viewBox 24 × 72, front at the top). */
const WHEEL_AT: Record<Corner, { x: number; y: number }> = { lf: { x: 1, y: 14 }, rf: { x: 19.5, y: 14 }, lr: { x: 1, y: 52 }, rr: { x: 19.5, y: 52 } };

/** The car from above, front at the top, with the card's wheel filled in: which corner it is, at a glance. */
function CornerMark({ corner }: { corner: Corner }) {
  return (
    <svg viewBox="0 0 24 72" className="h-12 w-5 shrink-0 text-line-strong" aria-hidden="true" focusable="false">
      <path d="M12 1 L17 7 H7 Z" fill="currentColor" />
      <rect x="5" y="8" width="14" height="60" rx="5" fill="none" stroke="currentColor" strokeWidth="1.5" />
      {CORNERS.map((c) => (
        <rect
          key={c}
          {...WHEEL_AT[c]}
          width="3.5"
          height="10"
          rx="1"
          stroke="currentColor"
          strokeWidth="1"
          className={c === corner ? 'fill-accent stroke-accent' : 'fill-none'}
        />
      ))}
    </svg>
  );
}

/**
 * On a phone the corners come one under another, front first and left before right, each card as wide as the
 * screen and marked on a small outline of the car; side by side they would be too narrow to read.
 */
function StackedCorners({ label, renderCorner }: { label: string; renderCorner: (corner: Corner) => ReactNode }) {
  const baseId = useId();
  return (
    <div role="group" aria-label={label} className="flex flex-col gap-2">
      <div className="font-semibold">{label}</div>
      {CORNERS.map((corner) => (
        <div key={corner} role="group" aria-labelledby={`${baseId}-${corner}`} className="flex flex-col gap-2 rounded border border-line p-3">
          <div className="flex items-center gap-2">
            <CornerMark corner={corner} />
            <h3 id={`${baseId}-${corner}`} className="font-bold">
              {CORNER_NAMES[corner]}
            </h3>
          </div>
          {renderCorner(corner)}
        </div>
      ))}
    </div>
  );
}

/**
 * Time across the change, from the days a driver ran on both sides of it. A change made between events has no
 * such day, and its numbers would only say how consistent each day was: the card says so instead of showing them.
 */
/**
 * What else changed on the car at the split: every value of the setup in force from it against the one before,
 * so a camber change that came with new toe says so. Both sides' wear and time carry all of them together.
 */
function ChangedAtSplit({ splitAt, setups, renderChanges }: { splitAt: string; setups: readonly SetupOption[]; renderChanges: (changes: SetupChange[]) => ReactNode }) {
  const after = setupInForce(setups, splitAt);
  const before = setupInForce(setups, new Date(Date.parse(splitAt) - 1).toISOString());
  const changes = before && after && before.id !== after.id ? diffSetups(before, after) : [];
  if (changes.length === 0) return null;
  // Camber at two corners is one setting.
  const settings = new Set(changes.map((c) => c.field)).size;
  return (
    <div className="flex flex-col gap-2 rounded border border-line p-3">
      <p className="font-bold">
        What changed on the car here <span className="font-normal text-ink-muted">({before!.label} → {after!.label})</span>
      </p>
      {renderChanges(changes)}
      <p className="text-sm text-ink-muted">
        {settings === 1
          ? 'One setting changed, so the numbers below are about it alone.'
          : `${settings} settings changed together: the numbers below are about all of them at once, not any one alone.`}
      </p>
    </div>
  );
}

function TimeAcross({ result }: { result: CompareResult }) {
  const { days, leftOut } = result.timeScope;
  const title = "Time: % off the day's best, per run";
  if (days === 0) {
    return (
      <div className="flex flex-col gap-1 rounded border border-line p-3">
        <p className="font-bold">{title}</p>
        <p className="text-sm">
          No event had runs on both sides of this change, so its effect on time cannot be measured here: a change made
          between events moves the whole day, best run included. Judge it {BETWEEN_EVENTS_ADVICE}
        </p>
      </div>
    );
  }
  return (
    <div className="flex flex-col gap-1 rounded border border-line p-3">
      <Measure title={title} comparison={result.time} scale={PERCENT_SCALE} counted="run" />
      <p className="text-sm text-ink-muted">
        From {plural(days, 'event')} with runs on both sides of the change, each run against the same driver&apos;s best
        run that day.{' '}
        {leftOut > 0
          ? `${plural(leftOut, 'clean run')} on days wholly before or after it ${leftOut === 1 ? 'is' : 'are'} left out: a change made between events moves the whole day, best run included. `
          : null}
        Judge a change between events {BETWEEN_EVENTS_ADVICE}
      </p>
    </div>
  );
}

/** Wide enough for the car's four corners side by side with each still comfortably readable. */
const CORNERS_SIDE_BY_SIDE = '(min-width: 48rem)';

function CompareResultView({ carId, split, setups, renderChanges }: { carId: string; split: CompareSplit; setups: readonly SetupOption[]; renderChanges: (changes: SetupChange[]) => ReactNode }) {
  const units = useUnits();
  const sideBySide = useMediaQuery(CORNERS_SIDE_BY_SIDE);
  const compare = useCompare(carId, split);
  if (compare.isPending) return <p className="text-ink-muted">Comparing before and after…</p>;
  if (compare.isError) return <EmptyState message="The comparison could not be loaded. Try again shortly." />;
  const result = compare.data;
  const wear = wearScale(units);
  const wearComparisons = CORNERS.flatMap((c) => [result.corners[c].innerWear, result.corners[c].wear, result.corners[c].skew]);
  const wearToCompare = wearComparisons.some((c) => c.enough);
  // The corner nearest to enough: the most intervals on its thinner side.
  const nearest = wearComparisons.reduce((best, c) => (Math.min(c.before.n, c.after.n) > Math.min(best.before.n, best.after.n) ? c : best));
  const label = 'Tyre wear per run, before and after';
  const renderCorner = (corner: Corner) => {
    const c = result.corners[corner];
    return (
      <div className="flex flex-col gap-3">
        <Measure title="Inner-edge wear" comparison={c.innerWear} scale={wear} counted="interval" emphasis />
        <Measure title="Overall wear" comparison={c.wear} scale={wear} counted="interval" />
        <Measure title="Inner minus outer" comparison={c.skew} scale={wear} counted="interval" />
      </div>
    );
  };
  return (
    <div className="flex flex-col gap-4">
      <p className="text-sm text-ink-muted">
        Split at <span className="tabular-figures font-semibold text-ink">{formatDateTime(result.splitAt)}</span>. Wear is
        measured over each interval between two tread readings; an interval whose runs straddle the change counts on
        neither side. Each side shows its average ± the usual spread (one standard deviation). p is how often a change at
        least this large would turn up by chance alone, with nothing changed on the car (Welch&apos;s t-test): under {CLEAR_P} is
        called a clear change, up to {HINT_P} a hint. With a dozen rows below, one may read &ldquo;clear&rdquo; by chance alone:
        trust a change that shows at more than one corner, or that holds over the next events.
      </p>
      <ChangedAtSplit splitAt={result.splitAt} setups={setups} renderChanges={renderChanges} />
      {wearToCompare ? (
        sideBySide ? (
          <CornerGrid label={label} renderCorner={renderCorner} />
        ) : (
          <StackedCorners label={label} renderCorner={renderCorner} />
        )
      ) : (
        // Said once, not twelve times over.
        <p className="rounded border border-line p-3 text-sm">
          Not enough tread readings yet to compare wear across this change: a corner needs {MIN_INTERVALS} intervals on each side, and
          the nearest has {nearest.before.n} before and {nearest.after.n} after.
        </p>
      )}
      <TimeAcross result={result} />
    </div>
  );
}

/** What the picker needs of a setup snapshot: each one after the first is a change to compare across. */
export type SetupOption = Pick<Setup, 'id' | 'label' | 'effectiveFrom' | 'createdAt' | 'corners' | 'axles'>;

interface SplitOption {
  value: string;
  label: string;
  /** For ordering: the log entry's day, or the setup's start. */
  when: string;
  split: CompareSplit;
}

const SETUP_VALUE = 'setup:';

/** The log's entries and the setups that followed another, newest first, in one list. */
function splitOptions(changes: readonly ChangeOption[], setups: readonly SetupOption[]): SplitOption[] {
  const fromLog = byDay(changes).map((c) => ({ value: c.id, label: changeLabel(c), when: c.changedOn, split: { changeId: c.id } }));
  const fromSetups = [...setups]
    .sort((a, b) => a.effectiveFrom.localeCompare(b.effectiveFrom))
    .slice(1)
    .map((s) => ({ value: `${SETUP_VALUE}${s.id}`, label: `${formatDay(s.effectiveFrom)} · Setup: ${s.label}`, when: s.effectiveFrom, split: { at: s.effectiveFrom } }));
  // Stable: a day's log entries keep the log's order, newest day first.
  return [...fromLog, ...fromSetups].map((o, i) => ({ o, i })).sort((a, b) => b.o.when.localeCompare(a.o.when) || b.i - a.i).map(({ o }) => o);
}

/**
 * Wear and time before and after one change: an entry of the change log (a part fitted, an alignment), or a new
 * setup (a quick change between heats, a shop's handover).
 */
export function CompareSection({
  carId,
  changes,
  setups,
  renderChanges,
}: {
  carId: string;
  changes: readonly ChangeOption[];
  setups: readonly SetupOption[];
  /** Draws a list of setup changes (the setups' own list, with the car's adjusters). */
  renderChanges: (changes: SetupChange[]) => ReactNode;
}) {
  const [picked, setPicked] = useState<string | null>(null);
  const options = splitOptions(changes, setups);
  // First the latest log entry about camber or the front, else the newest change of any kind.
  const fallback = defaultChangeId(changes) ?? options[0]?.value ?? null;
  const value = picked !== null && options.some((o) => o.value === picked) ? picked : fallback;
  const chosen = options.find((o) => o.value === value);
  if (!chosen) {
    return (
      <EmptyState message="Nothing to compare yet: the change log is empty and the car has one setup at most. Log a change (new camber, springs) or record a new setup to compare before and after it." />
    );
  }
  return (
    <div className="flex flex-col gap-4">
      <SelectField
        label="Change to compare across"
        options={options.map(({ value: v, label }) => ({ value: v, label }))}
        value={chosen.value}
        onChange={(e) => setPicked(e.target.value)}
      />
      <CompareResultView carId={carId} split={chosen.split} setups={setups} renderChanges={renderChanges} />
    </div>
  );
}
