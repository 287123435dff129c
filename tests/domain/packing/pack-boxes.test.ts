import { describe, expect, it } from 'vitest';
import { packBoxes, type PackContainer, type PackItem } from '../../../src/domain/packing/index.ts';
import { expectValid } from './check.ts';

// Hand-checkable cases: every expected figure below is plain arithmetic on the sizes given [COMP].
const cube = (id: string, s: number, quantity: number, extra: Partial<PackItem> = {}): PackItem => ({
  id,
  lengthMm: s,
  widthMm: s,
  heightMm: s,
  quantity,
  orientation: 'any',
  ...extra,
});
const fast = { maxIterations: 200 };

describe('packBoxes: exact fits', () => {
  it('fills a 400×200×200 box with 16 cubes of 100 mm exactly', async () => {
    const c: PackContainer = { lengthMm: 400, widthMm: 200, heightMm: 200 };
    const items = [cube('c', 100, 16)];
    const r = await packBoxes(c, items, fast);
    expectValid(c, items, r);
    expect(r.placements).toHaveLength(16);
    expect(r.unplaced).toEqual([]);
    expect(r.volumeUtilisation).toBeCloseTo(1, 12);
  });

  it('fills exactly with two sizes that only fit one way (600×400×300 from 8 of 300×200×150)', async () => {
    const c: PackContainer = { lengthMm: 600, widthMm: 400, heightMm: 300 };
    const items: PackItem[] = [{ id: 'b', lengthMm: 300, widthMm: 200, heightMm: 150, quantity: 8, orientation: 'any' }];
    const r = await packBoxes(c, items, fast);
    expectValid(c, items, r);
    expect(r.placements).toHaveLength(8);
    expect(r.volumeUtilisation).toBeCloseTo(1, 12);
  });

  it('places decimal sizes without overlap (3 × 333.3 mm in 1000 mm)', async () => {
    const c: PackContainer = { lengthMm: 1000, widthMm: 333.3, heightMm: 333.3 };
    const items = [cube('d', 333.3, 3)];
    const r = await packBoxes(c, items, fast);
    expectValid(c, items, r);
    expect(r.placements).toHaveLength(3);
  });
});

describe('packBoxes: bad input is reported and the rest still packs', () => {
  const c: PackContainer = { lengthMm: 1000, widthMm: 500, heightMm: 500, maxPayloadKg: 100 };
  const items: PackItem[] = [
    cube('ok', 100, 5, { massKg: 1 }),
    { id: 'too-long', lengthMm: 1200, widthMm: 100, heightMm: 100, quantity: 1, orientation: 'any' },
    { id: 'zero', lengthMm: 0, widthMm: 100, heightMm: 100, quantity: 2, orientation: 'any' },
    { id: 'negative', lengthMm: 100, widthMm: -5, heightMm: 100, quantity: 1, orientation: 'any' },
    cube('heavy', 100, 1, { massKg: 150 }),
    { id: 'no-way-up', lengthMm: 100, widthMm: 100, heightMm: 100, quantity: 1, orientation: 'fixed', verticalAxes: ['length'] },
    { id: 'bad-qty', lengthMm: 100, widthMm: 100, heightMm: 100, quantity: 1.5, orientation: 'any' },
  ];
  it('names each item and its limit', async () => {
    const r = await packBoxes(c, items, fast);
    expectValid(c, items, r);
    expect(r.placements.filter((p) => p.id === 'ok')).toHaveLength(5);
    const why = Object.fromEntries(r.unplaced.map((u) => [u.id, u.reason]));
    expect(why['too-long']).toMatch(/"too-long".*larger than the container \(1000×500×500 mm\)/);
    expect(why['zero']).toMatch(/"zero": lengthMm must be a positive/);
    expect(why['negative']).toMatch(/"negative": widthMm must be a positive.*-5/);
    expect(why['heavy']).toMatch(/"heavy".*150 kg exceeds.*maxPayloadKg 100 kg/);
    expect(why['no-way-up']).toMatch(/"no-way-up".*'fixed'.*allows no way to stand/);
    expect(why['bad-qty']).toMatch(/"bad-qty": quantity must be a whole number/);
    expect(r.unplaced.find((u) => u.id === 'too-long')?.quantity).toBe(1);
  });

  it('reports a bad container and packs nothing', async () => {
    const bad: PackContainer = { lengthMm: 0, widthMm: 500, heightMm: 500 };
    const r = await packBoxes(bad, [cube('a', 100, 2)], fast);
    expect(r.placements).toEqual([]);
    expect(r.unplaced[0].reason).toMatch(/container lengthMm must be a positive/);
    expect(r.unplaced[0].quantity).toBe(2);
  });

  it('an item too big leaves the rest packed and states the count', async () => {
    const box: PackContainer = { lengthMm: 300, widthMm: 100, heightMm: 100 };
    const its = [cube('fits', 100, 5)];
    const r = await packBoxes(box, its, fast);
    expectValid(box, its, r);
    expect(r.placements).toHaveLength(3);
    expect(r.unplaced).toEqual([{ id: 'fits', quantity: 2, reason: expect.stringMatching(/"fits": 2 of 5 not placed: no free space/) }]);
  });
});

