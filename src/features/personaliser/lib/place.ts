/**
 * The live preview's placement is the engine's own (shared/engine/place.ts, the function compose()
 * places with): the preview draws each piece's path through its matrix, so a keystroke costs one
 * text layout and no path rewriting. The full compose() — weeding, the true outline, cut-ready
 * mirrored paths — runs off the main thread (compose-client.ts).
 */
export { type PlacedPiece, type Placement, placeDesign } from '../../../../shared/engine/place.ts';
