/**
 * A whole lift assessed by the Revised NIOSH Lifting Equation: the RWL at the origin and, where the
 * load needs significant control at the destination, at the destination too, the lower governing
 * (manual p. 21: "the RWL is calculated at both the origin and the destination of the lift and the
 * lower of the two values is used"; p. 26). FM always uses V at the origin (p. 15); CM uses V at the
 * point evaluated (Example 4, Fig. 14). D = |V_destination − V_origin| (p. 10).
 */
import { liftingIndex, nioshRwl, type Coupling, type NioshLimitation, type NioshResult } from './niosh.ts';

/** Hand position at one end of the lift: distances in cm, angle in degrees. */
export interface NioshHandPosition {
  hCm: number;
  vCm: number;
  asymmetryDeg: number;
}

export interface NioshTask {
  loadKg: number;
  origin: NioshHandPosition;
  destination: NioshHandPosition;
  liftsPerMin: number;
  durationHours: number;
  coupling: Coupling;
  /** True where the worker re-grasps, holds or carefully places the load at the destination (p. 2). */
  significantControlAtDestination: boolean;
  limitations?: NioshLimitation[];
}

export interface NioshTaskResult {
  origin: NioshResult;
  /** Null where no significant control is needed at the destination (then only the origin counts). */
  destination: NioshResult | null;
  /** The lower RWL of the ends assessed, kg; NaN when the method does not apply. */
  governingRwlKg: number;
  governingEnd: 'origin' | 'destination';
  /** Load / governing RWL. */
  liftingIndex: number;
  applies: boolean;
  reasons: string[];
}

/** Assesses a lift at origin and (if needed) destination; the lower RWL governs. */
export function nioshTask(task: NioshTask): NioshTaskResult {
  const dCm = Math.abs(task.destination.vCm - task.origin.vCm);
  const common = {
    dCm,
    liftsPerMin: task.liftsPerMin,
    durationHours: task.durationHours,
    coupling: task.coupling,
    vOriginCm: task.origin.vCm,
    limitations: task.limitations,
  };
  const origin = nioshRwl({ ...common, ...task.origin });
  const destination = task.significantControlAtDestination ? nioshRwl({ ...common, ...task.destination }) : null;
  const applies = origin.applies && (destination?.applies ?? true);
  const reasons = [...origin.reasons.map((r) => `Origin: ${r}`), ...(destination?.reasons ?? []).map((r) => `Destination: ${r}`)];
  let governingRwlKg = origin.rwlKg;
  let governingEnd: 'origin' | 'destination' = 'origin';
  if (destination && !(destination.rwlKg >= origin.rwlKg)) {
    governingRwlKg = destination.rwlKg;
    governingEnd = 'destination';
  }
  if (!applies) governingRwlKg = Number.NaN;
  if (!(Number.isFinite(task.loadKg) && task.loadKg >= 0)) reasons.push(`Load mass missing or invalid (got ${String(task.loadKg)}).`);
  return {
    origin,
    destination,
    governingRwlKg,
    governingEnd,
    liftingIndex: liftingIndex(task.loadKg, governingRwlKg),
    applies,
    reasons,
  };
}
