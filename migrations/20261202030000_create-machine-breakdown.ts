import type { Knex } from 'knex';

/**
 * The machine breakdown of a production: one machine, its assembly tree, part lines (with placed instances and
 * meshes), the transportable sections with their add-ons, materials, weighings, and staged imports.
 * Frame everywhere: right-handed, z up, millimetres, kilograms. Every table carries production_id so every
 * query can be scoped to the production in the path without a join.
 */
export async function up(knex: Knex): Promise<void> {
  const uuidPk = (t: Knex.CreateTableBuilder) => t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'));
  const production = (t: Knex.CreateTableBuilder) => t.uuid('production_id').notNullable().references('productions.id').onDelete('CASCADE');
  const editable = (t: Knex.CreateTableBuilder) => {
    t.integer('version').notNullable().defaultTo(1);
    t.timestamps(true, true);
  };

  await knex.schema.createTable('machines', (t) => {
    uuidPk(t);
    production(t);
    t.text('name').notNullable().defaultTo('');
    // Contingency margin, % of nominal mass, used where a section names none.
    t.decimal('margin_percent', 8, 3).notNullable().defaultTo(0);
    // Import column mapping and units, remembered for the next import of this machine.
    t.jsonb('import_mapping').notNullable().defaultTo('{}');
    editable(t);
    t.unique(['production_id']);
    t.check('margin_percent >= 0');
  });

  await knex.schema.createTable('machine_sections', (t) => {
    uuidPk(t);
    production(t);
    t.uuid('machine_id').notNullable().references('machines.id').onDelete('CASCADE');
    t.text('code').notNullable();
    t.text('name').notNullable().defaultTo('');
    // Null: the machine's margin applies.
    t.decimal('margin_percent', 8, 3);
    t.decimal('cog_uncertainty_mm', 12, 3);
    t.integer('sort_order').notNullable().defaultTo(0);
    editable(t);
    t.unique(['machine_id', 'code']);
    t.index(['production_id']);
    t.check('margin_percent is null or margin_percent >= 0');
    t.check('cog_uncertainty_mm is null or cog_uncertainty_mm >= 0');
  });

  await knex.schema.createTable('machine_assemblies', (t) => {
    uuidPk(t);
    production(t);
    t.uuid('machine_id').notNullable().references('machines.id').onDelete('CASCADE');
    t.text('number').notNullable();
    t.text('name').notNullable().defaultTo('');
    t.uuid('parent_id').references('machine_assemblies.id').onDelete('CASCADE');
    t.uuid('section_id').references('machine_sections.id').onDelete('SET NULL');
    t.boolean('keep_together').notNullable().defaultTo(false);
    t.text('notes').notNullable().defaultTo('');
    t.integer('sort_order').notNullable().defaultTo(0);
    editable(t);
    t.unique(['machine_id', 'number']);
    t.index(['production_id']);
    t.index(['parent_id']);
    t.index(['section_id']);
  });

  await knex.schema.createTable('machine_part_lines', (t) => {
    uuidPk(t);
    production(t);
    t.uuid('machine_id').notNullable().references('machines.id').onDelete('CASCADE');
    t.uuid('assembly_id').references('machine_assemblies.id').onDelete('CASCADE');
    t.uuid('section_id').references('machine_sections.id').onDelete('SET NULL');
    t.text('part_number').notNullable();
    t.text('name').notNullable().defaultTo('');
    t.decimal('quantity', 14, 3).notNullable().defaultTo(1);
    t.double('unit_mass_kg');
    t.text('mass_source');
    t.text('material');
    t.text('make_or_buy');
    t.decimal('value', 16, 2);
    t.text('currency');
    t.text('country_of_origin');
    t.specificType('serial_numbers', 'text[]').notNullable().defaultTo('{}');
    // CoG of one unit [x, y, z] and its box {minMm, maxMm}, mm; null = unknown (a gap, never zero).
    t.jsonb('cog_mm');
    t.jsonb('bbox_mm');
    // Inertia of one unit about its CoG, kg·mm² (from a mesh); null = taken from the box.
    t.jsonb('inertia_kg_mm2');
    t.text('notes').notNullable().defaultTo('');
    t.integer('sort_order').notNullable().defaultTo(0);
    editable(t);
    t.index(['production_id', 'sort_order']);
    t.index(['machine_id', 'part_number']);
    t.index(['assembly_id']);
    t.index(['section_id']);
    t.check('quantity >= 0');
    t.check('unit_mass_kg is null or unit_mass_kg >= 0');
    t.check(`mass_source is null or mass_source in ('weighed', 'catalogue', 'cad', 'estimated')`);
    t.check(`make_or_buy is null or make_or_buy in ('made', 'bought')`);
  });
  await knex.raw('create index machine_part_lines_search on machine_part_lines (production_id, lower(part_number) text_pattern_ops)');

  await knex.schema.createTable('machine_part_instances', (t) => {
    uuidPk(t);
    production(t);
    t.uuid('part_line_id').notNullable().references('machine_part_lines.id').onDelete('CASCADE');
    t.integer('seq').notNullable();
    t.double('x_mm').notNullable();
    t.double('y_mm').notNullable();
    t.double('z_mm').notNullable();
    // Euler angles Z-Y-X, degrees (R = Rz·Ry·Rx).
    t.double('rz_deg').notNullable().defaultTo(0);
    t.double('ry_deg').notNullable().defaultTo(0);
    t.double('rx_deg').notNullable().defaultTo(0);
    t.unique(['part_line_id', 'seq']);
    t.index(['production_id']);
  });

  await knex.schema.createTable('machine_section_add_ons', (t) => {
    uuidPk(t);
    production(t);
    t.uuid('section_id').notNullable().references('machine_sections.id').onDelete('CASCADE');
    t.text('name').notNullable();
    t.double('mass_kg');
    t.text('mass_source');
    t.jsonb('cog_mm');
    t.jsonb('bbox_mm');
    t.text('notes').notNullable().defaultTo('');
    editable(t);
    t.index(['production_id']);
    t.index(['section_id']);
    t.check('mass_kg is null or mass_kg >= 0');
    t.check(`mass_source is null or mass_source in ('weighed', 'catalogue', 'cad', 'estimated')`);
  });

  await knex.schema.createTable('machine_materials', (t) => {
    uuidPk(t);
    production(t);
    t.text('code').notNullable();
    t.text('name').notNullable();
    t.double('density_kg_per_m3').notNullable();
    t.text('source').notNullable().defaultTo('');
    editable(t);
    t.unique(['production_id', 'code']);
    t.check('density_kg_per_m3 > 0');
  });

  await knex.schema.createTable('machine_weighings', (t) => {
    uuidPk(t);
    production(t);
    t.uuid('section_id').notNullable().references('machine_sections.id').onDelete('CASCADE');
    t.date('weighed_on').notNullable();
    t.text('weighed_by').notNullable();
    t.text('scale').notNullable().defaultTo('');
    // [{ positionMm: [x, y], readingKg }], net of tare; one entry for a single reading.
    t.jsonb('readings').notNullable();
    // Derived by statics from the readings (the core's weighingFromLoadCells).
    t.double('mass_kg').notNullable();
    t.jsonb('cog_plan_mm');
    t.jsonb('derived_notes').notNullable().defaultTo('[]');
    t.text('notes').notNullable().defaultTo('');
    t.uuid('recorded_by').references('users.id').onDelete('SET NULL');
    editable(t);
    t.index(['production_id']);
    t.index(['section_id', 'weighed_on']);
  });

  await knex.schema.createTable('machine_meshes', (t) => {
    uuidPk(t);
    production(t);
    t.uuid('part_line_id').notNullable().references('machine_part_lines.id').onDelete('CASCADE');
    t.text('file_name').notNullable();
    t.text('length_unit').notNullable();
    // The STL as uploaded: backs up with the rest of the database.
    t.binary('stl').notNullable();
    t.integer('size_bytes').notNullable();
    t.integer('triangle_count').notNullable();
    t.double('volume_mm3').notNullable();
    t.text('material');
    t.double('density_kg_per_m3');
    t.double('mass_kg');
    t.jsonb('cog_mm').notNullable();
    t.jsonb('bbox_mm').notNullable();
    t.jsonb('inertia_kg_mm2');
    t.boolean('flipped').notNullable().defaultTo(false);
    t.uuid('uploaded_by').references('users.id').onDelete('SET NULL');
    t.timestamps(true, true);
    t.unique(['part_line_id']);
    t.index(['production_id']);
    t.check(`length_unit in ('mm', 'cm', 'm', 'in')`);
  });

  await knex.schema.createTable('machine_imports', (t) => {
    uuidPk(t);
    production(t);
    t.uuid('machine_id').notNullable().references('machines.id').onDelete('CASCADE');
    t.text('file_name').notNullable();
    t.text('status').notNullable().defaultTo('uploaded');
    t.jsonb('headers').notNullable();
    // The file's rows as text cells, kept so preview and commit need no second upload.
    t.jsonb('rows').notNullable();
    t.jsonb('mapping');
    t.jsonb('summary');
    t.integer('progress_done').notNullable().defaultTo(0);
    t.integer('progress_total').notNullable().defaultTo(0);
    t.text('error');
    t.uuid('created_by').references('users.id').onDelete('SET NULL');
    t.timestamps(true, true);
    t.index(['production_id']);
    t.check(`status in ('uploaded', 'previewed', 'committing', 'committed', 'failed')`);
  });
}

export async function down(knex: Knex): Promise<void> {
  for (const table of [
    'machine_imports',
    'machine_meshes',
    'machine_weighings',
    'machine_materials',
    'machine_section_add_ons',
    'machine_part_instances',
    'machine_part_lines',
    'machine_assemblies',
    'machine_sections',
    'machines',
  ]) {
    await knex.schema.dropTableIfExists(table);
  }
}
