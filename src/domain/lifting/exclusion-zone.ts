/**
 * The exclusion zone under a suspended load: the load's plan footprint grown by a margin on every
 * side. Nobody is to be inside it while the load is off the ground. The margin (default 1 m) is
 * common practice [PRACTICE], not a published figure: set it per production and per lift (more for
 * a load that can swing or tilt, or a tall lift).
 */

export interface PlanRect {
  minXMm: number;
  minYMm: number;
  maxXMm: number;
  maxYMm: number;
}

export interface ExclusionZone extends PlanRect {
  marginMm: number;
  /** Where the footprint came from. */
  basis: string;
  note: string;
}

/** Zone from a plan footprint and a margin. */
export function exclusionZone(footprint: PlanRect, marginMm: number, basis: string): ExclusionZone {
  return {
    minXMm: footprint.minXMm - marginMm,
    minYMm: footprint.minYMm - marginMm,
    maxXMm: footprint.maxXMm + marginMm,
    maxYMm: footprint.maxYMm + marginMm,
    marginMm,
    basis,
    note: `Exclusion zone: the load's plan footprint plus ${marginMm} mm on every side (common practice, not a published figure). Keep everyone out of it while the load is suspended.`,
  };
}

/** Whether two plan rectangles overlap (touching counts). */
export function rectsOverlap(a: PlanRect, b: PlanRect): boolean {
  return a.minXMm <= b.maxXMm && b.minXMm <= a.maxXMm && a.minYMm <= b.maxYMm && b.minYMm <= a.maxYMm;
}
