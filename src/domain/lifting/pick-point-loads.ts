/**
 * Statics of a load hanging from two or three pick points.
 *
 * One hook (`pickPointLoadsKg`): each leg pulls along the line from its pick point to the hook. With
 * the hook plumb above the CoG, every leg and the weight pass through the hook, so moments balance by
 * themselves and force balance alone gives the tensions: Σ Tᵢ·uᵢ = W·ẑ, uᵢ the unit vector from pick
 * point i to the hook. Three points: a 3 × 3 system with one solution. Two points: the hook, both
 * points and the CoG lie in one vertical plane, and the system is 2 × 2 in that plane. All tensions
 * are ≥ 0 exactly when the CoG lies, in plan, inside the pick points' triangle (or on their segment).
 *
 * Vertical legs (`verticalPickLoadsKg`, two hoists or a spreader beam): forces are vertical, so
 * ΣFᵢ = W and Σ Fᵢ·(xᵢ, yᵢ) = W·(x_c, y_c). Two points: the lever rule along the line between them.
 * Three points: the shares are the barycentric coordinates of the CoG in the pick triangle.
 *
 * Four or more points are statically indeterminate on a rigid load: these functions refuse them, and
 * the lift-plan evaluator rates such lifts as if two legs carry.
 */
import { cross, dot, length, sub, type Vec3 } from '../geometry/vec3.ts';
import { solveLinear } from './linear-solve.ts';

/** Plan distance within which the hook counts as plumb above the CoG, mm. */
export const PLUMB_TOLERANCE_MM = 1;

type P3 = [number, number, number];

function checkInputs(fn: string, loadKg: number, cogMm: P3, points: P3[]): void {
  if (!Number.isFinite(loadKg) || loadKg < 0) throw new RangeError(`${fn}: load must be a finite number of kilograms not below 0 (got ${String(loadKg)}).`);
  if (!isVec(cogMm)) throw new RangeError(`${fn}: CoG must be three finite numbers in mm.`);
  if (!Array.isArray(points) || points.length < 2 || points.length > 3) {
    throw new RangeError(
      `${fn}: two or three pick points are needed (got ${Array.isArray(points) ? points.length : 0}); four or more are statically indeterminate: rate them as if two legs carry.`,
    );
  }
  points.forEach((p, i) => {
    if (!isVec(p)) throw new RangeError(`${fn}: pick point ${i + 1} must be three finite numbers in mm.`);
  });
}

function isVec(v: unknown): v is P3 {
  return Array.isArray(v) && v.length === 3 && v.every((x) => typeof x === 'number' && Number.isFinite(x));
}

/** Whether the CoG lies in plan within the segment or triangle of the pick points, with the offending side named. */
function surroundProblem(shares: number[], tolKg: number): string | null {
  const bad = shares.map((s, i) => (s < -tolKg ? i + 1 : 0)).filter((i) => i > 0);
  if (bad.length === 0) return null;
  return `pick points do not surround the CoG in plan: leg${bad.length > 1 ? 's' : ''} ${bad.join(', ')} would have to push.`;
}

/**
 * Tension in each leg from one hook to each of two or three pick points, kg (in the order given).
 * Throws, saying why, when the hook is not plumb above the CoG (within 1 mm in plan), is not above
 * every pick point, when the pick points do not surround the CoG in plan, or when the geometry is
 * degenerate.
 */
