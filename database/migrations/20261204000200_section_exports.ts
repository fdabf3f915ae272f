import type { Knex } from 'knex';

/**
 * Section exports (PRODUCT.md, chain step 6): each file handed to an analyst
 * is recorded with the layup revision it came from, its format, unit system
 * and options, the allowables its ply data used, who and when, and the file
 * itself with its SHA-256. The database checks the checksum against the text
 * (PostgreSQL 15's built-in sha256) and refuses any change afterwards.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('section_exports', (t) => {
    t.increments('id').primary();
    t.integer('layup_revision_id').notNullable().references('layup_revisions.id');
    t.text('format').notNullable();
    t.text('unit_system').notNullable();
    t.jsonb('options').notNullable().comment('propertyId, materialId, elset, referenceOffset, freeField as resolved');
    t.text('header_date').notNullable().comment('the date written in the file header (UTC day of the export)');
    t.text('allowables_text').notNullable().comment('the header line naming the allowables used');
    t.text('file_name').notNullable();
    t.text('content_type').notNullable();
    t.text('text').notNullable();
    t.text('sha256').notNullable();
    t.integer('bytes').notNullable();
    t.text('engine_version').notNullable();
    t.text('section_writer_version').notNullable();
    t.bigInteger('created_by').notNullable().references('users.id');
    t.text('created_by_name').notNullable();
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.index(['layup_revision_id']);
    t.index(['created_at']);
  });
  await knex.raw(`
    alter table section_exports add constraint section_exports_format_check
      check (format in ('nastran-pcomp', 'nastran-pshell', 'calculix', 'general-shell', 'json', 'csv'));
    alter table section_exports add constraint section_exports_units_check check (unit_system in ('N-mm-t', 'N-m-kg', 'lbf-in'));
    alter table section_exports add constraint section_exports_date_check check (header_date ~ '^\\d{4}-\\d{2}-\\d{2}$');
    alter table section_exports add constraint section_exports_checksum_check
      check (sha256 = encode(sha256(convert_to(text, 'UTF8')), 'hex') and bytes = octet_length(text));
  `);

  await knex.schema.createTable('section_export_allowables', (t) => {
    t.integer('export_id').notNullable().references('section_exports.id');
    t.integer('allowable_id').notNullable().references('allowables.id');
    t.integer('lamina_index').notNullable();
    t.specificType('fields', 'text[]').notNullable();
    t.primary(['export_id', 'allowable_id', 'lamina_index']);
    t.index(['allowable_id']);
  });

  await knex.raw(`
    create function section_exports_are_records() returns trigger language plpgsql as $$
    begin
      raise exception 'section exports are records and cannot be changed (% on %); export again instead', tg_op, tg_table_name using errcode = '42501';
    end $$;
    create trigger section_exports_fixed before update or delete on section_exports
      for each row execute function section_exports_are_records();
    create trigger section_export_allowables_fixed before update or delete on section_export_allowables
      for each row execute function section_exports_are_records();
  `);
}

export async function down(knex: Knex): Promise<void> {
  await knex.raw(`
    drop trigger if exists section_export_allowables_fixed on section_export_allowables;
    drop trigger if exists section_exports_fixed on section_exports;
  `);
  for (const table of ['section_export_allowables', 'section_exports']) await knex.schema.dropTableIfExists(table);
  await knex.raw('drop function if exists section_exports_are_records()');
}
