import type { Knex } from 'knex';

/**
 * Lift plans with their sign-off history, and the manual-handling task of each item.
 * A plan keeps what was typed (`inputs`), what the core was given (`evaluated_input`, with the load and
 * gear as they were) and what it answered (`result`). `fingerprint` hashes the evaluated input: when the
 * section, the gear or the plan changes, the fingerprint changes and an approval is withdrawn.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('lift_plans', (t) => {
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'));
    t.uuid('production_id').notNullable().references('productions.id').onDelete('CASCADE');
    t.uuid('section_id').references('machine_sections.id').onDelete('SET NULL');
    t.uuid('venue_id').references('venues.id').onDelete('SET NULL');
    t.text('title').notNullable();
    t.text('status').notNullable().defaultTo('draft');
    t.jsonb('inputs').notNullable();
    t.jsonb('evaluated_input').notNullable();
    t.jsonb('result').notNullable();
    t.text('verdict').notNullable();
    t.text('fingerprint').notNullable();
    t.uuid('author_id').references('users.id').onDelete('SET NULL');
    t.timestamp('submitted_at', { useTz: true });
    t.uuid('reviewer_id').references('users.id').onDelete('SET NULL');
    t.timestamp('reviewed_at', { useTz: true });
    t.text('review_comment').notNullable().defaultTo('');
    // The fingerprint the reviewer approved; any other fingerprint withdraws the approval.
    t.text('approved_fingerprint');
    t.integer('version').notNullable().defaultTo(1);
    t.timestamps(true, true);
    t.index(['production_id', 'status']);
    t.index(['section_id']);
    t.check(`status in ('draft', 'submitted', 'approved', 'rejected')`);
    t.check(`verdict in ('ok', 'over capacity', 'no verdict')`);
  });

  await knex.schema.createTable('lift_plan_events', (t) => {
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'));
    t.uuid('production_id').notNullable().references('productions.id').onDelete('CASCADE');
    t.uuid('plan_id').notNullable().references('lift_plans.id').onDelete('CASCADE');
    t.text('kind').notNullable();
    t.uuid('actor_id').references('users.id').onDelete('SET NULL');
    t.text('comment').notNullable().defaultTo('');
    t.text('verdict');
    t.text('fingerprint');
    // clock_timestamp(): events written in one transaction keep their order.
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.raw('clock_timestamp()'));
    t.index(['plan_id', 'created_at']);
    t.check(`kind in ('created', 'edited', 'submitted', 'approved', 'rejected', 'approval-withdrawn', 'returned-to-draft')`);
  });

  await knex.schema.createTable('handling_tasks', (t) => {
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'));
    t.uuid('production_id').notNullable().references('productions.id').onDelete('CASCADE');
    t.text('item_kind').notNullable();
    t.uuid('item_id').notNullable();
    t.jsonb('task').notNullable();
    t.uuid('updated_by').references('users.id').onDelete('SET NULL');
    t.integer('version').notNullable().defaultTo(1);
    t.timestamps(true, true);
    t.unique(['production_id', 'item_kind', 'item_id']);
    t.check(`item_kind in ('section', 'loose-part', 'crate')`);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists('handling_tasks');
  await knex.schema.dropTableIfExists('lift_plan_events');
  await knex.schema.dropTableIfExists('lift_plans');
}
