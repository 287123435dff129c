import type { Knex } from 'knex';

/**
 * Hanging points of a venue (beams, eyes in the grid) with their working load limits, for the lifting
 * plans. A point whose rating the venue has not given keeps wll_kg null: no plan may count on it.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('venue_hanging_points', (t) => {
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'));
    t.uuid('production_id').notNullable().references('productions.id').onDelete('CASCADE');
    t.uuid('venue_id').notNullable().references('venues.id').onDelete('CASCADE');
    t.text('name').notNullable();
    t.decimal('wll_kg', 12, 3);
    // Height of the point above the stage floor, mm; null when not known.
    t.decimal('height_mm', 12, 3);
    t.text('location').notNullable().defaultTo('');
    t.text('notes').notNullable().defaultTo('');
    t.integer('version').notNullable().defaultTo(1);
    t.timestamps(true, true);
    t.unique(['venue_id', 'name']);
    t.index(['production_id']);
    t.check('wll_kg is null or wll_kg > 0');
    t.check('height_mm is null or height_mm > 0');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists('venue_hanging_points');
}
