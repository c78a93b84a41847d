import type { Knex } from 'knex';

/**
 * Design fields the rules read: how far a provided control reduces the lighting when it acts
 * (partial OFF, light reduction, the space-specific sensor functions), and how many like rooms a
 * space entry stands for (a size in a space type's name applies to each room).
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('space_controls', (table) => {
    table.specificType('reduction_percent', 'numeric');
  });
  await knex.schema.alterTable('spaces', (table) => {
    table.integer('rooms');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('spaces', (table) => {
    table.dropColumn('rooms');
  });
  await knex.schema.alterTable('space_controls', (table) => {
    table.dropColumn('reduction_percent');
  });
}
