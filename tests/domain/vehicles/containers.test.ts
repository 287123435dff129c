import { describe, expect, it } from 'vitest';
import { AIR_PALLET_MAIN_DECK, CONTAINER_TYPES, EU_SEMI_TRAILER, RIGID_TRUCK_18T, containerVehicle, customVehicle, vehicleProblems } from '../../../src/domain/vehicles/index.ts';
import { EUR_PALLET } from '../../../src/domain/crates/index.ts';
import { KG_PER_POUND, MM_PER_INCH } from '../../../src/domain/units.ts';

const type = (code: '20GP' | '40GP' | '40HC') => CONTAINER_TYPES.find((c) => c.code === code)!;

describe('ISO containers', () => {
  // ISO 668 external sizes: 20' 6,058 × 2,438 × 2,591; 40' 12,192 × 2,438 × 2,591; 40' HC height
  // 2,896 (REFERENCES §4.1 [S, 3rd party]). Cross-check with the nominal feet and inches the standard
  // names them by: 8 ft = 2,438.4 mm, 8 ft 6 in = 2,590.8, 9 ft 6 in = 2,895.6, 40 ft = 12,192 exactly.
  it('ISO 668 external sizes agree with the nominal feet and inches', () => {
    const ft = 12 * MM_PER_INCH;
    expect(type('40GP').externalMm[0]).toBe(Math.round(40 * ft));
    for (const c of CONTAINER_TYPES) expect(c.externalMm[1]).toBe(Math.round(8 * ft));
    expect(type('20GP').externalMm[2]).toBe(Math.round(8.5 * ft));
    expect(type('40HC').externalMm[2]).toBe(Math.round(9.5 * ft));
    expect(type('20GP').externalMm).toEqual([6058, 2438, 2591]);
  });
  // ISO 668 Amd 1:2005 max gross 30,480 kg (REFERENCES §4.1 [S, 3rd party]), quoted alongside
  // 67,200 lb: the two agree to the standard's rounding (67,200 lb = 30,481.4 kg).
  it('max gross 30,480 kg, about 67,200 lb', () => {
    for (const c of CONTAINER_TYPES) expect(c.maxGrossKg).toBe(30480);
    expect(Math.abs(67200 * KG_PER_POUND - 30480)).toBeLessThan(2);
  });
  // ISO 1496-1 minima (REFERENCES §4.1 [S, 3rd party]): internal width 2,330, height 2,350 (8'6"),
  // length 5,867 (20') and 11,998 (40'); door 2,286 × 2,261 (8'6") and 2,286 × 2,566 (9'6").
  it('ISO 1496-1 minimum internal and door sizes', () => {
    expect(type('20GP').internalMinMm).toEqual([5867, 2330, 2350]);
    expect(type('40GP').internalMinMm).toEqual([11998, 2330, 2350]);
    expect(type('20GP').doorMinMm).toEqual([2286, 2261]);
    expect(type('40HC').doorMinMm).toEqual([2286, 2566]);
  });
  it("typical internal sizes (20' GP 5,898 × 2,352 × 2,393; 40' HC 12,032 × 2,352 × 2,698) meet the minima", () => {
    expect(type('20GP').internalTypicalMm).toEqual([5898, 2352, 2393]);
    expect(type('40HC').internalTypicalMm).toEqual([12032, 2352, 2698]);
    for (const c of CONTAINER_TYPES) {
      c.internalTypicalMm.forEach((v, i) => expect(v).toBeGreaterThanOrEqual(c.internalMinMm[i]));
      c.internalTypicalMm.forEach((v, i) => expect(v).toBeLessThan(c.externalMm[i]));
      c.doorTypicalMm.forEach((v, i) => expect(v).toBeGreaterThanOrEqual(c.doorMinMm[i]));
    }
  });
  it("a 40' high cube's door is lower than its inside (Verrière Pavilion delivery)", () => {
    const hc = containerVehicle('40HC', 'typical');
    expect(hc.doorHeightMm!).toBeLessThan(hc.heightMm);
    expect(hc.maxPayloadKg).toBe(30480 - 3900);
    expect(vehicleProblems(hc)).toEqual([]);
  });
  // Practical fill (REFERENCES §4.1 [S, 3rd party]): 20' nominal volume 33.1 m³ from typical sizes.
  it("20' typical inside volume is about 33.1 m³", () => {
    const v = type('20GP').internalTypicalMm.reduce((a, b) => a * b, 1) / 1e9;
    expect(v).toBeCloseTo(33.2, 1);
  });
});

describe('road vehicles and the air pallet', () => {
  // A 13.6 m trailer takes 33 EUR pallets (REFERENCES §4.1 [S, 3rd party]): 3 across (3 × 800 =
  // 2,400 ≤ 2,480) in 11 rows of 1,200 (13,200 ≤ 13,600).
  it('the semi-trailer floor takes 33 EUR pallets, 3 across in 11 rows', () => {
    const [l, w] = EUR_PALLET.outerMm;
    const across = Math.floor(EU_SEMI_TRAILER.widthMm / w);
    const rows = Math.floor(EU_SEMI_TRAILER.lengthMm / l);
    expect(across * rows).toBe(33);
    expect(EU_SEMI_TRAILER.maxPayloadKg).toBe(24000);
  });
  // 96/53/EC Annex I: 18 t two-axle motor vehicle, 11.5 t driving axle; tri-axle semi-trailer 24 t [M].
  it('carries the directive limits', () => {
    expect(RIGID_TRUCK_18T.maxGrossKg).toBe(18000);
    expect(RIGID_TRUCK_18T.axles?.kind === 'rigid' && RIGID_TRUCK_18T.axles.rear.permittedKg).toBe(11500);
    expect(EU_SEMI_TRAILER.axles?.kind === 'semi-trailer' && EU_SEMI_TRAILER.axles.axles.permittedKg).toBe(24000);
    expect(vehicleProblems(RIGID_TRUCK_18T)).toEqual([]);
    expect(vehicleProblems(EU_SEMI_TRAILER)).toEqual([]);
  });
  // Air pallet 96 × 125 in base, 15,000 lb gross [M]: 6,804 kg.
  it('air pallet: 15,000 lb = 6,804 kg max gross, inside its 96 × 125 in base', () => {
    expect(AIR_PALLET_MAIN_DECK.maxGrossKg).toBe(6804);
    expect(AIR_PALLET_MAIN_DECK.lengthMm).toBeLessThan(125 * MM_PER_INCH);
    expect(AIR_PALLET_MAIN_DECK.widthMm).toBeLessThan(96 * MM_PER_INCH);
  });
  it('a custom vehicle with a door wider than its inside is refused, naming the field', () => {
    expect(() => customVehicle({ id: 'van', name: 'Van', lengthMm: 3000, widthMm: 1700, heightMm: 1800, doorWidthMm: 1800, maxPayloadKg: 1200 })).toThrow(/door width 1800/);
    expect(() => customVehicle({ id: 'van', name: 'Van', lengthMm: 0, widthMm: 1700, heightMm: 1800, maxPayloadKg: 1200 })).toThrow(/inside length/);
    expect(customVehicle({ id: 'van', name: 'Van', lengthMm: 3000, widthMm: 1700, heightMm: 1800, maxPayloadKg: 1200 }).kind).toBe('custom');
  });
});
