import { z } from 'zod';
import { vec3Mm } from './mass.ts';
import { crateDesignOptions, crateMakeUp } from './crates.ts';
import { vehicle } from './vehicles.ts';

/**
 * Requests and responses of the crates API (`/api/productions/:productionId/crates`) and the loads API
 * (`…/loads`: vehicles, load settings, packing runs). mm, kg; the crate frame has its origin at the outer
 * bottom corner, x along the length, z up; the load space has x from the front wall to the doors.
 * The engineering shapes themselves are in ./crates.ts and ./vehicles.ts (the cores' shapes).
 */

const version = z.number().int().nonnegative();
const code = z.string().trim().min(1, 'Enter a code.').max(40, 'Use at most 40 characters.');
const name = z.string().trim().max(120, 'Use at most 120 characters.');
const notes = z.string().max(4000, 'Use at most 4,000 characters.');
const positiveVec3 = z.tuple([z.number().positive().max(30_000), z.number().positive().max(30_000), z.number().positive().max(30_000)]);
const massKg = z.number().nonnegative().max(100_000);

export const crateKind = z.enum(['designed', 'stock', 'pallet']);
export type CrateKind = z.infer<typeof crateKind>;

// ---------------------------------------------------------------------------------------------- crates

export const crateContentBody = z
  .object({
    partLineId: z.string().uuid().nullable().optional(),
    sectionId: z.string().uuid().nullable().optional(),
    description: z.string().trim().max(300).default(''),
    quantity: z.number().positive().max(1_000_000).default(1),
    /** Mass of the whole line, kg; null = unknown. For a section or part line left out, taken from the breakdown. */
    massKg: massKg.nullable().optional(),
    /** CoG of the line in the crate frame, mm; null = unknown. */
    cogMm: vec3Mm.nullable().optional(),
  })
  .refine((c) => c.description.length > 0 || c.partLineId || c.sectionId, { message: 'Describe the content, or name a section or part line.', path: ['description'] });
export type CrateContentBody = z.input<typeof crateContentBody>;

export const updateCrateContentBody = z.object({
  version,
  description: z.string().trim().max(300).optional(),
  quantity: z.number().positive().max(1_000_000).optional(),
  massKg: massKg.nullable().optional(),
  cogMm: vec3Mm.nullable().optional(),
});

const crateFlags = {
  stackable: z.boolean().optional(),
  maxLoadOnTopKg: massKg.nullable().optional(),
  thisWayUp: z.boolean().optional(),
  fragile: z.boolean().optional(),
  mayTilt: z.boolean().optional(),
  ispm15Required: z.boolean().optional(),
  maxGrossKg: z.number().positive().max(100_000).nullable().optional(),
  notes: notes.optional(),
};

/**
 * A new crate: designed around a section (the core sizes it), from the stock catalogue (`stockId`), or a
 * stock case / pallet of the planner's own sizes (`outerMm` and `tareKg`).
 */
export const createCrateBody = z
  .object({
    code,
    name: name.default(''),
    kind: crateKind,
    sectionId: z.string().uuid().optional(),
    designOptions: crateDesignOptions.optional(),
    stockId: z.string().trim().min(1).max(60).optional(),
    outerMm: positiveVec3.optional(),
    innerMm: positiveVec3.nullable().optional(),
    tareKg: massKg.optional(),
    ...crateFlags,
  })
  .superRefine((b, ctx) => {
    if (b.kind === 'designed' && !b.sectionId) ctx.addIssue({ code: 'custom', message: 'A designed crate needs the section it is designed around.', path: ['sectionId'] });
    if (b.kind !== 'designed' && !b.stockId && (!b.outerMm || b.tareKg === undefined)) {
      ctx.addIssue({ code: 'custom', message: 'Pick a catalogue entry, or give the outer size and the tare.', path: [b.outerMm ? 'tareKg' : 'outerMm'] });
    }
    if (b.innerMm && b.outerMm && b.innerMm.some((v, i) => v > b.outerMm![i])) {
      ctx.addIssue({ code: 'custom', message: 'The inside must not be larger than the outside.', path: ['innerMm'] });
    }
  });
