import type { Knex } from 'knex';

/**
 * Uploads of coupon results and the specimens (coupons) they brought in.
 * - uploads keeps the file itself, its SHA-256 (unique: one file is imported
 *   once) and its size and row count.
 * - specimens carries material, batch and panel ids with composite foreign keys,
 *   so a specimen cannot name a panel of another batch or a batch of another
 *   material; the (test method, property) pair must be one the method yields.
 * - An excluded specimen always says why and who excluded it.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('uploads', (t) => {
    t.increments('id').primary();
    t.text('file_name').notNullable();
    t.specificType('sha256', 'char(64)').notNullable().unique();
    t.bigInteger('size_bytes').notNullable();
    t.integer('row_count').notNullable();
    t.text('content_type').notNullable().defaultTo('text/csv');
    t.binary('content').notNullable().comment('the file as received');
    t.jsonb('column_mapping').notNullable().defaultTo('{}').comment('template field -> column header of the file');
    t.jsonb('units').notNullable().defaultTo('{}').comment('units the file was read in (stress, length, force)');
    t.jsonb('created_catalogue').notNullable().defaultTo('{}').comment('batches and panels the import registered');
    t.boolean('invented').notNullable().defaultTo(false).comment('true for the generated demo data');
    t.bigInteger('uploaded_by').notNullable().references('users.id');
    t.text('uploaded_by_name').notNullable().comment('name at the time, kept if the user is renamed');
    t.timestamp('uploaded_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.index(['uploaded_at']);
  });
  await knex.raw(`
    alter table uploads add constraint uploads_sha256_check check (sha256 ~ '^[0-9a-f]{64}$');
    alter table uploads add constraint uploads_size_check check (size_bytes > 0 and size_bytes = octet_length(content));
    alter table uploads add constraint uploads_row_count_check check (row_count > 0);
    alter table uploads add constraint uploads_file_name_check check (length(trim(file_name)) > 0);
  `);

  await knex.schema.createTable('specimens', (t) => {
    t.increments('id').primary();
    t.text('specimen_code').notNullable().unique().comment('the laboratory specimen id');
    t.integer('material_id').notNullable();
    t.integer('batch_id').notNullable();
    t.integer('panel_id');
    t.integer('test_method_id').notNullable();
    t.text('property_code').notNullable();
    t.integer('condition_id').notNullable().references('conditions.id');
    t.double('width_mm').notNullable();
    t.double('thickness_mm').notNullable();
    t.integer('ply_count').notNullable();
    t.double('failure_load_n');
    t.double('strength_mpa');
    t.double('modulus_mpa');
    t.double('poisson_ratio');
    t.double('failure_strain').comment('dimensionless (0.015 = 15 000 microstrain)');
    t.text('failure_mode').comment('failure mode code of the test standard, e.g. LGM');
    t.date('test_date').notNullable();
    t.text('laboratory').notNullable();
    t.text('status').notNullable().defaultTo('valid');
    t.text('status_reason');
    t.bigInteger('status_changed_by').references('users.id');
    t.text('status_changed_by_name');
    t.timestamp('status_changed_at', { useTz: true });
    t.integer('upload_id').notNullable();
    t.integer('upload_row').notNullable().comment('row of the file as a spreadsheet numbers it (the header is row 1)');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.foreign(['batch_id', 'material_id']).references(['id', 'material_id']).inTable('batches');
    t.foreign(['panel_id', 'batch_id']).references(['id', 'batch_id']).inTable('panels');
    t.foreign(['test_method_id', 'property_code']).references(['test_method_id', 'property_code']).inTable('test_method_properties');
    t.index(['material_id', 'property_code', 'condition_id', 'status'], 'specimens_data_group_idx');
    t.index(['batch_id']);
    t.index(['upload_id']);
    t.index(['test_date']);
  });
  await knex.raw(`
    -- deferrable: an import reserves the upload id, inserts the coupons in batches and the upload row
    -- (with its row count) last, all in one transaction
    alter table specimens add constraint specimens_upload_fk foreign key (upload_id) references uploads (id) deferrable initially immediate;
    alter table specimens add constraint specimens_status_check check (status in ('valid', 'excluded'));
    alter table specimens add constraint specimens_excluded_reason_check
      check (status <> 'excluded' or (length(trim(status_reason)) > 0 and status_changed_by is not null and status_changed_at is not null));
    alter table specimens add constraint specimens_width_check check (width_mm > 0 and width_mm < 10000);
    alter table specimens add constraint specimens_thickness_check check (thickness_mm > 0 and thickness_mm < 1000);
    alter table specimens add constraint specimens_ply_count_check check (ply_count between 1 and 10000);
    alter table specimens add constraint specimens_load_check check (failure_load_n > 0 and failure_load_n < 'Infinity'::float8);
    alter table specimens add constraint specimens_strength_check check (strength_mpa > 0 and strength_mpa < 'Infinity'::float8);
    alter table specimens add constraint specimens_modulus_check check (modulus_mpa > 0 and modulus_mpa < 'Infinity'::float8);
    alter table specimens add constraint specimens_poisson_check check (poisson_ratio > -1 and poisson_ratio < 1);
    alter table specimens add constraint specimens_strain_check check (failure_strain > 0 and failure_strain < 1);
    alter table specimens add constraint specimens_has_result_check
      check (strength_mpa is not null or modulus_mpa is not null or failure_strain is not null or poisson_ratio is not null);
    alter table specimens add constraint specimens_code_check check (length(trim(specimen_code)) > 0);
  `);
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists('specimens');
  await knex.schema.dropTableIfExists('uploads');
}
