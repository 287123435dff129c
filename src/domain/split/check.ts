/**
 * Checks a split the planner made by hand (or edited from a proposal) with the same rules the advisor
 * searches under: every part in exactly one section, no keep-together assembly divided, each section
 * within the mass and size limits, adjacent-only assemblies only with their neighbours. The client runs
 * it on every edit for the live checks; the server runs it again before it saves an adoption.
 */
import { fitsInAnyOrientation } from '../geometry/box.ts';
import { Adjacency, aggWithinLimits } from './evaluate.ts';
import { addAgg, aggCog, aggSize, buildTree, emptyAgg, ownUnit, wholeUnit, type Agg, type TreeNode, type Unit } from './tree.ts';
import type { SectionUnit, SplitAssembly, SplitLimits, SplitPart, Vec3Tuple } from './types.ts';

/** One section of a checked split, with each limit and its margin (negative: over). */
export interface CheckedSection {
  units: SectionUnit[];
  massKg: number;
  cogMm: Vec3Tuple;
  sizeMm: Vec3Tuple;
  /** limit − mass, kg. */
  massMarginKg: number;
  /** Sorted limit − sorted size, largest to smallest, mm; absent without a size limit. */
  sizeMarginMm?: Vec3Tuple;
  withinLimits: boolean;
  /** Each problem names the section and the limit. */
  problems: string[];
}

export interface SplitCheck {
  ok: boolean;
  sections: CheckedSection[];
  /** Problems of the split as a whole: parts not placed or placed twice, keep-together divided, too many sections. */
  problems: string[];
}

export interface SplitCheckInput {
  assemblies: SplitAssembly[];
  parts: SplitPart[];
  limits: SplitLimits;
  adjacency?: [string, string][];
}

function ancestors(n: TreeNode, byId: Map<string, TreeNode>): TreeNode[] {
  const out: TreeNode[] = [];
  let p = n.parentId ? byId.get(n.parentId) : undefined;
  while (p && out.length <= byId.size) {
    out.push(p);
    p = p.parentId ? byId.get(p.parentId) : undefined;
  }
  return out;
}

/**
 * Checks `sections` (each a list of units: an assembly whole, or only the parts hung directly on it)
 * against the limits. Sections are named S1, S2 … in the order given.
 */
export function checkSplit(input: SplitCheckInput, sections: readonly (readonly SectionUnit[])[]): SplitCheck {
  const tree = buildTree(input.assemblies, input.parts);
  const problems: string[] = [...tree.problems];
  const adj = new Adjacency(input.adjacency, (id) => tree.byId.get(id)?.parentId ?? null);
  const limits = input.limits;

  // How many times each assembly's own parts are covered.
  const covered = new Map<string, number>();
  const cover = (n: TreeNode, deep: boolean) => {
    covered.set(n.id, (covered.get(n.id) ?? 0) + 1);
    if (deep) for (const c of n.children) cover(c, true);
  };
  const checked: CheckedSection[] = sections.map((units, k) => {
    const name = `Section S${k + 1}`;
    const own: string[] = [];
    const resolved: Unit[] = [];
    for (const u of units) {
      const n = tree.byId.get(u.assemblyId);
      if (!n) {
        own.push(`${name}: assembly ${u.assemblyId} is not in the machine.`);
        continue;
      }
      const divided = u.scope === 'own-parts' && n.children.length > 0 ? [n] : [];
      for (const a of [...divided, ...ancestors(n, tree.byId)]) {
        if (a.keepTogether) own.push(`${name}: assembly ${a.id} must travel whole but is divided (${u.scope === 'whole' ? `${u.assemblyId} travels apart from it` : `only its own parts are here`}).`);
      }
      cover(n, u.scope === 'whole');
      resolved.push(u.scope === 'whole' ? wholeUnit(n) : ownUnit(n));
    }
    let agg: Agg = emptyAgg();
    for (const u of resolved) agg = addAgg(agg, u.agg);
    const size = aggSize(agg);
    const massMarginKg = limits.maxSectionMassKg - agg.massKg;
    let sizeMarginMm: Vec3Tuple | undefined;
    if (limits.maxSectionSizeMm) {
      const s = [...size].sort((a, b) => b - a);
      const l = [...limits.maxSectionSizeMm].sort((a, b) => b - a);
      sizeMarginMm = [l[0] - s[0], l[1] - s[1], l[2] - s[2]];
    }
    const within = resolved.length === 0 || aggWithinLimits(agg, limits);
    if (!within) {
      if (massMarginKg < -1e-9 * limits.maxSectionMassKg) own.push(`${name}: mass ${agg.massKg.toFixed(1)} kg is ${(-massMarginKg).toFixed(1)} kg over the ${limits.maxSectionMassKg.toFixed(1)} kg limit.`);
      if (limits.maxSectionSizeMm && !fitsInAnyOrientation(size, limits.maxSectionSizeMm)) {
        own.push(`${name}: size ${size.map((v) => Math.round(v)).join(' × ')} mm does not fit ${limits.maxSectionSizeMm.map((v) => Math.round(v)).join(' × ')} mm in any orientation.`);
      }
    }
    if (resolved.length === 0) own.push(`${name}: empty.`);
    if (!adj.sectionOk(resolved)) own.push(`${name}: holds an adjacent-only assembly with units it does not touch.`);
    problems.push(...own);
    return { units: units.map((u) => ({ assemblyId: u.assemblyId, scope: u.scope })), massKg: agg.massKg, cogMm: aggCog(agg), sizeMm: size, massMarginKg, sizeMarginMm, withinLimits: within, problems: own };
  });

  for (const n of tree.byId.values()) {
    if (n.own.partCount === 0) continue;
    const c = covered.get(n.id) ?? 0;
    if (c === 0) problems.push(`The parts of assembly ${n.id} are in no section.`);
    else if (c > 1) problems.push(`The parts of assembly ${n.id} are in ${c} sections; each part goes in exactly one.`);
  }
  if (limits.maxSections !== undefined && sections.length > limits.maxSections) problems.push(`${sections.length} sections, more than the ${limits.maxSections} wanted.`);
  return { ok: problems.length === 0, sections: checked, problems: [...new Set(problems)] };
}
