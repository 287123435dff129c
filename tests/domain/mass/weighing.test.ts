import { describe, expect, it } from 'vitest';
import { compareWeighing, weighingFromLoadCells } from '../../../src/domain/mass/index.ts';
import { KG_PER_POUND } from '../../../src/domain/units.ts';

describe('weighingFromLoadCells: statics (ΣR = W, ΣR·x = W·x̄)', () => {
  it('four cells at the corners of a 2,000 × 1,000 mm frame: hand-computed answer [COMP]', () => {
    // Readings 100, 200, 300, 400 kg. W = 1,000 kg.
    // x̄ = (200 + 300) × 2,000 / 1,000 = 1,000 mm; ȳ = (300 + 400) × 1,000 / 1,000 = 700 mm.
    const r = weighingFromLoadCells([
      { positionMm: [0, 0], readingKg: 100 },
      { positionMm: [2000, 0], readingKg: 200 },
      { positionMm: [2000, 1000], readingKg: 300 },
      { positionMm: [0, 1000], readingKg: 400 },
    ]);
    expect(r.massKg).toBe(1000);
    expect(r.cogPlanMm).toEqual([1000, 700]);
    expect(r.cellCount).toBe(4);
    expect(r.notes.join(' ')).toMatch(/height is not measured/);
  });

  it('three cells: reactions of a known body recover its CoG [COMP]', () => {
    // A 900 kg body with its CoG at (600, 400) on supports (0,0), (1,500,0), (0,1,000):
    // moments about the y axis: R₂ · 1,500 = 900 · 600 → R₂ = 360; about the x axis: R₃ · 1,000 = 900 · 400 →
    // R₃ = 360; R₁ = 900 − 720 = 180.
    const r = weighingFromLoadCells([
      { positionMm: [0, 0], readingKg: 180 },
      { positionMm: [1500, 0], readingKg: 360 },
      { positionMm: [0, 1000], readingKg: 360 },
    ]);
    expect(r.massKg).toBe(900);
    expect(r.cogPlanMm![0]).toBeCloseTo(600, 9);
    expect(r.cogPlanMm![1]).toBeCloseTo(400, 9);
  });

  it('two supports: 2,000 lb and 8,000 lb, 10 ft apart → CoG 8 ft from A, 2 ft from B [PUB-2: sling maker page, REFERENCES §2 "2-point pick"]', () => {
    const ft = 304.8;
    const r = weighingFromLoadCells([
      { positionMm: [0, 0], readingKg: 2000 * KG_PER_POUND },
      { positionMm: [10 * ft, 0], readingKg: 8000 * KG_PER_POUND },
    ]);
    expect(r.massKg / KG_PER_POUND).toBeCloseTo(10000, 9);
    expect(r.cogPlanMm![0] / ft).toBeCloseTo(8, 12);
    expect(r.notes.join(' ')).toMatch(/line between them/);
  });

  it('random bodies: the CoG recovered from statically determinate three-support reactions [property]', () => {
    let s = 11;
    const rand = (): number => ((s = (s * 48271) % 2147483647) - 1) / 2147483646;
    for (let i = 0; i < 50; i++) {
      const p = [0, 1, 2].map(() => [rand() * 3000, rand() * 3000] as [number, number]);
      // A CoG inside the triangle (barycentric weights), and reactions = W × those weights (statics of a
      // body on three supports).
      const w = [rand() + 0.01, rand() + 0.01, rand() + 0.01];
      const sw = w[0] + w[1] + w[2];
      const W = 50 + rand() * 2000;
      const cog = [0, 1].map((k) => (w[0] * p[0][k] + w[1] * p[1][k] + w[2] * p[2][k]) / sw);
      const r = weighingFromLoadCells(p.map((pos, j) => ({ positionMm: pos, readingKg: (W * w[j]) / sw })));
      expect(r.massKg).toBeCloseTo(W, 9);
      expect(r.cogPlanMm![0]).toBeCloseTo(cog[0], 6);
      expect(r.cogPlanMm![1]).toBeCloseTo(cog[1], 6);
    }
  });

  it('a single reading gives the mass only', () => {
    const r = weighingFromLoadCells([{ positionMm: [0, 0], readingKg: 412.5 }]);
    expect(r).toMatchObject({ massKg: 412.5, cogPlanMm: null, cellCount: 1 });
  });

  it('notes cells in a line and a zero reading', () => {
    const r = weighingFromLoadCells([
      { positionMm: [0, 0], readingKg: 10 },
      { positionMm: [1000, 0], readingKg: 0 },
      { positionMm: [2000, 0], readingKg: 10 },
    ]);
    expect(r.notes.join(' ')).toMatch(/reading 2 is zero.*supports lie on one line/s);
  });

  it('refuses bad readings, naming which', () => {
    expect(() => weighingFromLoadCells([])).toThrow(/no readings/);
    expect(() => weighingFromLoadCells([{ positionMm: [0, 0], readingKg: 5 }, { positionMm: [1, 0], readingKg: -1 }])).toThrow(/Weighing reading 2: reading -1 kg is negative/);
    expect(() => weighingFromLoadCells([{ positionMm: [0, 0], readingKg: Number.NaN }])).toThrow(/Weighing reading 1: reading must be a finite number/);
    expect(() => weighingFromLoadCells([{ positionMm: [0, 0], readingKg: 5 }, { positionMm: [Number.NaN, 0], readingKg: 1 }])).toThrow(/Weighing reading 2: support position/);
    expect(() => weighingFromLoadCells([{ positionMm: [0, 0], readingKg: 0 }, { positionMm: [1, 0], readingKg: 0 }])).toThrow(/add up to zero/);
  });
});

describe('compareWeighing: weighed against computed (5 % and 50 mm thresholds: [PRACTICE] common practice, no source)', () => {
  it('reports kg, % of the weighed mass and the plan CoG offset, and flags a large difference', () => {
    const c = compareWeighing({ massKg: 940, cogMm: [1000, 650, 300] }, { massKg: 1000, cogPlanMm: [1000, 700] });
    expect(c.differenceKg).toBeCloseTo(60, 12);
    expect(c.differencePercent).toBeCloseTo(6, 12);
    expect(c.cogOffsetMm).toEqual({ dx: 0, dy: 50, distance: 50 });
    expect(c.massDifferenceLarge).toBe(true);
    expect(c.cogOffsetLarge).toBe(false); // exactly at the threshold is not above it
    expect(c.large).toBe(true);
    expect(c.notes[0]).toMatch(/heavier than computed: look for parts missing/);
    expect(c.tolerances.source).toMatch(/PRACTICE/);
  });

  it('stays quiet within tolerance, and says when no CoG can be compared', () => {
    const c = compareWeighing({ massKg: 990, cogMm: null }, { massKg: 1000, cogPlanMm: [0, 0] });
    expect(c.large).toBe(false);
    expect(c.cogOffsetMm).toBeNull();
    expect(c.notes.join(' ')).toMatch(/No CoG comparison/);
    const lighter = compareWeighing({ massKg: 1100, cogMm: [0, 0, 0] }, { massKg: 1000, cogPlanMm: [80, 0] }, { massPercent: 20 });
    expect(lighter.massDifferenceLarge).toBe(false);
    expect(lighter.cogOffsetLarge).toBe(true);
  });
});
