import { useEffect, useId } from 'react';
import type { FontInfo } from '../../../../shared/schemas/engine.ts';
import type { Material } from '../../../../shared/schemas/material.ts';
import { FieldError } from '../../../components/ui/form-controls.tsx';

const chip = (on: boolean) =>
  'flex min-h-11 items-center gap-2 rounded-lg border-2 px-3 py-1.5 text-left text-sm font-bold transition-colors ' +
  (on ? 'border-thread bg-thread-wash text-thread-deep' : 'border-line bg-white text-ink hover:border-ink');

/** A group of toggle chips (aria-pressed) for picking several of a list, named by its legend. */
function ChipGroup({ label, hint, error, children }: { label: string; hint?: string; error?: string; children: React.ReactNode }) {
  const id = useId();
  return (
    <fieldset aria-describedby={error ? `${id}-e` : undefined} className="flex min-w-0 flex-col gap-1.5">
      {/* a rendered legend sits outside the flex flow, so its margin stands in for the gap */}
      <legend className="mb-1.5 font-bold">{label}</legend>
      {hint ? <span className="text-sm text-ink-soft">{hint}</span> : null}
      <div className="flex flex-wrap gap-2">{children}</div>
      <FieldError id={`${id}-e`} message={error} />
    </fieldset>
  );
}

const toggle = (list: string[], id: string) => (list.includes(id) ? list.filter((x) => x !== id) : [...list, id]);

export function ColourChoices({
  label,
  hint,
  materials,
  value,
  onChange,
  error,
}: {
  label: string;
  hint?: string;
  materials: Material[];
  value: string[] | undefined;
  onChange: (ids: string[]) => void;
  error?: string;
}) {
  const v = value ?? [];
  if (materials.length === 0)
    return (
      <ChipGroup label={label} error={error}>
        <p className="text-sm text-ink-soft">Add materials on the Materials page first; colours come from your vinyl stock.</p>
      </ChipGroup>
    );
  return (
    <ChipGroup label={label} hint={hint} error={error}>
      {materials.map((m) => (
        <button key={m.id} type="button" aria-pressed={v.includes(m.id)} onClick={() => onChange(toggle(v, m.id))} className={chip(v.includes(m.id))}>
          <span aria-hidden="true" className="size-5 shrink-0 rounded-full border border-ink/30" style={{ background: m.colourHex }} />
          <span>
            {m.colourName} <span className="font-semibold text-ink-soft">· {m.kind}</span>
          </span>
        </button>
      ))}
    </ChipGroup>
  );
}

const loaded = new Set<string>();
/** Loads the engine's own font files so each font's name is shown in that font. */
function useFontFaces(fonts: FontInfo[]) {
  useEffect(() => {
    if (typeof FontFace === 'undefined') return;
    for (const f of fonts) {
      if (loaded.has(f.id)) continue;
      loaded.add(f.id);
      const face = new FontFace(`namesake-${f.id}`, `url(${f.fileUrl}) format('truetype')`);
      face
        .load()
        .then((ff) => document.fonts.add(ff))
        .catch(() => loaded.delete(f.id));
    }
  }, [fonts]);
}

export function FontChoices({ fonts, value, onChange, error }: { fonts: FontInfo[]; value: string[] | undefined; onChange: (ids: string[]) => void; error?: string }) {
  useFontFaces(fonts);
  const v = value ?? [];
  return (
    <ChipGroup label="Allowed fonts" hint="The shopper picks one of these; each is cut from the same font file." error={error}>
      {fonts.map((f) => (
        <button key={f.id} type="button" aria-pressed={v.includes(f.id)} onClick={() => onChange(toggle(v, f.id))} className={chip(v.includes(f.id))}>
          <span style={{ fontFamily: `namesake-${f.id}, inherit` }} className="text-lg font-normal">
            {f.family}
          </span>
          <span className="font-semibold text-ink-soft">· {f.kind}</span>
        </button>
      ))}
    </ChipGroup>
  );
}
