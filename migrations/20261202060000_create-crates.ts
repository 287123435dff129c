import type { Knex } from 'knex';

/**
 * Crates of a production and what is in them. Frame: right-handed, z up, millimetres, kilograms.
 * section_id and part_line_id carry no foreign key here: the sections table belongs to the machine breakdown and
 * is linked in a later migration once it exists.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('crates', (t) => {
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'));
    t.uuid('production_id').notNullable().references('productions.id').onDelete('CASCADE');
    t.text('code').notNullable();
    t.text('name').notNullable().defaultTo('');
    t.text('kind').notNullable();
    // The section the crate is designed around (kind 'designed'); null for stock cases and pallets.
    t.uuid('section_id');
    t.decimal('inner_length_mm', 12, 3);
    t.decimal('inner_width_mm', 12, 3);
    t.decimal('inner_height_mm', 12, 3);
    t.decimal('outer_length_mm', 12, 3).notNullable();
    t.decimal('outer_width_mm', 12, 3).notNullable();
    t.decimal('outer_height_mm', 12, 3).notNullable();
    t.decimal('tare_kg', 12, 3).notNullable();
    t.decimal('max_gross_kg', 12, 3);
    t.boolean('stackable').notNullable().defaultTo(true);
    t.decimal('max_load_on_top_kg', 12, 3);
    t.boolean('this_way_up').notNullable().defaultTo(true);
    t.boolean('fragile').notNullable().defaultTo(false);
    t.boolean('may_tilt').notNullable().defaultTo(false);
    t.boolean('ispm15_required').notNullable().defaultTo(false);
    // Panel, base and skid make-up (the core's crate design input), or the stock/pallet catalogue entry.
    t.jsonb('design').notNullable().defaultTo('{}');
    t.text('notes').notNullable().defaultTo('');
    t.integer('version').notNullable().defaultTo(1);
    t.timestamps(true, true);
    t.unique(['production_id', 'code']);
    t.index(['section_id']);
    t.check(`kind in ('designed', 'stock', 'pallet')`);
    t.check('outer_length_mm > 0 and outer_width_mm > 0 and outer_height_mm > 0');
    t.check('tare_kg >= 0');
    t.check('max_gross_kg is null or max_gross_kg > 0');
    t.check('max_load_on_top_kg is null or max_load_on_top_kg >= 0');
  });

  await knex.schema.createTable('crate_contents', (t) => {
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'));
    t.uuid('production_id').notNullable().references('productions.id').onDelete('CASCADE');
    t.uuid('crate_id').notNullable().references('crates.id').onDelete('CASCADE');
    // One of these names the content, or neither for a loose line described in words.
    t.uuid('part_line_id');
    t.uuid('section_id');
    t.text('description').notNullable().defaultTo('');
    t.decimal('quantity', 14, 3).notNullable().defaultTo(1);
    // Mass of the whole line (all units), kg; null = unknown (a gap, never zero).
    t.decimal('mass_kg', 12, 3);
    // CoG of the line in the crate's frame [x, y, z] mm (origin at the crate's outer min corner); null = unknown.
    t.jsonb('cog_mm');
    t.integer('sort_order').notNullable().defaultTo(0);
    t.integer('version').notNullable().defaultTo(1);
    t.timestamps(true, true);
    t.index(['crate_id', 'sort_order']);
    t.index(['production_id']);
    t.check('quantity > 0');
    t.check('mass_kg is null or mass_kg >= 0');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists('crate_contents');
  await knex.schema.dropTableIfExists('crates');
}
