// Worker for scripts/bench/packing.ts: runs one benchmark instance at a time and validates the result.
import { readFileSync } from 'node:fs';
import { parentPort } from 'node:worker_threads';
import { packBoxes, packVehicles, validatePacking } from '../../src/domain/packing/index.ts';
import { parseThpack, thpackToPackInput } from '../../src/domain/packing/benchmarks/thpack-format.ts';
import { mpvToPackInput, parseMpv } from '../../src/domain/packing/benchmarks/mpv-format.ts';

export type Job =
  | { kind: 'br'; cls: number; problem: number; budgetMs: number; fullSupport: boolean; dataDir: string }
  | { kind: 'bpp'; cls: number; n: number; v: number; budgetMs: number; dataDir: string };

export interface JobResult {
  job: Job;
  value: number;
  timeMs: number;
  overlaps: number;
  orientationFaults: number;
  outOfBounds: number;
  unsupported: number;
  floating: number;
  quantityMismatches: number;
  boxes: number;
}

const brCache = new Map<number, ReturnType<typeof parseThpack>>();

async function run(job: Job): Promise<JobResult> {
  if (job.kind === 'br') {
    let file = brCache.get(job.cls);
    if (!file) {
      file = parseThpack(readFileSync(`${job.dataDir}/br-0-15/BR${job.cls}.txt`, 'utf8'));
      brCache.set(job.cls, file);
    }
    const { container, items } = thpackToPackInput(file[job.problem - 1]);
    const t0 = performance.now();
    const r = await packBoxes(container, items, { timeLimitMs: job.budgetMs, fullSupport: job.fullSupport });
    const timeMs = performance.now() - t0;
    const c = validatePacking(container, items, r.placements, { fullSupport: job.fullSupport, unplaced: r.unplaced });
    return { job, value: r.volumeUtilisation, timeMs, ...pick(c), boxes: r.placements.length };
  }
  const inst = parseMpv(readFileSync(`${job.dataDir}/mpv-3dbpp/${job.cls}_${job.n}/${job.v}.txt`, 'utf8'));
  const { vehicles, items } = mpvToPackInput(inst);
  const t0 = performance.now();
  const r = await packVehicles(vehicles, items, { timeLimitMs: job.budgetMs, fullSupport: false });
  const timeMs = performance.now() - t0;
  const sum = { overlaps: 0, orientationFaults: 0, outOfBounds: 0, unsupported: 0, floating: 0, quantityMismatches: 0 };
  for (const veh of vehicles) {
    const mine = r.placements.filter((p) => p.vehicleId === veh.id);
    if (mine.length === 0) continue;
    const c = validatePacking(veh, items, mine, { fullSupport: false });
    for (const k of Object.keys(sum) as (keyof typeof sum)[]) sum[k] += c[k];
  }
  if (r.unplaced.length > 0 || r.placements.length !== items.length) sum.quantityMismatches++;
  return { job, value: r.vehiclesUsed, timeMs, ...sum, boxes: r.placements.length };
}

function pick(c: ReturnType<typeof validatePacking>) {
  return {
    overlaps: c.overlaps,
    orientationFaults: c.orientationFaults,
    outOfBounds: c.outOfBounds,
    unsupported: c.unsupported,
    floating: c.floating,
    quantityMismatches: c.quantityMismatches,
  };
}

parentPort?.on('message', (job: Job) => {
  run(job).then(
    (res) => parentPort?.postMessage(res),
    (err: unknown) => parentPort?.postMessage({ error: String(err instanceof Error ? err.stack : err), job }),
  );
});
