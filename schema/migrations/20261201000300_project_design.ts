import type { Knex } from 'knex';

/** A project's design data: set-up, spaces and what is in them, luminaire types, exterior lighting. */

function versioned(knex: Knex, table: Knex.CreateTableBuilder): void {
  table.integer('version').notNullable().defaultTo(1);
  table.uuid('updated_by').references('users.id').onDelete('SET NULL');
  table.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
  table.timestamp('updated_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
}

export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('projects', (table) => {
    table.text('address');
    table.specificType('latitude', 'numeric');
    table.specificType('longitude', 'numeric');
    table.text('time_zone');
    table.text('jurisdiction');
    table.text('edition_id');
    table.text('method');
    table.text('units').notNullable().defaultTo('ip');
    table.integer('lighting_zone');
    table.uuid('updated_by').references('users.id').onDelete('SET NULL');
  });
  await knex.raw(
    "alter table projects add constraint projects_method_check check (method is null or method in ('building-area', 'space-by-space'))",
  );
  await knex.raw("alter table projects add constraint projects_units_check check (units in ('ip', 'si'))");
  await knex.raw(
    'alter table projects add constraint projects_lighting_zone_check check (lighting_zone is null or lighting_zone between 0 and 4)',
  );

  await knex.schema.createTable('luminaire_types', (table) => {
    table.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'));
    table.uuid('project_id').notNullable().references('projects.id').onDelete('CASCADE');
    table.text('tag').notNullable();
    table.text('description').notNullable().defaultTo('');
    table.specificType('input_watts', 'numeric').notNullable();
    table.text('use').notNullable().defaultTo('general');
    table.text('exempt_reason');
    table.text('basis').notNullable().defaultTo('rated');
    table.specificType('length', 'numeric');
    table.specificType('limit_watts', 'numeric');
    table.text('wattage_source');
    versioned(knex, table);
    table.unique(['project_id', 'tag']);
  });
  await knex.raw(
    "alter table luminaire_types add constraint luminaire_types_use_check check (use in ('general', 'decorative', 'display', 'exempt'))",
  );
  await knex.raw(
    "alter table luminaire_types add constraint luminaire_types_basis_check check (basis in ('rated', 'line-voltage-track', 'low-voltage-track', 'current-limited'))",
  );

  await knex.schema.createTable('spaces', (table) => {
    table.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'));
    table.uuid('project_id').notNullable().references('projects.id').onDelete('CASCADE');
    table.integer('position').notNullable().defaultTo(0);
    table.text('name').notNullable();
    table.text('level').notNullable().defaultTo('');
    table.text('space_type');
    table.text('building_area_type');
    table.text('control_space_type');
    table.specificType('area', 'numeric').notNullable();
    table.specificType('ceiling_height', 'numeric');
    table.specificType('length', 'numeric');
    table.specificType('width', 'numeric');
    table.specificType('luminaire_height', 'numeric');
    table.specificType('work_plane_height', 'numeric');
    table.boolean('enclosed');
    versioned(knex, table);
    table.index(['project_id', 'position']);
  });

  // A space's luminaires, controls, windows and skylights are part of the space: a write replaces
  // them together and bumps the space's version.
  await knex.schema.createTable('space_luminaires', (table) => {
    table.uuid('space_id').notNullable().references('spaces.id').onDelete('CASCADE');
    table.integer('position').notNullable();
    table.uuid('luminaire_type_id').notNullable().references('luminaire_types.id').onDelete('RESTRICT');
    table.integer('count').notNullable();
    table.text('zone');
    table.primary(['space_id', 'position']);
    table.index(['luminaire_type_id']);
  });
  await knex.raw('alter table space_luminaires add constraint space_luminaires_count_check check (count >= 0)');
  await knex.raw(
    "alter table space_luminaires add constraint space_luminaires_zone_check check (zone is null or zone in ('primary-sidelit', 'secondary-sidelit', 'toplit'))",
  );

  await knex.schema.createTable('space_controls', (table) => {
    table.uuid('space_id').notNullable().references('spaces.id').onDelete('CASCADE');
    table.text('strategy').notNullable();
    table.boolean('provided').notNullable();
    table.specificType('timeout_minutes', 'numeric');
    table.specificType('zone_size', 'numeric');
    table.text('auto_on');
    table.text('device');
    table.text('exception_reason');
    table.text('exception_note');
    table.primary(['space_id', 'strategy']);
  });

  await knex.schema.createTable('space_windows', (table) => {
    table.uuid('space_id').notNullable().references('spaces.id').onDelete('CASCADE');
    table.integer('position').notNullable();
    table.specificType('width', 'numeric').notNullable();
    table.specificType('head_height', 'numeric').notNullable();
    table.specificType('sill_height', 'numeric');
    table.text('wall');
    table.specificType('offset', 'numeric');
    table.primary(['space_id', 'position']);
  });

  await knex.schema.createTable('space_skylights', (table) => {
    table.uuid('space_id').notNullable().references('spaces.id').onDelete('CASCADE');
    table.integer('position').notNullable();
    table.specificType('length', 'numeric').notNullable();
    table.specificType('width', 'numeric').notNullable();
    table.specificType('x', 'numeric');
    table.specificType('y', 'numeric');
    table.primary(['space_id', 'position']);
  });

  await knex.schema.createTable('exterior_applications', (table) => {
    table.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'));
    table.uuid('project_id').notNullable().references('projects.id').onDelete('CASCADE');
    table.integer('position').notNullable().defaultTo(0);
    table.text('application_key').notNullable();
    table.text('description').notNullable().defaultTo('');
    table.specificType('quantity', 'numeric').notNullable();
    table.specificType('installed_watts', 'numeric').notNullable();
    table.jsonb('controls').notNullable().defaultTo('[]');
    versioned(knex, table);
    table.index(['project_id', 'position']);
  });

  await knex.schema.createTable('retail_display_claims', (table) => {
    table.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'));
    table.uuid('project_id').notNullable().references('projects.id').onDelete('CASCADE');
    table.uuid('space_id').notNullable().references('spaces.id').onDelete('CASCADE');
    table.text('allowance_key').notNullable();
    table.specificType('area', 'numeric').notNullable();
    versioned(knex, table);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('retail_display_claims');
  await knex.schema.dropTable('exterior_applications');
  await knex.schema.dropTable('space_skylights');
  await knex.schema.dropTable('space_windows');
  await knex.schema.dropTable('space_controls');
  await knex.schema.dropTable('space_luminaires');
  await knex.schema.dropTable('spaces');
  await knex.schema.dropTable('luminaire_types');
  await knex.raw(
    'alter table projects drop constraint projects_lighting_zone_check, drop constraint projects_units_check, drop constraint projects_method_check',
  );
  await knex.schema.alterTable('projects', (table) => {
    table.dropColumns(
      'address',
      'latitude',
      'longitude',
      'time_zone',
      'jurisdiction',
      'edition_id',
      'method',
      'units',
      'lighting_zone',
      'updated_by',
    );
  });
}
