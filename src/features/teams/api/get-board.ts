import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { ClassBoard } from '@shared/collab/team.schema';
import { api } from '@/lib/api-client';
import { teamKeys } from './team-keys';
import { teamPath } from './use-team-write';

/** The class board for a season; without one, the server's (the current year). */
export function getBoard(teamId: string, season: number | null, { signal }: { signal?: AbortSignal } = {}): Promise<ClassBoard> {
  const query = season === null ? '' : `?${new URLSearchParams({ season: String(season) }).toString()}`;
  return api.get(`${teamPath(teamId)}/board${query}`, { signal });
}

export function boardQueryOptions(teamId: string, season: number | null) {
  return queryOptions({
    queryKey: teamKeys.board(teamId, season),
    queryFn: ({ signal }) => getBoard(teamId, season, { signal }),
    meta: { errorsShownInline: true },
  });
}

/** Keeps the last season on screen while another is fetched. */
export function useBoard(teamId: string, season: number | null) {
  return useQuery({ ...boardQueryOptions(teamId, season), placeholderData: keepPreviousData });
}
