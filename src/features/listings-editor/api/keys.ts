import type { ListingState } from '../../../../shared/schemas/listing.ts';
import type { PageInput } from '../../../../shared/schemas/pagination.ts';

export type SellerListingsFilters = { state?: ListingState } & PageInput;

export const sellerListingKeys = {
  all: ['seller-listings'] as const,
  list: (filters: SellerListingsFilters = {}) => [...sellerListingKeys.all, 'list', { ...filters, page: filters.page ?? 1 }] as const,
  detail: (id: string) => [...sellerListingKeys.all, 'detail', id] as const,
};
export const fontKeys = {
  all: ['fonts'] as const,
  list: () => [...fontKeys.all, 'list'] as const,
};
