import { ButtonLink, Spinner } from '../../../components/ui/button.tsx';
import { PageHeading, StitchedBox } from '../../../components/ui/card.tsx';
import { Pager, usePageParam } from '../../../components/ui/pager.tsx';
import { paths } from '../../../config/paths.ts';
import { useMe } from '../../../features/auth/api/get-me.ts';
import { useOrders } from '../../../features/orders/api/get-orders.ts';
import { OrderList } from '../../../features/orders/components/order-list.tsx';

export function OrdersPage() {
  const me = useMe();
  const [page, setPage] = usePageParam();
  const orders = useOrders({ page });
  return (
    <div>
      <PageHeading title="Your orders" lead={me.data ? `Everything ${me.data.user.name} has ordered, with each shop's progress.` : undefined} />
      {orders.isPending ? (
        <div className="py-16 text-center text-ink-soft">
          <Spinner label="Loading your orders…" />
        </div>
      ) : orders.isError ? (
        <p role="alert" className="font-semibold text-danger">
          {orders.error.message}
        </p>
      ) : orders.data.total === 0 ? (
        <StitchedBox className="flex flex-col items-center gap-4 py-14 text-center">
          <p className="text-xl font-extrabold">No orders yet</p>
          <p className="max-w-md text-ink-soft">When you order, you'll follow each item here: proof, cutting, pressing and shipping.</p>
          <ButtonLink to={paths.search.getHref()} variant="secondary">
            Browse the shops
          </ButtonLink>
        </StitchedBox>
      ) : (
        <div className="flex flex-col gap-6">
          <div className={orders.isPlaceholderData ? 'opacity-60 transition-opacity' : ''}>
            <OrderList orders={orders.data.items} />
          </div>
          <Pager page={page} total={orders.data.total} limit={orders.data.limit} label="Order pages" noun="orders" onPageChange={setPage} />
        </div>
      )}
    </div>
  );
}
