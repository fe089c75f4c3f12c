import { Link } from 'react-router-dom';
import { ChevronRight, Crown, Trophy } from 'lucide-react';
import { recordPath } from '@/config/record-paths';
import { EmptyState } from '@/components/ui/empty-state';
import { useMyTeams } from '../api/get-my-teams';

/** A small marker beside a captain's name, in words as well as an icon. */
export function CaptainMarker() {
  return (
    <span className="inline-flex items-center gap-1 rounded border border-line-strong px-2 py-0.5 text-xs font-bold text-ink-muted">
      <Crown aria-hidden="true" className="size-3.5" />
      Captain
    </span>
  );
}

/** The teams the user belongs to, each opening its page and its class board. */
export function TeamList() {
  const { data, isPending, isError } = useMyTeams();
  if (isPending) return <p className="text-ink-muted">Loading your teams…</p>;
  if (isError && !data) return <p className="text-ink-muted">Your teams could not be loaded. Try again shortly.</p>;
  const teams = data.items;
  if (teams.length === 0) {
    return <EmptyState message="You are not on a team yet. Start one below, or open the link in a captain’s invitation e-mail." />;
  }
  return (
    <ul className="flex flex-col gap-2" aria-label="Your teams">
      {teams.map((team) => (
        <li key={team.id} className="flex flex-col gap-1 rounded border border-line bg-surface p-2 sm:flex-row sm:items-center">
          <Link
            to={recordPath.team(team.id)}
            className="flex min-h-tap min-w-0 flex-1 items-center gap-2 rounded px-2 font-bold hover:bg-surface-raised"
          >
            <span className="min-w-0 wrap-anywhere">{team.name}</span>
            {team.isCaptain ? <CaptainMarker /> : null}
            <ChevronRight aria-hidden="true" className="ml-auto size-5 shrink-0 text-ink-muted" />
          </Link>
          <Link
            to={recordPath.classBoard(team.id)}
            className="inline-flex min-h-tap items-center gap-2 rounded px-2 font-semibold text-link hover:bg-accent-soft"
          >
            <Trophy aria-hidden="true" className="size-5" />
            Class board<span className="sr-only"> of {team.name}</span>
          </Link>
        </li>
      ))}
    </ul>
  );
}
