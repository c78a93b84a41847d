import type { Database } from '../db/database.js';
import type { AdditionalAllowanceKind } from '../../../contract/editions.js';
import type {
  AdditionalAllowance,
  Amendment,
  EqualRow,
  BuildingAreaType,
  CodeFamily,
  DaylightOpeningRules,
  ControlStrategy,
  EditionData,
  EditionId,
  EditionRules,
  ExteriorApplication,
  ExteriorUnit,
  LightingZone,
  LpdFormula,
  Provenance,
  RequirementCode,
  SpaceType,
  StrategyKey,
} from '../compliance/edition-data.js';
import { type Citation, citationOf, editionName, referenceOf, withoutProvenance } from '../compliance/citation.js';
import type {
  CodeEditionRow,
  ControlStrategyRow,
  ControlStrategySectionRow,
  ProvenanceColumns,
  EditionRulesRow,
  SpaceTypeControlRow,
  TaggedProvenance,
} from '../db/tables.js';

/** The code tables as the API and the compliance engine read them. NUMERIC columns stay strings. */

export interface RowProvenance {
  source: string;
  confidence: string;
  verified: boolean;
  note: string;
  fromMemory?: string;
  /** The row's source for people: a short citation and the note in words (none of the maintainers' markers). */
  citation: Citation;
}

export interface EditionSummary {
  id: EditionId;
  family: CodeFamily;
  title: string;
  publisher: string;
  year: number;
  dataVersion: string;
  methods: string[];
}

export interface BuildingAreaTypeView extends RowProvenance {
  key: string;
  label: string;
  sourceLabel: string;
  lpdWPerFt2: string;
  /** The row of another edition this one equals, where the reference data records one. */
  equalsRowOf?: EqualRow;
}

export interface IeccRuleView {
  occupantSensorListed: boolean;
  occupantSensorListItem: string | null;
  fullAutoOnAllowed: boolean;
  fullAutoOnItem: string | null;
  sensorFunction: NonNullable<SpaceType['iecc']>['sensorFunction'];
  lightReductionExemptItem: string | null;
  timeSwitchExemptItem: string | null;
  sleepingUnit: boolean;
  tag?: '[S-ed]';
  note?: string;
}

export interface SpaceTypeView extends RowProvenance {
  key: string;
  label: string;
  sourceLabel: string;
  category: string;
  lpdWPerFt2: string;
  lpdFormula?: LpdFormula;
  rcrThreshold: string | null;
  rcrCondition?: string;
  equalsRowOf?: EqualRow;
  controls: Partial<Record<StrategyKey, RequirementCode>>;
  controlProvenance: Partial<Record<StrategyKey, RowProvenance>>;
  iecc?: IeccRuleView;
}

export interface ControlStrategyView extends RowProvenance {
  key: StrategyKey;
  label: string;
  section: string;
  tag: string;
  parameters: Record<string, string>;
  parameterSources: Record<string, { tag: string; source: string; note?: string; citation: Citation }>;
}

export interface ExteriorApplicationView extends RowProvenance {
  key: string;
  label: string;
  sourceLabel: string;
  unit: string;
  sourceUnit: string;
  tradable: boolean;
  isBaseSiteAllowance: boolean;
  allowanceByZone: Record<string, string>;
  unverifiedZones: string[];
  controls: Partial<Record<StrategyKey, RequirementCode>>;
  sourceControlFlags: Record<string, string>;
}

export interface LightingZoneView extends RowProvenance {
  key: string;
  zone: number;
  label: string;
  description: string;
  sourceLabel: string;
}

export interface AdditionalAllowanceView extends RowProvenance {
  key: string;
  label: string;
  sourceLabel: string;
  kind: AdditionalAllowanceKind;
  section: string | null;
  lpdWPerFt2: string;
  fixedW: string | null;
}

export interface SectionView {
  section: string;
  tag: string;
  verified: boolean;
  note: string;
  citation: Citation;
}

export interface RulesView extends EditionRules {
  smallEnclosedSpaceProvenance: Provenance | null;
  sections: Record<string, SectionView>;
}

/**
 * A column the seeds always fill where it applies (the reference files require it); a row without
 * it is broken data, answered as an error rather than read as false or left out.
 */
