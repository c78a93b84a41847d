import type { Knex } from 'knex';

/**
 * Functional test results recorded in the field, one row per test of a plan item: a retest adds a
 * row and never changes the earlier one (a trigger refuses updates), so every attempt stays in the
 * history and the latest counts. `item_id` is the plan item's stable key (made from design keys);
 * the plan itself is not stored, it is made from the design on each read. Measured values are
 * bounded: time-out and override in minutes (0–1,440), the light level in the project's units at
 * the time (`light_unit`: foot-candles or lux, 0–100,000), notes at most 2,000 characters.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('field_test_results', (table) => {
    table.bigIncrements('id').primary();
    table.uuid('project_id').notNullable().references('projects.id').onDelete('CASCADE');
    table.string('item_id', 300).notNullable();
    table.string('result', 4).notNullable();
    table.decimal('timeout_minutes', 7, 2);
    table.decimal('light_level', 9, 2);
    table.decimal('override_minutes', 7, 2);
    /** The project's units when the light level was recorded: 'ip' foot-candles, 'si' lux. */
    table.string('light_unit', 2).notNullable();
    table.string('notes', 2000);
    table.uuid('recorded_by').references('users.id').onDelete('SET NULL');
    table.timestamp('recorded_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    table.index(['project_id', 'item_id', 'id']);
  });
  await knex.raw(`alter table field_test_results add constraint field_test_results_result_check check (result in ('pass', 'fail'))`);
  await knex.raw(`alter table field_test_results add constraint field_test_results_light_unit_check check (light_unit in ('ip', 'si'))`);
  await knex.raw(
    `alter table field_test_results add constraint field_test_results_measured_check check (
      (timeout_minutes is null or timeout_minutes between 0 and 1440) and
      (override_minutes is null or override_minutes between 0 and 1440) and
      (light_level is null or light_level between 0 and 100000))`,
  );
  await knex.raw(`
    create function field_test_results_immutable() returns trigger language plpgsql as $$
    begin
      raise exception 'a recorded field test is never changed; record a retest instead';
    end $$`);
  await knex.raw(`
    create trigger field_test_results_no_update before update on field_test_results
      for each row execute function field_test_results_immutable()`);
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('field_test_results');
  await knex.raw('drop function field_test_results_immutable()');
}
