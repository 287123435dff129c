/**
 * Axle-group loads of a road vehicle from the load's CoG, by statics.
 *
 * Two supports at x_a < x_b (rigid truck: front and rear axle groups; semi-trailer: kingpin and
 * trailer axle group) carry a load P at x_c. Equilibrium of forces and of moments about x_a:
 *   R_b = P (x_c − x_a) / (x_b − x_a),   R_a = P − R_b.
 * Each group's load is its unladen load plus its share; each is checked against its permitted load
 * (and a minimum, e.g. a steering axle's share). A negative share means the load lifts that support:
 * always a fail. A tandem or tri-axle group is one support at its centre (load sharing within the
 * group assumed, as with air suspension).
 */
import { combineMasses, type PointMass } from '../mass/combine.ts';
import type { AxleGroup, AxleLayout, Vehicle } from './types.ts';

export interface AxleGroupLoad {
  name: string;
  positionMm: number;
  unladenKg: number;
  fromLoadKg: number;
  totalKg: number;
  permittedKg: number;
  minimumKg?: number;
  /** permitted − total, kg (negative: over). */
  marginKg: number;
  ok: boolean;
  reason: string;
}

export interface AxleLoadResult {
  groups: AxleGroupLoad[];
  loadKg: number;
  loadCogXMm: number;
  ok: boolean;
}

/** Shares of a load P at x_c on two supports at x_a < x_b, kg. Throws when x_b ≤ x_a. */
export function twoSupportReactions(loadKg: number, xcMm: number, xaMm: number, xbMm: number): [number, number] {
  if (!(xbMm > xaMm)) throw new Error(`Axle groups: the rear support (${xbMm} mm) must lie behind the front one (${xaMm} mm).`);
  const rb = (loadKg * (xcMm - xaMm)) / (xbMm - xaMm);
  return [loadKg - rb, rb];
}

function groupLoad(g: AxleGroup, fromLoadKg: number, minimumKg?: number): AxleGroupLoad {
  const totalKg = g.unladenKg + fromLoadKg;
  const min = minimumKg ?? g.minimumKg;
  const marginKg = g.permittedKg - totalKg;
  let ok = marginKg >= 0;
  let reason = `${g.name}: ${Math.round(totalKg)} kg of ${Math.round(g.permittedKg)} kg permitted`;
  if (!ok) reason = `${g.name}: ${Math.round(totalKg)} kg is ${Math.round(-marginKg)} kg over the ${Math.round(g.permittedKg)} kg permitted`;
  if (fromLoadKg < -g.unladenKg) {
    ok = false;
    reason = `${g.name}: the load lifts it (${Math.round(totalKg)} kg): move the load forward`;
  } else if (min !== undefined && totalKg < min) {
    ok = false;
    reason = `${g.name}: ${Math.round(totalKg)} kg is below the ${Math.round(min)} kg it must keep (steering): move the load forward`;
  }
  return { name: g.name, positionMm: g.positionMm, unladenKg: g.unladenKg, fromLoadKg, totalKg, permittedKg: g.permittedKg, minimumKg: min, marginKg, ok, reason };
}

/**
 * Axle-group loads for a load given as point masses (crates with their CoG in the load-space frame).
 * An empty load gives the unladen loads.
 */
export function axleLoads(layout: AxleLayout, load: readonly PointMass[]): AxleLoadResult {
  const total = load.length > 0 && load.some((p) => p.massKg > 0) ? combineMasses(load) : { massKg: 0, cogMm: [0, 0, 0] as [number, number, number] };
  const [a, b] = layout.kind === 'rigid' ? [layout.front, layout.rear] : [layout.kingpin, layout.axles];
  const [ra, rb] = twoSupportReactions(total.massKg, total.cogMm[0], a.positionMm, b.positionMm);
  let frontMin: number | undefined;
  if (layout.kind === 'rigid' && layout.minFrontShare !== undefined) {
    const gross = a.unladenKg + b.unladenKg + total.massKg;
    frontMin = Math.max(a.minimumKg ?? 0, layout.minFrontShare * gross);
  }
  const groups = [groupLoad(a, ra, frontMin), groupLoad(b, rb)];
  return { groups, loadKg: total.massKg, loadCogXMm: total.cogMm[0], ok: groups.every((g) => g.ok) };
}

export interface LoadPlanCheck {
  payload: { loadKg: number; maxPayloadKg: number; ok: boolean };
  cogAlong?: { offsetMm: number; limitMm: number; ok: boolean };
  cogAcross?: { offsetMm: number; limitMm: number; ok: boolean };
  axles?: AxleLoadResult;
  ok: boolean;
  reasons: string[];
}

/**
 * Checks a load in a vehicle: payload, CoG along and across against the vehicle's limits (offset from
 * the middle of the floor), and the axle groups where the vehicle has them.
 */
export function checkLoadPlan(vehicle: Vehicle, load: readonly PointMass[]): LoadPlanCheck {
  const reasons: string[] = [];
  const massKg = load.reduce((s, p) => s + p.massKg, 0);
  const payload = { loadKg: massKg, maxPayloadKg: vehicle.maxPayloadKg, ok: massKg <= vehicle.maxPayloadKg };
  if (!payload.ok) reasons.push(`Payload ${Math.round(massKg)} kg exceeds ${Math.round(vehicle.maxPayloadKg)} kg.`);
  const out: LoadPlanCheck = { payload, ok: true, reasons };
  if (massKg > 0) {
    const c = combineMasses(load);
    if (vehicle.cogLimits?.alongMm !== undefined) {
      const offsetMm = c.cogMm[0] - vehicle.lengthMm / 2;
      out.cogAlong = { offsetMm, limitMm: vehicle.cogLimits.alongMm, ok: Math.abs(offsetMm) <= vehicle.cogLimits.alongMm };
      if (!out.cogAlong.ok) reasons.push(`Load CoG ${Math.round(offsetMm)} mm from the middle along; limit ±${Math.round(vehicle.cogLimits.alongMm)} mm.`);
    }
    if (vehicle.cogLimits?.acrossMm !== undefined) {
      const offsetMm = c.cogMm[1] - vehicle.widthMm / 2;
      out.cogAcross = { offsetMm, limitMm: vehicle.cogLimits.acrossMm, ok: Math.abs(offsetMm) <= vehicle.cogLimits.acrossMm };
      if (!out.cogAcross.ok) reasons.push(`Load CoG ${Math.round(offsetMm)} mm from the middle across; limit ±${Math.round(vehicle.cogLimits.acrossMm)} mm.`);
    }
  }
  if (vehicle.axles) {
    out.axles = axleLoads(vehicle.axles, load);
    for (const g of out.axles.groups) if (!g.ok) reasons.push(g.reason + '.');
  }
  out.ok = reasons.length === 0;
  return out;
}
