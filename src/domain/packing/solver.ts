import { buildBlocks, forEachItem, type BlockTable } from './blocks.ts';
import { EPS_MM } from './orientations.ts';
import type { SolverType } from './prepare.ts';
import { loadsOnTopKg, type MassBox } from './stack-load.ts';

/**
 * Ballast's container-loading search. Written here because the npm 3D packers are single-pass greedies
 * without support or stack rules (measured at 81.5 % on BR1–7 with up to 17 % of boxes floating).
 *
 * Method (block building on maximal spaces, searched with a beam):
 * - Free space is kept as the list of MAXIMAL empty cuboids ("spaces"); they overlap. Placing a cuboid
 *   cuts every space it meets into up to six pieces; pieces inside another space are dropped.
 * - A step takes the space whose corner is closest to a container corner (front wall, a side wall, the
 *   floor; distances sorted and compared in order, then larger volume) and puts a block of identical
 *   items into that corner of it. The greedy takes the largest block that fits and obeys every rule.
 * - Anytime search: a greedy answer first; then rounds of beam search of width w = 1, 2, 3, 4, 6, 8, …
 *   where each node branches on its w largest feasible blocks and is scored by a greedy completion. The
 *   best completion ever seen is the answer, so stopping at any moment returns a valid packing.
 * - Full support: a block above the floor must sit entirely on the flat tops of placed blocks at its
 *   base height; when the space's own corner is not supported, the corners of those tops are tried.
 * - Non-stackable items close the column above them; stack-load limits are checked with the shared load
 *   model (stack-load.ts); load order is kept by packing stop groups in turn and never putting an item
 *   behind or under one that leaves later.
 */

/**
 * Mixed (general) blocks are built when lines hold fewer items than this on average (without / with
 * full support). With full support, mixed blocks have flat tops and so help up to larger lines.
 */
export const GENERAL_BLOCKS_BELOW_ITEMS_PER_LINE = { unsupported: 5, fullSupport: 6 };

export interface SolverConfig {
  L: number;
  W: number;
  H: number;
  payloadKg: number;
  types: SolverType[];
  groups: number;
  fullSupport: boolean;
  /** Work limit on block pairs examined for general blocks (default MAX_PAIRS). */
  maxPairs?: number;
  /** Build general (mixed) blocks; default: when lines are small (see GENERAL_BLOCKS_BELOW_ITEMS_PER_LINE). */
  generalBlocks?: boolean;
}

/** A placed block (immutable; the list is shared between search states). */
export interface PlacedNode {
  b: number;
  x0: number;
  y0: number;
  z0: number;
  x1: number;
  y1: number;
  z1: number;
  group: number;
  prev: PlacedNode | null;
}

/**
 * One search state. Spaces are 6 numbers each: x0 y0 z0 x1 y1 z1. Plain arrays, not typed arrays: states
 * are cloned for every beam child and greedy completion, and V8 copies small plain arrays far faster
 * than it allocates typed-array backing stores.
 */
export class State {
  sp: number[] = [];
  n = 0;
  dead: number[] = [];
  rem: number[] = [];
  placed: PlacedNode | null = null;
  volume = 0;
  massKg = 0;
  group = 0;
  clone(): State {
    const s = new State();
    s.sp = this.sp.slice(0, this.n * 6);
    s.dead = this.dead.slice(0, this.n);
    s.n = this.n;
    s.rem = this.rem.slice();
    s.placed = this.placed;
    s.volume = this.volume;
    s.massKg = this.massKg;
    s.group = this.group;
    return s;
  }
}

/** A chosen block and where it goes. */
interface Cand {
  b: number;
  x: number;
  y: number;
  z: number;
}

export class Solver {
  readonly cfg: SolverConfig;
  readonly blocks: BlockTable;
  private readonly nTypes: number;
  private readonly hasLimits: boolean;
  /** Scratch buffers (the solver is not re-entrant). */
  private pieces = new Float64Array(6 * 1024);
  private rects = new Float64Array(4 * 256);
  private nRects = 0;
  private typeGroup: Int32Array;

