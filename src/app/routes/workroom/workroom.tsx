import { lazy, Suspense } from 'react';
import { Spinner } from '../../../components/ui/button.tsx';
import { PageHeading } from '../../../components/ui/card.tsx';

// the order table (and TanStack Table with it) loads on demand, keeping the first page small
const WorkroomOrders = lazy(async () => ({ default: (await import('../../../features/workroom/components/workroom-orders.tsx')).WorkroomOrders }));

import { useMe } from '../../../features/auth/api/get-me.ts';
import { useShipByLookup } from '../../../features/business/api/ship-by-lookup.ts';

const stateText: Record<string, { label: string; body: string; tone: string }> = {
  in_review: {
    label: 'In review',
    body: 'Our team is looking at your shop. Shoppers will see it once it is approved; you can prepare in the meantime.',
    tone: 'bg-marigold-wash text-ink border-marigold',
  },
  live: { label: 'Live', body: 'Your shop is public. Shoppers can find your approved listings.', tone: 'bg-thread-wash text-thread-deep border-thread' },
  suspended: { label: 'Suspended', body: 'Your shop is hidden from shoppers for now. The Namesake team has written to you with the reason.', tone: 'bg-danger-wash text-danger border-danger' },
  rejected: { label: 'Not approved', body: 'Your shop was not approved. The message from our team says why and what to change.', tone: 'bg-danger-wash text-danger border-danger' },
};

export function WorkroomPage() {
  const me = useMe();
  const shop = me.data?.shop;
  // the queue's ship-by dates and marks come from the business feature; the route joins the two
  const shipBy = useShipByLookup();

  return (
    <div>
      <PageHeading eyebrow="Workroom" title={shop ? shop.name : 'Your workroom'} lead={`Welcome in, ${me.data?.user.name ?? ''}. Check proofs, build cut sheets, press and ship.`} />
      {shop ? (
        <div className={`mb-8 flex flex-col gap-1 rounded-lg border-2 p-5 sm:flex-row sm:items-center sm:gap-4 ${stateText[shop.state]?.tone ?? ''}`}>
          <p className="font-extrabold whitespace-nowrap">Shop state: {stateText[shop.state]?.label ?? shop.state}</p>
          <p>{stateText[shop.state]?.body}</p>
        </div>
      ) : null}
      <Suspense fallback={<Spinner label="Loading orders…" />}>
        <WorkroomOrders shipBy={shipBy} />
      </Suspense>
    </div>
  );
}
