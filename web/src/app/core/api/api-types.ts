/**
 * The service's wire types, as the web app reads them. Every number the calculation touches is an
 * exact decimal string; the app formats for display and never does arithmetic on floats it sends back.
 */

import type {
  AdditionalAllowanceKind,
  ComplianceMethod,
  EditionId,
  ExteriorExemptionReason,
  LuminaireUse,
  RequirementCode,
  UnitSystem,
  ZoneKind as DaylightZoneKind,
} from '../../../../../contract/editions';
import type { Citation, ControlStatus, Verdict } from '../../../../../contract/result';
import type { ExteriorScheduleSettings, ScheduleSummary } from '../../../../../contract/exterior-schedule';
import type { ReviewHistoryDetail } from '../../../../../contract/review';
import type { FieldTestSummary } from '../../../../../contract/field-tests';

export type {
  AdditionalAllowanceKind,
  ComplianceMethod,
  EditionId,
  ExteriorExemptionReason,
  LuminaireUse,
  RequirementCode,
  UnitSystem,
  ZoneKind as DaylightZoneKind,
} from '../../../../../contract/editions';
export type ProjectRole = 'engineer' | 'reviewer' | 'contractor';
export type ProjectState = 'draft' | 'in-review' | 'returned' | 'accepted' | 'issued';
export type WattageBasis = 'rated' | 'line-voltage-track' | 'low-voltage-track' | 'current-limited';
export type Wall = 'north' | 'east' | 'south' | 'west';
export type ControlExceptionReason =
  | 'security-or-emergency-continuous'
  | 'exit-stairway-ramp-passageway'
  | 'egress-normally-off'
  /** The time switch only: lighting intended for continuous operation. */
  | 'continuous-operation'
  /** For a requirement to verify: the engineer checked the adopted code and it does not apply here (the note says where). */
  | 'verified-not-required'
  | 'other';

/** Written with every design record; send `version` back on update, get 409 if someone else wrote first. */
export interface Stamp {
  version: number;
  updatedAt: string;
  updatedBy: string | null;
}

export interface ProjectSummary {
  id: string;
  name: string;
  state: ProjectState;
  role: ProjectRole | null;
  edition: EditionId | null;
  method: ComplianceMethod | null;
  version: number;
  /** The design revision: 1 at first, one more each time an accepted or issued design is reopened. */
  revision: number;
  updatedAt: string;
  /** The last evaluation's verdict; null until the project is evaluated after its latest change. */
  resultSummary: { complies: boolean; verdict?: Verdict; marginPct: string | null; dataVersion: string } | null;
  /** Where the field tests stand, as the test plan was last read; null before any test is recorded or after a design change. */
  fieldTests: FieldTestSummary | null;
  /** When the project was archived: it can be read but not changed until it is unarchived. */
  archivedAt: string | null;
}

export interface ProjectMember {
  userId: string;
  name: string;
  email: string;
  role: ProjectRole;
}

export type ProjectScope = 'new-building' | 'addition' | 'alteration' | 'tenant-improvement';

/** What a permit office asks for beside the design; null where not entered. */
export interface PermitFields {
  permitNumber: string | null;
  owner: string | null;
  occupancy: string | null;
  scope: ProjectScope | null;
  /** Gross floor area of the building, ft² or m² as the project's units say. */
  grossFloorArea: string | null;
  designerName: string | null;
  designerFirm: string | null;
  designerLicence: string | null;
  contractorName: string | null;
  contractorFirm: string | null;
  contractorLicence: string | null;
  contractorContact: string | null;
}

export interface ProjectDetail extends ProjectSummary, PermitFields {
  address: string | null;
  latitude: string | null;
  longitude: string | null;
  timeZone: string | null;
  jurisdiction: string | null;
  units: UnitSystem;
  lightingZone: number | null;
  /** Keys of the edition's jurisdiction amendments the project follows; none: the model code alone. */
  amendments: string[];
  updatedBy: string | null;
  members: ProjectMember[];
}

export interface ProjectSetup {
  name: string;
  address?: string | null;
  latitude?: string | null;
  longitude?: string | null;
  timeZone?: string | null;
  jurisdiction?: string | null;
  edition: EditionId;
  method: ComplianceMethod;
  units: UnitSystem;
  lightingZone?: number | null;
  amendments?: string[];
}

/** A set-up write may carry any of the permit fields as well. */
export type ProjectSetupWrite = ProjectSetup & Partial<PermitFields>;

export interface LuminaireTypeInput {
  tag: string;
  description: string;
  inputWatts: string;
  use: LuminaireUse;
  exemptReason?: string;
  basis: WattageBasis;
  length?: string;
  limitWatts?: string;
  wattageSource?: string;
  /** Catalogue fields: kept with the type and printed in the package, not used by the calculation. */
  manufacturer?: string;
  catalogNumber?: string;
  lightSource?: string;
  driver?: string;
  voltage?: string;
}

