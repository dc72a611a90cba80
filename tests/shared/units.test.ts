import { describe, expect, it } from 'vitest';
import { cssLengthToMm, cToF, deltaFToDeltaC, formatLength, formatTemperature, fToC, inToMm, mmToIn, pxToMm } from '../../shared/units.ts';

describe('units', () => {
  // NIST SP 811, Appendix B.8: inch → metre 2.54 E−02 exactly.
  it('when converting inches, then 12 in = 304.8 mm and 15 in = 381 mm (NIST SP 811 B.8)', () => {
    expect(inToMm(12)).toBeCloseTo(304.8, 10);
    expect(inToMm(15)).toBeCloseTo(381, 10);
    expect(mmToIn(304.8)).toBeCloseTo(12, 10);
  });
  // NIST SP 811 B.9: t/°C = (t/°F − 32)/1.8.
  it('when converting °F, then 320 °F = 160 °C, 212 °F = 100 °C, 315 °F ≈ 157.22 °C (NIST SP 811 B.9)', () => {
    expect(fToC(320)).toBeCloseTo(160, 10);
    expect(fToC(212)).toBeCloseTo(100, 10);
    expect(fToC(315)).toBeCloseTo(157.22, 2);
    expect(cToF(160)).toBeCloseTo(320, 10);
  });
  it('when converting a temperature difference, then only the 5/9 factor applies (NIST SP 811)', () => {
    expect(deltaFToDeltaC(18)).toBeCloseTo(10, 10);
  });
  // W3C CSS Values and Units, absolute lengths: 1in = 2.54cm = 96px, 1pt = 1/72 in.
  it('when reading CSS lengths, then 96px = 1in = 25.4 mm and 72pt = 1in (W3C CSS Values)', () => {
    expect(pxToMm(96)).toBeCloseTo(25.4, 10);
    expect(cssLengthToMm('12in')).toBeCloseTo(304.8, 10);
    expect(cssLengthToMm('72pt')).toBeCloseTo(25.4, 10);
    expect(cssLengthToMm('96')).toBeCloseTo(25.4, 10);
    expect(cssLengthToMm('50%')).toBeNull();
  });
  it('when formatting, then lengths show cm and inches and temperatures °C and °F', () => {
    expect(formatLength(101.6)).toBe('10.2 cm (4.0 in)');
    expect(formatTemperature(157)).toBe('157 °C (315 °F)');
  });
});
