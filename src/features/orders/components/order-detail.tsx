import type { ReactNode } from 'react';
import { formatDateTime } from '../../../../shared/dates.ts';
import { formatMoney } from '../../../../shared/money.ts';
import type { LineSnapshot } from '../../../../shared/schemas/cart.ts';
import { LINE_STATE_LABELS, type OrderDetail } from '../../../../shared/schemas/order.ts';
import { LineStateBadge } from '../../../components/ui/line-state-badge.tsx';
import { ShipToAddress } from '../../../components/ui/ship-to-address.tsx';
import { TrackingNumber } from '../../../components/ui/tracking-number.tsx';

const who = { you: 'You', shop: 'The shop', namesake: 'Namesake' } as const;

/** One order: each line with its design, personalisation, state and history. `preview` draws a line's design. */
export function OrderDetailView({ order, preview, summary }: { order: OrderDetail; preview: (s: LineSnapshot) => ReactNode; summary: (s: LineSnapshot) => ReactNode }) {
  const cur = order.currency;
  return (
    <div className="grid gap-8 lg:grid-cols-[1fr_18rem]">
      <ul className="flex flex-col gap-5">
        {order.lines.map((l) => (
          <li key={l.id} className="rounded-lg border border-line bg-white p-5 shadow-sm">
            <div className="flex flex-col gap-4 sm:flex-row">
              {preview(l.snapshot)}
              <div className="flex flex-1 flex-col gap-2">
                <div className="flex flex-wrap items-baseline justify-between gap-2">
                  <h2 className="text-lg font-bold">
                    {l.quantity} × {l.listingTitle}
                  </h2>
                  <LineStateBadge state={l.state} />
                </div>
                {summary(l.snapshot)}
                <p className="text-sm">
                  {formatMoney(l.totalMinor, cur)}
                  {l.refundedMinor > 0 ? <span className="text-ink-soft"> · {formatMoney(l.refundedMinor, cur)} refunded</span> : null}
                </p>
              </div>
            </div>
            <h3 className="mt-4 text-sm font-bold tracking-wide text-thread-deep uppercase">History</h3>
            <ol className="mt-2 flex flex-col gap-2 border-l-2 border-thread/40 pl-4">
              {l.history.map((e) => (
                <li key={e.id} className="text-sm">
                  <span className="font-bold">{LINE_STATE_LABELS[e.toState]}</span>
                  <span className="text-ink-soft">
                    {' '}
                    · {formatDateTime(e.at)}
                    {e.actor ? ` · ${who[e.actor]}` : ''}
                  </span>
                  {e.message ? <p className="text-ink">{e.message}</p> : null}
                </li>
              ))}
            </ol>
          </li>
        ))}
      </ul>
      <aside aria-label="Order summary" className="flex h-fit flex-col gap-3 rounded-lg border border-line bg-white p-5 shadow-sm">
        <p className="font-extrabold">From {order.shop.name}</p>
        <dl className="flex flex-col gap-1 text-sm">
          <div className="flex justify-between">
            <dt>Items</dt>
            <dd>{formatMoney(order.subtotalMinor, cur)}</dd>
          </div>
          {order.discountMinor ? (
            <div className="flex justify-between">
              <dt>Code {order.discountCode}</dt>
              <dd>−{formatMoney(order.discountMinor, cur)}</dd>
            </div>
          ) : null}
          <div className="flex justify-between">
            <dt>Shipping</dt>
            <dd>{formatMoney(order.shippingMinor, cur)}</dd>
          </div>
          {order.neededBy ? (
            <div className="flex justify-between">
              <dt>Needed by</dt>
              <dd>{order.neededBy}</dd>
            </div>
          ) : null}
          <div className="flex justify-between border-t border-line pt-1 font-bold">
            <dt>Paid</dt>
            <dd>{formatMoney(order.totalMinor, cur)}</dd>
          </div>
          {order.refundedMinor > 0 ? (
            <div className="flex justify-between">
              <dt>Refunded</dt>
              <dd>{formatMoney(order.refundedMinor, cur)}</dd>
            </div>
          ) : null}
        </dl>
        <div>
          <h2 className="mb-1 text-sm font-bold tracking-wide text-thread-deep uppercase">Sending to</h2>
          <ShipToAddress shipTo={order.shipTo} label="Sending to" />
        </div>
        {order.trackingNumber ? (
          <p className="text-sm">
            Shipped with {order.carrier ?? 'the carrier'}: <TrackingNumber carrier={order.carrier} trackingNumber={order.trackingNumber} />
          </p>
        ) : (
          <p className="text-sm text-ink-soft">Not shipped yet. We will e-mail you the tracking number.</p>
        )}
      </aside>
    </div>
  );
}
