import type { Knex } from 'knex';

/**
 * The reviewer's check items. Each submission opens a round that keeps the evaluation it was
 * submitted with (document and result, frozen); the round's check items are generated from that
 * result. An item is one per project and key (its kind and the space it checks), so it carries
 * over from round to round with its verdict and thread, and is marked changed when the data it
 * rests on (its fingerprint) differs from the previous round's. The thread holds every verdict
 * and reply, in whichever round it was written.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('review_rounds', (table) => {
    table.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'));
    table.uuid('project_id').notNullable().references('projects.id').onDelete('CASCADE');
    table.integer('number').notNullable();
    table.integer('revision').notNullable();
    table.uuid('opened_by').references('users.id').onDelete('SET NULL');
    table.timestamp('opened_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    table.jsonb('document').notNullable();
    table.jsonb('result').notNullable();
    table.timestamp('closed_at', { useTz: true });
    table.string('outcome', 10);
    table.unique(['project_id', 'number'], { indexName: 'review_rounds_project_number_unique' });
  });
  await knex.raw('alter table review_rounds add constraint review_rounds_number_check check (number between 1 and 100000)');
  await knex.raw('alter table review_rounds add constraint review_rounds_revision_check check (revision between 1 and 100000)');
  await knex.raw(
    // A round closes when the reviewer returns or accepts the design; one left open when the next opens closes without an outcome.
    "alter table review_rounds add constraint review_rounds_outcome_check check (outcome is null or (closed_at is not null and outcome in ('returned', 'accepted')))",
  );

  await knex.schema.createTable('review_items', (table) => {
    table.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'));
    table.uuid('project_id').notNullable().references('projects.id').onDelete('CASCADE');
    // The kind and the space's id ("site" for the exterior): stable while the space lives.
    table.string('key', 80).notNullable();
    table.string('kind', 40).notNullable();
    // No reference: the item outlives a deleted space, which the round marks removed.
    table.uuid('space_id');
    table.string('title', 400).notNullable();
    table.string('section', 400).notNullable();
    table.string('outcome', 20).notNullable();
    table.text('reasoning').notNullable();
    table.jsonb('values').notNullable();
    table.string('fingerprint', 64).notNullable();
    table.integer('round').notNullable();
    // The order of the round that last generated it: the spaces as the design lists them, then the site.
    table.integer('position').notNullable();
    table.boolean('changed').notNullable().defaultTo(false);
    table.string('verdict', 20);
    table.integer('removed_in_round');
    table.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    table.timestamp('updated_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    table.unique(['project_id', 'key'], { indexName: 'review_items_project_key_unique' });
  });
  await knex.raw(
    `alter table review_items add constraint review_items_kind_check check (kind in (
       'power-allowance', 'occupancy-sensing', 'automatic-shutoff', 'daylight-response', 'light-reduction',
       'other-controls', 'exterior-power', 'exterior-controls'))`,
  );
  await knex.raw(
    "alter table review_items add constraint review_items_outcome_check check (outcome in ('met', 'not-met', 'to-verify', 'not-required'))",
  );
  await knex.raw(
    "alter table review_items add constraint review_items_verdict_check check (verdict is null or verdict in ('confirmed', 'needs-revision', 'not-applicable'))",
  );
  await knex.raw('alter table review_items add constraint review_items_reasoning_check check (char_length(reasoning) <= 20000)');
  await knex.raw('alter table review_items add constraint review_items_round_check check (round between 1 and 100000)');
  await knex.raw('alter table review_items add constraint review_items_position_check check (position between 0 and 1000000)');
  await knex.raw(
    'alter table review_items add constraint review_items_removed_check check (removed_in_round is null or removed_in_round between 1 and 100000)',
  );

  await knex.schema.createTable('review_entries', (table) => {
    // Ordered by id: the entries of one transaction share its time.
    table.bigIncrements('id').primary();
    table.uuid('item_id').notNullable().references('review_items.id').onDelete('CASCADE');
    table.integer('round').notNullable();
    table.uuid('user_id').references('users.id').onDelete('SET NULL');
    table.string('role', 12).notNullable();
    table.string('text', 2000).notNullable();
    table.string('verdict', 20);
    table.timestamp('at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    table.index(['item_id', 'id'], 'review_entries_item');
  });
  await knex.raw(
    "alter table review_entries add constraint review_entries_role_check check (role in ('engineer', 'reviewer', 'contractor', 'admin'))",
  );
  await knex.raw(
    "alter table review_entries add constraint review_entries_verdict_check check (verdict is null or verdict in ('confirmed', 'needs-revision', 'not-applicable'))",
  );
  // A reply says something; a verdict may stand alone.
  await knex.raw("alter table review_entries add constraint review_entries_text_check check (verdict is not null or text <> '')");
  await knex.raw('alter table review_entries add constraint review_entries_round_check check (round between 1 and 100000)');
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('review_entries');
  await knex.schema.dropTable('review_items');
  await knex.schema.dropTable('review_rounds');
}
