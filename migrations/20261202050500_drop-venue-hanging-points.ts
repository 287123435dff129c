import type { Knex } from 'knex';

/**
 * Hanging points live in the lifting tables (`hanging_points`, 20261202040000_create-lifting-gear), where the
 * lift plans use them; the venue module's own table of them is dropped so that there is one list.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists('venue_hanging_points');
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.createTable('venue_hanging_points', (t) => {
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'));
    t.uuid('production_id').notNullable().references('productions.id').onDelete('CASCADE');
    t.uuid('venue_id').notNullable().references('venues.id').onDelete('CASCADE');
    t.text('name').notNullable();
    t.decimal('wll_kg', 12, 3);
    t.decimal('height_mm', 12, 3);
    t.text('location').notNullable().defaultTo('');
    t.text('notes').notNullable().defaultTo('');
    t.integer('version').notNullable().defaultTo(1);
    t.timestamps(true, true);
    t.unique(['venue_id', 'name']);
    t.index(['production_id']);
  });
}
