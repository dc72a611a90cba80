import { useQueryClient } from '@tanstack/react-query';
import { useSearchParams } from 'react-router-dom';
import { formatMoney } from '../../../../shared/money.ts';
import { ButtonLink, Spinner } from '../../../components/ui/button.tsx';
import { PageHeading, StitchedBox } from '../../../components/ui/card.tsx';
import { paths } from '../../../config/paths.ts';
import { useMe } from '../../../features/auth/api/get-me.ts';
import { useCart } from '../../../features/cart/api/get-cart.ts';
import { cartKeys } from '../../../features/cart/api/keys.ts';
import { CartView } from '../../../features/cart/components/cart-view.tsx';
import { CheckoutButton } from '../../../features/checkout/components/checkout-button.tsx';
import { CheckoutNotice } from '../../../features/checkout/components/checkout-notice.tsx';
import { CartShopOffers } from '../../../features/offers/components/cart-shop-offers.tsx';

export function CartPage() {
  const me = useMe();
  const [params] = useSearchParams();
  const viewer = me.data?.user.id ?? 'guest';
  const cart = useCart(viewer);
  const cameBack = params.get('checkout') === 'cancelled';
  const qc = useQueryClient();

  return (
    <div>
      <PageHeading title="Your cart" lead="Items from several shops can share one cart; you pay once at checkout." />
      <CheckoutNotice viewer={viewer} enabled={cameBack && Boolean(me.data)} />
      {me.isPending || cart.isPending ? (
        <div className="py-16 text-center text-ink-soft">
          <Spinner label="Loading your cart…" />
        </div>
      ) : cart.isError ? (
        <p role="alert" className="font-semibold text-danger">
          {cart.error.message}
        </p>
      ) : cart.data.itemCount === 0 ? (
        <StitchedBox className="flex flex-col items-center gap-4 py-14 text-center">
          <p className="text-xl font-extrabold">Your cart is empty</p>
          <p className="max-w-md text-ink-soft">Find a tote, tee or pouch, type a name on it, and it will wait for you here.</p>
          <ButtonLink to={paths.search.getHref()}>Start browsing</ButtonLink>
        </StitchedBox>
      ) : (
        <CartView
          cart={cart.data}
          shopExtras={(shop) => <CartShopOffers shop={shop} onCart={() => qc.invalidateQueries({ queryKey: cartKeys.all })} />}
          checkout={
            <CheckoutButton
              signedIn={Boolean(me.data)}
              totalText={formatMoney(cart.data.totalMinor, cart.data.currency ?? 'USD')}
              disabled={cart.data.shops.some((s) => s.lines.some((l) => !l.available))}
            />
          }
        />
      )}
    </div>
  );
}
