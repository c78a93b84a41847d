import type { Knex } from 'knex';

/**
 * One row per sign-in, keyed by the token's `jti`: a token is honoured only while its row is
 * neither revoked nor expired, so signing out (or ending a session from another browser) takes
 * effect on the server rather than relying on the browser to drop its cookie.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('sessions', (table) => {
    table.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'));
    table.uuid('user_id').notNullable().references('users.id').onDelete('CASCADE');
    table.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    table.timestamp('last_seen_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    table.timestamp('expires_at', { useTz: true }).notNullable();
    table.timestamp('revoked_at', { useTz: true });
    table.string('user_agent', 512);
    table.specificType('address', 'inet');
    table.index(['user_id', 'expires_at']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('sessions');
}
