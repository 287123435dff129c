import { allowedDims, EPS_MM, passesDoor, sameDims } from './orientations.ts';
import { loadsOnTopKg, planOverlapMm2, type MassBox } from './stack-load.ts';
import type { PackContainer, PackItem, Placement, Unplaced } from './types.ts';

/** Counts of rule breaks found in a packing; all zero means the packing is valid. */
export interface PackingCheck {
  /** Pairs of placements whose volumes overlap. */
  overlaps: number;
  /** Placements whose extents are not an allowed orientation of their item. */
  orientationFaults: number;
  /** Placements reaching outside the container. */
  outOfBounds: number;
  /** Placements above the floor whose base is not fully on tops below (counted only when fullSupport). */
  unsupported: number;
  /** Placements above the floor touching nothing below (always counted; a fault only when fullSupport). */
  floating: number;
  /** Items with something resting on them though not stackable, or carrying more than maxLoadOnTopKg. */
  stackLoadViolations: number;
  /** Item lines whose placed (+ unplaced) count differs from the quantity, and placements with unknown ids. */
  quantityMismatches: number;
  /** 1 when the total placed mass exceeds maxPayloadKg. */
  payloadExceeded: number;
  /** Placements that could not have passed the door opening as placed (see orientations.ts). */
  doorFaults: number;
  /** Pairs where an item unloaded later sits between an earlier one and the doors, or on top of it. */
  loadOrderViolations: number;
  /** First messages, each naming the item(s) and the limit. */
  messages: string[];
  /** True when every count that the variant requires to be zero is zero. */
  ok: boolean;
}

const MAX_MESSAGES = 20;

/**
 * Independent check of a packing against every rule the engine honours. It shares only the orientation
 * list, the door rule and the load model with the engine (so both mean the same thing), not its search
 * state. `unplaced`, when given, must account for every item not placed.
 */
