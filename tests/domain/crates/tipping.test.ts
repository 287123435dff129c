import { describe, expect, it } from 'vitest';
import { assessCrateForLeg, crateForAccess, designCrate, ispm15Need, ROAD_1G, ROAD_CTU, SEA_AREAS, tippingCheck } from '../../../src/domain/crates/index.ts';
import { checkCrateAccess } from '../../../src/domain/access/index.ts';

describe('tipping: a > c_z · b/h tips (REFERENCES §4.4 [C], statics)', () => {
  // 1,200 × 800 footprint, CoG central. Road 1.0 g forward, 0.5 g back and sideways (REFERENCES
  // §4.4 [S], insurers' handbook).
  it('CoG 900 high: b/h = 600/900 = 0.667 along, 400/900 = 0.444 across: tips both ways', () => {
    const r = tippingCheck({ lengthMm: 1200, widthMm: 800 }, [600, 400, 900], ROAD_1G, 'length-along');
    expect(r.tips).toBe(true);
    expect(r.action).toBe('lash or block');
    const ends = r.directions.find((d) => d.edge === 'x=0')!;
    expect(ends.bOverH).toBeCloseTo(0.6667, 4);
    expect(ends.marginG).toBeCloseTo(0.6667 - 1.0, 4);
    const side = r.directions.find((d) => d.edge === 'y=0')!;
    expect(side.marginG).toBeCloseTo(0.4444 - 0.5, 4);
    expect(r.note).toMatch(/Lash or block/);
  });
  it('CoG 600 high: b/h = 1.0 along exactly at 1.0 g (not over: stands); across 0.667 > 0.5', () => {
    const r = tippingCheck({ lengthMm: 1200, widthMm: 800 }, [600, 400, 600], ROAD_1G, 'length-along');
    expect(r.tips).toBe(false);
    expect(r.worst.marginG).toBeCloseTo(0, 12);
  });
  it('the CTU Code 0.8 g forward lets a crate with b/h = 0.9 stand that 1.0 g would tip', () => {
    const cog: [number, number, number] = [540, 400, 600]; // b/h forward edge 540/600 = 0.9
    expect(tippingCheck({ lengthMm: 1200, widthMm: 800 }, cog, ROAD_1G, 'length-along').tips).toBe(true);
    expect(tippingCheck({ lengthMm: 1200, widthMm: 800 }, cog, ROAD_CTU, 'length-along').tips).toBe(false);
  });
  it("'any' ride is never less strict than a planned one (property)", () => {
    let s = 11;
    const r = () => ((s = (s * 16807) % 2147483647) / 2147483647);
    for (let i = 0; i < 500; i++) {
      const L = 300 + r() * 2000, W = 300 + r() * 2000;
      const cog: [number, number, number] = [L * r(), W * r(), 50 + r() * 1500];
      for (const p of [ROAD_1G, ROAD_CTU, ...SEA_AREAS]) {
        const any = tippingCheck({ lengthMm: L, widthMm: W }, cog, p, 'any');
        for (const ride of ['length-along', 'width-along'] as const) {
          const planned = tippingCheck({ lengthMm: L, widthMm: W }, cog, p, ride);
          expect(any.worst.marginG).toBeLessThanOrEqual(planned.worst.marginG + 1e-12);
        }
        // and the verdict matches the inequality a > c_z · b / h on the worst edge
        expect(any.tips).toBe(any.directions.some((d) => d.accelerationG > d.verticalG * d.bOverH));
      }
    }
  });
  it('rejects a CoG outside the footprint, naming it', () => {
    expect(() => tippingCheck({ lengthMm: 1000, widthMm: 800 }, [1200, 400, 500])).toThrow(/CoG x = 1200/);
  });
});

describe('ISPM 15 (REFERENCES §4.3 [S])', () => {
  const d = designCrate({ massKg: 100, cogMm: [300, 200, 200], bboxMinMm: [0, 0, 0], bboxMaxMm: [600, 400, 400] });
  it('solid spruce skids and cleats need the mark on an international leg', () => {
    const n = ispm15Need(d.makeUp, true);
    expect(n.needed).toBe(true);
    expect(n.solidWoodParts).toEqual(['skids', 'cleats']);
  });
  it('not on a domestic leg', () => {
    expect(ispm15Need(d.makeUp, false).needed).toBe(false);
  });
  it('an all-plywood crate (plywood skids, no cleats) is exempt', () => {
    const ply = designCrate({ massKg: 100, cogMm: [300, 200, 200], bboxMinMm: [0, 0, 0], bboxMaxMm: [600, 400, 400] }, {
      makeUp: { skids: { materialCode: 'plywood-birch', count: 2, widthMm: 100, heightMm: 100 }, cleats: null },
    });
    expect(ispm15Need(ply.makeUp, true).needed).toBe(false);
  });
  it('solid wood 6 mm thick or less is exempt; 7 mm is not', () => {
    const thin = { ...d.makeUp, skids: { ...d.makeUp.skids, count: 0 }, cleats: { materialCode: 'spruce', widthMm: 40, thicknessMm: 6 } };
    expect(ispm15Need(thin, true).needed).toBe(false);
    expect(ispm15Need({ ...thin, cleats: { ...thin.cleats, thicknessMm: 7 } }, true).needed).toBe(true);
  });
});

describe('assessment and access glue', () => {
  it('a tall narrow crate gets "LASH OR BLOCK" on its packing list', () => {
    const tall = designCrate({ massKg: 150, cogMm: [200, 200, 1200], bboxMinMm: [0, 0, 0], bboxMaxMm: [400, 400, 1800] });
    const a = assessCrateForLeg(tall, { international: true });
    expect(a.tipping.tips).toBe(true);
    expect(a.packingListNotes[0]).toMatch(/^LASH OR BLOCK/);
    expect(a.packingListNotes.some((n) => n.startsWith('ISPM 15'))).toBe(true);
  });
  it('a designed crate feeds the venue access check', () => {
    const d = designCrate({ id: 'DC', massKg: 420, cogMm: [500, 400, 300], bboxMinMm: [0, 0, 0], bboxMaxMm: [1000, 800, 700] });
    const c = crateForAccess(d);
    expect(c.mayTilt).toBe(false);
    const r = checkCrateAccess(c, { doors: [{ widthMm: 1000, heightMm: 2100 }], floorRatingKnPerM2: 5 });
    expect(r.verdict).toBe('pass'); // 974 mm wide through 1,000 mm
  });
});
