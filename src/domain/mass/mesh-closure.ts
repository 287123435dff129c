/**
 * Watertightness check for a triangle soup: every edge must be shared by exactly two triangles that run
 * along it in opposite directions (a closed, consistently oriented 2-manifold). Only then does the
 * divergence theorem turn the surface sums into the volume integrals of a solid.
 *
 * Written here rather than taken from npm: the mesh libraries on npm either need three.js (not allowed in
 * the core) or build a full half-edge structure, which is several times slower and heavier than the two flat
 * hash tables below for 1,000,000 triangles.
 *
 * Method: corners are welded by a hash of their quantised coordinates (so the same point written twice in an
 * STL is one vertex), then each undirected edge is counted in both directions in an open-addressing table.
 */

/** What the closure check found, also on success (degenerate triangles are skipped, not refused). */
export interface MeshClosureReport {
  /** Distinct vertices after welding. */
  vertexCount: number;
  /** Distinct undirected edges. */
  edgeCount: number;
  /** Triangles with two corners welded into one vertex (zero area); left out of the edge count. */
  degenerateTriangleCount: number;
}

/** The problems of a mesh that is not closed, counted by kind. */
export interface MeshClosureProblems {
  /** Edges used by one triangle only (a hole or a crack). */
  openEdges: number;
  /** Edges used by more than two triangles (non-manifold). */
  overusedEdges: number;
  /** Edges used by two triangles running the same way (a face turned over). */
  misorientedEdges: number;
  /** The first offending edge in triangle order. */
  first: { triangleIndex: number; fromMm: [number, number, number]; toMm: [number, number, number]; kind: string };
}

export interface MeshClosureOptions {
  /** Corners closer than this (per axis) are one vertex. Default: 2⁻³² of the largest bounding-box extent. */
  weldToleranceMm?: number;
}

const EMPTY = 0;

function nextPow2(n: number): number {
  let p = 1;
  while (p < n) p *= 2;
  return p;
}

/** Mixes three 32-bit integers into a well-spread 32-bit hash (multiply–xorshift, after MurmurHash3's finaliser). */
function hash3(a: number, b: number, c: number): number {
  let h = Math.imul(a, 0x9e3779b1) ^ Math.imul(b, 0x85ebca77) ^ Math.imul(c, 0xc2b2ae3d);
  h ^= h >>> 15;
  h = Math.imul(h, 0x2c1b3c6d);
  h ^= h >>> 12;
  return h;
}

/**
 * Checks that a flat triangle list (9 numbers per triangle, mm) is closed and consistently oriented.
 * Returns the problems found, or null when it is closed. Coordinates are assumed finite (the caller checks).
 */
