import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Team } from '@shared/collab/team.schema';
import { api } from '@/lib/api-client';
import { teamKeys } from './team-keys';

export function getTeam(teamId: string, { signal }: { signal?: AbortSignal } = {}): Promise<Team> {
  return api.get(`/api/teams/${encodeURIComponent(teamId)}`, { signal });
}

export function teamQueryOptions(teamId: string) {
  return queryOptions({
    queryKey: teamKeys.detail(teamId),
    queryFn: ({ signal }) => getTeam(teamId, { signal }),
    meta: { errorsShownInline: true },
  });
}

/** A team: members, entered cars and (for captains) pending invitations. */
export function useTeam(teamId: string) {
  return useQuery(teamQueryOptions(teamId));
}
