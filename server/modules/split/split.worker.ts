import { parentPort, workerData } from 'node:worker_threads';
import { proposeSplits, type SplitInput } from '../../../src/domain/split/index.ts';

/**
 * Worker-thread entry of a split advisor run: the search runs here, off the app's event loop, and posts
 * its progress (at most every 200 ms).
 */
function main(): void {
  const input = workerData as SplitInput;
  let last = 0;
  const result = proposeSplits({
    ...input,
    options: {
      ...input.options,
      onProgress: (fraction) => {
        const now = Date.now();
        if (now - last < 200 && fraction < 1) return;
        last = now;
        parentPort!.postMessage({ type: 'progress', fraction });
      },
    },
  });
  parentPort!.postMessage({ type: 'done', value: result });
}

try {
  main();
} catch (e: unknown) {
  parentPort!.postMessage({ type: 'error', message: e instanceof Error ? e.message : String(e) });
}
