import { lazy, Suspense, useLayoutEffect } from 'react';
import { useNavigationType, useParams, useSearchParams } from 'react-router-dom';
import { recordPath } from '@/config/record-paths';
import { useBoard } from '@/features/teams/api/get-board';
import { ClassBoardView } from '@/features/teams/components/class-board';
import { SeasonPicker } from '@/features/teams/components/season-picker';
import { TeamUnavailable } from '@/features/teams/components/team-unavailable';
import { currentSeason, parseSeason } from '@/features/teams/utils/board-format';
import { EVENT_PARAM } from '@/features/teams/utils/event-board';
import { BackLink } from '@/components/ui/back-link';

// One event's ranking is loaded when it is first opened.
const ClassBoardEventView = lazy(() => import('@/features/teams/components/class-board-event').then((m) => ({ default: m.ClassBoardEventView })));

/**
 * The team's class board for a season (`?season=2026`; without it, the server's current season), or one event
 * of it (`&event=:eventId`), every team driver in the class there ranked in one list.
 */
export function ClassBoardPage() {
  const { teamId = '' } = useParams();
  const [params, setParams] = useSearchParams();
  const asked = parseSeason(params.get('season'));
  const eventId = params.get(EVENT_PARAM);
  const { data: board, isPending, isPlaceholderData, error, refetch } = useBoard(teamId, asked);
  const season = asked ?? board?.season ?? currentSeason();

  // Between the whole board and an event, a tapped link starts at the top; Back returns to where the reader was.
  const navigationType = useNavigationType();
  useLayoutEffect(() => {
    if (navigationType === 'PUSH') window.scrollTo(0, 0);
  }, [eventId, navigationType]);

  const loadingEvent = <p className="text-ink-muted">Loading the event…</p>;
  if (isPending) return eventId === null ? <p className="text-ink-muted">Loading the class board…</p> : loadingEvent;
  if (!board) return <TeamUnavailable error={error} failedTitle="The class board did not load" onRetry={() => void refetch()} />;

  if (eventId !== null) {
    return isPlaceholderData ? (
      loadingEvent
    ) : (
      <Suspense fallback={loadingEvent}>
        <ClassBoardEventView board={board} eventId={eventId} />
      </Suspense>
    );
  }

  return (
    <div className="flex min-w-0 flex-col gap-6">
      <title>{`Class board · ${board.team.name} · Scrubline`}</title>
      <div className="flex flex-col gap-2">
        <BackLink to={recordPath.team(teamId)}>{board.team.name}</BackLink>
        <h1 className="text-3xl font-extrabold">Class board</h1>
        <p className="text-ink-muted">
          Each car’s best times per event, against the fastest in its class on this team. Index times use the factors the team’s captains
          entered. Tap an event to see the team’s drivers there in one list.
        </p>
      </div>
      <div className="flex flex-wrap items-center gap-3">
        <SeasonPicker season={season} onChange={(next) => setParams({ season: String(next) }, { replace: true })} />
        {isPlaceholderData ? (
          <p role="status" className="text-sm text-ink-muted">
            Loading {season}…
          </p>
        ) : null}
      </div>
      {isPlaceholderData ? null : <ClassBoardView board={board} />}
    </div>
  );
}
