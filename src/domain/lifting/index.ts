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

// Rigging.
export {
  bridleLegTensionKg,
  slingAngleFactor,
  slingAngleFromGeometryDeg,
  slingAngleProblem,
  slingRatingAtAngleKg,
  MIN_SLING_ANGLE_FROM_HORIZONTAL_DEG,
} from './sling-angle.ts';
export { hitchFactor, CHOKER_FACTORS, MIN_CHOKE_ANGLE_DEG } from './hitch.ts';
export type { Hitch, SlingType, HitchFactorResult } from './hitch.ts';
export { en13414LegFactor, EN13414_LABEL } from './leg-factors.ts';
export { HOIST_RULE_SETS, DEFAULT_HOIST_RULE_SET, hoistRatingForUse } from './hoist-classes.ts';
export type { HoistClass, HoistClassRule, HoistRuleSet, HoistUseAsRule, HoistUseResult } from './hoist-classes.ts';
export { gearUsableOn, gearLabel, liftingPointRatingKg } from './gear.ts';
export { DEFAULT_DYNAMIC_FACTOR, en13001Phi2, dynamicFactorProblem } from './dynamic-factor.ts';
export type { DynamicFactor } from './dynamic-factor.ts';

// Statics and lift plans.
export { pickPointLoadsKg, verticalPickLoadsKg, PLUMB_TOLERANCE_MM } from './pick-point-loads.ts';
export { hangingEquilibrium } from './hanging-equilibrium.ts';
export type { HangingInput, HangingResult, HangingOutcome } from './hanging-equilibrium.ts';
export { exclusionZone, rectsOverlap } from './exclusion-zone.ts';
export type { ExclusionZone, PlanRect } from './exclusion-zone.ts';
export { evaluateLiftPlan, TURN_OVER_TILT_DEG } from './lift-plan.ts';
export type {
  LiftPlanResult,
  LiftFinding,
  LiftFindingCode,
  LiftFindingSeverity,
  ComponentUse,
  LegResult,
  CogCaseResult,
  LiftLoads,
} from './lift-plan.ts';
export type { LiftPlanInput, LiftPlan, GearItem, HoistItem, SlingItem, ShackleItem, LiftingPointItem, SpreaderBeamItem } from '../contracts/lifting.ts';