describe('packBoxes: orientation rules', () => {
  it("'upright' keeps the height vertical even where lying down would fit more", async () => {
    // 100 mm high container: lying down (80 high) 200×50×80 boxes fit; upright is the only rule-abiding way.
    const c: PackContainer = { lengthMm: 400, widthMm: 200, heightMm: 100 };
    const items: PackItem[] = [{ id: 'u', lengthMm: 80, widthMm: 50, heightMm: 100, quantity: 30, orientation: 'upright' }];
    const r = await packBoxes(c, items, fast);
    expectValid(c, items, r);
    expect(r.placements.every((p) => p.heightMm === 100)).toBe(true);
    // Floor 400×200 holds 20 footprints of 80×50 (5 × 4 both ways): 20 placed, 10 left [COMP].
    expect(r.placements).toHaveLength(20);
  });

  it("'fixed' keeps length along x, width along y", async () => {
    const c: PackContainer = { lengthMm: 500, widthMm: 500, heightMm: 500 };
    const items: PackItem[] = [{ id: 'f', lengthMm: 250, widthMm: 100, heightMm: 50, quantity: 40, orientation: 'fixed' }];
    const r = await packBoxes(c, items, fast);
    expectValid(c, items, r);
    expect(r.placements.every((p) => p.lengthMm === 250 && p.widthMm === 100 && p.heightMm === 50)).toBe(true);
    expect(r.placements).toHaveLength(40);
  });

  it('verticalAxes limits which side stands up (BR flags)', async () => {
    const c: PackContainer = { lengthMm: 587, widthMm: 233, heightMm: 220 };
    const items: PackItem[] = [{ id: 'v', lengthMm: 108, widthMm: 76, heightMm: 30, quantity: 40, orientation: 'any', verticalAxes: ['height'] }];
    const r = await packBoxes(c, items, fast);
    expectValid(c, items, r);
    expect(r.placements.every((p) => p.heightMm === 30)).toBe(true);
  });
});

