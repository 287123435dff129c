/**
 * How a load hangs from one hook on slings of given lengths: where the hook ends up relative to the
 * load, which slings are taut, how far the load tilts, and the tension in each sling.
 *
 * Method. Work in the load's own frame (as it stands before the lift, z up). Let c be the CoG, pᵢ the
 * pick points and Lᵢ the effective sling lengths (pick point to hook). Any hook position h with
 * |h − pᵢ| ≤ Lᵢ for every i can be reached (a sling may be slack), and for each such h the load turns
 * until h − c points straight up, leaving the CoG a distance |h − c| below the hook. The load comes to
 * rest where its potential energy is least, i.e. where |h − c| is greatest:
 *
 *     maximise |h − c|   subject to   |h − pᵢ| ≤ Lᵢ  (i = 1…n).
 *
 * The greatest distance from a point over an intersection of balls lies on an extreme point of it:
 * the farthest point of one sphere, the farthest point of the circle where two spheres meet, or a
 * point where three spheres meet. Ballast evaluates every such candidate that lies within all the
 * balls and keeps the farthest. At that point the optimality (Karush–Kuhn–Tucker) conditions say
 * that the unit vector ŵ = (h − c)/|h − c| is a non-negative combination Σ μᵢ uᵢ of the unit vectors
 * uᵢ = (h − pᵢ)/|h − pᵢ| of the taut slings; those multipliers times the weight are the sling
 * tensions (force balance Σ Tᵢ uᵢ = W ŵ; moments balance because every line of action passes through
 * the hook and the weight acts along the vertical through it).
 *
 * The tilt is the angle between ŵ and the load's own z axis: the load is turned by the smallest
 * rotation that takes ŵ to the vertical (its heading about the vertical is left as it was).
 * Four or more taut slings (equal lengths on a symmetric load) leave the tensions indeterminate:
 * the geometry is still found, the tensions are then returned as null.
 */
import { add, cross, dot, length, scale, sub, type Vec3 } from '../geometry/vec3.ts';
import { leastSquares3 } from './linear-solve.ts';

export interface HangingInput {
  /** Load weight to carry, kg. */
  loadKg: number;
  cogMm: Vec3;
  pickPointsMm: Vec3[];
  /** Effective length of each sling, pick point to hook, mm (same order as the pick points). */
  slingLengthsMm: number[];
}

export interface HangingResult {
  /** Hook position in the load's frame, mm. */
  hookInLoadMm: Vec3;
  /** Upward vertical at rest, as a unit vector in the load's frame. */
  upInLoad: Vec3;
  /** Angle between the load's own z axis and the vertical at rest, degrees. */
  tiltDeg: number;
  /** Rotation that brings the load from its standing pose to its hanging pose: unit axis and angle. */
  rotation: { axis: Vec3; angleDeg: number };
  /** Which slings are taut. */
  taut: boolean[];
  /** Tension in each sling, kg; 0 for slack slings; null when four or more are taut (indeterminate). */
  tensionsKg: number[] | null;
  /** Angle of each sling from the horizontal at rest, degrees. */
  legAnglesFromHorizontalDeg: number[];
  /** Unit vector of each sling, pick point towards hook, in the load's frame. */
  legDirectionsInLoad: Vec3[];
  /** Vertical distance from the CoG up to the hook at rest, mm. */
  hookAboveCogMm: number;
  /** Pick points and hook in the world at rest, with the CoG where it stood and the hook plumb above it, mm. */
  world: { cogMm: Vec3; hookMm: Vec3; pickPointsMm: Vec3[] };
}

export type HangingOutcome = { ok: true; result: HangingResult } | { ok: false; problems: string[] };

const DEG = 180 / Math.PI;

function unit(v: Vec3): Vec3 {
  const l = length(v);
  return l > 0 ? scale(v, 1 / l) : [0, 0, 0];
}

