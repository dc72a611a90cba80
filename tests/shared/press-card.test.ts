import { describe, expect, it } from 'vitest';
import { type PressCardInput, placementNote, pressCard } from '../../shared/engine/press-card.ts';
import { defaultPressProfile, MATERIAL_KINDS, type MaterialKind, PRESS_DEFAULT_SOURCES, PRESS_DEFAULTS, pressDefaultRow } from '../../shared/engine/press-defaults.ts';
import { cToF, fToC } from '../../shared/units.ts';

/**
 * The press defaults (DEVELOPERS.md, "Pressing": from memory, seller-editable), copied by hand. The smooth PU
 * row is marked "common practice" there (no published source); the others are "from memory".
 * No published source exists for HTV settings beyond makers' own instructions: the card must reproduce this table.
 */
const TRADE_TABLE: Record<MaterialKind, { handheld: [number, number]; clamshell: [number, number]; tackS: number; peel: string; topOnly: boolean; source: string }> = {
  smooth: { handheld: [157, 30], clamshell: [155, 10], tackS: 2, peel: 'hot', topOnly: false, source: 'common practice' },
  glitter: { handheld: [160, 30], clamshell: [160, 15], tackS: 5, peel: 'hot or cold', topOnly: true, source: 'from memory' },
  flock: { handheld: [160, 30], clamshell: [160, 15], tackS: 5, peel: 'hot', topOnly: true, source: 'from memory' },
  metallic: { handheld: [150, 25], clamshell: [150, 10], tackS: 2, peel: 'cold', topOnly: true, source: 'from memory' },
  patterned: { handheld: [155, 30], clamshell: [155, 10], tackS: 2, peel: 'warm', topOnly: true, source: 'from memory' },
};
/**
 * The cool-down before a warm or cold peel is not in that table: our own starting values (from
 * memory, seller-editable), none for a hot peel.
 */
const COOL_S: Record<MaterialKind, number> = { smooth: 0, glitter: 0, flock: 0, metallic: 30, patterned: 10 };

const tote = { kind: 'tote', name: 'Tote bag', topOffsetMm: 50 };
const layer = (layerId: string, materialKind: MaterialKind, colourName = 'Navy', profile?: PressCardInput['layers'][number]['profile']) => ({
  layerId,
  materialKind,
  colourName,
  ...(profile ? { profile } : {}),
});

describe('press defaults', () => {
  it('when read, then the defaults table is the hand-copied materials table row for row, with its source marks', () => {
    expect([...MATERIAL_KINDS].sort()).toEqual(Object.keys(TRADE_TABLE).sort());
    for (const kind of MATERIAL_KINDS) {
      const t = TRADE_TABLE[kind];
      expect(pressDefaultRow(kind)).toEqual({
        handheld: { tempC: t.handheld[0], timeS: t.handheld[1] },
        clamshell: { tempC: t.clamshell[0], timeS: t.clamshell[1] },
        tackS: t.tackS,
        peel: t.peel,
        topOnly: t.topOnly,
        coolS: COOL_S[kind],
        source: t.source,
      });
      expect(PRESS_DEFAULT_SOURCES[kind]).toBe(t.source);
    }
    // the older export still works and hands out copies
    const copy = defaultPressProfile('smooth');
    copy.tackS = 99;
    expect(PRESS_DEFAULTS.smooth.tackS).toBe(2);
  });
});