export interface LuminaireTypeRecord extends LuminaireTypeInput, Stamp {
  id: string;
}

export interface LuminaireGroup {
  tag: string;
  count: string;
  zone?: DaylightZoneKind;
}

export interface ProvidedControl {
  strategy: string;
  provided: boolean;
  timeoutMinutes?: string;
  zoneSize?: string;
  /** How far the control reduces the lighting power when it acts (partial OFF, light reduction), %. */
  reductionPercent?: string;
  autoOn?: 'manual' | 'partial' | 'full';
  device?: string;
  exceptionReason?: ControlExceptionReason;
  exceptionNote?: string;
}

export interface WindowOpening {
  width: string;
  headHeight: string;
  sillHeight?: string;
  wall: Wall;
  offset?: string;
  /** 0 to 1; absent: not recorded. */
  visibleTransmittance?: string;
  /** An adjacent structure blocks the window's daylight; absent: not recorded. */
  daylightBlocked?: boolean;
}

export interface Skylight {
  length: string;
  width: string;
  x?: string;
  y?: string;
  visibleTransmittance?: string;
  /** Nearby structures or natural objects block its direct sunlight; absent: not recorded. */
  daylightBlocked?: boolean;
}

export interface SpaceInput {
  name: string;
  level?: string;
  spaceType?: string;
  buildingAreaType?: string;
  controlSpaceType?: string;
  area: string;
  ceilingHeight?: string;
  length?: string;
  width?: string;
  luminaireHeight?: string;
  workPlaneHeight?: string;
  enclosed?: boolean;
  /** How many like rooms this entry stands for (1 when absent); a size in the space type's name applies to each. */
  rooms?: string;
  /** The engineer confirms the space has no lighting; until then a space without luminaires holds the verdict back. */
  unlit?: boolean;
  luminaires: LuminaireGroup[];
  controls: ProvidedControl[];
  windows: WindowOpening[];
  skylights: Skylight[];
}

export interface SpaceRecord extends SpaceInput, Stamp {
  id: string;
  position: number;
  luminaires: (LuminaireGroup & { luminaireTypeId: string })[];
}

export interface ExteriorApplicationInput {
  key: string;
  description: string;
  quantity: string;
  installedWatts: string;
  /** The part of installedWatts exempt from the allowance, with the reason from the edition's list and a note. */
  exemptWatts?: string;
  exemptReason?: ExteriorExemptionReason;
  exemptNote?: string;
  controls: ProvidedControl[];
}

export interface ExteriorApplicationRecord extends ExteriorApplicationInput, Stamp {
  id: string;
}

// ---------------------------------------------------------------- history

export type DesignHistoryAction = 'create' | 'import' | 'update' | 'delete' | 'restore';
export type CutSheetHistoryAction = 'attach-cut-sheet' | 'remove-cut-sheet';
export interface CutSheetHistoryDetail {
  fileName: string;
  size: number;
  sha256: string;
}
export type ProjectHistoryAction = 'create' | 'copy' | 'update' | 'convert-units' | 'archive' | 'unarchive' | 'transition';
export type ClaimHistoryAction = 'create' | 'update' | 'delete' | 'restore';
export type TeamHistoryAction = 'add-member' | 'change-role' | 'remove-member' | 'add-member-no-account';
/** A reviewer's verdict on a check item, a reply in its thread, a bulk confirmation. */
export type ReviewHistoryAction = 'verdict' | 'reply' | 'bulk-confirm';
/** A functional test recorded on a plan item: its first test, or a retest. */
export type FieldTestHistoryAction = 'record' | 'retest';

/** What a recorded functional test carries into the history (the service's audit detail). */
export interface FieldTestHistoryDetail {
  result: 'pass' | 'fail';
  measured?: { timeoutMinutes?: string; lightLevel?: string; overrideMinutes?: string };
  /** The light level's unit: foot-candles or lux, from the project's units when recorded. */
  lightLevelUnit?: 'fc' | 'lux';
  notes?: string;
  retest: boolean;
  role?: ProjectRole | null;
}
export type InvitationHistoryAction = 'invite' | 'withdraw-invitation' | 'accept-invitation';

/** The set-up as the history keeps it before and after a change of the project (entries from before the permit fields lack them). */
export interface SetupSnapshot extends Partial<PermitFields> {
  name: string;
  address: string | null;
  latitude: string | null;
  longitude: string | null;
  timeZone: string | null;
  jurisdiction: string | null;
  edition: EditionId | null;
  method: ComplianceMethod | null;
  units: UnitSystem;
  lightingZone: number | null;
  /** Absent from entries written before the set-up kept them. */
  amendments?: string[];
  version: number;
}

