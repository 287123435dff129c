import type { Knex } from 'knex';

// Packing and split runs point at their job with ON DELETE SET NULL. Without an index on job_id, every job
// deleted (a run deleted with its queued job) made PostgreSQL scan all runs of every production to find
// the ones pointing at it: 1.3–4.9 ms per job at 3,000 runs, growing with each run, against 0.5 ms with
// the index (measured while building the load benchmark's clean-up of the runs it starts).
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('packing_runs', (t) => t.index(['job_id']));
  await knex.schema.alterTable('split_runs', (t) => t.index(['job_id']));
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('packing_runs', (t) => t.dropIndex(['job_id']));
  await knex.schema.alterTable('split_runs', (t) => t.dropIndex(['job_id']));
}
