import type { Knex } from 'knex';

// The CAD volume of one unit of a part line (mm³), as parts lists carry it; with the material's density it
// gives a CAD mass when the list has no mass.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('machine_part_lines', (t) => {
    t.double('volume_mm3');
    t.check('volume_mm3 is null or volume_mm3 > 0', {}, 'machine_part_lines_volume_positive');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('machine_part_lines', (t) => {
    t.dropChecks('machine_part_lines_volume_positive');
    t.dropColumn('volume_mm3');
  });
}