export type CreateCrateBody = z.input<typeof createCrateBody>;

export const updateCrateBody = z.object({
  version,
  code: code.optional(),
  name: name.optional(),
  outerMm: positiveVec3.optional(),
  innerMm: positiveVec3.nullable().optional(),
  tareKg: massKg.optional(),
  /** Designed crates: design again around the section as it is now, with these options. */
  designOptions: crateDesignOptions.optional(),
  redesign: z.boolean().optional(),
  ...crateFlags,
});
export type UpdateCrateBody = z.input<typeof updateCrateBody>;

export const crateContentView = z.object({
  id: z.string(),
  crateId: z.string(),
  partLineId: z.string().nullable(),
  sectionId: z.string().nullable(),
  description: z.string(),
  quantity: z.number(),
  massKg: z.number().nullable(),
  cogMm: vec3Mm.nullable(),
  version: z.number().int(),
});
export type CrateContentView = z.infer<typeof crateContentView>;

export const tippingView = z.object({
  action: z.enum(['free-standing', 'lash or block']),
  tips: z.boolean(),
  note: z.string(),
  worstMarginG: z.number(),
  profile: z.string(),
});

export const handlingView = z.object({
  verdict: z.enum(['one person', 'team of N', 'mechanical aid required', 'no verdict']),
  teamSize: z.number().nullable(),
  capacityKg: z.number().nullable(),
  method: z.string(),
  reasons: z.array(z.string()),
  cautions: z.array(z.string()),
});
export type HandlingView = z.infer<typeof handlingView>;

export const crateFiguresView = z.object({
  tareKg: z.number(),
  netKg: z.number(),
  grossKg: z.number(),
  /** False while any content line has no mass: net and gross are then lower bounds. */
  massComplete: z.boolean(),
  /** CoG of crate and contents, crate frame; null when it cannot be placed. */
  cogMm: vec3Mm.nullable(),
  tareCogMm: vec3Mm,
  tipping: tippingView.nullable(),
  /** Why there is no tipping verdict, when there is none. */
  tippingUnknownReason: z.string().nullable(),
  handling: handlingView,
  warnings: z.array(z.string()),
  packingListNotes: z.array(z.string()),
});
export type CrateFiguresView = z.infer<typeof crateFiguresView>;

export const crateView = z.object({
  id: z.string(),
  code: z.string(),
  name: z.string(),
  kind: crateKind,
  sectionId: z.string().nullable(),
  innerMm: vec3Mm.nullable(),
  outerMm: vec3Mm,
  tareKg: z.number(),
  maxGrossKg: z.number().nullable(),
  stackable: z.boolean(),
  maxLoadOnTopKg: z.number().nullable(),
  thisWayUp: z.boolean(),
  fragile: z.boolean(),
  mayTilt: z.boolean(),
  ispm15Required: z.boolean(),
  design: z.object({ makeUp: crateMakeUp.optional(), stockId: z.string().optional(), options: z.unknown().optional(), warnings: z.array(z.string()).optional() }).passthrough(),
  notes: z.string(),
  version: z.number().int(),
  updatedAt: z.string(),
  contents: z.array(crateContentView),
  figures: crateFiguresView,
});
export type CrateView = z.infer<typeof crateView>;

// ---------------------------------------------------------------------------------------------- vehicles

export const createVehicleBody = z
  .object({
    code,
    name: name.optional(),
    /** A catalogue entry's id (GET …/loads/vehicle-catalogue), or a full custom vehicle. */
    catalogueId: z.string().trim().min(1).max(80).optional(),
    spec: vehicle.optional(),
    notes: notes.optional(),
  })
  .refine((b) => Boolean(b.catalogueId) !== Boolean(b.spec), { message: 'Give either a catalogue entry or the vehicle’s figures.', path: ['catalogueId'] });
