/**
 * A motif's fingerprint: the same cut shapes give the same fingerprint, whatever the layers are
 * called or coloured. Moderation uses it to flag a listing whose motif is another shop's artwork
 * uploaded again. It hashes the stored outline path data (already normalised to mm by the motif
 * parser) and the size; a redrawn or scaled copy is a different fingerprint, so this catches reuse
 * of the same file, not look-alikes. Two 32-bit FNV-1a hashes (different seeds) side by side.
 */
import type { StoredMotifGeometry } from './motif.ts';

function fnv1a(text: string, seed: number): string {
  let h = seed >>> 0;
  for (let i = 0; i < text.length; i++) {
    h ^= text.charCodeAt(i);
    h = Math.imul(h, 0x01000193) >>> 0;
  }
  return h.toString(16).padStart(8, '0');
}

export function motifFingerprint(g: Pick<StoredMotifGeometry, 'widthMm' | 'heightMm' | 'layers'>): string {
  const canonical = [`${g.widthMm.toFixed(1)}x${g.heightMm.toFixed(1)}`, ...g.layers.map((l) => l.path.trim()).sort()].join('\n');
  return `${fnv1a(canonical, 0x811c9dc5)}${fnv1a(canonical, 0x2166136b)}`;
}
