/**
 * Row shapes as the repositories read them. NUMERIC columns arrive as strings and stay strings.
 * The tables named in Knex's `Tables` below are typed wherever `db('name')` is written: users and
 * sessions, projects and their design, the audit log and every code table.
 */
import type { Knex } from 'knex';
import type {
  Amendment,
  CodeFamily,
  EditionId,
  EditionRules,
  EqualRow,
  LpdFormula,
  RequirementCode,
  SpaceType,
  StrategyKey,
} from '../compliance/edition-data.js';
import type { AdditionalAllowanceKind } from '../../../contract/editions.js';
import type { FieldTestSummary } from '../../../contract/field-tests.js';
import type { ProjectState } from '../../../contract/review.js';
import type { ExteriorApplicationInput, LuminaireTypeInput, SpaceInput } from '../design/design.schema.js';
import type { ResultSummary } from '../projects/projects.repository.js';
import type { UnitOrigin } from './unit-origin.js';

export type ProjectRole = 'engineer' | 'reviewer' | 'contractor';
export const projectRoles: readonly ProjectRole[] = ['engineer', 'reviewer', 'contractor'];

export interface UserRow {
  id: string;
  email: string;
  name: string;
  password_hash: string;
  is_admin: boolean;
  created_at: Date;
  /** Set while an administrator has the account disabled. */
  disabled_at: Date | null;
  /** The person chose the daily digest of projects waiting for their review. */
  review_digest: boolean;
}

export interface SessionRow {
  id: string;
  user_id: string;
  created_at: Date;
  last_seen_at: Date;
  expires_at: Date;
  revoked_at: Date | null;
  user_agent: string | null;
  /** PostgreSQL `inet`, which pg returns as text. */
  address: string | null;
}

export interface ProjectRow {
  id: string;
  name: string;
  state: ProjectState;
  version: number;
  /** Starts at 1; reopening an accepted or issued design starts the next. */
  revision: number;
  created_by: string | null;
  created_at: Date;
  updated_at: Date;
  updated_by: string | null;
  address: string | null;
  latitude: string | null;
  longitude: string | null;
  time_zone: string | null;
  jurisdiction: string | null;
  edition_id: string | null;
  method: string | null;
  units: 'ip' | 'si';
  lighting_zone: number | null;
  /** The jurisdiction amendments the project follows over the model code. */
  amendments: string[];
  result_summary: ResultSummary | null;
  field_test_summary: FieldTestSummary | null;
  archived_at: Date | null;
  archived_by: string | null;
  permit_number: string | null;
  owner_name: string | null;
  occupancy: string | null;
  scope: string | null;
  designer_name: string | null;
  designer_firm: string | null;
  designer_licence: string | null;
  contractor_name: string | null;
  contractor_firm: string | null;
  contractor_licence: string | null;
  contractor_contact: string | null;
  gross_floor_area: string | null;
  unit_origin: UnitOrigin | null;
}

export interface ProjectMemberRow {
  project_id: string;
  user_id: string;
  role: ProjectRole;
  added_at: Date;
}

/** An invitation to a project's team; only the SHA-256 of its token is kept. */
export interface InvitationRow {
  id: string;
  project_id: string;
  email: string;
  role: ProjectRole;
  token_hash: string;
  invited_by: string | null;
  created_at: Date;
  expires_at: Date;
  accepted_at: Date | null;
  accepted_user_id: string | null;
  withdrawn_at: Date | null;
  withdrawn_by: string | null;
}

export interface AuditLogRow {
  id: string;
  at: Date;
  user_id: string | null;
  project_id: string | null;
  action: string;
  entity: string;
  entity_id: string | null;
  detail: unknown;
}

// ---------------------------------------------------------------- code tables (written by the seeds, read-only to the service)

export interface CodeEditionRow {
  id: EditionId;
  family: CodeFamily;
  title: string;
  publisher: string;
  year: number;
  methods: string[];
  current_data_version: string;
}

export interface CodeEditionVersionRow {
  edition_id: string;
  data_version: string;
  loaded_at: Date;
}

