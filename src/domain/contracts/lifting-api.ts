import { z } from 'zod';
import { evaluateLiftPlan, type LiftPlanResult } from '../lifting/index.ts';
import {
  type hangingPoint,
  hoistItem,
  isoDate,
  liftingPointItem,
  pickPoint,
  shackleItem,
  slingItem,
  spreaderBeamItem,
  suspension,
  type GearItem,
  type LiftPlanInput,
} from './lifting.ts';

/**
 * Requests and responses of the lifting API (`/api/productions/:productionId/lifting`): production
 * lifting settings, the rigging gear inventory, hanging points, manual-handling tasks and lift plans.
 * The core's own shapes (gear items, pick points, suspension) are in ./lifting.ts and reused here.
 * Frame: right-handed, z up, mm, kg, degrees; units in the names.
 *
 * Besides the schemas this file holds the one mapping from stored records to the core's lift-plan
 * input (`buildLiftPlanInput`), so that the server (the authority) and the client (instant preview)
 * hand the core exactly the same thing.
 */

const version = z.number().int().nonnegative();
const vec3Mm = z.tuple([z.number().finite(), z.number().finite(), z.number().finite()]);
const boxMm = z.object({ minMm: vec3Mm, maxMm: vec3Mm });

// ------------------------------------------------------------------------------------------ settings

export const handlingMethod = z.enum(['niosh', 'uk-guideline']);
export const guidelineColumn = z.enum(['men', 'women']);

/** Production-wide lifting settings. Each has a default so a new production works at once. */
export const liftingSettingsFields = z.object({
  /** How manual-handling verdicts are reached. */
  handlingMethod,
  /** The guideline filter's column (UK guideline method). */
  guidelineColumn,
  /** Items at or below this mass get no handling verdict (too light to matter), kg. */
  handlingThresholdKg: z.number().min(0).max(100),
  /** Largest team the crew can field for one item (1–3; no published factor beyond three). */
  maxTeamSize: z.number().int().min(1).max(3),
  /** Dynamic factor on the hook load, and where it comes from. */
  dynamicFactor: z.number().min(1).max(3),
  dynamicFactorSource: z.string().trim().min(1, 'Name the source of the dynamic factor.').max(300),
  /** Hoist class rule set (HOIST_RULE_SETS key). */
  hoistRuleSet: z.string().min(1),
  /** Default margin of the exclusion zone around the load in plan, mm. */
  exclusionMarginMm: z.number().min(0).max(20_000),
});
export type LiftingSettingsFields = z.infer<typeof liftingSettingsFields>;

export const liftingSettingsView = liftingSettingsFields.extend({ version, updatedAt: z.string().nullable() });
export type LiftingSettingsView = z.infer<typeof liftingSettingsView>;

export const liftingSettingsBody = liftingSettingsFields.partial().extend({ version });
export type LiftingSettingsBody = z.infer<typeof liftingSettingsBody>;

// ------------------------------------------------------------------------------------------ gear

/** A gear item as typed (no id: the server gives it). */
export const gearInput = z.discriminatedUnion('kind', [
  hoistItem.omit({ id: true }),
  slingItem.omit({ id: true }),
  shackleItem.omit({ id: true }),
  liftingPointItem.omit({ id: true }),
  spreaderBeamItem.omit({ id: true }),
]);
export type GearInput = z.infer<typeof gearInput>;

export const gearCreateBody = z.object({ item: gearInput });
export type GearCreateBody = z.infer<typeof gearCreateBody>;
export const gearUpdateBody = z.object({ version, item: gearInput });
export type GearUpdateBody = z.infer<typeof gearUpdateBody>;

/** A stored gear item: the core's item plus its version. */
export type GearView = GearItem & { version: number; updatedAt: string };

// ------------------------------------------------------------------------------------------ hanging points

export const hangingPointFields = z.object({
  venueId: z.uuid(),
  label: z.string().trim().min(1, 'Name the hanging point (e.g. "Beam 3 west").').max(80),
  /** Safe working load of the point as the venue publishes it, kg; null = not known (a gap, never a pass). */
  ratingKg: z.number().positive().finite().nullable(),
  notes: z.string().trim().max(1000).default(''),
});
export const hangingPointCreateBody = hangingPointFields;
export const hangingPointUpdateBody = hangingPointFields.omit({ venueId: true }).partial().extend({ version });
export type HangingPointCreateBody = z.infer<typeof hangingPointCreateBody>;
export type HangingPointUpdateBody = z.infer<typeof hangingPointUpdateBody>;
export interface HangingPointView {
  id: string;
  venueId: string;
  venueName: string;
  label: string;
  ratingKg: number | null;
  notes: string;
  version: number;
}