/** Rotates v about the unit axis k by angle a (Rodrigues). */
export function rotateAbout(v: Vec3, k: Vec3, a: number): Vec3 {
  const c = Math.cos(a);
  const s = Math.sin(a);
  return add(add(scale(v, c), scale(cross(k, v), s)), scale(k, dot(k, v) * (1 - c)));
}

/** The smallest rotation taking unit vector `from` to unit vector `to`: axis and angle (radians). */
function minimalRotation(from: Vec3, to: Vec3): { axis: Vec3; angle: number } {
  const c = Math.max(-1, Math.min(1, dot(from, to)));
  const ax = cross(from, to);
  const s = length(ax);
  if (s < 1e-12) {
    if (c > 0) return { axis: [0, 0, 1], angle: 0 };
    const alt: Vec3 = Math.abs(from[0]) < 0.9 ? [1, 0, 0] : [0, 1, 0];
    return { axis: unit(cross(from, alt)), angle: Math.PI };
  }
  return { axis: scale(ax, 1 / s), angle: Math.atan2(s, c) };
}

/** Candidate hook positions: extreme points of the intersection of the balls. */
function candidates(c: Vec3, p: Vec3[], L: number[]): Vec3[] {
  const out: Vec3[] = [];
  const n = p.length;
  for (let i = 0; i < n; i++) {
    const d = sub(p[i], c);
    const dir = length(d) > 1e-9 ? unit(d) : ([0, 0, 1] as Vec3);
    out.push(add(p[i], scale(dir, L[i])));
  }
  for (let i = 0; i < n; i++) {
    for (let j = i + 1; j < n; j++) {
      const circle = sphereCircle(p[i], L[i], p[j], L[j]);
      if (!circle) continue;
      const { m, r, a } = circle;
      const cm = sub(c, m);
      const inPlane = sub(cm, scale(a, dot(cm, a)));
      let dir: Vec3;
      if (length(inPlane) > 1e-9 * (1 + r)) dir = scale(unit(inPlane), -1);
      else {
        // CoG on the axis: every point of the circle is as far; take the one highest in the load's frame.
        const up: Vec3 = [0, 0, 1];
        const t = sub(up, scale(a, dot(up, a)));
        dir = length(t) > 1e-9 ? unit(t) : unit(cross(a, [1, 0, 0]));
      }
      out.push(add(m, scale(dir, r)));
      for (let k = j + 1; k < n; k++) out.push(...trilaterate(p[i], L[i], p[j], L[j], p[k], L[k]));
    }
  }
  return out;
}

function sphereCircle(p1: Vec3, r1: number, p2: Vec3, r2: number): { m: Vec3; r: number; a: Vec3 } | null {
  const d = length(sub(p2, p1));
  if (!(d > 1e-9)) return null;
  const a = scale(sub(p2, p1), 1 / d);
  const x = (d * d + r1 * r1 - r2 * r2) / (2 * d);
  const r2c = r1 * r1 - x * x;
  if (r2c < 0) return null;
  return { m: add(p1, scale(a, x)), r: Math.sqrt(r2c), a };
}

function trilaterate(p1: Vec3, r1: number, p2: Vec3, r2: number, p3: Vec3, r3: number): Vec3[] {
  const d = length(sub(p2, p1));
  if (!(d > 1e-9)) return [];
  const ex = scale(sub(p2, p1), 1 / d);
  const i = dot(ex, sub(p3, p1));
  const eyRaw = sub(sub(p3, p1), scale(ex, i));
  const j = length(eyRaw);
  if (!(j > 1e-9)) return [];
  const ey = scale(eyRaw, 1 / j);
  const ez = cross(ex, ey);
  const x = (r1 * r1 - r2 * r2 + d * d) / (2 * d);
  const y = (r1 * r1 - r3 * r3 + i * i + j * j) / (2 * j) - (i / j) * x;
  const z2 = r1 * r1 - x * x - y * y;
  if (z2 < 0) return [];
  const z = Math.sqrt(z2);
  const base = add(p1, add(scale(ex, x), scale(ey, y)));
  return [add(base, scale(ez, z)), add(base, scale(ez, -z))];
}

