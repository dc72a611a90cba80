import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { type OpenShopInput, shopStateSchema } from '../../../../shared/schemas/auth.ts';
import { api } from '../../../lib/api-client.ts';
import { shopKeys } from './keys.ts';

const createShopResponseSchema = z.object({
  shop: z.object({ id: z.string(), slug: z.string(), name: z.string(), state: shopStateSchema }),
});
export type CreatedShop = z.infer<typeof createShopResponseSchema>['shop'];

export async function createShop(input: OpenShopInput): Promise<CreatedShop> {
  return createShopResponseSchema.parse(await api.post<unknown>('/api/shops', input)).shop;
}

/** The caller refreshes the signed-in account too: opening a shop makes the user a seller. */
export function useCreateShop() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createShop,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: shopKeys.all }),
  });
}
