import { queryOptions, useQuery } from '@tanstack/react-query';
import type { TeamSummary } from '@shared/collab/team.schema';
import { api } from '@/lib/api-client';
import { teamKeys } from './team-keys';

export function getMyTeams({ signal }: { signal?: AbortSignal } = {}): Promise<{ items: TeamSummary[]; count: number }> {
  return api.get('/api/teams/mine', { signal });
}

export function myTeamsQueryOptions() {
  return queryOptions({ queryKey: teamKeys.mine(), queryFn: ({ signal }) => getMyTeams({ signal }), meta: { errorsShownInline: true } });
}

/** The teams the signed-in user belongs to, each saying whether they captain it. */
export function useMyTeams() {
  return useQuery(myTeamsQueryOptions());
}
