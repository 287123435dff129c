import type { Vec3 } from '../geometry/vec3.ts';
import type { Box3 } from '../geometry/box.ts';
import type { InertiaTensor } from './inertia.ts';
import { findMeshClosureProblems, type MeshClosureOptions } from './mesh-closure.ts';

/** 1 mm³ = 1e-9 m³: turns density in kg/m³ into kg/mm³. */
const M3_PER_MM3 = 1e-9;

/** Mass properties of a closed triangle mesh of uniform density. */
export interface MeshMassProperties {
  /** Enclosed volume, mm³, always > 0 (an inside-out mesh is flipped first). */
  volumeMm3: number;
  /** volume × density, kg. */
  massKg: number;
  /** Centroid of the solid, mm, in the mesh's own coordinates. */
  cogMm: Vec3;
  /** 3×3 inertia tensor about the CoG, kg·mm² (see InertiaTensor for the sign convention). */
  inertiaKgMm2: InertiaTensor;
  /** True when the faces were consistently clockwise seen from outside and the mesh was turned right side out. */
  flipped?: boolean;
  /** Axis-aligned bounding box of the vertices, mm. */
  bboxMm?: Box3;
  /** Surface area, mm². */
  surfaceAreaMm2?: number;
  triangleCount?: number;
  /** Distinct vertices after welding equal corners. */
  vertexCount?: number;
  /** Zero-area triangles with two equal corners, ignored by the closure check (they add no volume). */
  degenerateTriangleCount?: number;
}

export interface MeshMassOptions extends MeshClosureOptions {
  /** Names the item in error messages, e.g. the file name or part number. Default "mesh". */
  itemName?: string;
}

/**
 * Volume, mass, centre of gravity and inertia tensor about the CoG of a closed triangle mesh of uniform
 * density, by the divergence theorem: each volume integral of 1, x, y, z, x², y², z², xy, yz, zx becomes a
 * sum over the triangles (D. Eberly, "Polyhedral Mass Properties (Revisited)", Geometric Tools, 2002, which
 * streamlines B. Mirtich, "Fast and Accurate Computation of Polyhedral Mass Properties", J. Graphics Tools
 * 1(2), 1996).
 *
 * @param trianglesMm flat list, 9 numbers per triangle (three corners x, y, z in mm); outward faces
 *   counter-clockwise seen from outside (the STL rule). Float32Array, Float64Array or number[].
 * @param densityKgPerM3 uniform density, kg/m³, > 0.
 * @throws when the length is not a multiple of 9, a coordinate is not finite, the density is not a positive
 *   finite number, the mesh is not closed (with counts of open, overused and misoriented edges and the first
 *   offending edge), or the volume is zero. Messages name the item (options.itemName).
 *
 * Precision: the integrals are taken about the bounding-box centre, not the file's origin, so that a small
 * part placed far from the origin does not lose digits to cancellation.
 */
