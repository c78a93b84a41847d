import type { Knex } from 'knex';

/**
 * Invitations to a project's team for an address with no account yet: a single-use link, kept only
 * as the SHA-256 of its token (like the password resets), good until `expires_at`; accepting it
 * makes the account and the membership, withdrawing it ends it. A row stays for the history.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('invitations', (table) => {
    table.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'));
    table.uuid('project_id').notNullable().references('projects.id').onDelete('CASCADE');
    table.string('email', 320).notNullable();
    table.string('role', 20).notNullable();
    table.string('token_hash', 64).notNullable().unique();
    table.uuid('invited_by').references('users.id').onDelete('SET NULL');
    table.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    table.timestamp('expires_at', { useTz: true }).notNullable();
    table.timestamp('accepted_at', { useTz: true });
    table.uuid('accepted_user_id').references('users.id').onDelete('SET NULL');
    table.timestamp('withdrawn_at', { useTz: true });
    table.uuid('withdrawn_by').references('users.id').onDelete('SET NULL');
    table.index(['project_id']);
  });
  await knex.raw(`alter table invitations add constraint invitations_role_check check (role in ('engineer', 'reviewer', 'contractor'))`);
  // Accepted or withdrawn, never both.
  await knex.raw(`alter table invitations add constraint invitations_ended_once_check check (accepted_at is null or withdrawn_at is null)`);
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('invitations');
}
