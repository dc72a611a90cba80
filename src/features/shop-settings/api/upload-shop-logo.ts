import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { OwnShop } from '../../../../shared/schemas/shop.ts';
import { upload } from '../../../lib/api-client.ts';
import { shopSettingsKeys } from './keys.ts';

export async function uploadShopLogo({ file, onProgress }: { file: File; onProgress?: (f: number | null) => void }): Promise<OwnShop> {
  const form = new FormData();
  form.append('file', file);
  return (await upload<{ shop: OwnShop }>('/api/shop/logo', form, onProgress)).shop;
}

export function useUploadShopLogo() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: uploadShopLogo,
    onSuccess: (shop) => queryClient.setQueryData(shopSettingsKeys.detail(), shop),
  });
}
