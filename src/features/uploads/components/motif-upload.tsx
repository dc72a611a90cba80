import { useRef, useState } from 'react';
import type { DroppedReport, MotifView } from '../../../../shared/schemas/upload.ts';
import { formatSize } from '../../../../shared/units.ts';
import { Button, Spinner } from '../../../components/ui/button.tsx';
import { ProgressBar } from '../../../components/ui/form-controls.tsx';
import { TextField } from '../../../components/ui/text-field.tsx';
import { isApiError } from '../../../lib/api-client.ts';
import { useMotif } from '../api/get-motif.ts';
import { useUploadMotif } from '../api/upload-motif.ts';

/**
 * The motif as the engine normalised it, drawn from its stored geometry (never the uploaded file):
 * all layers together, then each layer alone. `colours` overrides a layer's fill (layer id → hex).
 */
export function MotifPreview({ motifId, colours = {}, showLayers = true, size = 'md' }: { motifId: string; colours?: Record<string, string>; showLayers?: boolean; size?: 'sm' | 'md' }) {
  const motif = useMotif(motifId);
  if (motif.isPending) return <Spinner label="Loading the motif…" />;
  if (motif.isError) return <p className="text-sm text-danger">{motif.error.message}</p>;
  const g = motif.data.geometry;
  const fill = (l: { id: string; colour: string | null }) => colours[l.id] ?? l.colour ?? '#1f2a44';
  const box = size === 'sm' ? 'size-24' : 'size-40';
  return (
    <div className="flex flex-wrap items-start gap-4">
      <figure className="flex flex-col items-center gap-1">
        <svg viewBox={`0 0 ${g.widthMm} ${g.heightMm}`} className={`${box} rounded-md border border-line bg-white p-1`} role="img" aria-label={`${motif.data.name}, all layers`}>
          {g.layers.map((l) => (
            <path key={l.id} d={l.path} fill={fill(l)} />
          ))}
        </svg>
        <figcaption className="text-sm text-ink-soft">{formatSize(g.widthMm, g.heightMm)}</figcaption>
      </figure>
      {showLayers ? (
        <ol className="flex flex-wrap gap-3" aria-label="Layers, bottom to top">
          {g.layers.map((l, i) => (
            <li key={l.id} className="flex flex-col items-center gap-1">
              <svg viewBox={`0 0 ${g.widthMm} ${g.heightMm}`} className="size-20 rounded-md border border-dashed border-line bg-paper-deep p-1" role="img" aria-label={`Layer ${i + 1}: ${l.id}`}>
                <path d={l.path} fill={fill(l)} />
              </svg>
              <span className="max-w-20 truncate text-sm font-bold" title={l.id}>
                {i + 1}. {l.id}
              </span>
            </li>
          ))}
        </ol>
      ) : null}
    </div>
  );
}

/** Upload a layered SVG motif: it is sanitised and normalised by the engine on the server. */
export function MotifUpload({ onUploaded }: { onUploaded?: (motif: MotifView) => void }) {
  const uploadMotif = useUploadMotif();
  const [name, setName] = useState('');
  const [file, setFile] = useState<File | null>(null);
  const [progress, setProgress] = useState<number | null | undefined>(undefined);
  const [error, setError] = useState<{ name?: string; file?: string } | null>(null);
  const [result, setResult] = useState<{ motif: MotifView; dropped: DroppedReport } | null>(null);
  const input = useRef<HTMLInputElement>(null);

  async function submit() {
    const errs: { name?: string; file?: string } = {};
    if (!name.trim()) errs.name = 'Name the motif.';
    if (!file) errs.file = 'Choose an SVG file.';
    if (errs.name || errs.file) return setError(errs);
    setError(null);
    setResult(null);
    setProgress(0);
    try {
      const r = await uploadMotif.mutateAsync({ name: name.trim(), file: file!, onProgress: setProgress });
      setResult(r);
      setName('');
      setFile(null);
      if (input.current) input.current.value = '';
      onUploaded?.(r.motif);
    } catch (err) {
      const message = isApiError(err) ? err.message : 'The motif could not be uploaded.';
      setError(isApiError(err) && err.fields?.name ? { name: err.fields.name } : { file: message });
    } finally {
      setProgress(undefined);
    }
  }

  return (
    <div className="flex flex-col gap-4 rounded-lg border-2 border-dashed border-thread/60 bg-thread-wash/30 p-4">
      <p className="font-extrabold">Upload a motif</p>
      <p className="-mt-3 text-sm text-ink-soft">A layered SVG: put each colour in its own group (&lt;g id="…"&gt;). Scripts, images and links are removed; at most 4 layers are used on one item.</p>
      <div className="grid grid-cols-1 gap-4 sm:grid-cols-2">
        <TextField label="Motif name" value={name} maxLength={60} onChange={(e) => setName(e.target.value)} error={error?.name} />
        <div className="flex flex-col gap-1.5">
          <label className="flex flex-col gap-1.5">
            <span className="font-bold">SVG file</span>
            <input
              ref={input}
              type="file"
              accept=".svg,image/svg+xml"
              aria-invalid={error?.file ? true : undefined}
              onChange={(e) => setFile(e.target.files?.[0] ?? null)}
              className="min-h-11 max-w-full text-base file:mr-3 file:min-h-11 file:rounded-lg file:border-2 file:border-thread file:bg-paper file:px-4 file:font-bold file:text-thread-deep"
            />
          </label>
          {error?.file ? (
            <p role="alert" className="text-sm font-semibold text-danger">
              {error.file}
            </p>
          ) : null}
        </div>
      </div>
      {progress !== undefined ? <ProgressBar value={progress} label="Uploading motif" /> : null}
      <Button variant="secondary" className="self-start" pending={uploadMotif.isPending} pendingLabel="Uploading…" onClick={() => void submit()}>
        Upload motif
      </Button>
      {result ? (
        <div className="flex flex-col gap-2" role="status">
          <p className="font-bold text-thread-deep">
            “{result.motif.name}” uploaded with {result.motif.layers.length} layer{result.motif.layers.length === 1 ? '' : 's'}.
          </p>
          {result.dropped.length > 0 ? (
            <ul className="list-disc pl-5 text-sm text-ink-soft">
              {result.dropped.map((d) => (
                <li key={d.what}>
                  Removed {d.count} × {d.what}: {d.reason}.
                </li>
              ))}
            </ul>
          ) : null}
          <MotifPreview motifId={result.motif.id} />
        </div>
      ) : null}
    </div>
  );
}