/** Every code-table row is one data version of one edition. */
interface VersionedCodeRow {
  edition_id: string;
  data_version: string;
}

/** Where a code-table row came from; `from_memory` says what was recalled rather than read. */
export interface ProvenanceColumns {
  source: string;
  confidence: string;
  verified: boolean;
  note: string;
  from_memory: string | null;
}

/** A provenance kept as JSON beside the value it is for (edition rules), with its tag. */
export interface TaggedProvenance {
  source: string;
  confidence: string;
  verified: boolean;
  note: string;
  fromMemory?: string;
  tag?: string;
}

export interface BuildingAreaTypeRow extends VersionedCodeRow, ProvenanceColumns {
  key: string;
  position: number;
  label: string;
  source_label: string;
  lpd_w_per_ft2: string;
  equals_row_of: EqualRow | null;
}

export interface SpaceTypeRow extends VersionedCodeRow, ProvenanceColumns {
  key: string;
  position: number;
  label: string;
  source_label: string;
  category: string;
  lpd_w_per_ft2: string;
  lpd_formula: LpdFormula | null;
  rcr_threshold: string | null;
  rcr_condition: string | null;
  equals_row_of: EqualRow | null;
  iecc_occupant_sensor_listed: boolean | null;
  iecc_occupant_sensor_list_item: string | null;
  iecc_full_auto_on_allowed: boolean | null;
  iecc_full_auto_on_item: string | null;
  iecc_sensor_function: NonNullable<SpaceType['iecc']>['sensorFunction'] | null;
  iecc_light_reduction_exempt_item: string | null;
  iecc_time_switch_exempt_item: string | null;
  iecc_sleeping_unit: boolean | null;
  iecc_inputs_tag: '[S-ed]' | null;
  iecc_note: string | null;
}

export interface ControlStrategyRow {
  key: StrategyKey;
  label: string;
  position: number;
}

export interface SpaceTypeControlRow extends VersionedCodeRow, ProvenanceColumns {
  space_type_key: string;
  strategy_key: StrategyKey;
  requirement: RequirementCode;
}

export interface ControlStrategySectionRow extends VersionedCodeRow, ProvenanceColumns {
  strategy_key: StrategyKey;
  section: string;
  tag: string;
}

export interface ControlStrategyParameterRow extends VersionedCodeRow {
  strategy_key: StrategyKey;
  name: string;
  position: number;
  value: string;
  tag: string;
  source: string;
  note: string | null;
}

export interface CodeExteriorApplicationRow extends VersionedCodeRow, ProvenanceColumns {
  key: string;
  position: number;
  label: string;
  source_label: string;
  unit: string;
  source_unit: string;
  tradable: boolean;
  is_base_site_allowance: boolean;
  lz0: string;
  lz1: string;
  lz2: string;
  lz3: string;
  lz4: string;
  unverified_zones: string[];
  controls: Partial<Record<StrategyKey, RequirementCode>>;
  source_control_flags: Record<string, string>;
}

export interface LightingZoneRow extends VersionedCodeRow, ProvenanceColumns {
  zone: number;
  description: string;
  source_label: string;
}

export interface AdditionalAllowanceRow extends VersionedCodeRow, ProvenanceColumns {
  key: string;
  position: number;
  label: string;
  source_label: string;
  kind: AdditionalAllowanceKind;
  lpd_w_per_ft2: string;
  fixed_w: string | null;
  /** The allowance's own section where it differs from the edition's additional-allowance section. */
  section: string | null;
}

