import type { Knex } from 'knex';

/** How far a provided control reduces the lighting when it acts (partial OFF, light reduction, the space-specific sensor functions). */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('space_controls', (table) => {
    table.specificType('reduction_percent', 'numeric');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('space_controls', (table) => {
    table.dropColumn('reduction_percent');
  });
}
