import type { Vec3 } from './vec3.ts';

/** An axis-aligned box in the core frame (mm). Invariant: min[i] <= max[i]. */
export interface Box3 {
  minMm: Vec3;
  maxMm: Vec3;
}

export function emptyBox(): Box3 {
  return { minMm: [Infinity, Infinity, Infinity], maxMm: [-Infinity, -Infinity, -Infinity] };
}
export function isEmptyBox(b: Box3): boolean {
  return !(b.minMm[0] <= b.maxMm[0] && b.minMm[1] <= b.maxMm[1] && b.minMm[2] <= b.maxMm[2]);
}
export function unionBox(a: Box3, b: Box3): Box3 {
  return {
    minMm: [Math.min(a.minMm[0], b.minMm[0]), Math.min(a.minMm[1], b.minMm[1]), Math.min(a.minMm[2], b.minMm[2])],
    maxMm: [Math.max(a.maxMm[0], b.maxMm[0]), Math.max(a.maxMm[1], b.maxMm[1]), Math.max(a.maxMm[2], b.maxMm[2])],
  };
}
export function boxSize(b: Box3): Vec3 {
  return isEmptyBox(b) ? [0, 0, 0] : [b.maxMm[0] - b.minMm[0], b.maxMm[1] - b.minMm[1], b.maxMm[2] - b.minMm[2]];
}
/** True when a box of size `inner` fits inside `outer` in some axis permutation. */
export function fitsInAnyOrientation(inner: Vec3, outer: Vec3): boolean {
  const a = [...inner].sort((x, y) => x - y);
  const b = [...outer].sort((x, y) => x - y);
  return a[0] <= b[0] && a[1] <= b[1] && a[2] <= b[2];
}