// ------------------------------------------------------------------------------------------ manual handling

const handPosition = z.object({
  hCm: z.number().min(0).max(200).optional(),
  vCm: z.number().min(0).max(300).optional(),
  asymmetryDeg: z.number().min(0).max(180).optional(),
});

export const nioshLimitation = z.enum([
  'one-handed',
  'seated-or-kneeling',
  'restricted-space',
  'unstable-load',
  'carrying-pushing-pulling',
  'wheelbarrow-or-shovel',
  'high-speed',
  'poor-floor-friction',
  'unfavourable-environment',
]);

/** What the crew typed about one handling task; every field left out is estimated (and shown so). */
export const handlingTaskInput = z.object({
  niosh: z
    .object({
      origin: handPosition.optional(),
      destination: handPosition.optional(),
      liftsPerMin: z.number().min(0).max(20).optional(),
      durationHours: z.number().positive().max(24).optional(),
      coupling: z.enum(['good', 'fair', 'poor']).optional(),
      significantControlAtDestination: z.boolean().optional(),
      limitations: z.array(nioshLimitation).optional(),
    })
    .optional(),
  guideline: z
    .object({
      zones: z.array(z.enum(['above-shoulder', 'elbow-to-shoulder', 'knuckle-to-elbow', 'lower-leg-to-knuckle', 'below-lower-leg'])).min(1).optional(),
      reach: z.enum(['close', 'extended']).optional(),
      liftsPerMin: z.number().min(0).max(30).optional(),
      twistDeg: z.number().min(0).max(180).optional(),
    })
    .optional(),
  maxTeamSize: z.number().int().min(1).max(3).optional(),
  notes: z.string().trim().max(1000).optional(),
});
export type HandlingTaskInput = z.infer<typeof handlingTaskInput>;

export const handlingItemKind = z.enum(['section', 'loose-part', 'crate']);
export type HandlingItemKind = z.infer<typeof handlingItemKind>;

/** Save the task of one item; version 0 when none is saved yet. */
export const handlingTaskBody = z.object({ itemKind: handlingItemKind, version, task: handlingTaskInput });
export type HandlingTaskBody = z.infer<typeof handlingTaskBody>;

// ------------------------------------------------------------------------------------------ lift plans

export const liftPlanStatus = z.enum(['draft', 'submitted', 'approved', 'rejected']);
export type LiftPlanStatus = z.infer<typeof liftPlanStatus>;

/**
 * A lift plan as the planner or rigger enters it. The load (mass, CoG, bounds) comes from the
 * section's current figures and the gear from the inventory, both at evaluation time.
 */
export const liftPlanFields = z.object({
  title: z.string().trim().min(1, 'Give the plan a title.').max(200),
  sectionId: z.uuid('Choose the section to lift.'),
  /** The venue of the lift, if any: its hanging points may be used. */
  venueId: z.uuid().nullable().default(null),
  /** Planned date of the lift: gear inspection dates are checked against it. */
  liftDate: isoDate,
  /** CoG uncertainty ± on each axis, mm; null = the section's figure. */
  cogUncertaintyMm: z.number().min(0).max(5000).nullable().default(null),
  pickPoints: z.array(pickPoint).min(1, 'Add at least one pick point.').max(8),
  suspension,
  legRating: z.enum(['two-carry', 'en13414-symmetric']).default('two-carry'),
  /** Whether anyone will be beneath the load. Ballast refuses every plan where this is true. */
  peopleBelow: z.boolean().default(false),
  occupiedAreasMm: z.array(boxMm).max(20).default([]),
  /** Exclusion-zone margin, mm; null = the production's setting. */
  exclusionMarginMm: z.number().min(0).max(20_000).nullable().default(null),
  maxTiltDeg: z.number().min(0).max(90).nullable().default(null),
  /** Method statement: sequence, communication, who does what. */
  method: z.string().trim().max(4000).default(''),
});
export type LiftPlanFields = z.infer<typeof liftPlanFields>;
export type LiftPlanFieldsInput = z.input<typeof liftPlanFields>;

