import { z } from 'zod';
import { vec3Mm } from './mass.ts';

/**
 * Vehicles, containers and chargeable-weight requests, shared by the vehicle forms, the server and the
 * core (src/domain/vehicles). Load-space frame: x from the front wall to the doors, y across, z up; mm, kg.
 */

export const axleGroup = z.object({
  name: z.string().trim().min(1).max(60),
  positionMm: z.number().min(-20_000).max(30_000),
  unladenKg: z.number().nonnegative().max(100_000),
  permittedKg: z.number().positive().max(100_000),
  minimumKg: z.number().nonnegative().optional(),
});

export const axleLayout = z.discriminatedUnion('kind', [
  z.object({ kind: z.literal('rigid'), front: axleGroup, rear: axleGroup, minFrontShare: z.number().min(0).max(1).optional() }),
  z.object({ kind: z.literal('semi-trailer'), kingpin: axleGroup, axles: axleGroup }),
]);

const lengthMm = z.number().positive().max(30_000);

export const vehicle = z
  .object({
    id: z.string().trim().min(1).max(80),
    name: z.string().trim().min(1).max(120),
    kind: z.enum(['container', 'semi-trailer', 'rigid-truck', 'air-pallet', 'custom']),
    lengthMm,
    widthMm: lengthMm,
    heightMm: lengthMm,
    doorWidthMm: lengthMm.optional(),
    doorHeightMm: lengthMm.optional(),
    maxPayloadKg: z.number().positive().max(200_000),
    maxGrossKg: z.number().positive().max(200_000).optional(),
    tareKg: z.number().nonnegative().max(200_000).optional(),
    bedHeightMm: z.number().positive().max(3000).optional(),
    tailLiftCapacityKg: z.number().nonnegative().max(10_000).nullable().optional(),
    axles: axleLayout.optional(),
    cogLimits: z.object({ alongMm: z.number().nonnegative().optional(), acrossMm: z.number().nonnegative().optional() }).optional(),
    source: z.string().max(500),
  })
  .refine((v) => v.doorWidthMm === undefined || v.doorWidthMm <= v.widthMm, { message: 'door width must not exceed the inside width', path: ['doorWidthMm'] })
  .refine((v) => v.doorHeightMm === undefined || v.doorHeightMm <= v.heightMm, { message: 'door height must not exceed the inside height', path: ['doorHeightMm'] });
export type VehicleInput = z.infer<typeof vehicle>;

export const pointMass = z.object({ massKg: z.number().nonnegative(), cogMm: vec3Mm });

/** Check a load (crates as point masses) in a vehicle. */
export const loadPlanRequest = z.object({ vehicle, load: z.array(pointMass).max(10_000) });

export const shipmentPiece = z.object({
  lengthMm: z.number().positive().max(30_000),
  widthMm: z.number().positive().max(30_000),
  heightMm: z.number().positive().max(30_000),
  massKg: z.number().nonnegative().max(100_000),
  quantity: z.number().int().positive().max(10_000).optional(),
  stackedOnOthers: z.boolean().optional(),
});

/** Chargeable weight settings: air divisor (cm³/kg) and road kg per loading metre are settings. */
export const chargeableRequest = z.object({
  mode: z.enum(['air', 'road', 'sea']),
  pieces: z.array(shipmentPiece).min(1).max(10_000),
  airDivisorCm3PerKg: z.number().positive().max(20_000).optional(),
  roundUpCm: z.boolean().optional(),
  roadKgPerLoadingMetre: z.number().positive().max(10_000).optional(),
});
export type ChargeableRequest = z.infer<typeof chargeableRequest>;
