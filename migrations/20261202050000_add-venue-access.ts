import type { Knex } from 'knex';

/**
 * Venue access data (issue 6): the route from the vehicle to the stage as the access core reads it
 * (src/domain/contracts/access.ts `venueAccess`, plus the stage floor rating), the venue's contacts, and
 * the units its paperwork is printed in. A measure nobody has given is null in the JSON, never 0, so the
 * check says "not checked: … unknown" instead of passing.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('venues', (t) => {
    t.jsonb('access').notNullable().defaultTo(JSON.stringify({ doors: [] }));
    t.jsonb('contacts').notNullable().defaultTo('[]');
    t.text('address').notNullable().defaultTo('');
    t.text('notes').notNullable().defaultTo('');
    // Null: the production's default units.
    t.text('paperwork_units');
    t.check(`paperwork_units is null or paperwork_units in ('metric', 'imperial')`, [], 'venues_paperwork_units_check');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('venues', (t) => {
    t.dropChecks(['venues_paperwork_units_check']);
    t.dropColumns('access', 'contacts', 'address', 'notes', 'paperwork_units');
  });
}
