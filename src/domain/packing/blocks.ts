import type { SolverType } from './prepare.ts';

/**
 * Blocks: what one step of the search places.
 * - Simple block: nx × ny × nz identical items of one line, all turned the same way: a full cuboid.
 * - General block: two blocks side by side along x, y or z (the second against the first's far face),
 *   kept only when the items fill at least MIN_FILL of its bounding box. These let a step place several
 *   different items that together make a near-perfect cuboid, which matters when each line has only a few
 *   items. With full support, a block may go on top of another only where the lower one's top carries
 *   every item of the upper one's base.
 * Placing whole blocks instead of single items is what lets a constructive heuristic fill a container
 * densely with few decisions. Stored as parallel arrays (the hot loops read them millions of times),
 * sorted by item volume, largest first, so a scan can stop at the first blocks that fit.
 */
export interface BlockTable {
  count: number;
  /** Line index for simple blocks, -1 for general blocks. */
  type: Int32Array;
  /** Loading group of the block's items. */
  group: Int32Array;
  /** Block extents along x, y, z (mm). */
  dx: Float64Array;
  dy: Float64Array;
  dz: Float64Array;
  /** Simple blocks: item extents along x, y, z and counts per axis. */
  ox: Float64Array;
  oy: Float64Array;
  oz: Float64Array;
  nx: Int32Array;
  ny: Int32Array;
  nz: Int32Array;
  /** Number of items in the block. */
  n: Int32Array;
  /** Item volume (not bounding-box volume), mm³. */
  volume: Float64Array;
  massKg: Float64Array;
  /** General blocks: the two parts and the axis (0 x, 1 y, 2 z) the second sits along; -1 for simple. */
  left: Int32Array;
  right: Int32Array;
  axis: Int32Array;
  /** General blocks: items needed per line, as pairs (line, count). */
  req: (Int32Array | null)[];
  /** General blocks: item tops flush with the block top, and item bottoms on its base (x0 y0 x1 y1 relative). */
  tops: (Float64Array | null)[];
  bottoms: (Float64Array | null)[];
}

/** Upper limit on the number of blocks kept (largest volumes first, single items always kept). */
export const MAX_BLOCKS = 30000;
/**
 * Upper limit on general blocks, and the least share of a general block's box its items must fill (lower
 * with full support, where flat-topped mixed blocks are worth a little more gap; measured on BR samples).
 */
export const MAX_GENERAL = 6000;
export const MIN_FILL = { unsupported: 0.98, fullSupport: 0.95 };
/** Work limit on pairs examined when combining blocks (keeps set-up time small against a 2 s budget). */
export const MAX_PAIRS = 500_000;

interface Row {
  type: number;
  group: number;
  dx: number;
  dy: number;
  dz: number;
  ox: number;
  oy: number;
  oz: number;
  nx: number;
  ny: number;
  nz: number;
  n: number;
  volume: number;
  massKg: number;
  left: number;
  right: number;
  axis: number;
  req: Int32Array;
  tops: Float64Array;
  bottoms: Float64Array;
  /** Usable as a part of general blocks. */
  combinable: boolean;
}

export interface BlockOptions {
  fullSupport: boolean;
  /** Build general blocks (default true). */
  general?: boolean;
  /** Work limit on pairs examined (default MAX_PAIRS). */
  maxPairs?: number;
}

