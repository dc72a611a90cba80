import { useState } from 'react';
import { Button, ButtonLink } from '../../../components/ui/button.tsx';
import { paths } from '../../../config/paths.ts';
import { isApiError } from '../../../lib/api-client.ts';
import { useStartCheckout } from '../api/start-checkout.ts';

/**
 * Pay for the whole cart. A guest is asked to sign in or sign up first and comes back to the
 * cart (which waits for them, merged into their account). Confirms the amount before leaving
 * for the payment page (WCAG 2.2, 3.3.4).
 */
export function CheckoutButton({ signedIn, totalText, disabled }: { signedIn: boolean; totalText: string; disabled?: boolean }) {
  const start = useStartCheckout();
  const [error, setError] = useState<string | null>(null);
  if (!signedIn) {
    return (
      <div className="flex flex-col gap-3 rounded-lg bg-marigold-wash p-4">
        <p className="font-semibold">Sign in or create an account to pay. Your cart stays just as it is.</p>
        <ButtonLink to={paths.auth.signIn.getHref(paths.cart.getHref())}>Sign in to check out</ButtonLink>
        <ButtonLink to={paths.auth.signUp.getHref(paths.cart.getHref())} variant="secondary">
          Create an account
        </ButtonLink>
      </div>
    );
  }
  async function go() {
    setError(null);
    try {
      const s = await start.mutateAsync();
      window.location.assign(s.url);
    } catch (e) {
      setError(isApiError(e) ? e.message : 'We could not open the payment page. Please try again.');
    }
  }
  return (
    <div className="flex flex-col gap-2">
      <Button onClick={go} pending={start.isPending} pendingLabel="Opening the payment page…" disabled={disabled} className="w-full">
        Pay {totalText}
      </Button>
      <p className="text-xs text-ink-soft">You will enter your card on the payment page; nothing is charged until you confirm there.</p>
      {error ? (
        <p role="alert" className="text-sm font-semibold text-danger">
          {error}
        </p>
      ) : null}
    </div>
  );
}
