/**
 * The full compose() — weeding analysis and the outline's polygon offset included — off the main
 * thread, so typing never waits for it. Fonts arrive as the same bytes the page parsed.
 */
import { fontRegistry, type LoadedFont, loadFont } from '../../../../shared/engine/fonts.ts';
import { type ComposeReply, type ComposeRequest, composeReply } from './compose-reply.ts';

const fonts = new Map<string, LoadedFont>();
const registry = fontRegistry(fonts);

const ctx = self as unknown as { onmessage: ((e: MessageEvent<ComposeRequest>) => void) | null; postMessage(m: ComposeReply): void };

ctx.onmessage = (e) => {
  const msg = e.data;
  if (msg.type === 'fonts') {
    for (const s of msg.sources) if (!fonts.has(s.id)) fonts.set(s.id, loadFont(s));
    return;
  }
  ctx.postMessage(composeReply(registry, msg.id, msg.input));
};
