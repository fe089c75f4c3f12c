import { useMutation, useQueryClient } from '@tanstack/react-query';
import type * as z from '@shared/zod';
import type { inviteInputSchema } from '@shared/collab/shop.schema';
import { api } from '@/lib/api-client';
import { shopKeys } from './shop-keys';
import { refreshAfterWrite } from '@/lib/refresh-after-write';

export type InviteStaffInput = z.output<typeof inviteInputSchema>;

/** A shop admin invites someone by e-mail; the invitation waits in the shop's list until accepted. */
export function inviteStaff(shopId: string, input: InviteStaffInput): Promise<unknown> {
  return api.post(`/api/shops/${encodeURIComponent(shopId)}/invitations`, input);
}

export function useInviteStaff(shopId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: InviteStaffInput) => inviteStaff(shopId, input),
    networkMode: 'always',
    meta: { errorsShownInline: true },
    onSuccess: () => refreshAfterWrite(queryClient, { queryKey: shopKeys.detail(shopId) }),
  });
}
