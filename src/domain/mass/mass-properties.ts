import type { Vec3 } from '../geometry/vec3.ts';
import type { Box3 } from '../geometry/box.ts';
import type { MassAddOn, MassPartLine, MassPropertiesInput, MassSource } from '../contracts/mass.ts';
import { isFiniteTensor, type InertiaTensor } from './inertia.ts';

/**
 * Mass properties of a machine's assembly tree, its sections, the loose parts, and everything together:
 * mass (nominal and with margin), centre of gravity, bounding box, inertia tensor about the CoG, how firm the
 * mass figures are, and what is missing.
 *
 * Rules (stated here because the numbers depend on them):
 * - A part line with no mass or no CoG is a GAP: listed on every node it belongs to, never counted as zero.
 *   A node with gaps is `complete: false`; its mass is a lower bound.
 * - quantity > 1 without instances puts every unit at the one CoG: counted, flagged approximate.
 * - Inertia of a unit: its own tensor when given; otherwise a solid uniform cuboid filling its bounding box,
 *   m(b² + c²)/12 … (flagged `assumedInertia`); with neither, a point mass (flagged `pointMass`). Units are
 *   combined by the parallel-axis theorem, I = Σ (I_i + m_i(|d_i|² E − d_i d_iᵀ)).
 * - A line's section is its own sectionId if set, else its nearest assembly's (the nearest assignment wins).
 * - Add-ons count in their section and in the total, not in the machine or its assemblies.
 * - Confidence: kg and % of the nominal mass that is weighed, catalogue, CAD or estimated. A mass with no
 *   source is counted as estimated.
 * - Margin: massWithMarginKg = massKg × (1 + marginPercent/100), on the whole nominal mass.
 *
 * Runs in one pass over the lines plus one over the assemblies (bottom-up), on flat Float64Array
 * accumulators: 100,000 lines in a few tens of milliseconds (scripts/bench/mass.ts).
 */

/** How firm a node's mass is. Percentages are of the node's nominal mass (0 when it is zero). */
export interface MassConfidence {
  weighedKg: number;
  catalogueKg: number;
  cadKg: number;
  estimatedKg: number;
  /** weighed + catalogue: the mass that rests on a scale or a maker's figure. */
  weighedOrCatalogueKg: number;
  weighedOrCataloguePercent: number;
  cadPercent: number;
  estimatedPercent: number;
}

/** A part line (or add-on) left out of the totals, with why. */
export interface MassGap {
  lineId: string;
  label: string;
  kind: 'line' | 'addOn';
  assemblyId: string | null;
  sectionId: string | null;
  reasons: string[];
}

/** Mass properties of one node: an assembly (with its subtree), a section, the loose parts, the machine. */
export interface NodeMassProperties {
  id: string;
  kind: 'assembly' | 'section' | 'loose' | 'machine' | 'total';
  /** Nominal mass of what is counted, kg (gaps excluded: a lower bound while gaps remain). */
  massKg: number;
  massWithMarginKg: number;
  /** Null when nothing with mass is counted. */
  cogMm: Vec3 | null;
  /** Union of the counted units' boxes (a unit without a box adds its CoG point); null when nothing is counted. */
  bboxMm: Box3 | null;
  /** About cogMm, kg·mm²; null when massKg is zero. */
  inertiaKgMm2: InertiaTensor | null;
  confidence: MassConfidence;
  /** Part lines counted (gaps excluded), and the units they hold (Σ quantity). */
  lineCount: number;
  unitCount: number;
  addOnCount: number;
  gaps: MassGap[];
  /** False while any gap remains. */
  complete: boolean;
  /** Lines with quantity > 1 placed at one CoG, and their mass. */
  approximateLineCount: number;
  approximateMassKg: number;
  /** Units whose inertia was taken as a solid cuboid of their box, and units taken as point masses. */
  assumedInertiaLineCount: number;
  pointMassLineCount: number;
}

export interface MassPropertiesResult {
  marginPercent: number;
  /** Every assembly by id, each with its whole subtree. */
  assemblies: Record<string, NodeMassProperties>;
  /** Every section by id, with its add-ons. */
  sections: Record<string, NodeMassProperties>;
  /** Lines in no section (they go into crates later). */
  loose: NodeMassProperties;
  /** All part lines, no add-ons. */
  machine: NodeMassProperties;
  /** All part lines and all add-ons. */
  total: NodeMassProperties;
  /** Every gap once. (Per-line flags: see partLineFlags; per node, the counts.) */
  gaps: MassGap[];
  /** Input that was ignored but did not make a gap (e.g. a malformed box or inertia tensor). */
  warnings: { id: string; message: string }[];
}

