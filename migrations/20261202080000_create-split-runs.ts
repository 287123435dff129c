import type { Knex } from 'knex';

/**
 * Split advisor runs: the limits and the breakdown as the search saw them (so a proposal can be
 * re-checked and adopted against the same state), its progress and its proposals. The search runs as a
 * job (jobs table) on a worker thread.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('split_runs', (t) => {
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'));
    t.uuid('production_id').notNullable().references('productions.id').onDelete('CASCADE');
    t.uuid('job_id').references('jobs.id').onDelete('SET NULL');
    t.text('status').notNullable().defaultTo('queued');
    t.double('progress').notNullable().defaultTo(0);
    t.jsonb('limits').notNullable();
    t.jsonb('input').notNullable();
    t.jsonb('options').notNullable();
    t.text('stamp').notNullable();
    t.integer('machine_version').notNullable();
    t.jsonb('result');
    t.text('error');
    t.uuid('created_by').references('users.id').onDelete('SET NULL');
    t.timestamp('finished_at', { useTz: true });
    t.timestamps(true, true);
    t.index(['production_id', 'created_at']);
    t.check(`status in ('queued', 'running', 'done', 'failed')`);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists('split_runs');
}
