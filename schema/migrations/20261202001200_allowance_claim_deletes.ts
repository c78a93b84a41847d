import type { Knex } from 'knex';

/**
 * A deleted claim on an additional allowance stays in its table for the 30 days it can be
 * restored, marked by `deleted_at`: a change of units converts it with the live ones, so it comes
 * back in the project's units. Everything that reads claims leaves the marked ones out.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('retail_display_claims', (table) => {
    table.timestamp('deleted_at', { useTz: true });
    table.index(['project_id', 'deleted_at']);
  });
}

/** Before this column a claim in the table was a live one: the deleted ones go. */
export async function down(knex: Knex): Promise<void> {
  await knex('retail_display_claims').whereNotNull('deleted_at').delete();
  await knex.schema.alterTable('retail_display_claims', (table) => {
    table.dropIndex(['project_id', 'deleted_at']);
    table.dropColumn('deleted_at');
  });
}
