/**
 * Units. Millimetres inside the program; °C stored. Conversions follow NIST SP 811, Appendix B.8
 * (inch = 25.4 mm exactly) and B.9 (t/°C = (t/°F − 32)/1.8). CSS/SVG absolute lengths follow
 * W3C CSS Values and Units, "Absolute lengths": 1in = 2.54cm = 96px, 1pt = 1/72 in, 1pc = 12pt.
 */

export const MM_PER_IN = 25.4;
export const MM_PER_CM = 10;
/** W3C CSS Values: 96 CSS px per inch (not the 90 px/in of SVG 1.1's old example). */
export const CSS_PX_PER_IN = 96;
export const MM_PER_CSS_PX = MM_PER_IN / CSS_PX_PER_IN;

export const inToMm = (inches: number): number => inches * MM_PER_IN;
export const mmToIn = (mm: number): number => mm / MM_PER_IN;
export const cmToMm = (cm: number): number => cm * MM_PER_CM;
export const mmToCm = (mm: number): number => mm / MM_PER_CM;
export const pxToMm = (px: number): number => (px * MM_PER_IN) / CSS_PX_PER_IN;
export const mmToPx = (mm: number): number => (mm * CSS_PX_PER_IN) / MM_PER_IN;

/** °F → °C (NIST SP 811 B.9): t/°C = (t/°F − 32)/1.8. */
export const fToC = (f: number): number => (f - 32) / 1.8;
/** °C → °F: t/°F = 1.8 · t/°C + 32. */
export const cToF = (c: number): number => c * 1.8 + 32;
/** A temperature *difference* converts by 5/9 only (no offset). */
export const deltaFToDeltaC = (df: number): number => df / 1.8;
export const deltaCToDeltaF = (dc: number): number => dc * 1.8;

/** CSS absolute length units → mm (W3C CSS Values and Units). */
export const CSS_UNIT_MM: Readonly<Record<string, number>> = {
  px: MM_PER_CSS_PX,
  in: MM_PER_IN,
  cm: MM_PER_CM,
  mm: 1,
  q: 0.25,
  pt: MM_PER_IN / 72,
  pc: MM_PER_IN / 6,
};

/**
 * Parses a CSS absolute length ("12in", "300", "10.5mm") into mm. A bare number is px.
 * Returns null for relative units (%, em) or junk.
 */
export function cssLengthToMm(value: string | undefined | null): number | null {
  if (value == null) return null;
  const m = /^\s*([+-]?(?:\d+\.?\d*|\.\d+)(?:e[+-]?\d+)?)\s*([a-z]*)\s*$/i.exec(value);
  if (!m) return null;
  const n = Number(m[1]);
  const unit = (m[2] || 'px').toLowerCase();
  const factor = CSS_UNIT_MM[unit];
  if (factor === undefined || !Number.isFinite(n)) return null;
  return n * factor;
}

/** Rounds half away from zero to `digits` decimals, without -0. */
export function roundTo(value: number, digits: number): number {
  const f = 10 ** digits;
  const r = (Math.sign(value) * Math.round(Math.abs(value) * f)) / f;
  return r === 0 ? 0 : r;
}

/** "10.2 cm (4.0 in)": a length shown in both cm and inches, one decimal each. */
export function formatLength(mm: number): string {
  return `${roundTo(mmToCm(mm), 1).toFixed(1)} cm (${roundTo(mmToIn(mm), 1).toFixed(1)} in)`;
}

/** "12 mm (0.47 in)": small lengths (letter heights, gaps) in mm and inches. */
export function formatSmallLength(mm: number): string {
  return `${roundTo(mm, 1)} mm (${roundTo(mmToIn(mm), 2).toFixed(2)} in)`;
}

/** "25.0 × 25.0 cm (9.8 × 9.8 in)". */
export function formatSize(widthMm: number, heightMm: number): string {
  const cm = (v: number) => roundTo(mmToCm(v), 1).toFixed(1);
  const inch = (v: number) => roundTo(mmToIn(v), 1).toFixed(1);
  return `${cm(widthMm)} × ${cm(heightMm)} cm (${inch(widthMm)} × ${inch(heightMm)} in)`;
}

/** "157 °C (315 °F)": stored °C shown with °F, whole degrees. */
export function formatTemperature(c: number): string {
  return `${roundTo(c, 0)} °C (${roundTo(cToF(c), 0)} °F)`;
}
