import { describe, expect, it } from 'vitest';
import { DEFAULT_MATERIALS, cadMassKg, findMaterial } from '../../../src/domain/mass/index.ts';

describe('materials (REFERENCES §4.4)', () => {
  it('holds the reference densities with a tagged source each [S, 3rd party / M]', () => {
    const d = (code: string): number | undefined => findMaterial(DEFAULT_MATERIALS, code)?.densityKgPerM3;
    // Values as listed in §4.4 (ranges: middle taken).
    expect(d('steel')).toBe(7850);
    expect(d('stainless-304')).toBe(7900);
    expect(d('stainless-316')).toBe(8000);
    expect(d('aluminium')).toBe(2700);
    expect(d('brass')).toBeGreaterThanOrEqual(8400);
    expect(d('brass')).toBeLessThanOrEqual(8500);
    expect(d('copper')).toBe(8900);
    expect(d('acetal')).toBe(1410);
    expect(d('plywood-birch')).toBe(680);
    for (const m of DEFAULT_MATERIALS) expect(m.source).toMatch(/^\[(S|M)/);
    expect(new Set(DEFAULT_MATERIALS.map((m) => m.code)).size).toBe(DEFAULT_MATERIALS.length);
  });

  it('finds by code or name, ignoring case; unknown gives undefined', () => {
    expect(findMaterial(DEFAULT_MATERIALS, '  Birch Plywood ')?.code).toBe('plywood-birch');
    expect(findMaterial(DEFAULT_MATERIALS, 'STEEL')?.code).toBe('steel');
    expect(findMaterial(DEFAULT_MATERIALS, 'unobtainium')).toBeUndefined();
    expect(findMaterial(DEFAULT_MATERIALS, '')).toBeUndefined();
  });

  it('CAD mass = volume × density; a solid steel ring of a 6204 bearing envelope ≈ 0.156 kg [S/C: REFERENCES §4.4]', () => {
    // ISO 15 6204: bore 20, outside 47, width 14 mm.
    const v = (Math.PI / 4) * (47 ** 2 - 20 ** 2) * 14;
    expect(cadMassKg(v, 7850)).toBeCloseTo(0.156, 3);
    expect(() => cadMassKg(0, 7850, 'P-1')).toThrow(/P-1: volume must be/);
    expect(() => cadMassKg(1, Number.NaN)).toThrow(/density must be/);
  });
});
