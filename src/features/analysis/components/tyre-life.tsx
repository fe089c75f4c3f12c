import { useId, useState, type FormEvent, type ReactNode } from 'react';
import type { SeasonResult } from '@shared/analysis/analysis.schema';
import { formatQuantity, fromDisplay } from '@shared/calc/units.calc';
import { Button } from '@/components/ui/button';
import { Caution } from '@/components/ui/caution';
import { EmptyState } from '@/components/ui/empty-state';
import { UnitInput } from '@/components/ui/unit-input';
import { CORNER_NAMES } from '@/components/corner-grid/corner-grid';
import { formatDay } from '@/lib/dates';
import { cn } from '@/lib/cn';
import { parseDecimal, tidy, toInputText, unitSymbol } from '@/lib/numbers';
import { useUnits } from '@/lib/units-context';
import { formatWearRate } from '../utils/analysis-format';

type TyreLifeEntry = SeasonResult['tyreLife'][number];

/** The server takes 0 to 10 mm. */
const MIN_DEPTH_RANGE_MM = { min: 0, max: 10 } as const;

const POSITION_WORDS = { inner: 'inner edge', middle: 'middle', outer: 'outer edge' } as const;

const NOT_ENOUGH = 'not enough readings yet';

function Row({ term, children, warn = false }: { term: string; children: ReactNode; warn?: boolean }) {
  return (
    <div className="flex flex-wrap gap-x-2">
      <dt className="font-semibold">{term}:</dt>
      <dd className={cn('tabular-figures', warn && 'font-bold text-warning')}>{children}</dd>
    </div>
  );
}

function TyreSetLife({ entry }: { entry: TyreLifeEntry }) {
  const units = useUnits();
  const headingId = useId();
  const min = formatQuantity(entry.minDepthMm, 'treadDepth', units);
  const atLimit = entry.worst !== null && entry.worst.depthMm <= entry.minDepthMm;
  let runsLeft: string;
  if (entry.worst === null || entry.mmPerRun === null) runsLeft = NOT_ENOUGH;
  else if (entry.runsLeft === null) runsLeft = 'no wear measured between readings yet, so no estimate';
  else if (entry.runsLeft === 0) runsLeft = `none: the worst spot is at or below ${min}`;
  else runsLeft = `about ${entry.runsLeft} ${entry.runsLeft === 1 ? 'run' : 'runs'} (a straight-line estimate)`;
  const since = entry.runsSinceReading ?? 0;

  return (
    <article aria-labelledby={headingId} className="flex flex-col gap-2 rounded border border-line p-3">
      <h3 id={headingId} className="text-lg font-bold">
        {entry.label}
      </h3>
      <dl className="flex flex-col gap-1 text-sm">
        <Row term="Worst spot" warn={atLimit}>
          {entry.worst
            ? `${CORNER_NAMES[entry.worst.corner]}, ${POSITION_WORDS[entry.worst.position]}: ${formatQuantity(entry.worst.depthMm, 'treadDepth', units)}`
            : 'no tread readings yet'}
          {entry.latestReadingAt ? <span className="text-ink-muted"> (read {formatDay(entry.latestReadingAt)})</span> : null}
        </Row>
        <Row term="Wear at that spot">{entry.mmPerRun === null ? NOT_ENOUGH : formatWearRate(entry.mmPerRun, units)}</Row>
        <Row term={`Runs left to ${min}`} warn={entry.runsLeft === 0}>
          {runsLeft}
          {since > 0 && entry.runsLeft !== null ? (
            <span className="text-ink-muted">
              {' '}
              — after the {since === 1 ? 'run' : `${since} runs`} made on this set since the reading. Read the tread again to check.
            </span>
          ) : null}
        </Row>
        <Row term="Fit">
          {entry.n} {entry.n === 1 ? 'reading' : 'readings'}
          {entry.r2 === null ? '' : `, r² = ${entry.r2.toFixed(2)}`}
          {entry.n === 2 ? <span className="text-ink-muted"> (two readings always fit a line exactly)</span> : null}
        </Row>
      </dl>
      <AlignmentNote entry={entry} />
    </article>
  );
}

