import { z } from 'zod';

/**
 * Shapes of the lifting inputs: the rigging gear inventory and the lift plan. Shared by client forms,
 * server validation and the core (src/domain/lifting takes these types). Frame: right-handed, z up,
 * millimetres, kilograms, degrees. Ratings are working load limits (WLL) in kg, as marked on the gear.
 */

const vec3Mm = z.tuple([z.number(), z.number(), z.number()]);
const boxMm = z
  .object({ minMm: vec3Mm, maxMm: vec3Mm })
  .refine((b) => b.minMm.every((v, i) => v <= b.maxMm[i]), { message: 'box minimum must not exceed its maximum on any axis' });

/** Calendar date, ISO 8601 (YYYY-MM-DD). */
export const isoDate = z.iso.date();

const positiveKg = z.number().positive().finite();
const massKg = z.number().nonnegative().finite();

/** Fields every gear item has: its tag or serial number and the date of its next thorough examination. */
const gearBase = {
  id: z.string().min(1),
  /** The identifier marked on the item (tag, serial number). */
  identifier: z.string().min(1),
  description: z.string().optional(),
  /** Gear past this date cannot be used in a plan. */
  nextInspectionDate: isoDate,
};

export const hoistClass = z.enum(['D8', 'D8+', 'C1']);
export type HoistClassInput = z.infer<typeof hoistClass>;

/** A chain hoist. Its own weight and its chain load the hanging point, not the hook. */
export const hoistItem = z.object({
  ...gearBase,
  kind: z.literal('hoist'),
  ratedLoadKg: positiveKg,
  selfWeightKg: massKg,
  /** Mass of the whole load chain, kg (counted in full: conservative). */
  chainWeightKg: massKg,
  liftingSpeedMPerMin: z.number().positive().finite().optional(),
  hoistClass,
  hasSecondBrake: z.boolean().optional(),
});

export const slingType = z.enum(['wire-rope', 'web', 'roundsling', 'chain']);
export const hitch = z.enum(['vertical', 'choker', 'basket']);

export const slingItem = z.object({
  ...gearBase,
  kind: z.literal('sling'),
  slingType,
  /** WLL in a straight vertical pull, kg. */
  verticalRatingKg: positiveKg,
  /** Effective length, bearing point to bearing point, mm. */
  lengthMm: z.number().positive().finite(),
  massKg,
  /** The maker's hitch factors, where they differ from the defaults (choker 0.75/0.8, basket 2). */
  hitchFactors: z.object({ choker: z.number().positive().max(1).optional(), basket: z.number().positive().max(2).optional() }).optional(),
});

export const shackleItem = z.object({
  ...gearBase,
  kind: z.literal('shackle'),
  ratingKg: positiveKg,
  massKg,
});

/** One row of a lifting point's angle derating: up to this angle from its axis, this fraction of the rating. */
export const angleDeratingRow = z.object({ upToDegFromAxis: z.number().min(0).max(90), factor: z.number().positive().max(1) });

/** An eyebolt, swivel or lug: rated along its axis, derated by the maker's table at an angle. */
export const liftingPointItem = z.object({
  ...gearBase,
  kind: z.literal('lifting-point'),
  pointType: z.enum(['eyebolt', 'swivel', 'lug', 'other']),
  /** WLL along the axis, kg. */
  ratingKg: positiveKg,
  massKg,
  /** Maker's derating by angle from the axis, ascending; beyond the last row the point is not to be used. */
  angleDerating: z.array(angleDeratingRow).optional(),
});

export const spreaderBeamItem = z.object({
  ...gearBase,
  kind: z.literal('spreader-beam'),
  ratingKg: positiveKg,
  massKg,
  lengthMm: z.number().positive().finite().optional(),
});

export const gearItem = z.discriminatedUnion('kind', [hoistItem, slingItem, shackleItem, liftingPointItem, spreaderBeamItem]);
export type GearItem = z.infer<typeof gearItem>;
export type HoistItem = z.infer<typeof hoistItem>;
export type SlingItem = z.infer<typeof slingItem>;
export type ShackleItem = z.infer<typeof shackleItem>;
export type LiftingPointItem = z.infer<typeof liftingPointItem>;
export type SpreaderBeamItem = z.infer<typeof spreaderBeamItem>;

/** A hanging point: a venue's (with its published rating) or one typed in. A null rating is a gap, never a pass. */
export const hangingPoint = z.object({
  label: z.string().min(1),
  ratingKg: z.number().positive().finite().nullable(),
  source: z.enum(['venue', 'typed']),
});

