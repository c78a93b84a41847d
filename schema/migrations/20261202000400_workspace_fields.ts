import type { Knex } from 'knex';

/**
 * What daily use of the workspace needs stored: a space confirmed unlit, the luminaire schedule's
 * catalogue fields, and the names an import met that the engineer matched to a code-table type.
 */
const luminaireColumns = ['manufacturer', 'catalog_number', 'light_source', 'driver', 'voltage'];

export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('spaces', (table) => {
    table.boolean('unlit');
  });
  await knex.schema.alterTable('luminaire_types', (table) => {
    for (const column of luminaireColumns) table.text(column);
  });
  await knex.schema.createTable('project_import_aliases', (table) => {
    table.uuid('project_id').notNullable().references('projects.id').onDelete('CASCADE');
    /** The name as an import met it, folded (case, dashes, spacing) so that variants find it. */
    table.text('name_key').notNullable();
    table.text('name').notNullable();
    table.text('space_type');
    table.text('building_area_type');
    table.uuid('updated_by').references('users.id').onDelete('SET NULL');
    table.timestamp('updated_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    table.primary(['project_id', 'name_key']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('project_import_aliases');
  await knex.schema.alterTable('luminaire_types', (table) => {
    table.dropColumns(...luminaireColumns);
  });
  await knex.schema.alterTable('spaces', (table) => {
    table.dropColumn('unlit');
  });
}
