import { lazy, Suspense, useId } from 'react';
import { Link } from 'react-router-dom';
import type { BoardCar, BoardResult, ClassBoard } from '@shared/collab/team.schema';
import { Caution } from '@/components/ui/caution';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorBoundary } from '@/components/errors/error-boundary';
import { SideScroll } from '@/components/side-scroll/side-scroll';
import { recordPath } from '@/config/record-paths';
import { formatDay, formatShortDay } from '@/lib/dates';
import { formatPercent } from '@/lib/numbers';
import { useUnits } from '@/lib/units-context';
import { aloneWords, bestRawWords, boardTime, formatFactor, noTimeWords, offFastestWords, rawConesWords, setupLines, trendWords, wearLine } from '../utils/board-format';
import { eventBoardPath } from '../utils/event-board';
import type { TrendPoint } from './trend-chart';

const TrendChart = lazy(() => import('./trend-chart').then((m) => ({ default: m.TrendChart })));

const byDate = (a: BoardResult, b: BoardResult) => a.date.localeCompare(b.date) || a.driver.displayName.localeCompare(b.driver.displayName);

/** The car's % off the class's fastest per event: its best driver that day, in date order. */
function trendPoints(results: readonly BoardResult[]): TrendPoint[] {
  const best = new Map<string, BoardResult>();
  for (const r of [...results].sort(byDate)) {
    if (r.pctOffClassFastest === null) continue;
    const seen = best.get(r.eventId);
    if (!seen || (seen.pctOffClassFastest ?? Infinity) > r.pctOffClassFastest) best.set(r.eventId, r);
  }
  return [...best.values()].map((r, i) => ({
    x: i + 1,
    y: r.pctOffClassFastest ?? 0,
    tick: formatShortDay(r.date),
    label: `${r.eventName}, ${formatDay(r.date)}: ${formatPercent(r.pctOffClassFastest ?? 0)}`,
  }));
}

/** Where an event's name on the board leads: that event, every team driver in the class ranked in one list. */
interface EventLinks {
  teamId: string;
  season: number;
}

/** One event of the car on a phone: where and who on top, its numbers under them, all within the screen's width. */
function ResultItem({ result: r, hasFactor, links }: { result: BoardResult; hasFactor: boolean; links: EventLinks }) {
  const noTime = noTimeWords(r);
  const off = r.aloneInClass ? 'No other time in class' : offFastestWords(r.pctOffClassFastest);
  const more = [
    r.rankInClass === null ? null : `Rank ${r.rankInClass}`,
    r.bestRawSec === null ? null : bestRawWords(r.bestRawSec, r.bestRawCones),
    hasFactor && r.indexSec !== null ? `Index ${boardTime(r.indexSec)} s` : null,
  ].filter((part) => part !== null);
  return (
    // The event's link reaches over the whole item, a target for a thumb; read aloud, it is named by the event alone.
    <li className="relative border-b border-line py-2 last:border-b-0">
      <Link
        to={eventBoardPath(links.teamId, links.season, r.eventId)}
        className="block font-semibold text-balance wrap-anywhere text-link underline after:absolute after:inset-0"
      >
        {r.eventName}
      </Link>
      <p className="text-xs wrap-anywhere text-ink-muted">
        {formatDay(r.date)} · {r.driver.displayName}
      </p>
      <p className="tabular-figures flex flex-wrap items-baseline gap-x-3">
        {noTime ? (
          <span className="font-bold wrap-anywhere">{noTime}</span>
        ) : (
          <span className="text-base font-bold whitespace-nowrap">
            <span className="sr-only">Adjusted </span>
            {boardTime(r.bestAdjustedSec)}
            {r.bestAdjustedSec === null ? null : ' s'}
          </span>
        )}
        {off ? (
          <span className="whitespace-nowrap">
            <span className="sr-only">, </span>
            {off}
          </span>
        ) : null}
      </p>
      {more.length > 0 ? (
        <p className="tabular-figures flex flex-wrap gap-x-2 text-xs text-ink-muted">
          {more.map((part, i) => (
            <span key={part} className="whitespace-nowrap">
              {i > 0 ? <span className="sr-only">, </span> : null}
              {part}
            </span>
          ))}
        </p>
      ) : null}
    </li>
  );
}

/**
 * The car's events on a phone: one list item each, so the gap to the class's fastest sits under its event
 * instead of a swipe away. From the `sm` width up the table takes its place; only one of the two is ever
 * displayed, so screen readers meet the results once.
 */
function ResultsList({ car, hasFactor, links }: { car: BoardCar; hasFactor: boolean; links: EventLinks }) {
  const results = [...car.results].sort(byDate);
  return (
    <div className="flex flex-col gap-1 text-sm sm:hidden">
      <p className="text-xs text-ink-muted">Best adjusted time, cones added, and how far off the class’s fastest.</p>
      <ol aria-label={`Results of ${car.car.name}`} className="flex flex-col">
        {results.map((r) => (
          <ResultItem key={`${r.eventId}-${r.driver.id}`} result={r} hasFactor={hasFactor} links={links} />
        ))}
      </ol>
    </div>
  );
}

