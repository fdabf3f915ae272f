import type { Knex } from 'knex';

/**
 * Outgoing e-mail. A message is written here inside the transaction of the
 * change it reports (a proposal, a decision), then sent after the commit; a
 * send that fails leaves it 'unsent' with the attempt count and the error, to
 * be retried. So an SMTP outage never undoes or blocks a decision.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('mail_outbox', (t) => {
    t.increments('id').primary();
    t.text('kind').notNullable().comment('e.g. allowable.proposed, allowable.decided');
    t.bigInteger('to_user_id').references('users.id');
    t.text('to_address').notNullable();
    t.text('subject').notNullable();
    t.text('body_text').notNullable();
    t.text('body_html').notNullable();
    t.text('link').notNullable().comment('the page the message points back to');
    t.text('entity_type');
    t.text('entity_id');
    t.text('status').notNullable().defaultTo('unsent');
    t.integer('attempts').notNullable().defaultTo(0);
    t.text('last_error');
    t.timestamp('last_attempt_at', { useTz: true });
    t.timestamp('sent_at', { useTz: true });
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.index(['entity_type', 'entity_id']);
  });
  await knex.raw(`
    alter table mail_outbox add constraint mail_outbox_status_check check (status in ('unsent', 'sent'));
    alter table mail_outbox add constraint mail_outbox_sent_check check (status <> 'sent' or sent_at is not null);
    alter table mail_outbox add constraint mail_outbox_attempts_check check (attempts >= 0);
    create index mail_outbox_unsent_idx on mail_outbox (created_at) where status = 'unsent';
  `);
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists('mail_outbox');
}
