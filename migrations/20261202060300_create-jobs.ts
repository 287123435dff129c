import type { Knex } from 'knex';

/**
 * A small PostgreSQL job queue (server/jobs): any app server claims the oldest queued job with
 * `FOR UPDATE SKIP LOCKED`, so several servers share the work without a broker. A running job writes a
 * heartbeat with its progress; a job whose heartbeat stops (its server died) is queued again.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('jobs', (t) => {
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'));
    t.uuid('production_id').references('productions.id').onDelete('CASCADE');
    t.text('kind').notNullable();
    t.jsonb('payload').notNullable().defaultTo('{}');
    t.text('status').notNullable().defaultTo('queued');
    t.double('progress').notNullable().defaultTo(0);
    t.integer('attempts').notNullable().defaultTo(0);
    t.integer('max_attempts').notNullable().defaultTo(2);
    t.text('locked_by');
    t.timestamp('heartbeat_at', { useTz: true });
    t.text('last_error');
    t.timestamp('run_after', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp('started_at', { useTz: true });
    t.timestamp('finished_at', { useTz: true });
    t.timestamps(true, true);
    t.check(`status in ('queued', 'running', 'done', 'failed')`);
    t.check('progress >= 0 and progress <= 1');
  });
  await knex.raw(`create index jobs_queued on jobs (run_after, created_at) where status = 'queued'`);
  await knex.raw(`create index jobs_running on jobs (heartbeat_at) where status = 'running'`);
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists('jobs');
}
