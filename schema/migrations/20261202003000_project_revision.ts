import type { Knex } from 'knex';

/**
 * A project's design revision: 1 at the start, one more each time an accepted or issued design is
 * reopened as a draft. The review state itself (`projects.state`) exists from the first migration.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('projects', (table) => {
    table.integer('revision').notNullable().defaultTo(1);
  });
  await knex.raw('alter table projects add constraint projects_revision_check check (revision between 1 and 100000)');
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('projects', (table) => {
    table.dropColumn('revision');
  });
}
