// The one blank drawing (src/components/design/design-on-blank.tsx) and the one line-state badge.
// The drawn print area is checked against where the engine's compose() really puts a design, and
// the blank against the engine's own blank sizes (shared/engine/blanks.ts), not against itself.
import { createElement } from 'react';
import { renderToStaticMarkup } from 'react-dom/server';
import { describe, expect, it } from 'vitest';
import { getFontRegistry } from '../../server/integrations/fonts.ts';
import { DEFAULT_BLANKS } from '../../shared/engine/blanks.ts';
import { compose } from '../../shared/engine/compose.ts';
import { blankFor } from '../../shared/engine/listing-design.ts';
import { LINE_STATES } from '../../shared/schemas/order.ts';
import { DesignOnBlank, pictureOfBlank, pictureOfLineBlank } from '../../src/components/design/design-on-blank.tsx';
import { LineStateBadge } from '../../src/components/ui/line-state-badge.tsx';

const reg = getFontRegistry();
const attrs = (html: string, tag: string) =>
  [...html.matchAll(new RegExp(`<${tag} ([^>]*)/?>`, 'g'))].map((m) => Object.fromEntries([...m[1]!.matchAll(/([\w-]+)="([^"]*)"/g)].map((a) => [a[1], a[2]])));

describe('DesignOnBlank', () => {
  for (const blank of DEFAULT_BLANKS) {
    it(`when a long name is composed on the ${blank.name}, then it fills the dashed print area's width from its top edge, inside it`, () => {
      const item = compose(
        reg,
        {
          blank,
          fields: [{ kind: 'text', id: 'name', fontId: 'baloo-bold', letterHeightMm: 60, maxLetterHeightMm: 120, maxChars: 14, materialKind: 'smooth', colour: '#2f7d6d' }],
          choices: { name: { text: 'Bartholomew' } },
        },
        { weeding: 'none' },
      );
      const html = renderToStaticMarkup(createElement(DesignOnBlank, { blank: pictureOfBlank(blank), label: 'x' }));
      const area = attrs(html, 'rect').find((r) => r['stroke-dasharray'])!;
      const [x, y, w, h] = ['x', 'y', 'width', 'height'].map((k) => Number(area[k]));
      expect(item.bboxMm.minX).toBeGreaterThanOrEqual(x! - 1e-6);
      expect(item.bboxMm.maxX).toBeLessThanOrEqual(x! + w! + 1e-6);
      expect(item.bboxMm.minY).toBeGreaterThanOrEqual(y! - 1e-6);
      expect(item.bboxMm.maxY).toBeLessThanOrEqual(y! + h! + 1e-6);
      // a name too long for its letter height is fitted to the full width, starting at the top
      expect(item.bboxMm.minX).toBeCloseTo(x!, 0);
      expect(item.bboxMm.maxX).toBeCloseTo(x! + w!, 0);
      expect(item.bboxMm.minY).toBeCloseTo(y!, 0);
    });
  }

  it('when a line snapshot (which keeps only the print size) is drawn, then the blank has the engine size of its kind and no guessed print area', () => {
    const tee = DEFAULT_BLANKS.find((b) => b.kind === 'kids_tee')!;
    const picture = pictureOfLineBlank({ kind: 'kids_tee' });
    expect([picture.widthMm, picture.heightMm]).toEqual([tee.widthMm, tee.heightMm]);
    const html = renderToStaticMarkup(createElement(DesignOnBlank, { blank: picture, size: 96, label: 'Preview' }));
    expect(attrs(html, 'rect').some((r) => r['stroke-dasharray'])).toBe(false);
    expect(html).toContain('width="96"');
  });

  it("when a size and a blank colour are chosen, then the drawing takes that size's print area (where compose puts the design) and is filled in that colour", () => {
    const size = { label: '4T', widthMm: 160, heightMm: 180, topOffsetMm: 45 };
    const blank = blankFor({ blank: { kind: 'kids_tee', label: 'Tee', widthMm: 200, heightMm: 200, topOffsetMm: 50 } }, size);
    const item = compose(
      reg,
      {
        blank,
        fields: [{ kind: 'text', id: 'name', fontId: 'baloo-bold', letterHeightMm: 60, maxLetterHeightMm: 120, maxChars: 14, materialKind: 'smooth', colour: '#1b2440' }],
        choices: { name: { text: 'Bartholomew' } },
      },
      { weeding: 'none' },
    );
    const html = renderToStaticMarkup(createElement(DesignOnBlank, { blank: pictureOfBlank(blank, '#8d8f91'), label: 'x' }));
    const area = attrs(html, 'rect').find((r) => r['stroke-dasharray'])!;
    expect([Number(area.width), Number(area.height), Number(area.y)]).toEqual([160, 180, 45]);
    expect(item.bboxMm.maxX - item.bboxMm.minX).toBeCloseTo(160, 0);
    expect(item.bboxMm.minX).toBeCloseTo(Number(area.x), 0);
    expect(attrs(html, 'path')[0]!.fill).toBe('#8d8f91');
    // a line snapshot keeps its colour too; an unusable value falls back to the plain cloth
    expect(renderToStaticMarkup(createElement(DesignOnBlank, { blank: pictureOfLineBlank({ kind: 'tote', colourHex: '#1f2a44' }) }))).toContain('fill="#1f2a44"');
    expect(renderToStaticMarkup(createElement(DesignOnBlank, { blank: pictureOfLineBlank({ kind: 'tote', colourHex: 'red;x' }) }))).not.toContain('red;x');
  });

  it('when no label is given, then the drawing is hidden from assistive technology; with one it is a named image', () => {
    const blank = pictureOfBlank(DEFAULT_BLANKS[0]!);
    expect(renderToStaticMarkup(createElement(DesignOnBlank, { blank }))).toContain('aria-hidden="true"');
    const named = renderToStaticMarkup(createElement(DesignOnBlank, { blank, label: 'Preview on the tote' }));
    expect(named).toContain('role="img"');
    expect(named).toContain('aria-label="Preview on the tote"');
  });
});

describe('LineStateBadge', () => {
  const classOf = (html: string) => /class="([^"]*)"/.exec(html)![1];
  it('when the same state is shown to a shopper and in the workroom, then both badges have the same colour', () => {
    for (const state of LINE_STATES) {
      const shopper = renderToStaticMarkup(createElement(LineStateBadge, { state }));
      const workroom = renderToStaticMarkup(createElement(LineStateBadge, { state, words: 'workroom' }));
      expect(classOf(workroom), state).toBe(classOf(shopper));
    }
  });

  it('when the steps of making an item are shown, then each has its own colour', () => {
    const steps = ['awaiting_proof', 'changes_requested', 'approved', 'cut', 'pressed', 'shipped'] as const;
    const classes = steps.map((state) => classOf(renderToStaticMarkup(createElement(LineStateBadge, { state }))));
    expect(new Set(classes).size).toBe(steps.length);
  });

  it('when a state is shown, then its words say it (colour is never the only signal)', () => {
    expect(renderToStaticMarkup(createElement(LineStateBadge, { state: 'cut' }))).toContain('Vinyl cut');
    expect(renderToStaticMarkup(createElement(LineStateBadge, { state: 'awaiting_proof', words: 'workroom' }))).toContain('awaiting proof');
  });
});
