import { useId } from 'react';
import { Link } from 'react-router-dom';
import { ChevronLeft, ChevronRight } from 'lucide-react';
import type { ClassBoard } from '@shared/collab/team.schema';
import { EmptyState } from '@/components/ui/empty-state';
import { formatDay } from '@/lib/dates';
import { bestRawWords, boardTime, formatFactor, noTimeWords, offFastestWords } from '../utils/board-format';
import {
  boardEvents,
  eventBoardPath,
  eventClasses,
  neighbourEvents,
  runsWords,
  seasonBoardPath,
  type BoardEvent,
  type EventClass,
  type EventLine,
} from '../utils/event-board';
import { BackLink } from '@/components/ui/back-link';

function Line({ line, hasFactor }: { line: EventLine; hasFactor: boolean }) {
  const { car, result } = line;
  const noTime = noTimeWords(result);
  const off = result.aloneInClass ? 'No other time in class' : offFastestWords(result.pctOffClassFastest);
  return (
    <li className="flex items-start gap-3 border-b border-line py-3 last:border-b-0">
      <p className="tabular-figures w-8 shrink-0 text-center text-2xl font-extrabold">
        {result.rankInClass === null ? (
          <>
            <span className="sr-only">No rank</span>
            <span aria-hidden="true">—</span>
          </>
        ) : (
          <>
            <span className="sr-only">Rank </span>
            {result.rankInClass}
          </>
        )}
        {line.tied ? <span className="block text-xs font-normal text-ink-muted"> tie</span> : null}
      </p>
      <div className="min-w-0 flex-1">
        <p className="font-semibold wrap-anywhere">{result.driver.displayName}</p>
        <p className="text-sm wrap-anywhere text-ink-muted">
          {car.name}
          {car.carNumber ? <span className="tabular-figures"> #{car.carNumber}</span> : null}
        </p>
        {noTime ? null : <p className="text-xs text-ink-muted">{runsWords(result.runs)}</p>}
      </div>
      <div className="tabular-figures max-w-[50%] shrink-0 text-right">
        {noTime ? (
          <p className="font-bold wrap-anywhere">{noTime}</p>
        ) : (
          <p className="text-2xl font-extrabold">
            <span className="sr-only">Adjusted </span>
            {boardTime(result.bestAdjustedSec)}
            {result.bestAdjustedSec === null ? null : <span className="text-sm font-semibold"> s</span>}
          </p>
        )}
        {off ? <p className="text-sm">{off}</p> : null}
        {hasFactor && result.indexSec !== null ? <p className="text-sm">Index {boardTime(result.indexSec)} s</p> : null}
        {result.bestRawSec !== null ? (
          <p className="text-xs text-ink-muted">{bestRawWords(result.bestRawSec, result.bestRawCones)}</p>
        ) : null}
      </div>
    </li>
  );
}

/** One class at one event: every team driver in one list, fastest first, days without a time last. */
function EventClassRanking({ group, season }: { group: EventClass; season: number }) {
  const headingId = useId();
  const hasFactor = group.factor !== null;
  return (
    <section aria-labelledby={headingId} className="flex min-w-0 flex-col gap-2 rounded-lg border border-line bg-surface px-3 py-3">
      <div className="flex flex-wrap items-baseline justify-between gap-x-2">
        <h2 id={headingId} className="text-xl font-bold">
          Class {group.classCode}
        </h2>
        <p className="tabular-figures text-sm text-ink-muted">
          {group.factor === null ? `No factor entered for ${season}` : `Factor ${formatFactor(group.factor)}`}
        </p>
      </div>
      <ol aria-label={`Class ${group.classCode} ranking`} className="flex flex-col">
        {group.lines.map((line) => (
          <Line key={`${line.car.id}-${line.result.driver.id}`} line={line} hasFactor={hasFactor} />
        ))}
      </ol>
    </section>
  );
}

function StepLink({ teamId, season, event, direction }: { teamId: string; season: number; event: BoardEvent; direction: 'Previous' | 'Next' }) {
  const Icon = direction === 'Previous' ? ChevronLeft : ChevronRight;
  return (
    <Link
      to={eventBoardPath(teamId, season, event.eventId)}
      className={`flex min-h-tap min-w-0 items-center gap-1 rounded border border-line px-2 py-1 font-semibold text-link hover:bg-accent-soft ${
        direction === 'Next' ? 'flex-row-reverse text-right' : ''
      }`}
    >
      <Icon aria-hidden="true" className="size-5 shrink-0" />
      <span className="min-w-0">
        <span className="block text-xs font-normal text-ink-muted">{direction} event</span>
        <span className="sr-only">: </span>
        <span className="block wrap-anywhere">{event.eventName}</span>
      </span>
    </Link>
  );
}

/** The events either side of this one in the season, one tap each. */
function EventSteps({ teamId, season, previous, next }: { teamId: string; season: number; previous: BoardEvent | null; next: BoardEvent | null }) {
  if (!previous && !next) return null;
  return (
    <nav aria-label="Other events this season" className="grid grid-cols-2 gap-2">
      {previous ? <StepLink teamId={teamId} season={season} event={previous} direction="Previous" /> : <span />}
      {next ? <StepLink teamId={teamId} season={season} event={next} direction="Next" /> : null}
    </nav>
  );
}

/**
 * One event of the class board: every team car's drivers in each class there, ranked in one list that fits
 * a phone's width. It reads the same answer as the whole board, so coming from it costs no request.
 */
export function ClassBoardEventView({ board, eventId }: { board: ClassBoard; eventId: string }) {
  const teamId = board.team.id;
  const event = boardEvents(board).find((e) => e.eventId === eventId);
  const back = (
    <BackLink to={seasonBoardPath(teamId, board.season)}>Whole class board</BackLink>
  );
  if (!event) {
    return (
      <div className="flex min-w-0 flex-col gap-4">
        <title>{`Class board · ${board.team.name} · Scrubline`}</title>
        {back}
        <h1 className="text-3xl font-extrabold">Event not on the board</h1>
        <EmptyState message={`No team car has a result at this event in ${board.season}. Pick an event on the class board.`} />
      </div>
    );
  }

  const { previous, next } = neighbourEvents(board, eventId);
  return (
    <div className="flex min-w-0 flex-col gap-4">
      <title>{`${event.eventName} · Class board · ${board.team.name} · Scrubline`}</title>
      <div className="flex flex-col gap-1">
        {back}
        <h1 className="text-3xl font-extrabold wrap-anywhere">{event.eventName}</h1>
        <p className="text-ink-muted">
          {formatDay(event.date)} · {board.team.name}
        </p>
        <p className="text-sm text-ink-muted">
          Each team driver’s best adjusted time (cones added), fastest first, against the fastest on the team in the class. Equal times share a
          rank; a day without a time comes last. Runs by co-drivers who are not on the team are left out.
        </p>
      </div>
      {eventClasses(board, eventId).map((group) => (
        <EventClassRanking key={group.classCode} group={group} season={board.season} />
      ))}
      <EventSteps teamId={teamId} season={board.season} previous={previous} next={next} />
    </div>
  );
}