  constructor(cfg: SolverConfig) {
    this.cfg = cfg;
    this.nTypes = cfg.types.length;
    // Mixed blocks pay off when lines are small (few items each: simple blocks are then tiny); with large
    // lines, their up-to-2 % gaps cost more than they give (measured on BR samples at equal iterations).
    const itemsPerLine = cfg.types.reduce((n, t) => n + t.count, 0) / Math.max(1, cfg.types.length);
    const general = cfg.generalBlocks ?? itemsPerLine < GENERAL_BLOCKS_BELOW_ITEMS_PER_LINE[cfg.fullSupport ? 'fullSupport' : 'unsupported'];
    this.blocks = buildBlocks(cfg.types, cfg.L, cfg.W, cfg.H, cfg.payloadKg, { fullSupport: cfg.fullSupport, general, maxPairs: cfg.maxPairs });
    this.hasLimits = cfg.types.some((t) => Number.isFinite(t.maxLoadOnTopKg));
    this.typeGroup = Int32Array.from(cfg.types.map((t) => t.group));
  }

  root(): State {
    const s = new State();
    for (let t = 0; t < this.nTypes; t++) s.rem[t] = this.cfg.types[t].count;
    s.sp = [0, 0, 0, this.cfg.L, this.cfg.W, this.cfg.H];
    s.dead = [0];
    s.n = 1;
    return s;
  }

  // ---------------------------------------------------------------- space selection

  /** Index of the live space to fill next, or -1 when none is left. */
  select(s: State): number {
    const { W } = this.cfg;
    const sp = s.sp;
    let best = -1;
    let k0 = 0;
    let k1 = 0;
    let k2 = 0;
    let bv = 0;
    for (let i = 0; i < s.n; i++) {
      if (s.dead[i]) continue;
      const o = i * 6;
      let a = sp[o];
      let b = Math.min(sp[o + 1], W - sp[o + 4]);
      let c = sp[o + 2];
      // sort a <= b <= c
      if (a > b) [a, b] = [b, a];
      if (b > c) [b, c] = [c, b];
      if (a > b) [a, b] = [b, a];
      const v = (sp[o + 3] - sp[o]) * (sp[o + 4] - sp[o + 1]) * (sp[o + 5] - sp[o + 2]);
      if (best < 0 || a < k0 - EPS_MM || (a <= k0 + EPS_MM && (b < k1 - EPS_MM || (b <= k1 + EPS_MM && (c < k2 - EPS_MM || (c <= k2 + EPS_MM && v > bv)))))) {
        best = i;
        k0 = a;
        k1 = b;
        k2 = c;
        bv = v;
      }
    }
    return best;
  }

  /** Drops a space that no block can use (or parks it until the next loading group). */
  kill(s: State, i: number): void {
    if (s.group < this.cfg.groups - 1) {
      s.dead[i] = 1;
      return;
    }
    const last = s.n - 1;
    if (i !== last) {
      for (let k = 0; k < 6; k++) s.sp[i * 6 + k] = s.sp[last * 6 + k];
      s.dead[i] = s.dead[last];
    }
    s.n = last;
    s.sp.length = last * 6;
    s.dead.length = last;
  }

  /** Moves on to the next loading group; returns false when there is none. */
  nextGroup(s: State): boolean {
    if (s.group >= this.cfg.groups - 1) return false;
    s.group++;
    for (let i = 0; i < s.n; i++) s.dead[i] = 0;
    return true;
  }

  // ---------------------------------------------------------------- candidates

  /** Collects tops at height z overlapping the footprint of space o (clipped), nearest the anchor first. */
  private collectSupports(s: State, o: number): void {
    const sp = s.sp;
    const z = sp[o + 2];
    const sx0 = sp[o];
    const sy0 = sp[o + 1];
    const sx1 = sp[o + 3];
    const sy1 = sp[o + 4];
    this.nRects = 0;
    for (let p = s.placed; p; p = p.prev) {
      if (Math.abs(p.z1 - z) > EPS_MM) continue;
      if (p.x1 <= sx0 + EPS_MM || p.x0 >= sx1 - EPS_MM || p.y1 <= sy0 + EPS_MM || p.y0 >= sy1 - EPS_MM) continue;
      const tops = this.blocks.tops[p.b];
      if (!tops) this.addRect(p.x0, p.y0, p.x1, p.y1, sx0, sy0, sx1, sy1);
      else for (let j = 0; j < tops.length; j += 4) this.addRect(p.x0 + tops[j], p.y0 + tops[j + 1], p.x0 + tops[j + 2], p.y0 + tops[j + 3], sx0, sy0, sx1, sy1);
    }
  }