export function validatePacking(
  container: PackContainer,
  items: readonly PackItem[],
  placements: readonly Placement[],
  options?: { fullSupport?: boolean; unplaced?: readonly Unplaced[] },
): PackingCheck {
  const fullSupport = options?.fullSupport ?? true;
  const r: PackingCheck = {
    overlaps: 0,
    orientationFaults: 0,
    outOfBounds: 0,
    unsupported: 0,
    floating: 0,
    stackLoadViolations: 0,
    quantityMismatches: 0,
    payloadExceeded: 0,
    doorFaults: 0,
    loadOrderViolations: 0,
    messages: [],
    ok: true,
  };
  const say = (m: string) => {
    if (r.messages.length < MAX_MESSAGES) r.messages.push(m);
  };
  const byId = new Map<string, PackItem>();
  for (const it of items) if (!byId.has(it.id)) byId.set(it.id, it);
  const boxes: MassBox[] = placements.map((p) => ({
    x0: p.xMm,
    y0: p.yMm,
    z0: p.zMm,
    x1: p.xMm + p.lengthMm,
    y1: p.yMm + p.widthMm,
    z1: p.zMm + p.heightMm,
    massKg: byId.get(p.id)?.massKg ?? 0,
  }));
  const counts = new Map<string, number>();
  let mass = 0;
  placements.forEach((p, i) => {
    const it = byId.get(p.id);
    const b = boxes[i];
    counts.set(p.id, (counts.get(p.id) ?? 0) + 1);
    mass += b.massKg;
    if (!it) {
      r.quantityMismatches++;
      say(`placement ${i} has id "${p.id}", which is not in the item list`);
      return;
    }
    const dims = [p.lengthMm, p.widthMm, p.heightMm];
    if (!allowedDims(it).some((d) => sameDims(d, dims))) {
      r.orientationFaults++;
      say(`item "${p.id}" placed as ${dims.join('×')} mm, not an allowed orientation ('${it.orientation}'${it.verticalAxes ? `, vertical ${it.verticalAxes.join('/')}` : ''})`);
    } else if (!passesDoor(dims as [number, number, number], it.orientation, container)) {
      r.doorFaults++;
      say(`item "${p.id}" placed as ${dims.join('×')} mm cannot pass the door opening`);
    }
    if (b.x0 < -EPS_MM || b.y0 < -EPS_MM || b.z0 < -EPS_MM || b.x1 > container.lengthMm + EPS_MM || b.y1 > container.widthMm + EPS_MM || b.z1 > container.heightMm + EPS_MM) {
      r.outOfBounds++;
      say(`item "${p.id}" at (${p.xMm}, ${p.yMm}, ${p.zMm}) reaches outside the container ${container.lengthMm}×${container.widthMm}×${container.heightMm} mm`);
    }
  });
  // Overlaps: sweep along x.
  const order = boxes.map((_, i) => i).sort((a, b) => boxes[a].x0 - boxes[b].x0);
  for (let a = 0; a < order.length; a++) {
    const i = order[a];
    const bi = boxes[i];
    for (let c = a + 1; c < order.length; c++) {
      const j = order[c];
      const bj = boxes[j];
      if (bj.x0 >= bi.x1 - EPS_MM) break;
      const ov = Math.min(bi.y1, bj.y1) - Math.max(bi.y0, bj.y0) > EPS_MM && Math.min(bi.z1, bj.z1) - Math.max(bi.z0, bj.z0) > EPS_MM && Math.min(bi.x1, bj.x1) - Math.max(bi.x0, bj.x0) > EPS_MM;
      if (ov) {
        r.overlaps++;
        say(`items "${placements[i].id}" (#${i}) and "${placements[j].id}" (#${j}) overlap`);
      }
    }
  }
  // Support and direct stacking on non-stackable items.
  boxes.forEach((b, i) => {
    if (b.z0 <= EPS_MM) return;
    let area = 0;
    boxes.forEach((s, j) => {
      if (j === i || Math.abs(s.z1 - b.z0) > EPS_MM) return;
      const a = planOverlapMm2(b, s);
      if (a <= 0) return;
      area += a;
      if (byId.get(placements[j].id)?.stackable === false) {
        r.stackLoadViolations++;
        say(`item "${placements[i].id}" (#${i}) rests on "${placements[j].id}" (#${j}), which is not stackable`);
      }
    });
    const base = (b.x1 - b.x0) * (b.y1 - b.y0);
    if (area <= 0) r.floating++;
    if (fullSupport && area < base * (1 - 1e-9)) {
      r.unsupported++;
      say(`item "${placements[i].id}" (#${i}) at z = ${b.z0} mm is supported on ${((100 * area) / base).toFixed(1)} % of its base; full support is required`);
    }
  });
  // Stack-load limits.
  if (placements.some((p) => byId.get(p.id)?.maxLoadOnTopKg !== undefined)) {
    const loads = loadsOnTopKg(boxes);
    placements.forEach((p, i) => {
      const lim = byId.get(p.id)?.maxLoadOnTopKg;
      if (lim !== undefined && loads[i] > lim + 1e-6) {
        r.stackLoadViolations++;
        say(`item "${p.id}" (#${i}) carries ${loads[i].toFixed(1)} kg on top, over its maxLoadOnTopKg ${lim} kg`);
      }
    });
  }
  // Payload.
  if (container.maxPayloadKg !== undefined && mass > container.maxPayloadKg + 1e-6) {
    r.payloadExceeded = 1;
    say(`load mass ${mass.toFixed(1)} kg exceeds maxPayloadKg ${container.maxPayloadKg} kg`);
  }
  // Load order: lower stopIndex (unloaded earlier) must not be blocked by a higher one.
  const stop = placements.map((p) => byId.get(p.id)?.stopIndex ?? Infinity);
  if (new Set(stop).size > 1) {
    for (let i = 0; i < boxes.length; i++) {
      for (let j = 0; j < boxes.length; j++) {
        if (!(stop[i] < stop[j])) continue;
        const a = boxes[i];
        const b = boxes[j];
        const yz = Math.min(a.y1, b.y1) - Math.max(a.y0, b.y0) > EPS_MM && Math.min(a.z1, b.z1) - Math.max(a.z0, b.z0) > EPS_MM;
        const xy = Math.min(a.x1, b.x1) - Math.max(a.x0, b.x0) > EPS_MM && Math.min(a.y1, b.y1) - Math.max(a.y0, b.y0) > EPS_MM;
        if ((yz && b.x0 >= a.x1 - EPS_MM) || (xy && b.z0 >= a.z1 - EPS_MM)) {
          r.loadOrderViolations++;
          say(`item "${placements[j].id}" (stop ${stop[j]}) blocks "${placements[i].id}" (stop ${stop[i]}), which is unloaded earlier`);
        }
      }
    }
  }
  // Quantities.
  const unplacedQty = new Map<string, number>();
  for (const u of options?.unplaced ?? []) unplacedQty.set(u.id, (unplacedQty.get(u.id) ?? 0) + u.quantity);
  const quantity = new Map<string, number>();
  for (const it of items) quantity.set(it.id, (quantity.get(it.id) ?? 0) + (Number.isInteger(it.quantity) && it.quantity > 0 ? it.quantity : 0));
  for (const [id, q] of quantity) {
    const it = { id };
    const placed = counts.get(it.id) ?? 0;
    const accounted = placed + (options?.unplaced ? (unplacedQty.get(it.id) ?? 0) : 0);
    const bad = options?.unplaced ? accounted !== q : placed > q;
    if (bad) {
      r.quantityMismatches++;
      say(`item "${it.id}": quantity ${q}, placed ${placed}${options?.unplaced ? `, reported unplaced ${unplacedQty.get(it.id) ?? 0}` : ''}`);
    }
  }
  r.ok =
    r.overlaps + r.orientationFaults + r.outOfBounds + r.unsupported + r.stackLoadViolations + r.quantityMismatches + r.payloadExceeded + r.doorFaults + r.loadOrderViolations === 0;
  return r;
}
