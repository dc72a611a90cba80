import { memo } from 'react';
import type { Blank } from '../../../../shared/engine/blanks.ts';
import { DesignOnBlank, pictureOfBlank } from '../../../components/design/design-on-blank.tsx';
import type { ComposeResult } from '../lib/compose-client.ts';
import type { PlacedPiece, Placement } from '../lib/place.ts';
import { FinishOverlay, MaterialFinishes, useFinishIds } from './material-finish.tsx';

const Piece = memo(function Piece({ p, outlineStroke, finishes }: { p: PlacedPiece; outlineStroke: boolean; finishes: ReturnType<typeof useFinishIds> }) {
  const t = `matrix(${p.matrix.join(' ')})`;
  return (
    <g>
      {outlineStroke && p.outline ? <path d={p.d} transform={t} fill={p.outline.colour} stroke={p.outline.colour} strokeWidth={p.outline.offsetMm * 2} strokeLinejoin="round" /> : null}
      <path d={p.d} transform={t} fill={p.colour} fillRule="nonzero" stroke="#1f2a44" strokeOpacity="0.25" strokeWidth={0.3 / p.matrix[0]} />
      <FinishOverlay piece={p} ids={finishes} />
    </g>
  );
});

/**
 * The live preview: the shared blank drawing with rulers, and the pieces as the fast placement puts
 * them (each through its own matrix, so a keystroke repaints only what changed); the true outline
 * from the worker's full compose() replaces the stroked stand-in when it arrives.
 */
export function BlankPreview({ blank, colourHex, placement, full, label }: { blank: Blank; colourHex?: string | null; placement: Placement | null; full: ComposeResult | null; label: string }) {
  const outlinesDone = full !== null;
  const finishes = useFinishIds();
  return (
    <DesignOnBlank blank={pictureOfBlank(blank, colourHex)} label={label} rulers testId="design-preview">
      <MaterialFinishes ids={finishes} />
      {full?.outlines.map((o) => (
        <path key={o.fieldId} d={o.path} fill={o.colour} stroke="#1f2a44" strokeOpacity="0.25" strokeWidth="0.3" />
      ))}
      {placement?.pieces.map((p) => (
        <Piece key={p.layerId} p={p} outlineStroke={!outlinesDone} finishes={finishes} />
      ))}
    </DesignOnBlank>
  );
}
