import { packBoxes, DEFAULT_TIME_LIMIT_MS } from './pack-boxes.ts';
import { prepareInput } from './prepare.ts';
import type { PackItem, PackOptions, PackVehicle, PackVehiclesResult, Unplaced } from './types.ts';

const now = (): number => (typeof performance !== 'undefined' ? performance.now() : Date.now());

/**
 * Packs items into as few of the given vehicles as possible, filling them in the order given: each vehicle
 * gets the densest load the container search finds among the items still waiting (a sequential
 * bin-packing strategy: filling each bin as full as possible leaves the fewest items for the next).
 * The time budget is shared out over the vehicles still expected to be needed; `maxIterations` applies to
 * each vehicle's search. Items that fit no vehicle are reported with the reason for the largest one.
 */
export async function packVehicles(vehicles: PackVehicle[], items: PackItem[], options?: PackOptions): Promise<PackVehiclesResult> {
  const start = now();
  const unplaced: Unplaced[] = [];
  const placements: PackVehiclesResult['placements'] = [];
  const timeLimit = options?.timeLimitMs ?? (options?.maxIterations === undefined ? DEFAULT_TIME_LIMIT_MS : Infinity);
  // Items no vehicle can take at all: report once, with the reason from the largest vehicle.
  const largest = [...vehicles].sort((a, b) => b.lengthMm * b.widthMm * b.heightMm - a.lengthMm * a.widthMm * a.heightMm)[0];
  const okSomewhere = new Set<number>();
  const perVehicleOk = vehicles.map((v) => {
    const prep = prepareInput(v, items);
    const ids = new Set(prep.types.map((t) => t.index));
    ids.forEach((i) => okSomewhere.add(i));
    return ids;
  });
  if (largest) {
    const prepL = prepareInput(largest, items);
    for (const r of prepL.rejected) {
      const idx = items.findIndex((it) => it.id === r.id);
      if (!okSomewhere.has(idx)) unplaced.push({ ...r, reason: vehicles.length > 1 ? `item "${r.id}" fits none of the ${vehicles.length} vehicles (largest "${largest.id}": ${r.reason})` : r.reason });
    }
  } else {
    items.forEach((it, i) => it.quantity > 0 && okSomewhere.add(i));
  }
  const left = items.map((it, i) => (okSomewhere.has(i) ? it.quantity : 0));
  let used = 0;
  const volumeOf = (i: number) => items[i].lengthMm * items[i].widthMm * items[i].heightMm * left[i];
  for (let v = 0; v < vehicles.length; v++) {
    const veh = vehicles[v];
    const todo = items.map((it, i) => ({ it, i })).filter(({ i }) => left[i] > 0 && perVehicleOk[v].has(i));
    if (todo.length === 0) continue;
    // Share the remaining time over the vehicles the remaining volume still needs (at least one).
    const remainingVol = todo.reduce((s, { i }) => s + volumeOf(i), 0);
    const need = Math.max(1, Math.ceil(remainingVol / (veh.lengthMm * veh.widthMm * veh.heightMm)));
    const remainingTime = timeLimit - (now() - start);
    const res = await packBoxes(
      veh,
      todo.map(({ it, i }) => ({ ...it, quantity: left[i] })),
      {
        ...options,
        timeLimitMs: Number.isFinite(remainingTime) ? Math.max(1, remainingTime / need) : undefined,
        onProgress: options?.onProgress ? (f, u) => options.onProgress?.((v + f) / vehicles.length, u) : undefined,
      },
    );
    if (res.placements.length === 0) continue;
    used++;
    const idx = new Map(todo.map(({ it, i }) => [it.id, i]));
    for (const p of res.placements) {
      placements.push({ ...p, vehicleId: veh.id });
      left[idx.get(p.id)!]--;
    }
  }
  items.forEach((it, i) => {
    if (left[i] > 0) unplaced.push({ id: it.id, quantity: left[i], reason: `item "${it.id}": ${left[i]} of ${it.quantity} did not fit in the ${vehicles.length} vehicle(s) given` });
  });
  return { placements, unplaced, vehiclesUsed: used };
}
