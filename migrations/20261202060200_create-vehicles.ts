import type { Knex } from 'knex';

/**
 * The vehicles and containers a production uses, and its load settings (chargeable-weight divisors,
 * manual-handling assumptions for crates). A vehicle's figures are kept whole as the core's Vehicle shape
 * (src/domain/vehicles/types.ts, checked by the contract in src/domain/contracts/vehicles.ts): load space,
 * door opening, payload, axle groups and CoG limits travel together.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('vehicles', (t) => {
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'));
    t.uuid('production_id').notNullable().references('productions.id').onDelete('CASCADE');
    t.text('code').notNullable();
    t.text('name').notNullable();
    t.text('kind').notNullable();
    // The catalogue entry it was made from (e.g. 'container-40hc-minimum'), null for a custom one.
    t.text('catalogue_id');
    t.jsonb('spec').notNullable();
    t.text('notes').notNullable().defaultTo('');
    t.integer('version').notNullable().defaultTo(1);
    t.timestamps(true, true);
    t.unique(['production_id', 'code']);
    t.check(`kind in ('container', 'semi-trailer', 'rigid-truck', 'air-pallet', 'custom')`);
  });

  await knex.schema.createTable('load_settings', (t) => {
    t.uuid('production_id').primary().references('productions.id').onDelete('CASCADE');
    // Air volumetric divisor, cm³ per kg (6,000 is the common figure; some carriers use 5,000).
    t.decimal('air_divisor_cm3_per_kg', 10, 2).notNullable().defaultTo(6000);
    // Road: kg charged per loading metre (carriers use 1,750–1,850).
    t.decimal('road_kg_per_loading_metre', 10, 2).notNullable().defaultTo(1750);
    // Manual handling of crates: the guideline column the crew is screened against.
    t.text('handling_column').notNullable().defaultTo('women');
    t.integer('version').notNullable().defaultTo(1);
    t.timestamps(true, true);
    t.check('air_divisor_cm3_per_kg > 0');
    t.check('road_kg_per_loading_metre > 0');
    t.check(`handling_column in ('men', 'women')`);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists('load_settings');
  await knex.schema.dropTableIfExists('vehicles');
}
