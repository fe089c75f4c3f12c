import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Shop, UpdateShopSettingsInput } from '@shared/collab/shop.schema';
import { api } from '@/lib/api-client';
import { shopKeys } from './shop-keys';

export function updateShopSettings(shopId: string, input: UpdateShopSettingsInput): Promise<Shop> {
  return api.patch(`/api/shops/${encodeURIComponent(shopId)}/settings`, input);
}

/** A shop admin sets the invoice tax rate and currency and the build sheet's tolerance. */
export function useUpdateShopSettings(shopId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: UpdateShopSettingsInput) => updateShopSettings(shopId, input),
    networkMode: 'always',
    meta: { errorsShownInline: true },
    onSuccess: (shop) => {
      queryClient.setQueryData(shopKeys.detail(shopId), shop);
    },
  });
}
