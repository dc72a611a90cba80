/**
 * Adding the design to the cart: quantity, the pending state, the confirmation, and the server's
 * field messages mapped back onto the form's keys (`choices.texts.name.text` → `texts.name.text`);
 * a message no field shows goes to a toast.
 */
import { type FormEvent, useState } from 'react';
import type { Cart } from '../../../../shared/schemas/cart.ts';
import { MAX_LINE_QUANTITY } from '../../../../shared/schemas/cart.ts';
import type { Choices } from '../../../../shared/schemas/listing.ts';
import { useToast } from '../../../components/ui/toast.tsx';
import { isApiError } from '../../../lib/api-client.ts';
import { revealFirstError } from '../lib/add-blockers.ts';

export type AddToCart = (input: { listingId: string; quantity: number; choices: Choices }) => Promise<Cart>;

const isKnownField = (k: string) => /^(texts\.[^.]+\.(text|fontId)|textColours\.|motifId$|motifColours\.|outlineMaterialId$|quantity$)/.test(k);

export function useAddToCart(listingId: string, addToCart: AddToCart) {
  const toast = useToast();
  const [quantity, setQuantityRaw] = useState(1);
  const [fieldErrors, setFieldErrors] = useState<Record<string, string>>({});
  const [added, setAdded] = useState<{ itemCount: number } | null>(null);
  const [pending, setPending] = useState(false);

  async function submit(e: FormEvent, choices: Choices) {
    e.preventDefault();
    const form = e.currentTarget instanceof HTMLFormElement ? e.currentTarget : null;
    setPending(true);
    setFieldErrors({});
    try {
      const cart = await addToCart({ listingId, quantity, choices });
      setAdded({ itemCount: cart.itemCount });
    } catch (err) {
      if (isApiError(err) && err.fields) {
        const mapped: Record<string, string> = {};
        for (const [k, v] of Object.entries(err.fields)) mapped[k.replace(/^choices\./, '')] = v;
        setFieldErrors(mapped);
        if (!Object.keys(mapped).some(isKnownField)) toast.error(err.message);
        // the refusal may name a field far above the button: show it (after React has drawn it)
        else if (form) setTimeout(() => revealFirstError(form), 0);
      } else toast.error(err instanceof Error ? err.message : 'Adding to the cart failed. Please try again.');
    } finally {
      setPending(false);
    }
  }

  return {
    quantity,
    /** whole items from 1 to the most one line takes */
    setQuantity: (raw: string) => setQuantityRaw(Math.max(1, Math.min(MAX_LINE_QUANTITY, Math.floor(Number(raw) || 1)))),
    fieldErrors,
    /** the shopper changed this field: its server message no longer applies */
    clearFieldError(key: string) {
      if (fieldErrors[key]) setFieldErrors(({ [key]: _drop, ...rest }) => rest);
    },
    added,
    dismissAdded: () => setAdded(null),
    pending,
    submit,
  };
}
