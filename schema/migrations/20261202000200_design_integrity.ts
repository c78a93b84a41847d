import type { Knex } from 'knex';

/**
 * What keeps a design right under concurrency and across unit changes:
 * - space positions unique per project (compacted first, keeping their order);
 * - `unit_origin` on every row with a length or area: the values as they were before the last
 *   change of units, so converting back returns them exactly instead of a rounded quotient;
 * - idempotency keys for imports, so a retried import does not import twice;
 * - archived projects;
 * - the audit log read per space and per person.
 */
const withUnitOrigin = [
  'spaces',
  'space_windows',
  'space_skylights',
  'space_controls',
  'luminaire_types',
  'exterior_applications',
  'retail_display_claims',
];

export async function up(knex: Knex): Promise<void> {
  await knex.raw(`
    update spaces s set position = ordered.rank - 1
    from (select id, row_number() over (partition by project_id order by position, name, id) as rank from spaces) ordered
    where s.id = ordered.id and s.position <> ordered.rank - 1`);
  await knex.schema.alterTable('spaces', (table) => {
    table.dropIndex(['project_id', 'position']);
    table.unique(['project_id', 'position'], { indexName: 'spaces_project_position_unique' });
  });

  for (const name of withUnitOrigin) {
    await knex.schema.alterTable(name, (table) => {
      table.jsonb('unit_origin');
    });
  }

  await knex.schema.createTable('idempotency_keys', (table) => {
    table.uuid('project_id').notNullable().references('projects.id').onDelete('CASCADE');
    table.uuid('user_id').notNullable().references('users.id').onDelete('CASCADE');
    table.text('key').notNullable();
    table.text('request_hash').notNullable();
    table.specificType('space_ids', 'uuid[]').notNullable();
    table.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    table.primary(['project_id', 'user_id', 'key']);
  });

  await knex.schema.alterTable('projects', (table) => {
    table.timestamp('archived_at', { useTz: true });
    table.uuid('archived_by').references('users.id').onDelete('SET NULL');
  });

  await knex.schema.alterTable('audit_log', (table) => {
    table.index(['project_id', 'entity_id'], 'audit_log_project_entity');
    table.index(['project_id', 'user_id', 'at'], 'audit_log_project_user_at');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('audit_log', (table) => {
    table.dropIndex([], 'audit_log_project_user_at');
    table.dropIndex([], 'audit_log_project_entity');
  });
  await knex.schema.alterTable('projects', (table) => {
    table.dropColumns('archived_at', 'archived_by');
  });
  await knex.schema.dropTable('idempotency_keys');
  for (const name of withUnitOrigin) {
    await knex.schema.alterTable(name, (table) => {
      table.dropColumn('unit_origin');
    });
  }
  await knex.schema.alterTable('spaces', (table) => {
    table.dropUnique(['project_id', 'position'], 'spaces_project_position_unique');
    table.index(['project_id', 'position']);
  });
}
