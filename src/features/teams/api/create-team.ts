import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CreateTeamInput, TeamSummary } from '@shared/collab/team.schema';
import { api } from '@/lib/api-client';
import { teamKeys } from './team-keys';
import { refreshAfterWrite } from '@/lib/refresh-after-write';

/** Starts a team with the signed-in user as its captain. */
export function createTeam(input: CreateTeamInput): Promise<TeamSummary> {
  return api.post('/api/teams', input);
}

/** An online write (made at home, not at the car): tried at once, its errors shown on the form. */
export function useCreateTeam() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createTeam,
    networkMode: 'always',
    meta: { errorsShownInline: true },
    onSuccess: () => refreshAfterWrite(queryClient, { queryKey: teamKeys.mine() }),
  });
}
