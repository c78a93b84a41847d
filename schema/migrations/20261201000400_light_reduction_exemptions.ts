import type { Knex } from 'knex';

/** IECC space types carry the C405.2.3 exception list item that frees them from light-reduction control. */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('space_types', (table) => {
    table.text('iecc_light_reduction_exempt_item');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('space_types', (table) => {
    table.dropColumn('iecc_light_reduction_exempt_item');
  });
}
