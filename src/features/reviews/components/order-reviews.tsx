import { zodResolver } from '@hookform/resolvers/zod';
import { useId, useState } from 'react';
import { useForm } from 'react-hook-form';
import {
  type LineReviewView,
  type PostReviewInput,
  postReviewSchema,
  REPLY_MAX_CHARS,
  REVIEW_AFTER_SHIPPED_DAYS,
  REVIEW_MAX_CHARS,
  type ReplyInput,
  replySchema,
} from '../../../../shared/schemas/review.ts';
import { Button } from '../../../components/ui/button.tsx';
import { Field, TextAreaField } from '../../../components/ui/form-controls.tsx';
import { useToast } from '../../../components/ui/toast.tsx';
import { applyServerErrors } from '../../../lib/form-errors.ts';
import { useOrderReviews } from '../api/get-order-reviews.ts';
import { usePostReview } from '../api/post-review.ts';
import { useReplyToReview } from '../api/reply-review.ts';
import { ReviewCard } from './review-card.tsx';

const day = (ms: number) => new Date(ms).toLocaleDateString(undefined, { year: 'numeric', month: 'long', day: 'numeric' });

function ReviewForm({ orderId, line }: { orderId: string; line: LineReviewView }) {
  const post = usePostReview(orderId);
  const toast = useToast();
  const [photo, setPhoto] = useState<File | null>(null);
  const legendId = useId();
  const form = useForm<PostReviewInput>({ resolver: zodResolver(postReviewSchema), defaultValues: { rating: undefined as unknown as number, body: '' } });
  const onSubmit = form.handleSubmit(async (v) => {
    try {
      await post.mutateAsync({ lineId: line.lineId, rating: Number(v.rating), body: v.body, photo });
      toast.success('Thank you! Your review is on the listing now.');
    } catch (e) {
      const msg = applyServerErrors(e, form.setError, ['rating', 'body']);
      if (msg) toast.error(msg);
    }
  });
  const ratingError = form.formState.errors.rating?.message;
  return (
    <form noValidate onSubmit={onSubmit} className="flex flex-col gap-3" aria-label={`Review ${line.listingTitle}`}>
      <fieldset aria-describedby={ratingError ? `${legendId}-error` : undefined}>
        <legend id={legendId} className="font-bold">
          Your rating
        </legend>
        <div className="mt-1 flex flex-wrap gap-2">
          {[1, 2, 3, 4, 5].map((n) => (
            <label key={n} className="flex min-h-11 cursor-pointer items-center gap-1.5 rounded-lg border border-line bg-white px-3 has-[:checked]:border-thread has-[:checked]:bg-thread-wash">
              <input type="radio" value={n} className="accent-thread" {...form.register('rating')} />
              {n} {n === 1 ? 'star' : 'stars'}
            </label>
          ))}
        </div>
        {ratingError ? (
          <p id={`${legendId}-error`} className="mt-1 text-sm font-semibold text-danger">
            {ratingError}
          </p>
        ) : null}
      </fieldset>
      <TextAreaField label="Your review" rows={4} maxLength={REVIEW_MAX_CHARS} hint="Other parents read this on the listing." error={form.formState.errors.body?.message} {...form.register('body')} />
      <Field
        label="Add a photo (optional)"
        hint="JPEG, PNG or WebP, up to 8 MB. It shows on the listing with your review."
        control={(c) => (
          <input
            {...c}
            type="file"
            accept="image/jpeg,image/png,image/webp"
            onChange={(e) => setPhoto(e.currentTarget.files?.[0] ?? null)}
            className="text-sm file:mr-3 file:rounded-lg file:border-2 file:border-ink file:bg-white file:px-3 file:py-1.5 file:font-bold"
          />
        )}
      />
      <Button type="submit" pending={post.isPending} pendingLabel="Posting…" className="self-start">
        Post review
      </Button>
    </form>
  );
}

function ReplyForm({ reviewId }: { reviewId: string }) {
  const reply = useReplyToReview();
  const toast = useToast();
  const form = useForm<ReplyInput>({ resolver: zodResolver(replySchema), defaultValues: { reply: '' } });
  const onSubmit = form.handleSubmit(async (v) => {
    try {
      await reply.mutateAsync({ id: reviewId, reply: v.reply });
      toast.success('Your reply is under the review.');
    } catch (e) {
      const msg = applyServerErrors(e, form.setError, ['reply']);
      if (msg) toast.error(msg);
    }
  });
  return (
    <form noValidate onSubmit={onSubmit} className="flex flex-col gap-2">
      <TextAreaField label="Reply once, in public" rows={2} maxLength={REPLY_MAX_CHARS} error={form.formState.errors.reply?.message} {...form.register('reply')} />
      <Button type="submit" pending={reply.isPending} pendingLabel="Posting…" className="self-start">
        Post reply
      </Button>
    </form>
  );
}

/**
 * The reviews box of an order page. The shopper reviews each shipped line once it has been shipped
 * REVIEW_AFTER_SHIPPED_DAYS days; the shop sees the reviews and replies once. Nothing shows while
 * no line is shipped.
 */
export function OrderReviews({ orderId, shopName }: { orderId: string; shopName: string }) {
  const q = useOrderReviews(orderId);
  const headingId = useId();
  if (!q.data) return null;
  const lines = q.data.lines.filter((l) => l.reviewableFrom !== null || l.review);
  if (!lines.length) return null;
  const side = q.data.viewerSide;
  return (
    <section aria-labelledby={headingId} id="reviews" className="mt-8 flex flex-col gap-4">
      <h2 id={headingId} className="text-xl font-extrabold">
        {side === 'shopper' ? 'Review your items' : 'Reviews'}
      </h2>
      <ul className="flex flex-col gap-4">
        {lines.map((l) => (
          <li key={l.lineId} className="flex flex-col gap-2 rounded-lg border border-line bg-paper p-4">
            <h3 className="font-bold">{l.listingTitle}</h3>
            {l.review ? (
              <ReviewCard review={l.review} shopName={shopName} actions={side === 'shop' && !l.review.reply ? <ReplyForm reviewId={l.review.id} /> : null} />
            ) : l.canReview ? (
              <ReviewForm orderId={orderId} line={l} />
            ) : side === 'shopper' && l.reviewableFrom ? (
              <p className="text-ink-soft">
                You can review it from {day(l.reviewableFrom)}, {REVIEW_AFTER_SHIPPED_DAYS} days after shipping, once it has had time to arrive.
              </p>
            ) : (
              <p className="text-ink-soft">Not reviewed yet.</p>
            )}
          </li>
        ))}
      </ul>
    </section>
  );
}
