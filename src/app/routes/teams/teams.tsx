import { useNavigate } from 'react-router-dom';
import { recordPath } from '@/config/record-paths';
import { SectionCard } from '@/components/ui/section-card';
import { SectionBoundary } from '@/components/errors/section-boundary';
import { CreateTeamForm } from '@/features/teams/components/create-team-form';
import { TeamList } from '@/features/teams/components/team-list';

/** The user's teams, and starting a new one. */
export function TeamsPage() {
  const navigate = useNavigate();
  return (
    <div className="flex max-w-2xl flex-col gap-6">
      <title>Teams · Scrubline</title>
      <div className="flex flex-col gap-1">
        <h1 className="text-3xl font-extrabold">Teams</h1>
        <p className="text-ink-muted">A team compares its members’ cars class by class over the season, on its class board.</p>
      </div>
      <SectionBoundary title="Your teams">
        <TeamList />
      </SectionBoundary>
      <SectionCard title="Start a team">
        <CreateTeamForm onCreated={(team) => void navigate(recordPath.team(team.id))} />
      </SectionCard>
    </div>
  );
}
