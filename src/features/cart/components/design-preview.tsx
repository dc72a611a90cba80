import type { LineSnapshot } from '../../../../shared/schemas/cart.ts';

/**
 * A small, to-proportion picture of the frozen design: the engine's pieces as inline SVG paths in
 * their own colours (path data is numbers and commands made by our engine, never user markup).
 */
export function DesignPreview({ snapshot, size = 96 }: { snapshot: LineSnapshot; size?: number }) {
  const g = snapshot.geometry;
  const pad = Math.max(g.widthMm, g.heightMm) * 0.08 + 2;
  const vb = `${g.bboxMm.minX - pad} ${g.bboxMm.minY - pad} ${g.widthMm + 2 * pad} ${g.heightMm + 2 * pad}`;
  const words = snapshot.summary.filter((s) => !/colour/i.test(s.label)).map((s) => s.value).join(', ');
  return (
    <svg
      role="img"
      aria-label={`Preview of the design${words ? `: ${words}` : ''}`}
      viewBox={vb}
      width={size}
      height={size}
      preserveAspectRatio="xMidYMid meet"
      className="shrink-0 rounded-lg border border-line bg-paper-deep"
    >
      {g.pieces.map((p, i) => (
        <path key={i} d={p.d} fill={/^#[0-9a-fA-F]{6}$/.test(p.colourHex) ? p.colourHex : '#1f2a44'} fillRule="nonzero" />
      ))}
    </svg>
  );
}

export function PersonalisationSummary({ snapshot }: { snapshot: LineSnapshot }) {
  return (
    <dl className="grid grid-cols-[auto_1fr] gap-x-3 gap-y-0.5 text-sm">
      {snapshot.summary.map((s, i) => (
        <div key={i} className="contents">
          <dt className="text-ink-soft">{s.label}</dt>
          <dd className="font-semibold break-all text-ink">{s.value}</dd>
        </div>
      ))}
    </dl>
  );
}
