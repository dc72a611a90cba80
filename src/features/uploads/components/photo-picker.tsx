import { useRef, useState } from 'react';
import { FieldError, ProgressBar } from '../../../components/ui/form-controls.tsx';
import { isApiError } from '../../../lib/api-client.ts';
import { usePhotos } from '../api/get-photos.ts';
import { useUploadPhoto } from '../api/upload-photo.ts';

type Pending = { key: number; name: string; progress: number | null };
type Refusal = { key: number; name: string; message: string };

/**
 * The listing's photos (ids, in order; the first is the thumbnail). New files upload one by one
 * with a progress bar each; a refused file shows the server's reason and nothing else changes.
 */
export function PhotoPicker({ value, onChange, max = 8, error }: { value: string[]; onChange: (ids: string[]) => void; max?: number; error?: string }) {
  const photos = usePhotos();
  const uploadPhoto = useUploadPhoto();
  const [pending, setPending] = useState<Pending[]>([]);
  const [refused, setRefused] = useState<Refusal[]>([]);
  const [showLibrary, setShowLibrary] = useState(false);
  const input = useRef<HTMLInputElement>(null);
  const nextKey = useRef(1);
  // the latest ids, so uploads that finish one after another all land
  const current = useRef(value);
  current.current = value;

  const byId = new Map((photos.data ?? []).map((p) => [p.id, p]));
  const room = max - value.length - pending.length;

  async function onFiles(files: FileList | null) {
    if (!files) return;
    setRefused([]);
    const list = [...files].slice(0, Math.max(0, room));
    if (files.length > list.length) setRefused([{ key: nextKey.current++, name: `${files.length - list.length} file(s)`, message: `A listing has at most ${max} photos.` }]);
    for (const file of list) {
      const key = nextKey.current++;
      setPending((p) => [...p, { key, name: file.name, progress: 0 }]);
      try {
        const up = await uploadPhoto.mutateAsync({ file, onProgress: (f) => setPending((p) => p.map((x) => (x.key === key ? { ...x, progress: f } : x))) });
        onChange([...current.current, up.id]);
      } catch (err) {
        setRefused((r) => [...r, { key, name: file.name, message: isApiError(err) ? err.message : 'The upload failed.' }]);
      } finally {
        setPending((p) => p.filter((x) => x.key !== key));
      }
    }
    if (input.current) input.current.value = '';
  }

  const move = (i: number, d: -1 | 1) => {
    const next = [...value];
    const j = i + d;
    if (j < 0 || j >= next.length) return;
    [next[i], next[j]] = [next[j]!, next[i]!];
    onChange(next);
  };

  const library = (photos.data ?? []).filter((p) => p.kind === 'photo' && !value.includes(p.id));

  return (
    <div className="flex flex-col gap-4">
      {value.length > 0 ? (
        <ol className="grid grid-cols-2 gap-3 sm:grid-cols-4" aria-label="Listing photos, in order">
          {value.map((id, i) => {
            const p = byId.get(id);
            return (
              <li key={id} className="flex flex-col gap-1.5 rounded-lg border border-line bg-paper p-2">
                {/* the caption below names the photo, so the thumbnail itself carries no second name */}
                <div className="aspect-square overflow-hidden rounded-md bg-paper-deep">
                  {p ? <img src={p.thumbnailUrl} alt="" className="size-full object-cover" /> : <span className="p-2 text-sm text-ink-faint">Photo {i + 1}</span>}
                </div>
                <span className="text-sm font-bold">{i === 0 ? 'Photo 1 · thumbnail' : `Photo ${i + 1}`}</span>
                <span className="flex flex-wrap gap-1">
                  <button
                    type="button"
                    className="min-h-8 min-w-8 rounded border border-line px-2 text-sm disabled:opacity-40"
                    disabled={i === 0}
                    onClick={() => move(i, -1)}
                    aria-label={`Move photo ${i + 1} earlier`}
                  >
                    ←
                  </button>
                  <button
                    type="button"
                    className="min-h-8 min-w-8 rounded border border-line px-2 text-sm disabled:opacity-40"
                    disabled={i === value.length - 1}
                    onClick={() => move(i, 1)}
                    aria-label={`Move photo ${i + 1} later`}
                  >
                    →
                  </button>
                  <button
                    type="button"
                    className="min-h-8 rounded border border-line px-2 text-sm font-bold text-danger"
                    onClick={() => onChange(value.filter((x) => x !== id))}
                    aria-label={`Remove photo ${i + 1}`}
                  >
                    Remove
                  </button>
                </span>
              </li>
            );
          })}
        </ol>
      ) : (
        <p className="text-ink-soft">No photos yet.</p>
      )}

      {pending.map((p) => (
        <ProgressBar key={p.key} value={p.progress} label={`Uploading ${p.name}`} />
      ))}

      <div className="flex flex-col gap-1.5">
        <label className="flex flex-col gap-1.5">
          <span className="font-bold">Add photos</span>
          <span className="text-sm text-ink-soft">
            JPEG, PNG or WebP, up to 8 MB each. {value.length} of {max} used.
          </span>
          <input
            ref={input}
            type="file"
            multiple
            accept="image/jpeg,image/png,image/webp"
            disabled={room <= 0}
            onChange={(e) => void onFiles(e.target.files)}
            className="min-h-11 max-w-full text-base file:mr-3 file:min-h-11 file:rounded-lg file:border-2 file:border-thread file:bg-paper file:px-4 file:font-bold file:text-thread-deep"
          />
        </label>
        {refused.map((r) => (
          <p key={r.key} role="alert" className="text-sm font-semibold text-danger">
            {r.name}: {r.message}
          </p>
        ))}
        <FieldError message={error} />
      </div>

      {library.length > 0 ? (
        <div>
          <button type="button" className="min-h-11 font-bold text-thread-deep underline decoration-2 underline-offset-4" aria-expanded={showLibrary} onClick={() => setShowLibrary((s) => !s)}>
            {showLibrary ? 'Hide' : 'Choose from'} photos you uploaded before ({library.length})
          </button>
          {showLibrary ? (
            <ul className="mt-2 grid grid-cols-3 gap-2 sm:grid-cols-6">
              {library.map((p) => (
                <li key={p.id}>
                  <button
                    type="button"
                    disabled={room <= 0}
                    onClick={() => onChange([...value, p.id])}
                    className="block aspect-square w-full overflow-hidden rounded-md border-2 border-line hover:border-thread disabled:opacity-40"
                    aria-label="Add this photo to the listing"
                  >
                    <img src={p.thumbnailUrl} alt="" className="size-full object-cover" />
                  </button>
                </li>
              ))}
            </ul>
          ) : null}
        </div>
      ) : null}
    </div>
  );
}
