import type { Knex } from 'knex';
import { deriveIeccControls } from '../../service/src/code-tables/iecc-controls.js';
import {
  defaultReferenceRoot,
  editionIds,
  readReferenceEdition,
  type ReferenceEdition,
} from '../../service/src/code-tables/reference-files.js';
import type { RequirementCode, StrategyKey } from '../../service/src/compliance/edition-data.js';

/** Loads `reference/` into the code tables. An unchanged edition is left alone; a changed one gets a new data version. */
export async function seed(knex: Knex): Promise<void> {
  await seedCodeTables(knex);
}

export interface SeedOutcome {
  edition: string;
  dataVersion: string;
  inserted: boolean;
}

export async function seedCodeTables(knex: Knex, root = defaultReferenceRoot): Promise<SeedOutcome[]> {
  const outcomes: SeedOutcome[] = [];
  await knex.transaction(async (trx) => {
    const catalogue = readReferenceEdition(editionIds[0]!, root).catalogue;
    for (const [position, strategy] of catalogue.strategies.entries()) {
      await trx('control_strategies')
        .insert({ key: strategy.key, label: strategy.label, position })
        .onConflict('key')
        .merge(['label', 'position']);
    }
    for (const id of editionIds) {
      outcomes.push(await seedEdition(trx, readReferenceEdition(id, root)));
    }
  });
  return outcomes;
}

async function seedEdition(trx: Knex.Transaction, reference: ReferenceEdition): Promise<SeedOutcome> {
  const { id, dataVersion, edition } = reference;
  const editionRow = {
    id,
    family: edition.family,
    title: edition.title,
    publisher: edition.publisher,
    year: edition.year,
    methods: edition.methods,
  };
  await trx('code_editions').insert(editionRow).onConflict('id').merge(['family', 'title', 'publisher', 'year', 'methods']);

  const known = await trx('code_edition_versions').where({ edition_id: id, data_version: dataVersion }).first();
  if (!known) {
    await trx('code_edition_versions').insert({ edition_id: id, data_version: dataVersion });
    await insertTables(trx, reference);
  }
  const current = await trx('code_editions').where({ id }).first<{ current_data_version: string | null }>('current_data_version');
  if (current?.current_data_version !== dataVersion) {
    await trx('code_editions').where({ id }).update({ current_data_version: dataVersion });
  }
  return { edition: id, dataVersion, inserted: !known };
}

function provenanceColumns(row: { source: string; confidence: string; verified: boolean; note: string; fromMemory?: string | undefined }) {
  return { source: row.source, confidence: row.confidence, verified: row.verified, note: row.note, from_memory: row.fromMemory ?? null };
}

