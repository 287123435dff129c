/**
 * Steering a packed load's weight distribution by moving the whole load along and across the bed.
 *
 * The packing search fills a vehicle from the front wall (x = 0) with what is unloaded first nearest the
 * doors. Moving the whole load by the same distance keeps every crate's support, the stacking and the load
 * order, so it is always allowed within the free space; what changes is the load's CoG and with it the axle
 * group loads (linear in the CoG by statics, see axle-loads.ts) and the CoG offsets. This searches that free
 * space for the smallest move that brings the axle groups and the CoG within their limits, or, when none
 * does, the move that leaves them least over. A move away from a wall leaves a gap there that must be
 * blocked or braced before travel: the advice says where and how much.
 */
import type { Vec3 } from '../geometry/vec3.ts';
import { checkLoadPlan, type LoadPlanCheck } from './axle-loads.ts';
import type { Vehicle } from './types.ts';

/** One placed crate: its footprint in the load space and its mass at its CoG (load-space frame), mm, kg. */
export interface PlacedMass {
  xMm: number;
  yMm: number;
  lengthMm: number;
  widthMm: number;
  massKg: number;
  cogMm: Vec3;
}

export interface LoadSteer {
  /** How far to move every crate: + along is towards the doors, + across away from the y = 0 wall, mm. */
  alongMm: number;
  acrossMm: number;
  before: LoadPlanCheck;
  after: LoadPlanCheck;
  /** Free length at the front wall and at the doors after the move, mm. */
  frontGapMm: number;
  doorGapMm: number;
  /** What the planner must do, in words; empty when nothing was moved and all is within limits. */
  advice: string[];
}

/** How far over its limits a check is: 0 when within all the limits the move can change; larger is worse. */
function along(check: LoadPlanCheck): number {
  let bad = 0;
  for (const g of check.axles?.groups ?? []) {
    if (g.totalKg > g.permittedKg) bad += (g.totalKg - g.permittedKg) / g.permittedKg;
    if (g.minimumKg !== undefined && g.totalKg < g.minimumKg) bad += (g.minimumKg - g.totalKg) / Math.max(g.minimumKg, 1);
    if (g.totalKg < 0) bad += 1 - g.totalKg / Math.max(g.permittedKg, 1);
  }
  if (check.cogAlong && !check.cogAlong.ok) bad += (Math.abs(check.cogAlong.offsetMm) - check.cogAlong.limitMm) / Math.max(check.cogAlong.limitMm, 1);
  return bad;
}
function across(check: LoadPlanCheck): number {
  return check.cogAcross && !check.cogAcross.ok ? (Math.abs(check.cogAcross.offsetMm) - check.cogAcross.limitMm) / Math.max(check.cogAcross.limitMm, 1) : 0;
}

/**
 * The smallest whole-millimetre move in [lo, hi] with zero badness, else the one with the least badness.
 * Badness is piecewise linear in the move (the limits are linear in the CoG), so sampling at a step of at
 * most 1/2000 of the range and refining by bisection at the edge of the first good sample finds it.
 */
function bestMove(lo: number, hi: number, badness: (move: number) => number): number {
  if (badness(0) === 0 || hi - lo < 1) return 0;
  const n = Math.min(2000, Math.ceil(hi - lo));
  const samples: number[] = [];
  for (let i = 0; i <= n; i++) samples.push(Math.round(lo + ((hi - lo) * i) / n));
  samples.push(0);
  let best = 0;
  let bestBad = badness(0);
  for (const s of samples) {
    const b = badness(s);
    if (b < bestBad - 1e-12 || (Math.abs(b - bestBad) <= 1e-12 && Math.abs(s) < Math.abs(best))) {
      best = s;
      bestBad = b;
    }
  }
  if (bestBad > 0) return best;
  // Bisect between 0 (bad) and the good move for the smallest good one, to the millimetre.
  let bad = 0;
  let good = best;
  while (Math.abs(good - bad) > 1) {
    const mid = Math.round((good + bad) / 2);
    if (mid === good || mid === bad) break;
    if (badness(mid) === 0) good = mid;
    else bad = mid;
  }
  return good;
}

const mm = (v: number) => `${Math.round(v).toLocaleString('en-GB')} mm`;

/**
 * Where to move a vehicle's whole load so its axle groups and CoG are within limits (see the module comment).
 * An empty load, or a vehicle with no axle groups and no CoG limits, is left where it is.
 */
export function steerLoad(vehicle: Vehicle, load: readonly PlacedMass[]): LoadSteer {
  const points = load.filter((p) => p.massKg > 0).map((p) => ({ massKg: p.massKg, cogMm: p.cogMm }));
  const before = checkLoadPlan(vehicle, points);
  if (load.length === 0) return { alongMm: 0, acrossMm: 0, before, after: before, frontGapMm: vehicle.lengthMm, doorGapMm: 0, advice: [] };
  const minX = Math.min(...load.map((p) => p.xMm));
  const maxX = Math.max(...load.map((p) => p.xMm + p.lengthMm));
  const minY = Math.min(...load.map((p) => p.yMm));
  const maxY = Math.max(...load.map((p) => p.yMm + p.widthMm));
  const moved = (dx: number, dy: number) => checkLoadPlan(vehicle, points.map((p) => ({ massKg: p.massKg, cogMm: [p.cogMm[0] + dx, p.cogMm[1] + dy, p.cogMm[2]] as Vec3 })));
  const alongMm = bestMove(-minX, vehicle.lengthMm - maxX, (dx) => along(moved(dx, 0)));
  const acrossMm = bestMove(-minY, vehicle.widthMm - maxY, (dy) => across(moved(alongMm, dy)));
  const after = alongMm === 0 && acrossMm === 0 ? before : moved(alongMm, acrossMm);
  const frontGapMm = minX + alongMm;
  const doorGapMm = vehicle.lengthMm - maxX - alongMm;
  const advice: string[] = [];
  if (alongMm !== 0) {
    advice.push(
      alongMm > 0
        ? `Load the crates ${mm(alongMm)} further back from the front wall than packed, so the axle loads and CoG stay within limits; block or brace the ${mm(frontGapMm)} gap at the front wall before travel.`
        : `Load the crates ${mm(-alongMm)} further forward than packed, so the axle loads and CoG stay within limits; block or brace the ${mm(doorGapMm)} gap at the doors before travel.`,
    );
  }
  if (acrossMm !== 0) advice.push(`Move the load ${mm(Math.abs(acrossMm))} across the bed to bring its CoG within the limit, and block the gap at the side walls.`);
  if (along(after) > 0) advice.push('No position along the bed brings every axle group and the CoG within limits: move heavy crates, or split the load over another vehicle.');
  if (across(after) > 0) advice.push('No position across the bed brings the CoG within the limit: move heavy crates across, or balance them with others.');
  return { alongMm, acrossMm, before, after, frontGapMm, doorGapMm, advice };
}
