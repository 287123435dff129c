/**
 * Public entry point of the split advisor (issue 8). `proposeSplits` has the issue's signature; the
 * input accepts further optional fields (adjacency, maxSections, maxIterations, onProgress) and the
 * result carries each section's units and margins, each proposal's score and the method used.
 *
 * A section is a set of whole assemblies (or the parts hung directly on an assembly that is divided);
 * an assembly not marked keepTogether may be divided into its children; every part lands in exactly
 * one section; a section's size is the extent of its parts' boxes, compared with the limit in any
 * orientation. Proposals come best first by the objective in evaluate.ts.
 *
 * Small machines (at most EXACT_UNIT_LIMIT units when fully divided) are searched exhaustively, so
 * the first proposal is proven best; larger ones by the anytime heuristic in heuristic.ts.
 */
import { fitsInAnyOrientation } from '../geometry/box.ts';
import { Adjacency, type Score } from './evaluate.ts';
import { enumeratePartitions, frontiersOfRoots, fullDivisionUnitCount } from './exact.ts';
import { coarsestFrontier, runHeuristic } from './heuristic.ts';
import { ProposalPool } from './pool.ts';
import { aggCog, aggSize, addAgg, buildTree, emptyAgg, type Unit } from './tree.ts';
import type { ProposedSection, SplitInput, SplitLimits, SplitProposal, SplitResult } from './types.ts';

export type * from './types.ts';
export { rng } from './heuristic.ts';
export { checkSplit, type SplitCheck, type CheckedSection, type SplitCheckInput } from './check.ts';

/** Fully divided unit count at or below which the search is exhaustive. */
export const EXACT_UNIT_LIMIT = 9;
const FRONTIER_CAP = 5000;

function toSection(units: Unit[], limits: SplitLimits): ProposedSection {
  const agg = units.reduce((a, u) => addAgg(a, u.agg), emptyAgg());
  const sorted = [...units].sort((a, b) => (a.key < b.key ? -1 : a.key > b.key ? 1 : 0));
  const size = aggSize(agg);
  let sizeMargin: [number, number, number] | undefined;
  if (limits.maxSectionSizeMm) {
    const s = [...size].sort((a, b) => b - a);
    const l = [...limits.maxSectionSizeMm].sort((a, b) => b - a);
    sizeMargin = [l[0] - s[0], l[1] - s[1], l[2] - s[2]];
  }
  return {
    assemblyIds: [...new Set(sorted.map((u) => u.assemblyId))],
    massKg: agg.massKg,
    cogMm: aggCog(agg),
    sizeMm: size,
    units: sorted.map((u) => ({ assemblyId: u.assemblyId, scope: u.scope })),
    margins: { massKg: limits.maxSectionMassKg - agg.massKg, sizeMm: sizeMargin },
  };
}

function toProposal(item: { score: Score; sections: Unit[][] }, limits: SplitLimits): SplitProposal {
  // Sections heaviest first, then by their first unit, for a stable display.
  const sections = item.sections.map((s) => toSection(s, limits)).sort((a, b) => b.massKg - a.massKg || (a.assemblyIds[0] < b.assemblyIds[0] ? -1 : 1));
  return { sections, score: { sections: item.score.sections, heaviestKg: item.score.heaviestKg, cogOffsetSumMm: item.score.cogOffsetSumMm } };
}

function limitProblems(l: SplitLimits): string[] {
  const out: string[] = [];
  if (!(Number.isFinite(l.maxSectionMassKg) && l.maxSectionMassKg > 0)) out.push(`limits.maxSectionMassKg must be above zero (got ${String(l.maxSectionMassKg)}).`);
  if (l.maxSectionSizeMm && !l.maxSectionSizeMm.every((v) => Number.isFinite(v) && v > 0)) out.push('limits.maxSectionSizeMm must be three sizes above zero.');
  if (l.maxSections !== undefined && !(Number.isInteger(l.maxSections) && l.maxSections > 0)) out.push('limits.maxSections must be a whole number above zero.');
  return out;
}

/**
 * Proposes how to split the machine into sections within the limits, best first. Where no split
 * exists, `proposals` is empty and `infeasible` names each assembly that makes it impossible and by
 * how much. Deterministic for a given seed and maxIterations (a time limit may stop it earlier).
 */
export function proposeSplits(input: SplitInput): SplitResult {
  const options = input.options ?? {};
  const limits = input.limits;
  const maxProposals = Math.max(1, Math.floor(options.maxProposals ?? 3));
  const lp = limitProblems(limits);
  if (lp.length > 0) return { proposals: [], infeasible: lp.map((reason) => ({ assemblyId: '', reason })) };
  const tree = buildTree(input.assemblies, input.parts);
  if (tree.problems.length > 0) {
    return { proposals: [], infeasible: tree.problems.map((reason) => ({ assemblyId: reason.match(/Assembly (\S+):/)?.[1] ?? '', reason })) };
  }
  const adj = new Adjacency(options.adjacency, (id) => tree.byId.get(id)?.parentId ?? null);
  const { units: start, infeasible } = coarsestFrontier(tree, limits);
  if (infeasible.length > 0) return { proposals: [], infeasible, method: 'heuristic' };
  if (start.length === 0) return { proposals: [], infeasible: [{ assemblyId: '', reason: 'The machine has no parts to split.' }] };

  const pool = new ProposalPool(maxProposals);
  const fullCount = tree.roots.reduce((s, r) => s + fullDivisionUnitCount(r), 0);
  const fronts = options.method !== 'heuristic' && fullCount <= EXACT_UNIT_LIMIT ? frontiersOfRoots(tree.roots, FRONTIER_CAP) : undefined;
  let method: 'exact' | 'heuristic';
  if (fronts) {
    method = 'exact';
    fronts.forEach((f, i) => {
      enumeratePartitions(f, limits, adj, pool);
      options.onProgress?.((i + 1) / fronts.length);
    });
  } else {
    method = 'heuristic';
    const now = () => (typeof performance !== 'undefined' ? performance.now() : Date.now());
    const t0 = now();
    runHeuristic(tree, start, limits, adj, pool, {
      maxIterations: Math.max(0, Math.floor(options.maxIterations ?? 400)),
      deadline: t0 + (options.timeLimitMs ?? 2000),
      now,
      seed: options.seed ?? 1,
      onProgress: options.onProgress,
    });
  }
  const proposals = pool.items.map((it) => toProposal(it, limits));
  if (proposals.length === 0) {
    const why = limits.maxSections !== undefined ? `no split into at most ${limits.maxSections} sections was found within the limits` : 'no split was found within the limits';
    return { proposals, infeasible: [{ assemblyId: '', reason: `${why}${options.adjacency ? ' and the adjacency rules' : ''}.` }], method };
  }
  // Every proposal is re-checked here against the limits (a guard against a search bug).
  for (const p of proposals) {
    for (const s of p.sections) {
      if (s.massKg > limits.maxSectionMassKg * (1 + 1e-9) || (limits.maxSectionSizeMm && !fitsInAnyOrientation(s.sizeMm, limits.maxSectionSizeMm))) {
        throw new Error(`Split advisor: internal error, section ${s.assemblyIds.join('+')} breaks a limit.`);
      }
    }
  }
  return { proposals, infeasible: [], method };
}
