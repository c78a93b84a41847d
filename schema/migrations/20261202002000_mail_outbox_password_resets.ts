import type { Knex } from 'knex';

/**
 * The mail outbox: a message is queued in the transaction of the change it reports, so the change
 * commits even while SMTP is down, and a worker sends it afterwards (retrying with back-off, once
 * sent never again). And single-use tokens for password resets, kept only as their SHA-256.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('mail_outbox', (table) => {
    table.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'));
    table.string('kind', 40).notNullable();
    table.specificType('recipients', 'text[]').notNullable();
    table.string('subject', 300).notNullable();
    table.text('text_body').notNullable();
    table.text('html_body').notNullable();
    table.uuid('project_id').references('projects.id').onDelete('SET NULL');
    table.string('status', 10).notNullable().defaultTo('queued');
    table.integer('attempts').notNullable().defaultTo(0);
    table.timestamp('next_attempt_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    table.text('last_error');
    table.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    table.timestamp('sent_at', { useTz: true });
    table.index(['status', 'next_attempt_at']);
  });
  await knex.raw(`alter table mail_outbox add constraint mail_outbox_status_check check (status in ('queued', 'sent', 'failed'))`);
  await knex.raw(`alter table mail_outbox add constraint mail_outbox_recipients_check check (cardinality(recipients) between 1 and 200)`);

  await knex.schema.createTable('password_resets', (table) => {
    table.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'));
    table.uuid('user_id').notNullable().references('users.id').onDelete('CASCADE');
    table.string('token_hash', 64).notNullable().unique();
    table.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    table.timestamp('expires_at', { useTz: true }).notNullable();
    table.timestamp('used_at', { useTz: true });
    table.index(['user_id']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('password_resets');
  await knex.schema.dropTable('mail_outbox');
}
