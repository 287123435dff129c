import { describe, expect, it } from 'vitest';
import { booleans, measurements, primitives } from '@jscad/modeling';
import { CRATE_MATERIALS, crateStandardFor, designCrate, stackLimitKg, type CrateSection } from '../../../src/domain/crates/index.ts';

// A drive-core-like section: 1,000 × 800 × 700 mm box, 420 kg (SCENARIO.md "DC ~420 kg").
const section: CrateSection = { id: 'DC', massKg: 420, cogMm: [500, 400, 300], bboxMinMm: [0, 0, 0], bboxMaxMm: [1000, 800, 700] };
const density = (code: string) => CRATE_MATERIALS.find((m) => m.code === code)!.densityKgPerM3;

describe('crate sizes and tare, hand-worked', () => {
  // Default make-up [CP, REFERENCES §4.4]: 50 mm clearance; 15 mm birch plywood panels; 18 mm base;
  // two 100 × 100 spruce skids; 22 × 70 spruce cleats. Inner 1,100 × 900 × 800; wall ring
  // 1,130 × 930; outer 1,174 × 974 × (100 + 18 + 800 + 15 + 22 = 955).
  const d = designCrate(section);
  it('inner and outer sizes', () => {
    expect(d.innerMm).toEqual([1100, 900, 800]);
    expect(d.outerMm).toEqual([1174, 974, 955]);
    expect(d.makeUp.skids.count).toBe(2);
    expect(d.forkEntryHeightMm).toBe(100);
    expect(d.forkEntryGapMm).toBe(774);
  });
  // Hand-worked volumes (mm³) × densities (birch ply 680, spruce 450 kg/m³, REFERENCES §4.4):
  // skids 2·1174·100·100 = 23,480,000 → 10.566 kg; base 1174·974·18 = 20,582,568 → 13.996 kg;
  // walls (1130·930 − 1100·900)·800 = 48,720,000 → 33.130 kg; lid 1130·930·15 = 15,763,500 → 10.719 kg;
  // cleats: sides 2·(2·(1130+800) − 280)·70·22 = 11,026,400, ends 2·(2·(930+800) − 280)·1540 = 9,794,400,
  // lid (2·(1130+930) − 280)·1540 = 5,913,600 → 26,734,400 · 450e-9 = 12.030 kg. Tare 80.441 kg.
  it('tare from volumes × densities', () => {
    expect(d.tareKg).toBeCloseTo(10.566 + 13.996 + 33.1296 + 10.71918 + 12.03048, 2);
    expect(d.netKg).toBe(420);
    expect(d.grossKg).toBeCloseTo(d.tareKg + 420, 9);
  });
  it('the section sits at the inner corner plus the clearance; its CoG moves with it', () => {
    // inner origin (22 + 15, 22 + 15, 100 + 18) + 50 clearance = (87, 87, 168)
    expect(d.sectionOffsetMm).toEqual([87, 87, 168]);
  });
  it('stack limit: 10 kN/m² on the 1.174 × 0.974 m lid (REFERENCES §4.4 [S])', () => {
    // 10,000 N/m² × 1.143476 m² / 9.80665 = 1,166.02 kg [COMP]
    expect(d.maxLoadOnTopKg).toBeCloseTo(1166.02, 1);
  });
  it('ASTM ranges by net load (D6251 ≤ 454 kg, D6256 < 1,134, D6039 ≤ 1,814, D7478 ≤ 13,607; REFERENCES §4.4 [S])', () => {
    expect(d.standard?.code).toBe('ASTM D6251');
    expect(d.maxGrossKg).toBeCloseTo(454 + d.tareKg, 9);
    expect(crateStandardFor(454)?.code).toBe('ASTM D6251');
    expect(crateStandardFor(455)?.code).toBe('ASTM D6256');
    expect(crateStandardFor(1134)?.code).toBe('ASTM D6039');
    expect(crateStandardFor(1815)?.code).toBe('ASTM D7478');
    expect(crateStandardFor(13608)).toBeUndefined();
  });
  it('a stack limit of a 1.2 × 0.8 m lid is 978.9 kg [COMP from 10 kN/m²]', () => {
    expect(stackLimitKg(1200, 800)).toBeCloseTo(978.9, 1);
  });
});

