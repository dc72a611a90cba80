/**
 * Fit per blank size: the same design placed on each size's print area, to say at which sizes a
 * name is at least the smallest letter height. Pure; the personaliser uses it to suggest a size.
 */
import type { FontRegistry } from './fonts.ts';
import { blankFor, type DesignSize } from './listing-design.ts';
import { type ComposeInput, placeDesign } from './place.ts';

export type SizeArea = DesignSize & { id: string };
export type SizeFit = {
  id: string;
  label: string;
  /** letter height each text field gets at this size, mm */
  letterHeights: Record<string, number>;
  /** text fields that come out below their smallest letter height at this size */
  tooSmall: string[];
};

/** The compose input with the blank's print area and top offset of one size (as blankFor makes it). */
export function withSize(input: ComposeInput, size: DesignSize): ComposeInput {
  const b = input.blank;
  return { ...input, blank: blankFor({ blank: { kind: b.kind, label: b.name, widthMm: b.printArea.widthMm, heightMm: b.printArea.heightMm, topOffsetMm: b.topOffsetMm } }, size) };
}

/** Places the design at every size; a size the design cannot be placed on at all is left out. */
export function fitBySize(registry: FontRegistry, input: ComposeInput, sizes: readonly SizeArea[]): SizeFit[] {
  const out: SizeFit[] = [];
  for (const s of sizes) {
    try {
      const p = placeDesign(registry, withSize(input, s));
      const tooSmall = [...new Set(p.warnings.filter((w) => w.code === 'below_min_letter_height').map((w) => w.fieldId))];
      out.push({ id: s.id, label: s.label, letterHeights: p.letterHeights, tooSmall });
    } catch {
      // the layout refused (e.g. missing text): nothing to say about this size
    }
  }
  return out;
}

/** The first size after `sizeId` (in the offered order) where the field is not too small, or null. */
export function largerSizeThatFits(fits: readonly SizeFit[], sizeId: string, fieldId: string): SizeFit | null {
  const i = fits.findIndex((f) => f.id === sizeId);
  return fits.slice(i + 1).find((f) => !f.tooSmall.includes(fieldId)) ?? null;
}
