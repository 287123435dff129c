import type { Knex } from 'knex';

/**
 * Revision numbers per production and scope, raised by PostgreSQL itself whenever a transaction that wrote
 * a row of the scope's tables commits. Caches of computed views (server/modules/revisions.ts) read them to
 * know whether a kept value is still valid, whichever app server or tool wrote the rows.
 *
 *   machine  the breakdown: mass properties, the breakdown's order and pages
 *   tour     venues, engagements, legs, crates, vehicles: the venue manifests
 *
 * The triggers are deferred constraint triggers: they run at COMMIT, once per production, scope and
 * transaction (a transaction-local setting remembers that it was done), so a revision row is locked only
 * while the transaction commits, never between its statements: no wait while a long edit runs and no
 * deadlock with the edit's own row locks. TRUNCATE, which fires no row triggers, raises every production's
 * revision of that scope.
 *
 * It replaces a fingerprint computed from every row's xmin, which read all the production's breakdown rows
 * on each cached read: 2.4–2.7 ms of database CPU per mass-properties read of a 5,000-line section against
 * a primary-key lookup now (scripts/bench/load.ts, "CPU per request").
 */
export const REVISION_TABLES: Record<'machine' | 'tour', Record<string, 'production_id' | 'id' | 'leg_id'>> = {
  machine: {
    machines: 'production_id',
    machine_sections: 'production_id',
    machine_assemblies: 'production_id',
    machine_part_lines: 'production_id',
    machine_part_instances: 'production_id',
    machine_section_add_ons: 'production_id',
    machine_weighings: 'production_id',
    machine_meshes: 'production_id',
  },
  tour: {
    productions: 'id',
    venues: 'production_id',
    hanging_points: 'production_id',
    engagements: 'production_id',
    tour_legs: 'production_id',
    leg_vehicles: 'leg_id',
    leg_crates: 'leg_id',
    vehicles: 'production_id',
    crates: 'production_id',
    crate_contents: 'production_id',
  },
};

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('production_revisions', (t) => {
    t.uuid('production_id').notNullable().references('productions.id').onDelete('CASCADE');
    t.text('scope').notNullable();
    t.bigInteger('revision').notNullable().defaultTo(1);
    t.primary(['production_id', 'scope']);
  });
  await knex.raw(`insert into production_revisions (production_id, scope) select id, s from productions, unnest(array['machine', 'tour']) s`);
  // Arguments: the scope, and where the row's production is: its production_id, its own id (productions),
  // or its leg's production (leg_vehicles, leg_crates; a leg deleted meanwhile raised the revision itself).
  await knex.raw(`
    create function ballast_revision_bump() returns trigger language plpgsql as $$
    declare
      rev_scope text := tg_argv[0];
      pid uuid;
      done_key text;
    begin
      if tg_argv[1] = 'id' then
        pid := case when tg_op = 'DELETE' then old.id else new.id end;
      elsif tg_argv[1] = 'leg_id' then
        select l.production_id into pid from tour_legs l where l.id = (case when tg_op = 'DELETE' then old.leg_id else new.leg_id end);
      else
        pid := case when tg_op = 'DELETE' then old.production_id else new.production_id end;
      end if;
      if pid is null then
        return null;
      end if;
      done_key := 'ballast.rev_' || rev_scope || '_' || replace(pid::text, '-', '');
      if coalesce(current_setting(done_key, true), '') <> '1' then
        -- A production deleted in this transaction took its rows and its revisions with it.
        insert into production_revisions as r (production_id, scope) select pid, rev_scope where exists (select 1 from productions where id = pid)
          on conflict (production_id, scope) do update set revision = r.revision + 1;
        perform set_config(done_key, '1', true);
      end if;
      return null;
    end $$`);
  await knex.raw(`
    create function ballast_revision_bump_all() returns trigger language plpgsql as $$
    begin
      update production_revisions set revision = revision + 1 where scope = tg_argv[0];
      return null;
    end $$`);
  for (const [scope, tables] of Object.entries(REVISION_TABLES)) {
    for (const [table, key] of Object.entries(tables)) {
      await knex.raw(
        `create constraint trigger ${table}_${scope}_revision after insert or update or delete on ${table} deferrable initially deferred for each row execute function ballast_revision_bump('${scope}', '${key}')`,
      );
      await knex.raw(`create trigger ${table}_${scope}_revision_truncate after truncate on ${table} for each statement execute function ballast_revision_bump_all('${scope}')`);
    }
  }
}

export async function down(knex: Knex): Promise<void> {
  for (const [scope, tables] of Object.entries(REVISION_TABLES)) {
    for (const table of Object.keys(tables)) {
      await knex.raw(`drop trigger if exists ${table}_${scope}_revision on ${table}`);
      await knex.raw(`drop trigger if exists ${table}_${scope}_revision_truncate on ${table}`);
    }
  }
  await knex.raw('drop function if exists ballast_revision_bump()');
  await knex.raw('drop function if exists ballast_revision_bump_all()');
  await knex.schema.dropTableIfExists('production_revisions');
}
