import type { Vec3 } from '../geometry/vec3.ts';
import type { Mat3 } from './rotation.ts';

/**
 * Inertia tensor in kg·mm², a symmetric 3×3 matrix (rows x, y, z):
 * I_ij = ∫ ρ (|r|² δ_ij − r_i r_j) dV. The diagonal holds the moments of inertia about the x, y and z axes;
 * the off-diagonal terms are the NEGATED products of inertia (−∫ρxy dV …). Always about a stated point,
 * in Ballast normally the centre of gravity.
 */
export type InertiaTensor = number[][];

export function zeroTensor(): InertiaTensor {
  return [
    [0, 0, 0],
    [0, 0, 0],
    [0, 0, 0],
  ];
}

/**
 * Inertia of a solid uniform cuboid of mass m and edge lengths a, b, c (mm, along x, y, z) about its centre:
 * Ixx = m(b² + c²)/12, Iyy = m(a² + c²)/12, Izz = m(a² + b²)/12, no products (any statics handbook).
 */
export function cuboidInertia(massKg: number, sizeMm: Vec3): InertiaTensor {
  const [a, b, c] = sizeMm;
  return [
    [(massKg * (b * b + c * c)) / 12, 0, 0],
    [0, (massKg * (a * a + c * c)) / 12, 0],
    [0, 0, (massKg * (a * a + b * b)) / 12],
  ];
}

/**
 * Parallel-axis (Huygens–Steiner) term for a point mass m at offset d from the reference point:
 * m(|d|² E − d dᵀ). Add it to a tensor about the body's own CoG to get the tensor about the reference point.
 */
export function pointMassInertia(massKg: number, offsetMm: Vec3): InertiaTensor {
  const [x, y, z] = offsetMm;
  return [
    [massKg * (y * y + z * z), 0 - massKg * x * y, 0 - massKg * x * z],
    [0 - massKg * x * y, massKg * (x * x + z * z), 0 - massKg * y * z],
    [0 - massKg * x * z, 0 - massKg * y * z, massKg * (x * x + y * y)],
  ];
}

/** Tensor about the CoG moved to a point at `offsetMm` from the CoG: I = I_cg + m(|d|² E − d dᵀ). */
export function shiftFromCog(inertiaAtCog: InertiaTensor, massKg: number, offsetMm: Vec3): InertiaTensor {
  const p = pointMassInertia(massKg, offsetMm);
  return inertiaAtCog.map((row, i) => row.map((v, j) => v + p[i][j]));
}

/** Tensor about a point moved to the CoG at `offsetMm` from that point: I_cg = I − m(|d|² E − d dᵀ). */
export function shiftToCog(inertiaAtPoint: InertiaTensor, massKg: number, offsetMm: Vec3): InertiaTensor {
  const p = pointMassInertia(massKg, offsetMm);
  return inertiaAtPoint.map((row, i) => row.map((v, j) => v - p[i][j]));
}

/** R I Rᵀ: a tensor given in a body frame expressed in the frame that R rotates into. */
export function rotateTensor(r: Mat3, t: InertiaTensor): InertiaTensor {
  const out = zeroTensor();
  for (let i = 0; i < 3; i++) {
    for (let j = 0; j < 3; j++) {
      let s = 0;
      for (let k = 0; k < 3; k++) for (let l = 0; l < 3; l++) s += r[i][k] * t[k][l] * r[j][l];
      out[i][j] = s;
    }
  }
  return out;
}

/** True when the value is a 3×3 array of finite numbers. */
export function isFiniteTensor(t: unknown): t is InertiaTensor {
  return (
    Array.isArray(t) &&
    t.length === 3 &&
    t.every((row) => Array.isArray(row) && row.length === 3 && row.every((v) => typeof v === 'number' && Number.isFinite(v)))
  );
}
