import type { Knex } from 'knex';

/**
 * The exterior lighting's astronomical schedule as the project sets it: one row per project, absent
 * until the engineer saves one (the schedule then runs on the common-practice defaults). The
 * settings are the JSON the service's schema checks (`scheduleSettingsSchema`: offsets 0–120
 * minutes, the setback window as local HH:MM and its reduction 0–100 %, or no setback); `version`
 * counts the saves, so a write made on an older read is refused.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('exterior_schedule_settings', (table) => {
    table.uuid('project_id').primary().references('projects.id').onDelete('CASCADE');
    table.jsonb('settings').notNullable();
    table.integer('version').notNullable().defaultTo(1);
    table.uuid('updated_by').references('users.id').onDelete('SET NULL');
    table.timestamp('updated_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('exterior_schedule_settings');
}