describe('tare volumes and CoG against an independent solid modeller (@jscad/modeling)', () => {
  // Build every component as a solid in place (CSG subtract for the wall ring and cleat frames) and
  // compare volumes and the tare CoG from measureVolume / measureCenterOfMass.
  const { cuboid } = primitives;
  const { subtract } = booleans;
  const box = (min: [number, number, number], max: [number, number, number]) =>
    cuboid({ size: [max[0] - min[0], max[1] - min[1], max[2] - min[2]], center: [(min[0] + max[0]) / 2, (min[1] + max[1]) / 2, (min[2] + max[2]) / 2] });
  it('matches to 0.01 %', () => {
    const d = designCrate(section, { clearanceMm: { sidesMm: 40, topMm: 30, bottomMm: 60 }, makeUp: { skids: { materialCode: 'spruce', count: 3, widthMm: 120, heightMm: 110 } } });
    const [Lo, Wo] = d.outerMm;
    const [Li, Wi, Hi] = d.innerMm;
    const t = 15, c = 22, cw = 70, hs = 110, tb = 18;
    const z0 = hs + tb;
    const parts: { solid: ReturnType<typeof cuboid>; rho: number }[] = [];
    const spruce = density('spruce');
    const birch = density('plywood-birch');
    for (let k = 0; k < 3; k++) {
      const y = 60 + (k * (Wo - 120)) / 2;
      parts.push({ solid: box([0, y - 60, 0], [Lo, y + 60, hs]), rho: spruce });
    }
    parts.push({ solid: box([0, 0, hs], [Lo, Wo, z0]), rho: birch });
    const wallOuter = box([c, c, z0], [c + Li + 2 * t, c + Wi + 2 * t, z0 + Hi]);
    const inner = box([c + t, c + t, z0], [c + t + Li, c + t + Wi, z0 + Hi]);
    parts.push({ solid: subtract(wallOuter, inner), rho: birch });
    parts.push({ solid: box([c, c, z0 + Hi], [c + Li + 2 * t, c + Wi + 2 * t, z0 + Hi + t]), rho: birch });
    // cleat frames: on each side face (outside the wall ring) and on the lid
    const Lw = Li + 2 * t, Ww = Wi + 2 * t;
    const frameX = (x0: number, x1: number, y0: number, y1: number, z0_: number, z1: number, axisA: 'x' | 'y') => {
      // a frame lying in a vertical plane, outer a × Hi, cw wide, thickness along the other axis
      const outer = axisA === 'x' ? box([x0, y0, z0_], [x1, y1, z1]) : box([x0, y0, z0_], [x1, y1, z1]);
      const hole = axisA === 'x' ? box([x0 + cw, y0 - 1, z0_ + cw], [x1 - cw, y1 + 1, z1 - cw]) : box([x0 - 1, y0 + cw, z0_ + cw], [x1 + 1, y1 - cw, z1 - cw]);
      return subtract(outer, hole);
    };
    parts.push({ solid: frameX(c, c + Lw, 0, c, z0, z0 + Hi, 'x'), rho: spruce });
    parts.push({ solid: frameX(c, c + Lw, c + Ww, Wo, z0, z0 + Hi, 'x'), rho: spruce });
    parts.push({ solid: frameX(0, c, c, c + Ww, z0, z0 + Hi, 'y'), rho: spruce });
    parts.push({ solid: frameX(c + Lw, Lo, c, c + Ww, z0, z0 + Hi, 'y'), rho: spruce });
    const lidTop = z0 + Hi + t;
    parts.push({ solid: subtract(box([c, c, lidTop], [c + Lw, c + Ww, lidTop + c]), box([c + cw, c + cw, lidTop - 1], [c + Lw - cw, c + Ww - cw, lidTop + c + 1])), rho: spruce });

    let m = 0;
    const mc = [0, 0, 0];
    for (const p of parts) {
      const v = measurements.measureVolume(p.solid) as number;
      const com = measurements.measureCenterOfMass(p.solid) as number[];
      const mass = v * 1e-9 * p.rho;
      m += mass;
      for (let i = 0; i < 3; i++) mc[i] += mass * com[i];
    }
    expect(d.tareKg).toBeCloseTo(m, 6);
    expect(Math.abs(d.tareKg - m) / m).toBeLessThan(1e-4);
    for (let i = 0; i < 3; i++) expect(d.tareCogMm[i]).toBeCloseTo(mc[i] / m, 3);
  });
});

describe('crate CoG and gross (properties)', () => {
  it('gross = net + tare + dunnage; the CoG lies inside the crate; moving the section CoG by d moves the crate CoG by d·net/gross', () => {
    let s = 7;
    const r = () => ((s = (s * 16807) % 2147483647) / 2147483647);
    for (let i = 0; i < 200; i++) {
      const size: [number, number, number] = [200 + r() * 2000, 200 + r() * 1500, 200 + r() * 1500];
      const sec: CrateSection = { massKg: 5 + r() * 900, cogMm: [size[0] * r(), size[1] * r(), size[2] * r()], bboxMinMm: [0, 0, 0], bboxMaxMm: size };
      const dunnageKg = r() * 20;
      const a = designCrate(sec, { dunnageKg });
      expect(a.grossKg).toBeCloseTo(a.netKg + a.tareKg, 9);
      a.cogMm.forEach((v, k) => {
        expect(v).toBeGreaterThan(0);
        expect(v).toBeLessThan(a.outerMm[k]);
      });
      const dx = 37;
      const b = designCrate({ ...sec, cogMm: [sec.cogMm[0] + dx, sec.cogMm[1], sec.cogMm[2]] }, { dunnageKg });
      expect(b.cogMm[0] - a.cogMm[0]).toBeCloseTo((dx * sec.massKg) / a.grossKg, 9);
    }
  });
});

describe('bad input names the field', () => {
  it('throws on a zero-size box, a negative mass, too many skids, an unknown material', () => {
    expect(() => designCrate({ ...section, bboxMaxMm: [1000, 0, 700] })).toThrow(/along y/);
    expect(() => designCrate({ ...section, massKg: -1 })).toThrow(/mass/);
    expect(() => designCrate(section, { makeUp: { skids: { materialCode: 'spruce', count: 12, widthMm: 100, heightMm: 100 } } })).toThrow(/Skids/);
    expect(() => designCrate(section, { makeUp: { panel: { materialCode: 'unobtainium', thicknessMm: 12 } } })).toThrow(/unobtainium/);
  });
  it('warns when the fork entry is below 100 mm [CP]', () => {
    const d = designCrate(section, { makeUp: { skids: { materialCode: 'spruce', count: 2, widthMm: 100, heightMm: 80 } } });
    expect(d.warnings.join(' ')).toMatch(/Fork entry 80 mm/);
  });
});