export function buildBlocks(types: readonly SolverType[], L: number, W: number, H: number, payloadKg: number, opts: BlockOptions = { fullSupport: true }): BlockTable {
  const rows: Row[] = [];
  const singles: Row[] = [];
  for (let t = 0; t < types.length; t++) {
    const ty = types[t];
    const combinable = ty.stackable && !Number.isFinite(ty.maxLoadOnTopKg);
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
            const full = Float64Array.of(0, 0, nx * a, ny * b);
            const row: Row = {
              type: t,
              group: ty.group,
              dx: nx * a,
              dy: ny * b,
              dz: nz * c,
              ox: a,
              oy: b,
              oz: c,
              nx,
              ny,
              nz,
              n,
              volume: n * ty.volumeMm3,
              massKg: n * ty.massKg,
              left: -1,
              right: -1,
              axis: -1,
              req: Int32Array.of(t, n),
              tops: full,
              bottoms: full,
              combinable,
            };
            (n === 1 ? singles : rows).push(row);
          }
        }
      }
    }
  }
  rows.sort((p, q) => q.volume - p.volume);
  let all = rows.slice(0, Math.max(0, MAX_BLOCKS - singles.length)).concat(singles);
  if (opts.general !== false) all = all.concat(generalBlocks(all, types, L, W, H, payloadKg, opts.fullSupport, opts.maxPairs ?? MAX_PAIRS));
  const order = all.map((_, i) => i).sort((p, q) => all[q].volume - all[p].volume || all[p].n - all[q].n || p - q);
  const pos = new Int32Array(all.length);
  order.forEach((old, i) => (pos[old] = i));
  const m = all.length;
  const tbl: BlockTable = {
    count: m,
    type: new Int32Array(m),
    group: new Int32Array(m),
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
    left: new Int32Array(m),
    right: new Int32Array(m),
    axis: new Int32Array(m),
    req: new Array<Int32Array | null>(m).fill(null),
    tops: new Array<Float64Array | null>(m).fill(null),
    bottoms: new Array<Float64Array | null>(m).fill(null),
  };
  order.forEach((old, i) => {
    const r = all[old];
    tbl.type[i] = r.type;
    tbl.group[i] = r.group;
    tbl.dx[i] = r.dx;
    tbl.dy[i] = r.dy;
    tbl.dz[i] = r.dz;
    tbl.ox[i] = r.ox;
    tbl.oy[i] = r.oy;
    tbl.oz[i] = r.oz;
    tbl.nx[i] = r.nx;
    tbl.ny[i] = r.ny;
    tbl.nz[i] = r.nz;
    tbl.n[i] = r.n;
    tbl.volume[i] = r.volume;
    tbl.massKg[i] = r.massKg;
    tbl.axis[i] = r.axis;
    tbl.left[i] = r.left < 0 ? -1 : pos[r.left];
    tbl.right[i] = r.right < 0 ? -1 : pos[r.right];
    if (r.type < 0) {
      tbl.req[i] = r.req;
      tbl.tops[i] = r.tops;
      tbl.bottoms[i] = r.bottoms;
    }
  });
  return tbl;
}

/** Area of rectangle r (x0 y0 x1 y1 at offset k) covered by the rectangles in `cover` (disjoint). */
function coveredArea(r: Float64Array, k: number, cover: Float64Array): number {
  let a = 0;
  for (let j = 0; j < cover.length; j += 4) {
    const w = Math.min(r[k + 2], cover[j + 2]) - Math.max(r[k], cover[j]);
    const h = Math.min(r[k + 3], cover[j + 3]) - Math.max(r[k + 1], cover[j + 1]);
    if (w > 0 && h > 0) a += w * h;
  }
  return a;
}

function shifted(r: Float64Array, dx: number, dy: number): Float64Array {
  const o = new Float64Array(r.length);
  for (let j = 0; j < r.length; j += 4) {
    o[j] = r[j] + dx;
    o[j + 1] = r[j + 1] + dy;
    o[j + 2] = r[j + 2] + dx;
    o[j + 3] = r[j + 3] + dy;
  }
  return o;
}

function concat(a: Float64Array, b: Float64Array): Float64Array {
  const o = new Float64Array(a.length + b.length);
  o.set(a);
  o.set(b, a.length);
  return o;
}

/**
 * Combines blocks pairwise (two rounds) into general blocks. Only parts whose cross-sections differ by
 * less than the fill tolerance are paired (a pair that differs more cannot reach MIN_FILL unless one part
 * is tiny), which keeps the pair count manageable. Deterministic: a fixed pair budget, no clock.
 */
