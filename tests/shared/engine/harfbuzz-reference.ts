/**
 * HarfBuzz (harfbuzzjs, published by the HarfBuzz project) as the reference shaper: the text shaper
 * used by Chrome, Firefox, Android and LibreOffice (HarfBuzz project documentation). Our width for a
 * string must equal HarfBuzz's: sum of x-advances × size / unitsPerEm (HarfBuzz project documentation).
 * Test/bench only — never imported by the engine.
 */
import * as hb from 'harfbuzzjs';

export interface HbFont {
  shape(text: string): { glyphIds: number[]; xAdvances: number[] };
  upem: number;
}

export function hbFont(bytes: Uint8Array): HbFont {
  const face = new hb.Face(new hb.Blob(bytes), 0);
  const font = new hb.Font(face);
  return {
    upem: face.upem,
    shape(text: string) {
      const buf = new hb.Buffer();
      buf.addText(text);
      buf.guessSegmentProperties();
      hb.shape(font, buf);
      const infos = buf.getGlyphInfos();
      const pos = buf.getGlyphPositions();
      return { glyphIds: infos.map((g) => g.codepoint), xAdvances: pos.map((p) => p.xAdvance) };
    },
  };
}

/** HarfBuzz's advance width in mm for a cap height: Σ x-advance × (letterHeightMm / capHeightUnits). */
export function hbAdvanceMm(font: HbFont, text: string, letterHeightMm: number, capHeightUnits: number): number {
  const { xAdvances } = font.shape(text);
  return (xAdvances.reduce((s, a) => s + a, 0) * letterHeightMm) / capHeightUnits;
}
