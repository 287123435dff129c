import type { Knex } from 'knex';

/**
 * Check-in and check-out scans: who scanned which crate, when, at which engagement, in which direction
 * and in what state. The client makes up an idempotency key for each scan, so a scan sent twice (a retry
 * after a dropped connection, an offline queue sent again) is stored once. Photos of damage are kept in
 * the database, so nothing is left on an app server's disk.
 *
 * crate_id has no foreign key yet (see 20261202050200_create-tour).
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('crate_scans', (t) => {
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'));
    t.uuid('production_id').notNullable().references('productions.id').onDelete('CASCADE');
    t.uuid('engagement_id').notNullable().references('engagements.id').onDelete('CASCADE');
    t.uuid('crate_id').notNullable();
    t.text('direction').notNullable();
    t.text('state').notNullable();
    t.text('method').notNullable().defaultTo('list');
    t.text('note').notNullable().defaultTo('');
    t.text('idempotency_key').notNullable();
    t.uuid('scanned_by').references('users.id').onDelete('SET NULL');
    // When the person scanned (the phone's clock, perhaps offline), and when the server got it.
    t.timestamp('scanned_at', { useTz: true }).notNullable();
    t.timestamp('received_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.unique(['production_id', 'idempotency_key']);
    t.index(['engagement_id', 'crate_id', 'direction']);
    t.check(`direction in ('in', 'out')`);
    t.check(`state in ('arrived', 'damaged', 'missing')`);
    t.check(`method in ('qr', 'list')`);
  });

  await knex.schema.createTable('crate_scan_photos', (t) => {
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'));
    t.uuid('production_id').notNullable().references('productions.id').onDelete('CASCADE');
    t.uuid('scan_id').notNullable().references('crate_scans.id').onDelete('CASCADE');
    t.text('filename').notNullable();
    t.text('content_type').notNullable();
    t.integer('size_bytes').notNullable();
    t.binary('content').notNullable();
    t.uuid('uploaded_by').references('users.id').onDelete('SET NULL');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.index(['scan_id']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists('crate_scan_photos');
  await knex.schema.dropTableIfExists('crate_scans');
}
