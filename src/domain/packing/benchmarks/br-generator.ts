import type { ThpackInstance } from './thpack-format.ts';

/**
 * The Bischoff–Ratcliff (1995) instance generator for classes BR0–BR15, re-written from the published rules
 * (Omega 23(4):377–390; rules summarised in the shared data README §1.3). Pure and exact: it reproduces the
 * published files field for field (see tests).
 */

/** Park–Miller "minimal standard" generator: x ← 16807·x mod (2³¹ − 1), r = x / (2³¹ − 1). */
export class ParkMiller {
  private x: number;
  constructor(seed: number) {
    this.x = seed;
  }
  next(): number {
    // 16807 · (2³¹ − 2) < 2⁴⁶, exact in a double.
    this.x = (16807 * this.x) % 2147483647;
    return this.x / 2147483647;
  }
}

/** Number of box types per class BR0…BR15. */
export const BR_TYPES = [1, 3, 5, 8, 10, 12, 15, 20, 30, 40, 50, 60, 70, 80, 90, 100] as const;

/** Seed of problem p (1-based) in every class. */
export const brSeed = (problem: number): number => 2502505 + 100 * (problem - 1);

/** Generates problem `problem` (1…100) of class BR`cls` (0…15). */
export function generateBr(cls: number, problem: number): ThpackInstance {
  const n = BR_TYPES[cls];
  if (n === undefined) throw new Error(`BR class must be 0…15 (got ${cls})`);
  const L = 587;
  const W = 233;
  const H = 220;
  const seed = brSeed(problem);
  const rng = new ParkMiller(seed);
  for (let i = 0; i < 10; i++) rng.next();
  const lo = [30, 25, 20];
  const hi = [120, 100, 80];
  const dims: [number, number, number][] = [];
  for (let i = 0; i < n; i++) {
    const d = [0, 1, 2].map((j) => lo[j] + Math.floor(rng.next() * (hi[j] - lo[j] + 1)));
    d.sort((a, b) => b - a);
    dims.push([d[0], d[1], d[2]]);
  }
  const vol = dims.map((d) => d[0] * d[1] * d[2]);
  const m = new Array<number>(n).fill(1);
  const target = L * W * H;
  for (;;) {
    const cargo = m.reduce((s, q, i) => s + q * vol[i], 0);
    const k = Math.floor(rng.next() * n);
    if (target < cargo + vol[k]) break;
    m[k]++;
  }
  return {
    problem,
    seed,
    container: [L, W, H],
    boxes: dims.map((d, i) => {
      const min = Math.min(...d);
      return { id: i + 1, dims: d, vertical: [d[0] / min < 2, d[1] / min < 2, d[2] / min < 2], quantity: m[i] };
    }),
    warnings: [],
  };
}
