import { queryOptions, useQuery } from '@tanstack/react-query';
import type { OwnShop } from '../../../../shared/schemas/shop.ts';
import { api } from '../../../lib/api-client.ts';
import { shopSettingsKeys } from './keys.ts';

export async function getOwnShop(signal?: AbortSignal): Promise<OwnShop> {
  return (await api.get<{ shop: OwnShop }>('/api/shop', { signal })).shop;
}

export const getOwnShopQueryOptions = () => queryOptions({ queryKey: shopSettingsKeys.detail(), queryFn: ({ signal }) => getOwnShop(signal) });

export function useOwnShop() {
  return useQuery(getOwnShopQueryOptions());
}
