import type { Knex } from 'knex';

/**
 * More rule inputs held as data: the IECC time-switch exceptions and sleeping units per space type,
 * and the order in which an edition gives overlapping daylight zones their floor area.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('space_types', (table) => {
    table.text('iecc_time_switch_exempt_item');
    table.boolean('iecc_sleeping_unit');
  });
  await knex.schema.alterTable('edition_rules', (table) => {
    table.specificType('daylight_overlap_precedence', 'text[]');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('edition_rules', (table) => {
    table.dropColumn('daylight_overlap_precedence');
  });
  await knex.schema.alterTable('space_types', (table) => {
    table.dropColumns('iecc_time_switch_exempt_item', 'iecc_sleeping_unit');
  });
}
