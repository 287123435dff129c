import { z } from 'zod';

/**
 * Venue access data and the crate shape of the access check, shared by the venue forms, the server and
 * the core (src/domain/access takes values of these types). mm, kg, kN/m², kN, %.
 * A measure the venue has not given is null: the check then says "not checked: … unknown", never pass.
 */

/** A measure that may not be known yet: a positive number or null. */
const knownMm = z.number().positive().max(100_000).nullable();
const knownKg = z.number().positive().max(1_000_000).nullable();

export const handlingKind = z.enum(['hand-pallet-truck', 'electric-pallet-truck', 'electric-lift-truck', 'gas-forklift']);
export const loadingClass = z.enum(['A', 'B', 'C1', 'C2', 'C3']);

export const accessDoor = z.object({
  name: z.string().trim().max(120).optional(),
  /** Measured clear opening, never the nominal door size. */
  widthMm: knownMm,
  heightMm: knownMm,
});

export const accessLift = z.object({
  name: z.string().trim().max(120).optional(),
  carLengthMm: knownMm,
  carWidthMm: knownMm,
  carHeightMm: knownMm,
  doorWidthMm: knownMm,
  doorHeightMm: knownMm,
  ratedLoadKg: knownKg,
  /** ASME A17.1 freight loading class; null when not known (then treated as class A). */
  loadingClass: loadingClass.nullable().optional(),
});

export const accessDock = z.object({
  kind: z.enum(['dock', 'street']).nullable().optional(),
  heightMm: knownMm.optional(),
  levellerRangeMm: z.number().nonnegative().max(2000).nullable().optional(),
});

export const accessRamp = z.object({
  name: z.string().trim().max(120).optional(),
  gradientPct: z.number().nonnegative().max(100).nullable(),
});

export const handlingEquipment = z.object({
  kind: handlingKind,
  capacityKg: knownKg.optional(),
  maxGradientPct: z.number().positive().max(100).nullable().optional(),
});

/** A venue's access data as edited by its staff. */
export const venueAccess = z.object({
  /** Every door on the route from the vehicle to the stage, in order. */
  doors: z.array(accessDoor).max(50),
  lift: accessLift.nullable().optional(),
  floorRatingKnPerM2: z.number().positive().max(1000).nullable().optional(),
  /** Mass of the pallet truck that rides into the lift with a crate, kg (0 allowed). */
  handlingEquipmentKg: z.number().nonnegative().max(10_000).nullable().optional(),
  dock: accessDock.nullable().optional(),
  ramps: z.array(accessRamp).max(20).nullable().optional(),
  equipment: z.array(handlingEquipment).max(20).nullable().optional(),
  pointLoadRatingKn: z.number().positive().max(10_000).nullable().optional(),
  pointLoadAreaSideMm: z.number().positive().max(1000).nullable().optional(),
});
export type VenueAccess = z.infer<typeof venueAccess>;

export const crateSupports = z.discriminatedUnion('kind', [
  z.object({ kind: z.literal('skids'), count: z.number().int().positive().max(20), widthMm: z.number().positive(), lengthMm: z.number().positive().optional() }),
  z.object({ kind: z.enum(['castors', 'feet']), count: z.number().int().positive().max(50), contactDiameterMm: z.number().positive().optional() }),
]);

/** A crate as the access check needs it. */
export const accessCrate = z.object({
  id: z.string().optional(),
  name: z.string().optional(),
  lengthMm: z.number().positive().max(100_000),
  widthMm: z.number().positive().max(100_000),
  heightMm: z.number().positive().max(100_000),
  grossKg: knownKg,
  mayTilt: z.boolean(),
  carriedByHand: z.boolean().optional(),
  supports: crateSupports.optional(),
});
export type AccessCrateInput = z.infer<typeof accessCrate>;

/** The leg's vehicle and the production's own equipment, for the dock and ramp checks. */
export const accessOptions = z.object({
  vehicle: z
    .object({
      bedHeightMm: knownMm.optional(),
      tailLiftCapacityKg: z.number().nonnegative().max(100_000).nullable().optional(),
    })
    .optional(),
  touringEquipment: z.array(handlingEquipment).max(20).optional(),
});

export const accessFinding = z.object({
  check: z.enum(['door', 'lift', 'floor', 'dock', 'ramp', 'point-load']),
  verdict: z.enum(['pass', 'fail', 'unknown']),
  reason: z.string(),
  margin: z.number().optional(),
  marginUnit: z.enum(['mm', 'kg', 'kN/m²', 'kN', '%']).optional(),
  marginRatio: z.number().optional(),
  where: z.string().optional(),
  orientation: z.enum(['upright', 'tilted']).optional(),
});
export const accessResult = z.object({ verdict: z.enum(['pass', 'fail', 'unknown']), findings: z.array(accessFinding) });
export type AccessResultView = z.infer<typeof accessResult>;
