import { describe, expect, it } from 'vitest';
import { MotifError, parseMotifSvg, renderMotifSvg } from '../../../shared/engine/motif.ts';
import { at } from '../../support/at.ts';

// 1in across 96 user units: one user unit is one CSS px (25.4/96 mm)
const svg = (inner: string, root = 'width="1in" height="1in" viewBox="0 0 96 96"') => `<svg xmlns="http://www.w3.org/2000/svg" ${root}>${inner}</svg>`;
const refusal = (f: () => unknown): string => {
  try {
    f();
  } catch (e) {
    if (e instanceof MotifError) return e.code;
    throw e;
  }
  return 'accepted';
};

describe('motif units (W3C CSS Values: 1in = 96px = 25.4 mm)', () => {
  it('when an outer svg is width="12in", then it is 304.8 mm wide and one user unit is 12in / viewBox width', () => {
    const m = parseMotifSvg(svg('<rect x="0" y="0" width="1200" height="10"/>', 'width="12in" height="1.2in" viewBox="0 0 1200 120"'));
    expect(m.widthMm).toBeCloseTo(304.8, 9);
    expect(at(m.layers, 0).bboxMm.maxX - at(m.layers, 0).bboxMm.minX).toBeCloseTo(304.8, 3);
  });
  it('when sizes are bare numbers, then they are px at 96 per inch, and a 90 px/in reading would be 6.67 % off', () => {
    const m = parseMotifSvg(svg('<rect width="96" height="96"/>', 'width="96" height="96"'));
    const w = at(m.layers, 0).bboxMm.maxX - at(m.layers, 0).bboxMm.minX;
    expect(w).toBeCloseTo(25.4, 3);
    // SVG 1.1 §7.10's old example assumed 90 px/in: 96 px would read as 27.093 mm. Our result must not.
    const at90 = (96 / 90) * 25.4;
    expect(Math.abs(w - at90)).toBeGreaterThan(1.5);
    expect(w / 25.4).not.toBeCloseTo(96 / 90, 3);
  });
  it('when only a viewBox is given, then user units are CSS px (25.4/96 mm)', () => {
    const m = parseMotifSvg(svg('<rect width="192" height="10"/>', 'viewBox="0 0 192 96"'));
    expect(m.widthMm).toBeCloseTo(50.8, 9);
  });
});

describe('motif geometry', () => {
  it('when a circle of r = ½ in is read, then its layer area is within 0.1 % of πr²', () => {
    const m = parseMotifSvg(svg('<circle cx="48" cy="48" r="48" fill="#e0a526"/>'));
    const r = 12.7;
    expect(Math.abs(at(m.layers, 0).areaMm2 - Math.PI * r * r) / (Math.PI * r * r)).toBeLessThan(0.001);
    expect(at(m.layers, 0).colour).toBe('#e0a526');
  });
  it('when groups carry ids or data-layer, then they become layers in document order; loose shapes group by fill', () => {
    const m = parseMotifSvg(
      svg(`
      <g id="pumpkin" fill="#e07a26"><ellipse cx="48" cy="60" rx="40" ry="30"/><rect x="10" y="50" width="10" height="10"/></g>
      <g data-layer="stem" fill="green"><polygon points="44,20 52,20 50,32 46,32"/></g>
      <path d="M0 0h10v10h-10z" fill="#fff"/><polyline points="80,0 90,0 90,10" fill="#ffffff"/>
      <line x1="0" y1="90" x2="20" y2="90" stroke="black"/>`),
    );
    expect(m.layers.map((l) => l.id)).toEqual(['pumpkin', 'stem', 'fill-ffffff', 'fill-000000']);
    expect(at(m.layers, 1).colour).toBe('#008000');
    // rect inside the ellipse overlaps it: the union counts the overlap once
    const pumpkin = at(m.layers, 0).areaMm2;
    const ellipse = Math.PI * 40 * 30 * (25.4 / 96) ** 2;
    expect(pumpkin).toBeGreaterThan(ellipse * 0.999);
    expect(pumpkin).toBeLessThan(ellipse + 100 * (25.4 / 96) ** 2);
    expect(at(m.layers, 3).areaMm2).toBe(0); // a line has no area
  });
  it('when shapes are transformed, then the transform is applied to the geometry', () => {
    const m = parseMotifSvg(svg('<g id="a" transform="translate(10 0) scale(2)"><rect width="10" height="10"/></g>'));
    const px = 25.4 / 96;
    expect(at(m.layers, 0).bboxMm.minX).toBeCloseTo(10 * px, 3);
    expect(at(m.layers, 0).bboxMm.maxX).toBeCloseTo(30 * px, 3);
  });
  it('when fill-rule is evenodd, then the inner square is a hole', () => {
    const m = parseMotifSvg(svg('<path fill-rule="evenodd" d="M0 0H96V96H0Z M24 24H72V72H24Z"/>'));
    expect(at(m.layers, 0).areaMm2).toBeCloseTo((96 * 96 - 48 * 48) * (25.4 / 96) ** 2, 1);
  });
});