export interface EditionRulesRow extends VersionedCodeRow {
  daylight_primary_sidelit_threshold_w: string;
  daylight_combined_sidelit_threshold_w: string | null;
  daylight_toplit_threshold_w: string;
  daylight_comparison: EditionRules['daylight']['comparison'];
  daylight_minimum_window_area_ft2: string | null;
  daylight_side_extension_kind: EditionRules['daylight']['sideExtension']['kind'];
  daylight_side_extension_value: string;
  daylight_primary_depth_head_heights: string;
  daylight_secondary_depth_head_heights: string;
  daylight_toplit_extension_ceiling_heights: string;
  daylight_overlap_precedence: NonNullable<EditionRules['daylight']['overlapPrecedence']> | null;
  /** The opening rules (visible transmittance, blocked daylight, glazing minimums), each with its section and provenance. */
  daylight_openings: Record<string, { section: string; provenance: TaggedProvenance } & Record<string, unknown>> | null;
  daylight_provenance: TaggedProvenance;
  room_geometry_increase_percent: string | null;
  room_geometry_provenance: TaggedProvenance | null;
  small_enclosed_space_ft2: string | null;
  small_enclosed_space_provenance: TaggedProvenance | null;
  track_minimum_w_per_ft: string;
  track_provenance: TaggedProvenance;
  base_site_covers_nontradable: boolean;
  base_site_provenance: TaggedProvenance;
}

export interface EditionSectionRow extends VersionedCodeRow {
  key: string;
  section: string;
  tag: string;
  verified: boolean;
  note: string;
}

export interface EditionAmendmentRow extends VersionedCodeRow {
  key: string;
  position: number;
  title: string;
  jurisdiction: string;
  parameters: Amendment['parameters'];
  source: string;
  confidence: string;
  verified: boolean;
  note: string;
}

// ---------------------------------------------------------------- a project's design

/** The columns every design row that is edited on its own carries, for optimistic locking and "changed by". */
interface DesignStamp {
  id: string;
  project_id: string;
  version: number;
  created_at: Date;
  updated_at: Date;
  updated_by: string | null;
  /** The values before the last change of units (see `db/unit-origin.ts`). */
  unit_origin: UnitOrigin | null;
}

export interface LuminaireTypeRow extends DesignStamp {
  tag: string;
  description: string;
  input_watts: string;
  use: LuminaireTypeInput['use'];
  exempt_reason: string | null;
  basis: LuminaireTypeInput['basis'];
  length: string | null;
  limit_watts: string | null;
  wattage_source: string | null;
  manufacturer: string | null;
  catalog_number: string | null;
  light_source: string | null;
  driver: string | null;
  voltage: string | null;
}

export interface SpaceRow extends DesignStamp {
  position: number;
  name: string;
  level: string;
  space_type: string | null;
  building_area_type: string | null;
  control_space_type: string | null;
  area: string;
  ceiling_height: string | null;
  length: string | null;
  width: string | null;
  luminaire_height: string | null;
  work_plane_height: string | null;
  enclosed: boolean | null;
  rooms: number | null;
  unlit: boolean | null;
}

export interface SpaceLuminaireRow {
  space_id: string;
  position: number;
  luminaire_type_id: string;
  count: number;
  zone: SpaceInput['luminaires'][number]['zone'] | null;
}

export interface SpaceControlRow {
  space_id: string;
  strategy: string;
  provided: boolean;
  timeout_minutes: string | null;
  zone_size: string | null;
  reduction_percent: string | null;
  auto_on: SpaceInput['controls'][number]['autoOn'] | null;
  device: string | null;
  exception_reason: SpaceInput['controls'][number]['exceptionReason'] | null;
  exception_note: string | null;
  unit_origin: UnitOrigin | null;
}

export interface SpaceWindowRow {
  space_id: string;
  position: number;
  width: string;
  head_height: string;
  sill_height: string | null;
  wall: SpaceInput['windows'][number]['wall'] | null;
  offset: string | null;
  visible_transmittance: string | null;
  daylight_blocked: boolean | null;
  unit_origin: UnitOrigin | null;
}

export interface SpaceSkylightRow {
  space_id: string;
  position: number;
  length: string;
  width: string;
  x: string | null;
  y: string | null;
  visible_transmittance: string | null;
  daylight_blocked: boolean | null;
  unit_origin: UnitOrigin | null;
}

