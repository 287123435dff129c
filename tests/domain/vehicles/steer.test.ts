import { describe, expect, it } from 'vitest';
import { EU_SEMI_TRAILER, RIGID_TRUCK_18T, steerLoad, type PlacedMass, type Vehicle } from '../../../src/domain/vehicles/index.ts';

/** A row of equal crates from x = x0, each 1,200 mm long, CoG at its centre. */
const row = (n: number, massKg: number, x0 = 0): PlacedMass[] =>
  Array.from({ length: n }, (_, i) => ({ xMm: x0 + i * 1200, yMm: 40, lengthMm: 1200, widthMm: 2400, massKg, cogMm: [x0 + i * 1200 + 600, 1240, 800] }));

// Expected moves from the two-support statics of a simply supported beam (ΣF = 0, ΣM = 0), worked by hand
// [COMP, statics; e.g. Beer & Johnston, Vector Mechanics for Engineers: Statics, equilibrium of rigid bodies — MEM],
// with the vehicles' axle figures from src/domain/vehicles/road.ts [PRACTICE].
describe('steering a load along and across the bed', () => {
  // Semi-trailer, kingpin at 1,200 (unladen 2,600, permitted 12,000), tri-axle at 8,900 (4,200 / 24,000).
  // Five 4,000 kg crates against the front wall: 20,000 kg at x = 3,000. Kingpin 2,600 + 20,000 × 5,900 / 7,700
  // = 17,924.7 kg: over. Within limits needs 2,600 + 20,000 × (8,900 − x) / 7,700 ≤ 12,000, x ≥ 5,281 mm:
  // the smallest move is 2,281 mm back, which leaves 14,800 kg on the tri-axle (≤ 24,000).
  it('moves a nose-heavy semi-trailer load back by the least that unloads the kingpin', () => {
    const s = steerLoad(EU_SEMI_TRAILER, row(5, 4000));
    expect(s.before.ok).toBe(false);
    expect(s.before.axles!.groups[0].totalKg).toBeCloseTo(17924.675, 2);
    expect(s.alongMm).toBeGreaterThanOrEqual(2280);
    expect(s.alongMm).toBeLessThanOrEqual(2282);
    expect(s.after.ok).toBe(true);
    expect(s.after.axles!.groups[0].totalKg).toBeLessThanOrEqual(12000);
    expect(s.after.axles!.groups[1].totalKg).toBeCloseTo(4200 + (20000 * (3000 + s.alongMm - 1200)) / 7700, 6);
    expect(s.frontGapMm).toBe(s.alongMm);
    expect(s.advice.join(' ')).toMatch(/block or brace the 2,28\d mm gap at the front wall/);
  });

  // Rigid truck, front axle at −1,300 (4,500 / 7,100), rear at 4,700 (2,500 / 11,500). One 10,000 kg crate,
  // 1,000 mm long, at the front wall: x = 500, front 4,500 + 10,000 × 4,200 / 6,000 = 11,500: over. The front
  // axle is within 7,100 for x ≥ 4,700 − 2,600 × 0.6 = 3,140; the rear within 11,500 for x ≤ 4,100. Least move 2,640.
  it('moves a heavy single crate on a rigid truck into the window both axles allow', () => {
    const crate: PlacedMass = { xMm: 0, yMm: 740, lengthMm: 1000, widthMm: 1000, massKg: 10000, cogMm: [500, 1240, 600] };
    const s = steerLoad(RIGID_TRUCK_18T, [crate]);
    expect(s.before.axles!.groups[0].totalKg).toBeCloseTo(11500, 6);
    expect(Math.abs(s.alongMm - 2640)).toBeLessThanOrEqual(1);
    expect(s.after.ok).toBe(true);
  });

  // Across: 5,000 kg, 1,000 mm wide, against the y = 0 wall of the 2,480 mm semi-trailer bed: CoG 740 mm off the
  // middle, limit 5 % of the width = 124 mm. Within it needs y ≥ 1,240 − 124 = 1,116: a move of 616 mm.
  it('moves a load across to bring its CoG within the lateral limit', () => {
    const crate: PlacedMass = { xMm: 4000, yMm: 0, lengthMm: 2000, widthMm: 1000, massKg: 5000, cogMm: [5000, 500, 600] };
    const s = steerLoad(EU_SEMI_TRAILER, [crate]);
    expect(s.before.cogAcross!.ok).toBe(false);
    expect(Math.abs(s.acrossMm - 616)).toBeLessThanOrEqual(1);
    expect(s.after.cogAcross!.ok).toBe(true);
    expect(s.alongMm).toBe(0);
  });

  it('leaves a load that is within limits where it is', () => {
    const s = steerLoad(EU_SEMI_TRAILER, row(11, 2000));
    expect(s.before.ok).toBe(true);
    expect([s.alongMm, s.acrossMm]).toEqual([0, 0]);
    expect(s.advice).toEqual([]);
  });

  it('says so, and gives no pass, when no room is left to move the load', () => {
    const box: Vehicle = { id: 'box', name: 'Box van', kind: 'custom', lengthMm: 3600, widthMm: 2400, heightMm: 2400, maxPayloadKg: 10000, cogLimits: { alongMm: 300 }, source: 'test' };
    // Three crates fill the length; the heavy one at the front puts the CoG 900 mm forward of the middle.
    const load: PlacedMass[] = [
      { xMm: 0, yMm: 0, lengthMm: 1200, widthMm: 2400, massKg: 3000, cogMm: [600, 1200, 500] },
      { xMm: 1200, yMm: 0, lengthMm: 1200, widthMm: 2400, massKg: 0, cogMm: [1800, 1200, 500] },
      { xMm: 2400, yMm: 0, lengthMm: 1200, widthMm: 2400, massKg: 0, cogMm: [3000, 1200, 500] },
    ];
    const s = steerLoad(box, load);
    expect(s.alongMm).toBe(0);
    expect(s.after.ok).toBe(false);
    expect(s.advice.join(' ')).toMatch(/No position along the bed/);
  });

  it('moves forward when the load sits at the doors and the rear axle is over', () => {
    // 10,000 kg crate at the doors of the rigid truck (x = 6,800): rear 2,500 + 10,000 × 8,100 / 6,000 = 16,000: over.
    // The window is x ∈ [3,140, 4,100]; the least move forward brings x to 4,100: −2,700 mm.
    const crate: PlacedMass = { xMm: 6300, yMm: 740, lengthMm: 1000, widthMm: 1000, massKg: 10000, cogMm: [6800, 1240, 600] };
    const s = steerLoad(RIGID_TRUCK_18T, [crate]);
    expect(Math.abs(s.alongMm + 2700)).toBeLessThanOrEqual(1);
    expect(s.after.ok).toBe(true);
    expect(s.advice.join(' ')).toMatch(/further forward .* gap at the doors/);
  });
});
