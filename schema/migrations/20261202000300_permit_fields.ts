import type { Knex } from 'knex';

/** What a permit office asks for beside the design: the permit, the owner, the building, the scope, and who designs and builds it. */
const textColumns = [
  'permit_number',
  'owner_name',
  'occupancy',
  'scope',
  'designer_name',
  'designer_firm',
  'designer_licence',
  'contractor_name',
  'contractor_firm',
  'contractor_licence',
  'contractor_contact',
];

export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('projects', (table) => {
    for (const column of textColumns) table.text(column);
    table.specificType('gross_floor_area', 'numeric');
    // As on the design rows: the gross floor area before the last change of units.
    table.jsonb('unit_origin');
  });
  await knex.raw(
    "alter table projects add constraint projects_scope_check check (scope is null or scope in ('new-building', 'addition', 'alteration', 'tenant-improvement'))",
  );
}

export async function down(knex: Knex): Promise<void> {
  await knex.raw('alter table projects drop constraint projects_scope_check');
  await knex.schema.alterTable('projects', (table) => {
    table.dropColumns(...textColumns, 'gross_floor_area', 'unit_origin');
  });
}
