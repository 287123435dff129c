import type { PlacementView, RunFiguresView, RunItemView, VehicleFiguresView } from '../../../src/domain/contracts/crate-loads.ts';
import { combineMasses, type PointMass } from '../../../src/domain/mass/index.ts';
import { validatePacking, type PackItem } from '../../../src/domain/packing/index.ts';
import { airChargeable, checkLoadPlan, roadChargeable, seaChargeable, type Vehicle } from '../../../src/domain/vehicles/index.ts';

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
