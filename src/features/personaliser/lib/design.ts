/**
 * A listing's personalisation schema plus the shopper's choices → the engine's compose() input,
 * through the mapping the server's cart also uses (shared/engine/listing-design.ts), so the preview
 * draws what the cart stores; tests/client/design-parity.test.ts holds the two to the same pieces.
 */
import type { ComposeInput } from '../../../../shared/engine/compose.ts';
import { listingDesign } from '../../../../shared/engine/listing-design.ts';
import { blankChoiceOf, type ResolvedBlankOffer } from '../../../../shared/schemas/blanks.ts';
import type { ListingPage, PublicMaterial } from '../../../../shared/schemas/catalog.ts';
import type { Choices } from '../../../../shared/schemas/listing.ts';

export { blankFor } from '../../../../shared/engine/listing-design.ts';

export type DesignListing = Pick<ListingPage, 'content' | 'materials' | 'motifs'> & { blankOffer?: ResolvedBlankOffer | null };

/** The material a choice resolves to (the field's first colour when none is picked yet). */
export function materialFor(listing: DesignListing, id: string | null | undefined): PublicMaterial | undefined {
  return id ? listing.materials.find((m) => m.id === id) : undefined;
}

/**
 * compose() input for the choices, or null when there is nothing to draw yet (no text typed,
 * no motif). Unknown colours or motifs are skipped rather than thrown: the server has the last word.
 */
export function designInput(listing: DesignListing, choices: Choices): ComposeInput | null {
  return listingDesign(
    listing.content,
    choices,
    {
      material: (id) => materialFor(listing, id),
      motif: (id) => listing.motifs.find((m) => m.id === id),
    },
    blankChoiceOf(listing.blankOffer, choices),
  ).input;
}
