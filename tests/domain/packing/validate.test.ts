import { describe, expect, it } from 'vitest';
import { loadsOnTopKg, validatePacking, type PackContainer, type PackItem, type Placement } from '../../../src/domain/packing/index.ts';

// The validator on deliberately broken packings. Each case breaks one rule once; expected counts are
// plain arithmetic on the coordinates [COMP].
const c: PackContainer = { lengthMm: 1000, widthMm: 500, heightMm: 500, maxPayloadKg: 100 };
const item = (id: string, extra: Partial<PackItem> = {}): PackItem => ({ id, lengthMm: 200, widthMm: 100, heightMm: 100, quantity: 2, orientation: 'upright', massKg: 10, ...extra });
const at = (id: string, x: number, y: number, z: number, l = 200, w = 100, h = 100): Placement => ({ id, xMm: x, yMm: y, zMm: z, lengthMm: l, widthMm: w, heightMm: h });
const zeroCounts = (r: ReturnType<typeof validatePacking>) =>
  r.overlaps + r.orientationFaults + r.outOfBounds + r.unsupported + r.stackLoadViolations + r.quantityMismatches + r.payloadExceeded + r.doorFaults + r.loadOrderViolations;

describe('validatePacking', () => {
  it('accepts a valid packing (two side by side, one turned on the floor)', () => {
    const r = validatePacking(c, [item('a')], [at('a', 0, 0, 0), at('a', 200, 0, 0, 100, 200, 100)]);
    expect(r.messages).toEqual([]);
    expect(r.ok).toBe(true);
  });

  it('counts an overlap', () => {
    const r = validatePacking(c, [item('a')], [at('a', 0, 0, 0), at('a', 199, 99, 0)]);
    expect(r.overlaps).toBe(1);
    expect(zeroCounts(r)).toBe(1);
    expect(r.ok).toBe(false);
  });

  it('does not count touching faces as overlap', () => {
    const r = validatePacking(c, [item('a')], [at('a', 0, 0, 0), at('a', 200, 0, 0)]);
    expect(r.overlaps).toBe(0);
  });

  it('counts a box out of bounds', () => {
    const r = validatePacking(c, [item('a', { quantity: 1 })], [at('a', 850, 0, 0)]);
    expect(r.outOfBounds).toBe(1);
    expect(r.messages[0]).toMatch(/"a".*outside the container 1000×500×500/);
  });

  it('counts an orientation fault (upright item laid on its side)', () => {
    const r = validatePacking(c, [item('a', { quantity: 1 })], [at('a', 0, 0, 0, 200, 100 /* y */, 100)]);
    expect(r.orientationFaults).toBe(0);
    const bad = validatePacking(c, [item('a', { quantity: 1, heightMm: 150 })], [at('a', 0, 0, 0, 200, 150, 100)]);
    expect(bad.orientationFaults).toBe(1);
  });

  it('counts a box with half its base in the air, and a floating one', () => {
    const items = [item('a', { quantity: 3 })];
    const r = validatePacking(c, items, [at('a', 0, 0, 0), at('a', 100, 0, 100), at('a', 600, 0, 300)]);
    expect(r.unsupported).toBe(2);
    expect(r.floating).toBe(1);
    expect(r.messages.join(' ')).toMatch(/supported on 50\.0 % of its base/);
    const relaxed = validatePacking(c, items, [at('a', 0, 0, 0), at('a', 100, 0, 100), at('a', 600, 0, 300)], { fullSupport: false });
    expect(relaxed.unsupported).toBe(0);
    expect(relaxed.ok).toBe(true);
  });

  it('counts something resting on a non-stackable item', () => {
    const r = validatePacking(c, [item('n', { quantity: 1, stackable: false }), item('a', { quantity: 1 })], [at('n', 0, 0, 0), at('a', 0, 0, 100)]);
    expect(r.stackLoadViolations).toBe(1);
  });

  it('counts a stack-load over maxLoadOnTopKg, passed down through the box between', () => {
    // bottom (limit 15) carries middle 10 + top 10 = 20 kg; middle (no limit) carries 10 kg.
    const items = [item('bottom', { quantity: 1, maxLoadOnTopKg: 15 }), item('a', { quantity: 2 })];
    const r = validatePacking(c, items, [at('bottom', 0, 0, 0), at('a', 0, 0, 100), at('a', 0, 0, 200)]);
    expect(r.stackLoadViolations).toBe(1);
    expect(r.messages[0]).toMatch(/"bottom".*20\.0 kg on top, over its maxLoadOnTopKg 15 kg/);
  });

  it('splits a bridging box over its supports by contact area (statics of a simply supported load)', () => {
    // A 30 kg box resting on two supports, 150 mm and 50 mm of its 200 mm length: 22.5 kg and 7.5 kg.
    const loads = loadsOnTopKg([
      { x0: 0, y0: 0, z0: 0, x1: 150, y1: 100, z1: 100, massKg: 1 },
      { x0: 150, y0: 0, z0: 0, x1: 400, y1: 100, z1: 100, massKg: 1 },
      { x0: 0, y0: 0, z0: 100, x1: 200, y1: 100, z1: 200, massKg: 30 },
    ]);
    expect(loads[0]).toBeCloseTo(22.5, 9);
    expect(loads[1]).toBeCloseTo(7.5, 9);
    expect(loads[2]).toBe(0);
  });

  it('counts quantity mismatches and unknown ids', () => {
    const items = [item('a', { quantity: 1 })];
    expect(validatePacking(c, items, [at('a', 0, 0, 0), at('a', 300, 0, 0)]).quantityMismatches).toBe(1);
    expect(validatePacking(c, items, [at('zzz', 0, 0, 0)]).quantityMismatches).toBe(1);
    // With the unplaced list, every item must be accounted for.
    expect(validatePacking(c, items, [], { unplaced: [] }).quantityMismatches).toBe(1);
    expect(validatePacking(c, items, [], { unplaced: [{ id: 'a', quantity: 1, reason: 'x' }] }).quantityMismatches).toBe(0);
  });

  it('flags a payload overrun', () => {
    const r = validatePacking(c, [item('a', { massKg: 60 })], [at('a', 0, 0, 0), at('a', 300, 0, 0)]);
    expect(r.payloadExceeded).toBe(1);
    expect(r.messages[0]).toMatch(/120\.0 kg exceeds maxPayloadKg 100 kg/);
  });

  it('flags an item that could not have passed the door', () => {
    const low: PackContainer = { ...c, doorHeightMm: 90 };
    const r = validatePacking(low, [item('a', { quantity: 1 })], [at('a', 0, 0, 0)]);
    expect(r.doorFaults).toBe(1);
  });

  it('flags load-order faults: a later stop in front of (toward the doors) or on top of an earlier one', () => {
    const items = [item('early', { quantity: 1, stopIndex: 1 }), item('late', { quantity: 2, stopIndex: 2 })];
    const inFront = validatePacking(c, items, [at('early', 0, 0, 0), at('late', 400, 0, 0)]);
    expect(inFront.loadOrderViolations).toBe(1);
    const onTop = validatePacking(c, items, [at('early', 0, 0, 0), at('late', 0, 0, 100)]);
    expect(onTop.loadOrderViolations).toBe(1);
    const higherUp = validatePacking(c, items, [at('late', 0, 0, 0), at('early', 400, 0, 0), at('late', 400, 0, 400)]);
    expect(higherUp.loadOrderViolations).toBe(1); // above 'early' in its column, even with a gap between
    const good = validatePacking(c, items, [at('late', 0, 0, 0), at('late', 0, 0, 100), at('early', 400, 0, 0)]);
    expect(good.loadOrderViolations).toBe(0);
    expect(good.ok).toBe(true);
  });
});
