import { queryOptions, useQuery } from '@tanstack/react-query';
import type { InvitationPreview } from '@shared/collab/invitation.schema';
import { api } from '@/lib/api-client';

/** Query key of one invitation link's preview. */
export const invitationKey = (token: string) => ['invitation', token] as const;

/** What an invitation link offers; anyone holding the link may read it, signed in or not. */
export function getInvitation(token: string, { signal }: { signal?: AbortSignal } = {}): Promise<InvitationPreview> {
  return api.get(`/api/invitations/${encodeURIComponent(token)}`, { signal });
}

export function invitationQueryOptions(token: string) {
  return queryOptions({
    queryKey: invitationKey(token),
    queryFn: ({ signal }) => getInvitation(token, { signal }),
    meta: { errorsShownInline: true },
  });
}

export function useInvitation(token: string) {
  return useQuery(invitationQueryOptions(token));
}
