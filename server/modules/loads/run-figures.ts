import type { PlacementView, RunFiguresView, RunItemView, VehicleFiguresView } from '../../../src/domain/contracts/crate-loads.ts';
import { combineMasses, type PointMass } from '../../../src/domain/mass/index.ts';
import { validatePacking, type PackItem } from '../../../src/domain/packing/index.ts';
import { airChargeable, checkLoadPlan, roadChargeable, seaChargeable, steerLoad, type Vehicle } from '../../../src/domain/vehicles/index.ts';

type Vec3 = [number, number, number];
const EPS_MM = 0.5;

export type RunVehicle = Vehicle & { code: string; vehicleRowId: string };
export interface RunSettings {
  airDivisorCm3PerKg: number;
  roadKgPerLoadingMetre: number;
}

/** The packing engine's view of a run item (the extra fields are ours and ignored by the engine). */
export function packItem(i: RunItemView): PackItem {
  return {
    id: i.id,
    lengthMm: i.lengthMm,
    widthMm: i.widthMm,
    heightMm: i.heightMm,
    massKg: i.massKg,
    quantity: i.quantity,
    orientation: i.orientation,
    ...(i.stackable !== undefined ? { stackable: i.stackable } : {}),
    ...(i.maxLoadOnTopKg !== undefined ? { maxLoadOnTopKg: i.maxLoadOnTopKg } : {}),
    ...(i.stopIndex !== undefined ? { stopIndex: i.stopIndex } : {}),
  };
}

/** The engine names items by id (a uuid); the planner knows crates by code. */
export function nameUnplaced<T extends { id: string; reason: string }>(unplaced: readonly T[], items: readonly RunItemView[]): T[] {
  return unplaced.map((u) => {
    let reason = u.reason;
    for (const it of items) reason = reason.split(`"${it.id}"`).join(`crate ${it.code}`);
    return { ...u, reason };
  });
}

/**
 * Where a crate's CoG lies in the load space once placed. The engine turns crates only onto their axes;
 * each placed extent is matched to the crate's own length, width or height, and the CoG coordinates follow
 * the axes they were turned onto. Which end faces the doors the engine leaves free: the plan marks the
 * CoG for the end-for-end choice it draws. Unknown CoG: the middle of the box.
 */
export function placedCogMm(item: RunItemView, p: Pick<PlacementView, 'xMm' | 'yMm' | 'zMm' | 'lengthMm' | 'widthMm' | 'heightMm'>): Vec3 {
  const own = [item.lengthMm, item.widthMm, item.heightMm];
  const placed = [p.lengthMm, p.widthMm, p.heightMm];
  if (!item.cogMm) return [p.xMm + p.lengthMm / 2, p.yMm + p.widthMm / 2, p.zMm + p.heightMm / 2];
  const used = [false, false, false];
  const axisFor = placed.map((e, i) => {
    // Prefer the same axis, then any unused axis of the same extent.
    const pick = Math.abs(own[i] - e) < EPS_MM && !used[i] ? i : own.findIndex((o, j) => !used[j] && Math.abs(o - e) < EPS_MM);
    const k = pick < 0 ? i : pick;
    used[k] = true;
    return k;
  });
  const c = item.cogMm;
  return [p.xMm + c[axisFor[0]], p.yMm + c[axisFor[1]], p.zMm + c[axisFor[2]]];
}

/** How the engine's load was moved in each vehicle to keep its axle loads and CoG within limits. */
export type Steering = NonNullable<VehicleFiguresView['steering']>;

/**
 * The packing search fills each vehicle from the front wall; this moves each vehicle's whole load along and
 * across the bed (the core's steerLoad) so that its axle groups and CoG are within limits where the free
 * space allows, and says what must be blocked. Support, stacking and load order are unchanged by the move.
 */
export function steerPlacements(vehicles: readonly RunVehicle[], items: readonly RunItemView[], placements: readonly PlacementView[]): { placements: PlacementView[]; steering: Map<string, Steering> } {
  const byId = new Map(items.map((i) => [i.id, i]));
  const steering = new Map<string, Steering>();
  const out: PlacementView[] = [];
  for (const v of vehicles) {
    const mine = placements.filter((p) => p.vehicleId === v.id);
    if (mine.length === 0) continue;
    const s = steerLoad(
      v,
      mine.map((p) => {
        const it = byId.get(p.id);
        return { xMm: p.xMm, yMm: p.yMm, lengthMm: p.lengthMm, widthMm: p.widthMm, massKg: it?.massKg ?? 0, cogMm: it ? placedCogMm(it, p) : [p.xMm + p.lengthMm / 2, p.yMm + p.widthMm / 2, p.zMm + p.heightMm / 2] };
      }),
    );
    steering.set(v.id, { alongMm: s.alongMm, acrossMm: s.acrossMm, frontGapMm: s.frontGapMm, doorGapMm: s.doorGapMm, withinLimitsBefore: s.before.ok, advice: s.advice });
    for (const p of mine) out.push({ ...p, xMm: p.xMm + s.alongMm, yMm: p.yMm + s.acrossMm });
  }
  const inVehicles = new Set(vehicles.map((v) => v.id));
  for (const p of placements) if (!inVehicles.has(p.vehicleId)) out.push(p);
  return { placements: out, steering };
}

/**
 * The figures of a packing run, every one from the cores: the validator on each vehicle's load,
 * the load-plan check (payload, CoG along and across, axle groups by statics), and chargeable weight for
 * air, road and sea with the production's divisors. Floor use counts the crates standing on the floor.
 */
