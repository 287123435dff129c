import type { Knex } from 'knex';

/**
 * Links crates and crate contents to the machine breakdown, now that its tables exist: a section or part
 * line that is deleted leaves the crate (and its content line, described in words) in place, unlinked.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('crates', (t) => {
    t.foreign('section_id').references('machine_sections.id').onDelete('SET NULL');
  });
  await knex.schema.alterTable('crate_contents', (t) => {
    t.foreign('section_id').references('machine_sections.id').onDelete('SET NULL');
    t.foreign('part_line_id').references('machine_part_lines.id').onDelete('SET NULL');
    t.index(['section_id']);
    t.index(['part_line_id']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('crate_contents', (t) => {
    t.dropIndex(['part_line_id']);
    t.dropIndex(['section_id']);
    t.dropForeign(['part_line_id']);
    t.dropForeign(['section_id']);
  });
  await knex.schema.alterTable('crates', (t) => {
    t.dropForeign(['section_id']);
  });
}