export const liftPlanCreateBody = z.object({ inputs: liftPlanFields });
export const liftPlanUpdateBody = z.object({ version, inputs: liftPlanFields });
export const liftPlanActionBody = z.object({ version, comment: z.string().trim().max(2000).optional() });
export const liftPlanRejectBody = z.object({ version, comment: z.string().trim().min(1, 'Say why the plan is rejected.').max(2000) });
export type LiftPlanActionBody = z.infer<typeof liftPlanActionBody>;

/** The section as a lift plan sees it: current figures from the breakdown (or its latest weighing). */
export interface LiftLoadView {
  sectionId: string;
  code: string;
  name: string;
  /** Nominal mass (the weighing's, when weighed), kg; null while nothing with mass is counted. */
  massKg: number | null;
  /** Contingency that applies, %. 0 once weighed. */
  marginPercent: number;
  weighed: boolean;
  weighedOn: string | null;
  cogMm: [number, number, number] | null;
  cogUncertaintyMm: number | null;
  boundsMm: { minMm: [number, number, number]; maxMm: [number, number, number] } | null;
  /** False while the breakdown has gaps in this section (the mass is then a lower bound). */
  complete: boolean;
  gapCount: number;
}

export interface PlanEventView {
  id: string;
  kind: 'created' | 'edited' | 'submitted' | 'approved' | 'rejected' | 'approval-withdrawn' | 'returned-to-draft';
  actorName: string | null;
  comment: string;
  verdict: string | null;
  createdAt: string;
}

export interface LiftPlanSummary {
  id: string;
  title: string;
  status: LiftPlanStatus;
  sectionId: string | null;
  sectionCode: string | null;
  venueId: string | null;
  verdict: LiftPlanResult['verdict'];
  problemCount: number;
  authorId: string | null;
  authorName: string | null;
  liftDate: string;
  version: number;
  updatedAt: string;
}

/** A lift plan with its inputs, what the core was given, its answer, the sign-off and the history. */
export interface LiftPlanView extends Omit<LiftPlanSummary, 'problemCount'> {
  inputs: LiftPlanFields;
  evaluatedInput: LiftPlanInput;
  result: LiftPlanResult;
  load: LiftLoadView | null;
  reviewerId: string | null;
  reviewerName: string | null;
  reviewedAt: string | null;
  reviewComment: string;
  submittedAt: string | null;
  createdAt: string;
  events: PlanEventView[];
}

// ------------------------------------------------------------------------------------------ building the core's input

export interface BuildContext {
  load: LiftLoadView | null;
  /** The production's gear inventory (only the items the plan names are passed on). */
  gear: GearItem[];
  settings: Pick<LiftingSettingsFields, 'dynamicFactor' | 'dynamicFactorSource' | 'hoistRuleSet' | 'exclusionMarginMm'>;
  /** Hanging points of the plan's venue. */
  venuePoints: { label: string; ratingKg: number | null }[];
}

export interface BuiltPlan {
  /** Input for `evaluateLiftPlan`. */
  input: LiftPlanInput;
  /** Problems found while putting the input together (the load is unknown, a venue point is missing). */
  problems: string[];
}

/** Every gear id a plan names. */
export function gearIdsOf(fields: Pick<LiftPlanFields, 'pickPoints' | 'suspension'>): string[] {
  const ids = new Set<string>();
  for (const p of fields.pickPoints) {
    if (p.slingGearId) ids.add(p.slingGearId);
    for (const s of p.shackleGearIds ?? []) ids.add(s);
    if (p.liftingPointGearId) ids.add(p.liftingPointGearId);
  }
  const s = fields.suspension;
  if (s.kind === 'hoists') for (const l of s.legs) ids.add(l.hoistGearId);
  else ids.add(s.hoistGearId);
  if (s.kind === 'spreader-beam') {
    ids.add(s.beamGearId);
    for (const g of s.topRiggingGearIds ?? []) ids.add(g);
  }
  return [...ids];
}

/**
 * The core's lift-plan input from a stored plan, the section's current figures, the inventory, the
 * production settings and the venue's hanging points. A venue point's rating is always taken from
 * the venue's current record (a point the venue no longer lists has no rating: no verdict).
 */
