/**
 * Fitting a name to a blank: scale down to the space available (never up past the shopper's
 * chosen size) and say what the seller and shopper should know, as warnings with stable codes.
 */
import type { FontRegistry } from './fonts.ts';
import { layoutText, type TextLayout } from './text-layout.ts';

export type TextWarningCode = 'below_min_letter_height' | 'too_long' | 'missing_characters' | 'extra_spaces' | 'mixed_case';

export interface TextWarning {
  code: TextWarningCode;
  message: string;
  /** For missing_characters: the characters the font cannot draw. */
  characters?: string[];
  /** For below_min_letter_height: the fitted and the minimum height, mm. */
  letterHeightMm?: number;
  minLetterHeightMm?: number;
}

export interface FitLimits {
  /** The space the text may take, mm. */
  maxWidthMm: number;
  maxHeightMm: number;
  /** Smallest acceptable cap height; defaults to the font's recommendation. */
  minLetterHeightMm?: number;
  /** Most characters the field accepts (spaces not counted). */
  maxChars?: number;
}

export interface FitTextInput {
  text: string;
  fontId: string;
  /** The shopper's (or listing's) chosen cap height: the fit never goes above it. */
  letterHeightMm: number;
  trackingMm?: number;
}

export interface FittedText {
  layout: TextLayout;
  /** Fitted letter height / chosen letter height (≤ 1). */
  scale: number;
  letterHeightMm: number;
  warnings: TextWarning[];
}

const LETTER = /\p{L}/u;

