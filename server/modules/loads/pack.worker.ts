import { parentPort, workerData } from 'node:worker_threads';
import { packVehicles } from '../../../src/domain/packing/index.ts';
import { finishRun, packItem, type RunSettings, type RunVehicle } from './run-figures.ts';
import type { RunItemView } from '../../../src/domain/contracts/crate-loads.ts';

/**
 * Worker-thread entry of a packing run: the engine's search runs here, off the app's event loop, and
 * posts its progress; the figures are computed here too and go back with the result.
 */
interface Input {
  vehicles: RunVehicle[];
  items: RunItemView[];
  options: { timeLimitMs: number; fullSupport: boolean; seed: number };
  settings: RunSettings;
}

async function main(): Promise<void> {
  const input = workerData as Input;
  let last = 0;
  const result = await packVehicles(input.vehicles, input.items.map(packItem), {
    timeLimitMs: input.options.timeLimitMs,
    fullSupport: input.options.fullSupport,
    seed: input.options.seed,
    onProgress: (fraction, best) => {
      const now = Date.now();
      if (now - last < 200 && fraction < 1) return;
      last = now;
      parentPort!.postMessage({ type: 'progress', fraction, best });
    },
  });
  // Weight distribution: each vehicle's load is moved within its free space so axle loads and CoG are within limits.
  parentPort!.postMessage({ type: 'done', value: finishRun(input.vehicles, input.items, result, input.settings, input.options.fullSupport) });
}

main().catch((e: unknown) => parentPort!.postMessage({ type: 'error', message: e instanceof Error ? e.message : String(e) }));
