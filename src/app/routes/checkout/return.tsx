import { useQueryClient } from '@tanstack/react-query';
import { useCallback } from 'react';
import { useSearchParams } from 'react-router-dom';
import { PageHeading } from '../../../components/ui/card.tsx';
import { cartKeys } from '../../../features/cart/api/keys.ts';
import { CheckoutReturn } from '../../../features/checkout/components/checkout-return.tsx';
import { orderKeys } from '../../../features/orders/api/keys.ts';

export function CheckoutReturnPage() {
  const [params] = useSearchParams();
  const qc = useQueryClient();
  // the paid lines have left the cart and new orders exist: refresh both
  const onConfirmed = useCallback(() => {
    void qc.invalidateQueries({ queryKey: cartKeys.all });
    void qc.invalidateQueries({ queryKey: orderKeys.all });
  }, [qc]);
  return (
    <div>
      <PageHeading title="Your payment" />
      <CheckoutReturn sessionId={params.get('session_id') ?? ''} onConfirmed={onConfirmed} />
    </div>
  );
}
