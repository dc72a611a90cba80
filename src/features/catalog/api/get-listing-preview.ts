import { queryOptions, useQuery } from '@tanstack/react-query';
import { catalogKeys } from './keys.ts';

export type PreviewPieces = Array<{ d: string; colourHex: string }>;

/**
 * The listing's design for the default name, composed by the server for its first render (the
 * picture shown until the personaliser and its font engine have loaded). Only a server render
 * fills it: the browser never asks for it, so `enabled` is off and a miss is simply no picture.
 */
export const listingPreviewQueryOptions = (slug: string) =>
  queryOptions<PreviewPieces | null>({ queryKey: [...catalogKeys.listing(slug), 'preview'], queryFn: () => null, enabled: false, staleTime: Number.POSITIVE_INFINITY });

export function useListingPreview(slug: string) {
  return useQuery(listingPreviewQueryOptions(slug));
}
