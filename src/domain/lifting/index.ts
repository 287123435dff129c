/**
 * Public entry point of the lifting core: manual handling (NIOSH, UK guideline weights, teams),
 * rigging (sling angles, hitches, leg tensions, hoist classes, gear) and lift plans.
 * Units at the boundary: kg, cm for NIOSH distances, mm for positions in the z-up frame, degrees.
 * The server, the screens and the PDF import from here: add, never rename.
 */
export { nioshRwl, nioshRwlUs, liftingIndex, liftingIndexBand, NIOSH_LIMITATIONS } from './niosh.ts';
export type { NioshInput, NioshResult, NioshLimitation, Coupling, DurationBand } from './niosh.ts';
export { nioshTask } from './niosh-task.ts';
export type { NioshTask, NioshTaskResult, NioshHandPosition } from './niosh-task.ts';
export { FM_TABLE, CM_TABLE, FM_FREQUENCIES, frequencyMultiplier, durationBand } from './niosh-tables.ts';
export { estimateHandDistanceCm } from './hand-distance.ts';
export type { HandDistanceEstimate } from './hand-distance.ts';
export { classifyCoupling } from './coupling.ts';
export type { CouplingInput } from './coupling.ts';
export { guidelineWeightKg, GUIDELINE_WEIGHTS_KG, GUIDELINE_ZONES, repetitionReduction, twistReduction } from './guideline-weights.ts';
export type { GuidelineTask, GuidelineResult, GuidelineZone, GuidelineColumn, GuidelineReach } from './guideline-weights.ts';
export { teamCapacityKg, MAX_TEAM_WITH_PUBLISHED_FACTOR } from './team.ts';
export { handlingVerdict } from './handling-verdict.ts';
export type { HandlingItem, HandlingVerdict, HandlingVerdictKind, HandlingMethod } from './handling-verdict.ts';
export { LIFTING_CAUTIONS, HANDLING_CAUTIONS, handlingCautions, liftPlanCautions } from './cautions.ts';
