import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CreateShopInput, ShopSummary } from '@shared/collab/shop.schema';
import { api } from '@/lib/api-client';
import { shopKeys } from './shop-keys';
import { refreshAfterWrite } from '@/lib/refresh-after-write';

/** Opens a shop; the user becomes its first admin. */
export function createShop(input: CreateShopInput): Promise<ShopSummary> {
  return api.post('/api/shops', input);
}

export function useCreateShop() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createShop,
    networkMode: 'always',
    meta: { errorsShownInline: true },
    onSuccess: () => refreshAfterWrite(queryClient, { queryKey: shopKeys.mine() }),
  });
}
