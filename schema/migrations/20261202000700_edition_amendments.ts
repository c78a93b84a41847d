import type { Knex } from 'knex';

/**
 * Jurisdiction amendments: a named layer over one edition's values (a state's own thresholds),
 * which a project chooses; the model code stays as it is. Versioned with the edition's data.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('edition_amendments', (table) => {
    table.text('edition_id').notNullable();
    table.text('data_version').notNullable();
    table
      .foreign(['edition_id', 'data_version'])
      .references(['edition_id', 'data_version'])
      .inTable('code_edition_versions')
      .onDelete('CASCADE');
    table.text('key').notNullable();
    table.integer('position').notNullable();
    table.text('title').notNullable();
    table.text('jurisdiction').notNullable();
    table.jsonb('parameters').notNullable();
    table.text('source').notNullable();
    table.text('confidence').notNullable();
    table.boolean('verified').notNullable();
    table.text('note').notNullable().defaultTo('');
    table.primary(['edition_id', 'data_version', 'key']);
  });
  await knex.schema.alterTable('projects', (table) => {
    table.specificType('amendments', 'text[]').notNullable().defaultTo('{}');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('projects', (table) => {
    table.dropColumn('amendments');
  });
  await knex.schema.dropTable('edition_amendments');
}