function stored<Value>(value: Value | null, what: string): Value {
  if (value === null) throw new Error(`The code tables hold no value for ${what}.`);
  return value;
}

/** What a citation needs besides the row: the edition's name and the sections its rules cite (a fallback reference). */
interface CitationContext {
  edition: string;
  sections: Record<string, string>;
}

async function citationContext(db: Database, version: EditionVersion): Promise<CitationContext> {
  const rows = await db('edition_sections').where(scope(version)).select('key', 'section');
  return {
    edition: editionName(version.edition.family, version.edition.year),
    sections: Object.fromEntries(rows.map((row) => [row.key, row.section])),
  };
}

/** The table the row's own annotation names, else the section the edition cites for that kind of value. */
function reference(context: CitationContext, note: string | null | undefined, sectionKey: string): string {
  return referenceOf(note, context.sections[sectionKey] ?? '');
}

function provenanceOf(row: ProvenanceColumns, context: CitationContext, where: string, tag?: string): RowProvenance {
  const citation = citationOf({
    edition: context.edition,
    reference: where,
    source: row.source,
    confidence: row.confidence,
    tag,
    verified: row.verified,
    note: row.note,
    fromMemory: row.from_memory,
  });
  return {
    source: row.source,
    confidence: row.confidence,
    verified: row.verified,
    note: row.note,
    ...(row.from_memory ? { fromMemory: row.from_memory } : {}),
    citation,
  };
}

/** Provenance as the contract holds it: a from-memory text is kept in the note, the citation beside it. */
function contractProvenance(row: RowProvenance): Provenance {
  const note = [row.note, row.fromMemory ? `from memory: ${row.fromMemory}` : ''].filter(Boolean).join(' | ');
  return { source: row.source, confidence: row.confidence, verified: row.verified, ...(note ? { note } : {}), citation: row.citation };
}

/** An edition and the data version to read: the current one unless a stored result names another. */
export interface EditionVersion {
  edition: CodeEditionRow;
  dataVersion: string;
}

export async function listEditions(db: Database): Promise<EditionSummary[]> {
  const rows = await db('code_editions')
    .whereNotNull('current_data_version')
    .orderBy([{ column: 'family' }, { column: 'year' }]);
  return rows.map((row) => ({
    id: row.id,
    family: row.family,
    title: row.title,
    publisher: row.publisher,
    year: row.year,
    dataVersion: row.current_data_version,
    methods: row.methods,
  }));
}

export async function findEditionVersion(db: Database, editionId: string, dataVersion?: string): Promise<EditionVersion | undefined> {
  const edition = await db('code_editions').where('id', editionId).first();
  if (!edition) return undefined;
  const version = dataVersion ?? edition.current_data_version;
  const known = await db('code_edition_versions').where({ edition_id: editionId, data_version: version }).first();
  return known ? { edition, dataVersion: version } : undefined;
}

function scope(version: EditionVersion) {
  return { edition_id: version.edition.id, data_version: version.dataVersion };
}

export async function listBuildingAreaTypes(db: Database, version: EditionVersion): Promise<BuildingAreaTypeView[]> {
  const [rows, context] = await Promise.all([
    db('building_area_types').where(scope(version)).orderBy('position'),
    citationContext(db, version),
  ]);
  return rows.map((row) => ({
    key: row.key,
    label: row.label,
    sourceLabel: row.source_label,
    lpdWPerFt2: row.lpd_w_per_ft2,
    ...(row.equals_row_of ? { equalsRowOf: row.equals_row_of } : {}),
    ...provenanceOf(row, context, reference(context, row.note, 'buildingAreaMethod')),
  }));
}

