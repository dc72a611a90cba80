// What the compose worker (and its main-thread fallback) hands the preview: compose()'s weeding and
// true outline for the design, or compose()'s own message when the design is refused.
import { describe, expect, it } from 'vitest';
import { getFontRegistry } from '../../server/integrations/fonts.ts';
import { defaultBlank } from '../../shared/engine/blanks.ts';
import { type ComposeInput, compose } from '../../shared/engine/compose.ts';
import { composeReply } from '../../src/features/personaliser/lib/compose-reply.ts';

const reg = getFontRegistry();
const outlined = (text: string): ComposeInput => ({
  blank: defaultBlank('drawstring_bag')!,
  fields: [{ kind: 'text', id: 'name', fontId: 'bangers', letterHeightMm: 50, materialKind: 'smooth', colour: '#2f7d6d', outline: { offsetMm: 3, materialKind: 'smooth', colour: '#ffffff' } }],
  choices: { name: { text } },
});

describe('the compose reply for the preview', () => {
  it('when a name has an outline backing, then the reply carries compose()’s outline, weeding and box', () => {
    const item = compose(reg, outlined('Leon'));
    const reply = composeReply(reg, 7, outlined('Leon'));
    expect(reply.ok && reply.id).toBe(7);
    if (!reply.ok) return;
    expect(reply.outlines).toEqual([{ fieldId: 'name', path: item.pieces[0]!.path, colour: '#ffffff' }]);
    expect(item.pieces[0]!.role).toBe('outline');
    expect(reply.weeding).toEqual(item.weeding);
    expect(reply.bboxMm).toEqual(item.bboxMm);
  });

  it('when the name is empty, then the reply is compose()’s refusal in words', () => {
    expect(composeReply(reg, 8, outlined(' '))).toEqual({ id: 8, ok: false, message: 'Enter the text for this item.' });
  });
});