/** Warnings that depend on the text alone: extra spaces and mixed case ("mIRA"). */
export function textWarnings(raw: string): TextWarning[] {
  const text = raw.normalize('NFC');
  const out: TextWarning[] = [];
  if (/^\s|\s$|\s\s|[\t\n\r\v\f\u00a0]/u.test(text)) {
    out.push({ code: 'extra_spaces', message: 'The text has spaces at the start or end, doubled spaces, or tabs.' });
  }
  for (const word of text.split(/[\s\-'’.]+/u)) {
    const letters = [...word].filter((ch) => LETTER.test(ch));
    if (letters.length < 2) continue;
    const isUpper = (ch: string) => ch !== ch.toLowerCase() && ch === ch.toUpperCase();
    const isLower = (ch: string) => ch !== ch.toUpperCase() && ch === ch.toLowerCase();
    const [first = '', ...rest] = letters;
    const ok = letters.every(isUpper) || letters.every((ch) => !isUpper(ch)) || (isUpper(first) && rest.every((ch) => !isUpper(ch)));
    if (!ok && letters.some(isLower)) {
      out.push({ code: 'mixed_case', message: `"${word}" mixes capitals and small letters unusually; check it is meant that way.` });
      break;
    }
  }
  return out;
}

/** Characters named for people: “☃” (U+2603), each with its code point, so invisible ones are named too. */
export const nameCharacters = (chars: readonly string[]): string => chars.map((c) => `“${c}” (U+${c.codePointAt(0)!.toString(16).toUpperCase().padStart(4, '0')})`).join(', ');

const countChars = (text: string) => [...text].filter((ch) => !/\s/u.test(ch)).length;

/**
 * Everything the seller and shopper should know about text laid out at `letterHeightMm`: the
 * text's own warnings (textWarnings), letters below the minimum height, too many characters (or,
 * when the fit had to shrink it, too long to fit at a readable size), and characters the font
 * cannot draw. The one wording of these warnings: the fit, the layout API and the preview use it.
 */
export function layoutWarnings(layout: TextLayout, at: { letterHeightMm: number; minLetterHeightMm: number; maxChars?: number; shrunk?: boolean }): TextWarning[] {
  const warnings = textWarnings(layout.text);
  const h = at.letterHeightMm;
  const min = at.minLetterHeightMm;
  if (h < min) {
    warnings.push({
      code: 'below_min_letter_height',
      message: `At ${h.toFixed(1)} mm the letters are below the ${min} mm this font needs to weed and read well. Choose a shorter text, a narrower font or a larger blank.`,
      letterHeightMm: h,
      minLetterHeightMm: min,
    });
  }
  const n = countChars(layout.text);
  const tooMany = at.maxChars !== undefined && n > at.maxChars;
  if (tooMany || (at.shrunk && h < min)) {
    warnings.push({
      code: 'too_long',
      message: tooMany ? `The text has ${n} characters; this item takes at most ${at.maxChars}.` : 'The text is too long to fit at a readable size. Try a shorter text or a narrower font.',
    });
  }
  if (layout.missing.length > 0) {
    warnings.push({
      code: 'missing_characters',
      message: `This font cannot draw ${nameCharacters(layout.missing)}. Choose another font or change the text.`,
      characters: [...layout.missing],
    });
  }
  return warnings;
}

/**
 * Lays out `text` at the chosen size, then — if it is wider or taller than allowed — lays it out
 * again at the largest letter height that fits. The fitted ink width never exceeds maxWidthMm.
 */
export function fitText(registry: FontRegistry, input: FitTextInput, limits: FitLimits): FittedText {
  const font = registry.require(input.fontId);
  const text = input.text.normalize('NFC');
  const chosen = input.letterHeightMm;
  let layout = layoutText(registry, { text, fontId: input.fontId, letterHeightMm: chosen, trackingMm: input.trackingMm });
  let h = chosen;
  if (layout.widthMm > limits.maxWidthMm || layout.heightMm > limits.maxHeightMm) {
    // Ink size is linear in letter height (tracking aside), so one ratio gets close; then step down
    // by 1 µm of letter height until the rounded outlines fit.
    const r = Math.min(limits.maxWidthMm / Math.max(layout.widthMm, 1e-9), limits.maxHeightMm / Math.max(layout.heightMm, 1e-9));
    h = Math.floor(chosen * r * 1000) / 1000;
    for (let i = 0; i < 50 && h > 0.001; i++) {
      layout = layoutText(registry, { text, fontId: input.fontId, letterHeightMm: h, trackingMm: input.trackingMm });
      if (layout.widthMm <= limits.maxWidthMm && layout.heightMm <= limits.maxHeightMm) break;
      h = Math.floor(h * 0.999 * 1000) / 1000;
    }
  }
  const warnings = layoutWarnings(layout, {
    letterHeightMm: h,
    // a listing may ask for larger letters than the font needs, never for smaller ones
    minLetterHeightMm: Math.max(limits.minLetterHeightMm ?? 0, font.minLetterHeightMm),
    maxChars: limits.maxChars,
    shrunk: h < chosen,
  });
  return { layout, scale: h / chosen, letterHeightMm: h, warnings };
}

/**
 * The fit warning for a blank size: the name comes out below the smallest letter height at the
 * chosen size. Names the size and what would help: the smallest larger size offered where it fits
 * (with the letter height it gets there), or, when none does, a shorter text, a narrower font or a
 * smaller letter height on a shorter line.
 */
export function sizeFitWarning(at: {
  text: string;
  sizeLabel: string;
  letterHeightMm: number;
  minLetterHeightMm: number;
  /** the first larger size offered where the text is at least the minimum, or null */
  larger: { label: string; letterHeightMm: number } | null;
}): Omit<TextWarning, 'code'> & { code: 'size_too_small' } {
  const h = at.letterHeightMm.toFixed(1);
  const help = at.larger
    ? `Choose size ${at.larger.label} or larger, where it fits at ${at.larger.letterHeightMm.toFixed(1)} mm, or a smaller letter height with a shorter name.`
    : 'No size offered fits it: choose a shorter name, a narrower font or a smaller letter height on a shorter line.';
  return {
    code: 'size_too_small',
    message: `At size ${at.sizeLabel}, “${at.text.trim()}” comes out at ${h} mm letters, below the ${at.minLetterHeightMm} mm this item needs. ${help}`,
    letterHeightMm: at.letterHeightMm,
    minLetterHeightMm: at.minLetterHeightMm,
  };
}
