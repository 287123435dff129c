import { z } from 'zod';

/**
 * Requests and answers of the split advisor and the impact view (issue 8), shared by the client and the
 * server. mm, kg; dates YYYY-MM-DD.
 */

const vec3 = z.tuple([z.number(), z.number(), z.number()]);
const uuid = z.uuid();

/** How the advisor's limits are taken from the production's data. */
export const splitLimitsQuery = z.object({
  /** 'hoist': the largest usable hoist; 'hand': the team hand-lift capacity (small sections). */
  liftMode: z.enum(['hoist', 'hand']).default('hoist'),
  /** Rigging below the hook, kg; default from the lift plans or the gear inventory. */
  riggingKg: z.coerce.number().min(0).max(100_000).optional(),
  /** Date the gear must be within inspection on; default today. */
  evaluationDate: z.iso.date().optional(),
  /**
   * Where the largest section box comes from: 'tour' (every venue of the tour and the largest vehicle),
   * 'vehicles' (the largest vehicle only), 'none' (size not limited: said so on every proposal).
   */
  sizeFrom: z.enum(['tour', 'vehicles', 'none']).default('tour'),
  /** At most this many sections; absent: as few as possible. */
  maxSections: z.coerce.number().int().min(1).max(500).optional(),
});
export type SplitLimitsQuery = z.infer<typeof splitLimitsQuery>;

export const startSplitRunBody = splitLimitsQuery.extend({
  seed: z.number().int().min(0).max(2 ** 31 - 1).default(1),
  timeLimitMs: z.number().int().min(100).max(20_000).default(3000),
  maxProposals: z.number().int().min(1).max(5).default(3),
});
export type StartSplitRunBody = z.input<typeof startSplitRunBody>;

export const sectionUnit = z.object({ assemblyId: z.string().min(1).max(100), scope: z.enum(['whole', 'own-parts']) });
export type SectionUnitBody = z.infer<typeof sectionUnit>;

/** Adopting a split: its sections (as units) and the state of the machine it was made for. */
export const adoptSplitBody = z.object({
  machineVersion: z.number().int().min(0),
  /** The stamp of the breakdown the split was made for (GET /split/input): a change since answers 409. */
  stamp: z.string().min(1).max(100),
  sections: z.array(z.object({ units: z.array(sectionUnit).min(1).max(2000) })).min(1).max(500),
  limits: splitLimitsQuery.optional(),
});
export type AdoptSplitBody = z.infer<typeof adoptSplitBody>;

/** One limit with where it comes from. */
export interface LimitSource {
  /** What sets it, e.g. "hoist CH-1000-01" or "Loomworks Hall, freight lift door height". */
  what: string;
  detail: string;
}

export interface MassLimitView {
  mode: 'hoist' | 'hand';
  /** Null when no verdict can be given (no usable hoist, no hand-lift figure): the reason is in `problems`. */
  maxSectionMassKg: number | null;
  /** Working, line by line, e.g. "rated 1,000 kg as D8+ → effective 1,000 kg". */
  working: string[];
  sources: LimitSource[];
  problems: string[];
  hoist?: { gearId: string; identifier: string; ratedLoadKg: number; effectiveRatingKg: number; riggingKg: number; riggingSource: string; dynamicFactor: number; dynamicFactorSource: string; marginPercent: number };
  hand?: { perPersonKg: number; teamSize: number; teamCapacityKg: number; marginPercent: number; method: string };
}

export interface SizeLimitView {
  /** Largest crate (length, width, height, upright) that passes every venue checked; null per axis when no venue limits it. */
  crateMaxMm: [number | null, number | null, number | null];
  /** Crate walls, skids and clearance around a section, mm per axis (from the crate core's design). */
  crateOverheadMm: [number, number, number];
  /** Largest section box, mm (length, width, height); null when no venue limits the crate at all. */
  sectionMaxMm: [number, number, number] | null;
  /** For each axis, the venue and point that set it. */
  setBy: { axis: 'length' | 'width' | 'height'; venueId: string; venueName: string; where: string; limitMm: number }[];
  venuesChecked: number;
  /** The derived crate checked forward with the access core at every venue. */
  verified: { venueId: string; venueName: string; verdict: 'pass' | 'fail' | 'unknown'; tightest: string | null }[];
  problems: string[];
}

