/**
 * Labour from the work itself: the minutes a line's weeding takes, estimated from its cut pieces —
 * the separate pieces of vinyl (each weeded around), the counters inside them (each picked out),
 * the small parts (pieces or counters under SMALL_PART_MM2, slow and easy to lose) and the total
 * length of cut line — at the shop's rates. Few, large pieces are quick; many small pieces and tiny
 * counters are slow (common practice). The default rates are our own starting values (no published
 * source); each shop sets its own in Business settings. Pure.
 */
import { z } from 'zod';
import { polygonAreaAbs, unionRegions } from '../engine/geometry.ts';
import { flattenPath, type Polygon, parsePathData } from '../engine/path.ts';

/** A piece or counter smaller than this (mm²) counts as a small part (the weeding report's own "small piece" mark). */
export const SMALL_PART_MM2 = 10;

export const weedingRatesSchema = z.object({
  secondsPerPiece: z.number({ error: 'Enter seconds.' }).min(0, 'Cannot be negative.').max(600, 'At most 600 s.'),
  secondsPerCounter: z.number({ error: 'Enter seconds.' }).min(0, 'Cannot be negative.').max(600, 'At most 600 s.'),
  secondsPerSmallPart: z.number({ error: 'Enter seconds.' }).min(0, 'Cannot be negative.').max(600, 'At most 600 s.'),
  secondsPerMetre: z.number({ error: 'Enter seconds.' }).min(0, 'Cannot be negative.').max(3600, 'At most 3,600 s.'),
});
export type WeedingRates = z.infer<typeof weedingRatesSchema>;

/** Our own starting values (no published source); a shop overrides them. */
export const DEFAULT_WEEDING_RATES: Readonly<WeedingRates> = Object.freeze({ secondsPerPiece: 4, secondsPerCounter: 3, secondsPerSmallPart: 15, secondsPerMetre: 40 });

export type WeedingWork = { pieces: number; counters: number; smallParts: number; cutLengthMm: number };

const perimeter = (p: Polygon): number => {
  let s = 0;
  for (let i = 0; i < p.length; i += 2) {
    const j = (i + 2) % p.length;
    s += Math.hypot(p[j]! - p[i]!, p[j + 1]! - p[i + 1]!);
  }
  return s;
};

/** The weeding work in one item's cut pieces (path data, nonzero fill; overlapping contours merged as the blade cuts them). */
export function weedingWork(paths: readonly string[]): WeedingWork {
  const work: WeedingWork = { pieces: 0, counters: 0, smallParts: 0, cutLengthMm: 0 };
  for (const d of paths) {
    for (const r of unionRegions(flattenPath(parsePathData(d), 0.1), 'nonzero')) {
      work.pieces++;
      work.cutLengthMm += perimeter(r.outer);
      if (polygonAreaAbs(r.outer) < SMALL_PART_MM2) work.smallParts++;
      for (const h of r.holes) {
        work.counters++;
        work.cutLengthMm += perimeter(h);
        if (polygonAreaAbs(h) < SMALL_PART_MM2) work.smallParts++;
      }
    }
  }
  return work;
}

/** Minutes of weeding for `quantity` items of this work at these rates (exact, not rounded). */
export function weedingMinutes(work: WeedingWork, quantity: number, rates: WeedingRates = DEFAULT_WEEDING_RATES): number {
  const seconds = work.pieces * rates.secondsPerPiece + work.counters * rates.secondsPerCounter + work.smallParts * rates.secondsPerSmallPart + (work.cutLengthMm / 1000) * rates.secondsPerMetre;
  return (seconds * quantity) / 60;
}
