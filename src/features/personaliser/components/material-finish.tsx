/**
 * How a vinyl's finish looks in the live preview, so glitter and patterned pieces do not read as
 * flat colour: a sparkle of light and dark specks for glitter, a soft sheen for metallic, fine
 * diagonal bands for patterned. Smooth and flock stay plain. Each overlay is drawn in blank
 * millimetres over the piece's box and clipped to the piece's own path, so the specks keep their
 * size whatever the letter height.
 */
import { useId, useMemo } from 'react';
import type { PlacedPiece } from '../../../../shared/engine/place.ts';

export type FinishIds = { glitter: string; metallic: string; patterned: string; clip: (layerId: string) => string };

export function useFinishIds(): FinishIds {
  const raw = useId();
  return useMemo(() => {
    const base = raw.replace(/[^a-zA-Z0-9_-]/g, '');
    return { glitter: `${base}-glitter`, metallic: `${base}-metallic`, patterned: `${base}-patterned`, clip: (layerId) => `${base}-clip-${layerId.replace(/[^a-zA-Z0-9_-]/g, '_')}` };
  }, [raw]);
}

/** The patterns, once per preview. */
export function MaterialFinishes({ ids }: { ids: FinishIds }) {
  return (
    <defs>
      <pattern id={ids.glitter} width="2.4" height="2.4" patternUnits="userSpaceOnUse">
        <circle cx="0.5" cy="0.6" r="0.32" fill="#fff" fillOpacity="0.85" />
        <circle cx="1.7" cy="1.5" r="0.22" fill="#fff" fillOpacity="0.6" />
        <circle cx="1.2" cy="0.3" r="0.2" fill="#1f2a44" fillOpacity="0.3" />
        <circle cx="0.4" cy="1.9" r="0.24" fill="#1f2a44" fillOpacity="0.25" />
        <circle cx="2.1" cy="0.6" r="0.14" fill="#fff" fillOpacity="0.9" />
      </pattern>
      <linearGradient id={ids.metallic} x1="0" y1="0" x2="1" y2="1">
        <stop offset="0" stopColor="#fff" stopOpacity="0" />
        <stop offset="0.45" stopColor="#fff" stopOpacity="0.55" />
        <stop offset="0.55" stopColor="#fff" stopOpacity="0.1" />
        <stop offset="1" stopColor="#1f2a44" stopOpacity="0.15" />
      </linearGradient>
      <pattern id={ids.patterned} width="4" height="4" patternUnits="userSpaceOnUse" patternTransform="rotate(45)">
        <rect width="1.4" height="4" fill="#fff" fillOpacity="0.4" />
      </pattern>
    </defs>
  );
}

/** The finish over one piece (nothing for smooth and flock). */
export function FinishOverlay({ piece, ids }: { piece: PlacedPiece; ids: FinishIds }) {
  const kind = piece.materialKind;
  if (kind !== 'glitter' && kind !== 'metallic' && kind !== 'patterned') return null;
  const b = piece.bboxMm;
  const clip = ids.clip(piece.layerId);
  return (
    <g data-finish={kind}>
      <clipPath id={clip}>
        <path d={piece.d} transform={`matrix(${piece.matrix.join(' ')})`} />
      </clipPath>
      <rect x={b.minX} y={b.minY} width={b.maxX - b.minX} height={b.maxY - b.minY} fill={`url(#${ids[kind]})`} clipPath={`url(#${clip})`} />
    </g>
  );
}