export type CreateVehicleBody = z.input<typeof createVehicleBody>;

export const updateVehicleBody = z.object({ version, code: code.optional(), name: name.optional(), spec: vehicle.optional(), notes: notes.optional() });

export const vehicleView = z.object({
  id: z.string(),
  code: z.string(),
  name: z.string(),
  kind: z.string(),
  catalogueId: z.string().nullable(),
  spec: vehicle,
  notes: z.string(),
  version: z.number().int(),
});
export type VehicleView = z.infer<typeof vehicleView>;

export const loadSettingsBody = z.object({
  version,
  airDivisorCm3PerKg: z.number().positive().max(20_000).optional(),
  roadKgPerLoadingMetre: z.number().positive().max(10_000).optional(),
  handlingColumn: z.enum(['men', 'women']).optional(),
});
export const loadSettingsView = z.object({
  airDivisorCm3PerKg: z.number(),
  roadKgPerLoadingMetre: z.number(),
  handlingColumn: z.enum(['men', 'women']),
  version: z.number().int(),
});
export type LoadSettingsView = z.infer<typeof loadSettingsView>;

// ---------------------------------------------------------------------------------------------- packing runs

/**
 * A packing run: for a tour leg (vehicles and crates taken from the leg when not given, the leg's unloading
 * order as the stops), or ad hoc (vehicles and crates given).
 */
export const createPackingRunBody = z
  .object({
    name: z.string().trim().min(1, 'Name the run.').max(120),
    /** The tour leg the run is for; absent for an ad hoc run. */
    legId: z.string().uuid().nullable().optional(),
    vehicleIds: z.array(z.string().uuid()).max(50).optional(),
    /** Crates to load; stopIndex: the stop where the crate comes off (lower = earlier, nearer the doors). */
    crates: z
      .array(z.object({ crateId: z.string().uuid(), stopIndex: z.number().int().min(0).max(1000).optional() }))
      .max(2000)
      .optional(),
    timeLimitMs: z.number().int().min(100).max(60_000).default(3000),
    fullSupport: z.boolean().default(true),
    seed: z.number().int().min(0).max(2 ** 31).default(1),
  })
  .superRefine((b, ctx) => {
    if (b.legId) return;
    if (!b.vehicleIds?.length) ctx.addIssue({ code: 'custom', message: 'Pick at least one vehicle.', path: ['vehicleIds'] });
    if (!b.crates?.length) ctx.addIssue({ code: 'custom', message: 'Pick at least one crate.', path: ['crates'] });
  });
export type CreatePackingRunBody = z.input<typeof createPackingRunBody>;

export const placementView = z.object({
  id: z.string(),
  vehicleId: z.string(),
  xMm: z.number(),
  yMm: z.number(),
  zMm: z.number(),
  lengthMm: z.number(),
  widthMm: z.number(),
  heightMm: z.number(),
  /** Set by the planner: a pinned crate stays where it is when the run is packed again. */
  pinned: z.boolean().optional(),
});
export type PlacementView = z.infer<typeof placementView>;

/** The planner's hand edit of one vehicle's load: every placement of that vehicle, as it should be. */
export const updatePlacementsBody = z.object({
  version,
  vehicleId: z.string().min(1),
  placements: z.array(placementView.omit({ vehicleId: true })).max(2000),
});

/** The packing engine's item for one crate, as the run saw it (src/domain/packing PackItem). */
export const runItemView = z.object({
  id: z.string(),
  code: z.string(),
  lengthMm: z.number(),
  widthMm: z.number(),
  heightMm: z.number(),
  massKg: z.number(),
  quantity: z.number(),
  orientation: z.enum(['any', 'upright', 'fixed']),
  stackable: z.boolean().optional(),
  maxLoadOnTopKg: z.number().optional(),
  stopIndex: z.number().optional(),
  /** Crate CoG in its own frame, mm (null: unknown, the box centre is drawn). */
  cogMm: vec3Mm.nullable(),
});
export type RunItemView = z.infer<typeof runItemView>;

