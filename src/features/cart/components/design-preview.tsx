import type { LineSnapshot } from '../../../../shared/schemas/cart.ts';
import { DesignOnBlank, DesignPieces, pictureOfLineBlank } from '../../../components/design/design-on-blank.tsx';

/**
 * A small, to-proportion picture of the frozen design on its blank, through the shared blank
 * drawing (the snapshot's pieces are already placed on the blank, in its millimetres).
 */
export function DesignPreview({ snapshot, size = 112 }: { snapshot: LineSnapshot; size?: number }) {
  const words = snapshot.summary
    .filter((s) => !/colour/i.test(s.label))
    .map((s) => s.value)
    .join(', ');
  return (
    <DesignOnBlank blank={pictureOfLineBlank(snapshot.blank)} size={size} label={`Preview of the design${words ? `: ${words}` : ''}`} className="rounded-lg border border-line bg-paper-deep">
      <DesignPieces pieces={snapshot.geometry.pieces} />
    </DesignOnBlank>
  );
}

export function PersonalisationSummary({ snapshot }: { snapshot: LineSnapshot }) {
  return (
    <dl className="grid grid-cols-[auto_1fr] gap-x-3 gap-y-0.5 text-sm">
      {snapshot.summary.map((s, i) => (
        // biome-ignore lint/suspicious/noArrayIndexKey: a frozen snapshot's summary, never reordered; labels are the seller's words and may repeat, so the place is the identity
        <div key={i} className="contents">
          <dt className="text-ink-soft">{s.label}</dt>
          <dd className="font-semibold break-all text-ink">{s.value}</dd>
        </div>
      ))}
    </dl>
  );
}
