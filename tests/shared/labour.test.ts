// Weeding labour from the work itself. The shapes are squares, so the counts and the length of cut
// line are plain arithmetic (perimeter of a w × h rectangle = 2w + 2h), checked beside each value.
import { describe, expect, it } from 'vitest';
import { labourExact } from '../../shared/business/costs.ts';
import { DEFAULT_WEEDING_RATES, weedingMinutes, weedingWork } from '../../shared/business/labour.ts';

// a 20 × 20 mm square with a 10 × 10 mm counter (wound the other way), and a 2 × 2 mm square apart
const frame = 'M0 0H20V20H0Z M5 5V15H15V5Z';
const speck = 'M30 0H32V2H30Z';

describe('weedingWork', () => {
  it('when a piece has a counter and a tiny piece lies apart, then 2 pieces, 1 counter, 1 small part and 80 + 40 + 8 mm of cut line', () => {
    const w = weedingWork([frame, speck]);
    expect(w.pieces).toBe(2);
    expect(w.counters).toBe(1);
    expect(w.smallParts).toBe(1); // the 2 × 2 = 4 mm² square, under 10 mm²; the 100 mm² counter is not small
    expect(w.cutLengthMm).toBeCloseTo(4 * 20 + 4 * 10 + 4 * 2, 6);
  });
  it('when two contours of one piece overlap (as font outlines do), then the blade cuts their outer outline once', () => {
    // two 10 × 10 squares overlapping by 5 mm: one piece, outline 15 × 10 → 50 mm
    const w = weedingWork(['M0 0H10V10H0Z M5 0H15V10H5Z']);
    expect(w).toMatchObject({ pieces: 1, counters: 0, smallParts: 0 });
    expect(w.cutLengthMm).toBeCloseTo(2 * 15 + 2 * 10, 6);
  });
});

describe('weedingMinutes', () => {
  it('when the default rates are used, then seconds = pieces × 4 + counters × 3 + small parts × 15 + metres × 40, per item', () => {
    const w = weedingWork([frame, speck]);
    const seconds = 2 * 4 + 1 * 3 + 1 * 15 + 0.128 * 40;
    expect(DEFAULT_WEEDING_RATES).toEqual({ secondsPerPiece: 4, secondsPerCounter: 3, secondsPerSmallPart: 15, secondsPerMetre: 40 });
    expect(weedingMinutes(w, 3)).toBeCloseTo((seconds * 3) / 60, 9);
  });
  it('when the seller sets slower rates, then the minutes follow them, and labour is minutes × the hourly rate', () => {
    const w = weedingWork([frame]);
    const minutes = weedingMinutes(w, 1, { secondsPerPiece: 60, secondsPerCounter: 60, secondsPerSmallPart: 0, secondsPerMetre: 0 });
    expect(minutes).toBe(2); // one piece and one counter at a minute each
    expect(labourExact(minutes, 1800)).toBe(60); // 2 min at 18.00/h = 0.60
    expect(weedingMinutes(w, 1, { secondsPerPiece: 0, secondsPerCounter: 0, secondsPerSmallPart: 0, secondsPerMetre: 0 })).toBe(0);
  });
});
