import type { Knex } from 'knex';

/**
 * Basis-value analyses (PRODUCT.md, chain step 3). An analysis is a record:
 * the data group it was asked for, the exact numbers it ran on (input
 * snapshot), the engine's full result and the engine version, so it can be
 * reproduced. A trigger refuses UPDATE and DELETE: a different choice (another
 * method, other coupons) is a new analysis.
 * analysis_specimens ties each analysis to the coupons it used (the chain back
 * from an allowable to coupons and uploads).
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('analyses', (t) => {
    t.increments('id').primary();
    t.integer('material_id').notNullable().references('material_systems.id');
    t.text('property_code').notNullable().references('test_properties.code');
    t.text('quantity').notNullable();
    t.specificType('condition_ids', 'integer[]').notNullable();
    t.jsonb('data_group').notNullable().comment('the request: material, property, quantity, conditions, basis, method');
    t.jsonb('input_snapshot').notNullable().comment('the values, batches and conditions handed to the engine');
    t.jsonb('result').notNullable().comment('the statistics engine output');
    t.text('engine_version').notNullable();
    t.text('method_requested').notNullable();
    t.text('method_used').notNullable();
    t.text('method_override_reason');
    t.boolean('normalised').notNullable();
    t.integer('n').notNullable();
    t.double('b_basis');
    t.double('a_basis');
    t.boolean('provisional').notNullable();
    t.bigInteger('created_by').notNullable().references('users.id');
    t.text('created_by_name').notNullable();
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.index(['material_id', 'property_code', 'quantity']);
    t.index(['created_at']);
  });
  await knex.raw(`
    alter table analyses add constraint analyses_quantity_check check (quantity in ('strength', 'modulus', 'failure-strain'));
    alter table analyses add constraint analyses_conditions_check check (cardinality(condition_ids) >= 1);
    alter table analyses add constraint analyses_override_reason_check
      check (method_requested = 'auto' or length(trim(method_override_reason)) > 0);
    alter table analyses add constraint analyses_n_check check (n >= 1);
    create function analyses_are_records() returns trigger language plpgsql as $$
    begin
      raise exception 'analyses are records and cannot be changed (%); run a new analysis instead', tg_op using errcode = '42501';
    end $$;
    create trigger analyses_immutable before update or delete on analyses
      for each row execute function analyses_are_records();
  `);

  await knex.schema.createTable('analysis_specimens', (t) => {
    t.integer('analysis_id').notNullable().references('analyses.id');
    t.integer('specimen_id').notNullable().references('specimens.id');
    t.double('value_used').notNullable().comment('after normalisation, internal units');
    t.primary(['analysis_id', 'specimen_id']);
    t.index(['specimen_id']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists('analysis_specimens');
  await knex.raw('drop trigger if exists analyses_immutable on analyses; drop function if exists analyses_are_records()');
  await knex.schema.dropTableIfExists('analyses');
}