describe('packBoxes: stacking, payload, doors, load order', () => {
  it('puts nothing on a non-stackable item', async () => {
    const c: PackContainer = { lengthMm: 200, widthMm: 200, heightMm: 200 };
    const items = [cube('n', 100, 8, { stackable: false })];
    const r = await packBoxes(c, items, fast);
    expectValid(c, items, r);
    expect(r.placements).toHaveLength(4); // one layer of 2 × 2 on the floor
    expect(r.placements.every((p) => p.zMm === 0)).toBe(true);
    expect(r.unplaced[0]).toMatchObject({ id: 'n', quantity: 4 });
  });

  it('keeps maxLoadOnTopKg: a 10 kg box rated for 10 kg on top stacks two high, not three', async () => {
    const c: PackContainer = { lengthMm: 100, widthMm: 100, heightMm: 300 };
    const items = [cube('s', 100, 3, { massKg: 10, maxLoadOnTopKg: 10 })];
    const r = await packBoxes(c, items, fast);
    expectValid(c, items, r);
    expect(r.placements).toHaveLength(2);
  });

  it('stacks three in a column only in an order that keeps the 5 kg rating of the base crate', async () => {
    // Orders bottom→top that keep every rating: the rated crate is never at the bottom (it would carry 11 kg).
    const c: PackContainer = { lengthMm: 100, widthMm: 100, heightMm: 300 };
    const items = [cube('base', 100, 1, { massKg: 50, maxLoadOnTopKg: 5 }), cube('light', 100, 1, { massKg: 5 }), cube('heavy', 100, 1, { massKg: 6 })];
    const r = await packBoxes(c, items, fast);
    expectValid(c, items, r);
    expect(r.placements).toHaveLength(3);
    expect(r.placements.find((p) => p.id === 'base')?.zMm).toBeGreaterThan(0);
  });

  it('stops at the payload and says so', async () => {
    const c: PackContainer = { lengthMm: 1000, widthMm: 100, heightMm: 100, maxPayloadKg: 450 };
    const items = [cube('m', 100, 10, { massKg: 100 })];
    const r = await packBoxes(c, items, fast);
    expectValid(c, items, r);
    expect(r.placements).toHaveLength(4);
    expect(r.unplaced[0].reason).toMatch(/"m".*over the payload limit maxPayloadKg 450 kg/);
  });

  it('only loads what passes the door (a high cube container door is lower than its inside)', async () => {
    const c: PackContainer = { lengthMm: 1000, widthMm: 200, heightMm: 200, doorWidthMm: 200, doorHeightMm: 150 };
    const items: PackItem[] = [
      { id: 'tall-upright', lengthMm: 100, widthMm: 100, heightMm: 180, quantity: 1, orientation: 'upright' },
      { id: 'may-lie', lengthMm: 100, widthMm: 100, heightMm: 180, quantity: 1, orientation: 'any' },
    ];
    const r = await packBoxes(c, items, fast);
    expectValid(c, items, r);
    expect(r.unplaced.map((u) => u.id)).toEqual(['tall-upright']);
    expect(r.unplaced[0].reason).toMatch(/door opening \(200 mm wide × 150 mm high\)/);
    expect(r.placements[0].heightMm).toBeLessThanOrEqual(150);
  });

  it('puts the first stop nearest the doors', async () => {
    const c: PackContainer = { lengthMm: 1000, widthMm: 100, heightMm: 100 };
    const items = [cube('first-off', 100, 5, { stopIndex: 1 }), cube('last-off', 100, 5, { stopIndex: 2 })];
    const r = await packBoxes(c, items, fast);
    expectValid(c, items, r);
    const xs = (id: string) => r.placements.filter((p) => p.id === id).map((p) => p.xMm);
    expect(Math.max(...xs('last-off'))).toBeLessThan(Math.min(...xs('first-off')));
  });

  it('never blocks an earlier stop in a mixed, stacked load', async () => {
    const c: PackContainer = { lengthMm: 1200, widthMm: 800, heightMm: 600 };
    const items = [
      { id: 'a', lengthMm: 400, widthMm: 300, heightMm: 200, quantity: 6, orientation: 'any' as const, stopIndex: 1 },
      { id: 'b', lengthMm: 300, widthMm: 300, heightMm: 300, quantity: 6, orientation: 'any' as const, stopIndex: 2 },
      { id: 'c', lengthMm: 500, widthMm: 200, heightMm: 200, quantity: 6, orientation: 'upright' as const, stopIndex: 3 },
    ];
    const r = await packBoxes(c, items, fast);
    const check = expectValid(c, items, r);
    expect(check.loadOrderViolations).toBe(0);
  });
});

describe('packBoxes: search behaviour', () => {
  const c: PackContainer = { lengthMm: 587, widthMm: 233, heightMm: 220 };
  // BR1 problem 1 (Bischoff & Ratcliff 1995; shared data br-0-15/BR1.txt) [PUB].
  const items: PackItem[] = [
    { id: '1', lengthMm: 108, widthMm: 76, heightMm: 30, quantity: 40, orientation: 'any', verticalAxes: ['height'] },
    { id: '2', lengthMm: 110, widthMm: 43, heightMm: 25, quantity: 33, orientation: 'any', verticalAxes: ['width', 'height'] },
    { id: '3', lengthMm: 92, widthMm: 81, heightMm: 55, quantity: 39, orientation: 'any', verticalAxes: ['length', 'width', 'height'] },
  ];

  it('gives the same result for the same seed and maxIterations', async () => {
    const a = await packBoxes(c, items, { seed: 7, maxIterations: 150 });
    const b = await packBoxes(c, items, { seed: 7, maxIterations: 150 });
    expectValid(c, items, a);
    expect(b).toEqual(a);
  });

  it('runs with other seeds and short time limits, always valid', async () => {
    for (const seed of [2, 99]) {
      const r = await packBoxes(c, items, { seed, maxIterations: 120 });
      expectValid(c, items, r);
    }
    const quick = await packBoxes(c, items, { timeLimitMs: 30 });
    expectValid(c, items, quick);
    expect(quick.placements.length).toBeGreaterThan(0);
  });

  it('improves on its first answer and reports progress', async () => {
    const seen: [number, number][] = [];
    const r = await packBoxes(c, items, { maxIterations: 400, onProgress: (f, u) => seen.push([f, u]) });
    expectValid(c, items, r);
    expect(seen.length).toBeGreaterThan(1);
    for (let i = 1; i < seen.length; i++) expect(seen[i][1]).toBeGreaterThanOrEqual(seen[i - 1][1]);
    expect(seen.at(-1)).toEqual([1, r.volumeUtilisation]);
    expect(r.volumeUtilisation).toBeGreaterThan(seen[0][1]);
  });

  it('packs without full support when asked, and the validator then reports floating boxes only as information', async () => {
    const r = await packBoxes(c, items, { maxIterations: 100, fullSupport: false });
    expectValid(c, items, r, false);
  });
});