// Accumulator layout, one row of F numbers per node. Second moments are about the ORIGIN (as a tensor);
// they are moved to the node's CoG once at the end, which keeps the per-line work to a few multiply-adds.
const M = 0, MX = 1, MY = 2, MZ = 3;
const IXX = 4, IYY = 5, IZZ = 6, IXY = 7, IYZ = 8, IZX = 9;
const BMINX = 10, BMINY = 11, BMINZ = 12, BMAXX = 13, BMAXY = 14, BMAXZ = 15;
const KG_WEIGHED = 16, KG_CATALOGUE = 17, KG_CAD = 18, KG_ESTIMATED = 19;
const APPROX_KG = 20, LINES = 21, UNITS = 22, APPROX_LINES = 23, ASSUMED_LINES = 24, POINT_LINES = 25, ADDONS = 26;
const F = 27;

/** Accumulator field for a mass source; none (or anything unknown) counts as estimated. */
function sourceSlot(source: MassSource | null | undefined): number {
  switch (source) {
    case 'weighed':
      return KG_WEIGHED;
    case 'catalogue':
      return KG_CATALOGUE;
    case 'cad':
      return KG_CAD;
    default:
      return KG_ESTIMATED;
  }
}

function isVec3(v: unknown): v is Vec3 {
  return Array.isArray(v) && v.length === 3 && Number.isFinite(v[0]) && Number.isFinite(v[1]) && Number.isFinite(v[2]);
}
function isBox(b: unknown): b is Box3 {
  if (!b || typeof b !== 'object') return false;
  const { minMm, maxMm } = b as Box3;
  return isVec3(minMm) && isVec3(maxMm) && minMm[0] <= maxMm[0] && minMm[1] <= maxMm[1] && minMm[2] <= maxMm[2];
}

/** How massProperties treats one part line, for flags beside it in a table. */
export interface PartLineFlags {
  /** No mass or no CoG (or bad data): listed as a gap, not counted. */
  gap: boolean;
  /** quantity > 1 without instances: all units at one CoG. */
  approximate: boolean;
  /** No own inertia: a solid cuboid filling its box is assumed. */
  assumedInertia: boolean;
  /** Neither own inertia nor a box: a point mass. */
  pointMass: boolean;
}

/**
 * The flags massProperties gives a line, per line. Per-line id lists are not part of MassPropertiesResult:
 * at 100,000 lines building them cost more than the mass properties themselves; each node carries the counts.
 */
export function partLineFlags(line: MassPartLine): PartLineFlags {
  const inst = line.instances && line.instances.length > 0 ? line.instances : null;
  const gap = lineGapReasons(line, line.quantity, line.unitMassKg, inst) !== null;
  const hasOwn = line.inertiaKgMm2 != null && isFiniteTensor(line.inertiaKgMm2);
  const hasBox = line.bboxMm != null && isBox(line.bboxMm);
  return {
    gap,
    approximate: !gap && !inst && line.quantity > 1,
    assumedInertia: !gap && !hasOwn && hasBox,
    pointMass: !gap && !hasOwn && !hasBox,
  };
}

/** Why a part line cannot be counted, or null when it can (no allocation on the valid path). */
function lineGapReasons(line: MassPartLine, q: number, m: number | null | undefined, inst: MassPartLine['instances'] | null): string[] | null {
  let ok = Number.isFinite(q) && q >= 0 && m !== null && m !== undefined && Number.isFinite(m) && m >= 0 && isVec3(line.cogMm);
  if (ok && inst) {
    ok = q === inst.length;
    for (let k = 0; ok && k < inst.length; k++) ok = isVec3(inst[k].positionMm) && (inst[k].eulerZyxDeg === undefined || isVec3(inst[k].eulerZyxDeg));
  }
  if (ok) return null;
  const reasons: string[] = [];
  if (!Number.isFinite(q) || q < 0) reasons.push(`quantity must be a finite number, 0 or more (got ${String(q)})`);
  if (m === null || m === undefined) reasons.push('no mass');
  else if (!Number.isFinite(m) || m < 0) reasons.push(`mass must be a finite number of kg, 0 or more (got ${String(m)})`);
  if (line.cogMm === null || line.cogMm === undefined) reasons.push('no position (CoG)');
  else if (!isVec3(line.cogMm)) reasons.push('CoG must be three finite numbers in mm');
  if (inst) {
    if (Number.isFinite(q) && q !== inst.length) reasons.push(`quantity is ${q} but ${inst.length} instances are placed`);
    inst.forEach((it, k) => {
      if (!isVec3(it.positionMm)) reasons.push(`instance ${k + 1}: position must be three finite numbers in mm`);
      if (it.eulerZyxDeg !== undefined && !isVec3(it.eulerZyxDeg)) reasons.push(`instance ${k + 1}: rotation must be three finite angles in degrees`);
    });
  }
  return reasons;
}

