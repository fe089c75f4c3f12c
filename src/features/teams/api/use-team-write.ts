import { useMutation, useQueryClient } from '@tanstack/react-query';
import { teamKeys } from './team-keys';
import { refreshAfterWrite } from '@/lib/refresh-after-write';

export const teamPath = (teamId: string) => `/api/teams/${encodeURIComponent(teamId)}`;

/**
 * A change to a team's people, entries or factors. It is an online write (made at home, not at
 * the car): tried at once, never paused for later, its errors shown where it was asked; and it
 * refreshes everything about the team (page, factors, class board) before it counts as done.
 */
export function useTeamWrite<TInput, TResult>(
  teamId: string,
  write: (input: TInput) => Promise<TResult>,
  /** For writes of several requests: some may have landed before one failed. */
  { refreshOnError = false }: { refreshOnError?: boolean } = {},
) {
  const queryClient = useQueryClient();
  // The list of teams too: a captain may have made themselves a member.
  const refresh = () =>
    Promise.all([
      refreshAfterWrite(queryClient, { queryKey: teamKeys.ofTeam(teamId) }),
      refreshAfterWrite(queryClient, { queryKey: teamKeys.mine() }),
    ]);
  return useMutation({
    mutationFn: write,
    networkMode: 'always',
    meta: { errorsShownInline: true },
    onSuccess: refresh,
    onError: refreshOnError ? refresh : undefined,
  });
}
