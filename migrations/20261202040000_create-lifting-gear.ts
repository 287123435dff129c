import type { Knex } from 'knex';

/**
 * Lifting: production lifting settings, the rigging gear inventory and venues' hanging points.
 * Gear items keep their kind-specific fields (ratings, lengths, hitch factors, angle derating) as the
 * core's shape in `spec`; identifier and inspection date are columns so they can be listed and checked.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('lifting_settings', (t) => {
    t.uuid('production_id').primary().references('productions.id').onDelete('CASCADE');
    t.text('handling_method').notNullable().defaultTo('niosh');
    t.text('guideline_column').notNullable().defaultTo('women');
    t.double('handling_threshold_kg').notNullable().defaultTo(5);
    t.integer('max_team_size').notNullable().defaultTo(3);
    t.double('dynamic_factor').notNullable();
    t.text('dynamic_factor_source').notNullable();
    t.text('hoist_rule_set').notNullable();
    t.double('exclusion_margin_mm').notNullable().defaultTo(1000);
    t.integer('version').notNullable().defaultTo(1);
    t.timestamps(true, true);
    t.check(`handling_method in ('niosh', 'uk-guideline')`);
    t.check(`guideline_column in ('men', 'women')`);
    t.check('max_team_size between 1 and 3');
    t.check('dynamic_factor >= 1');
    t.check('exclusion_margin_mm >= 0');
  });

  await knex.schema.createTable('lifting_gear', (t) => {
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'));
    t.uuid('production_id').notNullable().references('productions.id').onDelete('CASCADE');
    t.text('kind').notNullable();
    t.text('identifier').notNullable();
    t.text('description');
    // Calendar date as text (YYYY-MM-DD): compared as a date, free of time zones.
    t.text('next_inspection_date').notNullable();
    t.jsonb('spec').notNullable();
    t.integer('version').notNullable().defaultTo(1);
    t.timestamps(true, true);
    t.unique(['production_id', 'identifier']);
    t.check(`kind in ('hoist', 'sling', 'shackle', 'lifting-point', 'spreader-beam')`);
    t.check(`next_inspection_date ~ '^[0-9]{4}-[0-9]{2}-[0-9]{2}$'`);
  });

  await knex.schema.createTable('hanging_points', (t) => {
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'));
    t.uuid('production_id').notNullable().references('productions.id').onDelete('CASCADE');
    t.uuid('venue_id').notNullable().references('venues.id').onDelete('CASCADE');
    t.text('label').notNullable();
    // Null: the venue has not said (a gap, never a pass).
    t.double('rating_kg');
    t.text('notes').notNullable().defaultTo('');
    t.integer('version').notNullable().defaultTo(1);
    t.timestamps(true, true);
    t.unique(['venue_id', 'label']);
    t.index(['production_id']);
    t.check('rating_kg is null or rating_kg > 0');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists('hanging_points');
  await knex.schema.dropTableIfExists('lifting_gear');
  await knex.schema.dropTableIfExists('lifting_settings');
}
