import type { Proof } from '../../../../shared/schemas/workroom.ts';
import { formatLength } from './format.ts';

const safeHex = (h: string) => (/^#[0-9a-fA-F]{6}$/.test(h) ? h : '#1f2a44');

/**
 * The design on the blank, to scale, from the line's own snapshot: the blank as a simple shape,
 * its print area dashed, the engine's pieces in their colours (path data made by our engine, never
 * user markup), and a 10 cm / 4 in ruler so the size reads at a glance.
 */
export function DesignProof({ proof }: { proof: Proof }) {
  const b = proof.blank;
  const g = proof.snapshot.geometry;
  const pa = b.printArea;
  const pad = 24;
  const isTee = /tee/.test(b.kind);
  const outline = isTee
    ? `M ${b.widthMm * 0.3} 0 Q ${b.widthMm / 2} ${b.heightMm * 0.08} ${b.widthMm * 0.7} 0 L ${b.widthMm} ${b.heightMm * 0.12} L ${b.widthMm * 0.88} ${b.heightMm * 0.28} L ${b.widthMm * 0.8} ${b.heightMm * 0.24} L ${b.widthMm * 0.8} ${b.heightMm} L ${b.widthMm * 0.2} ${b.heightMm} L ${b.widthMm * 0.2} ${b.heightMm * 0.24} L ${b.widthMm * 0.12} ${b.heightMm * 0.28} L 0 ${b.heightMm * 0.12} Z`
    : `M 0 0 H ${b.widthMm} V ${b.heightMm} H 0 Z`;
  const words = proof.texts.map((t) => t.text).join(', ');
  return (
    <figure className="flex flex-col gap-2">
      <svg
        role="img"
        aria-label={`Proof of ${words || 'the design'} on the ${b.name}, to scale`}
        viewBox={`${-pad} ${-pad * 2} ${b.widthMm + 2 * pad} ${b.heightMm + 3 * pad + 30}`}
        className="h-auto w-full max-w-xl rounded-lg border border-line bg-paper-deep"
      >
        <path d={outline} fill="#fffdf8" stroke="#857d6e" strokeWidth={1.5} />
        {b.kind === 'tote' ? <path d={`M ${b.widthMm * 0.3} 0 C ${b.widthMm * 0.3} ${-pad * 1.6}, ${b.widthMm * 0.7} ${-pad * 1.6}, ${b.widthMm * 0.7} 0`} fill="none" stroke="#857d6e" strokeWidth={4} /> : null}
        <rect x={pa.xMm} y={pa.yMm} width={pa.widthMm} height={pa.heightMm} fill="none" stroke="#2f7d6d" strokeWidth={1} strokeDasharray="6 4" />
        {g.pieces.map((p, i) => (
          <path key={i} d={p.d} fill={safeHex(p.colourHex)} stroke={p.colourHex.toLowerCase() > '#e0e0e0' ? '#857d6e' : 'none'} strokeWidth={0.3} />
        ))}
        <g transform={`translate(0 ${b.heightMm + 14})`} fill="#1f2a44" fontSize={9} fontFamily="Nunito, sans-serif">
          <rect x={0} y={0} width={100} height={3} />
          <text x={0} y={14}>10 cm</text>
          <rect x={0} y={18} width={101.6} height={1.5} fill="#2f7d6d" />
          <text x={106} y={22}>4 in</text>
        </g>
      </svg>
      <figcaption className="text-sm text-ink-soft">
        {b.name}: print area {formatLength(pa.widthMm)} × {formatLength(pa.heightMm)} (dashed). Design {formatLength(g.widthMm)} wide × {formatLength(g.heightMm)} tall.
      </figcaption>
    </figure>
  );
}
