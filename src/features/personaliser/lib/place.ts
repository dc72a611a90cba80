/**
 * The live preview's fast path: where compose() puts every piece, without the work compose() also
 * does for production (weeding analysis, the outline's polygon offset, cut-ready mirrored paths),
 * which takes 20–400 ms per call — far too slow for a keystroke. The placement rules are compose()'s
 * own, step for step (shared/engine/compose.ts); tests/client/place.test.ts checks every piece
 * lands exactly where compose() puts it. The full compose() runs off the main thread for the
 * weeding label and the true outline (compose-client.ts).
 */
import type { ComposeInput, MotifFieldDef, TextFieldDef, ComposeWarning, PieceRole } from '../../../../shared/engine/compose.ts';
import type { FontRegistry } from '../../../../shared/engine/fonts.ts';
import { usableArea } from '../../../../shared/engine/blanks.ts';
import { fitText } from '../../../../shared/engine/fit.ts';
import { unionBBox, type BBox } from '../../../../shared/engine/path.ts';

export type PlacedPiece = {
  layerId: string;
  fieldId: string;
  role: Exclude<PieceRole, 'outline'>;
  colour: string;
  /** path data in the piece's own coordinates… */
  d: string;
  /** …drawn through this matrix (a b c d e f) onto the blank, mm */
  matrix: [number, number, number, number, number, number];
  /** the piece's box on the blank, mm */
  bboxMm: BBox;
  /** text with an outline backing: its offset and colour (drawn as a wide stroke until the true outline is in) */
  outline?: { offsetMm: number; colour: string };
};

export type Placement = {
  pieces: PlacedPiece[];
  bboxMm: BBox;
  warnings: ComposeWarning[];
  letterHeights: Record<string, number>;
};

type Block = { w: number; h: number; place(x: number, y: number): PlacedPiece[] };

const boxAt = (b: BBox, m: PlacedPiece['matrix']): BBox => ({ minX: b.minX * m[0] + m[4], minY: b.minY * m[3] + m[5], maxX: b.maxX * m[0] + m[4], maxY: b.maxY * m[3] + m[5] });

/** compose()'s placement: throws compose()'s errors for missing text or motifs. */
export function placeDesign(registry: FontRegistry, input: ComposeInput): Placement {
  const { blank, fields, choices } = input;
  const gap = input.gapMm ?? 8;
  const area = usableArea(blank);
  const colours = new Map<string, string>();
  for (const f of fields) {
    if (f.kind !== 'colour') continue;
    const c = choices[f.id];
    if (c && 'colour' in c && f.options.includes(c.colour)) colours.set(f.target.layerId ? `${f.target.fieldId}:${f.target.layerId}` : f.target.fieldId, c.colour);
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
        if (!c || !('text' in c) || c.text.trim() === '') throw new Error('Enter the text for this item.');
        const chosen = Math.min(c.letterHeightMm ?? f.letterHeightMm, f.maxLetterHeightMm ?? Infinity, f.letterHeightMm * 4);
        const grow = f.outline ? 2 * f.outline.offsetMm : 0;
        const fitted = fitText(
          registry,
          { text: c.text, fontId: f.fontId, letterHeightMm: Math.max(0.5, Math.floor(chosen * k * 1000) / 1000), trackingMm: f.trackingMm },
          { maxWidthMm: area.widthMm - grow, maxHeightMm: Math.max(1, area.heightMm - stackGaps - grow), minLetterHeightMm: f.minLetterHeightMm, maxChars: f.maxChars },
        );
        for (const w of fitted.warnings) warnings.push({ ...w, fieldId: f.id });
        letterHeights[f.id] = fitted.letterHeightMm;
        const L = fitted.layout;
        const pad = f.outline ? f.outline.offsetMm : 0;
        return {
          w: L.widthMm + grow,
          h: L.heightMm + grow,
          place(x, y) {
            const matrix: PlacedPiece['matrix'] = [1, 0, 0, 1, x + pad - L.bboxMm.minX, y + pad - L.bboxMm.minY];
            return [{
              layerId: f.id, fieldId: f.id, role: 'text', colour: colours.get(f.id) ?? f.colour, d: L.path, matrix, bboxMm: boxAt(L.bboxMm, matrix),
              ...(f.outline ? { outline: { offsetMm: f.outline.offsetMm, colour: colours.get(`${f.id}:outline`) ?? f.outline.colour } } : {}),
            }];
          },
        };
      }
      const c = choices[f.id];
      const opt = c && 'motifId' in c ? f.options.find((o) => o.id === c.motifId) : f.options.length === 1 ? f.options[0] : undefined;
      if (!opt) throw new Error('Choose one of the motifs offered.');
      let ink: BBox | null = null;
      for (const l of opt.geometry.layers) ink = unionBBox(ink, l.bboxMm);
      const bb = ink!;
      const iw = bb.maxX - bb.minX, ih = bb.maxY - bb.minY;
      const m = Math.min(f.heightMm / ih, area.widthMm / iw, (area.heightMm - stackGaps) / ih) * k;
      return {
        w: iw * m,
        h: ih * m,
        place(x, y) {
          const matrix: PlacedPiece['matrix'] = [m, 0, 0, m, x - bb.minX * m, y - bb.minY * m];
          return opt.geometry.layers.map((l) => ({
            layerId: `${f.id}:${l.id}`, fieldId: f.id, role: 'motif' as const,
            colour: colours.get(`${f.id}:${l.id}`) ?? opt.layers?.[l.id]?.colour ?? l.colour ?? '#000000',
            d: l.path, matrix, bboxMm: boxAt(l.bboxMm, matrix),
          }));
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
  // press order, bottom → top, as compose() lists them: motif layers, then names
  const rank = { motif: 1, text: 2 } as const;
  const pieces = placed.map((p, i) => ({ p, i })).sort((a, b) => rank[a.p.role] - rank[b.p.role] || a.i - b.i).map((x) => x.p);
  let bbox: BBox | null = null;
  for (const p of pieces) {
    const o = p.outline?.offsetMm ?? 0;
    bbox = unionBBox(bbox, { minX: p.bboxMm.minX - o, minY: p.bboxMm.minY - o, maxX: p.bboxMm.maxX + o, maxY: p.bboxMm.maxY + o });
  }
  return { pieces, bboxMm: bbox ?? { minX: 0, minY: 0, maxX: 0, maxY: 0 }, warnings: [...warnings], letterHeights };
}
