import type { Knex } from 'knex';

/**
 * A reviewer may ask for a daily digest of the projects waiting for them (off unless chosen), and
 * each digest day is claimed once per person: the row's key holds across restarts and across two
 * servers, so nobody gets the same day's digest twice.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('users', (table) => {
    table.boolean('review_digest').notNullable().defaultTo(false);
  });
  await knex.schema.createTable('review_digests', (table) => {
    table.uuid('user_id').notNullable().references('users.id').onDelete('CASCADE');
    /** The digest's day in the configured time zone. */
    table.date('day').notNullable();
    /** The message queued that day; null when nothing was waiting. */
    table.uuid('mail_id').references('mail_outbox.id').onDelete('SET NULL');
    table.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    table.primary(['user_id', 'day']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('review_digests');
  await knex.schema.alterTable('users', (table) => {
    table.dropColumn('review_digest');
  });
}
