import type { Vec3 } from '../geometry/vec3.ts';
import type { Box3 } from '../geometry/box.ts';
import type { MassAddOn, MassPartLine, MassPropertiesInput, MassSource } from '../contracts/mass.ts';
import { isFiniteTensor, type InertiaTensor } from './inertia.ts';
import { rotationFromEulerZyxDeg, type Mat3 } from './rotation.ts';

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
  /** Union of the counted units' boxes; null when none has a box. */
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
  /** Every gap once. */
  gaps: MassGap[];
  approximateLineIds: string[];
  assumedInertiaLineIds: string[];
  pointMassLineIds: string[];
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

const SOURCE_SLOT: Record<MassSource, number> = { weighed: KG_WEIGHED, catalogue: KG_CATALOGUE, cad: KG_CAD, estimated: KG_ESTIMATED };

function isVec3(v: unknown): v is Vec3 {
  return Array.isArray(v) && v.length === 3 && Number.isFinite(v[0]) && Number.isFinite(v[1]) && Number.isFinite(v[2]);
}
function isBox(b: unknown): b is Box3 {
  if (!b || typeof b !== 'object') return false;
  const { minMm, maxMm } = b as Box3;
  return isVec3(minMm) && isVec3(maxMm) && minMm[0] <= maxMm[0] && minMm[1] <= maxMm[1] && minMm[2] <= maxMm[2];
}

/** Scratch contribution of one line or add-on, reused to avoid allocating per line. */
const tmp = new Float64Array(F);

function resetTmp(): void {
  tmp.fill(0);
  tmp[BMINX] = tmp[BMINY] = tmp[BMINZ] = Infinity;
  tmp[BMAXX] = tmp[BMAXY] = tmp[BMAXZ] = -Infinity;
}

/**
 * Adds to `tmp` q units of mass m at CoG c (world), own inertia `ii` (world axes, about c; 6 numbers
 * xx yy zz xy yz zx in tensor form, per unit) and world box.
 */
function addUnits(q: number, m: number, cx: number, cy: number, cz: number, ii: ArrayLike<number> | null, box: ArrayLike<number> | null): void {
  if (q === 0) return; // no units: no mass and no extent
  const mt = q * m;
  tmp[M] += mt;
  tmp[MX] += mt * cx;
  tmp[MY] += mt * cy;
  tmp[MZ] += mt * cz;
  // Parallel-axis term about the origin, m(|c|²E − ccᵀ), plus q × own inertia.
  tmp[IXX] += mt * (cy * cy + cz * cz);
  tmp[IYY] += mt * (cx * cx + cz * cz);
  tmp[IZZ] += mt * (cx * cx + cy * cy);
  tmp[IXY] -= mt * cx * cy;
  tmp[IYZ] -= mt * cy * cz;
  tmp[IZX] -= mt * cz * cx;
  if (ii) {
    tmp[IXX] += q * ii[0];
    tmp[IYY] += q * ii[1];
    tmp[IZZ] += q * ii[2];
    tmp[IXY] += q * ii[3];
    tmp[IYZ] += q * ii[4];
    tmp[IZX] += q * ii[5];
  }
  if (box) {
    if (box[0] < tmp[BMINX]) tmp[BMINX] = box[0];
    if (box[1] < tmp[BMINY]) tmp[BMINY] = box[1];
    if (box[2] < tmp[BMINZ]) tmp[BMINZ] = box[2];
    if (box[3] > tmp[BMAXX]) tmp[BMAXX] = box[3];
    if (box[4] > tmp[BMAXY]) tmp[BMAXY] = box[4];
    if (box[5] > tmp[BMAXZ]) tmp[BMAXZ] = box[5];
  }
}

