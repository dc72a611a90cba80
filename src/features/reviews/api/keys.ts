export type ReviewSource = { kind: 'listings' | 'shops'; slug: string };

export const reviewKeys = {
  all: ['reviews'] as const,
  lists: () => [...reviewKeys.all, 'list'] as const,
  list: (source: ReviewSource, page: number) => [...reviewKeys.lists(), source.kind, source.slug, { page }] as const,
  order: (orderId: string) => [...reviewKeys.all, 'order', orderId] as const,
};