export interface ExteriorApplicationRow extends DesignStamp {
  position: number;
  application_key: string;
  description: string;
  quantity: string;
  installed_watts: string;
  exempt_watts: string | null;
  exempt_reason: ExteriorApplicationInput['exemptReason'] | null;
  exempt_note: string | null;
  controls: ExteriorApplicationInput['controls'];
}

export interface RetailDisplayClaimRow extends DesignStamp {
  space_id: string;
  allowance_key: string;
  area: string;
  /** Set while a deleted claim waits out its restore days. */
  deleted_at: Date | null;
}

export interface ImportAliasRow {
  project_id: string;
  name_key: string;
  name: string;
  space_type: string | null;
  building_area_type: string | null;
  updated_by: string | null;
  updated_at: Date;
}

export interface IdempotencyKeyRow {
  project_id: string;
  user_id: string;
  key: string;
  request_hash: string;
  space_ids: string[];
  created_at: Date;
}

/** One file of a submittal package as kept in the file store. */
export interface PackageFileRecord {
  format: 'docx' | 'xlsx' | 'pdf';
  key: string;
  size: number;
  sha256: string;
}

/** A submittal package revision: written once, never updated (a trigger refuses it). */
export interface PackageRevisionRow {
  id: string;
  project_id: string;
  number: number;
  draft: boolean;
  project_name: string;
  design_revision: number;
  fingerprint: string;
  document: unknown;
  result: unknown;
  files: PackageFileRecord[];
  made_by: string | null;
  made_at: Date;
}

/** The cut sheet on file for a luminaire type: a PDF in the file store under a key the service made. */
export interface LuminaireCutSheetRow {
  luminaire_type_id: string;
  project_id: string;
  storage_key: string;
  size: number;
  sha256: string;
  /** As uploaded, cleaned and at most 200 characters; only ever shown, never used as a key. */
  file_name: string;
  uploaded_by: string | null;
  uploaded_at: Date;
}

/** A background job making a large project's package (pg-boss carries it; this row is what the route answers). */
export interface PackageJobRow {
  id: string;
  project_id: string;
  state: 'queued' | 'running' | 'done' | 'failed';
  step: 'evaluate' | 'docx' | 'xlsx' | 'pdf' | 'store' | null;
  progress: number;
  revision_id: string | null;
  /** Why it failed, in words for people. */
  error: string | null;
  requested_by: string | null;
  requested_at: Date;
  finished_at: Date | null;
}

/** One test of a functional test plan item, kept with every retest (the latest counts); never updated. */
export interface FieldTestResultRow {
  id: string;
  project_id: string;
  /** The plan item's stable key. */
  item_id: string;
  result: 'pass' | 'fail';
  timeout_minutes: string | null;
  light_level: string | null;
  override_minutes: string | null;
  /** The project's units when recorded: the light level is foot-candles ('ip') or lux ('si'). */
  light_unit: 'ip' | 'si';
  notes: string | null;
  recorded_by: string | null;
  recorded_at: Date;
}

/** The exterior schedule a project saved (one row per project; none: the defaults). */
export interface ExteriorScheduleSettingsRow {
  project_id: string;
  /** `scheduleSettingsSchema`'s output, checked again when read. */
  settings: unknown;
  version: number;
  updated_by: string | null;
  updated_at: Date;
}

/** A photo of a plan item: the original and its two copies in the file store, under keys the service made. */
export interface FieldTestPhotoRow {
  id: string;
  project_id: string;
  item_id: string;
  /** The item's latest test when the photo was added, if it had one. */
  result_id: string | null;
  caption: string | null;
  content_type: 'image/jpeg' | 'image/png';
  size_bytes: number;
  sha256: string;
  /** The display copy's size in pixels. */
  width: number;
  height: number;
  original_key: string;
  display_key: string;
  thumb_key: string;
  added_by: string | null;
  added_at: Date;
}

/**
 * How a project or design row is written: NUMERIC columns as decimal text (as they are read), JSON
 * columns as JSON text, and any column may be left out for its default or be a database expression.
 */