/** Which readings the line goes through when the alignment at the worst spot's corner changed on this tyre. */
function AlignmentNote({ entry }: { entry: TyreLifeEntry }) {
  const change = entry.alignmentChange;
  if (!change || !entry.worst) return null;
  const what = `The alignment at the ${CORNER_NAMES[entry.worst.corner].toLowerCase()} changed on ${formatDay(change.at)} (${change.label})`;
  return (
    <p className="text-sm text-ink-muted">
      {change.fitted === 'since'
        ? `${what}: the line starts at the last reading before it, so the rate is the one since.`
        : `${what}, and too few readings have been taken since: the line goes through every reading, so the rate may be the old one. Read the tread after the next event.`}
    </p>
  );
}

function MinDepthForm({ minDepthMm, onChange, isUpdating }: { minDepthMm: number; onChange: (mm: number) => void; isUpdating: boolean }) {
  const units = useUnits();
  const [text, setText] = useState(() => toInputText(minDepthMm, 'treadDepth', units));
  const [error, setError] = useState<string | undefined>();
  const submit = (e: FormEvent) => {
    e.preventDefault();
    const parsed = parseDecimal(text);
    const range = `${formatQuantity(MIN_DEPTH_RANGE_MM.min, 'treadDepth', units)} to ${formatQuantity(MIN_DEPTH_RANGE_MM.max, 'treadDepth', units)}`;
    if (parsed.kind !== 'number') {
      setError(`Enter a depth from ${range}`);
      return;
    }
    const mm = tidy(fromDisplay(parsed.value, 'treadDepth', units));
    if (mm < MIN_DEPTH_RANGE_MM.min || mm > MIN_DEPTH_RANGE_MM.max) {
      setError(`Enter a depth from ${range}`);
      return;
    }
    setError(undefined);
    onChange(mm);
  };
  return (
    <form onSubmit={submit} className="flex flex-wrap items-end gap-2" noValidate>
      <UnitInput
        label="Retire the tyre at"
        unit={unitSymbol('treadDepth', units)}
        value={text}
        onChange={(e) => setText(e.target.value)}
        error={error}
        className="w-44"
      />
      <Button type="submit" variant="secondary" isPending={isUpdating} pendingLabel="Working out…">
        Recalculate
      </Button>
    </form>
  );
}

/** Per tyre set: the worst spot, how fast it wears, and about how many runs are left to the chosen depth. */
export function TyreLife({
  tyreLife,
  minDepthMm,
  onMinDepthChange,
  isUpdating = false,
}: {
  tyreLife: SeasonResult['tyreLife'];
  minDepthMm: number;
  onMinDepthChange: (mm: number) => void;
  isUpdating?: boolean;
}) {
  return (
    <div className="flex flex-col gap-4">
      <MinDepthForm minDepthMm={minDepthMm} onChange={onMinDepthChange} isUpdating={isUpdating} />
      <p className="text-sm text-ink-muted">
        The worst spot&apos;s depth is fitted against the runs made on the set with a straight line; runs left = (depth at
        the latest reading − the depth above) ÷ wear per run, less the runs made since. The fit gives the number of
        readings and r², how well the line fits.
      </p>
      {tyreLife.length === 0 ? (
        <EmptyState message="No tyre sets recorded for this car yet." />
      ) : (
        <div className="grid grid-cols-1 gap-3 sm:grid-cols-2">
          {tyreLife.map((entry) => (
            <TyreSetLife key={entry.tyreSetId} entry={entry} />
          ))}
        </div>
      )}
      <Caution title="Tread depth">
        <p>
          Wear indicators sit at 1.6 mm (2/32 in). Follow the tyre maker&apos;s guidance and local law on the minimum, check the
          tyres before every event, and treat runs left as an estimate, not a promise.
        </p>
      </Caution>
    </div>
  );
}
