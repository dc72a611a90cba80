import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { ModerationShopsPage, ModerationShopsQuery } from '../../../../shared/schemas/catalog.ts';
import { api } from '../../../lib/api-client.ts';
import { moderationKeys } from './keys.ts';

/** GET /api/moderation/shops?q=&state=&page= — every shop, any state (admins only). */
export function getShops(filters: ModerationShopsQuery, signal?: AbortSignal) {
  const qs = new URLSearchParams();
  if (filters.q) qs.set('q', filters.q);
  if (filters.state) qs.set('state', filters.state);
  if (filters.page && filters.page !== 1) qs.set('page', String(filters.page));
  const s = qs.toString();
  return api.get<ModerationShopsPage>(`/api/moderation/shops${s ? `?${s}` : ''}`, { signal });
}

export const getShopsQueryOptions = (filters: ModerationShopsQuery) =>
  queryOptions({ queryKey: moderationKeys.shops(filters), queryFn: ({ signal }) => getShops(filters, signal), placeholderData: keepPreviousData, staleTime: 5_000 });

export function useShops(filters: ModerationShopsQuery) {
  return useQuery(getShopsQueryOptions(filters));
}
