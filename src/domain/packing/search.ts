import { seededRandom } from './rng.ts';
import type { Solver, PlacedNode, State } from './solver.ts';

/**
 * Anytime beam search over the block-building greedy (see solver.ts). `run()` is a generator that yields
 * after every greedy completion (one "iteration"), so the caller can stop it at a time or iteration limit
 * and still hold the best complete packing seen so far in `best`. Between beam rounds it runs a few
 * randomised greedy completions driven by the seed.
 */
export class BeamSearch {
  readonly solver: Solver;
  best: State;
  iterations = 0;
  /** Beam width of the round in progress. */
  width = 1;

  private readonly random: () => number;

  constructor(solver: Solver, seed = 1) {
    this.solver = solver;
    this.random = seededRandom(seed);
    const g = solver.root();
    solver.greedy(g);
    this.best = g;
    this.iterations = 1;
  }

  private record(s: State): void {
    if (s.volume > this.best.volume + 1e-6) this.best = s;
  }

  /** Beam widths of successive rounds: each round costs roughly width² greedy completions per level. */
  static widths(): number[] {
    const w = [2, 3, 4, 6, 8, 12, 16, 24, 32, 48, 64, 96, 128];
    return w;
  }

  *run(): Generator<void, void> {
    const solver = this.solver;
    const cands: { b: number; x: number; y: number; z: number }[] = [];
    for (const w of BeamSearch.widths()) {
      this.width = w;
      let beam: State[] = [solver.root()];
      while (beam.length > 0) {
        const children: { s: State; v: number }[] = [];
        for (const s of beam) {
          const n = solver.expand(s, w, cands);
          if (n === 0) {
            this.record(s);
            continue;
          }
          const mine = cands.slice(0, n).map((c) => ({ ...c }));
          for (const c of mine) {
            const child = s.clone();
            solver.place(child, c);
            const g = child.clone();
            solver.greedy(g);
            this.iterations++;
            this.record(g);
            children.push({ s: child, v: g.volume });
            yield;
          }
        }
        children.sort((a, b) => b.v - a.v);
        beam = children.slice(0, w).map((c) => c.s);
      }
      // Between rounds, a few randomised greedy runs from the start (the seed's only use).
      for (let r = 0; r < w; r++) {
        const g = solver.root();
        solver.greedy(g, this.random);
        this.iterations++;
        this.record(g);
        yield;
      }
    }
  }
}

/** The placed blocks of a state in loading order (first placed first). */
export function placedInOrder(s: State): PlacedNode[] {
  const out: PlacedNode[] = [];
  for (let p = s.placed; p; p = p.prev) out.push(p);
  return out.reverse();
}
