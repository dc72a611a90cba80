/**
 * Why "Add to cart" cannot go yet, said before the shopper presses it: the listing's own rules
 * (checkChoices, the same check the server runs on the cart line) and the characters the font
 * cannot draw (the engine's warning, which the server refuses too). Null when the design can go.
 */
import type { Placement } from '../../../../shared/engine/place.ts';
import type { ResolvedBlankOffer } from '../../../../shared/schemas/blanks.ts';
import { type Choices, checkChoices, type PricedContent } from '../../../../shared/schemas/listing.ts';

/** The warnings of the live layout that the server would refuse. */
const REFUSED_WARNINGS = new Set(['missing_characters']);

export function addToCartBlocker(content: PricedContent, choices: Choices, placement: Placement | null, offer?: ResolvedBlankOffer | null): string | null {
  const p = content.personalisation;
  const errs = checkChoices(content, choices, offer);
  const first = Object.entries(errs)[0];
  if (first) {
    const [key, message] = first;
    const fieldId = /^texts\.([^.]+)/.exec(key)?.[1] ?? /^textColours\.(.+)$/.exec(key)?.[1];
    const label = fieldId
      ? p.textFields.find((f) => f.id === fieldId)?.label
      : key.startsWith('motif')
        ? 'Motif'
        : key.startsWith('outline')
          ? 'Outline'
          : key === 'sizeId'
            ? 'Size'
            : key === 'colourId'
              ? 'Colour'
              : undefined;
    return label ? `${label}: ${message}` : message;
  }
  const refused = placement?.warnings.find((w) => REFUSED_WARNINGS.has(w.code));
  return refused ? refused.message : null;
}

/** After the server refused the line: bring the first field it named into view and focus it. */
export function revealFirstError(form: HTMLFormElement) {
  const target = form.querySelector<HTMLElement>('[aria-invalid="true"]') ?? form.querySelector<HTMLElement>('[data-field-error]');
  if (!target) return;
  target.scrollIntoView({ block: 'center' });
  if (target.matches('input, select, textarea, button')) target.focus({ preventScroll: true });
}
