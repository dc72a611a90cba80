import type { ReactNode } from 'react';
import { Link } from 'react-router-dom';
import { formatMoney } from '../../../../shared/money.ts';
import type { Cart, CartShop } from '../../../../shared/schemas/cart.ts';
import { Button } from '../../../components/ui/button.tsx';
import { useToast } from '../../../components/ui/toast.tsx';
import { useRemoveCartLine } from '../api/remove-cart-line.ts';
import { DesignPreview, PersonalisationSummary } from './design-preview.tsx';
import { QuantityForm } from './quantity-form.tsx';

/** The cart's lines grouped by shop, each shop with its shipping, and the totals; `checkout` is the call to action. */
export function CartView({
  cart,
  checkout,
  shopExtras,
}: {
  cart: Cart;
  checkout: ReactNode /** under each shop's lines: its code and needed-by date (composed by the route) */;
  shopExtras?: (shop: CartShop) => ReactNode;
}) {
  const toast = useToast();
  const remove = useRemoveCartLine();
  const cur = cart.currency ?? 'USD';
  return (
    <div className="grid gap-8 lg:grid-cols-[1fr_20rem]">
      <div className="flex flex-col gap-6">
        {cart.shops.map((shop) => (
          <section key={shop.shopId} aria-labelledby={`shop-${shop.shopId}`} className="rounded-lg border border-line bg-white p-5 shadow-sm">
            <h2 id={`shop-${shop.shopId}`} className="mb-4 text-lg font-extrabold">
              From{' '}
              {shop.shopSlug ? (
                <Link to={`/shops/${shop.shopSlug}`} className="underline decoration-thread decoration-2 underline-offset-4">
                  {shop.shopName}
                </Link>
              ) : (
                shop.shopName
              )}
            </h2>
            <ul className="flex flex-col divide-y divide-line">
              {shop.lines.map((line) => (
                <li key={line.id} className="flex flex-col gap-4 py-4 sm:flex-row">
                  <DesignPreview snapshot={line.snapshot} />
                  <div className="flex flex-1 flex-col gap-2">
                    <div className="flex flex-wrap items-baseline justify-between gap-2">
                      <h3 className="font-bold">{line.snapshot.listingTitle}</h3>
                      <p className="font-bold">{formatMoney(line.lineTotalMinor, shop.currency)}</p>
                    </div>
                    <p className="text-sm text-ink-soft">
                      {formatMoney(line.unitPriceMinor, shop.currency)} each · {line.snapshot.blank.label} · {line.snapshot.geometry.layerCount}{' '}
                      {line.snapshot.geometry.layerCount === 1 ? 'layer' : 'layers'}
                    </p>
                    <PersonalisationSummary snapshot={line.snapshot} />
                    {!line.available ? (
                      <p role="alert" className="rounded-lg bg-danger-wash px-3 py-2 text-sm font-semibold text-danger">
                        This listing is no longer on sale. Remove it to check out.
                      </p>
                    ) : null}
                    <div className="flex flex-wrap items-end gap-3">
                      <QuantityForm lineId={line.id} quantity={line.quantity} label={line.snapshot.listingTitle} />
                      <Button
                        variant="quiet"
                        className="min-h-11"
                        pending={remove.isPending && remove.variables === line.id}
                        onClick={() => remove.mutate(line.id, { onError: (e) => toast.error(e.message), onSuccess: () => toast.success('Removed from your cart.') })}
                      >
                        Remove <span className="sr-only">{line.snapshot.listingTitle}</span>
                      </Button>
                    </div>
                  </div>
                </li>
              ))}
            </ul>
            {shopExtras?.(shop)}
            <dl className="mt-2 flex flex-col gap-1 border-t border-line pt-3 text-sm">
              <div className="flex justify-between">
                <dt>Items</dt>
                <dd>{formatMoney(shop.subtotalMinor, shop.currency)}</dd>
              </div>
              {shop.discountMinor ? (
                <div className="flex justify-between text-thread-deep">
                  <dt>Code {shop.discount?.code}</dt>
                  <dd>−{formatMoney(shop.discountMinor, shop.currency)}</dd>
                </div>
              ) : null}
              <div className="flex justify-between">
                <dt>Shipping from {shop.shopName}</dt>
                <dd>{formatMoney(shop.shippingMinor, shop.currency)}</dd>
              </div>
              <div className="flex justify-between font-bold">
                <dt>{shop.shopName} total</dt>
                <dd>{formatMoney(shop.totalMinor, shop.currency)}</dd>
              </div>
            </dl>
          </section>
        ))}
      </div>
      <aside aria-label="Order total" className="flex h-fit flex-col gap-4 rounded-lg border-2 border-ink/10 bg-white p-5 shadow-sm max-lg:order-first lg:sticky lg:top-4">
        <dl className="flex flex-col gap-1.5">
          <div className="flex justify-between">
            <dt>Items ({cart.itemCount})</dt>
            <dd>{formatMoney(cart.subtotalMinor, cur)}</dd>
          </div>
          <div className="flex justify-between">
            <dt>
              Shipping ({cart.shops.length} {cart.shops.length === 1 ? 'shop' : 'shops'})
            </dt>
            <dd>{formatMoney(cart.shippingMinor, cur)}</dd>
          </div>
          {cart.discountMinor ? (
            <div className="flex justify-between text-thread-deep">
              <dt>Shop codes</dt>
              <dd>−{formatMoney(cart.discountMinor, cur)}</dd>
            </div>
          ) : null}
          <div className="flex justify-between border-t border-line pt-2 text-lg font-extrabold">
            <dt>Total</dt>
            <dd data-testid="cart-total">{formatMoney(cart.totalMinor, cur)}</dd>
          </div>
        </dl>
        <p className="text-sm text-ink-soft">One payment covers every shop. Each shop gets its own order and checks your personalisation before cutting.</p>
        {checkout}
      </aside>
    </div>
  );
}
