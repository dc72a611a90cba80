import type { PressCard } from '../../../../shared/engine/press-card.ts';

const kindWords: Record<string, string> = { pre_press: 'Pre-press', place: 'Place', tack: 'Tack', final_press: 'Final press', back_press: 'Back press' };

const layerWords = (card: PressCard, id: string) => {
  const l = card.layers.find((x) => x.layerId === id);
  return l ? `${l.colourName} (${l.materialKind})` : id;
};

/** One item's pressing steps, bottom layer first, with the shop's press type. */
export function PressCardView({ card }: { card: PressCard }) {
  return (
    <div className="flex flex-col gap-3">
      <p className="text-lg font-extrabold text-thread-deep">
        {card.pressType === 'handheld' ? 'Handheld press' : 'Clamshell press'} · final {card.tempLabel}, {card.finalTimeS} s, peel {card.peel}
      </p>
      <p className="text-sm">
        <span className="font-bold">Press steps, bottom to top:</span> {card.groups.map((g, i) => `${i + 1}. ${g.map((id) => layerWords(card, id)).join(' + ')}`).join('  ·  ')}
        {card.groups.length < card.layers.length ? <span className="text-ink-soft"> — layers that don't overlap go down together</span> : null}
      </p>
      {card.warnings.length ? (
        <ul className="flex flex-col gap-1" aria-label="Press warnings">
          {card.warnings.map((w) => (
            <li key={w.code} className="rounded-lg border-2 border-marigold bg-marigold-wash px-3 py-2 text-sm font-semibold">
              ⚠ {w.message}
            </li>
          ))}
        </ul>
      ) : null}
      <ol className="flex flex-col gap-1.5">
        {card.steps.map((s, i) => (
          // biome-ignore lint/suspicious/noArrayIndexKey: the steps are one fixed procedure and the place is the step number shown; a step may repeat
          <li key={i} className="grid grid-cols-[7rem_1fr] gap-2 text-sm">
            <span className="font-bold">
              {i + 1}. {kindWords[s.kind] ?? s.kind}
            </span>
            <span>
              {s.text}
              {s.protectiveSheet ? <span className="ml-1 rounded bg-thread-wash px-1.5 text-xs font-bold text-thread-deep">protective sheet</span> : null}
            </span>
          </li>
        ))}
      </ol>
      <p className="text-sm">
        <span className="font-bold">Placement:</span> {card.placementNote}
      </p>
      {card.notes.map((n) => (
        <p key={n} className="text-xs text-ink-soft">
          {n}
        </p>
      ))}
      <p className="text-xs text-ink-soft">Heat burns: keep hands clear, use a protective sheet, let the press cool, keep it away from children. Ventilate when pressing vinyl.</p>
    </div>
  );
}