/** Scratch contribution of one line or add-on, reused to avoid allocating per line. */
const tmp = new Float64Array(F);

function resetTmp(): void {
  tmp.fill(0);
  tmp[BMINX] = tmp[BMINY] = tmp[BMINZ] = Infinity;
  tmp[BMAXX] = tmp[BMAXY] = tmp[BMAXZ] = -Infinity;
}

/**
 * Adds to row offset `o` of `d` q units of mass m at CoG c (world), own inertia `ii` (world axes, about c; 6 numbers
 * xx yy zz xy yz zx in tensor form, per unit) and world box.
 */
function addUnits(d: Float64Array, o: number, q: number, m: number, cx: number, cy: number, cz: number, ii: ArrayLike<number> | null, box: ArrayLike<number> | null): void {
  if (q === 0) return; // no units: no mass and no extent
  const mt = q * m;
  d[o + M] += mt;
  d[o + MX] += mt * cx;
  d[o + MY] += mt * cy;
  d[o + MZ] += mt * cz;
  // Parallel-axis term about the origin, m(|c|²E − ccᵀ), plus q × own inertia.
  d[o + IXX] += mt * (cy * cy + cz * cz);
  d[o + IYY] += mt * (cx * cx + cz * cz);
  d[o + IZZ] += mt * (cx * cx + cy * cy);
  d[o + IXY] -= mt * cx * cy;
  d[o + IYZ] -= mt * cy * cz;
  d[o + IZX] -= mt * cz * cx;
  if (ii) {
    d[o + IXX] += q * ii[0];
    d[o + IYY] += q * ii[1];
    d[o + IZZ] += q * ii[2];
    d[o + IXY] += q * ii[3];
    d[o + IYZ] += q * ii[4];
    d[o + IZX] += q * ii[5];
  }
  // A unit without a box still occupies its CoG: the node's box takes in at least that point.
  const x0 = box ? box[0] : cx, y0 = box ? box[1] : cy, z0 = box ? box[2] : cz;
  const x1 = box ? box[3] : cx, y1 = box ? box[4] : cy, z1 = box ? box[5] : cz;
  if (x0 < d[o + BMINX]) d[o + BMINX] = x0;
  if (y0 < d[o + BMINY]) d[o + BMINY] = y0;
  if (z0 < d[o + BMINZ]) d[o + BMINZ] = z0;
  if (x1 > d[o + BMAXX]) d[o + BMAXX] = x1;
  if (y1 > d[o + BMAXY]) d[o + BMAXY] = y1;
  if (z1 > d[o + BMAXZ]) d[o + BMAXZ] = z1;
}

/** acc[node] += src[srcRow]: sums, except the box, which takes the union. Unrolled: it runs twice per line. */
function addRow(acc: Float64Array, node: number, src: Float64Array, srcRow = 0): void {
  const o = node * F;
  const s = srcRow * F;
  for (let k = 0; k < BMINX; k++) acc[o + k] += src[s + k];
  if (src[s + BMINX] < acc[o + BMINX]) acc[o + BMINX] = src[s + BMINX];
  if (src[s + BMINY] < acc[o + BMINY]) acc[o + BMINY] = src[s + BMINY];
  if (src[s + BMINZ] < acc[o + BMINZ]) acc[o + BMINZ] = src[s + BMINZ];
  if (src[s + BMAXX] > acc[o + BMAXX]) acc[o + BMAXX] = src[s + BMAXX];
  if (src[s + BMAXY] > acc[o + BMAXY]) acc[o + BMAXY] = src[s + BMAXY];
  if (src[s + BMAXZ] > acc[o + BMAXZ]) acc[o + BMAXZ] = src[s + BMAXZ];
  for (let k = BMAXZ + 1; k < F; k++) acc[o + k] += src[s + k];
}

