import { type FormEvent, useState } from 'react';
import type { CartShop } from '../../../../shared/schemas/cart.ts';
import { Button } from '../../../components/ui/button.tsx';
import { TextField } from '../../../components/ui/text-field.tsx';
import { isApiError } from '../../../lib/api-client.ts';
import { applyCode, putNeededBy, removeCode } from '../api/offers-api.ts';

/**
 * One shop's code and needed-by date in the cart. The date is asked once per shop, not per item:
 * each shop makes and posts its items as one parcel, so one date per parcel is the promise it can
 * really keep. `onCart` refreshes the cart after a change (the route owns the cart's query).
 */
export function CartShopOffers({ shop, onCart }: { shop: CartShop; onCart: () => Promise<unknown> }) {
  const [code, setCode] = useState('');
  const [codeError, setCodeError] = useState<string | undefined>();
  const [dateError, setDateError] = useState<string | undefined>();
  const [busy, setBusy] = useState<'code' | 'remove' | 'date' | null>(null);
  const d = shop.discount ?? null;
  const delivery = shop.delivery ?? null;

  const run = async (what: 'code' | 'remove' | 'date', call: () => Promise<unknown>, setError: (m: string | undefined) => void, field: string) => {
    setBusy(what);
    setError(undefined);
    try {
      await call();
      await onCart();
      return true;
    } catch (e) {
      setError(isApiError(e) ? (e.fields?.[field] ?? e.message) : 'Something went wrong. Please try again.');
      return false;
    } finally {
      setBusy(null);
    }
  };

  const onApply = async (ev: FormEvent) => {
    ev.preventDefault();
    if (!code.trim()) return setCodeError('Enter a code.');
    if (await run('code', () => applyCode({ shopId: shop.shopId, code }), setCodeError, 'code')) setCode('');
  };

  return (
    <div className="mt-3 grid gap-5 border-t border-line pt-4 sm:grid-cols-2">
      <div className="flex flex-col gap-2">
        <form noValidate onSubmit={onApply} className="flex items-end gap-2">
          <TextField
            label={`Code from ${shop.shopName}`}
            name="code"
            autoComplete="off"
            autoCapitalize="characters"
            maxLength={40}
            value={code}
            onChange={(e) => setCode(e.target.value)}
            error={codeError}
            className="flex-1"
          />
          <Button type="submit" variant="secondary" className="min-h-11" pending={busy === 'code'} pendingLabel="Checking…">
            Apply
          </Button>
        </form>
        {d ? (
          <div className="flex flex-wrap items-center gap-2">
            <p role="status" className={`text-sm font-semibold ${d.applied ? 'text-thread-deep' : 'text-danger'}`} data-testid="code-message">
              {d.message}
            </p>
            <Button variant="quiet" className="min-h-11" pending={busy === 'remove'} onClick={() => run('remove', () => removeCode(shop.shopId), setCodeError, 'code')}>
              Remove code <span className="sr-only">{d.code}</span>
            </Button>
          </div>
        ) : null}
      </div>
      <div className="flex flex-col gap-2">
        <TextField
          label="Needed by"
          hint="The day you need this shop's parcel (leave empty if any day is fine)."
          type="date"
          name="neededBy"
          value={delivery?.neededBy ?? ''}
          disabled={busy === 'date'}
          onChange={(e) => run('date', () => putNeededBy({ shopId: shop.shopId, neededBy: e.target.value || null }), setDateError, 'neededBy')}
          error={dateError}
        />
        {delivery ? (
          <p role="status" className={`text-sm font-semibold ${delivery.canMake === false ? 'text-danger' : 'text-ink'}`} data-testid="needed-by-verdict">
            {delivery.neededBy === null
              ? `Ordered today, ${shop.shopName} posts it by ${delivery.shipBy} and it should arrive by ${delivery.arrival}.`
              : delivery.canMake
                ? `${shop.shopName} can make it: posted by ${delivery.shipBy}, with you by ${delivery.arrival}.`
                : `${shop.shopName} cannot make ${delivery.neededBy}: the earliest it can arrive is ${delivery.arrival}. Ask the shop, or pick a later day.`}
          </p>
        ) : null}
      </div>
    </div>
  );
}
