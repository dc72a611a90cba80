export const sellerListingKeys = {
  all: ['seller-listings'] as const,
  list: (filters: { state?: string } = {}) => [...sellerListingKeys.all, 'list', filters] as const,
  detail: (id: string) => [...sellerListingKeys.all, 'detail', id] as const,
};
export const fontKeys = {
  all: ['fonts'] as const,
  list: () => [...fontKeys.all, 'list'] as const,
};
