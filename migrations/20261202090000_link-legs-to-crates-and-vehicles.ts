import type { Knex } from 'knex';

// The tour's legs were created before the crates and vehicles tables existed; now that both do,
// their links get foreign keys. Removing a crate or vehicle removes it from the legs it was on.
// (Scans keep their crate id without a key: a check-in record outlives a crate that was retired.)
export async function up(knex: Knex): Promise<void> {
  // Rows that point nowhere (none in a fresh database) would block the keys.
  await knex.raw('delete from leg_crates lc where not exists (select 1 from crates c where c.id = lc.crate_id)');
  await knex.raw('update leg_crates lc set vehicle_id = null where vehicle_id is not null and not exists (select 1 from vehicles v where v.id = lc.vehicle_id)');
  await knex.raw('delete from leg_vehicles lv where not exists (select 1 from vehicles v where v.id = lv.vehicle_id)');
  await knex.schema.alterTable('leg_crates', (t) => {
    t.foreign('crate_id').references('crates.id').onDelete('CASCADE');
    t.foreign('vehicle_id').references('vehicles.id').onDelete('SET NULL');
  });
  await knex.schema.alterTable('leg_vehicles', (t) => {
    t.foreign('vehicle_id').references('vehicles.id').onDelete('CASCADE');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('leg_vehicles', (t) => t.dropForeign(['vehicle_id']));
  await knex.schema.alterTable('leg_crates', (t) => {
    t.dropForeign(['vehicle_id']);
    t.dropForeign(['crate_id']);
  });
}