/**
 * Finds how the load hangs. Problems (returned, not thrown) name slings too short to meet at a hook.
 */
export function hangingEquilibrium(input: HangingInput): HangingOutcome {
  const { loadKg, cogMm: c, pickPointsMm: p, slingLengthsMm: L } = input;
  const problems: string[] = [];
  if (!(Number.isFinite(loadKg) && loadKg >= 0)) problems.push(`Load must be a finite number of kilograms not below 0 (got ${String(loadKg)}).`);
  if (p.length === 0) problems.push('No pick points.');
  if (L.length !== p.length) problems.push(`Each pick point needs one sling length (${p.length} points, ${L.length} lengths).`);
  L.forEach((l, i) => {
    if (!(typeof l === 'number' && Number.isFinite(l) && l > 0)) problems.push(`Sling ${i + 1}: length must be above 0 mm (got ${String(l)}).`);
  });
  if (problems.length) return { ok: false, problems };
  for (let i = 0; i < p.length; i++) {
    for (let j = i + 1; j < p.length; j++) {
      const span = length(sub(p[j], p[i]));
      if (span > L[i] + L[j]) {
        problems.push(
          `Slings ${i + 1} and ${j + 1} (${L[i].toFixed(0)} + ${L[j].toFixed(0)} mm) are shorter than the ${span.toFixed(0)} mm between their pick points: they cannot meet at one hook.`,
        );
      }
    }
  }
  if (problems.length) return { ok: false, problems };

  const scaleMm = Math.max(...L, 1);
  const tol = 1e-7 * scaleMm;
  let best: Vec3 | null = null;
  let bestDist = -Infinity;
  for (const h of candidates(c, p, L)) {
    if (!h.every(Number.isFinite)) continue;
    if (p.some((pi, i) => length(sub(h, pi)) > L[i] + tol)) continue;
    const dist = length(sub(h, c));
    if (dist > bestDist + tol) {
      best = h;
      bestDist = dist;
    }
  }
  if (!best) return { ok: false, problems: ['The slings cannot all reach one hook point together: check their lengths against the pick point spacing.'] };
  if (!(bestDist > tol)) return { ok: false, problems: ['The hook would sit at the CoG: the pick points are at the CoG.'] };

  const h = best;
  const w = unit(sub(h, c));
  const taut = p.map((pi, i) => length(sub(h, pi)) >= L[i] - 10 * tol);
  const dirs = p.map((pi) => unit(sub(h, pi)));
  const tautIdx = taut.map((t, i) => (t ? i : -1)).filter((i) => i >= 0);
  let tensionsKg: number[] | null = null;
  if (tautIdx.length <= 3) {
    const sol = leastSquares3(tautIdx.map((i) => dirs[i] as [number, number, number]), scale(w, loadKg) as [number, number, number]);
    if (sol) {
      tensionsKg = p.map(() => 0);
      tautIdx.forEach((i, k) => {
        tensionsKg![i] = Math.max(0, sol.x[k]);
      });
    }
  }
  const rot = minimalRotation(w, [0, 0, 1]);
  const hookAboveCogMm = bestDist;
  const worldOf = (q: Vec3): Vec3 => add(c, rotateAbout(sub(q, c), rot.axis, rot.angle));
  return {
    ok: true,
    result: {
      hookInLoadMm: h,
      upInLoad: w,
      // atan2 keeps precision near 0° where acos would not.
      tiltDeg: Math.atan2(Math.hypot(w[0], w[1]), w[2]) * DEG,
      rotation: { axis: rot.axis, angleDeg: rot.angle * DEG },
      taut,
      tensionsKg,
      legAnglesFromHorizontalDeg: dirs.map((u) => Math.asin(Math.max(-1, Math.min(1, dot(u, w)))) * DEG),
      legDirectionsInLoad: dirs,
      hookAboveCogMm,
      world: { cogMm: c, hookMm: add(c, [0, 0, hookAboveCogMm]), pickPointsMm: p.map(worldOf) },
    },
  };
}
