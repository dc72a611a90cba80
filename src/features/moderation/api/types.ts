import type { ListingContentParsed, ListingState } from '../../../../shared/schemas/listing.ts';
import type { ShopState } from '../../../../shared/schemas/shop.ts';
import type { Page } from '../../../../shared/schemas/pagination.ts';

/** GET /api/moderation/queue/listings and /queue/shops (server/features/moderation/moderation.service.ts) */
export type QueueShop = { id: string; name: string; slug: string; state: ShopState; description: string; owner: { name: string; email: string }; createdAt: number };
export type QueueListing = {
  id: string;
  slug: string;
  state: ListingState;
  pendingReview: boolean;
  kind: 'new' | 'edit';
  title: string;
  shop: { id: string; name: string; slug: string; state: ShopState };
  draft: ListingContentParsed;
  live: ListingContentParsed | null;
  previewUrl: string;
  submittedAt: number;
};

export type AuditEntry = {
  id: string;
  at: number;
  actor: { id: string; name: string | null; email: string | null };
  action: string;
  subject: { type: 'shop' | 'listing'; id: string; label: string | null };
  reason: string | null;
};
export type AuditPage = Page<AuditEntry>;
export type ShopMove = 'approve' | 'reject' | 'suspend' | 'restore';
