import { useId, useState } from 'react';
import { Spinner } from '../../../components/ui/button.tsx';
import { Pager } from '../../../components/ui/pager.tsx';
import { useReviews } from '../api/get-reviews.ts';
import type { ReviewSource } from '../api/keys.ts';
import { HideReviewForm } from './hide-review-form.tsx';
import { ReviewCard } from './review-card.tsx';
import { RatingLine } from './stars.tsx';

/**
 * The reviews of a listing or a shop: average and count, then the reviews newest first a page at a
 * time (the shared Pager). Admins get a "hide" action on each.
 */
export function ReviewList({ source, shopName, isAdmin = false }: { source: ReviewSource; shopName: string; isAdmin?: boolean }) {
  const [page, setPage] = useState(1);
  const reviews = useReviews(source, page);
  const headingId = useId();
  return (
    <section id="reviews" aria-labelledby={headingId} className="mt-10 flex flex-col gap-4">
      <h2 id={headingId} className="text-2xl font-extrabold">
        Reviews
      </h2>
      {reviews.isPending ? (
        <Spinner label="Loading reviews…" />
      ) : reviews.isError ? (
        <p role="alert">{reviews.error.message}</p>
      ) : (
        <>
          <RatingLine summary={reviews.data.summary} />
          {reviews.data.items.length ? (
            <ol className={`flex flex-col gap-3 ${reviews.isPlaceholderData ? 'opacity-60' : ''}`}>
              {reviews.data.items.map((r) => (
                <li key={r.id}>
                  <ReviewCard review={r} shopName={shopName} showItem={source.kind === 'shops'} actions={isAdmin ? <HideReviewForm reviewId={r.id} /> : null} />
                </li>
              ))}
            </ol>
          ) : null}
          <Pager page={page} total={reviews.data.total} limit={reviews.data.limit} label="Pages of reviews" noun="reviews" onPageChange={setPage} />
        </>
      )}
    </section>
  );
}