export async function listSpaceTypes(db: Database, version: EditionVersion): Promise<SpaceTypeView[]> {
  const [rows, cells, context] = await Promise.all([
    db('space_types').where(scope(version)).orderBy('position'),
    db('space_type_controls')
      .join('control_strategies', 'control_strategies.key', 'space_type_controls.strategy_key')
      .where('space_type_controls.edition_id', version.edition.id)
      .where('space_type_controls.data_version', version.dataVersion)
      .orderBy('control_strategies.position')
      .select<SpaceTypeControlRow[]>('space_type_controls.*'),
    citationContext(db, version),
  ]);
  const cellsBySpace = new Map<string, typeof cells>();
  for (const cell of cells) {
    const list = cellsBySpace.get(cell.space_type_key) ?? [];
    list.push(cell);
    cellsBySpace.set(cell.space_type_key, list);
  }
  return rows.map((row) => {
    const controls: Partial<Record<StrategyKey, RequirementCode>> = {};
    const controlProvenance: Partial<Record<StrategyKey, RowProvenance>> = {};
    for (const cell of cellsBySpace.get(row.key) ?? []) {
      controls[cell.strategy_key] = cell.requirement;
      controlProvenance[cell.strategy_key] = provenanceOf(cell, context, reference(context, cell.note, 'spaceBySpaceMethod'));
    }
    const view: SpaceTypeView = {
      key: row.key,
      label: row.label,
      sourceLabel: row.source_label,
      category: row.category,
      lpdWPerFt2: row.lpd_w_per_ft2,
      ...(row.lpd_formula ? { lpdFormula: row.lpd_formula } : {}),
      rcrThreshold: row.rcr_threshold,
      ...(row.rcr_condition ? { rcrCondition: row.rcr_condition } : {}),
      ...(row.equals_row_of ? { equalsRowOf: row.equals_row_of } : {}),
      controls,
      controlProvenance,
      ...provenanceOf(row, context, reference(context, row.note, 'spaceBySpaceMethod')),
    };
    if (row.iecc_sensor_function) {
      const where = `space type ${row.key} of ${version.edition.id} (${version.dataVersion})`;
      view.iecc = {
        occupantSensorListed: stored(row.iecc_occupant_sensor_listed, `the occupant-sensor listing of ${where}`),
        occupantSensorListItem: row.iecc_occupant_sensor_list_item,
        fullAutoOnAllowed: stored(row.iecc_full_auto_on_allowed, `the full automatic-on exception of ${where}`),
        fullAutoOnItem: row.iecc_full_auto_on_item,
        sensorFunction: row.iecc_sensor_function,
        lightReductionExemptItem: row.iecc_light_reduction_exempt_item,
        timeSwitchExemptItem: row.iecc_time_switch_exempt_item ?? null,
        sleepingUnit: row.iecc_sleeping_unit ?? false,
        ...(row.iecc_inputs_tag ? { tag: row.iecc_inputs_tag } : {}),
        ...(row.iecc_note ? { note: row.iecc_note } : {}),
      };
    }
    return view;
  });
}

export async function listControlStrategies(db: Database, version: EditionVersion): Promise<ControlStrategyView[]> {
  const [sections, parameters, context] = await Promise.all([
    db('control_strategy_sections')
      .join('control_strategies', 'control_strategies.key', 'control_strategy_sections.strategy_key')
      .where('control_strategy_sections.edition_id', version.edition.id)
      .where('control_strategy_sections.data_version', version.dataVersion)
      .orderBy('control_strategies.position')
      .select<(ControlStrategySectionRow & Pick<ControlStrategyRow, 'label'>)[]>('control_strategy_sections.*', 'control_strategies.label'),
    db('control_strategy_parameters')
      .where(scope(version))
      .orderBy([{ column: 'strategy_key' }, { column: 'position' }]),
    citationContext(db, version),
  ]);
  return sections.map((row) => {
    const own = parameters.filter((parameter) => parameter.strategy_key === row.strategy_key);
    return {
      key: row.strategy_key,
      label: row.label,
      section: row.section,
      tag: row.tag,
      parameters: Object.fromEntries(own.map((parameter) => [parameter.name, parameter.value])),
      parameterSources: Object.fromEntries(
        own.map((parameter) => [
          parameter.name,
          {
            tag: parameter.tag,
            source: parameter.source,
            ...(parameter.note ? { note: parameter.note } : {}),
            // A parameter has no verified flag of its own: only a value from the edition's own text counts as checked.
            citation: citationOf({
              edition: context.edition,
              reference: row.section,
              source: parameter.source,
              confidence: '',
              tag: parameter.tag,
              verified: parameter.tag === '[S]',
              note: parameter.note,
            }),
          },
        ]),
      ),
      ...provenanceOf(row, context, row.section, row.tag),
    };
  });
}

