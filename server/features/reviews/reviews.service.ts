// Reviews: a shopper rates a line she bought once it has been shipped REVIEW_AFTER_SHIPPED_DAYS
// days; one review per line; the shop replies once; an admin hides one with a reason (audit log).
import crypto from 'node:crypto';
import { type PageQuery, pageOffset, toPage } from '../../../shared/schemas/pagination.ts';
import { type LineReviewView, type OrderReviewsView, REVIEW_AFTER_SHIPPED_DAYS, type ReviewsPage, type ReviewView } from '../../../shared/schemas/review.ts';
import type { Db } from '../../db/client.ts';
import { AppError, conflict, forbidden, notFound } from '../../http/app-error.ts';
import type { SessionUser } from '../../http/auth-guards.ts';
import { type StoredImage, uploadUrl } from '../../integrations/storage.ts';
import { listingRating, liveListingBySlug, liveShopBySlug, shopRating } from '../catalog/index.ts';
import { recordAudit } from '../moderation/index.ts';
import { type OrderLineRow, type OrderRow, orderParty, ordersRepo } from '../orders/index.ts';
import { type ReviewWithNames, reviewsRepo as repo } from './reviews.repo.ts';

const DAY_MS = 86_400_000;
type Viewer = { user: SessionUser; shopId: string | null };

/** "Dana Whitlock" → "Dana W.": reviews are public, so a shopper's full name is not. */
export function publicName(name: string): string {
  const parts = name.trim().split(/\s+/).filter(Boolean);
  if (parts.length === 0) return 'A shopper';
  const first = parts[0]!;
  return parts.length > 1 ? `${first} ${parts[parts.length - 1]!.charAt(0).toUpperCase()}.` : first;
}

function toView({ r, authorName, listingSlug, listingTitle }: ReviewWithNames, withHidden = false): ReviewView {
  const photo =
    r.photoPath && r.photoThumbPath && r.photoWidth && r.photoHeight ? { url: uploadUrl(r.photoPath)!, thumbnailUrl: uploadUrl(r.photoThumbPath)!, width: r.photoWidth, height: r.photoHeight } : null;
  return {
    id: r.id,
    rating: r.rating,
    body: r.body,
    authorName: publicName(authorName),
    listingTitle: listingTitle ?? '',
    listingSlug,
    photo,
    reply: r.reply && r.repliedAt ? { body: r.reply, at: r.repliedAt } : null,
    createdAt: r.createdAt,
    ...(withHidden ? { hidden: r.hiddenAt && r.hiddenReason ? { at: r.hiddenAt, reason: r.hiddenReason } : null } : {}),
  };
}

/** From when a line may be reviewed: its order's shipping time plus the wait; null when not shipped. */
const reviewableFrom = (order: OrderRow, line: OrderLineRow) => (line.state === 'shipped' && order.shippedAt ? order.shippedAt + REVIEW_AFTER_SHIPPED_DAYS * DAY_MS : null);

/** The order's lines with their reviews, for its shopper (who may write), its shop (who may reply) and admins. */
export function orderReviews(db: Db, orderId: string, viewer: Viewer, now: number): OrderReviewsView {
  const { order, side } = orderParty(db, orderId, viewer.user, viewer.shopId);
  const lines = ordersRepo.lines(db, [order.id]);
  const byLine = new Map(
    repo
      .ofLines(
        db,
        lines.map((l) => l.id),
      )
      .map((x) => [x.r.lineId, x]),
  );
  const items: LineReviewView[] = lines.map((l) => {
    const from = reviewableFrom(order, l);
    const review = byLine.get(l.id);
    return {
      lineId: l.id,
      listingTitle: l.listingTitle,
      state: l.state,
      reviewableFrom: from,
      canReview: side === 'shopper' && !review && from !== null && now >= from,
      review: review ? toView(review, side !== 'shopper') : null,
    };
  });
  return { orderId: order.id, viewerSide: side, lines: items };
}

/**
 * Refuses a review that may not be written, before any photo is stored: not the buyer (the shop
 * and admins 403, anyone else 404), not a line of the order, not shipped long enough, or already reviewed.
 */
