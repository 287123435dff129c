import { describe, expect, it } from 'vitest';
import { checkCrateAccess, RAMP_LIMIT_PCT } from '../../../src/domain/access/index.ts';
import { MM_PER_INCH } from '../../../src/domain/units.ts';
import { driveCoreCrate, forumAurelian, kelderwerfHall } from './scenario-fixtures.ts';

const of = (r: ReturnType<typeof checkCrateAccess>, c: string) => r.findings.find((f) => f.check === c)!;

describe('ramps against handling equipment', () => {
  // Ramp limits: hand pallet truck 3 %, electric pallet truck 7 %, electric lift truck 10 %, gas
  // forklift 15 % (REFERENCES §4.5 [S, 3rd party]).
  it('carries the published limits', () => {
    expect(RAMP_LIMIT_PCT).toEqual({ 'hand-pallet-truck': 3, 'electric-pallet-truck': 7, 'electric-lift-truck': 10, 'gas-forklift': 15 });
  });
  it('Forum Aurelian 9 %: a hand pallet truck (3 %) cannot take it', () => {
    const f = of(checkCrateAccess(driveCoreCrate, forumAurelian), 'ramp');
    expect(f.verdict).toBe('fail');
    expect(f.margin).toBe(-6);
  });
  it('9 %: an electric pallet truck (7 %) cannot either; an electric lift truck (10 %) can, 1 % to spare', () => {
    const epl = { ...forumAurelian, equipment: [{ kind: 'electric-pallet-truck' as const, capacityKg: 1600 }] };
    expect(of(checkCrateAccess(driveCoreCrate, epl), 'ramp').verdict).toBe('fail');
    const f = of(checkCrateAccess(driveCoreCrate, forumAurelian, { touringEquipment: [{ kind: 'electric-lift-truck', capacityKg: 1500 }] }), 'ramp');
    expect(f.verdict).toBe('pass');
    expect(f.margin).toBeCloseTo(1, 9);
  });
  it('boundaries: 3 % passes a hand pallet truck, 3.1 % does not', () => {
    const at = (g: number) => of(checkCrateAccess(driveCoreCrate, { ...forumAurelian, ramps: [{ gradientPct: g }] }), 'ramp').verdict;
    expect(at(3)).toBe('pass');
    expect(at(3.1)).toBe('fail');
  });
  it('a truck rated for the gradient but not the mass does not pass', () => {
    const v = { ...forumAurelian, equipment: [{ kind: 'gas-forklift' as const, capacityKg: 400 }] };
    expect(of(checkCrateAccess(driveCoreCrate, v), 'ramp').verdict).toBe('fail');
  });
  it('gradient unknown or no equipment recorded: unknown', () => {
    expect(of(checkCrateAccess(driveCoreCrate, { ...forumAurelian, ramps: [{ gradientPct: null }] }), 'ramp').verdict).toBe('unknown');
    expect(of(checkCrateAccess(driveCoreCrate, { ...forumAurelian, equipment: [] }), 'ramp').verdict).toBe('unknown');
  });
});

describe('dock, tail lift and forklift', () => {
  // Kelderwerf Hall: street level, no dock: a tail lift is needed. 520 kg crate + 65 kg pallet truck
  // on a 1,000 kg tail lift: 415 kg to spare [COMP].
  it('Kelderwerf Hall: tail lift needed and enough', () => {
    const f = of(checkCrateAccess(driveCoreCrate, kelderwerfHall, { vehicle: { tailLiftCapacityKg: 1000 } }), 'dock');
    expect(f.verdict).toBe('pass');
    expect(f.reason).toMatch(/tail lift needed/);
    expect(f.margin).toBe(415);
  });
  it('street level without a tail lift or forklift fails; with the vehicle unknown it is unknown', () => {
    expect(of(checkCrateAccess(driveCoreCrate, kelderwerfHall, { vehicle: { tailLiftCapacityKg: null } }), 'dock').verdict).toBe('fail');
    expect(of(checkCrateAccess(driveCoreCrate, kelderwerfHall, { vehicle: { tailLiftCapacityKg: 500 } }), 'dock').verdict).toBe('fail');
    expect(of(checkCrateAccess(driveCoreCrate, kelderwerfHall), 'dock').verdict).toBe('unknown');
  });
  it('street level with a forklift on site passes: forklift needed', () => {
    const v = { ...kelderwerfHall, equipment: [{ kind: 'gas-forklift' as const, capacityKg: 2500 }] };
    const f = of(checkCrateAccess(driveCoreCrate, v, { vehicle: { tailLiftCapacityKg: null } }), 'dock');
    expect(f.verdict).toBe('pass');
    expect(f.reason).toMatch(/forklift needed/);
  });
  // Assay House: 48 in dock = 1,219.2 mm (REFERENCES §4.5, North American dock height [S, 3rd party]).
  // Trailer bed 1,300 mm: 80.8 mm above; leveller ±250 mm: passes with 169.2 mm to spare [COMP].
  it('Assay House 48 in dock with a leveller: bed within reach', () => {
    const v = { doors: [{ widthMm: 2500, heightMm: 3000 }], floorRatingKnPerM2: 12, dock: { kind: 'dock' as const, heightMm: 48 * MM_PER_INCH, levellerRangeMm: 250 } };
    const f = of(checkCrateAccess(driveCoreCrate, v, { vehicle: { bedHeightMm: 1300 } }), 'dock');
    expect(f.verdict).toBe('pass');
    expect(f.margin).toBeCloseTo(169.2, 9);
  });
  it('a dock out of the leveller reach falls back to tail lift or forklift', () => {
    const v = { doors: [{ widthMm: 2500, heightMm: 3000 }], dock: { kind: 'dock' as const, heightMm: 1200, levellerRangeMm: 0 } };
    expect(of(checkCrateAccess(driveCoreCrate, v, { vehicle: { bedHeightMm: 700, tailLiftCapacityKg: null } }), 'dock').verdict).toBe('fail');
    expect(of(checkCrateAccess(driveCoreCrate, v, { vehicle: { bedHeightMm: 1300 } }), 'dock').verdict).toBe('unknown');
  });
  it('dock height or bed height unknown: unknown', () => {
    const v = { doors: [{ widthMm: 2500, heightMm: 3000 }], dock: { kind: 'dock' as const } };
    expect(of(checkCrateAccess(driveCoreCrate, v, { vehicle: { bedHeightMm: 1300 } }), 'dock').reason).toMatch(/dock height unknown/);
    expect(of(checkCrateAccess(driveCoreCrate, { ...v, dock: { kind: 'dock', heightMm: 1200 } }), 'dock').reason).toMatch(/bed height unknown/);
  });
});
