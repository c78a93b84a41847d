import type { Knex } from 'knex';

/**
 * Code tables keyed by (edition_id, data_version): a new data version inserts new rows beside the
 * old ones, so a result stored with its data version keeps the numbers it was checked against.
 * Decimals are NUMERIC and come back from pg as strings.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('code_editions', (table) => {
    table.text('id').primary();
    table.text('family').notNullable();
    table.text('title').notNullable();
    table.text('publisher').notNullable();
    table.integer('year').notNullable();
    table.specificType('methods', 'text[]').notNullable();
    table.text('current_data_version');
  });

  await knex.schema.createTable('code_edition_versions', (table) => {
    table.text('edition_id').notNullable().references('code_editions.id').onDelete('CASCADE');
    table.text('data_version').notNullable();
    table.timestamp('loaded_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    table.primary(['edition_id', 'data_version']);
  });
  await knex.raw(
    'alter table code_editions add constraint code_editions_current_version_fk foreign key (id, current_data_version) references code_edition_versions (edition_id, data_version) deferrable initially deferred',
  );

  const versioned = (table: Knex.CreateTableBuilder) => {
    table.text('edition_id').notNullable();
    table.text('data_version').notNullable();
    table
      .foreign(['edition_id', 'data_version'])
      .references(['edition_id', 'data_version'])
      .inTable('code_edition_versions')
      .onDelete('CASCADE');
  };
  const provenance = (table: Knex.CreateTableBuilder) => {
    table.text('source').notNullable();
    table.text('confidence').notNullable();
    table.boolean('verified').notNullable();
    table.text('note').notNullable().defaultTo('');
    table.text('from_memory');
  };

  await knex.schema.createTable('building_area_types', (table) => {
    versioned(table);
    table.text('key').notNullable();
    table.integer('position').notNullable();
    table.text('label').notNullable();
    table.text('source_label').notNullable();
    table.decimal('lpd_w_per_ft2', null).notNullable();
    provenance(table);
    table.primary(['edition_id', 'data_version', 'key']);
  });

  await knex.schema.createTable('space_types', (table) => {
    versioned(table);
    table.text('key').notNullable();
    table.integer('position').notNullable();
    table.text('label').notNullable();
    table.text('source_label').notNullable();
    table.text('category').notNullable();
    table.decimal('lpd_w_per_ft2', null).notNullable();
    table.decimal('rcr_threshold', null);
    table.text('rcr_condition');
    table.boolean('iecc_occupant_sensor_listed');
    table.text('iecc_occupant_sensor_list_item');
    table.boolean('iecc_full_auto_on_allowed');
    table.text('iecc_full_auto_on_item');
    table.text('iecc_sensor_function');
    table.text('iecc_note');
    provenance(table);
    table.primary(['edition_id', 'data_version', 'key']);
  });

  await knex.schema.createTable('control_strategies', (table) => {
    table.text('key').primary();
    table.text('label').notNullable();
    table.integer('position').notNullable();
  });

  await knex.schema.createTable('space_type_controls', (table) => {
    versioned(table);
    table.text('space_type_key').notNullable();
    table.text('strategy_key').notNullable().references('control_strategies.key');
    table.text('requirement').notNullable();
    provenance(table);
    table.primary(['edition_id', 'data_version', 'space_type_key', 'strategy_key']);
    table
      .foreign(['edition_id', 'data_version', 'space_type_key'])
      .references(['edition_id', 'data_version', 'key'])
      .inTable('space_types')
      .onDelete('CASCADE');
  });

  await knex.schema.createTable('control_strategy_sections', (table) => {
    versioned(table);
    table.text('strategy_key').notNullable().references('control_strategies.key');
    table.text('section').notNullable();
    table.text('tag').notNullable();
    provenance(table);
    table.primary(['edition_id', 'data_version', 'strategy_key']);
  });

  await knex.schema.createTable('control_strategy_parameters', (table) => {
    versioned(table);
    table.text('strategy_key').notNullable();
    table.text('name').notNullable();
    table.integer('position').notNullable();
    table.decimal('value', null).notNullable();
    table.text('tag').notNullable();
    table.text('source').notNullable();
    table.text('note');
    table.primary(['edition_id', 'data_version', 'strategy_key', 'name']);
    table
      .foreign(['edition_id', 'data_version', 'strategy_key'])
      .references(['edition_id', 'data_version', 'strategy_key'])
      .inTable('control_strategy_sections')
      .onDelete('CASCADE');
  });

  await knex.schema.createTable('code_exterior_applications', (table) => {
    versioned(table);
    table.text('key').notNullable();
    table.integer('position').notNullable();
    table.text('label').notNullable();
    table.text('source_label').notNullable();
    table.text('unit').notNullable();
    table.text('source_unit').notNullable();
    table.boolean('tradable').notNullable();
    table.boolean('is_base_site_allowance').notNullable();
    for (const zone of [0, 1, 2, 3, 4]) table.decimal(`lz${zone}`, null).notNullable();
    table.specificType('unverified_zones', 'text[]').notNullable().defaultTo('{}');
    table.jsonb('controls').notNullable();
    table.jsonb('source_control_flags').notNullable();
    provenance(table);
    table.primary(['edition_id', 'data_version', 'key']);
  });

  await knex.schema.createTable('lighting_zones', (table) => {
    versioned(table);
    table.integer('zone').notNullable();
    table.text('description').notNullable();
    table.text('source_label').notNullable();
    provenance(table);
    table.primary(['edition_id', 'data_version', 'zone']);
  });

  await knex.schema.createTable('additional_allowances', (table) => {
    versioned(table);
    table.text('key').notNullable();
    table.integer('position').notNullable();
    table.text('label').notNullable();
    table.text('source_label').notNullable();
    table.text('kind').notNullable();
    table.decimal('lpd_w_per_ft2', null).notNullable();
    table.decimal('fixed_w', null);
    provenance(table);
    table.primary(['edition_id', 'data_version', 'key']);
  });

  await knex.schema.createTable('edition_rules', (table) => {
    versioned(table);
    table.decimal('daylight_primary_sidelit_threshold_w', null).notNullable();
    table.decimal('daylight_combined_sidelit_threshold_w', null);
    table.decimal('daylight_toplit_threshold_w', null).notNullable();
    table.text('daylight_comparison').notNullable();
    table.decimal('daylight_minimum_window_area_ft2', null);
    table.text('daylight_side_extension_kind').notNullable();
    table.decimal('daylight_side_extension_value', null).notNullable();
    table.decimal('daylight_primary_depth_head_heights', null).notNullable();
    table.decimal('daylight_secondary_depth_head_heights', null).notNullable();
    table.decimal('daylight_toplit_extension_ceiling_heights', null).notNullable();
    table.jsonb('daylight_provenance').notNullable();
    table.decimal('room_geometry_increase_percent', null);
    table.jsonb('room_geometry_provenance');
    table.decimal('small_enclosed_space_ft2', null);
    table.jsonb('small_enclosed_space_provenance');
    table.decimal('track_minimum_w_per_ft', null).notNullable();
    table.jsonb('track_provenance').notNullable();
    table.boolean('base_site_covers_nontradable').notNullable();
    table.jsonb('base_site_provenance').notNullable();
    table.primary(['edition_id', 'data_version']);
  });

  await knex.schema.createTable('edition_sections', (table) => {
    versioned(table);
    table.text('key').notNullable();
    table.text('section').notNullable();
    table.text('tag').notNullable();
    table.boolean('verified').notNullable();
    table.text('note').notNullable().defaultTo('');
    table.primary(['edition_id', 'data_version', 'key']);
  });
}

export async function down(knex: Knex): Promise<void> {
  for (const name of [
    'edition_sections',
    'edition_rules',
    'additional_allowances',
    'lighting_zones',
    'code_exterior_applications',
    'control_strategy_parameters',
    'control_strategy_sections',
    'space_type_controls',
    'control_strategies',
    'space_types',
    'building_area_types',
  ]) {
    await knex.schema.dropTable(name);
  }
  await knex.raw('alter table code_editions drop constraint code_editions_current_version_fk');
  await knex.schema.dropTable('code_edition_versions');
  await knex.schema.dropTable('code_editions');
}
