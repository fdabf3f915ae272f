import type { Knex } from 'knex';

/**
 * Allowables and their review (PRODUCT.md, chain step 4). The key of an
 * allowable is (material, property, quantity, condition, basis); each key has
 * numbered revisions. The database itself refuses, even for direct SQL:
 * - changing an approved allowable, except the one transition
 *   approved -> superseded with nothing else in the row changed (trigger);
 *   rejected and superseded rows are final; a new row starts as draft or proposed;
 * - a reviewer deciding their own proposal (check constraint);
 * - two approved revisions of one key (partial unique index).
 * The service supersedes the previous approved revision and approves the new
 * one in one transaction, in that order (the unique index is checked per statement).
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('allowables', (t) => {
    t.increments('id').primary();
    t.integer('material_id').notNullable().references('material_systems.id');
    t.text('property_code').notNullable().references('test_properties.code');
    t.text('quantity').notNullable();
    t.integer('condition_id').notNullable().references('conditions.id');
    t.text('basis').notNullable();
    t.double('value').notNullable().comment('internal units: MPa for strength, dimensionless for failure strain');
    t.text('unit').notNullable();
    t.integer('analysis_id').notNullable().references('analyses.id');
    t.text('method').notNullable().comment('statistical method of the analysis that gave the value');
    t.boolean('provisional').notNullable();
    t.integer('revision').notNullable();
    t.text('status').notNullable();
    t.bigInteger('proposer_id').notNullable().references('users.id');
    t.text('proposer_name').notNullable().comment('names at the time: part of the signature record');
    t.text('proposal_comment');
    t.timestamp('proposed_at', { useTz: true });
    t.bigInteger('reviewer_id').references('users.id');
    t.text('reviewer_name');
    t.timestamp('decided_at', { useTz: true });
    t.text('decision_comment');
    t.text('signature_meaning').comment('the statement the reviewer signed');
    t.integer('supersedes_id').references('allowables.id').comment('the approved revision this one replaced at its approval');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.unique(['material_id', 'property_code', 'quantity', 'condition_id', 'basis', 'revision']);
    t.index(['status']);
    t.index(['analysis_id']);
  });
  await knex.raw(`
    alter table allowables add constraint allowables_status_check
      check (status in ('draft', 'proposed', 'approved', 'rejected', 'superseded'));
    alter table allowables add constraint allowables_basis_check check (basis in ('A', 'B'));
    alter table allowables add constraint allowables_quantity_check check (quantity in ('strength', 'failure-strain'));
    alter table allowables add constraint allowables_unit_check
      check ((quantity = 'strength' and unit = 'MPa') or (quantity = 'failure-strain' and unit = '1'));
    alter table allowables add constraint allowables_value_check check (value > 0 and value < 'Infinity'::float8);
    alter table allowables add constraint allowables_revision_check check (revision >= 1);
    alter table allowables add constraint allowables_proposed_check
      check (status = 'draft' or proposed_at is not null);
    alter table allowables add constraint allowables_reviewer_is_not_proposer
      check (status not in ('approved', 'rejected', 'superseded')
             or (reviewer_id is not null and reviewer_id <> proposer_id and reviewer_name is not null and decided_at is not null
                 and length(trim(decision_comment)) > 0 and length(trim(signature_meaning)) > 0));
    create unique index allowables_one_approved_per_key on allowables (material_id, property_code, quantity, condition_id, basis)
      where status = 'approved';
    -- one open proposal (draft or proposed) per key at a time, so a reviewer never chooses between rivals
    create unique index allowables_one_open_per_key on allowables (material_id, property_code, quantity, condition_id, basis)
      where status in ('draft', 'proposed');

    create function allowables_guard() returns trigger language plpgsql as $$
    begin
      if tg_op = 'INSERT' then
        if new.status not in ('draft', 'proposed') then
          raise exception 'a new allowable starts as draft or proposed, not %; a quality reviewer decides it afterwards', new.status using errcode = '42501';
        end if;
        return new;
      end if;
      if tg_op = 'DELETE' then
        if old.status = 'draft' then return old; end if;
        raise exception 'allowable % is % and cannot be deleted', old.id, old.status using errcode = '42501';
      end if;
      if old.status = 'approved' then
        if new.status = 'superseded' and (to_jsonb(new) - 'status') = (to_jsonb(old) - 'status') then
          return new;
        end if;
        raise exception 'allowable % is approved and cannot be changed; only superseding it by a newly approved revision is allowed', old.id using errcode = '42501';
      end if;
      if old.status in ('rejected', 'superseded') then
        raise exception 'allowable % is % and cannot be changed', old.id, old.status using errcode = '42501';
      end if;
      if (new.material_id, new.property_code, new.quantity, new.condition_id, new.basis, new.value, new.unit,
          new.analysis_id, new.method, new.provisional, new.revision, new.proposer_id, new.proposer_name, new.created_at)
         is distinct from
         (old.material_id, old.property_code, old.quantity, old.condition_id, old.basis, old.value, old.unit,
          old.analysis_id, old.method, old.provisional, old.revision, old.proposer_id, old.proposer_name, old.created_at) then
        raise exception 'allowable %: key, value, analysis and proposer are fixed once created; propose a new revision instead', old.id using errcode = '42501';
      end if;
      if new.status <> old.status and not (
           (old.status = 'draft' and new.status = 'proposed')
        or (old.status = 'proposed' and new.status in ('approved', 'rejected'))) then
        raise exception 'allowable % cannot go from % to %', old.id, old.status, new.status using errcode = '42501';
      end if;
      return new;
    end $$;
    create trigger allowables_guard before insert or update or delete on allowables
      for each row execute function allowables_guard();
  `);
}

export async function down(knex: Knex): Promise<void> {
  await knex.raw('drop trigger if exists allowables_guard on allowables; drop function if exists allowables_guard()');
  await knex.schema.dropTableIfExists('allowables');
}
