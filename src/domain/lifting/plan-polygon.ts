/**
 * Plan-view (x, y) helpers for lift plans: convex hull of pick points and whether the CoG lies within.
 */

export type Xy = [number, number];

/** Convex hull in counter-clockwise order (Andrew's monotone chain); collinear points dropped. */
export function convexHull(points: Xy[]): Xy[] {
  const pts = [...points].sort((a, b) => a[0] - b[0] || a[1] - b[1]);
  if (pts.length < 3) return pts;
  const crossZ = (o: Xy, a: Xy, b: Xy) => (a[0] - o[0]) * (b[1] - o[1]) - (a[1] - o[1]) * (b[0] - o[0]);
  const lower: Xy[] = [];
  for (const p of pts) {
    while (lower.length >= 2 && crossZ(lower[lower.length - 2], lower[lower.length - 1], p) <= 0) lower.pop();
    lower.push(p);
  }
  const upper: Xy[] = [];
  for (let i = pts.length - 1; i >= 0; i--) {
    const p = pts[i];
    while (upper.length >= 2 && crossZ(upper[upper.length - 2], upper[upper.length - 1], p) <= 0) upper.pop();
    upper.push(p);
  }
  return lower.slice(0, -1).concat(upper.slice(0, -1));
}

/**
 * Signed distance, mm, by which a plan point lies inside the support of the pick points: positive
 * inside, negative outside (how far outside). Two points: inside means its projection falls between
 * them (the load turns about the line between them until the CoG hangs below it). One point: minus
 * the plan distance to it (a single point never surrounds anything; callers treat it separately).
 */
export function marginInside(point: Xy, supports: Xy[]): number {
  if (supports.length === 0) return -Infinity;
  if (supports.length === 1) return -Math.hypot(point[0] - supports[0][0], point[1] - supports[0][1]);
  const hull = convexHull(supports);
  if (hull.length === 2 || supports.length === 2) {
    const [a, b] = hull.length === 2 ? hull : [supports[0], supports[1]];
    const dx = b[0] - a[0];
    const dy = b[1] - a[1];
    const len = Math.hypot(dx, dy);
    if (!(len > 0)) return -Math.hypot(point[0] - a[0], point[1] - a[1]);
    const t = ((point[0] - a[0]) * dx + (point[1] - a[1]) * dy) / len;
    return Math.min(t, len - t);
  }
  let m = Infinity;
  for (let i = 0; i < hull.length; i++) {
    const a = hull[i];
    const b = hull[(i + 1) % hull.length];
    const len = Math.hypot(b[0] - a[0], b[1] - a[1]);
    // Left of a counter-clockwise edge is inside.
    const d = ((b[0] - a[0]) * (point[1] - a[1]) - (b[1] - a[1]) * (point[0] - a[0])) / len;
    m = Math.min(m, d);
  }
  return m;
}