  private addRect(ax0: number, ay0: number, ax1: number, ay1: number, sx0: number, sy0: number, sx1: number, sy1: number): void {
    const x0 = Math.max(ax0, sx0);
    const x1 = Math.min(ax1, sx1);
    const y0 = Math.max(ay0, sy0);
    const y1 = Math.min(ay1, sy1);
    if (x1 - x0 <= EPS_MM || y1 - y0 <= EPS_MM) return;
    const k = this.nRects;
    if (k * 4 + 4 > this.rects.length) {
      const r = new Float64Array(this.rects.length * 2);
      r.set(this.rects);
      this.rects = r;
    }
    this.rects[k * 4] = x0;
    this.rects[k * 4 + 1] = y0;
    this.rects[k * 4 + 2] = x1;
    this.rects[k * 4 + 3] = y1;
    this.nRects = k + 1;
  }

  /** True when block b with its corner at (x, y) stands fully on the collected tops. */
  private supported(b: number, x: number, y: number): boolean {
    const B = this.blocks;
    if (this.supportedArea(x, y, B.dx[b], B.dy[b]) >= B.dx[b] * B.dy[b] * (1 - 1e-9)) return true;
    const bot = B.bottoms[b];
    if (!bot) return false;
    for (let j = 0; j < bot.length; j += 4) {
      const w = bot[j + 2] - bot[j];
      const h = bot[j + 3] - bot[j + 1];
      if (this.supportedArea(x + bot[j], y + bot[j + 1], w, h) < w * h * (1 - 1e-9)) return false;
    }
    return true;
  }

  private supportedArea(x: number, y: number, dx: number, dy: number): number {
    let a = 0;
    const r = this.rects;
    for (let k = 0; k < this.nRects; k++) {
      const w = Math.min(x + dx, r[k * 4 + 2]) - Math.max(x, r[k * 4]);
      const h = Math.min(y + dy, r[k * 4 + 3]) - Math.max(y, r[k * 4 + 1]);
      if (w > 0 && h > 0) a += w * h;
    }
    return a;
  }

  /**
   * Finds up to k feasible blocks for space i, largest volume first. Writes them into `out` and returns
   * how many were found.
   */
  candidates(s: State, i: number, k: number, out: Cand[]): number {
    const B = this.blocks;
    const sp = s.sp;
    const o = i * 6;
    const sx0 = sp[o];
    const sy0 = sp[o + 1];
    const sz0 = sp[o + 2];
    const sx = sp[o + 3] - sx0;
    const sy = sp[o + 4] - sy0;
    const sz = sp[o + 5] - sz0;
    const vol = sx * sy * sz;
    const fromRight = this.cfg.W - sp[o + 4] < sy0;
    const needSupport = this.cfg.fullSupport && sz0 > EPS_MM;
    if (needSupport) {
      this.collectSupports(s, o);
      if (this.nRects === 0) return 0;
    }
    const payloadLeft = this.cfg.payloadKg - s.massKg + 1e-9;
    const multiGroup = this.cfg.groups > 1;
    // Skip blocks larger than the space (binary search on the volume-sorted table).
    let lo = 0;
    let hi = B.count;
    while (lo < hi) {
      const mid = (lo + hi) >> 1;
      if (B.volume[mid] > vol * (1 + 1e-12)) lo = mid + 1;
      else hi = mid;
    }
    let found = 0;
    for (let b = lo; b < B.count && found < k; b++) {
      const dx = B.dx[b];
      if (dx > sx + EPS_MM) continue;
      const dy = B.dy[b];
      if (dy > sy + EPS_MM) continue;
      const dz = B.dz[b];
      if (dz > sz + EPS_MM) continue;
      const t = B.type[b];
      if (t >= 0) {
        if (s.rem[t] < B.n[b]) continue;
      } else {
        const req = B.req[b]!;
        let ok = true;
        for (let j = 0; j < req.length && ok; j += 2) ok = s.rem[req[j]] >= req[j + 1];
        if (!ok) continue;
      }
      if (multiGroup && B.group[b] !== s.group) continue;
      if (B.massKg[b] > payloadLeft) continue;
      let x = sx0;
      let y = fromRight ? sy0 + sy - dy : sy0;
      if (needSupport) {
        if (!this.supported(b, x, y)) {
          // Try the corners of the tops below, keep the supported one nearest the space's corner.
          let ok = false;
          let bestD = Infinity;
          const ax = sx0;
          const ay = fromRight ? sy0 + sy - dy : sy0;
          for (let r = 0; r < this.nRects; r++) {
            const rx = this.rects[r * 4];
            let ry = fromRight ? this.rects[r * 4 + 3] - dy : this.rects[r * 4 + 1];
            if (rx + dx > sx0 + sx + EPS_MM) continue;
            if (ry < sy0) ry = sy0;
            if (ry + dy > sy0 + sy + EPS_MM) ry = sy0 + sy - dy;
            const d = rx - ax + Math.abs(ry - ay);
            if (d >= bestD) continue;
            if (this.supported(b, rx, ry)) {
              x = rx;
              y = ry;
              bestD = d;
              ok = true;
            }
          }
          if (!ok) continue;
        }
      }
      if (multiGroup && !this.orderOk(s, x, y, sz0, x + dx, y + dy, sz0 + dz)) continue;
      if (this.hasLimits && sz0 > EPS_MM && !this.loadsOk(s, b, x, y, sz0)) continue;
      const c = out[found];
      if (c) {
        c.b = b;
        c.x = x;
        c.y = y;
        c.z = sz0;
      } else out[found] = { b, x, y, z: sz0 };
      found++;
    }
    return found;
  }