async function insertTables(trx: Knex.Transaction, reference: ReferenceEdition): Promise<void> {
  const version = { edition_id: reference.id, data_version: reference.dataVersion };

  await trx('building_area_types').insert(
    reference.buildingAreaTypes.rows.map((row, position) => ({
      ...version,
      key: row.key,
      position,
      label: row.label,
      source_label: row.sourceLabel,
      lpd_w_per_ft2: row.lpdWPerFt2,
      equals_row_of: row.equalsRowOf ? JSON.stringify(row.equalsRowOf) : null,
      ...provenanceColumns(row),
    })),
  );

  await trx('space_types').insert(
    reference.spaceTypes.rows.map((row, position) => ({
      ...version,
      key: row.key,
      position,
      label: row.label,
      source_label: row.sourceLabel,
      category: row.category,
      lpd_w_per_ft2: row.lpdWPerFt2,
      rcr_threshold: row.rcrThreshold,
      rcr_condition: row.rcrCondition ?? null,
      equals_row_of: row.equalsRowOf ? JSON.stringify(row.equalsRowOf) : null,
      lpd_formula: row.lpdFormula ? JSON.stringify(row.lpdFormula) : null,
      iecc_occupant_sensor_listed: row.iecc?.occupantSensorListed ?? null,
      iecc_occupant_sensor_list_item: row.iecc?.occupantSensorListItem ?? null,
      iecc_full_auto_on_allowed: row.iecc?.fullAutoOnAllowed ?? null,
      iecc_full_auto_on_item: row.iecc?.fullAutoOnItem ?? null,
      iecc_sensor_function: row.iecc?.sensorFunction ?? null,
      iecc_light_reduction_exempt_item: row.iecc?.lightReductionExemptItem ?? null,
      iecc_time_switch_exempt_item: row.iecc?.timeSwitchExemptItem ?? null,
      iecc_sleeping_unit: row.iecc ? row.iecc.sleepingUnit : null,
      iecc_inputs_tag: row.iecc?.tag ?? null,
      iecc_note: row.iecc?.note ?? null,
      ...provenanceColumns(row),
    })),
  );

  // A derived cell is only as sure as the strategy it derives: a rule input from an unverified strategy is unverified too.
  const strategyVerified = new Map(reference.controlStrategies.strategies.map((strategy) => [strategy.key, strategy.verified]));
  const controls = reference.spaceTypes.rows.flatMap((row) => {
    if (row.iecc && row.daylight) {
      const derived = deriveIeccControls(row.iecc, {
        sidelighting: row.daylight.sidelighting as RequirementCode,
        toplighting: row.daylight.toplighting as RequirementCode,
      });
      // Inputs that another edition's list stands in for cannot make a derived cell verified.
      const standIn = row.iecc.tag !== undefined;
      return Object.entries(derived).map(([strategy, cell]) => ({
        ...version,
        space_type_key: row.key,
        strategy_key: strategy,
        requirement: cell.requirement,
        source: strategy.startsWith('daylight-') ? row.source : 'derived from the C405.2.1 rule inputs of this space type',
        confidence: row.confidence,
        verified: row.verified && !standIn && !strategy.startsWith('daylight-') && (strategyVerified.get(strategy as StrategyKey) ?? false),
        note: strategy.startsWith('daylight-')
          ? `${cell.why}: ${row.daylight!.note}`
          : standIn
            ? `${cell.why}; IECC 2021's rule list stands in for this edition's own, which was not found`
            : cell.why,
        from_memory: null,
      }));
    }
    return Object.entries(row.controls ?? {}).map(([strategy, cell]) => ({
      ...version,
      space_type_key: row.key,
      strategy_key: strategy,
      requirement: cell.requirement,
      ...provenanceColumns(cell),
    }));
  });
  if (controls.length) await trx('space_type_controls').insert(controls);

  for (const strategy of reference.controlStrategies.strategies) {
    await trx('control_strategy_sections').insert({
      ...version,
      strategy_key: strategy.key,
      section: strategy.section,
      tag: strategy.tag,
      ...provenanceColumns(strategy),
    });
    const parameters = Object.entries(strategy.parameters).map(([name, parameter], position) => ({
      ...version,
      strategy_key: strategy.key,
      name,
      position,
      value: parameter.value,
      tag: parameter.tag,
      source: parameter.source,
      note: parameter.note ?? null,
    }));
    if (parameters.length) await trx('control_strategy_parameters').insert(parameters);
  }

  await trx('code_exterior_applications').insert(
    reference.exteriorApplications.rows.map((row, position) => ({
      ...version,
      key: row.key,
      position,
      label: row.label,
      source_label: row.sourceLabel,
      unit: row.unit,
      source_unit: row.sourceUnit,
      tradable: row.tradable,
      is_base_site_allowance: row.isBaseSiteAllowance,
      lz0: row.allowanceByZone['0'],
      lz1: row.allowanceByZone['1'],
      lz2: row.allowanceByZone['2'],
      lz3: row.allowanceByZone['3'],
      lz4: row.allowanceByZone['4'],
      unverified_zones: row.unverifiedZones ?? [],
      controls: JSON.stringify(row.controls),
      source_control_flags: JSON.stringify(row.sourceControlFlags),
      ...provenanceColumns(row),
    })),
  );

  await trx('lighting_zones').insert(
    reference.lightingZones.rows.map((row) => ({
      ...version,
      zone: Number(row.zone),
      description: row.description,
      source_label: row.sourceLabel,
      ...provenanceColumns(row),
    })),
  );

  if (reference.additionalAllowances.rows.length) {
    await trx('additional_allowances').insert(
      reference.additionalAllowances.rows.map((row, position) => ({
        ...version,
        key: row.key,
        position,
        label: row.label,
        source_label: row.sourceLabel,
        kind: row.kind,
        section: row.section ?? null,
        lpd_w_per_ft2: row.lpdWPerFt2,
        fixed_w: row.fixedW,
        ...provenanceColumns(row),
      })),
    );
  }

  const { rules } = reference;
  const side = rules.daylight.sideExtension;
  await trx('edition_rules').insert({
    ...version,
    daylight_primary_sidelit_threshold_w: rules.daylight.primarySidelitThresholdW,
    daylight_combined_sidelit_threshold_w: rules.daylight.combinedSidelitThresholdW,
    daylight_toplit_threshold_w: rules.daylight.toplitThresholdW,
    daylight_comparison: rules.daylight.comparison,
    daylight_minimum_window_area_ft2: rules.daylight.minimumWindowAreaFt2,
    daylight_side_extension_kind: side.kind,
    daylight_side_extension_value: side.kind === 'fixed' ? side.feet : side.fraction,
    daylight_primary_depth_head_heights: rules.daylight.primaryDepthHeadHeights,
    daylight_secondary_depth_head_heights: rules.daylight.secondaryDepthHeadHeights,
    daylight_toplit_extension_ceiling_heights: rules.daylight.toplitExtensionCeilingHeights,
    daylight_overlap_precedence: rules.daylight.overlapPrecedence ?? null,
    daylight_provenance: JSON.stringify(rules.daylight.provenance),
    daylight_openings: rules.daylight.openings ? JSON.stringify(rules.daylight.openings) : null,
    room_geometry_increase_percent: rules.roomGeometry?.increasePercent ?? null,
    room_geometry_provenance: rules.roomGeometry ? JSON.stringify(rules.roomGeometry.provenance) : null,
    small_enclosed_space_ft2: rules.smallEnclosedSpace?.ft2 ?? null,
    small_enclosed_space_provenance: rules.smallEnclosedSpace ? JSON.stringify(rules.smallEnclosedSpace.provenance) : null,
    track_minimum_w_per_ft: rules.track.minimumWPerFt,
    track_provenance: JSON.stringify(rules.track.provenance),
    base_site_covers_nontradable: rules.baseSite.coversNontradable,
    base_site_provenance: JSON.stringify(rules.baseSite.provenance),
  });

  if (reference.amendments.rows.length) {
    await trx('edition_amendments').insert(
      reference.amendments.rows.map((row, position) => ({
        ...version,
        key: row.key,
        position,
        title: row.title,
        jurisdiction: row.jurisdiction,
        parameters: JSON.stringify(row.parameters),
        source: row.source,
        confidence: row.confidence,
        verified: row.verified,
        note: row.note,
      })),
    );
  }

  await trx('edition_sections').insert(
    Object.entries(rules.sections).map(([key, section]) => ({
      ...version,
      key,
      section: section.section,
      tag: section.tag,
      verified: section.verified,
      note: section.note,
    })),
  );
}
