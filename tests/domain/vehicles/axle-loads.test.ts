import { describe, expect, it } from 'vitest';
import { axleLoads, checkLoadPlan, containerVehicle, EU_SEMI_TRAILER, RIGID_TRUCK_18T, twoSupportReactions, type AxleLayout } from '../../../src/domain/vehicles/index.ts';

describe('axle loads by statics, hand-worked', () => {
  // Rigid truck, front axle at x = −1,300 mm, rear at 4,700 (wheelbase 6,000). Load 8,000 kg at
  // x = 3,000: rear share 8,000 × (3,000 + 1,300) / 6,000 = 5,733.33 kg; front 2,266.67 kg.
  // With unladen 4,500 / 2,500: front 6,766.67 (≤ 7,100), rear 8,233.33 (≤ 11,500). Front share of
  // the 15,000 kg gross 45 % ≥ 25 %.  [COMP, statics: ΣF = 0, ΣM = 0]
  it('rigid truck: 8,000 kg at 3,000 mm', () => {
    const r = axleLoads(RIGID_TRUCK_18T.axles!, [{ massKg: 8000, cogMm: [3000, 1240, 800] }]);
    expect(r.groups[0].fromLoadKg).toBeCloseTo(2266.667, 3);
    expect(r.groups[1].fromLoadKg).toBeCloseTo(5733.333, 3);
    expect(r.groups[0].totalKg).toBeCloseTo(6766.667, 3);
    expect(r.groups[1].totalKg).toBeCloseTo(8233.333, 3);
    expect(r.ok).toBe(true);
  });
  // Same load at the doors (x = 7,000): rear 8,000 × 8,300 / 6,000 = 11,066.7 → 13,566.7 > 11,500,
  // front 8,000 − 11,066.7 = −3,066.7 → 1,433.3 kg < 25 % of 15,000 = 3,750: both fail.
  it('rigid truck: the same load at the doors overloads the rear and unloads the steering axle', () => {
    const r = axleLoads(RIGID_TRUCK_18T.axles!, [{ massKg: 8000, cogMm: [7000, 1240, 800] }]);
    expect(r.groups[1].totalKg).toBeCloseTo(13566.667, 3);
    expect(r.groups[1].ok).toBe(false);
    expect(r.groups[0].totalKg).toBeCloseTo(1433.333, 3);
    expect(r.groups[0].ok).toBe(false);
    expect(r.groups[0].reason).toMatch(/steering/);
  });
  // Semi-trailer: kingpin at 1,200, tri-axle at 8,900 (7,700 apart). Full 24,000 kg evenly spread,
  // CoG 6,800: axles 24,000 × 5,600 / 7,700 = 17,454.5 (+ 4,200 = 21,654.5 ≤ 24,000); kingpin
  // 6,545.5 (+ 2,600 = 9,145.5 ≤ 12,000).
  it('semi-trailer: full even load', () => {
    const r = axleLoads(EU_SEMI_TRAILER.axles!, [{ massKg: 24000, cogMm: [6800, 1240, 1000] }]);
    expect(r.groups[1].totalKg).toBeCloseTo(21654.545, 2);
    expect(r.groups[0].totalKg).toBeCloseTo(9145.455, 2);
    expect(r.ok).toBe(true);
  });
  it('a full even payload keeps the rigid truck within every limit', () => {
    const r = checkLoadPlan(RIGID_TRUCK_18T, [{ massKg: RIGID_TRUCK_18T.maxPayloadKg, cogMm: [3650, 1240, 1000] }]);
    expect(r.ok).toBe(true);
  });
  it('empty: the unladen loads', () => {
    const r = axleLoads(EU_SEMI_TRAILER.axles!, []);
    expect(r.groups.map((g) => g.totalKg)).toEqual([2600, 4200]);
  });
});

describe('axle loads: property test (random loads)', () => {
  it('reactions sum to the load and their moments balance the load moment', () => {
    let s = 3;
    const r = () => ((s = (s * 16807) % 2147483647) / 2147483647);
    for (let i = 0; i < 1000; i++) {
      const xa = -2000 + r() * 3000;
      const xb = xa + 500 + r() * 9000;
      const pieces = Array.from({ length: 1 + Math.floor(r() * 8) }, () => ({ massKg: r() * 3000, cogMm: [r() * 13000, r() * 2400, r() * 2000] as [number, number, number] }));
      const layout: AxleLayout = {
        kind: 'semi-trailer',
        kingpin: { name: 'a', positionMm: xa, unladenKg: 0, permittedKg: 1e9 },
        axles: { name: 'b', positionMm: xb, unladenKg: 0, permittedKg: 1e9 },
      };
      const res = axleLoads(layout, pieces);
      const P = pieces.reduce((t, p) => t + p.massKg, 0);
      const M = pieces.reduce((t, p) => t + p.massKg * p.cogMm[0], 0);
      const [ra, rb] = [res.groups[0].fromLoadKg, res.groups[1].fromLoadKg];
      expect(ra + rb).toBeCloseTo(P, 6);
      expect(ra * xa + rb * xb).toBeCloseTo(M, 2);
    }
  });
  it('refuses supports in the wrong order', () => {
    expect(() => twoSupportReactions(100, 0, 500, 100)).toThrow(/behind/);
  });
});

describe('load CoG within limits', () => {
  // Container: CoG within ±5 % of the length from the middle [M, CTU Code "60/40"]. 40' HC typical
  // inside 12,032 mm → ±601.6 mm. A 10 t load with its CoG at 5,000 mm is 1,016 mm forward: fails.
  it("40' HC: a load bunched at the front fails the along limit", () => {
    const hc = containerVehicle('40HC', 'typical');
    const bad = checkLoadPlan(hc, [{ massKg: 10000, cogMm: [5000, 1176, 900] }]);
    expect(bad.cogAlong?.ok).toBe(false);
    expect(bad.cogAlong?.limitMm).toBeCloseTo(601.6, 6);
    const good = checkLoadPlan(hc, [{ massKg: 10000, cogMm: [6400, 1176, 900] }]);
    expect(good.ok).toBe(true);
  });
  it('payload over the limit is named', () => {
    const r = checkLoadPlan(containerVehicle('20GP'), [{ massKg: 29000, cogMm: [2900, 1165, 900] }]);
    expect(r.payload.ok).toBe(false);
    expect(r.reasons[0]).toMatch(/Payload 29000 kg exceeds 28280 kg/);
  });
});
