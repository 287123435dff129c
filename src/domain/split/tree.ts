/**
 * The assembly tree with mass aggregates, and the units a section is made of.
 */
import type { SectionUnit, SplitAssembly, SplitPart, Vec3Tuple } from './types.ts';

/** Mass, first moments and extent of a set of parts. */
export interface Agg {
  massKg: number;
  mx: number;
  my: number;
  mz: number;
  min: Vec3Tuple;
  max: Vec3Tuple;
  partCount: number;
}

export function emptyAgg(): Agg {
  return { massKg: 0, mx: 0, my: 0, mz: 0, min: [Infinity, Infinity, Infinity], max: [-Infinity, -Infinity, -Infinity], partCount: 0 };
}

export function addAgg(a: Agg, b: Agg): Agg {
  return {
    massKg: a.massKg + b.massKg,
    mx: a.mx + b.mx,
    my: a.my + b.my,
    mz: a.mz + b.mz,
    min: [Math.min(a.min[0], b.min[0]), Math.min(a.min[1], b.min[1]), Math.min(a.min[2], b.min[2])],
    max: [Math.max(a.max[0], b.max[0]), Math.max(a.max[1], b.max[1]), Math.max(a.max[2], b.max[2])],
    partCount: a.partCount + b.partCount,
  };
}

export function aggSize(a: Agg): Vec3Tuple {
  return a.partCount === 0 ? [0, 0, 0] : [a.max[0] - a.min[0], a.max[1] - a.min[1], a.max[2] - a.min[2]];
}

export function aggCog(a: Agg): Vec3Tuple {
  return a.massKg > 0 ? [a.mx / a.massKg, a.my / a.massKg, a.mz / a.massKg] : [(a.min[0] + a.max[0]) / 2, (a.min[1] + a.max[1]) / 2, (a.min[2] + a.max[2]) / 2];
}

export interface TreeNode {
  id: string;
  parentId: string | null;
  keepTogether: boolean;
  adjacentOnly: boolean;
  children: TreeNode[];
  own: Agg;
  subtree: Agg;
}

export interface Unit extends SectionUnit {
  key: string;
  agg: Agg;
  adjacentOnly: boolean;
}

export interface Tree {
  roots: TreeNode[];
  byId: Map<string, TreeNode>;
  /** Problems with the input, each naming the row. */
  problems: string[];
}

/** Builds the tree, checking ids, parents, cycles and part rows. */
export function buildTree(assemblies: readonly SplitAssembly[], parts: readonly SplitPart[]): Tree {
  const problems: string[] = [];
  const byId = new Map<string, TreeNode>();
  for (const a of assemblies) {
    if (byId.has(a.id)) problems.push(`Assembly ${a.id}: listed twice.`);
    byId.set(a.id, { id: a.id, parentId: a.parentId, keepTogether: a.keepTogether, adjacentOnly: !!a.adjacentOnly, children: [], own: emptyAgg(), subtree: emptyAgg() });
  }
  const roots: TreeNode[] = [];
  for (const a of assemblies) {
    const n = byId.get(a.id) as TreeNode;
    if (a.parentId === null) roots.push(n);
    else {
      const p = byId.get(a.parentId);
      if (!p) problems.push(`Assembly ${a.id}: parent ${a.parentId} is not in the list.`);
      else p.children.push(n);
    }
  }
  parts.forEach((p, i) => {
    const n = byId.get(p.assemblyId);
    if (!n) {
      problems.push(`Part row ${i + 1}: assembly ${p.assemblyId} is not in the list.`);
      return;
    }
    const ok = Number.isFinite(p.massKg) && p.massKg >= 0 && [...p.cogMm, ...p.bboxMinMm, ...p.bboxMaxMm].every(Number.isFinite) && p.bboxMinMm.every((v, k) => v <= p.bboxMaxMm[k]);
    if (!ok) {
      problems.push(`Part row ${i + 1} (${p.assemblyId}): mass must be ≥ 0 and CoG and box finite with min ≤ max.`);
      return;
    }
    n.own = addAgg(n.own, {
      massKg: p.massKg,
      mx: p.massKg * p.cogMm[0],
      my: p.massKg * p.cogMm[1],
      mz: p.massKg * p.cogMm[2],
      min: [...p.bboxMinMm] as Vec3Tuple,
      max: [...p.bboxMaxMm] as Vec3Tuple,
      partCount: 1,
    });
  });
  // Subtree aggregates, post-order, with a cycle guard.
  const state = new Map<string, 1 | 2>();
  const visit = (n: TreeNode): Agg => {
    if (state.get(n.id) === 2) return n.subtree;
    if (state.get(n.id) === 1) {
      problems.push(`Assembly ${n.id}: the tree has a cycle.`);
      return emptyAgg();
    }
    state.set(n.id, 1);
    let s = n.own;
    for (const c of n.children) s = addAgg(s, visit(c));
    n.subtree = s;
    state.set(n.id, 2);
    return s;
  };
  roots.forEach(visit);
  for (const n of byId.values()) if (!state.has(n.id)) problems.push(`Assembly ${n.id}: not reachable from a root (cycle).`);
  // Deterministic child order.
  for (const n of byId.values()) n.children.sort((a, b) => (a.id < b.id ? -1 : a.id > b.id ? 1 : 0));
  roots.sort((a, b) => (a.id < b.id ? -1 : a.id > b.id ? 1 : 0));
  return { roots, byId, problems };
}

export function wholeUnit(n: TreeNode): Unit {
  return { key: n.id, assemblyId: n.id, scope: 'whole', agg: n.subtree, adjacentOnly: n.adjacentOnly };
}
export function ownUnit(n: TreeNode): Unit {
  return { key: `${n.id}#own`, assemblyId: n.id, scope: 'own-parts', agg: n.own, adjacentOnly: n.adjacentOnly };
}

/** A node may be divided into its children (and its own parts) when it is not kept together and has children. */
export function divisible(n: TreeNode): boolean {
  return !n.keepTogether && n.children.length > 0;
}

/** The units of dividing a node once: its non-empty children whole, and its own parts if any. */
export function divide(n: TreeNode): Unit[] {
  const out: Unit[] = [];
  if (n.own.partCount > 0) out.push(ownUnit(n));
  for (const c of n.children) if (c.subtree.partCount > 0) out.push(wholeUnit(c));
  return out;
}
