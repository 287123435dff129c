import type { Vec3 } from '../geometry/vec3.ts';

/**
 * A 3×3 rotation matrix, row-major: `world = R · local`. Invariant: orthonormal with determinant +1
 * (callers that build one by hand should use {@link rotationFromEulerZyxDeg}).
 */
export type Mat3 = [[number, number, number], [number, number, number], [number, number, number]];

export const IDENTITY_MAT3: Mat3 = [
  [1, 0, 0],
  [0, 1, 0],
  [0, 0, 1],
];

/**
 * Rotation from Euler angles in degrees, order Z-Y-X (yaw about z, then pitch about the new y, then roll
 * about the newest x; intrinsic). R = Rz(zDeg) · Ry(yDeg) · Rx(xDeg). Positive angles turn counter-clockwise
 * when looking down the axis towards the origin (right-hand rule). Ballast's frame is z up, so an instance
 * that only turns in plan needs just the first angle.
 *
 * Chosen over a raw matrix at the boundary because people type and read three angles, and a matrix can be
 * non-orthonormal by a typo; the matrix is derived here once.
 */
export function rotationFromEulerZyxDeg(eulerZyxDeg: readonly [number, number, number]): Mat3 {
  const [zDeg, yDeg, xDeg] = eulerZyxDeg;
  const d = Math.PI / 180;
  const cz = Math.cos(zDeg * d);
  const sz = Math.sin(zDeg * d);
  const cy = Math.cos(yDeg * d);
  const sy = Math.sin(yDeg * d);
  const cx = Math.cos(xDeg * d);
  const sx = Math.sin(xDeg * d);
  return [
    [cz * cy, cz * sy * sx - sz * cx, cz * sy * cx + sz * sx],
    [sz * cy, sz * sy * sx + cz * cx, sz * sy * cx - cz * sx],
    [-sy, cy * sx, cy * cx],
  ];
}

/** R · v. */
export function rotateVec(r: Mat3, v: Vec3): Vec3 {
  return [
    r[0][0] * v[0] + r[0][1] * v[1] + r[0][2] * v[2],
    r[1][0] * v[0] + r[1][1] * v[1] + r[1][2] * v[2],
    r[2][0] * v[0] + r[2][1] * v[1] + r[2][2] * v[2],
  ];
}