  /**
   * Load order: an item of the current group (unloaded earlier) must not have an item of an earlier
   * group (unloaded later) between it and the doors in its own y–z band, nor above it.
   */
  private orderOk(s: State, x0: number, y0: number, z0: number, x1: number, y1: number, z1: number): boolean {
    for (let p = s.placed; p; p = p.prev) {
      if (p.group === s.group) continue;
      const yz = Math.min(y1, p.y1) - Math.max(y0, p.y0) > EPS_MM && Math.min(z1, p.z1) - Math.max(z0, p.z0) > EPS_MM;
      if (yz && p.x0 >= x1 - EPS_MM) return false;
      const xy = Math.min(x1, p.x1) - Math.max(x0, p.x0) > EPS_MM && Math.min(y1, p.y1) - Math.max(y0, p.y0) > EPS_MM;
      if (xy && p.z0 >= z1 - EPS_MM) return false;
    }
    return true;
  }

  private loadsOk(s: State, b: number, x: number, y: number, z: number): boolean {
    // Only blocks under the new one (through any chain of contact) take its weight. If none of them has a
    // load limit, nothing can break; skip the full recomputation, which is quadratic in the item count.
    const B = this.blocks;
    const under: PlacedNode[] = [];
    const frontier: [number, number, number, number, number][] = [[x, y, x + B.dx[b], y + B.dy[b], z]];
    let limited = false;
    while (frontier.length > 0 && !limited) {
      const [fx0, fy0, fx1, fy1, fz] = frontier.pop()!;
      for (let p = s.placed; p; p = p.prev) {
        if (Math.abs(p.z1 - fz) > EPS_MM || p.x1 <= fx0 + EPS_MM || p.x0 >= fx1 - EPS_MM || p.y1 <= fy0 + EPS_MM || p.y0 >= fy1 - EPS_MM) continue;
        if (under.includes(p)) continue;
        under.push(p);
        const t = B.type[p.b];
        if (t >= 0 && Number.isFinite(this.cfg.types[t].maxLoadOnTopKg)) limited = true;
        frontier.push([p.x0, p.y0, p.x1, p.y1, p.z0]);
      }
    }
    if (!limited) return true;
    const boxes: MassBox[] = [];
    const limits: number[] = [];
    const types = this.cfg.types;
    const visit = (t: number, x0: number, y0: number, z0: number, lx: number, ly: number, lz: number) => {
      boxes.push({ x0, y0, z0, x1: x0 + lx, y1: y0 + ly, z1: z0 + lz, massKg: types[t].massKg });
      limits.push(types[t].maxLoadOnTopKg);
    };
    const push = (bb: number, px: number, py: number, pz: number) => forEachItem(this.blocks, bb, px, py, pz, visit);
    for (let p = s.placed; p; p = p.prev) push(p.b, p.x0, p.y0, p.z0);
    push(b, x, y, z);
    const loads = loadsOnTopKg(boxes);
    for (let i = 0; i < boxes.length; i++) if (loads[i] > limits[i] + 1e-9) return false;
    return true;
  }