/** A change of units: the units, and how many stored rows of each table were converted. */
export interface UnitConversion {
  from: UnitSystem;
  to: UnitSystem;
  rows: Record<string, number>;
}

interface HistoryEntryBase {
  id: string;
  at: string;
  /** Null when the person's account no longer exists. */
  user: { id: string; name: string } | null;
  entityId: string | null;
  /** What a person calls the thing changed: a space's name, a type's tag, an e-mail. */
  name: string | null;
  /** A deleted design item that the restore route can still bring back. */
  restorable: boolean;
}

export type HistoryEntry = HistoryEntryBase &
  (
    | { entity: 'space'; action: DesignHistoryAction; before: SpaceRecord | null; after: SpaceRecord | null }
    | { entity: 'luminaire-type'; action: DesignHistoryAction; before: LuminaireTypeRecord | null; after: LuminaireTypeRecord | null }
    | {
        entity: 'luminaire-type';
        action: CutSheetHistoryAction;
        before: null;
        after: null;
        /** The cut sheet attached or removed, and on a replacement the one it replaced; `name` is the type's tag. */
        cutSheet?: CutSheetHistoryDetail;
        replaced?: CutSheetHistoryDetail;
      }
    | {
        entity: 'exterior-application';
        action: DesignHistoryAction;
        before: ExteriorApplicationRecord | null;
        after: ExteriorApplicationRecord | null;
      }
    | {
        entity: 'project';
        action: ProjectHistoryAction;
        before: SetupSnapshot | null;
        after: SetupSnapshot | null;
        conversion?: UnitConversion;
        copiedFrom?: { id: string; name: string };
        /** On a move of the review state. */
        transition?: { from: ProjectState; to: ProjectState; revision: number; words: string; comment?: string };
      }
    | { entity: 'additional-allowance'; action: ClaimHistoryAction; before: AllowanceClaim | null; after: AllowanceClaim | null }
    | { entity: 'project_member'; action: TeamHistoryAction; before: { role: ProjectRole } | null; after: { role: ProjectRole } | null }
    | {
        entity: 'review-item';
        action: ReviewHistoryAction;
        before: null;
        after: null;
        /** The verdict and comment, the reply, or what a bulk confirmation confirmed; `name` is the item's title. */
        review?: ReviewHistoryDetail;
      }
    | {
        /** `name` is the address invited. */
        entity: 'invitation';
        action: InvitationHistoryAction;
        before: { role: ProjectRole } | null;
        after: { role: ProjectRole; expiresAt?: string } | null;
      }
    | {
        /** `name` is the test item's title, e.g. “Occupant sensor in 201 Makerspace”. */
        entity: 'field-test';
        action: FieldTestHistoryAction;
        before: null;
        after: null;
        fieldTest?: FieldTestHistoryDetail;
      }
    | {
        /** The project's exterior schedule saved: the settings before (the defaults the first time) and after. */
        entity: 'exterior-schedule';
        action: 'create' | 'update';
        before: ExteriorScheduleSettings | null;
        after: ExteriorScheduleSettings | null;
      }
    | {
        entity: 'package';
        action: 'create';
        before: null;
        after: null;
        /** The submittal package made: its revision number, whether a draft, and its fingerprint. */
        package?: { revision: number; draft: boolean; fingerprint: string };
      }
  );

export interface HistoryPage {
  /** Newest first. */
  entries: HistoryEntry[];
  /** Older entries exist: ask again with `before` set to the last entry's id. */
  more: boolean;
  /** Everyone who appears in the project's history, for the filter. */
  people: { id: string; name: string }[];
}

export interface HistoryQuery {
  spaceId?: string;
  userId?: string;
  /** A date, YYYY-MM-DD: entries from its start on. */
  since?: string;
  before?: string;
  limit?: number;
}

// ---------------------------------------------------------------- code tables

export interface EditionSummary {
  id: EditionId;
  title: string;
  publisher: string;
  year: number;
  dataVersion: string;
  methods: ComplianceMethod[];
}

/** The maintainers' provenance of a row (not for screens) and its citation (for screens). */
export interface RowProvenance {
  source: string;
  confidence: string;
  verified: boolean;
  note?: string | null;
  citation: Citation;
}

export interface BuildingAreaTypeView extends RowProvenance {
  key: string;
  label: string;
  sourceLabel: string;
  lpdWPerFt2: string;
}

/** The height range (ft) a formula row is for; a bound left out is open. */
export interface HeightRangeFt {
  above?: string;
  atLeast?: string;
  below?: string;
  atMost?: string;
}

