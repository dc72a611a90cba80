import type { ListingPage } from '../../../../shared/schemas/catalog.ts';
import type { ListingContent, ListingState } from '../../../../shared/schemas/listing.ts';
import type { Page } from '../../../../shared/schemas/pagination.ts';
import type { ShopState } from '../../../../shared/schemas/shop.ts';

/** GET /api/moderation/queue/shops (server/features/moderation/moderation.service.ts) */
export type QueueShop = { id: string; name: string; slug: string; state: ShopState; description: string; owner: { name: string; email: string }; createdAt: number; revision: number };
export type QueueListing = {
  id: string;
  slug: string;
  state: ListingState;
  pendingReview: boolean;
  /** the revision shown; approve/reject send it back (409 when the seller changed it since) */
  revision: number;
  kind: 'new' | 'edit';
  title: string;
  shop: { id: string; name: string; slug: string; state: ShopState };
  draft: ListingContent;
  live: ListingContent | null;
  previewUrl: string;
  submittedAt: number;
};
/** A live (or suspended) shop's new name/description, waiting; the public shop shows `before`. */
export type QueueShopChange = {
  id: string;
  slug: string;
  state: ShopState;
  owner: { name: string; email: string };
  revision: number;
  before: { name: string; description: string };
  after: { name: string; description: string };
  changed: Array<'name' | 'description'>;
  submittedAt: number;
};
/** GET /api/moderation/listings/:id */
/** A motif of the listing that is the same artwork as another shop's (server: moderation.service.ts MotifReuse). */
export type MotifReuse = { motifId: string; motifName: string; otherShop: { name: string; slug: string }; otherMotifName: string };
export type ListingReview = { listing: QueueListing; page: ListingPage; motifReuse?: MotifReuse[] };

export type AuditEntry = {
  id: string;
  at: number;
  actor: { id: string; name: string | null; email: string | null };
  action: string;
  subject: { type: 'shop' | 'listing'; id: string; label: string | null; href?: string | null };
  reason: string | null;
};
export type AuditPage = Page<AuditEntry>;
export type ShopMove = 'approve' | 'reject' | 'suspend' | 'restore';