const ownInertia = new Float64Array(6);
const worldBox = new Float64Array(6);

/** Own inertia (6 tensor components) of one unit in its local axes: given, cuboid of its box, or none. */
function unitInertia(line: { inertiaKgMm2?: number[][] | null }, m: number, box: Box3 | null, hasOwn: boolean): 'own' | 'cuboid' | 'point' {
  if (hasOwn) {
    const t = line.inertiaKgMm2 as number[][];
    ownInertia[0] = t[0][0];
    ownInertia[1] = t[1][1];
    ownInertia[2] = t[2][2];
    ownInertia[3] = t[0][1];
    ownInertia[4] = t[1][2];
    ownInertia[5] = t[2][0];
    return 'own';
  }
  if (box) {
    const a = box.maxMm[0] - box.minMm[0], b = box.maxMm[1] - box.minMm[1], c = box.maxMm[2] - box.minMm[2];
    ownInertia[0] = (m * (b * b + c * c)) / 12;
    ownInertia[1] = (m * (a * a + c * c)) / 12;
    ownInertia[2] = (m * (a * a + b * b)) / 12;
    ownInertia[3] = ownInertia[4] = ownInertia[5] = 0;
    return 'cuboid';
  }
  ownInertia.fill(0);
  return 'point';
}

const rotInertia = new Float64Array(6);
/** Scratch rotation (row-major, 9 numbers) and R·I, so that turned instances allocate nothing. */
const R9 = new Float64Array(9);
const RI = new Float64Array(9);

/** R9 = Rz·Ry·Rx for Euler Z-Y-X angles in degrees (same convention as rotationFromEulerZyxDeg). */
function setRotation(e: readonly number[]): void {
  const d = Math.PI / 180;
  const cz = Math.cos(e[0] * d), sz = Math.sin(e[0] * d);
  const cy = Math.cos(e[1] * d), sy = Math.sin(e[1] * d);
  const cx = Math.cos(e[2] * d), sx = Math.sin(e[2] * d);
  R9[0] = cz * cy; R9[1] = cz * sy * sx - sz * cx; R9[2] = cz * sy * cx + sz * sx;
  R9[3] = sz * cy; R9[4] = sz * sy * sx + cz * cx; R9[5] = sz * sy * cx - cz * sx;
  R9[6] = -sy; R9[7] = cy * sx; R9[8] = cy * cx;
}

/** rotInertia = R I Rᵀ for I in ownInertia (symmetric, 6 components xx yy zz xy yz zx). */
function rotateOwnInertia(): void {
  const xx = ownInertia[0], yy = ownInertia[1], zz = ownInertia[2], xy = ownInertia[3], yz = ownInertia[4], zx = ownInertia[5];
  for (let i = 0; i < 3; i++) {
    const a = R9[3 * i], b = R9[3 * i + 1], c = R9[3 * i + 2];
    RI[3 * i] = a * xx + b * xy + c * zx;
    RI[3 * i + 1] = a * xy + b * yy + c * yz;
    RI[3 * i + 2] = a * zx + b * yz + c * zz;
  }
  rotInertia[0] = out(0, 0);
  rotInertia[1] = out(1, 1);
  rotInertia[2] = out(2, 2);
  rotInertia[3] = out(0, 1);
  rotInertia[4] = out(1, 2);
  rotInertia[5] = out(2, 0);
}

/** (R I Rᵀ)_ij from RI = R·I and R9. A module-level function, not a closure: it runs per turned instance. */
function out(i: number, j: number): number {
  return RI[3 * i] * R9[3 * j] + RI[3 * i + 1] * R9[3 * j + 1] + RI[3 * i + 2] * R9[3 * j + 2];
}

/** worldBox = axis-aligned box around the local box turned by R9 and moved by p (centre and |R|·half size). */
function transformBox(box: Box3, p: readonly number[]): void {
  const c0 = (box.minMm[0] + box.maxMm[0]) / 2, c1 = (box.minMm[1] + box.maxMm[1]) / 2, c2 = (box.minMm[2] + box.maxMm[2]) / 2;
  const h0 = (box.maxMm[0] - box.minMm[0]) / 2, h1 = (box.maxMm[1] - box.minMm[1]) / 2, h2 = (box.maxMm[2] - box.minMm[2]) / 2;
  for (let i = 0; i < 3; i++) {
    const a = R9[3 * i], b = R9[3 * i + 1], c = R9[3 * i + 2];
    const ci = a * c0 + b * c1 + c * c2 + p[i];
    const hi = Math.abs(a) * h0 + Math.abs(b) * h1 + Math.abs(c) * h2;
    worldBox[i] = ci - hi;
    worldBox[i + 3] = ci + hi;
  }
}