/** The rigging at one pick point: the sling to the hook (or hoist), its hitch, shackles and the lifting point. */
export const pickPoint = z.object({
  id: z.string().min(1),
  /** Where the rigging attaches, in the load's frame as it stands before the lift, mm. */
  positionMm: vec3Mm,
  /** Axis of the lifting point (its strong direction), default +z. */
  axis: vec3Mm.optional(),
  slingGearId: z.string().min(1).optional(),
  /**
   * Effective leg length from the pick point to the hook, mm (one hook only). Default: the sling's
   * length for a vertical hitch, half of it for a basket; a choker needs it typed (the wrap shortens it).
   */
  legLengthMm: z.number().positive().finite().optional(),
  hitch: hitch.default('vertical'),
  chokeAngleDeg: z.number().min(0).max(180).optional(),
  shackleGearIds: z.array(z.string().min(1)).default([]),
  liftingPointGearId: z.string().min(1).optional(),
});

const hoistUse = {
  hoistGearId: z.string().min(1),
  /** The class the hoist is used as (default its own class). */
  hoistUsedAs: hoistClass.optional(),
  hangingPoint,
};

/**
 * How the load hangs: one hook (the load settles with its CoG plumb under it), one hoist per pick
 * point with vertical legs, or a spreader beam under one hook with vertical legs to the pick points.
 */
export const suspension = z.discriminatedUnion('kind', [
  z.object({ kind: z.literal('single-hook'), ...hoistUse }),
  z.object({ kind: z.literal('hoists'), legs: z.array(z.object({ pickPointId: z.string().min(1), ...hoistUse })).min(1) }),
  z.object({
    kind: z.literal('spreader-beam'),
    ...hoistUse,
    beamGearId: z.string().min(1),
    /** Slings and shackles between the hook and the beam. */
    topRiggingGearIds: z.array(z.string().min(1)).default([]),
  }),
]);

/** CoG uncertainty: ± per axis, or a box of possible CoG positions, mm. */
export const cogUncertainty = z.union([z.object({ plusMinusMm: vec3Mm }), z.object({ boxMm })]);

export const liftPlanInput = z.object({
  label: z.string().optional(),
  /** The date the plan is evaluated for (gear inspection dates are checked against it). */
  evaluationDate: isoDate,
  load: z.object({
    massKg: positiveKg,
    /** True once the item has been weighed (otherwise the mass is an estimate). */
    massWeighed: z.boolean().default(false),
    cogMm: vec3Mm,
    cogUncertainty: cogUncertainty.optional(),
    /** The load's bounding box in the same frame, mm (for the exclusion zone). */
    boundsMm: boxMm.optional(),
  }),
  /** Margin added to the load mass, as a fraction (0.05 = +5 %). */
  contingency: z.number().min(0).max(1).default(0),
  dynamicFactor: z.object({ value: z.number().min(1).finite(), source: z.string().min(1) }).optional(),
  pickPoints: z.array(pickPoint).min(1),
  suspension,
  /** How legs of a 3+-leg bridle are rated: two carry (default), or EN 13414-1 for symmetric loads. */
  legRating: z.enum(['two-carry', 'en13414-symmetric']).default('two-carry'),
  hoistRuleSet: z.string().default('igvw-sq-p2'),
  /** Whether anyone will be beneath the load at any time. Ballast refuses every plan where this is true. */
  peopleBelow: z.boolean(),
  /** Plan areas where people are (boxes, mm); a plan whose exclusion zone overlaps one is refused. */
  occupiedAreasMm: z.array(boxMm).default([]),
  /** Margin around the load's plan footprint for the exclusion zone, mm. */
  exclusionMarginMm: z.number().min(0).finite().default(1000),
  /** Largest acceptable tilt of a freely hanging load, degrees (optional check). */
  maxTiltDeg: z.number().min(0).max(90).optional(),
  /** The gear the plan names (the server fills it from the inventory). */
  gear: z.array(gearItem).default([]),
});
/** A lift plan as typed (defaults not yet applied). */
export type LiftPlanInput = z.input<typeof liftPlanInput>;
export type LiftPlan = z.infer<typeof liftPlanInput>;
export type PickPointInput = z.input<typeof pickPoint>;
export type HangingPointInput = z.infer<typeof hangingPoint>;