const validationView = z.object({
  ok: z.boolean(),
  overlaps: z.number(),
  orientationFaults: z.number(),
  outOfBounds: z.number(),
  unsupported: z.number(),
  floating: z.number(),
  stackLoadViolations: z.number(),
  quantityMismatches: z.number(),
  payloadExceeded: z.number(),
  doorFaults: z.number(),
  loadOrderViolations: z.number(),
  messages: z.array(z.string()),
});

export const vehicleFiguresView = z.object({
  vehicleId: z.string(),
  itemCount: z.number(),
  loadKg: z.number(),
  maxPayloadKg: z.number(),
  volumeUtilisation: z.number(),
  floorUtilisation: z.number(),
  /** Load CoG in the load space, mm (null when empty). */
  cogMm: vec3Mm.nullable(),
  cogAlongOffsetMm: z.number().nullable(),
  cogAcrossOffsetMm: z.number().nullable(),
  loadPlan: z.object({ ok: z.boolean(), reasons: z.array(z.string()) }).passthrough(),
  validation: validationView,
  loadingMetres: z.number(),
  /** Each placed crate's CoG in the load space, mm (its own CoG turned as the crate was placed). */
  crateCogs: z.array(z.object({ id: z.string(), cogMm: vec3Mm })).default([]),
  /**
   * How the packed load was moved along (+ towards the doors) and across the bed to keep the axle loads and CoG
   * within limits, the gaps that leaves, and what must be blocked. Absent on a load edited by hand.
   */
  steering: z
    .object({ alongMm: z.number(), acrossMm: z.number(), frontGapMm: z.number(), doorGapMm: z.number(), withinLimitsBefore: z.boolean(), advice: z.array(z.string()) })
    .optional(),
});
export type VehicleFiguresView = z.infer<typeof vehicleFiguresView>;

export const runFiguresView = z.object({
  vehicles: z.array(vehicleFiguresView),
  vehiclesUsed: z.number(),
  placedCount: z.number(),
  unplacedCount: z.number(),
  totalKg: z.number(),
  chargeable: z.object({
    air: z.object({ actualKg: z.number(), volumetricKg: z.number(), chargeableKg: z.number(), divisorCm3PerKg: z.number() }),
    road: z.object({ actualKg: z.number(), loadingMetres: z.number(), loadingMetreKg: z.number(), chargeableKg: z.number(), kgPerLoadingMetre: z.number() }),
    sea: z.object({ actualKg: z.number(), volumeM3: z.number(), revenueTonnes: z.number() }),
  }),
  ok: z.boolean(),
});
export type RunFiguresView = z.infer<typeof runFiguresView>;

export const packingRunView = z.object({
  id: z.string(),
  name: z.string(),
  legId: z.string().nullable(),
  status: z.enum(['queued', 'running', 'done', 'failed']),
  progress: z.number(),
  bestUtilisation: z.number().nullable(),
  error: z.string().nullable(),
  createdAt: z.string(),
  startedAt: z.string().nullable(),
  finishedAt: z.string().nullable(),
  version: z.number().int(),
  input: z
    .object({
      vehicles: z.array(vehicle.and(z.object({ code: z.string(), vehicleRowId: z.string() }))),
      items: z.array(runItemView),
      options: z.object({ timeLimitMs: z.number(), fullSupport: z.boolean(), seed: z.number() }),
    })
    .optional(),
  result: z
    .object({
      placements: z.array(placementView),
      unplaced: z.array(z.object({ id: z.string(), quantity: z.number(), reason: z.string() })),
      vehiclesUsed: z.number(),
      editedByHand: z.boolean().optional(),
    })
    .nullable()
    .optional(),
  figures: runFiguresView.nullable().optional(),
});
export type PackingRunView = z.infer<typeof packingRunView>;
