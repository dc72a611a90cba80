import { useLatestCheckout } from '../api/get-latest-checkout.ts';

/** After coming back from the payment page without paying: why, in our words. */
export function CheckoutNotice({ viewer, enabled }: { viewer: string; enabled: boolean }) {
  const latest = useLatestCheckout(viewer, enabled);
  if (!enabled) return null;
  const problem = latest.data?.checkout?.problem ?? (latest.isSuccess ? 'You left the payment page before paying. Nothing was charged, and your cart is just as you left it.' : null);
  if (!problem) return null;
  return (
    <div role="alert" className="mb-6 rounded-lg border-2 border-marigold bg-marigold-wash p-4">
      <p className="font-bold">Your payment did not go through</p>
      <p>{problem}</p>
    </div>
  );
}
