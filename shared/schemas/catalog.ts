/** The public catalogue: search query, list items, the listing page and the public shop page. */
import { z } from 'zod';
import type { StoredMotifGeometry } from '../engine/motif.ts';
import type { ResolvedBlankOffer } from './blanks.ts';
import { blankKindSchema, type ListingContent, occasionSchema } from './listing.ts';
import { type Page, pageQuery, pageSchema } from './pagination.ts';
import type { RatingSummary } from './review.ts';
import { SHOP_STATES, type ShopState } from './shop.ts';

export const CATALOG_PAGE_SIZE = 24;
export const CATALOG_SORTS = ['newest', 'price_asc', 'price_desc'] as const;

const price = z.coerce.number({ error: 'Enter a price in cents.' }).int('Enter whole cents.').min(0, 'A price cannot be negative.').max(10_000_000);

export const catalogQuerySchema = pageQuery(CATALOG_PAGE_SIZE)
  .extend({
    q: z.string().trim().max(100, 'Use at most 100 characters.').optional(),
    occasion: occasionSchema.optional(),
    blank: blankKindSchema.optional(),
    /** shop slug */
    shop: z.string().trim().max(80).optional(),
    minPrice: price.optional(),
    maxPrice: price.optional(),
    sort: z.enum(CATALOG_SORTS, { error: 'Sort by newest, price_asc or price_desc.' }).default('newest'),
  })
  .refine((q) => q.minPrice === undefined || q.maxPrice === undefined || q.minPrice <= q.maxPrice, {
    message: 'The lowest price must not be above the highest.',
    path: ['minPrice'],
  });
export type CatalogQuery = z.output<typeof catalogQuerySchema>;

export const catalogItemSchema = z.object({
  id: z.string(),
  slug: z.string(),
  title: z.string(),
  shop: z.object({ slug: z.string(), name: z.string() }),
  /** the base price (the lowest a shopper pays) */
  priceMinor: z.number().int(),
  currency: z.string(),
  occasions: z.array(occasionSchema),
  /** null when the listing has no photo */
  thumbnailUrl: z.string().nullable(),
});
export type CatalogItem = z.infer<typeof catalogItemSchema>;

export const catalogPageSchema = pageSchema(catalogItemSchema);
export type CatalogPage = z.infer<typeof catalogPageSchema>;

/** GET /api/shops/:slug */
export type PublicShop = {
  shop: { name: string; slug: string; description: string; processingDays: number; shippingMinor: number; currency: string; returnPolicy: string; logoUrl: string | null };
  listings: CatalogItem[];
  /** average and count of the shop's visible reviews */
  rating: RatingSummary;
};

export const listingSlugParams = z.object({ slug: z.string().min(1).max(120) });

/** A motif as the engine stores it (normalised geometry, mm); see shared/engine for the exact type. */
export type PublicMotif = { id: string; name: string; geometry: StoredMotifGeometry; svgUrl: string };
export type PublicMaterial = { id: string; kind: string; colourName: string; colourHex: string };
export type PublicPhoto = { id: string; url: string; thumbnailUrl: string; width: number; height: number };

/** GET /api/listings/:slug */
export type ListingPage = {
  id: string;
  slug: string;
  currency: string;
  priceMinor: number;
  /** the approved content on sale (workroom costing fields removed) */
  content: Omit<ListingContent, 'blankCostMinor' | 'minutesPerLayer'>;
  /** the description rendered to safe HTML (raw HTML in the seller's text comes out as text) */
  descriptionHtml: string;
  shop: { slug: string; name: string; processingDays: number; shippingMinor: number; currency: string; returnPolicy: string; logoUrl: string | null };
  photos: PublicPhoto[];
  motifs: PublicMotif[];
  materials: PublicMaterial[];
  careCard: string[];
  /** present only when the listing has small decorations */
  safetyNotes: string[] | null;
  /** average and count of the listing's visible reviews (for the page and a Product's AggregateRating) */
  rating: RatingSummary;
  /** the sizes and colours on offer from the shop's blank type, with what is sold out (null: one plain blank) */
  blankOffer: ResolvedBlankOffer | null;
};

/** Care card for buyers (common practice, no published source; DEVELOPERS.md, "Care card and safety notes"). */
export const CARE_CARD: readonly string[] = [
  'Wait 24 hours before the first wash.',
  'Wash inside out, cool or warm.',
  'No bleach.',
  'Tumble dry low, or hang to dry.',
  'Never iron directly on the design.',
];