type Written<Row, Json extends keyof Row> = Partial<{
  [Column in keyof Row]: (Column extends Json ? string | null : Row[Column]) | Knex.Raw;
}>;
type StoredTable<Row, Json extends keyof Row = never> = Knex.CompositeTableType<Row, Written<Row, Json>>;

/**
 * How the seeds write a code-table row: JSON columns as JSON text, and columns the service reads as
 * narrower types (a strategy key, a requirement) as the reference files' text, which the reference
 * data's own checks vouch for. Reads get the row itself.
 */
type SeedWritten<Row, AsText extends keyof Row> = Partial<Omit<Row, AsText> & { [Column in AsText]: string | Extract<Row[Column], null> }>;
type CodeTable<Row, AsText extends keyof Row = never> = Knex.CompositeTableType<Row, SeedWritten<Row, AsText>>;

declare module 'knex/types/tables.js' {
  /** The tables `db('name')` knows the rows of: its reads return them, its writes are checked against them. */
  interface Tables {
    users: UserRow;
    sessions: SessionRow;
    projects: StoredTable<ProjectRow, 'result_summary' | 'field_test_summary' | 'unit_origin'>;
    luminaire_types: StoredTable<LuminaireTypeRow, 'unit_origin'>;
    spaces: StoredTable<SpaceRow, 'unit_origin'>;
    space_luminaires: StoredTable<SpaceLuminaireRow>;
    space_controls: StoredTable<SpaceControlRow, 'unit_origin'>;
    space_windows: StoredTable<SpaceWindowRow, 'unit_origin'>;
    space_skylights: StoredTable<SpaceSkylightRow, 'unit_origin'>;
    exterior_applications: StoredTable<ExteriorApplicationRow, 'controls' | 'unit_origin'>;
    retail_display_claims: StoredTable<RetailDisplayClaimRow, 'unit_origin'>;
    project_import_aliases: ImportAliasRow;
    idempotency_keys: IdempotencyKeyRow;
    project_members: ProjectMemberRow;
    package_revisions: StoredTable<PackageRevisionRow, 'document' | 'result' | 'files'>;
    field_test_results: StoredTable<FieldTestResultRow>;
    luminaire_cut_sheets: StoredTable<LuminaireCutSheetRow>;
    exterior_schedule_settings: StoredTable<ExteriorScheduleSettingsRow, 'settings'>;
    package_jobs: StoredTable<PackageJobRow>;
    field_test_photos: StoredTable<FieldTestPhotoRow>;
    audit_log: AuditLogRow;
    invitations: InvitationRow;
    code_editions: CodeTable<CodeEditionRow>;
    code_edition_versions: CodeTable<CodeEditionVersionRow>;
    building_area_types: CodeTable<BuildingAreaTypeRow, 'equals_row_of'>;
    space_types: CodeTable<SpaceTypeRow, 'equals_row_of' | 'lpd_formula' | 'iecc_sensor_function' | 'iecc_inputs_tag'>;
    control_strategies: CodeTable<ControlStrategyRow, 'key'>;
    space_type_controls: CodeTable<SpaceTypeControlRow, 'strategy_key' | 'requirement'>;
    control_strategy_sections: CodeTable<ControlStrategySectionRow, 'strategy_key'>;
    control_strategy_parameters: CodeTable<ControlStrategyParameterRow, 'strategy_key'>;
    code_exterior_applications: CodeTable<CodeExteriorApplicationRow, 'controls' | 'source_control_flags'>;
    lighting_zones: CodeTable<LightingZoneRow>;
    additional_allowances: CodeTable<AdditionalAllowanceRow, 'kind'>;
    edition_rules: CodeTable<
      EditionRulesRow,
      | 'daylight_comparison'
      | 'daylight_side_extension_kind'
      | 'daylight_provenance'
      | 'daylight_openings'
      | 'room_geometry_provenance'
      | 'small_enclosed_space_provenance'
      | 'track_provenance'
      | 'base_site_provenance'
    >;
    edition_sections: CodeTable<EditionSectionRow>;
    edition_amendments: CodeTable<EditionAmendmentRow, 'parameters'>;
  }
}
