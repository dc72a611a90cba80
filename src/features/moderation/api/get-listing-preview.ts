import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ListingPage } from '../../../../shared/schemas/catalog.ts';
import { api } from '../../../lib/api-client.ts';
import { moderationKeys } from './keys.ts';

/** The listing page as a shopper would see it, from the version waiting for review. */
export const getListingPreview = (slug: string, signal?: AbortSignal) =>
  api.get<ListingPage>(`/api/listings/${encodeURIComponent(slug)}?version=draft`, { signal });

export const getListingPreviewQueryOptions = (slug: string) =>
  queryOptions({ queryKey: moderationKeys.preview(slug), queryFn: ({ signal }) => getListingPreview(slug, signal), staleTime: 0 });

export function useListingPreview(slug: string | undefined) {
  return useQuery({ ...getListingPreviewQueryOptions(slug ?? ''), enabled: Boolean(slug) });
}
