import type { MaterialRef } from '../../../../shared/schemas/workroom.ts';

export function MaterialChips({ materials }: { materials: MaterialRef[] }) {
  return (
    <ul className="flex flex-wrap gap-1.5">
      {materials.map((m) => (
        <li key={m.id} className="inline-flex items-center gap-1.5 rounded-full border border-line bg-white px-2 py-0.5 text-sm whitespace-nowrap">
          <span aria-hidden="true" className="size-3 rounded-full border border-ink/30" style={{ background: m.colourHex }} />
          {m.colour} <span className="text-ink-soft">({m.kind})</span>
        </li>
      ))}
    </ul>
  );
}
