import { Link, useParams } from 'react-router-dom';
import { formatMoney } from '../../../../shared/money.ts';
import { canMoveLine, isFinishedLine } from '../../../../shared/schemas/order.ts';
import { PageHeading } from '../../../components/ui/card.tsx';
import { LineStateBadge } from '../../../components/ui/line-state-badge.tsx';
import { ShipToAddress } from '../../../components/ui/ship-to-address.tsx';
import { TrackingNumber } from '../../../components/ui/tracking-number.tsx';
import { paths } from '../../../config/paths.ts';
import { MessageBox } from '../../../features/messages/components/message-box.tsx';
import { OrderReviews } from '../../../features/reviews/components/order-reviews.tsx';
import { useOrder } from '../../../features/workroom/api/get-order.ts';
import { formatDate, formatDateTime } from '../../../features/workroom/components/format.ts';
import { MaterialChips } from '../../../features/workroom/components/material-chips.tsx';
import { PlacementTemplateLinks } from '../../../features/workroom/components/placement-template-links.tsx';
import { ShipForm } from '../../../features/workroom/components/ship-form.tsx';
import { Timeline } from '../../../features/workroom/components/timeline.tsx';
import { SellerPageStatus } from '../seller/seller-page-status.tsx';

export function WorkroomOrderPage() {
  const { orderId = '' } = useParams();
  const order = useOrder(orderId);
  if (order.isPending || order.isError) return <SellerPageStatus error={order.error} loading="Loading the order…" />;
  const o = order.data;
  const active = o.lines.filter((l) => !isFinishedLine(l.state));
  const ready = active.length > 0 && active.every((l) => canMoveLine(l.state, 'shipped', 'shop'));
  const label = (lineId: string) => o.lines.find((l) => l.id === lineId)?.text || o.lines.find((l) => l.id === lineId)?.listingTitle || '';
  return (
    <div>
      <PageHeading
        eyebrow={`Order ${o.number}`}
        title={`For ${o.buyerName}`}
        lead={`Paid ${formatDateTime(o.paidAt)}${o.shipByDate ? ` · ship by ${formatDate(o.shipByDate)}` : ''} · ${formatMoney(o.totalMinor, o.currency)}`}
      />
      <div className="grid gap-8 lg:grid-cols-[minmax(0,1fr)_22rem]">
        <div className="flex flex-col gap-6">
          <section aria-labelledby="items">
            <h2 id="items" className="mb-3 text-xl font-extrabold">
              Items
            </h2>
            <ul className="flex flex-col gap-3">
              {o.lines.map((l) => (
                <li key={l.id} className="flex flex-col gap-2 rounded-lg border border-line bg-white p-4 sm:flex-row sm:items-start sm:justify-between">
                  <div className="flex flex-col gap-1.5">
                    <p className="font-bold">
                      {l.quantity} × {l.listingTitle}
                      {l.blankChoice ? (
                        <span className="block" data-testid="blank-choice">
                          {l.blankChoice}
                        </span>
                      ) : null}
                    </p>
                    <p className="text-lg font-extrabold">{l.text || '—'}</p>
                    <MaterialChips materials={l.materials} />
                  </div>
                  <div className="flex flex-col items-start gap-2 sm:items-end">
                    <LineStateBadge state={l.state} words="workroom" />
                    <Link className="font-bold text-thread-deep underline decoration-2" to={paths.workroomProof.getHref(l.id)}>
                      {l.state === 'awaiting_proof' ? 'Check proof' : 'Open proof'}
                    </Link>
                    <PlacementTemplateLinks lineId={l.id} />
                  </div>
                </li>
              ))}
            </ul>
          </section>
          <section aria-labelledby="tl">
            <h2 id="tl" className="mb-3 text-xl font-extrabold">
              Timeline
            </h2>
            <Timeline events={o.timeline} lineLabel={label} />
          </section>
          <OrderReviews orderId={o.id} shopName="your shop" />
          <MessageBox orderId={o.id} with={o.buyerName} />
        </div>
        <aside className="flex h-fit flex-col gap-4 rounded-lg border border-line bg-white p-5 shadow-sm">
          <h2 className="text-lg font-extrabold">Shipping</h2>
          <div>
            <h3 className="mb-1 text-sm font-bold tracking-wide text-thread-deep uppercase">Post to</h3>
            <ShipToAddress shipTo={o.shipTo} label="Post to" />
          </div>
          {o.trackingNumber ? (
            <p data-testid="tracking">
              Shipped {o.shippedAt ? formatDateTime(o.shippedAt) : ''} with {o.carrier}: <TrackingNumber carrier={o.carrier} trackingNumber={o.trackingNumber} />
            </p>
          ) : ready ? (
            <ShipForm orderId={o.id} />
          ) : (
            <p className="text-ink-soft">Every item must be pressed before the order ships. {active.filter((l) => l.state !== 'pressed').length} still to go.</p>
          )}
        </aside>
      </div>
    </div>
  );
}
