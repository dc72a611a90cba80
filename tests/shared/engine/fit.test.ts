import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { fitText, textWarnings } from '../../../shared/engine/fit.ts';
import { FONT_IDS } from '../../../shared/engine/font-catalog.ts';
import { testRegistry } from './font-fixture.ts';

const reg = testRegistry();
const codes = (ws: { code: string }[]) => ws.map((w) => w.code);

describe('fit to the blank', () => {
  it('when a long name is wider than the print area, then it shrinks to fit and is flagged below the minimum height', () => {
    const f = fitText(reg, { text: 'Bartholomew-Alexander', fontId: 'dancing-script-bold', letterHeightMm: 60 }, { maxWidthMm: 120, maxHeightMm: 100 });
    expect(f.layout.widthMm).toBeLessThanOrEqual(120);
    expect(f.layout.widthMm).toBeGreaterThan(119.5); // as large as fits, not smaller
    expect(f.letterHeightMm).toBeLessThan(12);
    expect(codes(f.warnings)).toEqual(expect.arrayContaining(['below_min_letter_height', 'too_long']));
  });
  it('when a short name fits, then it keeps the chosen size (never scaled up)', () => {
    const f = fitText(reg, { text: 'Kai', fontId: 'baloo-bold', letterHeightMm: 40 }, { maxWidthMm: 250, maxHeightMm: 250 });
    expect(f.letterHeightMm).toBe(40);
    expect(f.scale).toBe(1);
    expect(f.warnings).toEqual([]);
  });
  it('when text has extra spaces, mixed case, missing letters or too many characters, then each is flagged', () => {
    expect(codes(textWarnings(' Mira'))).toContain('extra_spaces');
    expect(codes(textWarnings('Mira  Leon'))).toContain('extra_spaces');
    expect(codes(textWarnings('mIRA'))).toContain('mixed_case');
    expect(codes(textWarnings('Mira'))).toEqual([]);
    expect(codes(textWarnings('MIRA'))).toEqual([]);
    const m = fitText(reg, { text: 'Misaki 美咲', fontId: 'bangers', letterHeightMm: 20 }, { maxWidthMm: 250, maxHeightMm: 250 });
    const w = m.warnings.find((x) => x.code === 'missing_characters')!;
    expect(w.characters).toEqual(['美', '咲']);
    const long = fitText(reg, { text: 'Bartholomew', fontId: 'bangers', letterHeightMm: 20 }, { maxWidthMm: 250, maxHeightMm: 250, maxChars: 8 });
    expect(codes(long.warnings)).toContain('too_long');
  });
  it('when fitting any text, font and area, then the fitted width never exceeds the area and height never grows (fast-check)', () => {
    fc.assert(
      fc.property(
        fc.constantFrom(...FONT_IDS),
        fc.stringMatching(/^[A-Za-zÀ-ÿ]{1,20}$/),
        fc.double({ min: 5, max: 300, noNaN: true }),
        fc.double({ min: 20, max: 400, noNaN: true }),
        (fontId, text, h, w) => {
          const f = fitText(reg, { text, fontId, letterHeightMm: h }, { maxWidthMm: w, maxHeightMm: 300 });
          return f.layout.widthMm <= w && f.letterHeightMm <= h;
        },
      ),
      { numRuns: 150 },
    );
  });
});
