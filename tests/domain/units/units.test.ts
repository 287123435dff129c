import { describe, expect, it } from 'vitest';
import { formatPressure, fromKn, fromKnPerM2, KN_PER_M2_PER_PSF, N_PER_LBF, toKn, toKnPerM2 } from '../../../src/domain/units.ts';

describe('imperial floor ratings and point loads', () => {
  it('match the published conversion factors', () => {
    // NIST Special Publication 811 (2008), Appendix B.8 (from memory; the same figures in third-party
    // conversion tables): pound-force = 4.448 222 E+00 N; pound-force per square foot = 4.788 026 E+01 Pa.
    expect(N_PER_LBF).toBeCloseTo(4.448222, 6);
    expect(KN_PER_M2_PER_PSF * 1000).toBeCloseTo(47.88026, 5);
  });

  it('give a stage floor of 150 psf as 7.18 kN/m², and back', () => {
    // REFERENCES: ASCE 7 live load for stage floors 150 psf (7.18 kN/m²).
    expect(toKnPerM2(150, 'psf')).toBeCloseTo(7.18, 2);
    expect(fromKnPerM2(toKnPerM2(150, 'psf'), 'psf')).toBeCloseTo(150, 10);
    expect(toKnPerM2(5, 'kN/m²')).toBe(5);
    expect(formatPressure(7.182, 'imperial')).toBe('150 psf');
    expect(formatPressure(5, 'metric')).toBe('5.0 kN/m²');
  });

  it('turn a 1,000 lbf point load into kN and back', () => {
    expect(toKn(1000, 'lbf')).toBeCloseTo(4.448222, 6);
    expect(fromKn(toKn(1000, 'lbf'), 'lbf')).toBeCloseTo(1000, 9);
    expect(toKn(3, 'kN')).toBe(3);
  });
});
