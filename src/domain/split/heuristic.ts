/**
 * Anytime heuristic for large machines.
 *
 * 1. Start from the coarsest frontier that can work: divide an assembly only when it breaks a limit on
 *    its own (and may be divided); an undividable one that breaks a limit makes the split impossible.
 * 2. Pack units into sections by best fit, heaviest first (the classic first-fit-decreasing family for
 *    bin packing, with the section's size checked as the extent of its units' boxes).
 * 3. Improve until the time or iteration budget ends: empty the lightest section into the others; move
 *    units off the heaviest section; restart from a perturbed order, sometimes dividing a random
 *    assembly further (finer pieces can pack into fewer sections). Every partition found is offered
 *    to the pool, which keeps the best distinct ones.
 * A seeded generator drives every random choice, so the same seed and maxIterations repeat exactly.
 */
import { type Adjacency, aggWithinLimits, unitProblem } from './evaluate.ts';
import type { ProposalPool } from './pool.ts';
import { addAgg, divide, divisible, emptyAgg, wholeUnit, type Agg, type Tree, type Unit } from './tree.ts';
import type { SplitLimits } from './types.ts';

/** mulberry32: a small, well-mixed 32-bit generator (public domain). */
export function rng(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** The coarsest workable frontier, or the units that make any split impossible. */
export function coarsestFrontier(tree: Tree, limits: SplitLimits): { units: Unit[]; infeasible: { assemblyId: string; reason: string }[] } {
  const units: Unit[] = [];
  const infeasible: { assemblyId: string; reason: string }[] = [];
  const queue: Unit[] = tree.roots.filter((r) => r.subtree.partCount > 0).map(wholeUnit);
  while (queue.length > 0) {
    const u = queue.shift() as Unit;
    const problem = unitProblem(u, limits);
    if (!problem) {
      units.push(u);
      continue;
    }
    const node = tree.byId.get(u.assemblyId);
    if (u.scope === 'whole' && node && divisible(node)) queue.push(...divide(node));
    else infeasible.push({ assemblyId: u.assemblyId, reason: problem });
  }
  return { units, infeasible };
}

interface Packing {
  sections: Unit[][];
  aggs: Agg[];
}

function fits(p: Packing, k: number, u: Unit, limits: SplitLimits, adj: Adjacency): Agg | undefined {
  const a = addAgg(p.aggs[k], u.agg);
  if (!aggWithinLimits(a, limits)) return undefined;
  if ((u.adjacentOnly || p.sections[k].some((x) => x.adjacentOnly)) && !adj.sectionOk([...p.sections[k], u])) return undefined;
  return a;
}

/** Best fit: the feasible section left heaviest after adding (tightest), else a new one. */
function place(p: Packing, u: Unit, limits: SplitLimits, adj: Adjacency, skip = -1): void {
  let best = -1;
  let bestAgg: Agg | undefined;
  for (let k = 0; k < p.sections.length; k++) {
    if (k === skip) continue;
    const a = fits(p, k, u, limits, adj);
    if (a && (!bestAgg || a.massKg > bestAgg.massKg)) {
      best = k;
      bestAgg = a;
    }
  }
  if (best >= 0 && bestAgg) {
    p.sections[best].push(u);
    p.aggs[best] = bestAgg;
  } else {
    p.sections.push([u]);
    p.aggs.push(addAgg(emptyAgg(), u.agg));
  }
}

export function packUnits(units: readonly Unit[], limits: SplitLimits, adj: Adjacency): Packing {
  const p: Packing = { sections: [], aggs: [] };
  for (const u of units) place(p, u, limits, adj);
  return p;
}

function recompute(p: Packing): void {
  p.aggs = p.sections.map((s) => s.reduce((a, u) => addAgg(a, u.agg), emptyAgg()));
}

/** Tries to move every unit of section k into the others; keeps the change only if all move. */
function tryEmpty(p: Packing, k: number, limits: SplitLimits, adj: Adjacency): boolean {
  const trial: Packing = { sections: p.sections.map((s) => [...s]), aggs: [...p.aggs] };
  const moving = trial.sections[k].sort((a, b) => b.agg.massKg - a.agg.massKg);
  trial.sections[k] = [];
  trial.aggs[k] = emptyAgg();
  for (const u of moving) {
    let best = -1;
    let bestAgg: Agg | undefined;
    for (let j = 0; j < trial.sections.length; j++) {
      if (j === k) continue;
      const a = fits(trial, j, u, limits, adj);
      if (a && (!bestAgg || a.massKg > bestAgg.massKg)) {
        best = j;
        bestAgg = a;
      }
    }
    if (best < 0 || !bestAgg) return false;
    trial.sections[best].push(u);
    trial.aggs[best] = bestAgg;
  }
  trial.sections.splice(k, 1);
  trial.aggs.splice(k, 1);
  p.sections = trial.sections;
  p.aggs = trial.aggs;
  return true;
}

/** Moves units off the heaviest section while that lowers the heaviest mass. */
function balance(p: Packing, limits: SplitLimits, adj: Adjacency): void {
  for (let guard = 0; guard < 4 * p.sections.length + 8; guard++) {
    let h = 0;
    for (let k = 1; k < p.aggs.length; k++) if (p.aggs[k].massKg > p.aggs[h].massKg) h = k;
    const heaviest = p.aggs[h].massKg;
    let moved = false;
    const candidates = [...p.sections[h]].sort((a, b) => a.agg.massKg - b.agg.massKg);
    for (const u of candidates) {
      for (let j = 0; j < p.sections.length && !moved; j++) {
        if (j === h) continue;
        const a = fits(p, j, u, limits, adj);
        if (!a || a.massKg >= heaviest) continue;
        const rest = p.sections[h].filter((x) => x !== u);
        if (rest.length === 0 || !adj.sectionOk(rest)) continue;
        p.sections[h] = rest;
        p.sections[j].push(u);
        recompute(p);
        moved = true;
      }
      if (moved) break;
    }
    if (!moved) return;
  }
}

export interface HeuristicRun {
  iterations: number;
  stoppedBy: 'iterations' | 'time';
}

export function runHeuristic(
  tree: Tree,
  start: Unit[],
  limits: SplitLimits,
  adj: Adjacency,
  pool: ProposalPool,
  budget: { maxIterations: number; deadline: number; now: () => number; seed: number; onProgress?: (f: number) => void },
): HeuristicRun {
  const random = rng(budget.seed);
  const offer = (p: Packing) => {
    if (limits.maxSections !== undefined && p.sections.length > limits.maxSections) return;
    pool.offer(p.sections);
  };
  const improve = (p: Packing) => {
    offer(p);
    // Empty sections, lightest first, while any can be emptied.
    let progress = true;
    while (progress && p.sections.length > 1) {
      progress = false;
      const order = p.aggs.map((a, k) => [a.massKg, k] as const).sort((a, b) => a[0] - b[0]);
      for (const [, k] of order) {
        if (tryEmpty(p, k, limits, adj)) {
          progress = true;
          break;
        }
      }
    }
    offer(p);
    balance(p, limits, adj);
    offer(p);
  };

  const byMassDesc = [...start].sort((a, b) => b.agg.massKg - a.agg.massKg || (a.key < b.key ? -1 : 1));
  improve(packUnits(byMassDesc, limits, adj));

  let units = start;
  let i = 0;
  for (; i < budget.maxIterations; i++) {
    if (budget.now() > budget.deadline) return { iterations: i, stoppedBy: 'time' };
    budget.onProgress?.(Math.min(1, (i + 1) / budget.maxIterations));
    // Sometimes divide a random dividable whole unit further, sometimes go back to the coarse start.
    const r = random();
    if (r < 0.25) {
      const dividable = units.filter((u) => {
        const n = tree.byId.get(u.assemblyId);
        return u.scope === 'whole' && n !== undefined && divisible(n);
      });
      if (dividable.length > 0) {
        const pick = dividable[Math.floor(random() * dividable.length)];
        const node = tree.byId.get(pick.assemblyId);
        if (node) units = [...units.filter((u) => u !== pick), ...divide(node)];
      }
    } else if (r < 0.35) {
      units = start;
    }
    // Perturbed heaviest-first order: mass × a random factor in [0.7, 1.3).
    const keyed = units.map((u) => ({ u, k: u.agg.massKg * (0.7 + 0.6 * random()) }));
    keyed.sort((a, b) => b.k - a.k || (a.u.key < b.u.key ? -1 : 1));
    improve(packUnits(keyed.map((x) => x.u), limits, adj));
  }
  return { iterations: i, stoppedBy: 'iterations' };
}