export function pickPointLoadsKg(input: { loadKg: number; cogMm: [number, number, number]; pickPointsMm: [number, number, number][]; hookMm: [number, number, number] }): number[] {
  const { loadKg, cogMm, pickPointsMm: pts, hookMm } = input;
  checkInputs('pickPointLoadsKg', loadKg, cogMm, pts);
  if (!isVec(hookMm)) throw new RangeError('pickPointLoadsKg: hook position must be three finite numbers in mm.');
  const off = Math.hypot(hookMm[0] - cogMm[0], hookMm[1] - cogMm[1]);
  if (off > PLUMB_TOLERANCE_MM) {
    throw new RangeError(
      `The hook must be plumb above the CoG: it is ${off.toFixed(1)} mm away in plan. A freely hanging load turns until its CoG is under the hook.`,
    );
  }
  if (!(hookMm[2] > cogMm[2])) throw new RangeError(`The hook (z ${hookMm[2]} mm) must be above the CoG (z ${cogMm[2]} mm).`);
  pts.forEach((p, i) => {
    if (!(hookMm[2] > p[2])) throw new RangeError(`The hook (z ${hookMm[2]} mm) is not above pick point ${i + 1} (z ${p[2]} mm).`);
  });
  const u = pts.map((p) => {
    const d = sub(hookMm, p);
    const l = length(d);
    return [d[0] / l, d[1] / l, d[2] / l] as Vec3;
  });
  const tol = 1e-9 * Math.max(loadKg, 1);
  let t: number[] | null;
  if (pts.length === 3) {
    t = solveLinear(
      [
        [u[0][0], u[1][0], u[2][0]],
        [u[0][1], u[1][1], u[2][1]],
        [u[0][2], u[1][2], u[2][2]],
      ],
      [0, 0, loadKg],
    );
    if (!t) throw new RangeError('The three pick points and the hook lie in one plane (or two points coincide): no unique tensions.');
  } else {
    const [a, b] = pts;
    const span = Math.hypot(b[0] - a[0], b[1] - a[1]);
    if (!(span > 0)) throw new RangeError('The two pick points are one above the other in plan: the load is not supported against turning.');
    const e: Vec3 = [(b[0] - a[0]) / span, (b[1] - a[1]) / span, 0];
    const perp = Math.abs(cross(e, [cogMm[0] - a[0], cogMm[1] - a[1], 0])[2]);
    if (perp > PLUMB_TOLERANCE_MM) {
      throw new RangeError(
        `The CoG is ${perp.toFixed(1)} mm off the line between the two pick points in plan: the load would turn about that line until the CoG hangs under it.`,
      );
    }
    t = solveLinear(
      [
        [dot(u[0], e), dot(u[1], e)],
        [u[0][2], u[1][2]],
      ],
      [0, loadKg],
    );
    if (!t) throw new RangeError('The two legs are parallel: no unique tensions.');
  }
  const problem = surroundProblem(t, tol);
  if (problem) throw new RangeError(`The ${problem}`);
  return t.map((x) => Math.max(0, x));
}

/**
 * Share of the load at each of two or three pick points held by vertical legs, kg (in the order given).
 * Two points: the lever rule along the line between them in plan, using the CoG's projection on that
 * line (a CoG off the line makes the load turn about it until the CoG hangs below it; the shares do
 * not change). Throws when the pick points do not surround the CoG in plan or are degenerate.
 */
export function verticalPickLoadsKg(input: { loadKg: number; cogMm: [number, number, number]; pickPointsMm: [number, number, number][] }): number[] {
  const { loadKg, cogMm, pickPointsMm: pts } = input;
  checkInputs('verticalPickLoadsKg', loadKg, cogMm, pts);
  const tol = 1e-9 * Math.max(loadKg, 1);
  let shares: number[];
  if (pts.length === 2) {
    const [a, b] = pts;
    const dx = b[0] - a[0];
    const dy = b[1] - a[1];
    const span2 = dx * dx + dy * dy;
    if (!(span2 > 0)) throw new RangeError('The two pick points are one above the other in plan: no lever between them.');
    const t = ((cogMm[0] - a[0]) * dx + (cogMm[1] - a[1]) * dy) / span2;
    shares = [loadKg * (1 - t), loadKg * t];
  } else {
    const s = solveLinear(
      [
        [1, 1, 1],
        [pts[0][0], pts[1][0], pts[2][0]],
        [pts[0][1], pts[1][1], pts[2][1]],
      ],
      [loadKg, loadKg * cogMm[0], loadKg * cogMm[1]],
    );
    if (!s) throw new RangeError('The three pick points lie on one line in plan: no unique shares.');
    shares = s;
  }
  const problem = surroundProblem(shares, tol);
  if (problem) throw new RangeError(`The ${problem}`);
  return shares.map((x) => Math.max(0, x));
}