export function meshMassProperties(
  trianglesMm: ArrayLike<number>,
  densityKgPerM3: number,
  options: MeshMassOptions = {},
): MeshMassProperties {
  const name = options.itemName ?? 'mesh';
  const t = trianglesMm;
  if (!t || typeof t.length !== 'number') throw new Error(`Mesh "${name}": triangles must be a flat list of numbers.`);
  if (t.length === 0) throw new Error(`Mesh "${name}": no triangles, so no volume and a total mass of zero.`);
  if (t.length % 9 !== 0) {
    throw new Error(`Mesh "${name}": the triangle list has ${t.length} numbers, not a multiple of 9 (three corners x, y, z per triangle).`);
  }
  if (!Number.isFinite(densityKgPerM3) || densityKgPerM3 <= 0) {
    throw new Error(`Mesh "${name}": density must be a finite number of kg/m³ above zero (got ${String(densityKgPerM3)}); a total mass of zero has no centre of gravity.`);
  }
  const n = t.length / 9;

  // Pass 1: finite check and bounding box.
  let minX = Infinity, minY = Infinity, minZ = Infinity, maxX = -Infinity, maxY = -Infinity, maxZ = -Infinity;
  for (let k = 0; k < t.length; k += 3) {
    const x = t[k], y = t[k + 1], z = t[k + 2];
    // One test for all three: NaN and ±Infinity make the sum non-finite (x − x is NaN for ±Infinity).
    if (!Number.isFinite(x - x + (y - y) + (z - z))) {
      const bad = !Number.isFinite(x) ? 'x' : !Number.isFinite(y) ? 'y' : 'z';
      throw new Error(`Mesh "${name}": triangle ${Math.floor(k / 9) + 1} (counting from 1), corner ${((k / 3) % 3) + 1} has a non-finite ${bad} coordinate (${String(t[k + 'xyz'.indexOf(bad)])}).`);
    }
    if (x < minX) minX = x;
    if (x > maxX) maxX = x;
    if (y < minY) minY = y;
    if (y > maxY) maxY = y;
    if (z < minZ) minZ = z;
    if (z > maxZ) maxZ = z;
  }

  // Closure before integration: a mesh with a hole has no enclosed volume to speak of.
  const closure = findMeshClosureProblems(t, options, { minMm: [minX, minY, minZ], maxMm: [maxX, maxY, maxZ] });
  if (closure.problems) {
    const p = closure.problems;
    const f = p.first;
    const fmt = (v: number[]): string => `(${v.map((c) => +c.toPrecision(9)).join(', ')})`;
    const kinds = [
      p.openEdges
        ? `${p.openEdges} open edge${p.openEdges === 1 ? '' : 's'} (used by one triangle only: a hole, a missing face, or faces meeting mid-edge; export the part as a closed, watertight mesh)`
        : '',
      p.overusedEdges ? `${p.overusedEdges} edge${p.overusedEdges === 1 ? '' : 's'} shared by more than two triangles` : '',
      p.misorientedEdges ? `${p.misorientedEdges} edge${p.misorientedEdges === 1 ? '' : 's'} where two triangles run the same way (a face turned over)` : '',
    ].filter(Boolean);
    throw new Error(
      `Mesh "${name}" is not closed: ${kinds.join(', ')}. Every edge must be shared by exactly two triangles running in opposite directions. ` +
        `First offending edge (${f.kind}): triangle ${f.triangleIndex + 1} (counting from 1), from ${fmt(f.fromMm)} to ${fmt(f.toMm)} mm.`,
    );
  }

  // Pass 2: the ten integrals, about the bounding-box centre.
  const ox = (minX + maxX) / 2, oy = (minY + maxY) / 2, oz = (minZ + maxZ) / 2;
  let i0 = 0, ix = 0, iy = 0, iz = 0, ixx = 0, iyy = 0, izz = 0, ixy = 0, iyz = 0, izx = 0;
  let area2 = 0;
  for (let k = 0; k < t.length; k += 9) {
    const x0 = t[k] - ox, y0 = t[k + 1] - oy, z0 = t[k + 2] - oz;
    const x1 = t[k + 3] - ox, y1 = t[k + 4] - oy, z1 = t[k + 5] - oz;
    const x2 = t[k + 6] - ox, y2 = t[k + 7] - oy, z2 = t[k + 8] - oz;
    // Edges and their cross product: twice the area vector, pointing out for counter-clockwise corners.
    const a1 = x1 - x0, b1 = y1 - y0, c1 = z1 - z0;
    const a2 = x2 - x0, b2 = y2 - y0, c2 = z2 - z0;
    const d0 = b1 * c2 - b2 * c1;
    const d1 = a2 * c1 - a1 * c2;
    const d2 = a1 * b2 - a2 * b1;
    area2 += Math.sqrt(d0 * d0 + d1 * d1 + d2 * d2);
    // Eberly's subexpressions per axis: f1 = Σw, f2 = Σw², f3 = Σw³ (over the monomials), g_i for products.
    let s0 = x0 + x1, s1 = x0 * x0, s2 = s1 + x1 * s0;
    const f1x = s0 + x2, f2x = s2 + x2 * f1x, f3x = x0 * s1 + x1 * s2 + x2 * f2x;
    const g0x = f2x + x0 * (f1x + x0), g1x = f2x + x1 * (f1x + x1), g2x = f2x + x2 * (f1x + x2);
    s0 = y0 + y1; s1 = y0 * y0; s2 = s1 + y1 * s0;
    const f1y = s0 + y2, f2y = s2 + y2 * f1y, f3y = y0 * s1 + y1 * s2 + y2 * f2y;
    const g0y = f2y + y0 * (f1y + y0), g1y = f2y + y1 * (f1y + y1), g2y = f2y + y2 * (f1y + y2);
    s0 = z0 + z1; s1 = z0 * z0; s2 = s1 + z1 * s0;
    const f1z = s0 + z2, f2z = s2 + z2 * f1z, f3z = z0 * s1 + z1 * s2 + z2 * f2z;
    const g0z = f2z + z0 * (f1z + z0), g1z = f2z + z1 * (f1z + z1), g2z = f2z + z2 * (f1z + z2);
    i0 += d0 * f1x;
    ix += d0 * f2x;
    iy += d1 * f2y;
    iz += d2 * f2z;
    ixx += d0 * f3x;
    iyy += d1 * f3y;
    izz += d2 * f3z;
    ixy += d0 * (y0 * g0x + y1 * g1x + y2 * g2x);
    iyz += d1 * (z0 * g0y + z1 * g1y + z2 * g2y);
    izx += d2 * (x0 * g0z + x1 * g1z + x2 * g2z);
  }
  let vol = i0 / 6;
  let mx = ix / 24, my = iy / 24, mz = iz / 24;
  let sxx = ixx / 60, syy = iyy / 60, szz = izz / 60;
  let sxy = ixy / 120, syz = iyz / 120, szx = izx / 120;

  // Zero volume (a flat or empty shell): nothing to weigh. Compared with the box so the test is scale-free.
  const boxVol = Math.max(maxX - minX, 1e-300) * Math.max(maxY - minY, 1e-300) * Math.max(maxZ - minZ, 1e-300);
  if (!(Math.abs(vol) > boxVol * 1e-12) || !Number.isFinite(vol)) {
    throw new Error(`Mesh "${name}": the enclosed volume is zero (${vol} mm³), so the total mass is zero and there is no centre of gravity.`);
  }
  let flipped = false;
  if (vol < 0) {
    // Consistently inside-out (all faces clockwise from outside): every integral changes sign; turn it over.
    flipped = true;
    vol = -vol;
    mx = -mx; my = -my; mz = -mz;
    sxx = -sxx; syy = -syy; szz = -szz;
    sxy = -sxy; syz = -syz; szx = -szx;
  }
  const cx = mx / vol, cy = my / vol, cz = mz / vol;
  const rho = densityKgPerM3 * M3_PER_MM3; // kg/mm³
  // Second moments about the CoG (parallel-axis shift from the box centre), then the tensor.
  const cxx = sxx - vol * cx * cx, cyy = syy - vol * cy * cy, czz = szz - vol * cz * cz;
  const cxy = sxy - vol * cx * cy, cyz = syz - vol * cy * cz, czx = szx - vol * cz * cx;
  const inertia: InertiaTensor = [
    // `0 - …` rather than unary minus, so that a zero product of inertia is +0, not −0.
    [rho * (cyy + czz), 0 - rho * cxy, 0 - rho * czx],
    [0 - rho * cxy, rho * (cxx + czz), 0 - rho * cyz],
    [0 - rho * czx, 0 - rho * cyz, rho * (cxx + cyy)],
  ];
  return {
    volumeMm3: vol,
    massKg: vol * rho,
    cogMm: [cx + ox, cy + oy, cz + oz],
    inertiaKgMm2: inertia,
    flipped,
    bboxMm: { minMm: [minX, minY, minZ], maxMm: [maxX, maxY, maxZ] },
    surfaceAreaMm2: area2 / 2,
    triangleCount: n,
    vertexCount: closure.report.vertexCount,
    degenerateTriangleCount: closure.report.degenerateTriangleCount,
  };
}
