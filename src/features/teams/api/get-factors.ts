import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ClassFactor } from '@shared/collab/team.schema';
import { api } from '@/lib/api-client';
import { teamKeys } from './team-keys';
import { teamPath } from './use-team-write';

export function getFactors(teamId: string, season: number, { signal }: { signal?: AbortSignal } = {}): Promise<{ items: ClassFactor[]; count: number }> {
  return api.get(`${teamPath(teamId)}/factors?${new URLSearchParams({ season: String(season) }).toString()}`, { signal });
}

export function factorsQueryOptions(teamId: string, season: number) {
  return queryOptions({
    queryKey: teamKeys.factors(teamId, season),
    queryFn: ({ signal }) => getFactors(teamId, season, { signal }),
    meta: { errorsShownInline: true },
  });
}

/** The index factors the team's captains entered for one season. */
export function useFactors(teamId: string, season: number) {
  return useQuery(factorsQueryOptions(teamId, season));
}
