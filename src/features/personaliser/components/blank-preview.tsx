import { memo } from 'react';
import type { Blank } from '../../../../shared/engine/blanks.ts';
import { MM_PER_IN } from '../../../../shared/units.ts';
import type { ComposeResult } from '../lib/compose-client.ts';
import type { PlacedPiece, Placement } from '../lib/place.ts';

const RULER_GAP = 14;
const RULER_H = 26;

/** The blank laid flat, drawn to scale in mm (one SVG user unit = 1 mm). */
function BlankShape({ blank }: { blank: Blank }) {
  const W = blank.widthMm, H = blank.heightMm;
  const stroke = { stroke: '#1f2a44', strokeWidth: 2.5, strokeLinejoin: 'round' as const };
  switch (blank.kind) {
    case 'kids_tee':
    case 'adult_tee':
      return (
        <path
          d={`M${W * 0.36} 0 Q${W / 2} ${W * 0.1} ${W * 0.64} 0 L${W * 0.82} ${H * 0.02} L${W} ${H * 0.2} L${W * 0.87} ${H * 0.3} L${W * 0.86} ${H} L${W * 0.14} ${H} L${W * 0.13} ${H * 0.3} L0 ${H * 0.2} L${W * 0.18} ${H * 0.02} Z`}
          fill="#ffffff" {...stroke}
        />
      );
    case 'pouch':
      return (
        <g>
          <rect x="0" y="0" width={W} height={H} rx="12" fill="#efe6d4" {...stroke} />
          <line x1="8" y1="12" x2={W - 8} y2="12" stroke="#4a5470" strokeWidth="3" strokeDasharray="3 2" />
          <rect x={W - 34} y="6" width="20" height="12" rx="3" fill="#4a5470" />
        </g>
      );
    case 'drawstring_bag':
      return (
        <g>
          <path d={`M${W * 0.06} 20 Q${W * 0.25} ${-H * 0.12} ${W * 0.5} ${-H * 0.04} Q${W * 0.75} ${-H * 0.12} ${W * 0.94} 20`} fill="none" stroke="#4a5470" strokeWidth="3" />
          <rect x="0" y="0" width={W} height={H} rx="6" fill="#efe6d4" {...stroke} />
          <line x1="0" y1="26" x2={W} y2="26" stroke="#4a5470" strokeWidth="1.5" />
        </g>
      );
    default:
      return (
        <g>
          <path d={`M${W * 0.3} 2 C${W * 0.3} ${-H * 0.3} ${W * 0.7} ${-H * 0.3} ${W * 0.7} 2`} fill="none" stroke="#1f2a44" strokeWidth="9" strokeLinecap="round" />
          <rect x="0" y="0" width={W} height={H} rx="6" fill="#efe6d4" {...stroke} />
        </g>
      );
  }
}

/** Top of the drawing above the blank's own box (tote handles, drawstrings). */
const headroom = (b: Blank) => (b.kind === 'tote' ? b.heightMm * 0.25 : b.kind === 'drawstring_bag' ? b.heightMm * 0.12 : 4);

function Ruler({ y, lengthMm, unit }: { y: number; lengthMm: number; unit: 'cm' | 'in' }) {
  const step = unit === 'cm' ? 10 : MM_PER_IN / 4;
  const label = unit === 'cm' ? 5 : 4; // label every 5 cm, every inch (4 quarter-inch ticks)
  const n = Math.floor(lengthMm / step + 1e-9);
  const ticks = [];
  for (let i = 0; i <= n; i++) {
    const x = i * step;
    const major = i % label === 0;
    const half = unit === 'cm' ? false : i % 2 === 0;
    ticks.push(<line key={i} x1={x} y1={y} x2={x} y2={y + (major ? 10 : half ? 7 : 4)} />);
    if (major) {
      ticks.push(
        <text key={`t${i}`} x={x + 1.5} y={y + 21} fontSize="10" fill="#1f2a44" stroke="none" fontFamily="Nunito Variable, sans-serif" fontWeight="700">
          {unit === 'cm' ? i : i / 4}
          {i === 0 ? ` ${unit}` : ''}
        </text>,
      );
    }
  }
  return (
    <g stroke="#4a5470" strokeWidth="0.8">
      <line x1="0" y1={y} x2={n * step} y2={y} />
      {ticks}
    </g>
  );
}

const Piece = memo(function Piece({ p, outlineStroke }: { p: PlacedPiece; outlineStroke: boolean }) {
  const t = `matrix(${p.matrix.join(' ')})`;
  return (
    <g>
      {outlineStroke && p.outline ? (
        <path d={p.d} transform={t} fill={p.outline.colour} stroke={p.outline.colour} strokeWidth={p.outline.offsetMm * 2} strokeLinejoin="round" />
      ) : null}
      <path d={p.d} transform={t} fill={p.colour} fillRule="nonzero" stroke="#1f2a44" strokeOpacity="0.25" strokeWidth={0.3 / p.matrix[0]} />
    </g>
  );
});

export function BlankPreview({ blank, placement, full, label }: { blank: Blank; placement: Placement | null; full: ComposeResult | null; label: string }) {
  const W = blank.widthMm, H = blank.heightMm;
  const top = headroom(blank) + 6;
  const pa = { x: (W - blank.printArea.widthMm) / 2, y: blank.topOffsetMm, w: blank.printArea.widthMm, h: blank.printArea.heightMm };
  const rulersY = H + RULER_GAP;
  const viewH = top + H + RULER_GAP + 2 * RULER_H + 4;
  const outlinesDone = full !== null;
  return (
    <svg viewBox={`-8 ${-top} ${W + 24} ${viewH}`} role="img" aria-label={label} className="h-auto w-full" data-testid="design-preview">
      <BlankShape blank={blank} />
      <rect x={pa.x} y={pa.y} width={pa.w} height={pa.h} fill="none" stroke="#2f7d6d" strokeWidth="1.2" strokeDasharray="5 4" />
      <text x={pa.x + 2} y={pa.y - 3} fontSize="9" fill="#23604f" fontFamily="Nunito Variable, sans-serif" fontWeight="700">print area</text>
      {full?.outlines.map((o) => <path key={o.fieldId} d={o.path} fill={o.colour} stroke="#1f2a44" strokeOpacity="0.25" strokeWidth="0.3" />)}
      {placement?.pieces.map((p) => <Piece key={p.layerId} p={p} outlineStroke={!outlinesDone} />)}
      <Ruler y={rulersY} lengthMm={W} unit="cm" />
      <Ruler y={rulersY + RULER_H} lengthMm={W} unit="in" />
    </svg>
  );
}