/** An allowance that depends on the space's height (the atrium rows of 90.1-2013/2016 and IECC 2018). */
export type LpdFormula =
  | { kind: 'per-foot-of-height'; wPerFt2PerFt: string; heightFt: HeightRangeFt }
  | { kind: 'base-plus-per-foot-of-height'; baseWPerFt2: string; wPerFt2PerFt: string; heightFt: HeightRangeFt };

export interface SpaceTypeView extends RowProvenance {
  key: string;
  label: string;
  sourceLabel: string;
  category: string;
  /** For a formula row only the formula's first term: read `lpdFormula` instead. */
  lpdWPerFt2: string;
  lpdFormula?: LpdFormula;
  rcrThreshold: string | null;
  controls: Record<string, RequirementCode>;
}

export interface ControlStrategyView extends RowProvenance {
  key: string;
  label: string;
  section: string;
  parameters: Record<string, string | undefined>;
}

export interface ExteriorApplicationView extends RowProvenance {
  key: string;
  label: string;
  sourceLabel: string;
  unit: string;
  tradable: boolean;
  isBaseSiteAllowance: boolean;
  allowanceByZone: Record<string, string>;
}

/** One of the edition's additional allowances (retail display categories), in W/ft² of the area claimed. */
export interface AdditionalAllowanceView extends RowProvenance {
  key: string;
  label: string;
  sourceLabel: string;
  kind: AdditionalAllowanceKind;
  /** The section stating this allowance where it is not the edition's section for additional allowances (decorative: item (a)). */
  section: string | null;
  lpdWPerFt2: string;
  /** Added once per building where the edition states one (90.1-2022: 750 W). */
  fixedW: string | null;
}

/** A jurisdiction's amendment of an edition: its values replace the model code's for a project that chooses it. */
export interface AmendmentView extends RowProvenance {
  key: string;
  title: string;
  jurisdiction: string;
}

export interface LightingZoneView extends RowProvenance {
  key: string;
  zone: number;
  label: string;
  description: string;
  sourceLabel: string;
}

// ---------------------------------------------------------------- evaluation result
// One schema, in the contract the service reads too: the types cannot drift from what is served.

export type * from '../../../../../contract/result';

/** Where a control is required (one of a set of alternatives counts), not required, or to verify. */
export type RequirementKind = 'required' | 'not-required' | 'to-verify';

/** A space's (or exterior application's) controls whose requirement under an edition differs from the project's own. */
export interface ControlChange {
  place: string;
  exterior: boolean;
  changes: { control: string; requirement: RequirementKind; before: RequirementKind; status: ControlStatus; section: string }[];
}

/** What a comparison shows of one edition's evaluation; watts W, area and densities in the project's units. */
export interface ComparisonSummary {
  verdict: Verdict;
  units: UnitSystem;
  area: string;
  allowanceW: string;
  installedW: string;
  marginW: string;
  marginPct: string | null;
  allowanceLpd: string | null;
  installedLpd: string | null;
  interiorComplies: boolean;
  exterior: { allowanceW: string; installedW: string; marginW: string; complies: boolean } | null;
  controls: { met: number; notMet: number; toVerify: number };
  open: { space: string; control: string; status: ControlStatus; section: string }[];
  unverifiedValues: number;
}

/** The design under one edition: each space type mapped to that edition's row, or listed where none matches. */
export interface EditionComparison {
  edition: string;
  title: string;
  status: 'evaluated' | 'not-mapped' | 'not-valid';
  unmapped: { what: 'space' | 'exterior application'; name: string; type: string }[];
  remapped: { space: string; from: string; to: string }[];
  controlsNotCarried: string[];
  controlChanges: ControlChange[];
  problems: { path: string; message: string }[];
  result: ComparisonSummary | null;
}

/** `GET /api/projects/:id/comparison`. */
export interface ProjectComparison {
  current: EditionComparison;
  editions: EditionComparison[];
  cautions: string[];
}

/** A sales-floor space's claim on one of the edition's additional allowances. */
export interface AllowanceClaim extends Stamp {
  id: string;
  spaceId: string;
  allowance: string;
  /** ft² or m² as the project's units say; at most the space's area. */
  area: string;
}

/** A name a spreadsheet used for a type, and the type the engineer matched it to (remembered per project). */
export interface ImportAlias {
  name: string;
  spaceType: string | null;
  buildingAreaType: string | null;
}

/** The astronomical schedule's day, settings and year, as contract/exterior-schedule.ts has them; the summary adds the year asked for. */
export type {
  ApplicationEnergy as ExteriorApplicationEnergy,
  ExteriorScheduleSettings,
  ScheduleCheck,
  ScheduleCheckStatus,
  ScheduleDay as ExteriorScheduleDay,
  SetbackRule,
  StoredExteriorSchedule,
  SunPattern,
} from '../../../../../contract/exterior-schedule';
export type ExteriorScheduleSummary = ScheduleSummary & { year: number };
