/**
 * Public entry point of the venue access core (issue 6). `checkCrateAccess(crate, venue)` has the
 * issue's signature; the types accept more optional fields and a third optional argument.
 * Add exports here; never rename or remove them.
 */
export { checkCrateAccess, overallVerdict, tightestFinding, describeMargin, crateSizeProblems } from './check.ts';
export { accessMatrix, type AccessMatrix, type MatrixCell, type MatrixCrate, type MatrixSummary, type MatrixVenue } from './matrix.ts';
export { carryOrientations, type CarryOrientation } from './orientations.ts';
export { pressureKnPerM2, pointForceKn } from './floor.ts';
export { RAMP_LIMIT_PCT, HANDLING_LABEL, rampLimitPct } from './handling.ts';
export type * from './types.ts';
