import { forEachItem, MAX_PAIRS } from './blocks.ts';
import { prepareInput } from './prepare.ts';
import { BeamSearch, placedInOrder } from './search.ts';
import { Solver, type State } from './solver.ts';
import type { PackContainer, PackItem, PackOptions, PackResult, Placement, Unplaced } from './types.ts';

/** Default wall-clock budget when neither timeLimitMs nor maxIterations is given, ms. */
export const DEFAULT_TIME_LIMIT_MS = 2000;

const now = (): number => (typeof performance !== 'undefined' ? performance.now() : Date.now());
const nextTick = (): Promise<void> => new Promise((r) => setTimeout(r, 0));

/** Runs the anytime search within the limits; resolves with the final search object. */
export async function runSearch(solver: Solver, options: PackOptions | undefined, startMs: number): Promise<BeamSearch> {
  const maxIterations = options?.maxIterations ?? Infinity;
  const timeLimit = options?.timeLimitMs ?? (options?.maxIterations === undefined ? DEFAULT_TIME_LIMIT_MS : Infinity);
  const deadline = startMs + timeLimit;
  const volume = solver.cfg.L * solver.cfg.W * solver.cfg.H;
  const search = new BeamSearch(solver, options?.seed ?? 1);
  const report = (f: number) => options?.onProgress?.(Math.min(1, f), search.best.volume / volume);
  const fraction = () => Math.max(Number.isFinite(timeLimit) ? (now() - startMs) / timeLimit : 0, search.iterations / maxIterations);
  report(fraction());
  const gen = search.run();
  let lastPause = now();
  while (search.iterations < maxIterations && now() < deadline) {
    if (gen.next().done) break;
    if (now() - lastPause > 50) {
      report(fraction());
      await nextTick();
      lastPause = now();
    }
  }
  report(1);
  return search;
}

/** Expands a state's blocks into single placements with the caller's item ids. */
export function statePlacements(solver: Solver, s: State): Placement[] {
  const B = solver.blocks;
  const out: Placement[] = [];
  const types = solver.cfg.types;
  for (const p of placedInOrder(s)) {
    forEachItem(B, p.b, p.x0, p.y0, p.z0, (t, x, y, z, lx, ly, lz) => out.push({ id: types[t].id, xMm: x, yMm: y, zMm: z, lengthMm: lx, widthMm: ly, heightMm: lz }));
  }
  return out;
}

/** Why the items left in state s were not placed, one line per item. */
export function unplacedReasons(solver: Solver, s: State, container: PackContainer): Unplaced[] {
  const out: Unplaced[] = [];
  const payload = container.maxPayloadKg;
  solver.cfg.types.forEach((t, i) => {
    const left = s.rem[i];
    if (left <= 0) return;
    let reason: string;
    if (payload !== undefined && t.massKg > 0 && s.massKg + t.massKg > payload + 1e-9) {
      reason = `item "${t.id}": ${left} of ${t.count} not placed: one more (${t.massKg} kg) would bring the load to ${(s.massKg + t.massKg).toFixed(1)} kg, over the payload limit maxPayloadKg ${payload} kg`;
    } else {
      reason = `item "${t.id}": ${left} of ${t.count} not placed: no free space left that fits it in an allowed orientation${solver.cfg.fullSupport ? ' with full support' : ''}${t.stackable ? '' : ''}${solver.cfg.groups > 1 ? ' while keeping the load order' : ''}`;
    }
    out.push({ id: t.id, quantity: left, reason });
  });
  return out;
}

/**
 * Packs items into one container. See types.ts for units and frame. Items that cannot be placed are in
 * `unplaced` with a reason; bad lines are reported and the rest is still packed. Deterministic for a given
 * seed and maxIterations when no time limit stops the run first.
 */
export async function packBoxes(container: PackContainer, items: PackItem[], options?: PackOptions): Promise<PackResult> {
  const start = now();
  const prep = prepareInput(container, items);
  if (prep.containerError || prep.types.length === 0) {
    options?.onProgress?.(1, 0);
    return { placements: [], unplaced: prep.rejected, volumeUtilisation: 0 };
  }
  const solver = new Solver({
    L: container.lengthMm,
    W: container.widthMm,
    H: container.heightMm,
    payloadKg: container.maxPayloadKg ?? Infinity,
    types: prep.types,
    groups: prep.groups,
    fullSupport: options?.fullSupport ?? true,
    generalBlocks: options?.mixedBlocks,
    // Set-up work in proportion to a short time budget (a function of the options, so still deterministic).
    maxPairs: options?.timeLimitMs !== undefined ? Math.round(Math.min(MAX_PAIRS, Math.max(20_000, options.timeLimitMs * 250))) : MAX_PAIRS,
  });
  const search = await runSearch(solver, options, start);
  const best = search.best;
  return {
    placements: statePlacements(solver, best),
    unplaced: [...prep.rejected, ...unplacedReasons(solver, best, container)],
    volumeUtilisation: best.volume / (container.lengthMm * container.widthMm * container.heightMm),
  };
}
