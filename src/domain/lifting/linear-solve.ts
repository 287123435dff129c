/**
 * Small dense linear systems for the statics of two, three and a few pick points. Written here
 * rather than taken from a package: the systems are at most a few unknowns, and a general matrix
 * library would add weight to the browser bundle for twenty lines of Gaussian elimination.
 */

/**
 * Solves A·x = b (n × n) by Gaussian elimination with partial pivoting. Returns null when A is
 * singular or nearly so (pivot below `eps` × the largest entry of A).
 */
export function solveLinear(a: number[][], b: number[], eps = 1e-10): number[] | null {
  const n = b.length;
  const m = a.map((row, i) => [...row, b[i]]);
  let scale = 0;
  for (const row of a) for (const v of row) scale = Math.max(scale, Math.abs(v));
  if (!(scale > 0)) return null;
  for (let col = 0; col < n; col++) {
    let piv = col;
    for (let r = col + 1; r < n; r++) if (Math.abs(m[r][col]) > Math.abs(m[piv][col])) piv = r;
    if (Math.abs(m[piv][col]) < eps * scale) return null;
    [m[col], m[piv]] = [m[piv], m[col]];
    for (let r = col + 1; r < n; r++) {
      const f = m[r][col] / m[col][col];
      for (let c = col; c <= n; c++) m[r][c] -= f * m[col][c];
    }
  }
  const x = new Array<number>(n).fill(0);
  for (let r = n - 1; r >= 0; r--) {
    let s = m[r][n];
    for (let c = r + 1; c < n; c++) s -= m[r][c] * x[c];
    x[r] = s / m[r][r];
  }
  return x;
}

/**
 * Least-squares solution of the over-determined system Σ xᵢ·colᵢ = target (columns are 3-vectors),
 * via the normal equations; with the residual so callers can tell whether the system was consistent.
 */
export function leastSquares3(cols: [number, number, number][], target: [number, number, number]): { x: number[]; residual: number } | null {
  const k = cols.length;
  const ata = cols.map((ci) => cols.map((cj) => ci[0] * cj[0] + ci[1] * cj[1] + ci[2] * cj[2]));
  const atb = cols.map((ci) => ci[0] * target[0] + ci[1] * target[1] + ci[2] * target[2]);
  const x = solveLinear(ata, atb);
  if (!x) return null;
  const r = [0, 1, 2].map((d) => target[d] - cols.reduce((s, c, i) => s + c[d] * x[i], 0));
  return { x: x.slice(0, k), residual: Math.hypot(r[0], r[1], r[2]) };
}
