import { useState } from 'react';
import { useListingDelivery } from '../api/offers-api.ts';

/**
 * The listing's dates: the shop's order-by banners still to come, when an order placed today
 * should arrive, and a needed-by check (processing days in the shop's working days, then the shop's
 * own estimate of days in the post: shared/business/needed-by.ts).
 */
export function ListingDates({ slug }: { slug: string }) {
  const [neededBy, setNeededBy] = useState('');
  const base = useListingDelivery(slug, null);
  const check = useListingDelivery(slug, neededBy || null);
  const d = base.data;
  if (!d) return null;
  const v = neededBy ? check.data?.verdict : null;
  return (
    <div className="flex flex-col gap-3">
      {d.orderBy.map((o) => (
        <p key={o.id} role="note" className="rounded-lg border-2 border-marigold bg-marigold-wash px-4 py-2 font-bold" data-testid="order-by-banner">
          Order by {o.orderBy} for {o.occasion}
        </p>
      ))}
      <div className="flex flex-col gap-1.5 rounded-lg border border-line bg-white p-4 text-sm">
        <p>
          Ordered today, it is posted by <strong>{d.shipBy}</strong> and should arrive by <strong>{d.arrival}</strong> ({d.shippingDays} working {d.shippingDays === 1 ? 'day' : 'days'} in the post).
        </p>
        <label htmlFor="listing-needed-by" className="mt-1 font-bold">
          Need it by a certain day?
        </label>
        <input
          id="listing-needed-by"
          type="date"
          value={neededBy}
          onChange={(e) => setNeededBy(e.target.value)}
          className="min-h-11 max-w-56 rounded-lg border-2 border-field bg-white px-3.5 py-2 text-base text-ink hover:border-ink"
        />
        {v ? (
          <p role="status" className={`font-semibold ${v.canMake ? 'text-thread-deep' : 'text-danger'}`} data-testid="listing-needed-by-verdict">
            {v.canMake ? `Yes: ordered today, it can be with you by ${v.arrival}.` : `Not by ${v.neededBy}: ordered today, the earliest it can arrive is ${v.arrival}.`}
          </p>
        ) : null}
      </div>
    </div>
  );
}
