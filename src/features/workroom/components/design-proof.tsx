import type { Proof } from '../../../../shared/schemas/workroom.ts';
import { DesignOnBlank, DesignPieces } from '../../../components/design/design-on-blank.tsx';
import { formatLength } from './format.ts';

/**
 * The design on the blank, to scale, from the line's own snapshot, through the shared blank
 * drawing: the print area dashed, the engine's pieces in their colours and cm / in rulers so the
 * size reads at a glance.
 */
export function DesignProof({ proof }: { proof: Proof }) {
  const b = proof.blank;
  const g = proof.snapshot.geometry;
  const pa = b.printArea;
  const words = proof.texts.map((t) => t.text).join(', ');
  return (
    <figure className="flex flex-col gap-2">
      <div className="w-full max-w-xl rounded-lg border border-line bg-paper-deep p-2">
        <DesignOnBlank blank={b} rulers label={`Proof of ${words || 'the design'} on the ${b.name}, to scale`}>
          <DesignPieces pieces={g.pieces} />
        </DesignOnBlank>
      </div>
      <figcaption className="text-sm text-ink-soft">
        {b.name}: print area {formatLength(pa.widthMm)} × {formatLength(pa.heightMm)} (dashed). Design {formatLength(g.widthMm)} wide × {formatLength(g.heightMm)} tall.
      </figcaption>
    </figure>
  );
}
