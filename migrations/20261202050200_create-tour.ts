import type { Knex } from 'knex';

/**
 * The tour of a production: its engagements (a venue with load-in, show and load-out dates, in tour
 * order), the legs that bring the load to each engagement, the vehicles of each leg, and which crates
 * travel on it (some stay behind or travel ahead).
 *
 * crate_id and vehicle_id carry no foreign key here: the crates and vehicles tables are created by later
 * migrations (20261202060000_create-crates, 20261202060200_create-vehicles); a migration after those should
 * add the keys. Every read joins crates and vehicles, so a deleted one drops out of every leg.
 */
export async function up(knex: Knex): Promise<void> {
  const uuidPk = (t: Knex.CreateTableBuilder) => t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'));
  const production = (t: Knex.CreateTableBuilder) => t.uuid('production_id').notNullable().references('productions.id').onDelete('CASCADE');
  const editable = (t: Knex.CreateTableBuilder) => {
    t.integer('version').notNullable().defaultTo(1);
    t.timestamps(true, true);
  };

  await knex.schema.createTable('engagements', (t) => {
    uuidPk(t);
    production(t);
    t.uuid('venue_id').notNullable().references('venues.id').onDelete('RESTRICT');
    t.integer('sort_order').notNullable().defaultTo(0);
    t.date('load_in_on').notNullable();
    t.date('show_first_on').notNullable();
    t.date('show_last_on').notNullable();
    t.date('load_out_on').notNullable();
    t.text('notes').notNullable().defaultTo('');
    editable(t);
    t.index(['production_id', 'sort_order']);
    t.index(['venue_id']);
    t.check('load_in_on <= show_first_on and show_first_on <= show_last_on and show_last_on <= load_out_on');
  });

  await knex.schema.createTable('tour_legs', (t) => {
    uuidPk(t);
    production(t);
    // Null: the leg starts at the workshop (the first leg of the tour).
    t.uuid('from_engagement_id').references('engagements.id').onDelete('SET NULL');
    t.uuid('to_engagement_id').notNullable().references('engagements.id').onDelete('CASCADE');
    t.date('departs_on');
    t.text('notes').notNullable().defaultTo('');
    editable(t);
    // One leg brings the load to each engagement.
    t.unique(['to_engagement_id']);
    t.index(['production_id']);
  });

  await knex.schema.createTable('leg_vehicles', (t) => {
    t.uuid('leg_id').notNullable().references('tour_legs.id').onDelete('CASCADE');
    t.uuid('vehicle_id').notNullable();
    t.integer('sort_order').notNullable().defaultTo(0);
    t.primary(['leg_id', 'vehicle_id']);
  });

  await knex.schema.createTable('leg_crates', (t) => {
    t.uuid('leg_id').notNullable().references('tour_legs.id').onDelete('CASCADE');
    t.uuid('crate_id').notNullable();
    t.uuid('vehicle_id');
    // Order of unloading at the engagement (load-in order of the manifest).
    t.integer('load_order').notNullable().defaultTo(0);
    t.primary(['leg_id', 'crate_id']);
    t.index(['crate_id']);
  });
}

export async function down(knex: Knex): Promise<void> {
  for (const table of ['leg_crates', 'leg_vehicles', 'tour_legs', 'engagements']) await knex.schema.dropTableIfExists(table);
}
