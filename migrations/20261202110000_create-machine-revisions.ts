import type { Knex } from 'knex';

/**
 * One revision number per production's machine breakdown, raised by PostgreSQL itself whenever a transaction
 * that wrote any row of the breakdown's tables commits (server/modules/machine/machine-cache.ts reads it
 * to know whether a cached figure is still valid).
 *
 * The triggers are deferred constraint triggers: they run at COMMIT, once per production and transaction
 * (a transaction-local setting remembers that it was done), so the revision row is locked only while the
 * transaction commits, never between its statements: no wait while a long edit runs and no deadlock with
 * the edit's own row locks. TRUNCATE, which fires no row triggers, raises every production's revision.
 *
 * It replaces a fingerprint computed from every row's xmin, which read all the production's breakdown rows
 * on each cached read: 2.4–2.7 ms of database CPU per mass-properties read of a 5,000-line section against
 * a primary-key lookup now (scripts/bench/load.ts, "CPU per request").
 */
const TABLES = ['machines', 'machine_sections', 'machine_assemblies', 'machine_part_lines', 'machine_part_instances', 'machine_section_add_ons', 'machine_weighings', 'machine_meshes'];

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('machine_revisions', (t) => {
    t.uuid('production_id').primary().references('productions.id').onDelete('CASCADE');
    t.bigInteger('revision').notNullable().defaultTo(1);
  });
  await knex.raw(`insert into machine_revisions (production_id) select id from productions`);
  await knex.raw(`
    create function ballast_machine_revision_bump() returns trigger language plpgsql as $$
    declare
      pid uuid := case when tg_op = 'DELETE' then old.production_id else new.production_id end;
      done_key text := 'ballast.machine_rev_' || replace(pid::text, '-', '');
    begin
      if coalesce(current_setting(done_key, true), '') <> '1' then
        -- A production deleted in this transaction took its breakdown and its revision row with it.
        insert into machine_revisions as r (production_id) select pid where exists (select 1 from productions where id = pid)
          on conflict (production_id) do update set revision = r.revision + 1;
        perform set_config(done_key, '1', true);
      end if;
      return null;
    end $$`);
  await knex.raw(`
    create function ballast_machine_revision_bump_all() returns trigger language plpgsql as $$
    begin
      update machine_revisions set revision = revision + 1;
      return null;
    end $$`);
  for (const t of TABLES) {
    await knex.raw(`create constraint trigger ${t}_revision after insert or update or delete on ${t} deferrable initially deferred for each row execute function ballast_machine_revision_bump()`);
    await knex.raw(`create trigger ${t}_revision_truncate after truncate on ${t} for each statement execute function ballast_machine_revision_bump_all()`);
  }
}

export async function down(knex: Knex): Promise<void> {
  for (const t of TABLES) {
    await knex.raw(`drop trigger if exists ${t}_revision on ${t}`);
    await knex.raw(`drop trigger if exists ${t}_revision_truncate on ${t}`);
  }
  await knex.raw('drop function if exists ballast_machine_revision_bump()');
  await knex.raw('drop function if exists ballast_machine_revision_bump_all()');
  await knex.schema.dropTableIfExists('machine_revisions');
}
