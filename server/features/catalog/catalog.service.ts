import { CARE_CARD, type CatalogItem, type CatalogPage, type CatalogQuery, type ListingPage, type PublicShop, SMALL_PARTS_NOTES } from '../../../shared/schemas/catalog.ts';
import { fromPriceMinor, materialIdsOf, type Occasion } from '../../../shared/schemas/listing.ts';
import { toPage } from '../../../shared/schemas/pagination.ts';
import { type RatingSummary, ratingSummary } from '../../../shared/schemas/review.ts';
import type { Db } from '../../db/client.ts';
import { notFound } from '../../http/app-error.ts';
import type { SessionUser } from '../../http/auth-guards.ts';
import { uploadUrl } from '../../integrations/storage.ts';
import { resolveOffer } from '../blanks/index.ts';
import * as repo from './catalog.repo.ts';
import { renderDescription } from './markdown.ts';

const toItem = (r: repo.CatalogRow): CatalogItem => ({
  id: r.id,
  slug: r.slug,
  title: r.title,
  shop: { slug: r.shopSlug, name: r.shopName },
  priceMinor: r.priceMinor,
  currency: r.currency,
  // live_occasions is nullable (rows written before it existed, or straight inserts): no occasions then
  occasions: (r.occasions ?? '').split(',').filter(Boolean) as Occasion[],
  thumbnailUrl: uploadUrl(r.thumb),
});

export function search(db: Db, q: CatalogQuery): CatalogPage {
  const { rows, total } = repo.catalogPage(db, q);
  return toPage(rows.map(toItem), total, q);
}

export function publicShop(db: Db, slug: string): PublicShop {
  const s = repo.liveShopBySlug(db, slug);
  if (!s) throw notFound('No such shop.');
  // a shop page shows every live listing (a demo shop has dozens at most; capped for safety)
  const items: CatalogItem[] = [];
  for (let page = 1; page <= 10; page++) {
    const { rows, total } = repo.catalogPage(db, { shop: slug, sort: 'newest', page, limit: 100 });
    items.push(...rows.map(toItem));
    if (page * 100 >= total) break;
  }
  return {
    shop: {
      name: s.name,
      slug: s.slug,
      description: s.description,
      processingDays: s.processingDays,
      shippingMinor: s.shippingMinor,
      currency: s.currency,
      returnPolicy: s.returnPolicy,
      logoUrl: uploadUrl(s.logoPath),
    },
    listings: items,
    rating: shopRating(db, s.id),
  };
}

/**
 * The listing page. Shoppers get the live copy of a live listing in a live shop, nothing else.
 * `version: 'draft'` renders the working copy the same way, for an admin reviewing it or the
 * seller who owns it; for anyone else it is a 404, as if the listing did not exist.
 */
export function listingPage(db: Db, slug: string, version: 'live' | 'draft', viewer: SessionUser | undefined): ListingPage {
  let found: ReturnType<typeof repo.liveListingBySlug>;
  if (version === 'draft') {
    found = repo.anyListingBySlug(db, slug);
    const mayPreview = !!viewer && !!found && (viewer.role === 'admin' || repo.shopOwnedBy(db, viewer.id)?.id === found.shop.id);
    if (!mayPreview) throw notFound('No such listing.');
  } else found = repo.liveListingBySlug(db, slug);
  if (!found) throw notFound('No such listing.');
  const { listing, shop } = found;
  const raw = version === 'draft' ? listing.draft : listing.live;
  if (!raw) throw notFound('No such listing.');
  const { blankCostMinor: _c, minutesPerLayer: _m, ...content } = raw;
  const photos = new Map(repo.photosOf(db, shop.id, content.photoIds).map((u) => [u.id, u]));
  const motifIds = content.personalisation.motifChoices.map((m) => m.motifId);
  return {
    id: listing.id,
    slug: listing.slug,
    currency: listing.currency,
    priceMinor: fromPriceMinor(content),
    content,
    descriptionHtml: renderDescription(content.description, content.descriptionFormat),
    shop: {
      slug: shop.slug,
      name: shop.name,
      processingDays: shop.processingDays,
      shippingMinor: shop.shippingMinor,
      currency: shop.currency,
      returnPolicy: shop.returnPolicy,
      logoUrl: uploadUrl(shop.logoPath),
    },
    photos: content.photoIds.flatMap((id) => {
      const u = photos.get(id);
      return u ? [{ id, url: uploadUrl(u.path)!, thumbnailUrl: uploadUrl(u.thumbPath)!, width: u.width, height: u.height }] : [];
    }),
    motifs: repo.motifsOf(db, shop.id, motifIds).map((m) => ({ id: m.id, name: m.name, geometry: m.geometry, svgUrl: `/api/motifs/${m.id}/svg` })),
    materials: repo.materialsOf(db, shop.id, materialIdsOf(content.personalisation)),
    careCard: [...CARE_CARD],
    safetyNotes: content.hasSmallDecorations ? [...SMALL_PARTS_NOTES] : null,
    rating: listingRating(db, listing.id),
    blankOffer: resolveOffer(db, shop.id, content.blankOffer),
  };
}

/**
 * Average and count of a listing's visible reviews: on the listing page's answer as `rating`, and
 * the value a Product's AggregateRating (ratingValue, reviewCount) is made from; null average: none yet.
 */
export const listingRating = (db: Db, listingId: string): RatingSummary => {
  const r = repo.visibleRatings(db, { listingId });
  return ratingSummary(r.sum, r.count);
};
export const shopRating = (db: Db, shopId: string): RatingSummary => {
  const r = repo.visibleRatings(db, { shopId });
  return ratingSummary(r.sum, r.count);
};
