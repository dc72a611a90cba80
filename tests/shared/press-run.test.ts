// The press run's step order for each mix of materials, from the press card. Expected times are
// the press tables' values (smooth: common practice; the other kinds from memory, seller-editable),
// written out by hand: pre-press 5 s, tack smooth 2 s, clamshell final smooth 10 s / glitter and
// flock 15 s, handheld final 30 s (metallic 25 s), back press 15 s; peel smooth hot, glitter hot
// or cold, flock hot, metallic cold after 30 s, patterned warm after 10 s.
import { describe, expect, it } from 'vitest';
import { pressCard } from '../../shared/engine/press-card.ts';
import type { MaterialKind } from '../../shared/engine/press-defaults.ts';
import { pressRunSteps } from '../../shared/engine/press-run.ts';

const tote = { kind: 'tote', name: 'Tote bag', topOffsetMm: 50 };
const layer = (layerId: string, materialKind: MaterialKind, colourName = 'Navy') => ({ layerId, materialKind, colourName });
const run = (input: Parameters<typeof pressCard>[0]) => pressRunSteps(pressCard(input)).map((s) => [s.kind, s.timerS]);

describe('pressRunSteps', () => {
  it('when one smooth layer goes on a clamshell press, then: pre-press 5 s, place, final 10 s, peel hot', () => {
    expect(run({ pressType: 'clamshell', layers: [layer('a', 'smooth')], overlaps: [], blank: tote })).toEqual([
      ['pre_press', 5],
      ['place', null],
      ['final_press', 10],
      ['peel', null],
    ]);
  });

  it('when two smooth layers overlap on a handheld press, then the bottom one is tacked 2 s and peeled hot before the top one goes on', () => {
    expect(run({ pressType: 'handheld', layers: [layer('a', 'smooth'), layer('b', 'smooth', 'Red')], overlaps: [['a', 'b']], blank: tote })).toEqual([
      ['pre_press', 5],
      ['place', null],
      ['tack', 2],
      ['peel', null],
      ['place', null],
      ['final_press', 30],
      ['peel', null],
    ]);
  });

  it('when smooth and metallic lie side by side on a clamshell press, then both go down in one step and the cold peel waits a 30 s cool-down', () => {
    const steps = pressRunSteps(pressCard({ pressType: 'clamshell', layers: [layer('s', 'smooth'), layer('m', 'metallic', 'Silver')], overlaps: [], blank: tote }));
    expect(steps.map((s) => [s.kind, s.timerS])).toEqual([
      ['pre_press', 5],
      ['place', null],
      ['final_press', 10],
      ['cool', 30],
      ['peel', null],
    ]);
    expect(steps[1]!.layerIds).toEqual(['s', 'm']);
    expect(steps.at(-1)!.title).toBe('Peel cold');
  });

  it('when patterned lies over smooth on a handheld press, then smooth is tacked, patterned gets the final 30 s, a 10 s cool-down and a warm peel, under a protective sheet', () => {
    const steps = pressRunSteps(pressCard({ pressType: 'handheld', layers: [layer('s', 'smooth'), layer('p', 'patterned', 'Stars')], overlaps: [['s', 'p']], blank: tote }));
    expect(steps.map((s) => [s.kind, s.timerS])).toEqual([
      ['pre_press', 5],
      ['place', null],
      ['tack', 2],
      ['peel', null],
      ['place', null],
      ['final_press', 30],
      ['cool', 10],
      ['peel', null],
    ]);
    expect(steps[5]!.protectiveSheet).toBe(true);
    expect(steps[2]!.tempLabel).toBe('157 °C (315 °F)');
  });

  it('when glitter and flock sit apart and the shop presses from the back, then one final 15 s press, a hot peel (glitter takes either) and a 15 s back press', () => {
    expect(run({ pressType: 'clamshell', layers: [layer('g', 'glitter', 'Gold'), layer('f', 'flock', 'Pine')], overlaps: [], blank: tote, backPress: true })).toEqual([
      ['pre_press', 5],
      ['place', null],
      ['final_press', 15],
      ['peel', null],
      ['back_press', 15],
    ]);
  });

  it("when the seller's press table says otherwise, then the run follows it (tack 7 s, cool 12 s)", () => {
    const steps = run({
      pressType: 'clamshell',
      layers: [{ ...layer('a', 'smooth'), profile: { tackS: 7, peel: 'warm', coolS: 12 } }, layer('b', 'smooth', 'Red')],
      overlaps: [['a', 'b']],
      blank: tote,
    });
    expect(steps.slice(0, 5)).toEqual([
      ['pre_press', 5],
      ['place', null],
      ['tack', 7],
      ['cool', 12],
      ['peel', null],
    ]);
  });
});
