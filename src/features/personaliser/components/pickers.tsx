import { memo, type ReactNode, useEffect, useId, useState } from 'react';
import type { FontRegistry } from '../../../../shared/engine/fonts.ts';
import type { StoredMotifGeometry } from '../../../../shared/engine/motif.ts';
import { layoutText } from '../../../../shared/engine/text-layout.ts';
import type { PublicMaterial } from '../../../../shared/schemas/catalog.ts';
import type { FontInfo } from '../../../../shared/schemas/engine.ts';
import { FieldError } from '../../../components/ui/form-controls.tsx';

export const optionBox =
  'flex cursor-pointer items-center gap-3 rounded-lg border-2 bg-white p-2.5 has-[:checked]:border-thread has-[:checked]:bg-thread-wash ' +
  'has-[:focus-visible]:outline-3 has-[:focus-visible]:outline-offset-2 has-[:focus-visible]:outline-ink border-line hover:border-ink';

/** A group of radio options under a legend, its error read out with it. `layout`: the options' wrapper classes. */
export function OptionGroup({ legend, error, layout, children }: { legend: string; error?: string; layout: string; children: ReactNode }) {
  const errId = useId();
  return (
    <fieldset className="flex flex-col gap-2" aria-describedby={error ? errId : undefined}>
      <legend className="mb-1 font-bold">{legend}</legend>
      <div className={layout}>{children}</div>
      <FieldError id={errId} message={error} />
    </fieldset>
  );
}

/** The characters of `text` a font lacks, each once. */
export function missingIn(registry: FontRegistry | null, fontId: string, text: string): string[] {
  const f = registry?.get(fontId);
  if (!f) return [];
  const out: string[] = [];
  for (const ch of text.normalize('NFC')) if (!/\s/u.test(ch) && !f.hasChar(ch.codePointAt(0)!) && !out.includes(ch)) out.push(ch);
  return out;
}

/** The typed name set in one font, from the engine's outlines (not a CSS font): the real geometry. */
const FontSample = memo(function FontSample({ registry, fontId, text }: { registry: FontRegistry; fontId: string; text: string }) {
  const l = layoutText(registry, { text, fontId, letterHeightMm: 10 });
  if (!l.path) return <span className="h-8" />;
  const pad = 1;
  const vb = `${l.bboxMm.minX - pad} ${Math.min(l.bboxMm.minY, 0) - pad} ${l.widthMm + 2 * pad} ${Math.max(l.bboxMm.maxY, 10) - Math.min(l.bboxMm.minY, 0) + 2 * pad}`;
  return (
    <svg viewBox={vb} aria-hidden="true" className="h-9 max-w-full" preserveAspectRatio="xMinYMid meet">
      <path d={l.path} fill="#1f2a44" />
    </svg>
  );
});

export function FontPicker(props: { legend: string; name: string; fonts: FontInfo[]; value: string; text: string; registry: FontRegistry | null; onChange: (fontId: string) => void; error?: string }) {
  // The samples follow the typing one frame behind: set after the preview's frame has painted,
  // so laying the name out in every font never delays the preview itself.
  const [typed, setTyped] = useState(props.text);
  useEffect(() => {
    if (typed === props.text) return;
    let t = 0;
    const raf = requestAnimationFrame(() => {
      t = window.setTimeout(() => setTyped(props.text), 0);
    });
    return () => {
      cancelAnimationFrame(raf);
      clearTimeout(t);
    };
  }, [props.text, typed]);
  const sample = typed.trim() || 'Mira';
  return (
    <OptionGroup legend={props.legend} error={props.error} layout="grid gap-2 sm:grid-cols-2">
      {props.fonts.map((f) => {
        const missing = missingIn(props.registry, f.id, sample);
        return (
          <label key={f.id} className={optionBox}>
            <input type="radio" name={props.name} value={f.id} checked={props.value === f.id} onChange={() => props.onChange(f.id)} className="sr-only" />
            <span className="flex min-w-0 flex-1 flex-col gap-0.5">
              {props.registry?.get(f.id) ? <FontSample registry={props.registry} fontId={f.id} text={sample} /> : <span className="h-9 animate-pulse rounded bg-paper-deep" />}
              <span className="text-sm text-ink-soft">
                {f.family} · {f.style}
                {missing.length ? <span className="block font-semibold text-danger">Can't draw {missing.map((c) => `“${c}”`).join(' ')}</span> : null}
              </span>
            </span>
          </label>
        );
      })}
    </OptionGroup>
  );
}

export function SwatchPicker(props: { legend: string; name: string; options: PublicMaterial[]; value: string | null | undefined; onChange: (materialId: string) => void; error?: string }) {
  return (
    <OptionGroup legend={props.legend} error={props.error} layout="flex flex-wrap gap-2">
      {props.options.map((m) => (
        <label key={m.id} className={`${optionBox} !py-1.5 pr-3.5`}>
          <input type="radio" name={props.name} value={m.id} checked={props.value === m.id} onChange={() => props.onChange(m.id)} className="sr-only" />
          <span aria-hidden="true" className="size-7 shrink-0 rounded-full border-2 border-ink/30" style={{ background: m.colourHex }} />
          <span className="text-sm leading-tight">
            <span className="block font-bold">{m.colourName}</span>
            <span className="text-ink-soft">{m.kind}</span>
          </span>
        </label>
      ))}
    </OptionGroup>
  );
}

function MotifThumb({ geometry, colours }: { geometry: StoredMotifGeometry; colours: Record<string, string | undefined> }) {
  let minX = Infinity,
    minY = Infinity,
    maxX = -Infinity,
    maxY = -Infinity;
  for (const l of geometry.layers) {
    minX = Math.min(minX, l.bboxMm.minX);
    minY = Math.min(minY, l.bboxMm.minY);
    maxX = Math.max(maxX, l.bboxMm.maxX);
    maxY = Math.max(maxY, l.bboxMm.maxY);
  }
  return (
    <svg viewBox={`${minX - 2} ${minY - 2} ${maxX - minX + 4} ${maxY - minY + 4}`} aria-hidden="true" className="size-12 shrink-0">
      {geometry.layers.map((l) => (
        <path key={l.id} d={l.path} fill={colours[l.id] ?? l.colour ?? '#1f2a44'} />
      ))}
    </svg>
  );
}

export function MotifPicker(props: {
  legend: string;
  name: string;
  options: { motifId: string; label: string; geometry: StoredMotifGeometry | null; colours: Record<string, string | undefined> }[];
  allowNone: boolean;
  value: string | null;
  onChange: (motifId: string | null) => void;
  error?: string;
}) {
  return (
    <OptionGroup legend={props.legend} error={props.error} layout="flex flex-wrap gap-2">
      {props.options.map((o) => (
        <label key={o.motifId} className={`${optionBox} pr-3.5`}>
          <input type="radio" name={props.name} value={o.motifId} checked={props.value === o.motifId} onChange={() => props.onChange(o.motifId)} className="sr-only" />
          {o.geometry ? <MotifThumb geometry={o.geometry} colours={o.colours} /> : null}
          <span className="font-bold">{o.label}</span>
        </label>
      ))}
      {props.allowNone ? (
        <label className={`${optionBox} pr-3.5`}>
          <input type="radio" name={props.name} value="" checked={props.value === null} onChange={() => props.onChange(null)} className="sr-only" />
          <span className="font-bold">No motif</span>
        </label>
      ) : null}
    </OptionGroup>
  );
}
