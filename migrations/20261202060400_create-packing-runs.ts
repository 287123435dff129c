import type { Knex } from 'knex';

/**
 * Packing runs: crates into a set of vehicles, for a leg of the tour or ad hoc. The input is kept as it
 * was when the run started (vehicles and crates as the engine saw them), so the result can always be
 * re-checked; hand edits (pinned or moved crates) are saved into the result and re-checked by the
 * validator. leg_id carries no foreign key: the tour's legs live in another module.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('packing_runs', (t) => {
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'));
    t.uuid('production_id').notNullable().references('productions.id').onDelete('CASCADE');
    t.text('name').notNullable();
    t.uuid('leg_id');
    t.uuid('job_id').references('jobs.id').onDelete('SET NULL');
    t.text('status').notNullable().defaultTo('queued');
    t.double('progress').notNullable().defaultTo(0);
    t.double('best_utilisation');
    t.jsonb('input').notNullable();
    t.jsonb('result');
    t.jsonb('figures');
    t.text('error');
    t.uuid('created_by').references('users.id').onDelete('SET NULL');
    t.timestamp('started_at', { useTz: true });
    t.timestamp('finished_at', { useTz: true });
    t.integer('version').notNullable().defaultTo(1);
    t.timestamps(true, true);
    t.index(['production_id', 'created_at']);
    t.index(['leg_id']);
    t.check(`status in ('queued', 'running', 'done', 'failed')`);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists('packing_runs');
}
