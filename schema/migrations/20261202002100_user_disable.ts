import type { Knex } from 'knex';

/** An administrator can disable an account: it cannot sign in, and its sessions stop counting. */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('users', (table) => {
    table.timestamp('disabled_at', { useTz: true });
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('users', (table) => {
    table.dropColumn('disabled_at');
  });
}
