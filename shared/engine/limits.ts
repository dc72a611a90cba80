/**
 * Every bound on input that drives geometry, in one place. Each limit caps work that grows with
 * what a user sends (a seller's motif file, a shopper's text, a batch of lines, a PDF), so no single
 * request can hold a CPU or the heap for long. The routes check these before any work starts, and
 * the engine checks them again itself (defence in depth): calling the engine directly with hostile
 * input is refused the same way.
 *
 * Each message names the limit, so whoever meets it knows what to change.
 */

// ---------------------------------------------------------------- coordinates (all geometry)

/**
 * Largest absolute coordinate, in mm, any engine geometry may have (after every transform). 20 m:
 * twice the widest thing the engine ever lays out (60 characters at the 300 mm letter height is
 * under 13 m) and four times the largest motif canvas. A control point at 1e11, `1e999` or a
 * `scale(1e12)` lands far beyond it. Work on a curve grows with its size, so this bounds that too.
 */
export const MAX_COORDINATE_MM = 20_000;

/**
 * Most straight chords one curve is flattened into. Wang's formula asks for about 1,700 on a curve
 * spanning 20 m at the finest tolerance we use (0.01 mm); past this cap a curve is flattened a
 * little more coarsely rather than into an unbounded number of points.
 */
export const MAX_SEGMENTS_PER_CURVE = 1024;

/** Most points one flattening of a path may produce in total (2 numbers each): about 16 MB. */
export const MAX_FLATTENED_POINTS = 1_000_000;

// ---------------------------------------------------------------- motif files (seller uploads)

/** Largest motif SVG file, bytes (512 kB: our demo motifs are 1–4 kB, busy artwork 100–200 kB). */
export const MOTIF_MAX_BYTES = 512 * 1024;
/** Most elements (tags) in a motif file. */
export const MOTIF_MAX_ELEMENTS = 5000;
/** Deepest nesting of elements (groups within groups) in a motif file. */
export const MOTIF_MAX_DEPTH = 48;
/** Most layers (colours) in a motif: each becomes a piece to cut and press. */
export const MOTIF_MAX_LAYERS = 12;
/**
 * Most path commands (segments: each line or curve, after implicit repeats are expanded) in the
 * whole motif file, counting the segments that rectangles, circles and polygons become.
 */
export const MOTIF_MAX_PATH_COMMANDS = 20_000;
/** Largest width or height of the motif's canvas, mm. */
export const MOTIF_MAX_SIDE_MM = 5000;

/** Largest stored motif layer's path data, characters (what compose() accepts from the database). */
export const MOTIF_MAX_PATH_CHARS = 2_000_000;

// ---------------------------------------------------------------- text

/** Most characters (code points, after NFC) in one text the engine lays out. */
export const MAX_TEXT_CHARS = 60;
/**
 * Smallest and largest letter (cap) height a shopper or seller may ask for, mm. The engine itself
 * lays out anything above zero up to the largest (fitting may shrink a name below the smallest).
 */
export const MIN_LETTER_HEIGHT_MM = 5;
export const MAX_LETTER_HEIGHT_MM = 300;

// ---------------------------------------------------------------- cut sheets, work sheet PDFs

/** Most order lines one cut-sheet build takes. */
export const MAX_CUT_SHEET_LINES = 500;
/** Most pieces nested in one call (lines × quantity × layers). */
export const MAX_NEST_PIECES = 20_000;
/** Most pages one work sheet PDF may have. */
export const MAX_WORKSHEET_PAGES = 400;

/** A bound was crossed. `limit` names it (as above); the message says what it is. */
export class LimitError extends Error {
  constructor(
    public readonly limit: string,
    message: string,
  ) {
    super(message);
    this.name = 'LimitError';
  }
}

/** Throws LimitError unless `v` is a finite number within ±MAX_COORDINATE_MM. */
export function checkCoordinate(v: number, what = 'A coordinate'): void {
  if (!Number.isFinite(v)) throw new LimitError('MAX_COORDINATE_MM', `${what} is not a finite number; the limit is ${MAX_COORDINATE_MM.toLocaleString('en')} mm from the origin.`);
  if (v > MAX_COORDINATE_MM || v < -MAX_COORDINATE_MM) {
    throw new LimitError('MAX_COORDINATE_MM', `${what} lies ${fmtMm(Math.abs(v))} from the origin; the limit is ${MAX_COORDINATE_MM.toLocaleString('en')} mm.`);
  }
}

const fmtMm = (v: number) => (v < 1e6 ? `${Math.round(v).toLocaleString('en')} mm` : `${v.toExponential(1)} mm`);