/**
 * Small-parts warning (US CPSC, 16 CFR 1501: items for children under 3). Whether the item is exempt is
 * the seller's compliance question, so the text defers to them.
 */
export const SMALL_PARTS_NOTES: readonly string[] = [
  'Choking hazard: this item has small decorations (such as bows, buttons or gems). Not for children under 3 years.',
  'Under the US small-parts rule (16 CFR 1501), a part that fits wholly in a test cylinder 1.25 in (31.7 mm) across and 1.00–2.25 in (25.4–57.1 mm) deep is a choking hazard for children under 3.',
  "The seller is responsible for this item's compliance with the rules where you live; ask them if you are unsure.",
];

// ---------------------------------------------------------------- moderation desk inputs
export const moderationIdParams = z.object({ id: z.string().min(1).max(64) });
export const reasonSchema = z.object({
  reason: z.string({ error: 'Give the seller a reason.' }).trim().min(3, 'Give the seller a reason (at least 3 characters).').max(1000, 'Use at most 1,000 characters.'),
});
export const optionalReasonSchema = z.object({ reason: z.string().trim().max(1000, 'Use at most 1,000 characters.').optional() });

/**
 * A decision names the revision the moderator was shown (a listing's `revision`, a shop change's
 * `revision`); if the seller saved since, the decision is refused with 409 and the new version
 * is reviewed instead, so what goes live is exactly what was read.
 */
const revisionSchema = z
  .number({ error: 'Say which version you reviewed (revision).' })
  .int('Say which version you reviewed (revision).')
  .min(0, 'Say which version you reviewed (revision).')
  .max(1_000_000_000, 'Say which version you reviewed (revision).');
export const decisionSchema = z.object({ revision: revisionSchema });
export const rejectDecisionSchema = reasonSchema.extend({ revision: revisionSchema });
export type DecisionInput = z.infer<typeof decisionSchema>;
/** approving a new shop may name the revision of its name/description the desk showed */
export const approveShopSchema = optionalReasonSchema.extend({ revision: revisionSchema.optional() });
export const STALE_LISTING_MESSAGE = 'The seller changed this listing after you opened it; review the new version.';
export const STALE_SHOP_CHANGE_MESSAGE = 'The seller changed the shop details after you opened them; review the new version.';
/** GET /api/moderation/queue/listings and /queue/shops: what waits for review, oldest first */
export const QUEUE_PAGE_SIZE = 20;
export const queueQuerySchema = pageQuery(QUEUE_PAGE_SIZE);
/** GET /api/moderation/audit: decisions, newest first */
export const AUDIT_PAGE_SIZE = 50;
/** Every action the audit log records, as the desk names them (the filter's choices). */
export const AUDIT_ACTIONS = {
  'listing.approve': 'Approved listing',
  'listing.reject': 'Sent back listing',
  'shop.approve': 'Approved shop',
  'shop.reject': 'Rejected shop',
  'shop.suspend': 'Suspended shop',
  'shop.restore': 'Restored shop',
  'shop.change.approve': 'Approved shop details',
  'shop.change.reject': 'Sent back shop details',
} as const;
export type AuditAction = keyof typeof AUDIT_ACTIONS;
export const auditQuerySchema = pageQuery(AUDIT_PAGE_SIZE).extend({
  action: z.enum(Object.keys(AUDIT_ACTIONS) as [AuditAction, ...AuditAction[]], { error: 'Pick one of the actions.' }).optional(),
});
export type AuditQuery = z.output<typeof auditQuerySchema>;

/** GET /api/moderation/shops: every shop, found by name, address or owner e-mail, optionally by state. */
export const MODERATION_SHOPS_PAGE_SIZE = 20;
export const moderationShopsQuery = pageQuery(MODERATION_SHOPS_PAGE_SIZE).extend({
  q: z.string().trim().max(100, 'Use at most 100 characters.').default(''),
  state: z.enum(SHOP_STATES, { error: 'Pick one of the shop states.' }).optional(),
});
export type ModerationShopsQuery = z.input<typeof moderationShopsQuery>;
export type ModerationShopsFilter = z.output<typeof moderationShopsQuery>;
export type ModerationShop = {
  id: string;
  name: string;
  slug: string;
  state: ShopState;
  /** the moderator's reason for the current state (suspension, rejection), if any */
  stateReason: string | null;
  owner: { name: string; email: string };
  createdAt: number;
};
export type ModerationShopsPage = Page<ModerationShop>;
