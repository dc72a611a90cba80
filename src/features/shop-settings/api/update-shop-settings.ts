import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { OwnShop, ShopSettingsInput } from '../../../../shared/schemas/shop.ts';
import { api } from '../../../lib/api-client.ts';
import { shopSettingsKeys } from './keys.ts';

export async function updateShopSettings(input: ShopSettingsInput): Promise<OwnShop> {
  return (await api.patch<{ shop: OwnShop }>('/api/shop', input)).shop;
}

export function useUpdateShopSettings() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateShopSettings,
    onSuccess: (shop) => {
      queryClient.setQueryData(shopSettingsKeys.detail(), shop);
      void queryClient.invalidateQueries({ queryKey: shopSettingsKeys.all });
    },
  });
}