  // ---------------------------------------------------------------- placing

  place(s: State, c: Cand): void {
    const B = this.blocks;
    const b = c.b;
    const t = B.type[b];
    const x1 = c.x + B.dx[b];
    const y1 = c.y + B.dy[b];
    const z1 = c.z + B.dz[b];
    s.placed = { b, x0: c.x, y0: c.y, z0: c.z, x1, y1, z1, group: s.group, prev: s.placed };
    if (t >= 0) s.rem[t] -= B.n[b];
    else {
      const req = B.req[b]!;
      for (let j = 0; j < req.length; j += 2) s.rem[req[j]] -= req[j + 1];
    }
    s.volume += B.volume[b];
    s.massKg += B.massKg[b];
    // A non-stackable block closes the whole column above it.
    const top = t < 0 || this.cfg.types[t].stackable ? z1 : this.cfg.H;
    this.subtract(s, c.x, c.y, c.z, x1, y1, top);
  }

  /** Smallest extents along x, y, z and volume of any item still to place (current group or later). */
  private mx = 0;
  private my = 0;
  private mz = 0;
  private mv = 0;
  private minima(s: State): void {
    let mx = Infinity;
    let my = Infinity;
    let mz = Infinity;
    let mv = Infinity;
    const types = this.cfg.types;
    for (let t = 0; t < this.nTypes; t++) {
      if (s.rem[t] <= 0 || this.typeGroup[t] < s.group) continue;
      const ty = types[t];
      if (ty.massKg > this.cfg.payloadKg - s.massKg + 1e-9) continue;
      for (const d of ty.dims) {
        if (d[0] < mx) mx = d[0];
        if (d[1] < my) my = d[1];
        if (d[2] < mz) mz = d[2];
      }
      if (ty.volumeMm3 < mv) mv = ty.volumeMm3;
    }
    this.mx = mx - EPS_MM;
    this.my = my - EPS_MM;
    this.mz = mz - EPS_MM;
    this.mv = mv * (1 - 1e-9);
  }

  /** Can any remaining item fit in a cuboid of these extents (cheap necessary test)? */
  private usable(a: number, b: number, c: number): boolean {
    return a >= this.mx && b >= this.my && c >= this.mz && a * b * c >= this.mv;
  }

  private nP = 0;
  private addPiece(x0: number, y0: number, z0: number, x1: number, y1: number, z1: number): void {
    if (!this.usable(x1 - x0, y1 - y0, z1 - z0)) return;
    const q = this.nP * 6;
    if (this.pieces.length < q + 6) {
      const p = new Float64Array(this.pieces.length * 2);
      p.set(this.pieces);
      this.pieces = p;
    }
    const P = this.pieces;
    P[q] = x0;
    P[q + 1] = y0;
    P[q + 2] = z0;
    P[q + 3] = x1;
    P[q + 4] = y1;
    P[q + 5] = z1;
    this.nP++;
  }

