/**
 * The full composition as the preview needs it (weeding, the true outlines, the design's box), made
 * the same way by the compose worker and by the main-thread fallback in compose-client.ts.
 */
import { type ComposeInput, compose } from '../../../../shared/engine/compose.ts';
import type { FontRegistry, FontSource } from '../../../../shared/engine/fonts.ts';
import type { BBox } from '../../../../shared/engine/path.ts';
import type { WeedingReport } from '../../../../shared/engine/weeding.ts';

export type ComposeRequest = { type: 'fonts'; sources: FontSource[] } | { type: 'compose'; id: number; input: ComposeInput };
export type ComposeReply = { id: number; ok: true; weeding: WeedingReport; outlines: { fieldId: string; path: string; colour: string }[]; bboxMm: BBox } | { id: number; ok: false; message: string };

export type ComposeResult = Extract<ComposeReply, { ok: true }>;

/** Composes `input` for request `id`; a design the engine refuses answers with its message. */
export function composeReply(registry: FontRegistry, id: number, input: ComposeInput): ComposeReply {
  try {
    const item = compose(registry, input);
    return {
      id,
      ok: true,
      weeding: item.weeding,
      bboxMm: item.bboxMm,
      outlines: item.pieces.filter((p) => p.role === 'outline').map((p) => ({ fieldId: p.fieldId, path: p.path, colour: p.colour })),
    };
  } catch (err) {
    return { id, ok: false, message: err instanceof Error ? err.message : 'The design could not be composed.' };
  }
}
