/**
 * The personalisation engine's public API (pure: plain data in, plain data out, mm inside).
 * Modules can also be imported one by one.
 */

export { type Blank, DEFAULT_BLANKS, defaultBlank, usableArea } from './blanks.ts';
export { type Choice, type ComposedItem, ComposeError, type ComposeInput, type ComposeOptions, compose, type FieldDef, type MaterialKind, type Piece, type WeedingMode } from './compose.ts';
export { type FitLimits, type FittedText, fitText, layoutWarnings, type TextWarning, type TextWarningCode, textWarnings } from './fit.ts';
export { catalogEntry, FONT_CATALOG, FONT_IDS, type FontCatalogEntry, type FontKind, requiredCoverage } from './font-catalog.ts';
export { createFontRegistry, type FontMeta, type FontRegistry, type FontSource, fontRegistry, fontSource, type LoadedFont, loadFont } from './fonts.ts';
export { MOTIF_LIMITS, MotifError, type MotifGeometry, type MotifLayer, parseMotifSvg, renderMotifSvg } from './motif.ts';
export { outlinePath } from './outline.ts';
export { type BBox, formatPath, mirrorPath, mirrorPathData, parsePathData, pathArea, pathBBox } from './path.ts';
export { type PlacedPiece, type Placement, placeDesign } from './place.ts';
export { type LaidOutGlyph, type LayoutTextInput, layoutText, type TextLayout } from './text-layout.ts';
export { analyseWeeding, combineWeeding, NARROW_MM, type WeedingLabel, type WeedingReport } from './weeding.ts';
