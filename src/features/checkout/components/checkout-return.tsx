import { useEffect } from 'react';
import { Link } from 'react-router-dom';
import { formatMoney } from '../../../../shared/money.ts';
import { ButtonLink, Spinner } from '../../../components/ui/button.tsx';
import { StitchedBox } from '../../../components/ui/card.tsx';
import { paths } from '../../../config/paths.ts';
import { useCheckoutStatus } from '../api/get-checkout-status.ts';

/** The page the payment provider sends the shopper back to: waits for the orders, then shows them. */
export function CheckoutReturn({ sessionId, onConfirmed }: { sessionId: string; onConfirmed?: () => void }) {
  const status = useCheckoutStatus(sessionId);
  const paid = status.data?.state === 'paid';
  useEffect(() => {
    if (paid) onConfirmed?.();
  }, [paid, onConfirmed]);

  if (!sessionId) return <p role="alert">This page needs a payment reference. Go back to your cart to try again.</p>;
  if (status.isPending) {
    return (
      <StitchedBox className="py-12 text-center">
        <Spinner label="Checking your payment…" />
      </StitchedBox>
    );
  }
  if (status.isError) {
    return (
      <div role="alert" className="flex flex-col gap-3">
        <p className="font-bold">We could not check this payment.</p>
        <p>{status.error.message}</p>
        <ButtonLink to={paths.cart.getHref()} variant="secondary">
          Back to your cart
        </ButtonLink>
      </div>
    );
  }
  const s = status.data;
  if (s.state === 'paid') {
    return (
      <section aria-labelledby="confirmed" className="flex flex-col gap-5">
        <div role="status" className="rounded-lg border-2 border-thread bg-thread-wash p-5">
          <h2 id="confirmed" className="text-2xl font-extrabold">
            Thank you, your order is confirmed
          </h2>
          <p>
            You paid {formatMoney(s.totalMinor, s.currency)}. {s.orders.length > 1 ? `Each of the ${s.orders.length} shops has its own order:` : 'Your order:'}
          </p>
        </div>
        <ul className="flex flex-col gap-3">
          {s.orders.map((o) => (
            <li key={o.id} className="flex flex-wrap items-center justify-between gap-2 rounded-lg border border-line bg-white p-4">
              <span>
                <span className="font-extrabold">{o.number}</span> from {o.shopName}
              </span>
              <span className="flex items-center gap-4">
                <span className="font-bold">{formatMoney(o.totalMinor, s.currency)}</span>
                <Link to={paths.orderDetail.getHref(o.id)} className="font-bold text-thread-deep underline underline-offset-4">
                  See order {o.number}
                </Link>
              </span>
            </li>
          ))}
        </ul>
        <p className="text-ink-soft">
          A confirmation is on its way to your inbox. Each shop checks the spelling before cutting; we will e-mail you when your item goes into production, if the shop needs you to check something,
          and when it ships.
        </p>
      </section>
    );
  }
  if (s.paymentReceived) {
    return (
      <StitchedBox className="flex flex-col items-center gap-3 py-12 text-center">
        <Spinner label="Payment received. Confirming your order with the shops…" />
        <p className="text-sm text-ink-soft">This usually takes a few seconds. You can keep this page open.</p>
      </StitchedBox>
    );
  }
  return (
    <div role="alert" className="flex flex-col gap-4 rounded-lg border-2 border-marigold bg-marigold-wash p-5">
      <p className="font-bold">{s.state === 'expired' ? 'This payment page expired before it was used.' : 'Your payment did not go through.'}</p>
      {s.problem ? <p>{s.problem}</p> : null}
      <div className="flex flex-wrap gap-3">
        {s.payUrl ? (
          <a href={s.payUrl} className="font-bold underline">
            Try again on the payment page
          </a>
        ) : null}
        <ButtonLink to={paths.cart.getHref()} variant="secondary">
          Back to your cart
        </ButtonLink>
      </div>
    </div>
  );
}
