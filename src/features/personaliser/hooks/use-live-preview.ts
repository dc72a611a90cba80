/**
 * The live preview's engine: the listing's fonts fetched and parsed once, every change placed with
 * the engine's placeDesign() in the same render (nothing debounced), and the full compose() —
 * weeding and the true outline — asked of a worker after the frame, newest input only.
 * Keystroke → painted is measured as the `preview` performance measure (marks `preview-input` and
 * `preview-painted`); call markInput() when the shopper changes something.
 */
import { useEffect, useLayoutEffect, useMemo, useRef, useState } from 'react';
import type { ComposeInput } from '../../../../shared/engine/compose.ts';
import type { FontRegistry } from '../../../../shared/engine/fonts.ts';
import type { FontInfo } from '../../../../shared/schemas/engine.ts';
import { ComposeClient, type ComposeReply, type ComposeResult } from '../lib/compose-client.ts';
import { loadClientRegistry } from '../lib/font-registry.ts';
import { type Placement, placeDesign } from '../lib/place.ts';

type Engine = { registry: FontRegistry; client: ComposeClient };

/** Fonts → a registry for the page and a compose worker that has the same bytes. */
function useComposeEngine(fonts: FontInfo[] | undefined, fontIds: string[]) {
  const [engine, setEngine] = useState<Engine | null>(null);
  const [error, setError] = useState<string | null>(null);
  const [full, setFull] = useState<ComposeReply | null>(null);
  useEffect(() => {
    if (!fonts) return;
    let live = true;
    loadClientRegistry(fonts, fontIds)
      .then(({ registry, sources }) => {
        if (!live) return;
        const client = new ComposeClient(registry, sources);
        client.onResult((r) => setFull(r));
        setEngine({ registry, client });
      })
      .catch((e: unknown) => live && setError(e instanceof Error ? e.message : 'The fonts did not load.'));
    return () => {
      live = false;
    };
  }, [fonts, fontIds]);
  useEffect(() => () => engine?.client.dispose(), [engine]);
  return { engine, error, full };
}

export function useLivePreview(input: ComposeInput | null, fonts: FontInfo[] | undefined, fontIds: string[]) {
  const { engine, error: engineError, full } = useComposeEngine(fonts, fontIds);
  const inputStart = useRef<number | null>(null);

  const placement = useMemo<{ value: Placement | null; error: string | null }>(() => {
    if (!engine || !input) return { value: null, error: null };
    try {
      return { value: placeDesign(engine.registry, input), error: null };
    } catch (e) {
      return { value: null, error: e instanceof Error ? e.message : 'The design could not be placed.' };
    }
  }, [engine, input]);

  // the full composition for weeding and the outline, newest input only
  const [requestId, setRequestId] = useState(-1);
  useEffect(() => {
    if (!engine || !input || !placement.value) return setRequestId(-1);
    // posted after the frame: copying the input to the worker is not on the keystroke's path
    const t = setTimeout(() => setRequestId(engine.client.request(input)), 0);
    return () => clearTimeout(t);
  }, [engine, input, placement.value]);
  const fullNow: ComposeResult | null = full && full.id === requestId && full.ok && engine?.client.current === requestId ? full : null;

  // keystroke → painted: measured from the first input not yet on screen to the frame after it
  // biome-ignore lint/correctness/useExhaustiveDependencies: `placement` is the trigger, not an input: this runs once each new placement is committed, which is the frame being timed
  useLayoutEffect(() => {
    if (inputStart.current === null) return;
    const start = inputStart.current;
    requestAnimationFrame(() =>
      setTimeout(() => {
        const end = performance.mark('preview-painted').startTime;
        performance.measure('preview', { start, end });
        if (inputStart.current === start) inputStart.current = null;
      }, 0),
    );
  }, [placement]);

  return {
    registry: engine?.registry ?? null,
    engineError,
    placement: placement.value,
    placementError: placement.error,
    /** the worker's full composition for what is on screen now, once it is in */
    full: fullNow,
    /** the worker's refusal of what is on screen now, in words */
    fullFailed: full && !full.ok && full.id === requestId ? full.message : null,
    markInput() {
      if (inputStart.current === null) inputStart.current = performance.mark('preview-input').startTime;
    },
  };
}
