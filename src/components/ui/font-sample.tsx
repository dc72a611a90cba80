import { useEffect, useState } from 'react';
import { catalogEntry } from '../../../shared/engine/font-catalog.ts';

/**
 * A font by its name, with a sample set in the font file itself (the same file the shop cuts from,
 * served at /api/fonts/:id/file): what an admin or seller reads instead of an internal id.
 */
export function FontSample({ fontId, sample = 'Mira Zoë' }: { fontId: string; sample?: string }) {
  const entry = catalogEntry(fontId);
  const family = `ns-sample-${fontId}`;
  const [ready, setReady] = useState(false);
  useEffect(() => {
    if (typeof FontFace === 'undefined') return;
    let live = true;
    const face = new FontFace(family, `url(/api/fonts/${encodeURIComponent(fontId)}/file)`);
    face
      .load()
      .then((f) => {
        document.fonts.add(f);
        if (live) setReady(true);
      })
      .catch(() => {});
    return () => {
      live = false;
    };
  }, [family, fontId]);
  return (
    <span className="inline-flex flex-col rounded-lg border border-line bg-white px-3 py-1.5" data-font={fontId}>
      <span className="text-xl leading-tight" style={ready ? { fontFamily: `"${family}"` } : undefined}>
        {sample}
      </span>
      <span className="text-xs text-ink-soft">{entry ? `${entry.family} · ${entry.style}` : fontId}</span>
    </span>
  );
}
