/**
 * Placement: where each piece of one item goes on the blank — the one definition, used by
 * compose() (which then does the production work: outline offset, weeding, mirrored paths) and by
 * the personaliser's live preview (which draws the pieces through their matrices as they are, so a
 * keystroke costs one text layout and no path rewriting).
 *
 * Rules: fields are stacked top to bottom in their order, each centred horizontally, the first
 * starting `topOffsetMm` down; a text field is fitted to the usable print area (fit.ts) and a motif
 * scaled to its height (never wider or taller than the area); when the stack is taller than the
 * area every field is scaled down together until it fits. Pieces come in press order, bottom → top:
 * motif layers, then names (an outline backing travels with its name, see `outline`).
 */

import type { Blank } from './blanks.ts';
import { usableArea } from './blanks.ts';
import { fitText, type TextWarning } from './fit.ts';
import type { FontRegistry } from './fonts.ts';
import type { StoredMotifGeometry } from './motif.ts';
import { type BBox, unionBBox } from './path.ts';
import { LayoutError } from './text-layout.ts';

export type MaterialKind = 'smooth' | 'glitter' | 'flock' | 'metallic' | 'patterned';
export type PieceRole = 'text' | 'outline' | 'motif';

export interface TextFieldDef {
  kind: 'text';
  id: string;
  fontId: string;
  /** Default cap height; the shopper may choose smaller or up to maxLetterHeightMm. */
  letterHeightMm: number;
  maxLetterHeightMm?: number;
  minLetterHeightMm?: number;
  maxChars?: number;
  trackingMm?: number;
  materialKind: MaterialKind;
  colour: string;
  /** Outline backing grown around the name. */
  outline?: { offsetMm: number; materialKind: MaterialKind; colour: string };
}

export interface MotifOption {
  id: string;
  geometry: StoredMotifGeometry;
  /** Material and colour per motif layer id; layers not listed use the field default and their own colour. */
  layers?: Record<string, { materialKind?: MaterialKind; colour?: string }>;
}

export interface MotifFieldDef {
  kind: 'motif';
  id: string;
  /** Height of the motif's ink on the item, mm (scaled down if it does not fit). */
  heightMm: number;
  materialKind: MaterialKind;
  options: MotifOption[];
}

export interface ColourFieldDef {
  kind: 'colour';
  id: string;
  /** What the colour paints: a text field, its outline (layerId 'outline'), or a motif layer. */
  target: { fieldId: string; layerId?: string };
  options: string[];
}

export type FieldDef = TextFieldDef | MotifFieldDef | ColourFieldDef;

export type Choice = { text: string; letterHeightMm?: number } | { motifId: string } | { colour: string };

export interface ComposeInput {
  blank: Blank;
  fields: FieldDef[];
  choices: Record<string, Choice | undefined>;
  /** Vertical gap between stacked fields, mm (default 8). */
  gapMm?: number;
}

export interface ComposeWarning extends TextWarning {
  fieldId: string;
}

export class ComposeError extends Error {
  constructor(
    public readonly fieldId: string,
    message: string,
  ) {
    super(message);
    this.name = 'ComposeError';
  }
}

/** An affine matrix (a b c d e f), as in SVG's `matrix()`. Placement only scales and moves. */
export type Matrix = [number, number, number, number, number, number];

export type PlacedPiece = {
  /** Unique within the item, e.g. "name", "motif:flame" (an outline is "name-outline" once composed). */
  layerId: string;
  fieldId: string;
  role: Exclude<PieceRole, 'outline'>;
  materialKind: MaterialKind;
  colour: string;
  /** path data in the piece's own coordinates (the text layout's or the motif layer's)… */
  d: string;
  /** …drawn through this matrix onto the blank, mm */
  matrix: Matrix;
  /** the piece's box on the blank, mm */
  bboxMm: BBox;
  /** ink area on the blank, mm², where it is known without geometry work (motif layers) */
  areaMm2?: number;
  /** text with an outline backing: its offset, material and colour */
  outline?: { offsetMm: number; materialKind: MaterialKind; colour: string };
};

export type Placement = {
  /** Press order, bottom → top: motif layers, then names. */
  pieces: PlacedPiece[];
  /** The design's box on the blank, an outline counted as its name's box grown by the offset. */
  bboxMm: BBox;
  warnings: ComposeWarning[];
  /** Letter height actually used per text field, mm. */
  letterHeights: Record<string, number>;
};

type Block = { w: number; h: number; place(x: number, y: number): PlacedPiece[] };

const boxAt = (b: BBox, m: Matrix): BBox => ({ minX: b.minX * m[0] + m[4], minY: b.minY * m[3] + m[5], maxX: b.maxX * m[0] + m[4], maxY: b.maxY * m[3] + m[5] });

/**
 * Places every piece of the item. Throws ComposeError (with the field's id) for a colour that is not
 * offered, missing text, a motif not offered, or text the layout refuses.
 */
