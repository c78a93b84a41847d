import type { Knex } from 'knex';

/**
 * Submittal package revisions: each package made is one row, never changed afterwards (a trigger
 * refuses any update): its number within the project, whether it is a draft, the fingerprint of
 * its result, the evaluation document and result it was made from, the files kept in the file
 * store (format, key, size and SHA-256 of each), and who made it when. The project's name and
 * design revision are kept as they were, since the public check names them as printed.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('package_revisions', (table) => {
    table.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'));
    table.uuid('project_id').notNullable().references('projects.id').onDelete('CASCADE');
    table.integer('number').notNullable();
    table.boolean('draft').notNullable();
    table.string('project_name', 200).notNullable();
    table.integer('design_revision').notNullable();
    table.string('fingerprint', 64).notNullable();
    table.jsonb('document').notNullable();
    table.jsonb('result').notNullable();
    table.jsonb('files').notNullable();
    table.uuid('made_by').references('users.id').onDelete('SET NULL');
    table.timestamp('made_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    table.unique(['project_id', 'number']);
    table.index(['fingerprint']);
  });
  await knex.raw(`alter table package_revisions add constraint package_revisions_number_check check (number between 1 and 100000)`);
  await knex.raw(`alter table package_revisions add constraint package_revisions_fingerprint_check check (fingerprint ~ '^[0-9a-f]{64}$')`);
  await knex.raw(`alter table package_revisions add constraint package_revisions_files_check check (jsonb_typeof(files) = 'array')`);
  await knex.raw(`
    create function package_revisions_immutable() returns trigger language plpgsql as $$
    begin
      raise exception 'a submittal package revision is never changed once made';
    end $$`);
  await knex.raw(`
    create trigger package_revisions_no_update before update on package_revisions
      for each row execute function package_revisions_immutable()`);
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('package_revisions');
  await knex.raw('drop function package_revisions_immutable()');
}
