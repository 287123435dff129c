import type { Knex } from 'knex';

// Two indexes of part lines that no query uses (the breakdown searches with ilike '%…%', which a b-tree cannot
// serve, and every query is scoped by production, not machine): dropped, as each one costs every import row.
export async function up(knex: Knex): Promise<void> {
  await knex.raw('drop index if exists machine_part_lines_search');
  await knex.schema.alterTable('machine_part_lines', (t) => t.dropIndex(['machine_id', 'part_number']));
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('machine_part_lines', (t) => t.index(['machine_id', 'part_number']));
  await knex.raw('create index machine_part_lines_search on machine_part_lines (production_id, lower(part_number) text_pattern_ops)');
}
