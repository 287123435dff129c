import { allowedDims, fitsInside, passesDoor, type Dims3 } from './orientations.ts';
import type { PackContainer, PackItem, Unplaced } from './types.ts';

/** One item line as the solver sees it: checked, with the turns that fit the container and pass the door. */
export interface SolverType {
  /** Index in the caller's item list. */
  index: number;
  id: string;
  /** Allowed extents (x, y, z) that fit inside and pass the door. Never empty. */
  dims: Dims3[];
  volumeMm3: number;
  massKg: number;
  count: number;
  stackable: boolean;
  /** Infinity when unlimited. */
  maxLoadOnTopKg: number;
  /** Loading group: 0 is loaded first (highest stopIndex, front wall); later groups nearer the doors. */
  group: number;
}

export interface PreparedInput {
  types: SolverType[];
  /** Items rejected before packing, with the reason. */
  rejected: Unplaced[];
  /** Number of loading groups (distinct stops). */
  groups: number;
  /** Non-empty when the container itself is unusable; then nothing is packed. */
  containerError?: string;
}

const fmt = (v: number): string => (Number.isInteger(v) ? String(v) : v.toFixed(1));
const sizeText = (i: PackItem): string => `${fmt(i.lengthMm)}×${fmt(i.widthMm)}×${fmt(i.heightMm)} mm`;

/** Checks the container; returns a message naming the bad field, or undefined. */
export function checkContainer(c: PackContainer): string | undefined {
  for (const f of ['lengthMm', 'widthMm', 'heightMm'] as const) {
    if (!(Number.isFinite(c[f]) && c[f] > 0)) return `container ${f} must be a positive number of mm (got ${String(c[f])})`;
  }
  for (const f of ['maxPayloadKg', 'doorWidthMm', 'doorHeightMm'] as const) {
    const v = c[f];
    if (v !== undefined && !(Number.isFinite(v) && v >= 0)) return `container ${f} must be a number ≥ 0 (got ${String(v)})`;
  }
  return undefined;
}

/**
 * Checks every item line against the container and turns the good ones into solver types. Bad lines are
 * rejected with a reason naming the item and the limit; the rest are still packed.
 */
export function prepareInput(container: PackContainer, items: readonly PackItem[]): PreparedInput {
  const rejected: Unplaced[] = [];
  const containerError = checkContainer(container);
  const ok: { item: PackItem; index: number; dims: Dims3[] }[] = [];
  const seen = new Set<string>();
  items.forEach((item, index) => {
    const q = item.quantity;
    const qty = Number.isInteger(q) && q > 0 ? q : 0;
    const reject = (reason: string) => rejected.push({ id: item.id, quantity: qty, reason });
    if (!Number.isInteger(q) || q < 0) return reject(`item "${item.id}": quantity must be a whole number ≥ 0 (got ${String(q)})`);
    if (q === 0) return;
    if (containerError) return reject(`item "${item.id}" not packed: ${containerError}`);
    if (seen.has(item.id)) return reject(`item "${item.id}": the id is used by an earlier line; ids must be unique`);
    seen.add(item.id);
    for (const f of ['lengthMm', 'widthMm', 'heightMm'] as const) {
      if (!(Number.isFinite(item[f]) && item[f] > 0)) return reject(`item "${item.id}": ${f} must be a positive number of mm (got ${String(item[f])})`);
    }
    if (item.massKg !== undefined && !(Number.isFinite(item.massKg) && item.massKg >= 0)) {
      return reject(`item "${item.id}": massKg must be a number ≥ 0 (got ${String(item.massKg)})`);
    }
    if (item.maxLoadOnTopKg !== undefined && !(item.maxLoadOnTopKg >= 0)) {
      return reject(`item "${item.id}": maxLoadOnTopKg must be ≥ 0 (got ${String(item.maxLoadOnTopKg)})`);
    }
    if (item.stopIndex !== undefined && !Number.isFinite(item.stopIndex)) {
      return reject(`item "${item.id}": stopIndex must be a finite number (got ${String(item.stopIndex)})`);
    }
    const turns = allowedDims(item);
    if (turns.length === 0) {
      return reject(`item "${item.id}": orientation '${item.orientation}' with verticalAxes [${(item.verticalAxes ?? []).join(', ')}] allows no way to stand`);
    }
    const inside = turns.filter((d) => fitsInside(d, container));
    if (inside.length === 0) {
      return reject(`item "${item.id}" (${sizeText(item)}, ${item.orientation}) is larger than the container (${fmt(container.lengthMm)}×${fmt(container.widthMm)}×${fmt(container.heightMm)} mm) in every allowed orientation`);
    }
    const through = inside.filter((d) => passesDoor(d, item.orientation, container));
    if (through.length === 0) {
      return reject(`item "${item.id}" (${sizeText(item)}) does not pass the door opening (${fmt(container.doorWidthMm ?? container.widthMm)} mm wide × ${fmt(container.doorHeightMm ?? container.heightMm)} mm high) in any allowed orientation`);
    }
    const m = item.massKg ?? 0;
    if (container.maxPayloadKg !== undefined && m > container.maxPayloadKg + 1e-9) {
      return reject(`item "${item.id}": its mass ${fmt(m)} kg exceeds the payload limit maxPayloadKg ${fmt(container.maxPayloadKg)} kg`);
    }
    ok.push({ item, index, dims: through });
  });
  // Loading groups: the highest stopIndex is loaded first (front wall); absent = after every stop.
  const stops = [...new Set(ok.map((o) => o.item.stopIndex ?? Infinity))].sort((a, b) => b - a);
  const types: SolverType[] = ok.map(({ item, index, dims }) => ({
    index,
    id: item.id,
    dims,
    volumeMm3: item.lengthMm * item.widthMm * item.heightMm,
    massKg: item.massKg ?? 0,
    count: item.quantity,
    stackable: item.stackable !== false,
    maxLoadOnTopKg: item.maxLoadOnTopKg ?? Infinity,
    group: stops.indexOf(item.stopIndex ?? Infinity),
  }));
  return { types, rejected, groups: Math.max(1, stops.length), containerError };
}
