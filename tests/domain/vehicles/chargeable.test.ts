import { describe, expect, it } from 'vitest';
import { airChargeable, roadChargeable, seaChargeable } from '../../../src/domain/vehicles/index.ts';

describe('chargeable weight (REFERENCES §4.2)', () => {
  // Air: L × W × H (cm) / 6,000 [S: airport authority tariff; IATA practice].
  // 120 × 80 × 100 cm = 960,000 cm³ / 6,000 = 160 kg [COMP from the published 6,000 rule].
  it('air: 120 × 80 × 100 cm is 160 kg volumetric; a 100 kg piece is charged 160 kg', () => {
    const r = airChargeable([{ lengthMm: 1200, widthMm: 800, heightMm: 1000, massKg: 100 }]);
    expect(r.volumetricKg).toBeCloseTo(160, 9);
    expect(r.chargeableKg).toBeCloseTo(160, 9);
  });
  it('air: a dense piece is charged its actual mass; divisor 5,000 (couriers) gives 192 kg', () => {
    expect(airChargeable([{ lengthMm: 1200, widthMm: 800, heightMm: 1000, massKg: 420 }]).chargeableKg).toBe(420);
    expect(airChargeable([{ lengthMm: 1200, widthMm: 800, heightMm: 1000, massKg: 100 }], { divisorCm3PerKg: 5000 }).volumetricKg).toBeCloseTo(192, 9);
  });
  it('air: rounding each dimension up to the whole cm when asked', () => {
    // 120.1 → 121, 80.05 → 81, 99.99 → 100: 980,100 / 6,000 = 163.35
    expect(airChargeable([{ lengthMm: 1201, widthMm: 800.5, heightMm: 999.9, massKg: 1 }], { roundUpCm: true }).volumetricKg).toBeCloseTo(163.35, 9);
  });
  // Road: loading metres = L × W (m) / 2.4 [CP]. A EUR pallet 1.2 × 0.8 = 0.4 LDM; 33 pallets fill
  // 13.2 LDM of a 13.6 m trailer. At 1,750 kg/LDM, 10 pallets of 300 kg (3,000 kg actual) are
  // charged 4.0 × 1,750 = 7,000 kg.
  it('road: EUR pallet is 0.4 loading metres; 10 light pallets charged by loading metres', () => {
    const one = roadChargeable([{ lengthMm: 1200, widthMm: 800, heightMm: 1000, massKg: 300 }]);
    expect(one.loadingMetres).toBeCloseTo(0.4, 12);
    const ten = roadChargeable([{ lengthMm: 1200, widthMm: 800, heightMm: 1000, massKg: 300, quantity: 10 }]);
    expect(ten.loadingMetres).toBeCloseTo(4, 12);
    expect(ten.chargeableKg).toBeCloseTo(7000, 9);
    expect(roadChargeable([{ lengthMm: 1200, widthMm: 800, heightMm: 1000, massKg: 300, quantity: 10 }], { kgPerLoadingMetre: 1850 }).chargeableKg).toBeCloseTo(7400, 9);
  });
  it('road: a piece stacked on others takes no floor', () => {
    const r = roadChargeable([
      { lengthMm: 1200, widthMm: 800, heightMm: 1000, massKg: 300 },
      { lengthMm: 1200, widthMm: 800, heightMm: 1000, massKg: 300, stackedOnOthers: true },
    ]);
    expect(r.loadingMetres).toBeCloseTo(0.4, 12);
    expect(r.actualKg).toBe(600);
  });
  // Sea: revenue tonnes = max(m³, t) [CP]. 2 m³ of 800 kg → 2 RT; 1 m³ of 1,500 kg → 1.5 RT.
  it('sea: revenue tonnes', () => {
    expect(seaChargeable([{ lengthMm: 2000, widthMm: 1000, heightMm: 1000, massKg: 800 }]).revenueTonnes).toBeCloseTo(2, 12);
    expect(seaChargeable([{ lengthMm: 1000, widthMm: 1000, heightMm: 1000, massKg: 1500 }]).revenueTonnes).toBeCloseTo(1.5, 12);
  });
  it('bad pieces are named', () => {
    expect(() => airChargeable([{ lengthMm: 1200, widthMm: 0, heightMm: 1000, massKg: 1 }])).toThrow(/Piece 1: widthMm/);
    expect(() => roadChargeable([{ lengthMm: 1200, widthMm: 800, heightMm: 1000, massKg: 1, quantity: 0 }])).toThrow(/quantity/);
  });
});