function addRow(acc: Float64Array, node: number, src: Float64Array, srcRow = 0): void {
  const o = node * F;
  const s = srcRow * F;
  for (let k = 0; k < F; k++) {
    if (k >= BMINX && k <= BMINZ) acc[o + k] = Math.min(acc[o + k], src[s + k]);
    else if (k >= BMAXX && k <= BMAXZ) acc[o + k] = Math.max(acc[o + k], src[s + k]);
    else acc[o + k] += src[s + k];
  }
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
/** rotInertia = R I Rᵀ for I in ownInertia (symmetric, 6 components). */
function rotateOwnInertia(r: Mat3): void {
  const I = [
    [ownInertia[0], ownInertia[3], ownInertia[5]],
    [ownInertia[3], ownInertia[1], ownInertia[4]],
    [ownInertia[5], ownInertia[4], ownInertia[2]],
  ];
  const out = (i: number, j: number): number => {
    let s = 0;
    for (let k = 0; k < 3; k++) {
      const rik = r[i][k];
      if (rik === 0) continue;
      for (let l = 0; l < 3; l++) s += rik * I[k][l] * r[j][l];
    }
    return s;
  };
  rotInertia[0] = out(0, 0);
  rotInertia[1] = out(1, 1);
  rotInertia[2] = out(2, 2);
  rotInertia[3] = out(0, 1);
  rotInertia[4] = out(1, 2);
  rotInertia[5] = out(2, 0);
}

/** worldBox = axis-aligned box around the local box turned by R and moved by p (centre and |R|·half size). */
function transformBox(box: Box3, r: Mat3, p: Vec3): void {
  const c = [(box.minMm[0] + box.maxMm[0]) / 2, (box.minMm[1] + box.maxMm[1]) / 2, (box.minMm[2] + box.maxMm[2]) / 2];
  const h = [(box.maxMm[0] - box.minMm[0]) / 2, (box.maxMm[1] - box.minMm[1]) / 2, (box.maxMm[2] - box.minMm[2]) / 2];
  for (let i = 0; i < 3; i++) {
    const ci = r[i][0] * c[0] + r[i][1] * c[1] + r[i][2] * c[2] + p[i];
    const hi = Math.abs(r[i][0]) * h[0] + Math.abs(r[i][1]) * h[1] + Math.abs(r[i][2]) * h[2];
    worldBox[i] = ci - hi;
    worldBox[i + 3] = ci + hi;
  }
}

function emptyAcc(n: number): Float64Array {
  const acc = new Float64Array(n * F);
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
 * @throws on structural errors that make the tree meaningless, naming the item: duplicate ids, an assembly
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
  const LOOSE = A + S, MACHINE = A + S + 1, TOTAL = A + S + 2;
  const acc = emptyAcc(A + S + 3);
  const nodeGaps: MassGap[][] = Array.from({ length: A + S + 3 }, () => []);
  const gaps: MassGap[] = [];
  const approximateLineIds: string[] = [];
  const assumedInertiaLineIds: string[] = [];
  const pointMassLineIds: string[] = [];
  const warnings: { id: string; message: string }[] = [];
  const lineIds = new Set<string>();

  const recordGap = (gap: MassGap, asm: number, sec: number, inMachine: boolean): void => {
    gaps.push(gap);
    for (let j = asm; j !== -1; j = parent[j]) nodeGaps[j].push(gap);
    if (sec !== -1) nodeGaps[A + sec].push(gap);
    else if (inMachine) nodeGaps[LOOSE].push(gap);
    if (inMachine) nodeGaps[MACHINE].push(gap);
    nodeGaps[TOTAL].push(gap);
  };

  // --- Part lines.
  for (let li = 0; li < lines.length; li++) {
    const line: MassPartLine = lines[li];
    const label = line.label ?? line.id;
    if (lineIds.has(line.id)) throw new Error(`Part line "${label}": id "${line.id}" appears twice.`);
    lineIds.add(line.id);
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

    // Gaps: everything that stops the line being counted, all reasons at once.
    const reasons: string[] = [];
    const q = line.quantity;
    const m = line.unitMassKg;
    if (!Number.isFinite(q) || q < 0) reasons.push(`quantity must be a finite number, 0 or more (got ${String(q)})`);
    if (m === null || m === undefined) reasons.push('no mass');
    else if (!Number.isFinite(m) || m < 0) reasons.push(`mass must be a finite number of kg, 0 or more (got ${String(m)})`);
    if (line.cogMm === null || line.cogMm === undefined) reasons.push('no position (CoG)');
    else if (!isVec3(line.cogMm)) reasons.push('CoG must be three finite numbers in mm');
    const inst = line.instances && line.instances.length > 0 ? line.instances : null;
    if (inst) {
      if (Number.isFinite(q) && q !== inst.length) reasons.push(`quantity is ${q} but ${inst.length} instances are placed`);
      inst.forEach((it, k) => {
        if (!isVec3(it.positionMm)) reasons.push(`instance ${k + 1}: position must be three finite numbers in mm`);
        if (it.eulerZyxDeg !== undefined && !isVec3(it.eulerZyxDeg)) reasons.push(`instance ${k + 1}: rotation must be three finite angles in degrees`);
      });
    }
    if (reasons.length > 0) {
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

    resetTmp();
    if (!inst) {
      const bx = box ? [box.minMm[0], box.minMm[1], box.minMm[2], box.maxMm[0], box.maxMm[1], box.maxMm[2]] : null;
      addUnits(q, unitMass, c[0], c[1], c[2], ownInertia, bx);
      if (q > 1) {
        tmp[APPROX_LINES] = 1;
        tmp[APPROX_KG] = q * unitMass;
        approximateLineIds.push(line.id);
      }
    } else {
      for (const it of inst) {
        const p = it.positionMm;
        const e = it.eulerZyxDeg;
        if (!e || (e[0] === 0 && e[1] === 0 && e[2] === 0)) {
          const bx = box ? [box.minMm[0] + p[0], box.minMm[1] + p[1], box.minMm[2] + p[2], box.maxMm[0] + p[0], box.maxMm[1] + p[1], box.maxMm[2] + p[2]] : null;
          addUnits(1, unitMass, c[0] + p[0], c[1] + p[1], c[2] + p[2], ownInertia, bx);
        } else {
          const r = rotationFromEulerZyxDeg(e);
          rotateOwnInertia(r);
          if (box) transformBox(box, r, p);
          addUnits(
            1,
            unitMass,
            r[0][0] * c[0] + r[0][1] * c[1] + r[0][2] * c[2] + p[0],
            r[1][0] * c[0] + r[1][1] * c[1] + r[1][2] * c[2] + p[1],
            r[2][0] * c[0] + r[2][1] * c[1] + r[2][2] * c[2] + p[2],
            rotInertia,
            box ? worldBox : null,
          );
        }
      }
    }
    const massTotal = q * unitMass;
    tmp[SOURCE_SLOT[line.massSource ?? 'estimated'] ?? KG_ESTIMATED] += massTotal;
    tmp[LINES] = 1;
    tmp[UNITS] = q;
    if (kind === 'cuboid') {
      tmp[ASSUMED_LINES] = 1;
      assumedInertiaLineIds.push(line.id);
    } else if (kind === 'point') {
      tmp[POINT_LINES] = 1;
      pointMassLineIds.push(line.id);
    }
    if (asm !== -1) addRow(acc, asm, tmp);
    addRow(acc, sec !== -1 ? A + sec : LOOSE, tmp);
    addRow(acc, MACHINE, tmp);
    addRow(acc, TOTAL, tmp);
  }

  // --- Roll assemblies up, deepest first, so each parent receives its finished children.
  const order = Array.from({ length: A }, (_, i) => i).sort((a, b) => depth[b] - depth[a]);
  for (const i of order) if (parent[i] !== -1) addRow(acc, parent[i], acc, i);

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
    addUnits(1, mass, c[0], c[1], c[2], ownInertia, box ? [...box.minMm, ...box.maxMm] : null);
    tmp[SOURCE_SLOT[ad.massSource ?? 'estimated'] ?? KG_ESTIMATED] += mass;
    tmp[ADDONS] = 1;
    addRow(acc, A + sec, tmp);
    addRow(acc, TOTAL, tmp);
  }

  // --- Results.
  const k = 1 + marginPercent / 100;
  const node = (row: number, id: string, kind: NodeMassProperties['kind']): NodeMassProperties => {
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
    const pct = (v: number): number => (m > 0 ? (v / m) * 100 : 0);
    const g = nodeGaps[row];
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
        weighedOrCataloguePercent: pct(w + ca),
        cadPercent: pct(cad),
        estimatedPercent: pct(est),
      },
      lineCount: acc[o + LINES],
      unitCount: acc[o + UNITS],
      addOnCount: acc[o + ADDONS],
      gaps: g,
      complete: g.length === 0,
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
    loose: node(LOOSE, 'loose', 'loose'),
    machine: node(MACHINE, 'machine', 'machine'),
    total: node(TOTAL, 'total', 'total'),
    gaps,
    approximateLineIds,
    assumedInertiaLineIds,
    pointMassLineIds,
    warnings,
  };
}