describe('motif sanitiser (OWASP ASVS 1.3.4, 1.5.1, 5.2.1)', () => {
  const hostile = svg(`
    <script>alert(1)</script>
    <g id="body" onload="alert(1)" onclick="steal()"><circle cx="48" cy="48" r="20"/></g>
    <foreignObject width="10" height="10"><div xmlns="http://www.w3.org/1999/xhtml">hi</div></foreignObject>
    <image xlink:href="http://example.test/x.png" width="5" height="5"/>
    <use href="https://example.test/evil.svg#a"/>
    <a href="javascript:alert(1)"><rect width="5" height="5"/></a>
    <style>circle { fill: url(http://example.test/) }</style>`);
  it('when a motif has script, event attributes, foreignObject and external hrefs, then only geometry is kept', () => {
    const m = parseMotifSvg(hostile);
    expect(m.layers.map((l) => l.id)).toEqual(['body']);
    const whats = m.dropped.map((d) => d.what);
    for (const w of ['<script>', 'onload attribute', 'onclick attribute', '<foreignObject>', '<image>', '<use>', '<a>', '<style>', 'xlink:href attribute']) expect(whats).toContain(w);
  });
  it('when cleaned geometry is rendered for serving, then the SVG holds only our g/path elements and no script', () => {
    const out = renderMotifSvg(parseMotifSvg(hostile));
    expect(out).not.toMatch(/script|onload|onclick|foreignObject|href|javascript|example\.test|<image|<use|<style/i);
    const tags = [...out.matchAll(/<([a-zA-Z]+)/g)].map((m) => m[1]);
    expect(new Set(tags)).toEqual(new Set(['svg', 'g', 'path']));
  });
  it('when stored geometry is tampered with, then rendering still cannot inject markup', () => {
    const m = parseMotifSvg(svg('<rect id="x" width="10" height="10"/>'));
    at(m.layers, 0).id = '"><script>alert(1)</script>';
    at(m.layers, 0).colour = 'red" onload="x';
    at(m.layers, 0).path = 'M0 0"/><script>alert(1)</script>';
    const out = renderMotifSvg(m);
    expect(out).not.toMatch(/<script|onload=/);
    expect([...out.matchAll(/<([a-zA-Z]+)/g)].map((x) => x[1])).toEqual(['svg', 'g', 'path']);
  });
  it('when a DOCTYPE or ENTITY is present, then the file is refused (no entity expansion)', () => {
    expect(refusal(() => parseMotifSvg(`<?xml version="1.0"?><!DOCTYPE svg [<!ENTITY x SYSTEM "file:///etc/passwd">]>${svg('<text>&x;</text>')}`))).toBe('doctype_refused');
    expect(refusal(() => parseMotifSvg(`<!doctype svg>${svg('<rect width="1" height="1"/>')}`))).toBe('doctype_refused');
  });
  it('when the file is too big, has too many elements, is not SVG or not well-formed, then it is refused', () => {
    expect(refusal(() => parseMotifSvg(svg(`<!-- ${'x'.repeat(600 * 1024)} --><rect width="1" height="1"/>`)))).toBe('too_large');
    expect(refusal(() => parseMotifSvg(svg('<rect width="1" height="1"/>'.repeat(6000))))).toBe('too_many_elements');
    expect(refusal(() => parseMotifSvg('<html><body/></html>'))).toBe('not_svg');
    expect(refusal(() => parseMotifSvg('<svg><rect></svg>'))).toBe('malformed');
    expect(refusal(() => parseMotifSvg(svg('<text>hello</text>')))).toBe('no_geometry');
  });
});
