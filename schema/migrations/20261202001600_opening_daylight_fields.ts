import type { Knex } from 'knex';

/**
 * What the daylight rules need to know of each window and skylight beyond its size: the
 * glazing's visible transmittance (a fraction from 0 to 1) and whether an adjacent structure (for
 * a skylight, also a natural object) blocks its daylight. Both stay blank until entered: a blank
 * is "not recorded", never "no". The edition's rules on them (exceptions, minimum glazing) are
 * code-table data, kept as one document per edition with a source on every entry.
 */
const openings = ['space_windows', 'space_skylights'] as const;

export async function up(knex: Knex): Promise<void> {
  for (const name of openings) {
    await knex.schema.alterTable(name, (table) => {
      table.specificType('visible_transmittance', 'numeric');
      table.boolean('daylight_blocked');
    });
    await knex.raw(
      `alter table ?? add constraint ?? check (visible_transmittance is null or (visible_transmittance >= 0 and visible_transmittance <= 1))`,
      [name, `${name}_visible_transmittance_check`],
    );
  }
  await knex.schema.alterTable('edition_rules', (table) => {
    table.jsonb('daylight_openings');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('edition_rules', (table) => {
    table.dropColumn('daylight_openings');
  });
  for (const name of openings) {
    await knex.raw('alter table ?? drop constraint ??', [name, `${name}_visible_transmittance_check`]);
    await knex.schema.alterTable(name, (table) => {
      table.dropColumns('visible_transmittance', 'daylight_blocked');
    });
  }
}
