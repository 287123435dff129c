import { randomUUID } from 'node:crypto';
import { hostname } from 'node:os';
import type { Knex } from 'knex';
import type { Logger } from 'pino';
import { claimJob, failJob, finishJob, heartbeatJob, requeueStaleJobs, type JobRow } from './queue.ts';

export interface JobContext {
  /** Reports progress 0..1 (written at most every few hundred ms). */
  progress(fraction: number): void;
}
export type JobHandler = (job: JobRow, ctx: JobContext) => Promise<void>;
export type JobFailureHandler = (job: JobRow, error: Error, finalStatus: 'queued' | 'failed' | 'done' | 'running') => Promise<void>;

const POLL_MS = 2000;
const STALE_SECONDS = 60;
const HEARTBEAT_MS = 300;

/**
 * Runs queued jobs in this app server, one at a time (the heavy work itself runs on a worker thread, so
 * the event loop stays free). `kick()` after enqueueing starts at once; a slow poll picks up jobs queued
 * by other servers and jobs left by a server that died. Timers are unref'd: they never hold the process.
 */
export class JobRunner {
  readonly workerId = `${hostname()}:${process.pid}:${randomUUID().slice(0, 8)}`;
  private readonly handlers = new Map<string, { run: JobHandler; failed?: JobFailureHandler }>();
  private busy = false;
  private again = false;
  private timer: NodeJS.Timeout | null = null;
  private stopped = false;

  constructor(
    private readonly db: Knex,
    private readonly log: Logger,
  ) {}

  register(kind: string, run: JobHandler, failed?: JobFailureHandler): void {
    this.handlers.set(kind, { run, failed });
    this.start();
  }

  /** Look for work now. */
  kick(): void {
    if (this.stopped) return;
    if (this.busy) {
      this.again = true;
      return;
    }
    void this.drain();
  }

  start(): void {
    if (this.timer || this.stopped) return;
    this.timer = setInterval(() => {
      requeueStaleJobs(this.db, STALE_SECONDS)
        .then(() => this.kick())
        .catch((err) => this.pollFailed(err));
    }, POLL_MS);
    this.timer.unref();
  }

  stop(): void {
    this.stopped = true;
    if (this.timer) clearInterval(this.timer);
    this.timer = null;
  }

  private pollFailed(err: unknown): void {
    // The pool was closed (the app shut down): stop polling quietly.
    if (/destroyed|Unable to acquire a connection/i.test(String((err as Error)?.message))) this.stop();
    else this.log.warn({ err }, 'job poll failed');
  }

  private async drain(): Promise<void> {
    this.busy = true;
    try {
      do {
        this.again = false;
        for (;;) {
          if (this.stopped) return;
          const job = await claimJob(this.db, this.workerId, [...this.handlers.keys()]);
          if (!job) break;
          await this.runOne(job);
        }
      } while (this.again);
    } catch (err) {
      this.pollFailed(err);
    } finally {
      this.busy = false;
    }
  }

  private async runOne(job: JobRow): Promise<void> {
    const h = this.handlers.get(job.kind)!;
    let last = 0;
    let lastFraction = 0;
    let pending: Promise<void> = Promise.resolve();
    const ctx: JobContext = {
      progress: (fraction) => {
        if (Number.isFinite(fraction)) lastFraction = fraction;
        const now = Date.now();
        if (now - last < HEARTBEAT_MS && fraction < 1) return;
        last = now;
        fraction = lastFraction;
        pending = pending.then(() => heartbeatJob(this.db, job.id, this.workerId, fraction)).catch((err) => this.log.warn({ err }, 'job heartbeat failed'));
      },
    };
    // A long step without progress still proves the job alive.
    const beat = setInterval(() => ctx.progress(Number.NaN), 10_000);
    beat.unref();
    try {
      await h.run(job, ctx);
      await pending;
      await finishJob(this.db, job.id, this.workerId);
    } catch (e) {
      const err = e instanceof Error ? e : new Error(String(e));
      await pending;
      const status = await failJob(this.db, job.id, this.workerId, err.message);
      this.log.warn({ err, jobId: job.id, kind: job.kind, status }, 'job failed');
      await h.failed?.(job, err, status).catch((e2) => this.log.warn({ err: e2 }, 'job failure handler failed'));
    } finally {
      clearInterval(beat);
    }
  }
}

const runners = new WeakMap<Knex, JobRunner>();

/** One runner per database handle (one per app). */
export function jobRunnerFor(db: Knex, log: Logger): JobRunner {
  let r = runners.get(db);
  if (!r) {
    r = new JobRunner(db, log);
    runners.set(db, r);
  }
  return r;
}
