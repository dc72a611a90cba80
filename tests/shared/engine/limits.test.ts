// The engine refuses out-of-bounds input on its own (defence in depth: the routes check first).
import { describe, expect, it } from 'vitest';
import { defaultBlank } from '../../../shared/engine/blanks.ts';
import { compose } from '../../../shared/engine/compose.ts';
import { nestCutSheets } from '../../../shared/engine/cut-sheets.ts';
import {
  LimitError,
  MAX_COORDINATE_MM,
  MAX_FLATTENED_POINTS,
  MAX_LETTER_HEIGHT_MM,
  MAX_NEST_PIECES,
  MAX_SEGMENTS_PER_CURVE,
  MAX_TEXT_CHARS,
  MOTIF_MAX_DEPTH,
  MOTIF_MAX_PATH_COMMANDS,
} from '../../../shared/engine/limits.ts';
import { MotifError, type MotifGeometry, parseMotifSvg } from '../../../shared/engine/motif.ts';
import { flattenPath, parsePathData } from '../../../shared/engine/path.ts';
import { layoutText } from '../../../shared/engine/text-layout.ts';
import { testRegistry } from './font-fixture.ts';

const svg = (body: string) => `<svg xmlns="http://www.w3.org/2000/svg" width="100mm" height="100mm" viewBox="0 0 100 100">${body}</svg>`;
const refusal = (f: () => unknown): unknown => {
  try {
    f();
  } catch (e) {
    return e;
  }
  throw new Error('expected a refusal');
};

describe('motif bounds in the engine', () => {
  it.each([
    ['a control point at 1e13', '<path d="M0 0 C 1e13 0 10 10 0 10 Z"/>'],
    ['an infinite coordinate (1e999)', '<path d="M0 0 L 1e999 0 L 0 10 Z"/>'],
    ['a plain square under scale(1e12)', '<g transform="scale(1e12)"><rect width="10" height="10"/></g>'],
    ['a square moved 30 m away by nested translates', '<g transform="translate(20000 0)"><g transform="translate(10000 0)"><rect width="10" height="10"/></g></g>'],
  ])('when a motif has %s, then parseMotifSvg refuses it as out of range', (_label, body) => {
    const e = refusal(() => parseMotifSvg(svg(body)));
    expect(e).toBeInstanceOf(MotifError);
    expect((e as MotifError).code).toBe('out_of_range');
    expect((e as MotifError).message).toMatch(/20,000 mm/);
  });

  it('when a motif sits near the edge of the limit but within it, then it is accepted (the bound is where it says)', () => {
    // 1 px = 25.4/96 mm: 70,000 px ≈ 18,521 mm, inside 20,000 mm
    const g = parseMotifSvg(`<svg xmlns="http://www.w3.org/2000/svg" width="100mm" height="100mm"><rect x="70000" width="10" height="10"/></svg>`);
    expect(g.layers[0]!.bboxMm.maxX).toBeLessThan(MAX_COORDINATE_MM);
  });

  it('when groups nest one deeper than the limit, then refused; at the limit, accepted', () => {
    const nested = (n: number) => svg(`${'<g>'.repeat(n)}<rect width="10" height="10"/>${'</g>'.repeat(n)}`);
    expect(parseMotifSvg(nested(MOTIF_MAX_DEPTH)).layers).toHaveLength(1);
    const e = refusal(() => parseMotifSvg(nested(MOTIF_MAX_DEPTH + 1)));
    expect((e as MotifError).code).toBe('too_deep');
  });

  it('when a path has one command more than the limit, then refused; at the limit, accepted', () => {
    // "M0 0" is one command, each " L1 1" one more, "Z" the last: n commands in all
    const path = (n: number) => svg(`<path d="M0 0${' L50 50 L0 50'.repeat((n - 2) / 2)} Z"/>`);
    expect(parseMotifSvg(path(MOTIF_MAX_PATH_COMMANDS)).layers.length).toBeGreaterThan(0);
    const e = refusal(() => parseMotifSvg(path(MOTIF_MAX_PATH_COMMANDS + 2)));
    expect((e as MotifError).code).toBe('too_many_commands');
  });
});

