/**
 * The full compose() — weeding analysis and the outline's polygon offset included — off the main
 * thread, so typing never waits for it. Fonts arrive as the same bytes the page parsed.
 */
import { compose, ComposeError, type ComposeInput } from '../../../../shared/engine/compose.ts';
import { loadFont, type FontRegistry, type FontSource, type LoadedFont } from '../../../../shared/engine/fonts.ts';
import type { ComposeReply, ComposeRequest } from './compose-client.ts';

const fonts = new Map<string, LoadedFont>();
const registry: FontRegistry = {
  get: (id) => fonts.get(id),
  require(id) {
    const f = fonts.get(id);
    if (!f) throw new Error(`Unknown font "${id}".`);
    return f;
  },
  list: () => [...fonts.values()],
};

const ctx = self as unknown as { onmessage: ((e: MessageEvent<ComposeRequest>) => void) | null; postMessage(m: ComposeReply): void };

ctx.onmessage = (e) => {
  const msg = e.data;
  if (msg.type === 'fonts') {
    for (const s of msg.sources as FontSource[]) if (!fonts.has(s.id)) fonts.set(s.id, loadFont(s));
    return;
  }
  try {
    const item = compose(registry, msg.input as ComposeInput);
    ctx.postMessage({
      id: msg.id,
      ok: true,
      weeding: item.weeding,
      outlines: item.pieces.filter((p) => p.role === 'outline').map((p) => ({ fieldId: p.fieldId, path: p.path, colour: p.colour })),
      bboxMm: item.bboxMm,
    });
  } catch (err) {
    ctx.postMessage({ id: msg.id, ok: false, message: err instanceof ComposeError || err instanceof Error ? err.message : 'The design could not be composed.' });
  }
};