  /**
   * Removes the cuboid from the free space: every space it meets is replaced by its (up to six) parts
   * outside the cuboid; parts inside another space, or too small for any item left, are dropped. The
   * state's space list is rewritten in place (kept spaces first, then new parts).
   */
  private subtract(s: State, bx0: number, by0: number, bz0: number, bx1: number, by1: number, bz1: number): void {
    this.minima(s);
    const sp = s.sp;
    const dead = s.dead;
    let nOut = 0;
    this.nP = 0;
    for (let i = 0; i < s.n; i++) {
      const o = i * 6;
      const x0 = sp[o];
      const y0 = sp[o + 1];
      const z0 = sp[o + 2];
      const x1 = sp[o + 3];
      const y1 = sp[o + 4];
      const z1 = sp[o + 5];
      if (x1 <= bx0 + EPS_MM || x0 >= bx1 - EPS_MM || y1 <= by0 + EPS_MM || y0 >= by1 - EPS_MM || z1 <= bz0 + EPS_MM || z0 >= bz1 - EPS_MM) {
        if (!this.usable(x1 - x0, y1 - y0, z1 - z0)) continue;
        // Compact in place (nOut <= i).
        const q = nOut * 6;
        sp[q] = x0;
        sp[q + 1] = y0;
        sp[q + 2] = z0;
        sp[q + 3] = x1;
        sp[q + 4] = y1;
        sp[q + 5] = z1;
        dead[nOut] = dead[i];
        nOut++;
        continue;
      }
      if (bx0 > x0 + EPS_MM) this.addPiece(x0, y0, z0, bx0, y1, z1);
      if (bx1 < x1 - EPS_MM) this.addPiece(bx1, y0, z0, x1, y1, z1);
      if (by0 > y0 + EPS_MM) this.addPiece(x0, y0, z0, x1, by0, z1);
      if (by1 < y1 - EPS_MM) this.addPiece(x0, by1, z0, x1, y1, z1);
      if (bz0 > z0 + EPS_MM) this.addPiece(x0, y0, z0, x1, y1, bz0);
      if (bz1 < z1 - EPS_MM) this.addPiece(x0, y0, bz1, x1, y1, z1);
    }
    const nOld = nOut;
    const nP = this.nP;
    const P = this.pieces;
    for (let p = 0; p < nP; p++) {
      const q = p * 6;
      const x0 = P[q];
      const y0 = P[q + 1];
      const z0 = P[q + 2];
      const x1 = P[q + 3];
      const y1 = P[q + 4];
      const z1 = P[q + 5];
      let inside = false;
      for (let j = 0; j < nOld && !inside; j++) {
        const r = j * 6;
        inside = sp[r] <= x0 + EPS_MM && sp[r + 1] <= y0 + EPS_MM && sp[r + 2] <= z0 + EPS_MM && sp[r + 3] >= x1 - EPS_MM && sp[r + 4] >= y1 - EPS_MM && sp[r + 5] >= z1 - EPS_MM;
      }
      for (let j = 0; j < nP && !inside; j++) {
        if (j === p) continue;
        const r = j * 6;
        const contains = P[r] <= x0 + EPS_MM && P[r + 1] <= y0 + EPS_MM && P[r + 2] <= z0 + EPS_MM && P[r + 3] >= x1 - EPS_MM && P[r + 4] >= y1 - EPS_MM && P[r + 5] >= z1 - EPS_MM;
        if (!contains) continue;
        const equal = P[r] >= x0 - EPS_MM && P[r + 1] >= y0 - EPS_MM && P[r + 2] >= z0 - EPS_MM && P[r + 3] <= x1 + EPS_MM && P[r + 4] <= y1 + EPS_MM && P[r + 5] <= z1 + EPS_MM;
        inside = !equal || j < p;
      }
      if (inside) continue;
      const r = nOut * 6;
      sp[r] = x0;
      sp[r + 1] = y0;
      sp[r + 2] = z0;
      sp[r + 3] = x1;
      sp[r + 4] = y1;
      sp[r + 5] = z1;
      dead[nOut] = 0;
      nOut++;
    }
    s.n = nOut;
    sp.length = nOut * 6;
    dead.length = nOut;
  }

  // ---------------------------------------------------------------- greedy

  /**
   * Completes a state greedily (largest feasible block into the selected space) until nothing fits. With
   * `random`, each step takes the best block 70 % of the time, else the second or third (GRASP-style
   * diversification).
   */
  greedy(s: State, random?: () => number): void {
    const c: Cand[] = [];
    const k = random ? 3 : 1;
    for (;;) {
      const i = this.select(s);
      if (i < 0) {
        if (this.nextGroup(s)) continue;
        return;
      }
      const n = this.candidates(s, i, k, c);
      if (n === 0) {
        this.kill(s, i);
        continue;
      }
      let pick = 0;
      if (random) {
        const u = random();
        pick = Math.min(n - 1, u < 0.7 ? 0 : u < 0.9 ? 1 : 2);
      }
      this.place(s, c[pick]);
    }
  }

  /**
   * Advances a state to its next decision: returns the selected space's feasible blocks (up to k), or 0
   * when the state is complete.
   */
  expand(s: State, k: number, out: Cand[]): number {
    for (;;) {
      const i = this.select(s);
      if (i < 0) {
        if (this.nextGroup(s)) continue;
        return 0;
      }
      const n = this.candidates(s, i, k, out);
      if (n > 0) return n;
      this.kill(s, i);
    }
  }
}