/** worldBox = the box moved by (dx, dy, dz), not turned. */
function setWorldBox(box: Box3, dx: number, dy: number, dz: number): void {
  worldBox[0] = box.minMm[0] + dx;
  worldBox[1] = box.minMm[1] + dy;
  worldBox[2] = box.minMm[2] + dz;
  worldBox[3] = box.maxMm[0] + dx;
  worldBox[4] = box.maxMm[1] + dy;
  worldBox[5] = box.maxMm[2] + dz;
}

/**
 * The accumulators, kept between calls and grown when a bigger tree comes: allocating ~1 MB per call for a
 * 2,000-assembly tree cost more in garbage collection than filling it. Safe because the core is synchronous.
 */
let accBuffer = new Float64Array(0);

function emptyAcc(n: number): Float64Array {
  if (accBuffer.length < n * F) accBuffer = new Float64Array(n * F);
  const acc = accBuffer.length === n * F ? accBuffer : accBuffer.subarray(0, n * F);
  acc.fill(0);
  for (let i = 0; i < n; i++) {
    const o = i * F;
    acc[o + BMINX] = acc[o + BMINY] = acc[o + BMINZ] = Infinity;
    acc[o + BMAXX] = acc[o + BMAXY] = acc[o + BMAXZ] = -Infinity;
  }
  return acc;
}

/**
 * Mass properties of every assembly, section, the loose parts, the machine and the total. See the module
 * comment for the rules.
 * Part-line ids are not checked for repeats (the database key guarantees them; a check costs more than the
 * whole computation at 100,000 lines).
 * @throws on structural errors that make the tree meaningless, naming the item: duplicate assembly, section or
 *   add-on ids, an assembly
 *   whose parent is unknown, a cycle of assemblies, an unknown section or assembly referenced by a line,
 *   assembly or add-on, or a margin that is not a finite percentage ≥ 0. Per-line data problems are gaps.
 */
