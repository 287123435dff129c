import { describe, expect, it } from 'vitest';
import { checkCrateAccess, pressureKnPerM2 } from '../../../src/domain/access/index.ts';
import { KG_PER_POUND, MM_PER_INCH, STANDARD_GRAVITY_M_PER_S2 } from '../../../src/domain/units.ts';
import { controlDesk, driveCoreCrate, teatrBursztynowy } from './scenario-fixtures.ts';

const floor = (r: ReturnType<typeof checkCrateAccess>) => r.findings.find((f) => f.check === 'floor')!;
const point = (r: ReturnType<typeof checkCrateAccess>) => r.findings.find((f) => f.check === 'point-load')!;

describe('floor pressure: gross × g over the upright footprint (REFERENCES §4.5 pressure check [CP])', () => {
  // Hand-worked: 520 kg × 9.80665 m/s² = 5,099.458 N = 5.0995 kN; footprint 1.6 × 1.15 = 1.84 m²;
  // 5.0995 / 1.84 = 2.7714 kN/m² against the 5.0 kN/m² stage of Teatr Bursztynowy (EN 1991-1-1 C4,
  // REFERENCES §4.5 [M]): passes with 2.2286 kN/m² to spare.
  it('Teatr Bursztynowy 5.0 kN/m²: the drive core crate bears 2.77 kN/m²', () => {
    const f = floor(checkCrateAccess(driveCoreCrate, teatrBursztynowy));
    expect(f.verdict).toBe('pass');
    expect(5 - (f.margin as number)).toBeCloseTo(2.7714, 4);
  });
  // Hand-worked fail: 300 kg on 0.8 × 0.6 m = 0.48 m²: 2.942 kN / 0.48 = 6.129 kN/m² > 5.0; spreader
  // area needed 2.942 / 5.0 = 0.588 m².
  it('a dense 300 kg case on 0.48 m² overloads the 5.0 kN/m² stage and is told the spreader area', () => {
    const f = floor(checkCrateAccess({ lengthMm: 800, widthMm: 600, heightMm: 700, grossKg: 300, mayTilt: false }, teatrBursztynowy));
    expect(f.verdict).toBe('fail');
    expect(5 - (f.margin as number)).toBeCloseTo(6.129, 3);
    expect(f.reason).toMatch(/0\.59 m²/);
  });
  // Unit check against ASCE 7 stage floors 150 psf = 7.18 kN/m² (REFERENCES §4.5 [S, 3rd party]):
  // 150 lb on one square foot must give 7.18 kN/m².
  it('150 lb over one square foot is 7.18 kN/m² (ASCE 7 stage floor figure)', () => {
    const ft = 12 * MM_PER_INCH;
    expect(pressureKnPerM2(150 * KG_PER_POUND, ft * ft)).toBeCloseTo(7.18, 2);
  });
  it('pressure scales with mass and inversely with area (property)', () => {
    for (let m = 10; m < 3000; m += 97) {
      const p = pressureKnPerM2(m, 1e6);
      expect(p).toBeCloseTo((m * STANDARD_GRAVITY_M_PER_S2) / 1000, 9);
      expect(pressureKnPerM2(m, 2e6)).toBeCloseTo(p / 2, 9);
    }
  });
  it('rating unknown or gross unknown: unknown', () => {
    expect(floor(checkCrateAccess(driveCoreCrate, { doors: teatrBursztynowy.doors })).verdict).toBe('unknown');
    expect(floor(checkCrateAccess({ ...driveCoreCrate, grossKg: null }, teatrBursztynowy)).verdict).toBe('unknown');
  });
});

describe('point load under skids and castors', () => {
  // Control desk 70 kg on 4 castors, taken as resting on 3 [PRACTICE]: 70 × 9.80665 / 3 = 228.8 N
  // = 0.2288 kN per castor against a 2.0 kN rating.
  it('castors: per contact, on three of four', () => {
    const f = point(checkCrateAccess(controlDesk, { ...teatrBursztynowy, pointLoadRatingKn: 2 }));
    expect(f.verdict).toBe('pass');
    expect(2 - (f.margin as number)).toBeCloseTo(0.2288, 4);
    expect(point(checkCrateAccess(controlDesk, { ...teatrBursztynowy, pointLoadRatingKn: 0.2 })).verdict).toBe('fail');
  });
  // Skids: 520 kg on 2 skids 100 mm × 1,600 mm = 0.32 m² → 5.0995 / 0.32 = 15.936 kN/m²; on a 50 mm
  // square (EN 1991-1-1 §6.3.1.2 area for Q_k [MEM]) 15.936 × 0.0025 = 0.03984 kN.
  it('skids: bearing pressure on the rating square', () => {
    const f = point(checkCrateAccess(driveCoreCrate, { ...teatrBursztynowy, pointLoadRatingKn: 0.03 }));
    expect(f.verdict).toBe('fail');
    expect(0.03 - (f.margin as number)).toBeCloseTo(0.03984, 5);
  });
  it('supports unknown: unknown', () => {
    const f = point(checkCrateAccess({ ...driveCoreCrate, supports: undefined }, { ...teatrBursztynowy, pointLoadRatingKn: 4 }));
    expect(f.verdict).toBe('unknown');
  });
  it('no point-load rating recorded: no point-load finding', () => {
    expect(checkCrateAccess(driveCoreCrate, teatrBursztynowy).findings.some((f) => f.check === 'point-load')).toBe(false);
  });
});