export interface SplitLimitsView {
  mass: MassLimitView;
  size: SizeLimitView;
  maxSections: number | null;
  /** What the core is given; null when the mass limit has no verdict. */
  limits: { maxSectionMassKg: number; maxSectionSizeMm?: [number, number, number]; maxSections?: number } | null;
  cautions: string[];
}

export interface SplitAssemblyView {
  id: string;
  number: string;
  name: string;
  parentId: string | null;
  keepTogether: boolean;
  sectionId: string | null;
}

/** The breakdown as the advisor sees it: one aggregated part per assembly (own parts only). */
export interface SplitInputView {
  machineVersion: number;
  stamp: string;
  assemblies: SplitAssemblyView[];
  parts: { assemblyId: string; massKg: number; cogMm: [number, number, number]; bboxMinMm: [number, number, number]; bboxMaxMm: [number, number, number] }[];
  sections: { id: string; code: string; name: string }[];
  /** Lines that count as zero (no mass or position) and lines without an assembly. */
  gaps: string[];
  lineCount: number;
}

export interface ProposalSectionView {
  units: SectionUnitBody[];
  assemblyIds: string[];
  massKg: number;
  cogMm: [number, number, number];
  sizeMm: [number, number, number];
  massMarginKg: number;
  sizeMarginMm: [number, number, number] | null;
}

export interface SplitRunView {
  id: string;
  status: 'queued' | 'running' | 'done' | 'failed';
  progress: number;
  error: string | null;
  createdAt: string;
  limits: SplitLimitsView | null;
  stamp: string;
  machineVersion: number;
  result: {
    method: 'exact' | 'heuristic' | null;
    proposals: { sections: ProposalSectionView[]; score: { sections: number; heaviestKg: number; cogOffsetSumMm: number } | null }[];
    infeasible: { assemblyId: string; assemblyNumber: string | null; reason: string }[];
  } | null;
}

// ------------------------------------------------------------------------------------------ impact

/** A draft: typed overrides evaluated in memory, never saved until applied. */
export const impactDraft = z.object({
  /** A part line's unit mass, e.g. after weighing. */
  partMasses: z
    .array(z.object({ lineId: uuid, unitMassKg: z.number().min(0).max(1e6), massSource: z.enum(['weighed', 'catalogue', 'cad', 'estimated']).optional(), version: z.number().int().min(0).optional() }))
    .max(200)
    .default([]),
  /** A new assembly with one part line of the given mass, CoG and box. */
  newAssemblies: z
    .array(
      z.object({
        number: z.string().min(1).max(60),
        name: z.string().max(200).default(''),
        parentId: uuid.nullable().default(null),
        sectionId: uuid.nullable().default(null),
        massKg: z.number().min(0).max(1e6),
        cogMm: vec3,
        bboxMm: z.object({ minMm: vec3, maxMm: vec3 }).nullable().default(null),
      }),
    )
    .max(20)
    .default([]),
  /** A lift plan with a different hoist. */
  planHoists: z.array(z.object({ planId: uuid, hoistGearId: uuid })).max(50).default([]),
  /** A venue's door with another clear opening. */
  venueDoors: z
    .array(z.object({ venueId: uuid, doorIndex: z.number().int().min(0).max(50), widthMm: z.number().positive().max(1e5).optional(), heightMm: z.number().positive().max(1e5).optional() }))
    .max(50)
    .default([]),
});
export type ImpactDraft = z.input<typeof impactDraft>;
export type ImpactDraftParsed = z.infer<typeof impactDraft>;

export const impactEvaluateBody = z.object({ draft: impactDraft });
export const impactApplyBody = z.object({ draft: impactDraft });

export type ImpactVerdict = 'pass' | 'fail' | 'unknown';

export interface ImpactRow {
  kind: 'section' | 'crate' | 'lift-plan' | 'truck-load' | 'access';
  id: string;
  label: string;
  /** What is checked, e.g. "mass within the largest hoist's limit". */
  check: string;
  before: { verdict: ImpactVerdict; figure: string };
  after: { verdict: ImpactVerdict; figure: string };
  /** 'pass→fail', 'fail→pass', or 'changed' (figures moved, verdict kept) */
  change: 'pass→fail' | 'fail→pass' | 'to unknown' | 'from unknown' | 'changed';
  note?: string;
}

export interface ImpactView {
  rows: ImpactRow[];
  counts: { passToFail: number; failToPass: number; changed: number };
  /** Lift plans whose approval the draft would withdraw. */
  approvalsWithdrawn: { planId: string; title: string; why: string }[];
  warnings: string[];
}
