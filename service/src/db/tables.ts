/**
 * Row shapes as the repositories read them. NUMERIC columns arrive as strings and stay strings.
 * The tables named in Knex's `Tables` below are typed wherever `db('name')` is written; the
 * project's own and its design's tables are not named yet, and read as the rows their
 * repositories declare.
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
  state: string;
  version: number;
  created_by: string | null;
  created_at: Date;
  updated_at: Date;
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
    project_members: ProjectMemberRow;
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
