import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { shopKeys } from './shop-keys';
import { refreshAfterWrite } from '@/lib/refresh-after-write';

export function removeStaff(shopId: string, userId: string): Promise<void> {
  return api.delete(`/api/shops/${encodeURIComponent(shopId)}/staff/${encodeURIComponent(userId)}`);
}

/** A shop admin takes someone off the staff. */
export function useRemoveStaff(shopId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (userId: string) => removeStaff(shopId, userId),
    networkMode: 'always',
    meta: { errorsShownInline: true },
    onSuccess: () => refreshAfterWrite(queryClient, { queryKey: shopKeys.all }),
  });
}
