// Reviews of shipped order lines: rating 1–5, text, an optional photo; one per line; the shop may
// reply once; admins may hide one with a reason.
import { z } from 'zod';
import { type Page, pageQuery } from './pagination.ts';

/**
 * Days after shipping before a line can be reviewed: a parcel usually arrives within a few
 * working days, and a review should be about the item in hand and worn, not about the wait.
 */
export const REVIEW_AFTER_SHIPPED_DAYS = 3;
export const REVIEW_MAX_CHARS = 2000;
export const REPLY_MAX_CHARS = 1000;
export const HIDE_REASON_MAX_CHARS = 500;
export const REVIEWS_PAGE_SIZE = 10;

export const reviewsQuerySchema = pageQuery(REVIEWS_PAGE_SIZE);

/** POST /api/orders/:id/lines/:lineId/review (JSON, or multipart with an optional `file` photo). */
export const postReviewSchema = z.object({
  rating: z.coerce.number({ error: 'Choose 1 to 5 stars.' }).int('Choose 1 to 5 stars.').min(1, 'Choose 1 to 5 stars.').max(5, 'Choose 1 to 5 stars.'),
  body: z
    .string({ error: 'Write a few words about it.' })
    .trim()
    .min(1, 'Write a few words about it.')
    .max(REVIEW_MAX_CHARS, `Use at most ${REVIEW_MAX_CHARS.toLocaleString('en-US')} characters.`),
});
export type PostReviewInput = z.input<typeof postReviewSchema>;

export const replySchema = z.object({
  reply: z
    .string({ error: 'Write your reply.' })
    .trim()
    .min(1, 'Write your reply.')
    .max(REPLY_MAX_CHARS, `Use at most ${REPLY_MAX_CHARS.toLocaleString('en-US')} characters.`),
});
export type ReplyInput = z.input<typeof replySchema>;

export const hideReviewSchema = z.object({
  reason: z.string({ error: 'Say why the review is hidden.' }).trim().min(1, 'Say why the review is hidden.').max(HIDE_REASON_MAX_CHARS, `Use at most ${HIDE_REASON_MAX_CHARS} characters.`),
});
export type HideReviewInput = z.input<typeof hideReviewSchema>;

export const reviewIdParams = z.object({ id: z.string().min(1).max(64) });
export const lineReviewParams = z.object({ id: z.string().min(1).max(64), lineId: z.string().min(1).max(64) });
export const slugParams = z.object({ slug: z.string().min(1).max(120) });

/** Average and count of the visible reviews; `average` to one decimal, null when there are none. */
export type RatingSummary = { count: number; average: number | null };

/** The summary from a sum and a count of whole-star ratings (one decimal, half away from zero). */
export function ratingSummary(sum: number, count: number): RatingSummary {
  if (count <= 0) return { count: 0, average: null };
  return { count, average: Math.round((sum * 10) / count) / 10 };
}

export type ReviewView = {
  id: string;
  rating: number;
  /** plain text, rendered as text */
  body: string;
  authorName: string;
  listingTitle: string;
  listingSlug: string | null;
  photo: { url: string; thumbnailUrl: string; width: number; height: number } | null;
  reply: { body: string; at: number } | null;
  createdAt: number;
  /** only in answers to admins and the review's shop */
  hidden?: { at: number; reason: string } | null;
};
export type ReviewsPage = Page<ReviewView> & { summary: RatingSummary };

/** One line of an order as the review box sees it. */
export type LineReviewView = {
  lineId: string;
  listingTitle: string;
  state: string;
  /** ms from which the shopper may review (null: not shipped) */
  reviewableFrom: number | null;
  canReview: boolean;
  review: ReviewView | null;
};
export type OrderReviewsView = { orderId: string; viewerSide: 'shopper' | 'shop' | 'admin'; lines: LineReviewView[] };
