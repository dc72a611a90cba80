/**
 * How well a vinyl colour shows on a blank colour: the contrast ratio of WCAG 2.2, computed from
 * relative luminance. Definitions: https://www.w3.org/TR/WCAG22/#dfn-relative-luminance and
 * https://www.w3.org/TR/WCAG22/#dfn-contrast-ratio. Pure: hex strings in, numbers out.
 */

/** Below this ratio a pairing is named to the shopper (WCAG's level for large graphics and text, 3:1). */
export const LOW_CONTRAST_RATIO = 3;

const HEX = /^#?([0-9a-f]{6})$/i;

/** `#rrggbb` → [r, g, b] in 0…1, or null for anything else. */
export function parseHex(hex: string): [number, number, number] | null {
  const m = HEX.exec(hex.trim());
  if (!m) return null;
  const n = Number.parseInt(m[1]!, 16);
  return [((n >> 16) & 255) / 255, ((n >> 8) & 255) / 255, (n & 255) / 255];
}

/** sRGB channel → linear, as WCAG 2.2 defines it (threshold 0.04045, the sRGB standard's). */
const linear = (c: number) => (c <= 0.04045 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4);

/** WCAG 2.2 relative luminance: L = 0.2126 R + 0.7152 G + 0.0722 B on linear channels (0 black … 1 white). */
export function relativeLuminance(hex: string): number {
  const rgb = parseHex(hex);
  if (!rgb) throw new Error(`Not a #rrggbb colour: ${hex}`);
  const [r, g, b] = rgb.map(linear) as [number, number, number];
  return 0.2126 * r + 0.7152 * g + 0.0722 * b;
}

/** WCAG 2.2 contrast ratio (L1 + 0.05) / (L2 + 0.05), L1 the lighter: 1 (same) … 21 (black on white). */
export function contrastRatio(a: string, b: string): number {
  const la = relativeLuminance(a);
  const lb = relativeLuminance(b);
  return (Math.max(la, lb) + 0.05) / (Math.min(la, lb) + 0.05);
}

export type ContrastPair = { materialId: string; colourId: string };
export type ContrastWarning = ContrastPair & { vinylName: string; blankColourName: string; ratio: number; message: string };

/**
 * The vinyl colours that will hardly show on the blank colour (ratio below 3:1), each once, except
 * the pairings the seller marked as intended (tone on tone) for this listing.
 */
export function contrastWarnings(
  vinyls: ReadonlyArray<{ id: string; colourName: string; colourHex: string }>,
  blank: { id: string; name: string; hex: string; noun: string },
  intended: ReadonlyArray<ContrastPair> = [],
): ContrastWarning[] {
  const out: ContrastWarning[] = [];
  const seen = new Set<string>();
  for (const v of vinyls) {
    if (seen.has(v.id)) continue;
    seen.add(v.id);
    if (intended.some((p) => p.materialId === v.id && p.colourId === blank.id)) continue;
    if (!parseHex(v.colourHex) || !parseHex(blank.hex)) continue;
    const ratio = contrastRatio(v.colourHex, blank.hex);
    if (ratio >= LOW_CONTRAST_RATIO) continue;
    const shown = Math.floor(ratio * 10) / 10;
    out.push({
      materialId: v.id,
      colourId: blank.id,
      vinylName: v.colourName,
      blankColourName: blank.name,
      ratio,
      message: `${v.colourName} on a ${blank.name.toLowerCase()} ${blank.noun} has a contrast of ${shown.toFixed(1)}:1 and will hardly show. Pick a darker or lighter colour for one of them.`,
    });
  }
  return out;
}