export function placeDesign(registry: FontRegistry, input: ComposeInput): Placement {
  const { blank, fields, choices } = input;
  const gap = input.gapMm ?? 8;
  const area = usableArea(blank);
  const colours = new Map<string, string>(); // "field" or "field:layer" → colour
  for (const f of fields) {
    if (f.kind !== 'colour') continue;
    const c = choices[f.id];
    if (!c) continue;
    if (!('colour' in c) || !f.options.includes(c.colour)) throw new ComposeError(f.id, 'Choose one of the colours offered.');
    colours.set(f.target.layerId ? `${f.target.fieldId}:${f.target.layerId}` : f.target.fieldId, c.colour);
  }
  const warnings: ComposeWarning[] = [];
  const letterHeights: Record<string, number> = {};
  const layoutFields = fields.filter((f): f is TextFieldDef | MotifFieldDef => f.kind !== 'colour');
  const stackGaps = Math.max(0, layoutFields.length - 1) * gap;

  const buildBlocks = (k: number): Block[] => {
    warnings.length = 0;
    return layoutFields.map((f): Block => {
      if (f.kind === 'text') {
        const c = choices[f.id];
        if (!c || !('text' in c) || c.text.trim() === '') throw new ComposeError(f.id, 'Enter the text for this item.');
        const chosen = Math.min(c.letterHeightMm ?? f.letterHeightMm, f.maxLetterHeightMm ?? Infinity, f.letterHeightMm * 4);
        const grow = f.outline ? 2 * f.outline.offsetMm : 0;
        let fitted: ReturnType<typeof fitText>;
        try {
          fitted = fitText(
            registry,
            { text: c.text, fontId: f.fontId, letterHeightMm: Math.max(0.5, Math.floor(chosen * k * 1000) / 1000), trackingMm: f.trackingMm },
            { maxWidthMm: area.widthMm - grow, maxHeightMm: Math.max(1, area.heightMm - stackGaps - grow), minLetterHeightMm: f.minLetterHeightMm, maxChars: f.maxChars },
          );
        } catch (e) {
          if (e instanceof LayoutError) throw new ComposeError(f.id, e.message);
          throw e;
        }
        for (const w of fitted.warnings) warnings.push({ ...w, fieldId: f.id });
        letterHeights[f.id] = fitted.letterHeightMm;
        const L = fitted.layout;
        const pad = f.outline ? f.outline.offsetMm : 0;
        return {
          w: L.widthMm + grow,
          h: L.heightMm + grow,
          place(x, y) {
            const matrix: Matrix = [1, 0, 0, 1, x + pad - L.bboxMm.minX, y + pad - L.bboxMm.minY];
            return [
              {
                layerId: f.id,
                fieldId: f.id,
                role: 'text',
                materialKind: f.materialKind,
                colour: colours.get(f.id) ?? f.colour,
                d: L.path,
                matrix,
                bboxMm: boxAt(L.bboxMm, matrix),
                ...(f.outline ? { outline: { offsetMm: f.outline.offsetMm, materialKind: f.outline.materialKind, colour: colours.get(`${f.id}:outline`) ?? f.outline.colour } } : {}),
              },
            ];
          },
        };
      }
      const c = choices[f.id];
      const opt = c && 'motifId' in c ? f.options.find((o) => o.id === c.motifId) : f.options.length === 1 ? f.options[0] : undefined;
      if (!opt) throw new ComposeError(f.id, 'Choose one of the motifs offered.');
      let ink: BBox | null = null;
      for (const l of opt.geometry.layers) ink = unionBBox(ink, l.bboxMm);
      const bb = ink!;
      const iw = bb.maxX - bb.minX,
        ih = bb.maxY - bb.minY;
      const m = Math.min(f.heightMm / ih, area.widthMm / iw, (area.heightMm - stackGaps) / ih) * k;
      return {
        w: iw * m,
        h: ih * m,
        place(x, y) {
          const matrix: Matrix = [m, 0, 0, m, x - bb.minX * m, y - bb.minY * m];
          return opt.geometry.layers.map((l) => {
            const spec = opt.layers?.[l.id];
            return {
              layerId: `${f.id}:${l.id}`,
              fieldId: f.id,
              role: 'motif' as const,
              materialKind: spec?.materialKind ?? f.materialKind,
              colour: colours.get(`${f.id}:${l.id}`) ?? spec?.colour ?? l.colour ?? '#000000',
              d: l.path,
              matrix,
              bboxMm: boxAt(l.bboxMm, matrix),
              areaMm2: l.areaMm2 * m * m,
            };
          });
        },
      };
    });
  };

  let blocks = buildBlocks(1);
  const total = () => blocks.reduce((s, b) => s + b.h, 0) + stackGaps;
  for (let i = 0; i < 5 && total() > area.heightMm + 1e-9; i++) {
    const inkH = blocks.reduce((s, b) => s + b.h, 0);
    const k = Math.max(0.01, (area.heightMm - stackGaps) / inkH) * (i === 0 ? 1 : 0.99 ** i);
    blocks = buildBlocks(k);
  }

  const placed: PlacedPiece[] = [];
  let y = blank.topOffsetMm;
  for (const b of blocks) {
    placed.push(...b.place((blank.widthMm - b.w) / 2, y));
    y += b.h + gap;
  }
  const rank = { motif: 1, text: 2 } as const;
  const pieces = placed
    .map((p, i) => ({ p, i }))
    .sort((a, b) => rank[a.p.role] - rank[b.p.role] || a.i - b.i)
    .map((x) => x.p);
  let bbox: BBox | null = null;
  for (const p of pieces) {
    const o = p.outline?.offsetMm ?? 0;
    bbox = unionBBox(bbox, { minX: p.bboxMm.minX - o, minY: p.bboxMm.minY - o, maxX: p.bboxMm.maxX + o, maxY: p.bboxMm.maxY + o });
  }
  return { pieces, bboxMm: bbox ?? { minX: 0, minY: 0, maxX: 0, maxY: 0 }, warnings: [...warnings], letterHeights };
}