export function massProperties(input: MassPropertiesInput): MassPropertiesResult {
  const { lines, assemblies } = input;
  const sections = input.sections ?? [];
  const addOns = input.addOns ?? [];
  const marginPercent = input.marginPercent ?? 0;
  if (!Number.isFinite(marginPercent) || marginPercent < 0) {
    throw new Error(`Contingency margin must be a finite percentage, 0 or more (got ${String(marginPercent)}).`);
  }

  // --- Index the tree.
  const A = assemblies.length;
  const S = sections.length;
  const asmIndex = new Map<string, number>();
  assemblies.forEach((a, i) => {
    if (asmIndex.has(a.id)) throw new Error(`Assembly "${a.label ?? a.id}": id "${a.id}" appears twice.`);
    asmIndex.set(a.id, i);
  });
  const secIndex = new Map<string, number>();
  sections.forEach((s, i) => {
    if (secIndex.has(s.id)) throw new Error(`Section "${s.label ?? s.id}": id "${s.id}" appears twice.`);
    secIndex.set(s.id, i);
  });
  const parent = new Int32Array(A).fill(-1);
  const ownSection = new Int32Array(A).fill(-1);
  assemblies.forEach((a, i) => {
    if (a.parentId != null) {
      const p = asmIndex.get(a.parentId);
      if (p === undefined) throw new Error(`Assembly "${a.label ?? a.id}": parent assembly "${a.parentId}" is not in the assembly list.`);
      parent[i] = p;
    }
    if (a.sectionId != null) {
      const s = secIndex.get(a.sectionId);
      if (s === undefined) throw new Error(`Assembly "${a.label ?? a.id}": section "${a.sectionId}" is not in the section list.`);
      ownSection[i] = s;
    }
  });
  // Depth and effective section, with cycle detection (0 = unvisited, 1 = on the current path, 2 = done).
  const depth = new Int32Array(A);
  const effSection = new Int32Array(A).fill(-1);
  const state = new Uint8Array(A);
  const path: number[] = [];
  for (let i = 0; i < A; i++) {
    if (state[i] === 2) continue;
    path.length = 0;
    let j = i;
    while (j !== -1 && state[j] !== 2) {
      if (state[j] === 1) {
        const cycle = path.slice(path.indexOf(j)).map((k) => assemblies[k].label ?? assemblies[k].id);
        throw new Error(`Assemblies form a cycle (${cycle.join(' → ')} → ${cycle[0]}): each must have a parent outside its own subtree.`);
      }
      state[j] = 1;
      path.push(j);
      j = parent[j];
    }
    for (let k = path.length - 1; k >= 0; k--) {
      const n = path[k];
      const p = parent[n];
      depth[n] = p === -1 ? 0 : depth[p] + 1;
      effSection[n] = ownSection[n] !== -1 ? ownSection[n] : p === -1 ? -1 : effSection[p];
      state[n] = 2;
    }
  }

  // Node rows: assemblies [0, A), sections [A, A+S), loose, machine, total.
  // Rows. Each line is added once, to its assembly's INH row (it inherits the assembly's section) or, when it
  // names its own section, to its assembly's OVR row and that section's row. Afterwards each INH row goes to
  // its assembly's section (or loose), then becomes the assembly's TREE row (INH += OVR, in place) and is
  // rolled up the tree; MACHINE = the lines without an assembly + the root assemblies, TOTAL = MACHINE +
  // add-ons. Assembly index A stands for "no assembly".
  const INH = 0, OVR = A + 1, TREE = INH, SEC = 2 * (A + 1);
  const LOOSE = SEC + S, MACHINE = LOOSE + 1, TOTAL = LOOSE + 2;
  const acc = emptyAcc(TOTAL + 1);
  const nodeRow = (i: number): number => (i < A ? TREE + i : i < A + S ? SEC + i - A : i - A - S + LOOSE);
  // Gap lists by logical node: assemblies [0, A), sections [A, A + S), loose, machine, total.
  const G_LOOSE = A + S, G_MACHINE = A + S + 1, G_TOTAL = A + S + 2;
  const nodeGaps: MassGap[][] = Array.from({ length: A + S + 3 }, () => []);
  const gaps: MassGap[] = [];
  const warnings: { id: string; message: string }[] = [];

  const recordGap = (gap: MassGap, asm: number, sec: number, inMachine: boolean): void => {
    gaps.push(gap);
    for (let j = asm; j !== -1; j = parent[j]) nodeGaps[j].push(gap);
    if (sec !== -1) nodeGaps[A + sec].push(gap);
    else if (inMachine) nodeGaps[G_LOOSE].push(gap);
    if (inMachine) nodeGaps[G_MACHINE].push(gap);
    nodeGaps[G_TOTAL].push(gap);
  };

  // --- Part lines.
  for (let li = 0; li < lines.length; li++) {
    const line: MassPartLine = lines[li];
    const label = line.label ?? line.id;
    let asm = -1;
    if (line.assemblyId != null) {
      const a = asmIndex.get(line.assemblyId);
      if (a === undefined) throw new Error(`Part line "${label}": assembly "${line.assemblyId}" is not in the assembly list.`);
      asm = a;
    }
    let sec = asm === -1 ? -1 : effSection[asm];
    if (line.sectionId != null) {
      const s = secIndex.get(line.sectionId);
      if (s === undefined) throw new Error(`Part line "${label}": section "${line.sectionId}" is not in the section list.`);
      sec = s;
    }

    // Gaps: everything that stops the line being counted. The common, valid case is checked without
    // allocating; the reasons are spelt out only for a line that fails.
    const q = line.quantity;
    const m = line.unitMassKg;
    const inst = line.instances && line.instances.length > 0 ? line.instances : null;
    const reasons = lineGapReasons(line, q, m, inst);
    if (reasons !== null) {
      recordGap({ lineId: line.id, label, kind: 'line', assemblyId: line.assemblyId ?? null, sectionId: sec === -1 ? null : sections[sec].id, reasons }, asm, sec, true);
      continue;
    }

    const unitMass = m as number;
    const c = line.cogMm as Vec3;
    let box: Box3 | null = null;
    if (line.bboxMm != null) {
      if (isBox(line.bboxMm)) box = line.bboxMm;
      else warnings.push({ id: line.id, message: `Part line "${label}": bounding box ignored (needs finite min ≤ max on each axis, mm).` });
    }
    let hasOwn = false;
    if (line.inertiaKgMm2 != null) {
      if (isFiniteTensor(line.inertiaKgMm2)) hasOwn = true;
      else warnings.push({ id: line.id, message: `Part line "${label}": inertia ignored (needs a 3×3 of finite numbers, kg·mm²).` });
    }
    const kind = unitInertia(line, unitMass, box, hasOwn);

    // Common case: straight into the assembly's INH row. A line with its own section: into scratch, then
    // into its assembly's OVR row and the section's row.
    const own = line.sectionId != null;
    const asmSlot = asm !== -1 ? asm : A;
    let d: Float64Array = acc;
    let o = (INH + asmSlot) * F;
    if (own) {
      resetTmp();
      d = tmp;
      o = 0;
    }
    if (!inst) {
      if (box) setWorldBox(box, 0, 0, 0);
      addUnits(d, o, q, unitMass, c[0], c[1], c[2], ownInertia, box ? worldBox : null);
      if (q > 1) {
        d[o + APPROX_LINES] += 1;
        d[o + APPROX_KG] += q * unitMass;
      }
    } else {
      for (let k = 0; k < inst.length; k++) {
        const p = inst[k].positionMm;
        const e = inst[k].eulerZyxDeg;
        if (!e || (e[0] === 0 && e[1] === 0 && e[2] === 0)) {
          if (box) setWorldBox(box, p[0], p[1], p[2]);
          addUnits(d, o, 1, unitMass, c[0] + p[0], c[1] + p[1], c[2] + p[2], ownInertia, box ? worldBox : null);
        } else {
          setRotation(e);
          rotateOwnInertia();
          if (box) transformBox(box, p);
          addUnits(
            d,
            o,
            1,
            unitMass,
            R9[0] * c[0] + R9[1] * c[1] + R9[2] * c[2] + p[0],
            R9[3] * c[0] + R9[4] * c[1] + R9[5] * c[2] + p[1],
            R9[6] * c[0] + R9[7] * c[1] + R9[8] * c[2] + p[2],
            rotInertia,
            box ? worldBox : null,
          );
        }
      }
    }
    d[o + sourceSlot(line.massSource)] += q * unitMass;
    d[o + LINES] += 1;
    d[o + UNITS] += q;
    if (kind === 'cuboid') {
      d[o + ASSUMED_LINES] += 1;
    } else if (kind === 'point') {
      d[o + POINT_LINES] += 1;
    }
    if (own) {
      addRow(acc, OVR + asmSlot, tmp);
      addRow(acc, SEC + sec, tmp);
    }
  }

  // --- Sections and loose from the INH rows; then TREE = INH + OVR.
  for (let i = 0; i <= A; i++) {
    const s = i < A ? effSection[i] : -1;
    addRow(acc, s !== -1 ? SEC + s : LOOSE, acc, INH + i);
    addRow(acc, TREE + i, acc, OVR + i); // INH becomes TREE
  }

  // --- Roll assemblies up, deepest first, so each parent receives its finished children.
  const order = Array.from({ length: A }, (_, i) => i).sort((a, b) => depth[b] - depth[a]);
  for (const i of order) if (parent[i] !== -1) addRow(acc, TREE + parent[i], acc, TREE + i);
  addRow(acc, MACHINE, acc, TREE + A);
  for (let i = 0; i < A; i++) if (parent[i] === -1) addRow(acc, MACHINE, acc, TREE + i);
  addRow(acc, TOTAL, acc, MACHINE);

  // --- Add-ons: their section and the total.
  const addOnIds = new Set<string>();
  for (const ad of addOns as MassAddOn[]) {
    const label = ad.label ?? ad.id;
    if (addOnIds.has(ad.id)) throw new Error(`Add-on "${label}": id "${ad.id}" appears twice.`);
    addOnIds.add(ad.id);
    const sec = secIndex.get(ad.sectionId);
    if (sec === undefined) throw new Error(`Add-on "${label}": section "${ad.sectionId}" is not in the section list.`);
    const reasons: string[] = [];
    if (ad.massKg === null || ad.massKg === undefined) reasons.push('no mass');
    else if (!Number.isFinite(ad.massKg) || ad.massKg < 0) reasons.push(`mass must be a finite number of kg, 0 or more (got ${String(ad.massKg)})`);
    if (ad.cogMm === null || ad.cogMm === undefined) reasons.push('no position (CoG)');
    else if (!isVec3(ad.cogMm)) reasons.push('CoG must be three finite numbers in mm');
    if (reasons.length > 0) {
      recordGap({ lineId: ad.id, label, kind: 'addOn', assemblyId: null, sectionId: ad.sectionId, reasons }, -1, sec, false);
      continue;
    }
    let box: Box3 | null = null;
    if (ad.bboxMm != null) {
      if (isBox(ad.bboxMm)) box = ad.bboxMm;
      else warnings.push({ id: ad.id, message: `Add-on "${label}": bounding box ignored (needs finite min ≤ max on each axis, mm).` });
    }
    let hasOwn = false;
    if (ad.inertiaKgMm2 != null) {
      if (isFiniteTensor(ad.inertiaKgMm2)) hasOwn = true;
      else warnings.push({ id: ad.id, message: `Add-on "${label}": inertia ignored (needs a 3×3 of finite numbers, kg·mm²).` });
    }
    const mass = ad.massKg as number;
    unitInertia(ad, mass, box, hasOwn);
    resetTmp();
    const c = ad.cogMm as Vec3;
    if (box) setWorldBox(box, 0, 0, 0);
    addUnits(tmp, 0, 1, mass, c[0], c[1], c[2], ownInertia, box ? worldBox : null);
    tmp[sourceSlot(ad.massSource)] += mass;
    tmp[ADDONS] = 1;
    addRow(acc, SEC + sec, tmp);
    addRow(acc, TOTAL, tmp);
  }

  // --- Results.
  const k = 1 + marginPercent / 100;
  const node = (g: number, id: string, kind: NodeMassProperties['kind']): NodeMassProperties => {
    const row = nodeRow(g);
    const o = row * F;
    const m = acc[o + M];
    let cog: Vec3 | null = null;
    let inertia: InertiaTensor | null = null;
    if (m > 0) {
      const cx = acc[o + MX] / m, cy = acc[o + MY] / m, cz = acc[o + MZ] / m;
      cog = [cx, cy, cz];
      // Parallel-axis theorem, from the origin back to the CoG: I_cg = I_O − m(|c|²E − ccᵀ).
      const xy = acc[o + IXY] + m * cx * cy, yz = acc[o + IYZ] + m * cy * cz, zx = acc[o + IZX] + m * cz * cx;
      inertia = [
        [acc[o + IXX] - m * (cy * cy + cz * cz), xy, zx],
        [xy, acc[o + IYY] - m * (cx * cx + cz * cz), yz],
        [zx, yz, acc[o + IZZ] - m * (cx * cx + cy * cy)],
      ];
    }
    const hasBox = acc[o + BMINX] <= acc[o + BMAXX];
    const w = acc[o + KG_WEIGHED], ca = acc[o + KG_CATALOGUE], cad = acc[o + KG_CAD], est = acc[o + KG_ESTIMATED];
    const toPct = m > 0 ? 100 / m : 0;
    const gl = nodeGaps[g];
    return {
      id,
      kind,
      massKg: m,
      massWithMarginKg: m * k,
      cogMm: cog,
      bboxMm: hasBox ? { minMm: [acc[o + BMINX], acc[o + BMINY], acc[o + BMINZ]], maxMm: [acc[o + BMAXX], acc[o + BMAXY], acc[o + BMAXZ]] } : null,
      inertiaKgMm2: inertia,
      confidence: {
        weighedKg: w,
        catalogueKg: ca,
        cadKg: cad,
        estimatedKg: est,
        weighedOrCatalogueKg: w + ca,
        weighedOrCataloguePercent: (w + ca) * toPct,
        cadPercent: cad * toPct,
        estimatedPercent: est * toPct,
      },
      lineCount: acc[o + LINES],
      unitCount: acc[o + UNITS],
      addOnCount: acc[o + ADDONS],
      gaps: gl,
      complete: gl.length === 0,
      approximateLineCount: acc[o + APPROX_LINES],
      approximateMassKg: acc[o + APPROX_KG],
      assumedInertiaLineCount: acc[o + ASSUMED_LINES],
      pointMassLineCount: acc[o + POINT_LINES],
    };
  };
  const assemblyOut: Record<string, NodeMassProperties> = {};
  assemblies.forEach((a, i) => (assemblyOut[a.id] = node(i, a.id, 'assembly')));
  const sectionOut: Record<string, NodeMassProperties> = {};
  sections.forEach((s, i) => (sectionOut[s.id] = node(A + i, s.id, 'section')));
  return {
    marginPercent,
    assemblies: assemblyOut,
    sections: sectionOut,
    loose: node(G_LOOSE, 'loose', 'loose'),
    machine: node(G_MACHINE, 'machine', 'machine'),
    total: node(G_TOTAL, 'total', 'total'),
    gaps,
    warnings,
  };
}
