import type { Knex } from 'knex';

/**
 * Photos taken in the field of a plan item: the original and two copies made by the service (a
 * display copy, longest side 1,600 px, and a thumbnail, 320 px, both without the camera's metadata)
 * are kept in the file store under keys the service makes; this row names them. A photo belongs to
 * the item (`item_id`, the plan item's stable key) and, when the item had been tested when it was
 * added, to that latest test (`result_id`). The caption is at most 300 characters; the size is the
 * original's in bytes (at most 10 MB), its sha256 in hex.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('field_test_photos', (table) => {
    table.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'));
    table.uuid('project_id').notNullable().references('projects.id').onDelete('CASCADE');
    table.string('item_id', 300).notNullable();
    table.bigInteger('result_id').references('field_test_results.id').onDelete('SET NULL');
    table.string('caption', 300);
    table.string('content_type', 20).notNullable();
    table.integer('size_bytes').notNullable();
    table.string('sha256', 64).notNullable();
    table.integer('width').notNullable();
    table.integer('height').notNullable();
    table.string('original_key', 200).notNullable();
    table.string('display_key', 200).notNullable();
    table.string('thumb_key', 200).notNullable();
    table.uuid('added_by').references('users.id').onDelete('SET NULL');
    table.timestamp('added_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    table.index(['project_id', 'item_id']);
  });
  await knex.raw(
    `alter table field_test_photos add constraint field_test_photos_content_type_check check (content_type in ('image/jpeg', 'image/png'))`,
  );
  await knex.raw(
    `alter table field_test_photos add constraint field_test_photos_size_check check (size_bytes between 1 and 10485760 and width > 0 and height > 0)`,
  );
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('field_test_photos');
}
