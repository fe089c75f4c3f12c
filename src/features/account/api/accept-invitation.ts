import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { AcceptedInvitation } from '@shared/collab/invitation.schema';
import { api } from '@/lib/api-client';
import { refreshAfterWrite } from '@/lib/refresh-after-write';
import { invitationKey } from './get-invitation';

export function acceptInvitation(token: string): Promise<AcceptedInvitation> {
  return api.post(`/api/invitations/${encodeURIComponent(token)}/accept`);
}

/**
 * Joins the shop or team. Joining changes what the user may see almost everywhere (customers'
 * cars, a team's board, their roles), so every cached answer is refreshed — except this link's
 * preview, which would now say "used" while the page moves on; it is only marked stale.
 */
export function useAcceptInvitation(token: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => acceptInvitation(token),
    networkMode: 'always',
    meta: { errorsShownInline: true },
    onSuccess: () =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: invitationKey(token), refetchType: 'none' }),
        refreshAfterWrite(queryClient, { predicate: (query) => query.queryKey[0] !== invitationKey(token)[0] }),
      ]),
  });
}
