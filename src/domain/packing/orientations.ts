import type { PackContainer, PackItem, VerticalAxis } from './types.ts';

/** Tolerance for comparing lengths in mm (sums of decimal sizes are not exact in floating point). */
export const EPS_MM = 1e-6;

/** Extents along x, y, z of one way of placing an item. */
export type Dims3 = [number, number, number];

/**
 * The six axis-aligned turns of an item with sizes (l, w, h), as extents along (x, y, z), and which of the
 * item's dimensions stands vertical in each.
 */
const TURNS: { pick: [0 | 1 | 2, 0 | 1 | 2, 0 | 1 | 2]; vertical: VerticalAxis }[] = [
  { pick: [0, 1, 2], vertical: 'height' }, // as given
  { pick: [1, 0, 2], vertical: 'height' }, // turned on the floor
  { pick: [0, 2, 1], vertical: 'width' },
  { pick: [2, 0, 1], vertical: 'width' },
  { pick: [1, 2, 0], vertical: 'length' },
  { pick: [2, 1, 0], vertical: 'length' },
];

/**
 * Allowed placed extents (x, y, z) of an item, without duplicates (a cube has one).
 * 'fixed' allows only the given turn, 'upright' keeps height vertical, 'any' allows all six; `verticalAxes`
 * (where given) must also list the vertical dimension. An empty list means the constraints exclude every turn.
 */
export function allowedDims(item: Pick<PackItem, 'lengthMm' | 'widthMm' | 'heightMm' | 'orientation' | 'verticalAxes'>): Dims3[] {
  const size = [item.lengthMm, item.widthMm, item.heightMm];
  const turns = item.orientation === 'fixed' ? TURNS.slice(0, 1) : item.orientation === 'upright' ? TURNS.slice(0, 2) : TURNS;
  const out: Dims3[] = [];
  for (const t of turns) {
    if (item.verticalAxes && !item.verticalAxes.includes(t.vertical)) continue;
    const d: Dims3 = [size[t.pick[0]], size[t.pick[1]], size[t.pick[2]]];
    if (!out.some((o) => sameDims(o, d))) out.push(d);
  }
  return out;
}

export function sameDims(a: readonly number[], b: readonly number[]): boolean {
  return Math.abs(a[0] - b[0]) <= EPS_MM && Math.abs(a[1] - b[1]) <= EPS_MM && Math.abs(a[2] - b[2]) <= EPS_MM;
}

/**
 * Door rule (Ballast's own, stated here so engine and validator agree): an item goes in through the doors
 * moving along x, upright as it will stand, so its height must pass the door height. An item that may turn
 * on the floor enters narrow side first (it is turned inside), so its smaller floor side must pass the door
 * width; a 'fixed' item cannot turn, so its width across (y) must pass.
 */
export function passesDoor(dims: Dims3, orientation: PackItem['orientation'], container: PackContainer): boolean {
  const doorW = container.doorWidthMm ?? container.widthMm;
  const doorH = container.doorHeightMm ?? container.heightMm;
  const across = orientation === 'fixed' ? dims[1] : Math.min(dims[0], dims[1]);
  return dims[2] <= doorH + EPS_MM && across <= doorW + EPS_MM;
}

/** True when the extents fit inside the container. */
export function fitsInside(dims: Dims3, container: PackContainer): boolean {
  return dims[0] <= container.lengthMm + EPS_MM && dims[1] <= container.widthMm + EPS_MM && dims[2] <= container.heightMm + EPS_MM;
}
