import type { Knex } from 'knex';

/**
 * Layups (PRODUCT.md, chain step 5). A layup is a name with an owner and
 * numbered revisions; a save is a new revision, and a revision is a record:
 * its ply list, the lamina data it was computed on (a snapshot of the
 * catalogue at save time: values and the allowable each field came from) and
 * its analysis settings never change afterwards (trigger). The allowables a
 * revision used are listed by foreign key, so the impact of a superseded
 * allowable is one indexed join.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('layups', (t) => {
    t.increments('id').primary();
    t.text('name').notNullable().comment('the name of the latest revision (unique, case-insensitive)');
    t.text('description');
    t.bigInteger('owner_id').notNullable().references('users.id');
    t.text('owner_name').notNullable().comment('name at creation');
    t.integer('latest_revision').notNullable().defaultTo(0);
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
  });
  await knex.raw(`
    create unique index layups_name_unique on layups (lower(name));
    alter table layups add constraint layups_name_check check (length(trim(name)) between 1 and 120);
    alter table layups add constraint layups_latest_revision_check check (latest_revision >= 0);
  `);

  await knex.schema.createTable('layup_revisions', (t) => {
    t.increments('id').primary();
    t.integer('layup_id').notNullable().references('layups.id');
    t.integer('revision').notNullable();
    t.text('name').notNullable();
    t.text('description');
    t.text('comment').comment('what changed and why');
    t.text('code').notNullable().comment('laminate code printed from the ply angles');
    t.integer('ply_count').notNullable();
    t.double('thickness_mm').notNullable();
    t.jsonb('laminae').notNullable().comment('lamina data per (material, source) as computed on: values, origin of each field, allowables');
    t.jsonb('settings').notNullable().defaultTo('{}').comment('loads, criteria, factor of safety, failure and shear settings');
    t.text('engine_version').notNullable();
    t.bigInteger('created_by').notNullable().references('users.id');
    t.text('created_by_name').notNullable();
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.unique(['layup_id', 'revision']);
  });
  await knex.raw(`
    alter table layup_revisions add constraint layup_revisions_revision_check check (revision >= 1);
    alter table layup_revisions add constraint layup_revisions_ply_count_check check (ply_count between 1 and 2000);
    alter table layup_revisions add constraint layup_revisions_thickness_check check (thickness_mm > 0 and thickness_mm < 'Infinity'::float8);
    alter table layup_revisions add constraint layup_revisions_laminae_check check (jsonb_typeof(laminae) = 'array' and jsonb_array_length(laminae) >= 1);
  `);

  await knex.schema.createTable('layup_plies', (t) => {
    t.integer('revision_id').notNullable().references('layup_revisions.id');
    t.integer('position').notNullable().comment('0 = first ply, bottom surface (z = -h/2)');
    t.integer('material_id').notNullable().references('material_systems.id');
    t.double('theta_deg').notNullable();
    t.double('thickness_mm').notNullable().comment('as computed on: the override or the nominal cured ply thickness');
    t.double('thickness_override_mm');
    t.text('lamina_source').notNullable();
    t.integer('condition_id').notNullable().references('conditions.id').comment('the condition of the lamina data (typical values are coupon means in it)');
    t.text('basis');
    t.integer('lamina_index').notNullable().comment('index into layup_revisions.laminae');
    t.primary(['revision_id', 'position']);
  });
  await knex.raw(`
    alter table layup_plies add constraint layup_plies_position_check check (position >= 0);
    alter table layup_plies add constraint layup_plies_theta_check check (theta_deg >= -360 and theta_deg <= 360);
    alter table layup_plies add constraint layup_plies_thickness_check check (thickness_mm > 0 and thickness_mm < 1000);
    alter table layup_plies add constraint layup_plies_override_check check (thickness_override_mm is null or thickness_override_mm = thickness_mm);
    alter table layup_plies add constraint layup_plies_source_check check (
      (lamina_source = 'typical' and basis is null)
      or (lamina_source = 'ply-property-set' and basis in ('A', 'B')));
  `);

  await knex.schema.createTable('layup_revision_allowables', (t) => {
    t.integer('revision_id').notNullable().references('layup_revisions.id');
    t.integer('allowable_id').notNullable().references('allowables.id');
    t.integer('lamina_index').notNullable();
    t.specificType('fields', 'text[]').notNullable().comment('lamina fields taken from the allowable, e.g. {Xt}');
    t.primary(['revision_id', 'allowable_id', 'lamina_index']);
    t.index(['allowable_id']);
  });

  await knex.raw(`
    create function layup_records_are_fixed() returns trigger language plpgsql as $$
    begin
      raise exception 'layup revisions are records and cannot be changed (% on %); save a new revision instead', tg_op, tg_table_name using errcode = '42501';
    end $$;
    create trigger layup_revisions_fixed before update or delete on layup_revisions
      for each row execute function layup_records_are_fixed();
    create trigger layup_plies_fixed before update or delete on layup_plies
      for each row execute function layup_records_are_fixed();
    create trigger layup_revision_allowables_fixed before update or delete on layup_revision_allowables
      for each row execute function layup_records_are_fixed();
  `);
}

export async function down(knex: Knex): Promise<void> {
  await knex.raw(`
    drop trigger if exists layup_revision_allowables_fixed on layup_revision_allowables;
    drop trigger if exists layup_plies_fixed on layup_plies;
    drop trigger if exists layup_revisions_fixed on layup_revisions;
  `);
  for (const table of ['layup_revision_allowables', 'layup_plies', 'layup_revisions', 'layups']) await knex.schema.dropTableIfExists(table);
  await knex.raw('drop function if exists layup_records_are_fixed()');
}
