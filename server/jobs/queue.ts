import type { Knex } from 'knex';

/**
 * A small job queue in PostgreSQL, shared by every app server through the `jobs` table.
 *
 * Why our own and not pg-boss: the project's package set is fixed for this work, and a run needs exactly
 * four things — enqueue inside the caller's transaction (the run row and its job appear together or not at
 * all), claim with `FOR UPDATE SKIP LOCKED` so several servers never take the same job, a heartbeat that
 * carries the progress, and re-queueing of a job whose server died. That is one table and a few queries
 * on the knex pool the app already has; pg-boss would bring its own schema, pool and lifecycle to
 * manage beside knex's migrations for no gain here.
 */

export type JobStatus = 'queued' | 'running' | 'done' | 'failed';

export interface JobRow {
  id: string;
  production_id: string | null;
  kind: string;
  payload: Record<string, unknown>;
  status: JobStatus;
  progress: number;
  attempts: number;
  max_attempts: number;
  locked_by: string | null;
  heartbeat_at: Date | null;
  last_error: string | null;
  run_after: Date;
  started_at: Date | null;
  finished_at: Date | null;
  created_at: Date;
}

/** Adds a job; pass a transaction to enqueue together with the rows it works on. */
export async function enqueueJob(db: Knex, job: { kind: string; productionId?: string | null; payload: Record<string, unknown>; maxAttempts?: number }): Promise<JobRow> {
  const [row] = await db<JobRow>('jobs')
    .insert({ kind: job.kind, production_id: job.productionId ?? null, payload: JSON.stringify(job.payload) as never, max_attempts: job.maxAttempts ?? 2 })
    .returning('*');
  return row;
}

/** Takes the oldest due job of the given kinds for this worker, or null. Never the same job twice. */
export async function claimJob(db: Knex, workerId: string, kinds: readonly string[]): Promise<JobRow | null> {
  if (kinds.length === 0) return null;
  const { rows } = (await db.raw(
    `update jobs set status = 'running', locked_by = ?, attempts = attempts + 1, heartbeat_at = now(),
            started_at = coalesce(started_at, now()), updated_at = now()
      where id = (select id from jobs where status = 'queued' and run_after <= now() and kind = any(?)
                  order by run_after, created_at for update skip locked limit 1)
      returning *`,
    [workerId, kinds as string[]],
  )) as { rows: JobRow[] };
  return rows[0] ?? null;
}

/** Progress 0..1 and proof of life; only while this worker still holds the job. */
export async function heartbeatJob(db: Knex, id: string, workerId: string, progress: number): Promise<void> {
  await db('jobs')
    .where({ id, locked_by: workerId, status: 'running' })
    .update({ progress: Math.min(1, Math.max(0, progress)), heartbeat_at: db.fn.now(), updated_at: db.fn.now() });
}

export async function finishJob(db: Knex, id: string, workerId: string): Promise<void> {
  await db('jobs').where({ id, locked_by: workerId }).update({ status: 'done', progress: 1, finished_at: db.fn.now(), updated_at: db.fn.now() });
}

/** A failed attempt: queued again after a pause while attempts remain, else failed for good. Returns the new status. */
export async function failJob(db: Knex, id: string, workerId: string, error: string): Promise<JobStatus> {
  const [row] = await db('jobs')
    .where({ id, locked_by: workerId })
    .update({
      status: db.raw(`case when attempts < max_attempts then 'queued' else 'failed' end`) as never,
      run_after: db.raw(`now() + interval '5 seconds'`) as never,
      finished_at: db.raw(`case when attempts < max_attempts then null else now() end`) as never,
      last_error: error.slice(0, 4000),
      locked_by: null,
      updated_at: db.fn.now() as never,
    })
    .returning('status');
  return (row?.status as JobStatus | undefined) ?? 'failed';
}

/** Jobs whose heartbeat stopped (their server died mid-run) go back to the queue, or fail when out of attempts. */
export async function requeueStaleJobs(db: Knex, staleSeconds: number): Promise<number> {
  return db('jobs')
    .where({ status: 'running' })
    .andWhere('heartbeat_at', '<', db.raw(`now() - (? * interval '1 second')`, [staleSeconds]))
    .update({
      status: db.raw(`case when attempts < max_attempts then 'queued' else 'failed' end`),
      last_error: 'The server running this job stopped answering.',
      locked_by: null,
      updated_at: db.fn.now(),
    });
}
