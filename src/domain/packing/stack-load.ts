import { EPS_MM } from './orientations.ts';

/** An axis-aligned placed box with its mass (mm, kg). */
export interface MassBox {
  x0: number;
  y0: number;
  z0: number;
  x1: number;
  y1: number;
  z1: number;
  massKg: number;
}

/** Area (mm²) where the footprints of two boxes overlap in plan. */
export function planOverlapMm2(a: MassBox, b: MassBox): number {
  const dx = Math.min(a.x1, b.x1) - Math.max(a.x0, b.x0);
  const dy = Math.min(a.y1, b.y1) - Math.max(a.y0, b.y0);
  return dx > EPS_MM && dy > EPS_MM ? dx * dy : 0;
}

/**
 * Mass resting on each box (kg), directly and through the boxes above it. Ballast's load model (shared by
 * engine and validator): a box passes its own mass plus the load on it to the boxes whose tops touch its
 * base, in proportion to the contact areas. A box with no contact below (floor or floating) passes nothing
 * on. This is the statically simplest split; it is exact for a box on one support and a fair estimate for
 * bridges, where the real split depends on stiffness.
 */
export function loadsOnTopKg(boxes: readonly MassBox[]): Float64Array {
  const n = boxes.length;
  const load = new Float64Array(n);
  const order = Array.from({ length: n }, (_, i) => i).sort((a, b) => boxes[b].z0 - boxes[a].z0);
  const supporters: number[] = [];
  const areas: number[] = [];
  for (const i of order) {
    const b = boxes[i];
    if (b.z0 <= EPS_MM) continue;
    supporters.length = 0;
    areas.length = 0;
    let total = 0;
    for (let j = 0; j < n; j++) {
      if (j === i) continue;
      const s = boxes[j];
      if (Math.abs(s.z1 - b.z0) > EPS_MM) continue;
      const a = planOverlapMm2(b, s);
      if (a > 0) {
        supporters.push(j);
        areas.push(a);
        total += a;
      }
    }
    if (total <= 0) continue;
    const passed = b.massKg + load[i];
    for (let k = 0; k < supporters.length; k++) load[supporters[k]] += (passed * areas[k]) / total;
  }
  return load;
}
