import { createRequire } from 'node:module';
import { pathToFileURL } from 'node:url';
import { Worker } from 'node:worker_threads';
import type { JobContext } from './runner.ts';

/**
 * tsx's ESM entry, found with createRequire through tsx's own exports map rather than
 * import.meta.resolve, which the test runner's module loader (where the browser tests start the app)
 * does not offer. Its CommonJS entry cannot register the ESM loader, hence the map lookup.
 */
function tsxEsmApiUrl(): string {
  const require = createRequire(import.meta.url);
  const pkgPath = require.resolve('tsx/package.json');
  const pkg = require(pkgPath) as { exports: Record<string, { import: { default: string } }> };
  return new URL(pkg.exports['./esm/api'].import.default, pathToFileURL(pkgPath)).href;
}

/**
 * Runs a TypeScript module on a worker thread and resolves with the first `{ type: 'done' }` message it
 * posts; `{ type: 'progress' }` messages go to onMessage. The module is loaded through tsx's loader,
 * registered inside the worker first (the app and the tests both run TypeScript sources directly).
 * A worker that outlives `timeoutMs` is terminated.
 */
export function runOnWorker<TDone>(moduleUrl: URL, workerData: unknown, onMessage: (msg: { type: string; [k: string]: unknown }) => void, timeoutMs: number): Promise<TDone> {
  const boot = `import(${JSON.stringify(tsxEsmApiUrl())}).then((m) => { m.register(); return import(${JSON.stringify(moduleUrl.href)}); });`;
  return new Promise<TDone>((resolve, reject) => {
    const worker = new Worker(boot, { eval: true, workerData });
    let settled = false;
    const finish = (fn: () => void) => {
      if (settled) return;
      settled = true;
      clearTimeout(timer);
      fn();
      void worker.terminate();
    };
    const timer = setTimeout(() => finish(() => reject(new Error(`The worker ran longer than ${Math.round(timeoutMs / 1000)} s and was stopped.`))), timeoutMs);
    worker.on('message', (msg: { type: string; [k: string]: unknown }) => {
      if (msg?.type === 'done') finish(() => resolve(msg.value as TDone));
      else if (msg?.type === 'error') finish(() => reject(new Error(String(msg.message))));
      else onMessage(msg);
    });
    worker.on('error', (err) => finish(() => reject(err)));
    worker.on('exit', (code) => finish(() => reject(new Error(`The worker stopped (exit code ${code}) before it finished.`))));
  });
}

type WorkerMessage = { type: string; [k: string]: unknown };

/**
 * The `onMessage` of runOnWorker for a job: every progress message goes to the job's heartbeat; at most every
 * `intervalMs` one also goes to `save`, which writes it to the run's own row (what the client polls). A failed
 * save is only reported through `save`'s own promise: progress is not worth failing a run for.
 */
export function progressTo(ctx: JobContext, save: (fraction: number, msg: WorkerMessage) => Promise<unknown>, intervalMs = 250): (msg: WorkerMessage) => void {
  let lastWrite = 0;
  return (msg) => {
    if (msg.type !== 'progress') return;
    const fraction = Number(msg.fraction);
    ctx.progress(fraction);
    const now = Date.now();
    if (now - lastWrite < intervalMs) return;
    lastWrite = now;
    void save(Math.min(0.99, fraction), msg);
  };
}