export function runFigures(
  vehicles: readonly RunVehicle[],
  items: readonly RunItemView[],
  placements: readonly PlacementView[],
  unplaced: readonly { id: string; quantity: number }[],
  settings: RunSettings,
  fullSupport: boolean,
  steering?: ReadonlyMap<string, Steering>,
): RunFiguresView {
  const byId = new Map(items.map((i) => [i.id, i]));
  const packItems = items.map(packItem);
  const perVehicle: VehicleFiguresView[] = vehicles.map((v) => {
    const mine = placements.filter((p) => p.vehicleId === v.id);
    const load: PointMass[] = [];
    const crateCogs: { id: string; cogMm: Vec3 }[] = [];
    let volume = 0;
    let floor = 0;
    for (const p of mine) {
      const it = byId.get(p.id);
      volume += p.lengthMm * p.widthMm * p.heightMm;
      if (p.zMm <= EPS_MM) floor += p.lengthMm * p.widthMm;
      if (!it) continue;
      const cogMm = placedCogMm(it, p);
      crateCogs.push({ id: p.id, cogMm });
      if (it.massKg > 0) load.push({ massKg: it.massKg, cogMm });
    }
    const loadKg = load.reduce((s, m) => s + m.massKg, 0);
    const cog = load.length > 0 ? (combineMasses(load).cogMm as Vec3) : null;
    const plan = checkLoadPlan(v, load);
    const validation = validatePacking(v, packItems, mine, { fullSupport });
    const road = mine.length > 0 ? roadChargeable(mine.map((p) => ({ lengthMm: p.lengthMm, widthMm: p.widthMm, heightMm: p.heightMm, massKg: byId.get(p.id)?.massKg ?? 0, stackedOnOthers: p.zMm > EPS_MM }))) : null;
    return {
      vehicleId: v.id,
      itemCount: mine.length,
      loadKg,
      maxPayloadKg: v.maxPayloadKg,
      volumeUtilisation: volume / (v.lengthMm * v.widthMm * v.heightMm),
      floorUtilisation: floor / (v.lengthMm * v.widthMm),
      cogMm: cog,
      cogAlongOffsetMm: cog ? cog[0] - v.lengthMm / 2 : null,
      cogAcrossOffsetMm: cog ? cog[1] - v.widthMm / 2 : null,
      loadPlan: plan as unknown as VehicleFiguresView['loadPlan'],
      validation,
      loadingMetres: road?.loadingMetres ?? 0,
      crateCogs,
      ...(steering?.get(v.id) ? { steering: steering.get(v.id) } : {}),
    };
  });

  // Every crate once: in one vehicle, or reported as not placed.
  const seen = new Map<string, number>();
  for (const p of placements) seen.set(p.id, (seen.get(p.id) ?? 0) + 1);
  const notPlaced = new Map(unplaced.map((u) => [u.id, u.quantity]));
  const accountingProblems: string[] = [];
  for (const it of items) {
    const n = (seen.get(it.id) ?? 0) + (notPlaced.get(it.id) ?? 0);
    if (n !== it.quantity) accountingProblems.push(`crate ${it.code}: ${seen.get(it.id) ?? 0} placed, ${notPlaced.get(it.id) ?? 0} not placed, of ${it.quantity}`);
  }
  for (const p of placements) {
    if (!byId.has(p.id)) accountingProblems.push(`placement of unknown item "${p.id}"`);
    if (!vehicles.some((v) => v.id === p.vehicleId)) accountingProblems.push(`placement in unknown vehicle "${p.vehicleId}"`);
  }
  if (accountingProblems.length > 0 && perVehicle[0]) {
    perVehicle[0].validation.quantityMismatches += accountingProblems.length;
    perVehicle[0].validation.messages.push(...accountingProblems);
    perVehicle[0].validation.ok = false;
  }

  const pieces = placements.map((p) => ({ lengthMm: p.lengthMm, widthMm: p.widthMm, heightMm: p.heightMm, massKg: byId.get(p.id)?.massKg ?? 0, stackedOnOthers: p.zMm > EPS_MM }));
  const air = airChargeable(pieces, { divisorCm3PerKg: settings.airDivisorCm3PerKg });
  const road = roadChargeable(pieces, { kgPerLoadingMetre: settings.roadKgPerLoadingMetre });
  const sea = seaChargeable(pieces);
  const unplacedCount = unplaced.reduce((s, u) => s + u.quantity, 0);
  return {
    vehicles: perVehicle,
    vehiclesUsed: perVehicle.filter((v) => v.itemCount > 0).length,
    placedCount: placements.length,
    unplacedCount,
    totalKg: air.actualKg,
    chargeable: { air, road: { ...road, kgPerLoadingMetre: settings.roadKgPerLoadingMetre }, sea },
    ok: unplacedCount === 0 && perVehicle.every((v) => v.validation.ok && (v.itemCount === 0 || v.loadPlan.ok)),
  };
}

/**
 * What the engine returned, made ready to save: unplaced crates named by code, each vehicle's load steered for
 * its axles and CoG, and the run's figures.
 */
export function finishRun<R extends { placements: PlacementView[]; unplaced: { id: string; quantity: number; reason: string }[] }>(
  vehicles: readonly RunVehicle[],
  items: readonly RunItemView[],
  result: R,
  settings: RunSettings,
  fullSupport: boolean,
): { result: R; figures: RunFiguresView } {
  const steered = steerPlacements(vehicles, items, result.placements);
  const done = { ...result, placements: steered.placements, unplaced: nameUnplaced(result.unplaced, items) };
  return { result: done, figures: runFigures(vehicles, items, done.placements, done.unplaced, settings, fullSupport, steered.steering) };
}
