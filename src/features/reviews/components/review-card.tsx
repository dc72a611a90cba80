import type { ReactNode } from 'react';
import type { ReviewView } from '../../../../shared/schemas/review.ts';
import { Stars } from './stars.tsx';

const day = (ms: number) => new Date(ms).toLocaleDateString(undefined, { year: 'numeric', month: 'short', day: 'numeric' });

/** One review: stars, who and when, the text as text, its photo, the shop's reply; `actions` below (reply, hide). */
export function ReviewCard({ review: r, shopName, showItem = false, actions }: { review: ReviewView; shopName?: string; showItem?: boolean; actions?: ReactNode }) {
  return (
    <article className="flex flex-col gap-2 rounded-lg border border-line bg-white p-4" data-testid="review">
      <div className="flex flex-wrap items-center gap-x-3 gap-y-1">
        <Stars rating={r.rating} />
        <span className="font-bold">{r.authorName}</span>
        <span className="text-sm text-ink-soft">
          <time dateTime={new Date(r.createdAt).toISOString()}>{day(r.createdAt)}</time>
          {showItem && r.listingTitle ? ` · ${r.listingTitle}` : ''}
        </span>
      </div>
      {r.hidden ? <p className="text-sm font-semibold text-danger">Hidden by the Namesake team: {r.hidden.reason}</p> : null}
      <p className="break-words whitespace-pre-wrap">{r.body}</p>
      {r.photo ? (
        <a href={r.photo.url} target="_blank" rel="noopener" className="self-start">
          <img
            src={r.photo.thumbnailUrl}
            alt={`Shared by ${r.authorName} with the review`}
            width={r.photo.width}
            height={r.photo.height}
            className="h-auto max-h-48 w-auto rounded border border-line"
            loading="lazy"
          />
        </a>
      ) : null}
      {r.reply ? (
        <div className="rounded border-l-4 border-thread bg-thread-wash px-3 py-2">
          <p className="text-sm font-bold">Reply from {shopName ?? 'the shop'}</p>
          <p className="break-words whitespace-pre-wrap">{r.reply.body}</p>
        </div>
      ) : null}
      {actions}
    </article>
  );
}
