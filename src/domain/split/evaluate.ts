/**
 * Limits and the objective of the split advisor.
 *
 * Objective (lexicographic, written once here): (1) fewest sections; (2) the lightest heaviest
 * section; (3) the smallest sum over sections of the horizontal distance (mm) from the section's CoG
 * to the centre of its footprint (the x–y extent of its parts' boxes). Remaining ties are broken by
 * a canonical text of the sections, so the order is total and the answer deterministic.
 */
import { fitsInAnyOrientation } from '../geometry/box.ts';
import { addAgg, aggCog, aggSize, emptyAgg, type Agg, type Unit } from './tree.ts';
import type { SplitLimits } from './types.ts';

/** Relative tolerance for comparing masses and distances (floating sums in different orders). */
const EPS = 1e-9;

export function aggWithinLimits(a: Agg, limits: SplitLimits): boolean {
  if (a.massKg > limits.maxSectionMassKg * (1 + EPS)) return false;
  if (limits.maxSectionSizeMm && !fitsInAnyOrientation(aggSize(a), limits.maxSectionSizeMm)) return false;
  return true;
}

/** Why one unit cannot be a section on its own, with how much it is over; undefined when it can. */
export function unitProblem(u: Unit, limits: SplitLimits): string | undefined {
  const problems: string[] = [];
  if (u.agg.massKg > limits.maxSectionMassKg * (1 + EPS)) {
    problems.push(`mass ${u.agg.massKg.toFixed(1)} kg is ${(u.agg.massKg - limits.maxSectionMassKg).toFixed(1)} kg over the ${limits.maxSectionMassKg} kg section limit`);
  }
  if (limits.maxSectionSizeMm && !fitsInAnyOrientation(aggSize(u.agg), limits.maxSectionSizeMm)) {
    const s = [...aggSize(u.agg)].sort((a, b) => b - a);
    const l = [...limits.maxSectionSizeMm].sort((a, b) => b - a);
    const over = s.map((v, i) => Math.max(0, v - l[i]));
    problems.push(
      `size ${s.map((v) => Math.round(v)).join(' × ')} mm does not fit ${l.map((v) => Math.round(v)).join(' × ')} mm in any orientation (over by ${over.map((v) => Math.round(v)).join(' / ')} mm, largest to smallest)`,
    );
  }
  if (problems.length === 0) return undefined;
  const what = u.scope === 'whole' ? `assembly ${u.assemblyId}` : `the parts hung directly on assembly ${u.assemblyId}`;
  return `${what}: ${problems.join('; ')}${u.scope === 'whole' ? ' and it may not be divided' : ''}.`;
}

export function unitsAgg(units: readonly Unit[]): Agg {
  let a = emptyAgg();
  for (const u of units) a = addAgg(a, u.agg);
  return a;
}

/** Horizontal distance from a section's CoG to the centre of its footprint, mm. */
export function cogOffsetMm(a: Agg): number {
  const c = aggCog(a);
  return Math.hypot(c[0] - (a.min[0] + a.max[0]) / 2, c[1] - (a.min[1] + a.max[1]) / 2);
}

export interface Score {
  sections: number;
  heaviestKg: number;
  cogOffsetSumMm: number;
  /** Canonical text of the partition (sorted unit keys), for ties and de-duplication. */
  key: string;
}

export function scoreOf(sections: readonly Unit[][]): Score {
  let heaviest = 0;
  let offsets = 0;
  const keys: string[] = [];
  for (const s of sections) {
    const a = unitsAgg(s);
    heaviest = Math.max(heaviest, a.massKg);
    offsets += cogOffsetMm(a);
    keys.push(
      s
        .map((u) => u.key)
        .sort()
        .join(','),
    );
  }
  keys.sort();
  return { sections: sections.length, heaviestKg: heaviest, cogOffsetSumMm: offsets, key: keys.join('|') };
}

function cmpNum(a: number, b: number): number {
  const tol = EPS * Math.max(1, Math.abs(a), Math.abs(b));
  return Math.abs(a - b) <= tol ? 0 : a < b ? -1 : 1;
}

/** Negative when `a` is better. */
export function compareScores(a: Score, b: Score): number {
  return a.sections - b.sections || cmpNum(a.heaviestKg, b.heaviestKg) || cmpNum(a.cogOffsetSumMm, b.cogOffsetSumMm) || (a.key < b.key ? -1 : a.key > b.key ? 1 : 0);
}

/** Adjacency among units: explicit pairs of assembly ids, plus parent–child links (a part hangs on its parent). */
export class Adjacency {
  private pairs = new Set<string>();
  constructor(
    pairs: readonly [string, string][] | undefined,
    private parentOf: (id: string) => string | null,
  ) {
    for (const [a, b] of pairs ?? []) {
      this.pairs.add(`${a}\u0000${b}`);
      this.pairs.add(`${b}\u0000${a}`);
    }
  }
  adjacent(u: Unit, v: Unit): boolean {
    const a = u.assemblyId;
    const b = v.assemblyId;
    if (a === b) return true;
    if (this.pairs.has(`${a}\u0000${b}`)) return true;
    return this.parentOf(a) === b || this.parentOf(b) === a;
  }
  /** A section holding an adjacent-only unit must be connected through adjacency. */
  sectionOk(units: readonly Unit[]): boolean {
    if (units.length <= 1 || !units.some((u) => u.adjacentOnly)) return true;
    const seen = new Set<number>([0]);
    const stack = [0];
    while (stack.length > 0) {
      const i = stack.pop() as number;
      for (let j = 0; j < units.length; j++) {
        if (!seen.has(j) && this.adjacent(units[i], units[j])) {
          seen.add(j);
          stack.push(j);
        }
      }
    }
    return seen.size === units.length;
  }
}
