import { Matrix4, Vector3 } from 'three';

/**
 * The one place where Ballast's frame meets three.js's. Ballast: right-handed, z up, millimetres.
 * three.js: right-handed, y up; the scene is drawn in metres so the camera's near/far planes stay sane.
 * Core (x, y, z) mm → three (x, z, −y) m: a turn of −90° about x, then a scale of 1/1000.
 */
export const METRES_PER_MM = 0.001;

/** Core frame → three's frame, as a matrix (applied last, on the left). */
export function coreToThree(): Matrix4 {
  const s = METRES_PER_MM;
  return new Matrix4().set(s, 0, 0, 0, 0, 0, s, 0, 0, -s, 0, 0, 0, 0, 0, 1);
}

/** A point in the core frame (mm) as a three.js position (m). */
export function toThreePoint(pMm: readonly [number, number, number]): Vector3 {
  return new Vector3(pMm[0] * METRES_PER_MM, pMm[2] * METRES_PER_MM, -pMm[1] * METRES_PER_MM);
}

/** A row-major 3×3 rotation (world = R · local, core frame) and a position (mm) as a core-frame Matrix4. */
export function placement(rotation: readonly (readonly number[])[], positionMm: readonly [number, number, number]): Matrix4 {
  const r = rotation;
  return new Matrix4().set(r[0][0], r[0][1], r[0][2], positionMm[0], r[1][0], r[1][1], r[1][2], positionMm[1], r[2][0], r[2][1], r[2][2], positionMm[2], 0, 0, 0, 1);
}
