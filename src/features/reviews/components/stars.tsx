import type { RatingSummary } from '../../../../shared/schemas/review.ts';

/** Whole stars out of five, read out as "4 out of 5 stars". */
export function Stars({ rating }: { rating: number }) {
  const n = Math.max(0, Math.min(5, Math.round(rating)));
  return (
    <span role="img" aria-label={`${n} out of 5 stars`} className="tracking-wider whitespace-nowrap text-marigold-deep">
      {'★'.repeat(n)}
      <span className="text-ink-faint opacity-50">{'★'.repeat(5 - n)}</span>
    </span>
  );
}

/** "4.5 out of 5 · 12 reviews", or that there are none yet. */
export function RatingLine({ summary }: { summary: RatingSummary }) {
  if (!summary.count || summary.average === null) return <p className="text-ink-soft">No reviews yet.</p>;
  return (
    <p className="flex flex-wrap items-center gap-2" data-testid="rating-summary">
      <Stars rating={summary.average} />
      <span className="font-bold">{summary.average.toFixed(1)} out of 5</span>
      <span className="text-ink-soft">
        · {summary.count} {summary.count === 1 ? 'review' : 'reviews'}
      </span>
    </p>
  );
}
