import type { SolverType } from './prepare.ts';

/**
 * Simple blocks: nx × ny × nz identical items of one line, all turned the same way, packed as one cuboid.
 * Placing whole blocks instead of single items is what lets a constructive heuristic fill a container
 * densely with few decisions; a block's top is flat and fully covered, so a block is as good a support as
 * the floor. Stored as parallel typed arrays (the hot loops read them millions of times), sorted by volume
 * (largest first) so a scan can stop at the first blocks that fit.
 */
export interface BlockTable {
  count: number;
  type: Int32Array;
  /** Block extents along x, y, z (mm). */
  dx: Float64Array;
  dy: Float64Array;
  dz: Float64Array;
  /** Item extents along x, y, z inside the block (mm). */
  ox: Float64Array;
  oy: Float64Array;
  oz: Float64Array;
  nx: Int32Array;
  ny: Int32Array;
  nz: Int32Array;
  /** Number of items in the block. */
  n: Int32Array;
  volume: Float64Array;
  massKg: Float64Array;
}

/** Upper limit on the number of blocks kept (largest volumes first, single items always kept). */
export const MAX_BLOCKS = 30000;

export function buildBlocks(types: readonly SolverType[], L: number, W: number, H: number, payloadKg: number): BlockTable {
  const rows: number[][] = [];
  const singles: number[][] = [];
  for (let t = 0; t < types.length; t++) {
    const ty = types[t];
    for (const [a, b, c] of ty.dims) {
      let maxNz = ty.stackable ? Math.floor(H / c + 1e-9) : 1;
      if (Number.isFinite(ty.maxLoadOnTopKg) && ty.massKg > 0) maxNz = Math.min(maxNz, 1 + Math.floor(ty.maxLoadOnTopKg / ty.massKg + 1e-9));
      const maxNy = Math.floor(W / b + 1e-9);
      const maxNx = Math.floor(L / a + 1e-9);
      for (let nz = 1; nz <= maxNz; nz++) {
        for (let ny = 1; ny <= maxNy; ny++) {
          if (ny * nz > ty.count) break;
          for (let nx = 1; nx <= maxNx; nx++) {
            const n = nx * ny * nz;
            if (n > ty.count || n * ty.massKg > payloadKg + 1e-9) break;
            const row = [t, nx * a, ny * b, nz * c, a, b, c, nx, ny, nz, n, n * ty.volumeMm3, n * ty.massKg];
            (n === 1 ? singles : rows).push(row);
          }
        }
      }
    }
  }
  rows.sort((p, q) => q[11] - p[11]);
  const kept = rows.slice(0, Math.max(0, MAX_BLOCKS - singles.length)).concat(singles);
  kept.sort((p, q) => q[11] - p[11] || p[10] - q[10]);
  const m = kept.length;
  const tbl: BlockTable = {
    count: m,
    type: new Int32Array(m),
    dx: new Float64Array(m),
    dy: new Float64Array(m),
    dz: new Float64Array(m),
    ox: new Float64Array(m),
    oy: new Float64Array(m),
    oz: new Float64Array(m),
    nx: new Int32Array(m),
    ny: new Int32Array(m),
    nz: new Int32Array(m),
    n: new Int32Array(m),
    volume: new Float64Array(m),
    massKg: new Float64Array(m),
  };
  kept.forEach((r, i) => {
    tbl.type[i] = r[0];
    tbl.dx[i] = r[1];
    tbl.dy[i] = r[2];
    tbl.dz[i] = r[3];
    tbl.ox[i] = r[4];
    tbl.oy[i] = r[5];
    tbl.oz[i] = r[6];
    tbl.nx[i] = r[7];
    tbl.ny[i] = r[8];
    tbl.nz[i] = r[9];
    tbl.n[i] = r[10];
    tbl.volume[i] = r[11];
    tbl.massKg[i] = r[12];
  });
  return tbl;
}
