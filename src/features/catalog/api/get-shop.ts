import { queryOptions, useQuery } from '@tanstack/react-query';
import type { PublicShop } from '../../../../shared/schemas/catalog.ts';
import { api } from '../../../lib/api-client.ts';
import { catalogKeys } from './keys.ts';

/** GET /api/shops/:slug: a live shop and its live listings. */
export async function getShop(slug: string, signal?: AbortSignal): Promise<PublicShop> {
  return api.get<PublicShop>(`/api/shops/${encodeURIComponent(slug)}`, { signal });
}

export const getShopQueryOptions = (slug: string) => queryOptions({ queryKey: catalogKeys.shop(slug), queryFn: ({ signal }) => getShop(slug, signal) });

export function useShop(slug: string) {
  return useQuery(getShopQueryOptions(slug));
}
