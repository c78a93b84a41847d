import type { Knex } from 'knex';

/**
 * Space types whose allowance is a formula of the space's height (the atrium rows of 90.1-2013/2016
 * and IECC 2018) keep the formula beside the table's number; IECC rule inputs that another
 * edition's list stands in for carry that tag.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('space_types', (table) => {
    table.jsonb('lpd_formula');
    table.text('iecc_inputs_tag');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('space_types', (table) => {
    table.dropColumn('lpd_formula');
    table.dropColumn('iecc_inputs_tag');
  });
}