export function assertCanReview(db: Db, orderId: string, lineId: string, viewer: Viewer, now: number): { order: OrderRow; line: OrderLineRow } {
  const { order, side } = orderParty(db, orderId, viewer.user, viewer.shopId);
  if (side !== 'shopper') throw forbidden('Only the shopper who bought this item can review it.');
  const line = ordersRepo.lines(db, [order.id]).find((l) => l.id === lineId);
  if (!line) throw notFound('We could not find that item in your order.');
  const from = reviewableFrom(order, line);
  if (from === null) throw new AppError(409, 'not_shipped', 'You can review this item once it has been shipped.');
  if (now < from) {
    throw new AppError(
      409,
      'too_soon',
      `You can review this item from ${new Date(from).toISOString().slice(0, 10)}, ${REVIEW_AFTER_SHIPPED_DAYS} days after it was shipped, so it has had time to arrive.`,
    );
  }
  if (repo.ofLines(db, [line.id]).length) throw conflict('You have already reviewed this item.');
  return { order, line };
}

export function create(deps: { db: Db; now: () => number }, orderId: string, lineId: string, viewer: Viewer, input: { rating: number; body: string }, photo: StoredImage | null): ReviewView {
  const { db } = deps;
  const at = deps.now();
  const { order, line } = assertCanReview(db, orderId, lineId, viewer, at);
  const id = crypto.randomUUID();
  try {
    repo.insert(db, {
      id,
      lineId: line.id,
      orderId: order.id,
      listingId: line.listingId,
      shopId: order.shopId,
      authorId: viewer.user.id,
      rating: input.rating,
      body: input.body,
      photoPath: photo?.fileName ?? null,
      photoThumbPath: photo?.thumbName ?? null,
      photoWidth: photo?.width ?? null,
      photoHeight: photo?.height ?? null,
      createdAt: at,
    });
  } catch (e) {
    // two tabs at once: the unique index on the line keeps it to one
    if (String((e as { code?: string }).code ?? '').startsWith('SQLITE_CONSTRAINT')) throw conflict('You have already reviewed this item.');
    throw e;
  }
  return toView(repo.byId(db, id)!, true);
}

/** The review's shop answers once; another shop, a shopper or an admin gets 404. */
export function reply(deps: { db: Db; now: () => number }, reviewId: string, viewer: Viewer, text: string): ReviewView {
  const r = repo.find(deps.db, reviewId);
  if (!r || !viewer.shopId || r.shopId !== viewer.shopId) throw notFound('We could not find that review in your shop.');
  if (!repo.setReply(deps.db, r.id, text, deps.now())) throw conflict('Your shop has already replied to this review.');
  return toView(repo.byId(deps.db, r.id)!, true);
}

/** An admin hides a review with a reason, recorded in the audit log; it leaves the pages and the average. */
export function hide(deps: { db: Db; now: () => number }, reviewId: string, admin: SessionUser, reason: string): ReviewView {
  const r = repo.find(deps.db, reviewId);
  if (!r) throw notFound('No such review.');
  deps.db.transaction((tx) => {
    const t = tx as unknown as Db;
    if (!repo.hide(t, r.id, reason, deps.now())) throw conflict('This review is hidden already.');
    recordAudit({ db: t, now: deps.now }, admin, 'review.hide', 'review', r.id, reason);
  });
  return toView(repo.byId(deps.db, r.id)!, true);
}

export function listingReviews(db: Db, slug: string, q: PageQuery): ReviewsPage {
  const found = liveListingBySlug(db, slug);
  if (!found) throw notFound('No such listing.');
  const items = repo.visiblePage(db, { listingId: found.listing.id }, q.limit, pageOffset(q)).map((x) => toView(x));
  const summary = listingRating(db, found.listing.id);
  return { ...toPage(items, summary.count, q), summary };
}

export function shopReviews(db: Db, slug: string, q: PageQuery): ReviewsPage {
  const shop = liveShopBySlug(db, slug);
  if (!shop) throw notFound('No such shop.');
  const items = repo.visiblePage(db, { shopId: shop.id }, q.limit, pageOffset(q)).map((x) => toView(x));
  const summary = shopRating(db, shop.id);
  return { ...toPage(items, summary.count, q), summary };
}