export function buildLiftPlanInput(fields: LiftPlanFields, ctx: BuildContext): BuiltPlan {
  const problems: string[] = [];
  const load = ctx.load;
  if (!load) problems.push('The section of this plan no longer exists: no verdict.');
  else {
    if (load.massKg === null || !(load.massKg > 0)) problems.push(`Section ${load.code}: mass unknown (nothing with a mass is counted yet): no verdict.`);
    if (!load.cogMm) problems.push(`Section ${load.code}: CoG unknown: no verdict.`);
    if (!load.complete) problems.push(`Section ${load.code}: the breakdown has ${load.gapCount} gap${load.gapCount === 1 ? '' : 's'} (parts without mass or position): its mass is a lower bound until they are filled or the section is weighed.`);
  }
  const uncertainty = fields.cogUncertaintyMm ?? load?.cogUncertaintyMm ?? null;
  const venueHp = (hp: z.infer<typeof hangingPoint>): z.infer<typeof hangingPoint> => {
    if (hp.source !== 'venue') return hp;
    const found = ctx.venuePoints.find((v) => v.label === hp.label);
    if (!found) {
      problems.push(`Hanging point "${hp.label}" is not among the venue's hanging points: its rating is unknown.`);
      return { ...hp, ratingKg: null };
    }
    return { ...hp, ratingKg: found.ratingKg };
  };
  const s = fields.suspension;
  const sus: LiftPlanInput['suspension'] =
    s.kind === 'hoists' ? { ...s, legs: s.legs.map((l) => ({ ...l, hangingPoint: venueHp(l.hangingPoint) })) } : { ...s, hangingPoint: venueHp(s.hangingPoint) };
  const used = new Set(gearIdsOf(fields));
  const input: LiftPlanInput = {
    label: fields.title,
    evaluationDate: fields.liftDate,
    load: {
      // An unknown mass stays invalid (0), so the evaluator cannot pass it.
      massKg: load?.massKg ?? 0,
      massWeighed: load?.weighed ?? false,
      cogMm: load?.cogMm ?? [0, 0, 0],
      ...(uncertainty !== null && uncertainty > 0 ? { cogUncertainty: { plusMinusMm: [uncertainty, uncertainty, uncertainty] as [number, number, number] } } : {}),
      ...(load?.boundsMm ? { boundsMm: load.boundsMm } : {}),
    },
    contingency: (load?.marginPercent ?? 0) / 100,
    dynamicFactor: { value: ctx.settings.dynamicFactor, source: ctx.settings.dynamicFactorSource },
    pickPoints: fields.pickPoints,
    suspension: sus,
    legRating: fields.legRating,
    hoistRuleSet: ctx.settings.hoistRuleSet,
    peopleBelow: fields.peopleBelow,
    occupiedAreasMm: fields.occupiedAreasMm,
    exclusionMarginMm: fields.exclusionMarginMm ?? ctx.settings.exclusionMarginMm,
    ...(fields.maxTiltDeg !== null ? { maxTiltDeg: fields.maxTiltDeg } : {}),
    gear: ctx.gear.filter((g) => used.has(g.id)),
  };
  return { input, problems };
}

/** Whether a built plan can be evaluated at all (known mass and CoG). */
export function loadKnown(load: LiftLoadView | null): boolean {
  return Boolean(load && load.massKg !== null && load.massKg > 0 && load.cogMm);
}

/**
 * Builds and evaluates a plan with the core: the one call the server (authority) and the client
 * (preview) both make. Problems found while building come first, as 'missing' findings, so the
 * verdict can never pass with an unknown load or hanging point.
 */
export function evaluatePlanFields(fields: LiftPlanFields, ctx: BuildContext): { input: LiftPlanInput; result: LiftPlanResult } {
  const built = buildLiftPlanInput(fields, ctx);
  const result = evaluateLiftPlan(built.input);
  if (built.problems.length === 0) return { input: built.input, result };
  const extra = built.problems.map((message) => ({ severity: 'missing' as const, code: 'invalid-input' as const, message }));
  const findings = [...extra, ...result.findings];
  return {
    input: built.input,
    result: {
      ...result,
      findings,
      problems: findings.filter((f) => f.severity !== 'notice').map((f) => f.message),
      verdict: result.verdict === 'over capacity' ? 'over capacity' : 'no verdict',
    },
  };
}