export async function listExteriorApplications(db: Database, version: EditionVersion): Promise<ExteriorApplicationView[]> {
  const [rows, context] = await Promise.all([
    db('code_exterior_applications').where(scope(version)).orderBy('position'),
    citationContext(db, version),
  ]);
  return rows.map((row) => ({
    key: row.key,
    label: row.label,
    sourceLabel: row.source_label,
    unit: row.unit,
    sourceUnit: row.source_unit,
    tradable: row.tradable,
    isBaseSiteAllowance: row.is_base_site_allowance,
    allowanceByZone: { '0': row.lz0, '1': row.lz1, '2': row.lz2, '3': row.lz3, '4': row.lz4 },
    unverifiedZones: row.unverified_zones,
    controls: row.controls,
    sourceControlFlags: row.source_control_flags,
    ...provenanceOf(row, context, reference(context, row.note, 'exteriorAllowance')),
  }));
}

export async function listLightingZones(db: Database, version: EditionVersion): Promise<LightingZoneView[]> {
  const [rows, context] = await Promise.all([db('lighting_zones').where(scope(version)).orderBy('zone'), citationContext(db, version)]);
  return rows.map((row) => ({
    key: String(row.zone),
    zone: row.zone,
    label: `Lighting zone ${row.zone}`,
    description: withoutProvenance(row.description),
    sourceLabel: row.source_label,
    ...provenanceOf(row, context, context.sections['lightingZones'] ?? ''),
  }));
}

export async function listAdditionalAllowances(db: Database, version: EditionVersion): Promise<AdditionalAllowanceView[]> {
  const [rows, context] = await Promise.all([
    db('additional_allowances').where(scope(version)).orderBy('position'),
    citationContext(db, version),
  ]);
  return rows.map((row) => ({
    key: row.key,
    label: row.label,
    sourceLabel: row.source_label,
    kind: row.kind,
    section: row.section,
    lpdWPerFt2: row.lpd_w_per_ft2,
    fixedW: row.fixed_w,
    // A row stating its own section (the decorative allowance, item (a)) is cited by it.
    ...provenanceOf(row, context, row.section ? referenceOf(row.note, row.section) : reference(context, row.note, 'additionalAllowances')),
  }));
}

/** An edition rule's provenance (stored as JSON with its tag), cited under the section the rule belongs to. */
function taggedProvenance(value: TaggedProvenance, context: CitationContext, sectionKey: string): Provenance {
  const citation = citationOf({ edition: context.edition, reference: context.sections[sectionKey] ?? '', ...value });
  return contractProvenance({ ...value, note: [value.tag, value.note].filter(Boolean).join(' '), citation });
}

type StoredOpeningRules = NonNullable<EditionRulesRow['daylight_openings']>;

/** The glazing rules of an edition, each cited by its own section. */
function openingRules(stored: StoredOpeningRules, context: CitationContext): DaylightOpeningRules {
  const cited = Object.entries(stored).map(([name, { provenance, ...rule }]) => {
    const citation = citationOf({ edition: context.edition, reference: rule.section, ...provenance });
    return [
      name,
      {
        ...rule,
        provenance: contractProvenance({ ...provenance, note: [provenance.tag, provenance.note].filter(Boolean).join(' '), citation }),
      },
    ];
  });
  return Object.fromEntries(cited) as DaylightOpeningRules;
}

export interface AmendmentView extends RowProvenance {
  key: string;
  title: string;
  jurisdiction: string;
  parameters: Amendment['parameters'];
}

/** The jurisdiction amendments a project on this edition may choose. */
export async function listAmendments(db: Database, version: EditionVersion): Promise<AmendmentView[]> {
  const [rows, context] = await Promise.all([
    db('edition_amendments').where({ edition_id: version.edition.id, data_version: version.dataVersion }).orderBy('position'),
    citationContext(db, version),
  ]);
  return rows.map((row) => ({
    key: row.key,
    title: row.title,
    jurisdiction: row.jurisdiction,
    parameters: row.parameters,
    ...provenanceOf({ ...row, from_memory: null }, context, row.title),
  }));
}

