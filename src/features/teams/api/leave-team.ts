import { useMutation, useQueryClient } from '@tanstack/react-query';
import { teamKeys } from './team-keys';
import { removeMember } from './remove-member';
import { refreshAfterWrite } from '@/lib/refresh-after-write';

/**
 * The signed-in member leaves the team. Only the list of teams is refreshed: the team's own page
 * would now answer "not found", and the caller leaves it.
 */
export function useLeaveTeam(teamId: string, currentUserId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => removeMember(teamId, currentUserId),
    networkMode: 'always',
    meta: { errorsShownInline: true },
    onSuccess: () => refreshAfterWrite(queryClient, { queryKey: teamKeys.mine() }),
  });
}
