import type { Knex } from 'knex';

/** The row of another edition a space type or building area type equals, as the reference data records it: the map a comparison across editions follows. */
export async function up(knex: Knex): Promise<void> {
  for (const name of ['space_types', 'building_area_types']) {
    await knex.schema.alterTable(name, (table) => {
      table.jsonb('equals_row_of');
    });
  }
}

export async function down(knex: Knex): Promise<void> {
  for (const name of ['space_types', 'building_area_types']) {
    await knex.schema.alterTable(name, (table) => {
      table.dropColumn('equals_row_of');
    });
  }
}
