import { useParams } from 'react-router-dom';
import { formatDate } from '../../../../shared/dates.ts';
import { ButtonLink, Spinner } from '../../../components/ui/button.tsx';
import { PageHeading } from '../../../components/ui/card.tsx';
import { paths } from '../../../config/paths.ts';
import { DesignPreview, PersonalisationSummary } from '../../../features/cart/components/design-preview.tsx';
import { MessageBox } from '../../../features/messages/components/message-box.tsx';
import { useOrder } from '../../../features/orders/api/get-order.ts';
import { OrderDetailView } from '../../../features/orders/components/order-detail.tsx';
import { ProofEditPanel } from '../../../features/proof-edit/components/proof-edit-panel.tsx';
import { OrderReviews } from '../../../features/reviews/components/order-reviews.tsx';

export function OrderPage() {
  const { orderId = '' } = useParams();
  const order = useOrder(orderId);
  if (order.isPending) {
    return (
      <div className="py-16 text-center text-ink-soft">
        <Spinner label="Loading the order…" />
      </div>
    );
  }
  if (order.isError) {
    return (
      <div role="alert" className="flex flex-col items-start gap-4 py-8">
        <p className="text-lg font-bold">{order.error.message}</p>
        <ButtonLink to={paths.orders.getHref()} variant="secondary">
          All your orders
        </ButtonLink>
      </div>
    );
  }
  const o = order.data;
  return (
    <div>
      <PageHeading eyebrow={`Order ${o.number}`} title={`Your order from ${o.shop.name}`} lead={`Paid on ${formatDate(o.paidAt)}.`} />
      <ProofEditPanel lines={o.lines} onSaved={() => void order.refetch()} />
      <OrderDetailView order={o} preview={(s) => <DesignPreview snapshot={s} size={120} />} summary={(s) => <PersonalisationSummary snapshot={s} />} />
      <OrderReviews orderId={o.id} shopName={o.shop.name} />
      <MessageBox orderId={o.id} with={o.shop.name} />
    </div>
  );
}
