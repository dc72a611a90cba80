// Press order from the design's geometry: which layers overlap (Clipper intersection), how they
// group into press steps, and what the press card makes of it. Shapes are axis-aligned rectangles,
// so every overlap area is checked against plain arithmetic (width × height of the shared box).
import { describe, expect, it } from 'vitest';
import { intersectionArea } from '../../shared/engine/geometry.ts';
import { pressCard } from '../../shared/engine/press-card.ts';
import type { MaterialKind } from '../../shared/engine/press-defaults.ts';
import { layerOverlaps, pressOrder } from '../../shared/engine/press-order.ts';

const rect = (x: number, y: number, w: number, h: number) => `M${x} ${y}H${x + w}V${y + h}H${x}Z`;
const poly = (x: number, y: number, w: number, h: number) => [x, y, x + w, y, x + w, y + h, x, y + h];
const tote = { kind: 'tote', name: 'Tote bag', topOffsetMm: 50 };
const layer = (layerId: string, materialKind: MaterialKind, colourName = 'Navy') => ({ layerId, materialKind, colourName });

describe('intersectionArea', () => {
  it('when two rectangles overlap, then the area is the shared box (20 × 10 = 200 mm²); touching edges give 0', () => {
    // [0,40]×[0,30] and [20,60]×[20,50] share [20,40]×[20,30]: 20 mm × 10 mm
    expect(intersectionArea([poly(0, 0, 40, 30)], [poly(20, 20, 40, 30)])).toBeCloseTo(200, 6);
    expect(intersectionArea([poly(0, 0, 40, 30)], [poly(40, 0, 10, 30)])).toBe(0);
  });
});

describe('layerOverlaps', () => {
  it('when a name sits under a motif with a patch on the motif, then only the motif and its patch overlap', () => {
    const pairs = layerOverlaps([
      { layerId: 'body', paths: [rect(10, 10, 60, 60)] },
      { layerId: 'patch', paths: [rect(30, 30, 10, 10)] },
      { layerId: 'name', paths: [rect(0, 90, 80, 25), rect(90, 90, 20, 25)] },
    ]);
    expect(pairs).toEqual([['body', 'patch']]);
  });
  it('when two layers only touch, or overlap by less than 1 mm², then they do not overlap', () => {
    expect(
      layerOverlaps([
        { layerId: 'a', paths: [rect(0, 0, 10, 10)] },
        { layerId: 'b', paths: [rect(10, 0, 10, 10)] },
      ]),
    ).toEqual([]);
    // 0.5 mm × 1 mm = 0.5 mm² of shared vinyl: below the 1 mm² noise floor
    expect(
      layerOverlaps([
        { layerId: 'a', paths: [rect(0, 0, 10, 10)] },
        { layerId: 'b', paths: [rect(9.5, 9, 10, 10)] },
      ]),
    ).toEqual([]);
  });
});

describe('pressOrder', () => {
  it('when no layers overlap, then all go in one step', () => {
    expect(
      pressOrder(
        [
          { layerId: 'a', topOnly: false },
          { layerId: 'b', topOnly: true },
          { layerId: 'c', topOnly: false },
        ],
        [],
      ),
    ).toEqual({ groups: [['a', 'b', 'c']], conflicts: [] });
  });
  it('when a chain overlaps, then it goes bottom to top, and a layer nothing covers waits for the last step', () => {
    const order = pressOrder(
      [
        { layerId: 'body', topOnly: false },
        { layerId: 'name', topOnly: false },
        { layerId: 'patch', topOnly: false },
        { layerId: 'eye', topOnly: true },
      ],
      [
        ['body', 'patch'],
        ['patch', 'eye'],
      ],
    );
    expect(order.groups).toEqual([['body'], ['patch'], ['name', 'eye']]);
    expect(order.conflicts).toEqual([]);
  });
  it('when the design puts a layer over a top-only one where they overlap, then no order works and it says which', () => {
    const order = pressOrder(
      [
        { layerId: 'glitter', topOnly: true },
        { layerId: 'navy', topOnly: false },
      ],
      [['glitter', 'navy']],
    );
    expect(order.conflicts).toEqual([{ layerId: 'glitter', coveredBy: ['navy'] }]);
  });
  it('when the geometry is unknown, then every layer gets its own step in the given order', () => {
    expect(
      pressOrder(
        [
          { layerId: 'a', topOnly: false },
          { layerId: 'b', topOnly: false },
          { layerId: 'c', topOnly: false },
        ],
        null,
      ).groups,
    ).toEqual([['a'], ['b'], ['c']]);
  });
});

describe('pressCard with the geometry', () => {
  it('when glitter is listed first but overlaps nothing, then it is pressed with the rest in the final press and there is no order warning', () => {
    const layers = [layer('g', 'glitter', 'Gold'), layer('s', 'smooth')];
    const overlaps = layerOverlaps([
      { layerId: 'g', paths: [rect(0, 0, 30, 30)] },
      { layerId: 's', paths: [rect(0, 50, 30, 30)] },
    ]);
    const card = pressCard({ pressType: 'clamshell', layers, overlaps, blank: tote });
    // (glitter 160 °C and smooth 155 °C still differ: that warning is about heat, not order)
    expect(card.warnings.map((w) => w.code)).toEqual(['temperatures_do_not_overlap']);
    expect(card.groups).toEqual([['g', 's']]);
    expect(card.steps.map((s) => s.kind)).toEqual(['pre_press', 'place', 'final_press']);
    expect(card.steps[1]!.layerIds).toEqual(['g', 's']);
    // the final time is the longest of the two (glitter 15 s, smooth 10 s on a clamshell, from the tables)
    expect(card.finalTimeS).toBe(15);
  });
  it('when smooth covers glitter where they overlap, then the card says no order works, naming both, before anything is cut', () => {
    const layers = [layer('g', 'glitter', 'Gold'), layer('s', 'smooth')];
    const overlaps = layerOverlaps([
      { layerId: 'g', paths: [rect(0, 0, 30, 30)] },
      { layerId: 's', paths: [rect(10, 10, 30, 30)] },
    ]);
    const card = pressCard({ pressType: 'clamshell', layers, overlaps, blank: tote });
    const w = card.warnings.find((x) => x.code === 'top_only_covered')!;
    expect(w.layerIds).toEqual(['g', 's']);
    expect(w.message).toMatch(/Gold glitter must stay on top.*Navy smooth over it/);
  });
  it('when smooth lies under glitter, then smooth is tacked first, its carrier peeled, and glitter gets the final press under a protective sheet', () => {
    const card = pressCard({ pressType: 'handheld', layers: [layer('s', 'smooth'), layer('g', 'glitter', 'Gold')], overlaps: [['s', 'g']], blank: tote });
    expect(card.steps.map((s) => s.kind)).toEqual(['pre_press', 'place', 'tack', 'place', 'final_press']);
    expect(card.steps[2]).toMatchObject({ timeS: 2, peel: 'hot', protectiveSheet: false });
    expect(card.steps[4]).toMatchObject({ protectiveSheet: true, layerIds: ['g'] });
  });
  it('when metallic (cold peel) and smooth (hot peel) are pressed together, then the peel is cold after the cool-down from the table', () => {
    const card = pressCard({ pressType: 'clamshell', layers: [layer('m', 'metallic', 'Silver'), layer('s', 'smooth')], overlaps: [], blank: tote });
    const final = card.steps.at(-1)!;
    expect(final).toMatchObject({ kind: 'final_press', peel: 'cold', coolS: 30 });
    expect(final.text).toContain('let it cool 30 s, then peel cold');
  });
});
