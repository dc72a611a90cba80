/**
 * Fonts for the work sheet PDF. pdfkit renders woff2 fonts invisible (seen with pdfkit 0.20.2), and the UI font
 * package ships only woff2 split by Unicode range, so the PDF embeds Nunito as complete TTFs from
 * @expo-google-fonts/nunito (OFL 1.1): Latin-extended included, so Zoë and Łukasz print.
 * Characters the font has no glyph for (美咲) are reported so the page can name them by code point
 * instead of printing empty boxes.
 */
import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import * as fontkit from 'fontkit';

const require = createRequire(import.meta.url);

export const PDF_FONT_FILES = {
  regular: '@expo-google-fonts/nunito/400Regular/Nunito_400Regular.ttf',
  bold: '@expo-google-fonts/nunito/700Bold/Nunito_700Bold.ttf',
} as const;
export type PdfFontName = keyof typeof PDF_FONT_FILES;

/** pdfkit's registered names for our two weights. */
export const PDF_FONT = { regular: 'Nunito', bold: 'Nunito-Bold' } as const;

let cache: Record<PdfFontName, Buffer> | null = null;
let glyphCheck: fontkit.Font | null = null;

/** The TTF bytes of both weights (read once). */
export function pdfFontBytes(): Record<PdfFontName, Buffer> {
  if (!cache) {
    cache = {
      regular: readFileSync(require.resolve(PDF_FONT_FILES.regular)),
      bold: readFileSync(require.resolve(PDF_FONT_FILES.bold)),
    };
  }
  return cache;
}

/** Registers both weights on a pdfkit document. */
export function registerPdfFonts(doc: PDFKit.PDFDocument): void {
  const bytes = pdfFontBytes();
  doc.registerFont(PDF_FONT.regular, bytes.regular);
  doc.registerFont(PDF_FONT.bold, bytes.bold);
}

/** The distinct characters of `text` that the PDF font cannot draw (whitespace and controls aside). */
export function missingCharacters(text: string): string[] {
  if (!glyphCheck) {
    const f = fontkit.create(pdfFontBytes().regular);
    glyphCheck = ('fonts' in f ? (f as fontkit.FontCollection).fonts[0] : f) as fontkit.Font;
  }
  const missing = new Set<string>();
  for (const ch of text) {
    const cp = ch.codePointAt(0)!;
    if (cp < 0x20 || /\s/u.test(ch) || (cp >= 0x300 && cp <= 0x36f && glyphCheck.hasGlyphForCodePoint(cp))) continue;
    if (!glyphCheck.hasGlyphForCodePoint(cp)) missing.add(ch);
  }
  return [...missing];
}

/** "U+7F8E U+54B2": code points the way the proof screen names them. */
export const codePoints = (chars: readonly string[]): string => chars.map((c) => `U+${c.codePointAt(0)!.toString(16).toUpperCase().padStart(4, '0')}`).join(' ');

/** The whole PDF once pdfkit has written it (call before `doc.end()`). */
export function pdfBytes(doc: PDFKit.PDFDocument): Promise<Buffer> {
  const chunks: Buffer[] = [];
  doc.on('data', (c: Buffer) => chunks.push(c));
  return new Promise<Buffer>((resolve, reject) => {
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
  });
}
