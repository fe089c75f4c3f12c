import { useMemo } from 'react';
import { Link, useNavigate, useParams } from 'react-router-dom';
import { Trophy } from 'lucide-react';
import type { Team } from '@shared/collab/team.schema';
import { paths } from '@/config/paths';
import { recordPath } from '@/config/record-paths';
import { buttonClasses } from '@/components/ui/button';
import { SectionCard } from '@/components/ui/section-card';
import { SectionBoundary } from '@/components/errors/section-boundary';
import { useMe } from '@/features/auth/api/get-me';
import { useCars } from '@/features/cars/api/get-cars';
import { useTeam } from '@/features/teams/api/get-team';
import { EnterCarForm, type OwnCar } from '@/features/teams/components/enter-car-form';
import { EntryList } from '@/features/teams/components/entry-list';
import { FactorsEditor } from '@/features/teams/components/factors-form';
import { InviteForm, PendingInvitations } from '@/features/teams/components/invite-form';
import { LeaveTeam, MemberList } from '@/features/teams/components/member-list';
import { CaptainMarker } from '@/features/teams/components/team-list';
import { TeamUnavailable } from '@/features/teams/components/team-unavailable';
import { BackLink } from '@/components/ui/back-link';

/** The user's own cars not yet on the team: co-driven cars are their owners' to enter. */
function EnterCarSection({ team, currentUserId }: { team: Team; currentUserId: string }) {
  const { data, isPending, isError } = useCars();
  const entered = useMemo(() => new Set(team.entries.map((e) => e.car.id)), [team.entries]);
  if (isPending) return <p className="text-ink-muted">Loading your cars…</p>;
  if (isError && !data) return <p className="text-ink-muted">Your cars could not be loaded. Try again shortly.</p>;
  const own: OwnCar[] = data.items.filter((car) => car.owner.id === currentUserId && !entered.has(car.id));
  return <EnterCarForm teamId={team.id} cars={own} />;
}

/** One team: its members, its entered cars, and for captains the invitations and class factors. */
export function TeamPage() {
  const { teamId = '' } = useParams();
  const navigate = useNavigate();
  const { data: me } = useMe();
  const { data: team, isPending, error, refetch } = useTeam(teamId);

  if (!me) return null;
  if (isPending) return <p className="text-ink-muted">Loading the team…</p>;
  if (!team) return <TeamUnavailable error={error} failedTitle="The team did not load" onRetry={() => void refetch()} />;

  const entryClasses = [...new Set(team.entries.map((e) => e.classCode))];
  return (
    <div className="flex max-w-3xl flex-col gap-6">
      <title>{`${team.name} · Scrubline`}</title>
      <div className="flex flex-col gap-2">
        <BackLink to={paths.teams}>Teams</BackLink>
        <div className="flex flex-wrap items-center gap-2">
          <h1 className="min-w-0 text-3xl font-extrabold wrap-anywhere">{team.name}</h1>
          {team.isCaptain ? <CaptainMarker /> : null}
        </div>
        <Link to={recordPath.classBoard(team.id)} className={buttonClasses('primary', 'self-start')}>
          <Trophy aria-hidden="true" className="size-5" /> Class board
        </Link>
      </div>

      <SectionCard title="Members">
        <MemberList team={team} currentUserId={me.id} />
        {team.isCaptain ? null : <p className="text-sm text-ink-muted">Captains invite members and enter the class factors.</p>}
      </SectionCard>

      {team.isCaptain ? (
        <SectionCard title="Invite someone">
          <InviteForm teamId={team.id} />
          <h3 className="pt-2 font-bold">Invitations waiting</h3>
          <PendingInvitations invitations={team.pendingInvitations} />
        </SectionCard>
      ) : null}

      <SectionCard title="Entered cars">
        <EntryList team={team} />
      </SectionCard>

      <SectionCard title="Enter a car">
        <SectionBoundary title="Your cars">
          <EnterCarSection team={team} currentUserId={me.id} />
        </SectionBoundary>
      </SectionCard>

      {team.isCaptain ? (
        <SectionCard title="Class factors">
          <SectionBoundary title="The class factors">
            <FactorsEditor teamId={team.id} entryClasses={entryClasses} initialSeason={new Date().getFullYear()} />
          </SectionBoundary>
        </SectionCard>
      ) : null}

      <div>
        <LeaveTeam team={team} currentUserId={me.id} onLeft={() => void navigate(paths.teams, { replace: true })} />
      </div>
    </div>
  );
}
