import type { Knex } from 'knex';

/**
 * The material catalogue (PRODUCT.md, the chain step 1): material systems ->
 * batches -> panels, the reference lists of test properties, test methods
 * (with the properties each yields and whether they are fibre- or
 * matrix-dominated) and environmental conditions, and the per-material mapping
 * from (test method, property, quantity) to the lamina field the laminate
 * engine reads.
 *
 * Integer ids (not bigint): pg returns them as JS numbers. Composite unique
 * keys (id, parent_id) let child tables prove, by foreign key, that a panel
 * belongs to the batch and the batch to the material they name.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('test_properties', (t) => {
    t.text('code').primary().comment('what a coupon is loaded for, e.g. tension-0, in-plane-shear');
    t.text('label').notNullable();
    t.integer('sort_order').notNullable().defaultTo(0);
  });
  await knex.raw(`alter table test_properties add constraint test_properties_code_check check (code ~ '^[a-z0-9]+(-[a-z0-9]+)*$')`);

  await knex.schema.createTable('test_methods', (t) => {
    t.increments('id').primary();
    t.text('code').notNullable().unique().comment('short reference used in CSV files, e.g. ASTM D3039');
    t.text('standard_ref').notNullable().comment('full standard reference, e.g. ASTM D3039/D3039M');
    t.text('title').notNullable();
    t.bigInteger('created_by').references('users.id');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
  });

  await knex.schema.createTable('test_method_properties', (t) => {
    t.integer('test_method_id').notNullable().references('test_methods.id').onDelete('CASCADE');
    t.text('property_code').notNullable().references('test_properties.code');
    t.text('dominance').notNullable().comment('fibre-dominated values are normalised to nominal cured ply thickness');
    t.primary(['test_method_id', 'property_code']);
  });
  await knex.raw(`alter table test_method_properties add constraint test_method_properties_dominance_check
    check (dominance in ('fibre-dominated', 'matrix-dominated', 'not-applicable'))`);

  await knex.schema.createTable('conditions', (t) => {
    t.increments('id').primary();
    t.text('code').notNullable().unique().comment('e.g. RTD, ETW');
    t.text('label').notNullable();
    t.double('temperature_c').notNullable();
    t.text('moisture_state').notNullable();
    t.integer('sort_order').notNullable().defaultTo(0);
  });
  await knex.raw(`alter table conditions add constraint conditions_moisture_check check (moisture_state in ('dry', 'wet', 'ambient'));
    alter table conditions add constraint conditions_temperature_check check (temperature_c between -273.15 and 1000);
    alter table conditions add constraint conditions_code_check check (code ~ '^[A-Za-z0-9][A-Za-z0-9_-]*$')`);

  await knex.schema.createTable('material_systems', (t) => {
    t.increments('id').primary();
    t.text('code').notNullable().unique().comment('designation used in CSV files, e.g. FR-UC300');
    t.text('name').notNullable();
    t.text('form').notNullable();
    t.text('fibre').notNullable();
    t.text('resin').notNullable();
    t.double('nominal_cured_ply_thickness_mm').comment('for a core: its nominal thickness');
    t.double('fibre_areal_weight_g_m2');
    t.double('resin_content_pct').comment('by mass');
    t.double('density_kg_m3');
    t.text('specification_ref');
    t.text('notes');
    t.boolean('invented').notNullable().defaultTo(false).comment('true for the invented demo scenario');
    t.bigInteger('created_by').references('users.id');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp('updated_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
  });
  await knex.raw(`
    alter table material_systems add constraint material_systems_form_check
      check (form in ('unidirectional-tape', 'woven-fabric', 'non-crimp-fabric', 'core'));
    alter table material_systems add constraint material_systems_ply_thickness_check
      check (nominal_cured_ply_thickness_mm > 0 and nominal_cured_ply_thickness_mm < 100);
    alter table material_systems add constraint material_systems_ply_thickness_required
      check (form = 'core' or nominal_cured_ply_thickness_mm is not null);
    alter table material_systems add constraint material_systems_faw_check check (fibre_areal_weight_g_m2 > 0);
    alter table material_systems add constraint material_systems_resin_content_check check (resin_content_pct > 0 and resin_content_pct < 100);
    alter table material_systems add constraint material_systems_density_check check (density_kg_m3 > 0 and density_kg_m3 < 25000);
    alter table material_systems add constraint material_systems_code_check check (code ~ '^[A-Za-z0-9][A-Za-z0-9._/-]*$');
  `);

  await knex.schema.createTable('batches', (t) => {
    t.increments('id').primary();
    t.integer('material_id').notNullable().references('material_systems.id');
    t.text('code').notNullable().comment('the lot or batch designation');
    t.date('manufactured_on');
    t.text('notes');
    t.bigInteger('created_by').references('users.id');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.unique(['material_id', 'code']);
    t.unique(['id', 'material_id']);
  });

  await knex.schema.createTable('panels', (t) => {
    t.increments('id').primary();
    t.integer('batch_id').notNullable().references('batches.id');
    t.text('code').notNullable();
    t.date('cured_on');
    t.text('notes');
    t.bigInteger('created_by').references('users.id');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.unique(['batch_id', 'code']);
    t.unique(['id', 'batch_id']);
  });
  await knex.raw(`alter table batches add constraint batches_code_check check (length(trim(code)) > 0);
    alter table panels add constraint panels_code_check check (length(trim(code)) > 0)`);

  await knex.schema.createTable('ply_field_mappings', (t) => {
    t.integer('material_id').notNullable().references('material_systems.id').onDelete('CASCADE');
    t.text('lamina_field').notNullable().comment('E1, E2, G12, nu12, Xt, Xc, Yt, Yc, S12, e1t, e1c, e2t, e2c, g12u');
    t.integer('test_method_id').notNullable();
    t.text('property_code').notNullable();
    t.text('quantity').notNullable();
    t.primary(['material_id', 'lamina_field']);
    t.foreign(['test_method_id', 'property_code']).references(['test_method_id', 'property_code']).inTable('test_method_properties');
  });
  await knex.raw(`
    alter table ply_field_mappings add constraint ply_field_mappings_field_check
      check (lamina_field in ('E1', 'E2', 'G12', 'nu12', 'Xt', 'Xc', 'Yt', 'Yc', 'S12', 'e1t', 'e1c', 'e2t', 'e2c', 'g12u'));
    alter table ply_field_mappings add constraint ply_field_mappings_quantity_check
      check (quantity in ('strength', 'modulus', 'failure-strain', 'poisson-ratio'));
  `);
}

export async function down(knex: Knex): Promise<void> {
  for (const table of ['ply_field_mappings', 'panels', 'batches', 'material_systems', 'conditions', 'test_method_properties', 'test_methods', 'test_properties']) {
    await knex.schema.dropTableIfExists(table);
  }
}
