import type { Vec3 } from '../geometry/vec3.ts';

export interface PointMass {
  massKg: number;
  cogMm: Vec3;
}

/**
 * Combined mass and centre of gravity of point masses: x̄ = Σ mᵢxᵢ / Σ mᵢ per axis.
 * Throws on a non-finite or negative mass, a non-finite position, or a zero total,
 * naming the item (by index) so that a gap is never silently counted as zero.
 */
export function combineMasses(items: readonly PointMass[]): PointMass {
  let m = 0;
  let mx = 0;
  let my = 0;
  let mz = 0;
  for (let i = 0; i < items.length; i++) {
    const it = items[i];
    if (!Number.isFinite(it.massKg) || it.massKg < 0) {
      throw new Error(`Item ${i}: mass must be a finite number of kilograms, not below zero (got ${String(it.massKg)}).`);
    }
    const c = it.cogMm;
    if (!c || c.length !== 3 || !Number.isFinite(c[0]) || !Number.isFinite(c[1]) || !Number.isFinite(c[2])) {
      throw new Error(`Item ${i}: centre of gravity must be three finite numbers in millimetres.`);
    }
    m += it.massKg;
    mx += it.massKg * c[0];
    my += it.massKg * c[1];
    mz += it.massKg * c[2];
  }
  if (!(m > 0)) throw new Error('Total mass is zero: no centre of gravity can be computed.');
  return { massKg: m, cogMm: [mx / m, my / m, mz / m] };
}
