import type { Knex } from 'knex';

/**
 * The manufacturer's cut sheet of a luminaire type: one PDF per type, kept in the file store under a
 * key the service made (never from what a person typed). The row names the key, the file's size
 * (at most 20 MB) and SHA-256, the name it was uploaded under (at most 200 characters, cleaned of
 * control characters), and who attached it when. It goes with its type.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('luminaire_cut_sheets', (table) => {
    table.uuid('luminaire_type_id').primary().references('luminaire_types.id').onDelete('CASCADE');
    table.uuid('project_id').notNullable().references('projects.id').onDelete('CASCADE');
    table.string('storage_key', 200).notNullable().unique();
    table.integer('size').notNullable();
    table.string('sha256', 64).notNullable();
    table.string('file_name', 200).notNullable();
    table.uuid('uploaded_by').references('users.id').onDelete('SET NULL');
    table.timestamp('uploaded_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    table.index(['project_id']);
  });
  await knex.raw(`alter table luminaire_cut_sheets add constraint luminaire_cut_sheets_size_check check (size between 1 and 20971520)`);
  await knex.raw(`alter table luminaire_cut_sheets add constraint luminaire_cut_sheets_sha256_check check (sha256 ~ '^[0-9a-f]{64}$')`);
  await knex.raw(
    `alter table luminaire_cut_sheets add constraint luminaire_cut_sheets_file_name_check check (length(file_name) between 1 and 200)`,
  );
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('luminaire_cut_sheets');
}