describe('pressCard', () => {
  for (const kind of MATERIAL_KINDS) {
    for (const pressType of ['handheld', 'clamshell'] as const) {
      it(`when one ${kind} layer is pressed on a ${pressType} press, then the final press is ${TRADE_TABLE[kind][pressType].join(' °C / ')} s, peel ${TRADE_TABLE[kind].peel} (${TRADE_TABLE[kind].source})`, () => {
        const card = pressCard({ pressType, layers: [layer('a', kind)], blank: tote });
        const [tempC, timeS] = TRADE_TABLE[kind][pressType];
        const final = card.steps.find((s) => s.kind === 'final_press')!;
        expect(final).toMatchObject({ tempC, timeS, peel: TRADE_TABLE[kind].peel, protectiveSheet: false });
        expect(card).toMatchObject({ tempC, finalTimeS: timeS, peel: TRADE_TABLE[kind].peel, warnings: [] });
        // °F from °C per NIST SP 811: t/°F = 1.8 · t/°C + 32
        expect(final.tempF).toBeCloseTo(tempC * 1.8 + 32, 12);
        expect(card.tempLabel).toBe(`${tempC} °C (${Math.round(tempC * 1.8 + 32)} °F)`);
      });
      it(`when ${kind} is a lower layer on a ${pressType} press, then it gets its own ${TRADE_TABLE[kind].tackS} s tack (${TRADE_TABLE[kind].source})`, () => {
        const card = pressCard({ pressType, layers: [layer('under', kind), layer('top', 'smooth', 'White')], blank: tote });
        const tacks = card.steps.filter((s) => s.kind === 'tack');
        expect(tacks).toHaveLength(1);
        expect(tacks[0]).toMatchObject({ layerId: 'under', timeS: TRADE_TABLE[kind].tackS, peel: TRADE_TABLE[kind].peel });
      });
    }
  }

  it('when temperatures are converted, then they follow NIST SP 811 (320 °F = 160 °C; 315 °F = 157.22 °C; 212 °F = 100 °C)', () => {
    expect(fToC(320)).toBe(160);
    expect(cToF(160)).toBe(320);
    expect(fToC(315)).toBeCloseTo(157.22, 2);
    expect(fToC(212)).toBe(100);
    const card = pressCard({ pressType: 'handheld', layers: [layer('g', 'glitter', 'Gold')], blank: tote });
    expect(card.tempF).toBe(320);
    // "157 °C (315 °F)" for smooth on a handheld press (common practice; 157 °C = 314.6 °F by NIST SP 811)
    expect(pressCard({ pressType: 'handheld', layers: [layer('s', 'smooth')], blank: tote }).tempLabel).toBe('157 °C (315 °F)');
  });

  it('when three layers are pressed, then the steps run pre-press, place/tack bottom → top, final press, back press, with the protective sheet from the first carrier peel on', () => {
    const card = pressCard({
      pressType: 'clamshell',
      layers: [layer('base', 'smooth', 'Navy'), layer('mid', 'smooth', 'White'), layer('top', 'glitter', 'Gold')],
      blank: tote,
      backPress: true,
    });
    expect(card.steps.map((s) => `${s.kind}${s.layerId ? ':' + s.layerId : ''}`)).toEqual([
      'pre_press',
      'place:base',
      'tack:base',
      'place:mid',
      'tack:mid',
      'place:top',
      'final_press:top',
      'back_press',
    ]);
    const pre = card.steps[0];
    expect(pre).toMatchObject({ timeS: 5, protectiveSheet: false }); // about 5 s (common practice)
    const byKind = (k: string) => card.steps.filter((s) => s.kind === k);
    expect(byKind('tack').map((s) => [s.timeS, s.protectiveSheet])).toEqual([
      [2, false],
      [2, true],
    ]);
    expect(byKind('final_press')[0]).toMatchObject({ timeS: 15, protectiveSheet: true, peel: 'hot or cold' }); // top layer's time
    expect(byKind('back_press')[0]).toMatchObject({ timeS: 15, protectiveSheet: true }); // about 15 s (common practice)
    expect(card.layers.map((l) => l.layerId)).toEqual(['base', 'mid', 'top']);
  });

  it('when a single layer is pressed, then no tack and no protective sheet until the carrier is off (back press)', () => {
    const card = pressCard({ pressType: 'handheld', layers: [layer('a', 'smooth')], blank: tote, backPress: true });
    expect(card.steps.filter((s) => s.kind === 'tack')).toEqual([]);
    expect(card.steps.find((s) => s.kind === 'final_press')!.protectiveSheet).toBe(false);
    expect(card.steps.find((s) => s.kind === 'back_press')!.protectiveSheet).toBe(true);
    expect(pressCard({ pressType: 'handheld', layers: [layer('a', 'smooth')], blank: tote }).steps.some((s) => s.kind === 'back_press')).toBe(false);
  });

  it("when layers' temperatures differ, then the card warns and presses at the lowest temperature every layer accepts", () => {
    // handheld: smooth 157 °C, glitter 160 °C — single values, so no common temperature
    const card = pressCard({ pressType: 'handheld', layers: [layer('s', 'smooth'), layer('g', 'glitter', 'Gold')], blank: tote });
    expect(card.warnings.map((w) => w.code)).toEqual(['temperatures_do_not_overlap']);
    expect(card.tempC).toBe(160);
    // with the seller's ranges they overlap on 157–160: the lowest shared value is 157 °C
    const ranged = pressCard({
      pressType: 'handheld',
      layers: [layer('s', 'smooth', 'Navy', { tempRangeC: { minC: 150, maxC: 165 } }), layer('g', 'glitter', 'Gold', { tempRangeC: { minC: 157, maxC: 165 } })],
      blank: tote,
    });
    expect(ranged.warnings).toEqual([]);
    expect(ranged.tempC).toBe(157);
    expect(ranged.steps.every((s) => s.tempC === undefined || s.tempC === 157)).toBe(true);
    // same kind, same temperature: no warning
    expect(pressCard({ pressType: 'clamshell', layers: [layer('a', 'smooth'), layer('b', 'smooth', 'Red')], blank: tote }).warnings).toEqual([]);
  });

  it('when the geometry is unknown and a top-only material is not last, then the card warns naming it and what covers it', () => {
    const card = pressCard({ pressType: 'clamshell', layers: [layer('g', 'glitter', 'Gold'), layer('s', 'smooth', 'Navy', { clamshell: { tempC: 160 } })], blank: tote });
    const w = card.warnings.find((x) => x.code === 'top_only_covered')!;
    expect(w.layerIds).toEqual(['g', 's']);
    expect(w.message).toMatch(/Gold glitter/);
    expect(card.warnings.some((x) => x.code === 'temperatures_do_not_overlap')).toBe(false);
  });

  it('when there are more than 4 layers, then the card warns; 4 is fine', () => {
    const four = ['a', 'b', 'c', 'd'].map((id) => layer(id, 'smooth'));
    expect(pressCard({ pressType: 'handheld', layers: four, blank: tote }).warnings).toEqual([]);
    const five = pressCard({ pressType: 'handheld', layers: [...four, layer('e', 'smooth')], blank: tote });
    expect(five.warnings.map((w) => w.code)).toEqual(['too_many_layers']);
    expect(five.steps.filter((s) => s.kind === 'tack')).toHaveLength(4);
  });

  it("when the seller's profile or final time overrides the table, then the card uses them", () => {
    const card = pressCard({
      pressType: 'handheld',
      layers: [layer('a', 'smooth', 'Navy', { handheld: { tempC: 150, timeS: 20 }, tackS: 3, peel: 'cold' }), layer('b', 'smooth', 'Red', { handheld: { tempC: 150, timeS: 20 } })],
      blank: tote,
    });
    expect(card.tempC).toBe(150);
    expect(card.finalTimeS).toBe(20);
    expect(card.steps.find((s) => s.kind === 'tack')).toMatchObject({ timeS: 3, peel: 'cold' });
    expect(pressCard({ pressType: 'handheld', layers: [layer('a', 'smooth')], blank: tote, finalTimeS: 25 }).finalTimeS).toBe(25);
  });

  it('when the input is bad, then it is refused', () => {
    expect(() => pressCard({ pressType: 'handheld', layers: [], blank: tote })).toThrow();
    expect(() => pressCard({ pressType: 'iron' as 'handheld', layers: [layer('a', 'smooth')], blank: tote })).toThrow();
    expect(() => pressCard({ pressType: 'handheld', layers: [layer('a', 'vinyl' as MaterialKind)], blank: tote })).toThrow();
  });
});

describe('placementNote', () => {
  it('when the blank is a tote, then the design is centred, its top offset given in cm and in, and kept off the bottom (common practice)', () => {
    const note = placementNote(tote);
    expect(note).toMatch(/Centre the design horizontally/);
    expect(note).toContain('5.0 cm (2.0 in) below the top edge');
    expect(note).toMatch(/upper half/);
  });
  it('when the blank is a tee, then the offset is from the collar and there is no tote rule', () => {
    const note = placementNote({ kind: 'kids_tee', topOffsetMm: 50 });
    expect(note).toContain('below the collar');
    expect(note).not.toMatch(/upper half/);
  });
});
