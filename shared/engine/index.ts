/**
 * The personalisation engine's public API (pure: plain data in, plain data out, mm inside).
 * Modules can also be imported one by one.
 */
export { FONT_CATALOG, FONT_IDS, catalogEntry, requiredCoverage, type FontCatalogEntry, type FontKind } from './font-catalog.ts';
export { createFontRegistry, fontRegistry, fontSource, loadFont, type FontMeta, type FontRegistry, type FontSource, type LoadedFont } from './fonts.ts';
export { layoutText, type LayoutTextInput, type TextLayout, type LaidOutGlyph } from './text-layout.ts';
export { fitText, layoutWarnings, textWarnings, type FitLimits, type FittedText, type TextWarning, type TextWarningCode } from './fit.ts';
export { parseMotifSvg, renderMotifSvg, MotifError, MOTIF_LIMITS, type MotifGeometry, type MotifLayer } from './motif.ts';
export { placeDesign, type Placement, type PlacedPiece } from './place.ts';
export { compose, ComposeError, type ComposeInput, type ComposeOptions, type WeedingMode, type ComposedItem, type Piece, type FieldDef, type Choice, type MaterialKind } from './compose.ts';
export { outlinePath } from './outline.ts';
export { analyseWeeding, combineWeeding, NARROW_MM, type WeedingReport, type WeedingLabel } from './weeding.ts';
export { DEFAULT_BLANKS, defaultBlank, usableArea, type Blank } from './blanks.ts';
export { parsePathData, formatPath, pathBBox, pathArea, mirrorPath, mirrorPathData, type BBox } from './path.ts';