function ResultsTable({ car, hasFactor, links }: { car: BoardCar; hasFactor: boolean; links: EventLinks }) {
  const results = [...car.results].sort(byDate);
  const head = 'px-1.5 py-2 text-right align-bottom font-semibold';
  const num = 'tabular-figures px-1.5 py-2 text-right whitespace-nowrap';
  return (
    // Should the table be wider than its box, the event column stays put while the numbers scroll past it.
    <SideScroll label={`Results of ${car.car.name}`}>
      <table className="w-full border-collapse text-left text-sm">
        <thead>
          <tr className="border-b border-line text-ink-muted">
            <th scope="col" className="sticky left-0 bg-surface py-2 pr-2 font-semibold">
              Event, date, driver
            </th>
            {/* What the class is compared on comes first; raw and index follow. */}
            <th scope="col" className={head}>
              <span className="whitespace-nowrap">Adjusted (s)</span>
              <span className="block text-xs font-normal">best, with cones</span>
            </th>
            <th scope="col" className={head}>
              <span className="whitespace-nowrap">Off fastest</span>
              <span className="block text-xs font-normal">in class</span>
            </th>
            <th scope="col" className={head}>Rank</th>
            <th scope="col" className={head}>
              <span className="whitespace-nowrap">Best raw (s)</span>
              <span className="block text-xs font-normal">cones not added</span>
            </th>
            <th scope="col" className={head}>Index (s)</th>
          </tr>
        </thead>
        <tbody>
          {results.map((r) => (
            <tr key={`${r.eventId}-${r.driver.id}`} className="border-b border-line align-top">
              <th scope="row" className="sticky left-0 max-w-40 min-w-32 bg-surface py-2 pr-2 text-left font-normal">
                <Link
                  to={eventBoardPath(links.teamId, links.season, r.eventId)}
                  className="block py-0.5 font-semibold wrap-anywhere text-link underline"
                >
                  {r.eventName}
                </Link>
                <span className="block text-xs text-ink-muted">
                  {formatDay(r.date)} · {r.driver.displayName}
                </span>
              </th>
              <td className={`${num} font-bold`}>{noTimeWords(r) ?? boardTime(r.bestAdjustedSec)}</td>
              <td className={num}>
                {r.pctOffClassFastest === null ? '—' : formatPercent(r.pctOffClassFastest)}
                {/* Wrapped to the column's width, so the column stays narrow. */}
                {r.aloneInClass ? <span className="block text-xs font-normal whitespace-normal text-ink-muted">no other time</span> : null}
              </td>
              <td className={num}>{r.rankInClass ?? '—'}</td>
              <td className={num}>
                {boardTime(r.bestRawSec)}
                {/* The best raw time may come from a run with cones, slower once they are added than the adjusted time's run. */}
                {rawConesWords(r.bestRawCones) ? ' ' : null}
                {rawConesWords(r.bestRawCones) ? <span className="block text-xs font-normal text-ink-muted">{rawConesWords(r.bestRawCones)}</span> : null}
              </td>
              <td className={num}>{hasFactor ? boardTime(r.indexSec) : '—'}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </SideScroll>
  );
}

function SetupSummary({ car }: { car: BoardCar }) {
  const units = useUnits();
  if (!car.setup) {
    return (
      <p className="text-sm text-ink-muted">
        {car.sharing === 'results' ? 'Results only — setup and tread not shared.' : 'Setup shared, but none is recorded for this season yet.'}
      </p>
    );
  }
  const lines = setupLines(car.setup, units);
  return (
    <div className="flex flex-col gap-1">
      <p className="text-sm font-semibold">
        Setup at the latest event: {car.setup.label} <span className="font-normal text-ink-muted">(from {formatDay(car.setup.effectiveFrom)})</span>
      </p>
      <table className="w-full max-w-sm border-collapse text-left text-sm" aria-label={`Setup of ${car.car.name}`}>
        <thead>
          <tr className="text-ink-muted">
            <th scope="col" className="py-1 pr-2 font-semibold">
              <span className="sr-only">Setting</span>
            </th>
            <th scope="col" className="py-1 pr-2 text-right font-semibold">Front</th>
            <th scope="col" className="py-1 text-right font-semibold">Rear</th>
          </tr>
        </thead>
        <tbody>
          {lines.map((line) => (
            <tr key={line.label} className="border-t border-line">
              <th scope="row" className="py-1 pr-2 font-semibold">{line.label}</th>
              <td className="tabular-figures py-1 pr-2 text-right">{line.front}</td>
              <td className="tabular-figures py-1 text-right">{line.rear}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

/** The latest tread per axle, for a car that shares its setup; nothing for one that shares results only. */
function WearSummary({ car }: { car: BoardCar }) {
  const units = useUnits();
  if (car.sharing !== 'results_and_setup') return null;
  if (!car.wear) return <p className="text-sm text-ink-muted">No tread readings this season yet.</p>;
  return (
    <div className="flex flex-col gap-1">
      <p className="text-sm font-semibold">Tread at the latest reading (mean of both tyres)</p>
      <ul aria-label={`Tread of ${car.car.name}`} className="tabular-figures flex flex-col gap-0.5 text-sm wrap-anywhere">
        <li>{wearLine('Front', car.wear.front, units)}</li>
        <li>{wearLine('Rear', car.wear.rear, units)}</li>
      </ul>
    </div>
  );
}

/**
 * The car's trend against its class's fastest. A car with no classmate that has a time this season is
 * only ever compared with itself, so it gets no trend, only that sentence.
 */
function Trend({ car, classCode, alone }: { car: BoardCar; classCode: string; alone: boolean }) {
  const points = trendPoints(car.results);
  const words = alone ? aloneWords(classCode) : trendWords(car.trendPctPerEvent, points.length);
  return (
    <div className="flex flex-col gap-1">
      <p className="text-sm font-semibold">{words}</p>
      {!alone && points.length >= 2 ? (
        <ErrorBoundary fallback={() => <p className="text-sm text-ink-muted">The trend line could not be drawn; the table above has the same numbers.</p>}>
          <Suspense fallback={<div className="h-32 max-w-sm rounded border border-dashed border-line-strong" aria-hidden="true" />}>
            <TrendChart
              points={points}
              summary={`${car.car.name}: percent off the class’s fastest over ${points.length} events. ${words}`}
            />
          </Suspense>
        </ErrorBoundary>
      ) : null}
    </div>
  );
}

function BoardCarCard({
  car,
  classCode,
  hasFactor,
  alone,
  links,
}: {
  car: BoardCar;
  classCode: string;
  hasFactor: boolean;
  alone: boolean;
  links: EventLinks;
}) {
  const headingId = useId();
  return (
    <article aria-labelledby={headingId} className="flex min-w-0 flex-col gap-3 rounded border border-line p-2.5 sm:p-3">
      <div className="flex flex-wrap items-baseline gap-x-2">
        <h3 id={headingId} className="text-lg font-bold wrap-anywhere">
          {car.car.name}
          {car.car.carNumber ? <span className="tabular-figures font-semibold text-ink-muted"> #{car.car.carNumber}</span> : null}
        </h3>
        <span className="text-sm text-ink-muted">{car.owner.displayName}’s car</span>
      </div>
      {car.results.length === 0 ? (
        <p className="text-sm text-ink-muted">No results this season yet.</p>
      ) : (
        <>
          <ResultsList car={car} hasFactor={hasFactor} links={links} />
          {/* Not displayed on a phone, where the list stands in for it. */}
          <div className="hidden sm:block">
            <ResultsTable car={car} hasFactor={hasFactor} links={links} />
          </div>
        </>
      )}
      {car.results.length > 0 ? <Trend car={car} classCode={classCode} alone={alone} /> : null}
      <SetupSummary car={car} />
      <WearSummary car={car} />
    </article>
  );
}

/** The team's season, class by class: every entered car's results, its trend, and its setup and tread when shared. */
export function ClassBoardView({ board }: { board: ClassBoard }) {
  if (board.classes.length === 0) {
    return <EmptyState message={`No cars are entered in ${board.team.name} yet. Enter a car on the team page and it shows here.`} />;
  }
  const anySetup = board.classes.some((c) => c.cars.some((car) => car.setup));
  return (
    <div className="flex min-w-0 flex-col gap-6">
      {anySetup ? (
        <Caution title="Setups are starting points">
          <p>
            A teammate’s setup suits their car, tyres and driving. Before copying a value, check it against your car maker’s data and your
            event’s rules; have alignment and spring work done by someone qualified.
          </p>
        </Caution>
      ) : null}
      {board.classes.map((group) => (
        <section key={group.classCode} aria-label={`Class ${group.classCode}`} className="flex min-w-0 flex-col gap-3 rounded-lg border border-line bg-surface p-3 sm:p-4">
          <div className="flex flex-wrap items-baseline justify-between gap-2">
            <h2 className="text-xl font-bold">Class {group.classCode}</h2>
            <p className="tabular-figures text-sm text-ink-muted">
              {group.factor === null ? `No factor entered for ${board.season}` : `Factor ${formatFactor(group.factor)}`}
            </p>
          </div>
          {group.factor === null ? (
            <p className="text-sm text-ink-muted">
              No index times for this class yet: a captain enters its {board.season} factor on{' '}
              <Link to={recordPath.team(board.team.id)} className="font-semibold text-link underline">
                the team page
              </Link>
              .
            </p>
          ) : null}
          {group.cars.map((car) => (
            <BoardCarCard
              key={car.car.id}
              car={car}
              classCode={group.classCode}
              hasFactor={group.factor !== null}
              links={{ teamId: board.team.id, season: board.season }}
              alone={!group.cars.some((other) => other !== car && other.results.some((r) => r.bestAdjustedSec !== null))}
            />
          ))}
        </section>
      ))}
    </div>
  );
}
