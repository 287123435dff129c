import type { Knex } from 'knex';

// Foundation: people, productions, memberships, invitations, password resets, sessions, sign-in
// rate limits, caught mail (development and tests), and the venues that venue users belong to.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('users', (t) => {
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'));
    t.text('email').notNullable();
    t.text('name').notNullable();
    t.text('password_hash');
    t.boolean('is_admin').notNullable().defaultTo(false);
    t.boolean('active').notNullable().defaultTo(true);
    t.text('units').notNullable().defaultTo('metric');
    t.integer('version').notNullable().defaultTo(1);
    t.timestamps(true, true);
    t.check(`units in ('metric', 'imperial')`);
  });
  await knex.raw('create unique index users_email_unique on users (lower(email))');

  await knex.schema.createTable('productions', (t) => {
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'));
    t.text('name').notNullable();
    t.text('machine_name').notNullable().defaultTo('');
    t.text('paper_size').notNullable().defaultTo('A4');
    t.text('default_units').notNullable().defaultTo('metric');
    t.integer('version').notNullable().defaultTo(1);
    t.timestamps(true, true);
    t.check(`paper_size in ('A4', 'Letter')`);
    t.check(`default_units in ('metric', 'imperial')`);
  });

  await knex.schema.createTable('venues', (t) => {
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'));
    t.uuid('production_id').notNullable().references('productions.id').onDelete('CASCADE');
    t.text('name').notNullable();
    t.text('city').notNullable().defaultTo('');
    t.text('country').notNullable().defaultTo('');
    t.integer('version').notNullable().defaultTo(1);
    t.timestamps(true, true);
    t.index(['production_id']);
  });

  await knex.schema.createTable('memberships', (t) => {
    t.uuid('production_id').notNullable().references('productions.id').onDelete('CASCADE');
    t.uuid('user_id').notNullable().references('users.id').onDelete('CASCADE');
    t.text('role').notNullable();
    t.specificType('venue_ids', 'uuid[]').notNullable().defaultTo('{}');
    t.integer('version').notNullable().defaultTo(1);
    t.timestamps(true, true);
    t.primary(['production_id', 'user_id']);
    t.index(['user_id']);
    t.check(`role in ('planner', 'rigger', 'venue')`);
  });

  await knex.schema.createTable('invitations', (t) => {
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'));
    t.text('email').notNullable();
    t.text('name').notNullable();
    t.boolean('is_admin').notNullable().defaultTo(false);
    t.uuid('production_id').references('productions.id').onDelete('CASCADE');
    t.text('role');
    t.specificType('venue_ids', 'uuid[]').notNullable().defaultTo('{}');
    // Only a hash of the token is stored: a database leak does not hand out accounts.
    t.text('token_hash').notNullable().unique();
    t.timestamp('expires_at', { useTz: true }).notNullable();
    t.timestamp('accepted_at', { useTz: true });
    t.uuid('invited_by').references('users.id').onDelete('SET NULL');
    t.timestamps(true, true);
  });

  await knex.schema.createTable('password_resets', (t) => {
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'));
    t.uuid('user_id').notNullable().references('users.id').onDelete('CASCADE');
    t.text('token_hash').notNullable().unique();
    t.timestamp('expires_at', { useTz: true }).notNullable();
    t.timestamp('used_at', { useTz: true });
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
  });

  // connect-pg-simple's table, as its table.sql defines it.
  await knex.schema.createTable('session', (t) => {
    t.string('sid').primary();
    t.json('sess').notNullable();
    t.timestamp('expire', { precision: 6 }).notNullable();
    t.index(['expire'], 'IDX_session_expire');
  });

  // rate-limiter-flexible's table (RateLimiterPostgres), shared by every app server.
  await knex.schema.createTable('rate_limits', (t) => {
    t.string('key', 255).primary();
    t.integer('points').notNullable().defaultTo(0);
    t.bigInteger('expire');
  });

  // Messages received by the local SMTP catcher (development and tests only), so every app
  // server can show them.
  await knex.schema.createTable('caught_mail', (t) => {
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'));
    t.text('mail_from').notNullable();
    t.specificType('rcpt_to', 'text[]').notNullable();
    t.text('subject').notNullable().defaultTo('');
    t.text('text_body').notNullable().defaultTo('');
    t.jsonb('attachments').notNullable().defaultTo('[]');
    t.integer('size_bytes').notNullable();
    t.timestamp('received_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
  });
}

export async function down(knex: Knex): Promise<void> {
  for (const table of ['caught_mail', 'rate_limits', 'session', 'password_resets', 'invitations', 'memberships', 'venues', 'productions', 'users']) {
    await knex.schema.dropTableIfExists(table);
  }
}
