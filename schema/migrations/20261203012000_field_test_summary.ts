import type { Knex } from 'knex';

/**
 * Where a project's field tests stand (`FieldTestSummary`: required, passed, failed, untested,
 * complete and when), kept on the project when its test plan is read so the project list can say
 * "testing complete" without making every project's plan. Null until a plan with results is read,
 * and set back to null by every design change.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('projects', (table) => {
    table.jsonb('field_test_summary');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('projects', (table) => {
    table.dropColumn('field_test_summary');
  });
}