export async function getRules(db: Database, version: EditionVersion): Promise<RulesView> {
  const [row, sections, context] = await Promise.all([
    db('edition_rules').where(scope(version)).first(),
    db('edition_sections').where(scope(version)).orderBy('key'),
    citationContext(db, version),
  ]);
  if (!row) throw new Error(`The code tables of ${version.edition.id} (${version.dataVersion}) have no edition rules.`);
  return {
    daylight: {
      primarySidelitThresholdW: row.daylight_primary_sidelit_threshold_w,
      combinedSidelitThresholdW: row.daylight_combined_sidelit_threshold_w,
      toplitThresholdW: row.daylight_toplit_threshold_w,
      comparison: row.daylight_comparison,
      minimumWindowAreaFt2: row.daylight_minimum_window_area_ft2,
      sideExtension:
        row.daylight_side_extension_kind === 'fixed'
          ? { kind: 'fixed', feet: row.daylight_side_extension_value }
          : { kind: 'head-height-fraction', fraction: row.daylight_side_extension_value },
      primaryDepthHeadHeights: row.daylight_primary_depth_head_heights,
      secondaryDepthHeadHeights: row.daylight_secondary_depth_head_heights,
      toplitExtensionCeilingHeights: row.daylight_toplit_extension_ceiling_heights,
      ...(row.daylight_overlap_precedence ? { overlapPrecedence: row.daylight_overlap_precedence } : {}),
      provenance: taggedProvenance(row.daylight_provenance, context, 'daylightSidelighting'),
      ...(row.daylight_openings ? { openings: openingRules(row.daylight_openings, context) } : {}),
    },
    roomGeometry:
      row.room_geometry_increase_percent === null
        ? null
        : {
            increasePercent: row.room_geometry_increase_percent,
            provenance: taggedProvenance(
              stored(row.room_geometry_provenance, `the room-geometry provenance of ${version.edition.id} (${version.dataVersion})`),
              context,
              'roomGeometry',
            ),
          },
    smallEnclosedSpaceFt2: row.small_enclosed_space_ft2,
    smallEnclosedSpaceProvenance: row.small_enclosed_space_provenance
      ? taggedProvenance(
          row.small_enclosed_space_provenance,
          context,
          context.sections['occupantSensor'] ? 'occupantSensor' : 'controlsGeneral',
        )
      : null,
    trackMinimumWPerFt: row.track_minimum_w_per_ft,
    trackProvenance: taggedProvenance(row.track_provenance, context, 'trackLighting'),
    baseSiteCoversNontradable: row.base_site_covers_nontradable,
    baseSiteProvenance: taggedProvenance(row.base_site_provenance, context, 'exteriorAllowance'),
    sections: Object.fromEntries(
      sections.map((section) => [
        section.key,
        {
          section: section.section,
          tag: section.tag,
          verified: section.verified,
          note: section.note,
          citation: citationOf({
            edition: context.edition,
            reference: section.section,
            source: '',
            confidence: '',
            tag: section.tag,
            verified: section.verified,
            note: section.note,
          }),
        },
      ]),
    ),
  };
}

const exteriorUnits: readonly ExteriorUnit[] = ['W', 'W/ft2', 'W/ft', 'W/location', 'W/door', 'W/device', 'W/window'];

function isExteriorUnit(unit: string): unit is ExteriorUnit {
  return (exteriorUnits as readonly string[]).includes(unit);
}

const editionDataCache = new Map<string, EditionData>();

/**
 * The whole edition as the compliance engine reads it, at its current data version unless one is
 * named. Cached by edition and data version: a data version's rows never change.
 */
