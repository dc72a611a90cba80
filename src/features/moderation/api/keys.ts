import type { ModerationShopsQuery } from '../../../../shared/schemas/catalog.ts';

export const moderationKeys = {
  all: ['moderation'] as const,
  queue: () => [...moderationKeys.all, 'queue'] as const,
  audit: (page: number) => [...moderationKeys.all, 'audit', page] as const,
  shops: (filters: ModerationShopsQuery) => [...moderationKeys.all, 'shops', filters] as const,
  review: (id: string) => [...moderationKeys.all, 'review', id] as const,
};
