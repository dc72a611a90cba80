import type { ModerationShopsQuery } from '../../../../shared/schemas/catalog.ts';
import type { PageInput } from '../../../../shared/schemas/pagination.ts';

const pageKey = (p: PageInput) => ({ page: p.page ?? 1, limit: p.limit ?? null });

export const moderationKeys = {
  all: ['moderation'] as const,
  queue: () => [...moderationKeys.all, 'queue'] as const,
  queueListings: (p: PageInput = {}) => [...moderationKeys.queue(), 'listings', pageKey(p)] as const,
  queueShopChanges: (p: PageInput = {}) => [...moderationKeys.queue(), 'shop-changes', pageKey(p)] as const,
  queueShops: (p: PageInput = {}) => [...moderationKeys.queue(), 'shops', pageKey(p)] as const,
  audit: (p: PageInput & { action?: string | undefined } = {}) => [...moderationKeys.all, 'audit', pageKey(p), p.action ?? ''] as const,
  shops: (filters: ModerationShopsQuery) => [...moderationKeys.all, 'shops', filters] as const,
  review: (id: string) => [...moderationKeys.all, 'review', id] as const,
};