export async function loadEditionData(db: Database, editionId: string, dataVersion?: string): Promise<EditionData | undefined> {
  const version = await findEditionVersion(db, editionId, dataVersion);
  if (!version) return undefined;
  const cacheKey = `${version.edition.id}@${version.dataVersion}`;
  const cached = editionDataCache.get(cacheKey);
  if (cached) return cached;

  const [buildingAreaTypes, spaceTypes, strategies, exterior, zones, allowances, rules, amendments] = await Promise.all([
    listBuildingAreaTypes(db, version),
    listSpaceTypes(db, version),
    listControlStrategies(db, version),
    listExteriorApplications(db, version),
    listLightingZones(db, version),
    listAdditionalAllowances(db, version),
    getRules(db, version),
    listAmendments(db, version),
  ]);
  const { sections, smallEnclosedSpaceProvenance: _small, ...editionRules } = rules;
  const data: EditionData = {
    id: version.edition.id,
    family: version.edition.family,
    title: version.edition.title,
    publisher: version.edition.publisher,
    year: version.edition.year,
    dataVersion: version.dataVersion,
    sections: Object.fromEntries(Object.entries(sections).map(([key, section]) => [key, section.section])),
    buildingAreaTypes: buildingAreaTypes.map((row): BuildingAreaType => ({
      key: row.key,
      label: row.label,
      sourceLabel: row.sourceLabel,
      lpdWPerFt2: row.lpdWPerFt2,
      ...(row.equalsRowOf ? { equalsRowOf: row.equalsRowOf } : {}),
      provenance: contractProvenance(row),
    })),
    spaceTypes: spaceTypes.map((row): SpaceType => ({
      key: row.key,
      label: row.label,
      sourceLabel: row.sourceLabel,
      category: row.category,
      lpdWPerFt2: row.lpdWPerFt2,
      ...(row.lpdFormula ? { lpdFormula: row.lpdFormula } : {}),
      rcrThreshold: row.rcrThreshold,
      ...(row.rcrCondition ? { rcrCondition: row.rcrCondition } : {}),
      ...(row.equalsRowOf ? { equalsRowOf: row.equalsRowOf } : {}),
      controls: row.controls,
      ...(row.iecc
        ? {
            iecc: {
              occupantSensorListed: row.iecc.occupantSensorListed,
              fullAutoOnAllowed: row.iecc.fullAutoOnAllowed,
              sensorFunction: row.iecc.sensorFunction,
              lightReductionExemptItem: row.iecc.lightReductionExemptItem,
              timeSwitchExemptItem: row.iecc.timeSwitchExemptItem,
              sleepingUnit: row.iecc.sleepingUnit,
            },
          }
        : {}),
      provenance: contractProvenance(row),
    })),
    controlStrategies: strategies.map((row): ControlStrategy => ({
      key: row.key,
      label: row.label,
      section: row.section,
      parameters: row.parameters,
      provenance: contractProvenance({
        ...row,
        note: [row.note, ...Object.entries(row.parameterSources).map(([name, source]) => `${name} ${source.tag} ${source.source}`)].join(
          ' | ',
        ),
      }),
    })),
    exteriorApplications: exterior.flatMap((row): ExteriorApplication[] => {
      if (!isExteriorUnit(row.unit)) return [];
      const zoneNote = row.unverifiedZones.length ? `allowances for zone ${row.unverifiedZones.join(', ')} to verify` : '';
      return [
        {
          key: row.key,
          label: row.label,
          sourceLabel: row.sourceLabel,
          unit: row.unit,
          tradable: row.tradable,
          isBaseSiteAllowance: row.isBaseSiteAllowance,
          allowanceByZone: row.allowanceByZone,
          ...(row.unverifiedZones.length ? { unverifiedZones: row.unverifiedZones } : {}),
          controls: row.controls,
          provenance: contractProvenance({ ...row, note: [row.note, zoneNote].filter(Boolean).join(' | ') }),
        },
      ];
    }),
    lightingZones: zones.map((row): LightingZone => ({
      zone: row.zone,
      description: row.description,
      provenance: contractProvenance(row),
    })),
    additionalAllowances: allowances.map((row): AdditionalAllowance => ({
      key: row.key,
      label: row.label,
      kind: row.kind,
      ...(row.section !== null ? { section: row.section } : {}),
      lpdWPerFt2: row.lpdWPerFt2,
      ...(row.fixedW !== null ? { fixedW: row.fixedW } : {}),
      provenance: contractProvenance(row),
    })),
    rules: editionRules,
    amendments: amendments.map((row): Amendment => ({
      key: row.key,
      title: row.title,
      jurisdiction: row.jurisdiction,
      parameters: row.parameters,
      provenance: contractProvenance(row),
    })),
  };
  editionDataCache.set(cacheKey, data);
  return data;
}