function generalBlocks(base: Row[], types: readonly SolverType[], L: number, W: number, H: number, payloadKg: number, fullSupport: boolean, maxPairs: number): Row[] {
  const counts = Int32Array.from(types.map((t) => t.count));
  const tally = new Int32Array(types.length);
  const rows: Row[] = base.slice();
  const out: Row[] = [];
  const seen = new Set<string>();
  const keyOf = (dx: number, dy: number, dz: number, req: Int32Array) => `${dx},${dy},${dz}|${req.join(',')}`;
  for (const r of base) seen.add(keyOf(r.dx, r.dy, r.dz, r.req));
  const dim = (r: Row, k: number) => (k === 0 ? r.dx : k === 1 ? r.dy : r.dz);
  const minFill = fullSupport ? MIN_FILL.fullSupport : MIN_FILL.unsupported;
  const pool: number[] = [];
  base.forEach((r, i) => r.combinable && pool.push(i));
  if (pool.length < 2) return [];
  let pairs = 0;
  let current = pool;
  for (let round = 0; round < 2 && out.length < MAX_GENERAL; round++) {
    const fresh: number[] = [];
    const partners = round === 0 ? pool : pool.concat(current);
    for (let axis = 0; axis < 3; axis++) {
      const o1 = (axis + 1) % 3;
      const o2 = (axis + 2) % 3;
      // Partners sorted by the first cross dimension, for a window search.
      const sorted = partners.slice().sort((p, q) => dim(rows[p], o1) - dim(rows[q], o1) || p - q);
      const keys = Float64Array.from(sorted, (i) => dim(rows[i], o1));
      const other = Float64Array.from(sorted, (i) => dim(rows[i], o2));
      const along = Float64Array.from(sorted, (i) => dim(rows[i], axis));
      for (const ia of current) {
        const a = rows[ia];
        const aA = dim(a, axis);
        const a1 = dim(a, o1);
        const a2 = dim(a, o2);
        const lo = a1 * minFill;
        const hi = a1 / minFill;
        const lim = axis === 0 ? L : axis === 1 ? W : H;
        let s = 0;
        let e = keys.length;
        while (s < e) {
          const mid = (s + e) >> 1;
          if (keys[mid] < lo) s = mid + 1;
          else e = mid;
        }
        for (let j = s; j < sorted.length && keys[j] <= hi; j++) {
          if (++pairs > maxPairs) return out;
          const ib = sorted[j];
          if (axis !== 2 && round === 0 && ib < ia) continue; // side-by-side pairs are symmetric
          const b2 = other[j];
          if (Math.min(a2, b2) < Math.max(a2, b2) * minFill) continue;
          const lenA = aA + along[j];
          if (lenA > lim + 1e-9) continue;
          const b = rows[ib];
          if (a.group !== b.group) continue;
          // Two simple blocks of one line turned the same way with equal cross-sections make a simple block.
          if (a.type >= 0 && a.type === b.type && a.ox === b.ox && a.oy === b.oy && a.oz === b.oz && a1 === keys[j] && a2 === b2) continue;
          const c1 = Math.max(a1, keys[j]);
          const c2 = Math.max(a2, b2);
          const volume = a.volume + b.volume;
          if (volume < lenA * c1 * c2 * minFill) continue;
          const massKg = a.massKg + b.massKg;
          if (massKg > payloadKg + 1e-9) continue;
          // With full support, parts side by side must be equally high (one flat top to build on), and
          // the upper part's base must stand on the lower part's top.
          if (fullSupport && axis !== 2 && a.dz !== b.dz) continue;
          if (axis === 2 && fullSupport) {
            const bot = b.bottoms;
            let ok = true;
            for (let k = 0; k < bot.length && ok; k += 4) ok = coveredArea(bot, k, a.tops) >= (bot[k + 2] - bot[k]) * (bot[k + 3] - bot[k + 1]) * (1 - 1e-9);
            if (!ok) continue;
          }
          // Enough items of every line? (tally is a zeroed scratch array, cleared again below)
          for (let k = 0; k < a.req.length; k += 2) tally[a.req[k]] += a.req[k + 1];
          for (let k = 0; k < b.req.length; k += 2) tally[b.req[k]] += b.req[k + 1];
          let ok = true;
          for (let k = 0; k < a.req.length; k += 2) if (tally[a.req[k]] > counts[a.req[k]]) ok = false;
          for (let k = 0; k < b.req.length; k += 2) if (tally[b.req[k]] > counts[b.req[k]]) ok = false;
          const merged: [number, number][] = [];
          for (const r of [a.req, b.req]) {
            for (let k = 0; k < r.length; k += 2) {
              if (tally[r[k]] === 0) continue;
              merged.push([r[k], tally[r[k]]]);
              tally[r[k]] = 0;
            }
          }
          if (!ok) continue;
          merged.sort((p, q) => p[0] - q[0]);
          const pairsSorted = merged.flat();
          const mreq = Int32Array.from(pairsSorted);
          const d: [number, number, number] = [0, 0, 0];
          d[axis] = lenA;
          d[o1] = c1;
          d[o2] = c2;
          const key = keyOf(d[0], d[1], d[2], mreq);
          if (seen.has(key)) continue;
          seen.add(key);
          let tops: Float64Array;
          let bottoms: Float64Array;
          if (axis === 2) {
            tops = b.tops;
            bottoms = a.bottoms;
          } else {
            const sx = axis === 0 ? a.dx : 0;
            const sy = axis === 1 ? a.dy : 0;
            bottoms = concat(a.bottoms, shifted(b.bottoms, sx, sy));
            const ta = a.dz === d[2] ? a.tops : new Float64Array(0);
            const tb = b.dz === d[2] ? shifted(b.tops, sx, sy) : new Float64Array(0);
            tops = concat(ta, tb);
          }
          rows.push({
            type: -1,
            group: a.group,
            dx: d[0],
            dy: d[1],
            dz: d[2],
            ox: 0,
            oy: 0,
            oz: 0,
            nx: 0,
            ny: 0,
            nz: 0,
            n: a.n + b.n,
            volume,
            massKg,
            left: ia,
            right: ib,
            axis,
            req: mreq,
            tops,
            bottoms,
            combinable: true,
          });
          out.push(rows[rows.length - 1]);
          fresh.push(rows.length - 1);
          if (out.length >= MAX_GENERAL) return out;
        }
      }
    }
    current = fresh;
  }
  return out;
}

/**
 * Calls `visit` for every item of block b placed with its corner at (x, y, z): line index, corner and
 * extents (mm). Items come bottom layer first within each simple part.
 */
export function forEachItem(
  B: BlockTable,
  b: number,
  x: number,
  y: number,
  z: number,
  visit: (type: number, x: number, y: number, z: number, lx: number, ly: number, lz: number) => void,
): void {
  const t = B.type[b];
  if (t >= 0) {
    const ox = B.ox[b];
    const oy = B.oy[b];
    const oz = B.oz[b];
    for (let iz = 0; iz < B.nz[b]; iz++)
      for (let ix = 0; ix < B.nx[b]; ix++) for (let iy = 0; iy < B.ny[b]; iy++) visit(t, x + ix * ox, y + iy * oy, z + iz * oz, ox, oy, oz);
    return;
  }
  const l = B.left[b];
  forEachItem(B, l, x, y, z, visit);
  const a = B.axis[b];
  forEachItem(B, B.right[b], a === 0 ? x + B.dx[l] : x, a === 1 ? y + B.dy[l] : y, a === 2 ? z + B.dz[l] : z, visit);
}