export function findMeshClosureProblems(
  t: ArrayLike<number>,
  options: MeshClosureOptions = {},
): { report: MeshClosureReport; problems: MeshClosureProblems | null } {
  const triCount = Math.floor(t.length / 9);
  const cornerCount = triCount * 3;

  // Bounding box, for the quantum and for small quantised integers.
  let minX = Infinity, minY = Infinity, minZ = Infinity, maxX = -Infinity, maxY = -Infinity, maxZ = -Infinity;
  for (let k = 0; k < cornerCount * 3; k += 3) {
    const x = t[k], y = t[k + 1], z = t[k + 2];
    if (x < minX) minX = x;
    if (x > maxX) maxX = x;
    if (y < minY) minY = y;
    if (y > maxY) maxY = y;
    if (z < minZ) minZ = z;
    if (z > maxZ) maxZ = z;
  }
  const extent = Math.max(maxX - minX, maxY - minY, maxZ - minZ);
  const quantum = options.weldToleranceMm && options.weldToleranceMm > 0 ? options.weldToleranceMm : extent > 0 ? extent * 2 ** -32 : 1;
  const inv = 1 / quantum;

  // --- Weld corners into vertices. The table stores (first corner index + 1) of each distinct vertex; equal
  // keys are compared by re-quantising that corner, so no coordinate copy is kept (memory: 4 bytes a slot).
  const vSize = nextPow2(Math.ceil(cornerCount * 1.5) + 1);
  const vMask = vSize - 1;
  const vTable = new Int32Array(vSize);
  const vertexOfCorner = new Int32Array(cornerCount);
  const vertexFirstCorner = new Int32Array(cornerCount);
  let vertexCount = 0;
  for (let c = 0; c < cornerCount; c++) {
    const k = c * 3;
    const qx = Math.round((t[k] - minX) * inv);
    const qy = Math.round((t[k + 1] - minY) * inv);
    const qz = Math.round((t[k + 2] - minZ) * inv);
    let slot = hash3(qx | 0, qy | 0, qz | 0) & vMask;
    for (;;) {
      const e = vTable[slot];
      if (e === EMPTY) {
        vTable[slot] = c + 1;
        vertexFirstCorner[vertexCount] = c;
        vertexOfCorner[c] = vertexCount++;
        break;
      }
      const o = (e - 1) * 3;
      if (
        Math.round((t[o] - minX) * inv) === qx &&
        Math.round((t[o + 1] - minY) * inv) === qy &&
        Math.round((t[o + 2] - minZ) * inv) === qz
      ) {
        vertexOfCorner[c] = vertexOfCorner[e - 1];
        break;
      }
      slot = (slot + 1) & vMask;
    }
  }

  // --- Count each undirected edge (lo, hi) in both directions. counts: low 16 bits = lo→hi uses,
  // high 16 bits = hi→lo uses (saturating far above the 2 that a valid edge has).
  const eSize = nextPow2(Math.ceil(cornerCount * 1.5) + 1);
  const eMask = eSize - 1;
  const eLo = new Int32Array(eSize); // vertex + 1, 0 = empty
  const eHi = new Int32Array(eSize);
  const eCount = new Int32Array(eSize);
  let edgeCount = 0;
  let degenerate = 0;
  const findSlot = (lo: number, hi: number): number => {
    let slot = hash3(lo, hi, 0x5bd1e995) & eMask;
    for (;;) {
      const l = eLo[slot];
      if (l === EMPTY || (l === lo + 1 && eHi[slot] === hi)) return slot;
      slot = (slot + 1) & eMask;
    }
  };
  const addEdge = (a: number, b: number): void => {
    const fwd = a < b;
    const lo = fwd ? a : b;
    const hi = fwd ? b : a;
    const slot = findSlot(lo, hi);
    if (eLo[slot] === EMPTY) {
      eLo[slot] = lo + 1;
      eHi[slot] = hi;
      edgeCount++;
    }
    const n = eCount[slot];
    if (fwd) {
      if ((n & 0xffff) < 0xffff) eCount[slot] = n + 1;
    } else if (n >>> 16 < 0x7fff) {
      eCount[slot] = n + 0x10000;
    }
  };
  for (let tri = 0; tri < triCount; tri++) {
    const a = vertexOfCorner[tri * 3], b = vertexOfCorner[tri * 3 + 1], c = vertexOfCorner[tri * 3 + 2];
    if (a === b || b === c || c === a) {
      degenerate++;
      continue;
    }
    addEdge(a, b);
    addEdge(b, c);
    addEdge(c, a);
  }

  const kindOf = (n: number): 'ok' | 'open' | 'overused' | 'misoriented' => {
    const f = n & 0xffff;
    const r = n >>> 16;
    if (f === 1 && r === 1) return 'ok';
    if (f + r === 1) return 'open';
    if (f + r > 2) return 'overused';
    return 'misoriented';
  };
  let open = 0, overused = 0, misoriented = 0;
  for (let s = 0; s < eSize; s++) {
    if (eLo[s] === EMPTY) continue;
    const k = kindOf(eCount[s]);
    if (k === 'open') open++;
    else if (k === 'overused') overused++;
    else if (k === 'misoriented') misoriented++;
  }
  const report: MeshClosureReport = { vertexCount, edgeCount, degenerateTriangleCount: degenerate };
  if (open + overused + misoriented === 0) return { report, problems: null };

  // Only on failure: walk the triangles again to name the first offending edge in file order.
  const corner = (v: number): [number, number, number] => {
    const o = vertexFirstCorner[v] * 3;
    return [t[o], t[o + 1], t[o + 2]];
  };
  for (let tri = 0; tri < triCount; tri++) {
    const vs = [vertexOfCorner[tri * 3], vertexOfCorner[tri * 3 + 1], vertexOfCorner[tri * 3 + 2]];
    if (vs[0] === vs[1] || vs[1] === vs[2] || vs[2] === vs[0]) continue;
    for (let e = 0; e < 3; e++) {
      const a = vs[e], b = vs[(e + 1) % 3];
      const k = kindOf(eCount[findSlot(Math.min(a, b), Math.max(a, b))]);
      if (k !== 'ok') {
        return {
          report,
          problems: { openEdges: open, overusedEdges: overused, misorientedEdges: misoriented, first: { triangleIndex: tri, fromMm: corner(a), toMm: corner(b), kind: k } },
        };
      }
    }
  }
  /* c8 ignore next */
  throw new Error('Mesh closure check: an offending edge was counted but not found again (internal error).');
}
