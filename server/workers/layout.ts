/**
 * Text layout for the API: served from a cache on the request thread when the same text, font and
 * size were laid out lately (the personaliser asks again on every keystroke), otherwise laid out
 * in the worker pool. The engine's own layout cache lives in each worker; this one spares the trip.
 */
import type { LayoutTextInput, TextLayout } from '../../shared/engine/text-layout.ts';
import type { WorkPool } from './pool.ts';

const SIZE = 2000;

export function createLayoutCache(pool: WorkPool) {
  const cache = new Map<string, TextLayout>();
  return async function layout(input: LayoutTextInput): Promise<TextLayout> {
    const key = `${input.fontId}|${input.letterHeightMm}|${input.trackingMm ?? 0}|${input.text.normalize('NFC')}`;
    const hit = cache.get(key);
    if (hit) {
      cache.delete(key); // LRU: move to the newest end
      cache.set(key, hit);
      return hit;
    }
    const l = Object.freeze(await pool.run({ kind: 'layout', input: { text: input.text, fontId: input.fontId, letterHeightMm: input.letterHeightMm, trackingMm: input.trackingMm } }));
    cache.set(key, l);
    if (cache.size > SIZE) cache.delete(cache.keys().next().value as string);
    return l;
  };
}