describe('flattening bounds', () => {
  it('when a point lies beyond the coordinate limit, then flattenPath throws a LimitError naming it', () => {
    const e = refusal(() => flattenPath(parsePathData(`M0 0 C ${MAX_COORDINATE_MM * 10} 0 10 10 0 10 Z`)));
    expect(e).toBeInstanceOf(LimitError);
    expect((e as LimitError).limit).toBe('MAX_COORDINATE_MM');
  });

  it('when one curve would need more chords than the cap, then it gets exactly the cap', () => {
    // Wang's formula asks for about sqrt(0.75 · 60,000 / 0.001) ≈ 6,700 chords here
    const [poly] = flattenPath(parsePathData('M0 0 C 19000 0 -19000 19000 0 19000'), 0.001);
    expect(poly!.length / 2).toBe(1 + MAX_SEGMENTS_PER_CURVE);
  });

  it('when a path would flatten into more points than the budget, then a LimitError', () => {
    const curves = Math.ceil(MAX_FLATTENED_POINTS / MAX_SEGMENTS_PER_CURVE) + 1;
    const d = `M0 0${' C 19000 0 -19000 19000 0 19000 C -19000 19000 19000 0 0 0'.repeat(Math.ceil(curves / 2))}`;
    const e = refusal(() => flattenPath(parsePathData(d), 0.001));
    expect((e as LimitError).limit).toBe('MAX_FLATTENED_POINTS');
  });
});

describe('text, nesting and compose bounds', () => {
  const reg = testRegistry();
  it('when the text or letter height is over its limit, then layoutText refuses; at the limit it lays out', () => {
    expect(layoutText(reg, { text: 'A'.repeat(MAX_TEXT_CHARS), fontId: 'baloo-bold', letterHeightMm: MAX_LETTER_HEIGHT_MM }).widthMm).toBeGreaterThan(0);
    expect((refusal(() => layoutText(reg, { text: 'A'.repeat(MAX_TEXT_CHARS + 1), fontId: 'baloo-bold', letterHeightMm: 40 })) as LimitError).limit).toBe('MAX_TEXT_CHARS');
    expect((refusal(() => layoutText(reg, { text: 'Ava', fontId: 'baloo-bold', letterHeightMm: MAX_LETTER_HEIGHT_MM + 1 })) as LimitError).limit).toBe('MAX_LETTER_HEIGHT_MM');
  });

  it('when more pieces than the limit are nested, then nestCutSheets refuses before reading them', () => {
    const piece = { id: 'p', lineId: 'l', layerId: 'x', widthMm: 10, heightMm: 10, areaMm2: 100, path: 'M0 0H10V10H0Z' };
    const e = refusal(() => nestCutSheets({ rollWidthMm: 300, pieces: Array.from({ length: MAX_NEST_PIECES + 1 }, (_, i) => ({ ...piece, id: `p${i}` })) }));
    expect((e as LimitError).limit).toBe('MAX_NEST_PIECES');
  });

  it('when a stored motif (tampered) lies beyond the coordinate limit, then compose refuses it', () => {
    const far: MotifGeometry = {
      widthMm: 10,
      heightMm: 10,
      dropped: [],
      layers: [{ id: 'a', colour: '#000000', path: 'M0 0L1e13 0L0 10Z', bboxMm: { minX: 0, minY: 0, maxX: 1e13, maxY: 10 }, areaMm2: 1 }],
    };
    const e = refusal(() =>
      compose(reg, {
        blank: defaultBlank('tote')!,
        fields: [{ kind: 'motif', id: 'm', heightMm: 60, materialKind: 'smooth', options: [{ id: 'far', geometry: far }] }],
        choices: { m: { motifId: 'far' } },
      }),
    );
    expect((e as LimitError).limit).toBe('MAX_COORDINATE_MM');
  });
});
