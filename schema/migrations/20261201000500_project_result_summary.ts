import type { Knex } from 'knex';

/**
 * The verdict and margin of a project's last evaluation, for lists. Any design write clears it,
 * so it is either current or absent, never stale.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('projects', (table) => {
    table.jsonb('result_summary');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('projects', (table) => {
    table.dropColumn('result_summary');
  });
}
