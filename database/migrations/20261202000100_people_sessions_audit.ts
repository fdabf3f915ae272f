import type { Knex } from 'knex';

/**
 * People, their roles, the server-side sessions and the audit log.
 * - sessions has the shape connect-pg-simple reads and writes (sid, sess, expire).
 * - audit_log is append-only: a trigger refuses UPDATE and DELETE, so the record
 *   of who did what cannot be rewritten through the application or by hand.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('roles', (t) => {
    t.text('code').primary();
    t.text('label').notNullable();
    t.text('description').notNullable();
  });

  await knex.schema.createTable('users', (t) => {
    t.bigIncrements('id').primary();
    t.text('issuer').notNullable().comment('OpenID Connect issuer that vouches for the user');
    t.text('subject').notNullable().comment('the sub claim at that issuer');
    t.text('name').notNullable();
    t.text('email');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp('last_sign_in_at', { useTz: true });
    t.unique(['issuer', 'subject']);
  });

  await knex.schema.createTable('user_roles', (t) => {
    t.bigInteger('user_id').notNullable().references('users.id').onDelete('CASCADE');
    t.text('role_code').notNullable().references('roles.code');
    t.text('source').notNullable().defaultTo('identity-provider');
    t.timestamp('granted_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.primary(['user_id', 'role_code']);
  });
  await knex.raw(`alter table user_roles add constraint user_roles_source_check check (source in ('identity-provider', 'local'))`);

  await knex.schema.createTable('sessions', (t) => {
    t.string('sid').primary();
    t.json('sess').notNullable();
    t.timestamp('expire', { precision: 6 }).notNullable();
    t.index(['expire'], 'sessions_expire_idx');
  });

  await knex.schema.createTable('audit_log', (t) => {
    t.bigIncrements('id').primary();
    t.timestamp('at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.bigInteger('user_id').references('users.id');
    t.text('actor').notNullable().comment('name of the user at the time, kept if the user is renamed');
    t.text('action').notNullable().comment('dotted verb, e.g. user.signed-in, allowable.approved');
    t.text('entity_type');
    t.text('entity_id');
    t.jsonb('details').notNullable().defaultTo('{}');
    t.text('request_id');
    t.index(['entity_type', 'entity_id']);
    t.index(['at']);
  });
  await knex.raw(`
    create function audit_log_is_append_only() returns trigger language plpgsql as $$
    begin
      raise exception 'audit_log is append-only: % is not allowed', tg_op using errcode = '42501';
    end $$;
    create trigger audit_log_append_only before update or delete on audit_log
      for each row execute function audit_log_is_append_only();
  `);
}

export async function down(knex: Knex): Promise<void> {
  await knex.raw('drop trigger if exists audit_log_append_only on audit_log; drop function if exists audit_log_is_append_only()');
  for (const table of ['audit_log', 'sessions', 'user_roles', 'users', 'roles']) await knex.schema.dropTableIfExists(table);
}
