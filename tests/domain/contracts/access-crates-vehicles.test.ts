import { describe, expect, expectTypeOf, it } from 'vitest';
import { accessCrate, accessOptions, accessResult, venueAccess } from '../../../src/domain/contracts/access.ts';
import { crateDesignRequest, crateDesignView } from '../../../src/domain/contracts/crates.ts';
import { chargeableRequest, loadPlanRequest, vehicle } from '../../../src/domain/contracts/vehicles.ts';
import { checkCrateAccess, type AccessCrate, type AccessOptions, type AccessVenue } from '../../../src/domain/access/index.ts';
import { designCrate, type CrateDesign } from '../../../src/domain/crates/index.ts';
import { checkLoadPlan, containerVehicle, EU_SEMI_TRAILER, RIGID_TRUCK_18T, type Vehicle } from '../../../src/domain/vehicles/index.ts';
import type { z } from 'zod';

describe('contract types feed the core as they are', () => {
  it('parsed values are assignable to the core types', () => {
    expectTypeOf<z.infer<typeof venueAccess>>().toMatchTypeOf<AccessVenue>();
    expectTypeOf<z.infer<typeof accessCrate>>().toMatchTypeOf<AccessCrate>();
    expectTypeOf<z.infer<typeof accessOptions>>().toMatchTypeOf<AccessOptions>();
    expectTypeOf<z.infer<typeof vehicle>>().toMatchTypeOf<Vehicle>();
    expectTypeOf<CrateDesign>().toMatchTypeOf<z.infer<typeof crateDesignView>>();
  });
});

describe('venue access', () => {
  it('accepts unknown measures as null, and the core says "not checked"', () => {
    const v = venueAccess.parse({ doors: [{ name: 'corridor', widthMm: null, heightMm: 2100 }], floorRatingKnPerM2: null });
    const c = accessCrate.parse({ lengthMm: 1600, widthMm: 1150, heightMm: 1000, grossKg: 520, mayTilt: false });
    const r = accessResult.parse(checkCrateAccess(c, v));
    expect(r.verdict).toBe('unknown');
    expect(r.findings[0].reason).toContain('not checked: door width unknown');
  });
  it('leg options parse: a vehicle with no tail lift', () => {
    const o = accessOptions.parse({ vehicle: { bedHeightMm: 1200, tailLiftCapacityKg: null } });
    const r = checkCrateAccess({ lengthMm: 1000, widthMm: 800, heightMm: 900, grossKg: 300, mayTilt: false }, { doors: [{ widthMm: 2000, heightMm: 2500 }], floorRatingKnPerM2: 5, dock: { kind: 'street' } }, o);
    expect(r.findings.find((f) => f.check === 'dock')?.verdict).toBe('fail');
  });
  it('refuses negative sizes and unknown classes, naming the path', () => {
    const bad = venueAccess.safeParse({ doors: [{ widthMm: -1, heightMm: 2000 }], lift: { carLengthMm: 1, carWidthMm: 1, carHeightMm: 1, doorWidthMm: 1, doorHeightMm: 1, ratedLoadKg: 1, loadingClass: 'D' } });
    expect(bad.success).toBe(false);
    const paths = bad.error!.issues.map((i) => i.path.join('.'));
    expect(paths).toContain('doors.0.widthMm');
    expect(paths).toContain('lift.loadingClass');
  });
});

describe('crates', () => {
  it('a design request parses and its result matches the view schema', () => {
    const req = crateDesignRequest.parse({ section: { id: 'DC', massKg: 420, cogMm: [500, 400, 300], bboxMinMm: [0, 0, 0], bboxMaxMm: [1000, 800, 700] }, options: { clearanceMm: 40 } });
    const d = designCrate(req.section, req.options);
    expect(crateDesignView.safeParse(d).success).toBe(true);
  });
  it('refuses a flat section box', () => {
    const r = crateDesignRequest.safeParse({ section: { massKg: 1, cogMm: [0, 0, 0], bboxMinMm: [0, 0, 0], bboxMaxMm: [1, 0, 1] } });
    expect(r.success).toBe(false);
    expect(r.error!.issues[0].path.join('.')).toBe('section.bboxMaxMm');
  });
});

describe('vehicles', () => {
  it('the built-in vehicles pass the schema', () => {
    for (const v of [EU_SEMI_TRAILER, RIGID_TRUCK_18T, containerVehicle('20GP'), containerVehicle('40HC', 'typical')]) {
      expect(vehicle.safeParse(v).success).toBe(true);
    }
  });
  it('a door wider than the inside is refused with its path', () => {
    const r = vehicle.safeParse({ ...RIGID_TRUCK_18T, doorWidthMm: 3000 });
    expect(r.success).toBe(false);
    expect(r.error!.issues[0].path).toEqual(['doorWidthMm']);
  });
  it('a load plan request runs through the core', () => {
    const req = loadPlanRequest.parse({ vehicle: RIGID_TRUCK_18T, load: [{ massKg: 8000, cogMm: [3000, 1240, 800] }] });
    expect(checkLoadPlan(req.vehicle, req.load).ok).toBe(true);
  });
  it('chargeable request: at least one piece', () => {
    expect(chargeableRequest.safeParse({ mode: 'air', pieces: [] }).success).toBe(false);
  });
});
