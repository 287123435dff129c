/**
 * Exhaustive search for small machines: every way to divide the tree (every frontier of whole and
 * divided assemblies) × every partition of its units into sections, keeping the best proposals. Used
 * when the fully divided tree has few units, so the answer is proven best by enumeration.
 */
import { type Adjacency, aggWithinLimits } from './evaluate.ts';
import type { ProposalPool } from './pool.ts';
import { addAgg, divide, divisible, emptyAgg, wholeUnit, type Agg, type TreeNode, type Unit } from './tree.ts';
import type { SplitLimits } from './types.ts';

/** Number of units when every dividable assembly is divided all the way. */
export function fullDivisionUnitCount(n: TreeNode): number {
  if (!divisible(n)) return n.subtree.partCount > 0 ? 1 : 0;
  return (n.own.partCount > 0 ? 1 : 0) + n.children.reduce((s, c) => s + fullDivisionUnitCount(c), 0);
}

/** Every frontier of a node: whole, or (if dividable) its own parts plus a frontier of each child. */
export function frontiers(n: TreeNode, cap: number): Unit[][] | undefined {
  if (n.subtree.partCount === 0) return [[]];
  const out: Unit[][] = [[wholeUnit(n)]];
  if (!divisible(n)) return out;
  let combos: Unit[][] = [divide(n).filter((u) => u.scope === 'own-parts')];
  for (const c of n.children) {
    const fc = frontiers(c, cap);
    if (!fc) return undefined;
    const next: Unit[][] = [];
    for (const a of combos) for (const b of fc) next.push([...a, ...b]);
    if (next.length > cap) return undefined;
    combos = next;
  }
  out.push(...combos);
  return out.length > cap ? undefined : out;
}

export function frontiersOfRoots(roots: readonly TreeNode[], cap: number): Unit[][] | undefined {
  let combos: Unit[][] = [[]];
  for (const r of roots) {
    const fr = frontiers(r, cap);
    if (!fr) return undefined;
    const next: Unit[][] = [];
    for (const a of combos) for (const b of fr) next.push([...a, ...b]);
    if (next.length > cap) return undefined;
    combos = next;
  }
  return combos;
}

/** Enumerates partitions of `units` into sections within the limits, offering each to the pool. */
export function enumeratePartitions(units: readonly Unit[], limits: SplitLimits, adjacency: Adjacency, pool: ProposalPool): void {
  const sections: Unit[][] = [];
  const aggs: Agg[] = [];
  const maxSections = limits.maxSections ?? Infinity;
  const rec = (i: number) => {
    if (sections.length > maxSections) return;
    const w = pool.worst();
    if (w && sections.length > w.sections) return; // more sections than the worst kept: cannot enter
    if (i === units.length) {
      if (sections.every((s) => adjacency.sectionOk(s))) pool.offer(sections);
      return;
    }
    const u = units[i];
    for (let k = 0; k < sections.length; k++) {
      const a = addAgg(aggs[k], u.agg);
      if (!aggWithinLimits(a, limits)) continue;
      const prev = aggs[k];
      sections[k].push(u);
      aggs[k] = a;
      rec(i + 1);
      sections[k].pop();
      aggs[k] = prev;
    }
    const a = addAgg(emptyAgg(), u.agg);
    if (!aggWithinLimits(a, limits)) return;
    sections.push([u]);
    aggs.push(a);
    rec(i + 1);
    sections.pop();
    aggs.pop();
  };
  rec(0);
}
