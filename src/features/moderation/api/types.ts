import type { ListingContent, ListingState } from '../../../../shared/schemas/listing.ts';
import type { ShopState } from '../../../../shared/schemas/shop.ts';

/** GET /api/moderation/queue (server/features/moderation/moderation.service.ts) */
export type QueueShop = { id: string; name: string; slug: string; state: ShopState; description: string; owner: { name: string; email: string }; createdAt: number };
export type QueueListing = {
  id: string;
  slug: string;
  state: ListingState;
  pendingReview: boolean;
  kind: 'new' | 'edit';
  title: string;
  shop: { id: string; name: string; slug: string; state: ShopState };
  draft: ListingContent;
  live: ListingContent | null;
  previewUrl: string;
  submittedAt: number;
};
export type ModerationQueue = { shops: QueueShop[]; listings: QueueListing[] };

export type AuditEntry = {
  id: string;
  at: number;
  actor: { id: string; name: string | null; email: string | null };
  action: string;
  subject: { type: 'shop' | 'listing'; id: string; label: string | null };
  reason: string | null;
};
export type AuditPage = { items: AuditEntry[]; total: number; page: number; pageSize: number };
export type ShopMove = 'approve' | 'reject' | 'suspend' | 'restore';
