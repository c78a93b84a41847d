import type { Citation } from './citation.js';
import type { EditionId, RequirementCode, StrategyKey } from './edition-data.js';
import type { ZoneKind } from './geometry.js';
import type { UnitSystem } from './units.js';

/**
 * What an evaluation returns. Every number is an exact decimal string; watts are W, areas and
 * lengths are in the document's units (ft²/ft or m²/m), power densities W/ft² or W/m². Round only
 * for display, with the format helpers.
 */

export type ControlStatus = 'met' | 'not-met' | 'exception-claimed' | 'to-verify' | 'not-required';

export interface ControlLine {
  /** The strategy, or 'control-space-type' where the space type that sets the controls is missing. */
  strategy: StrategyKey | 'control-space-type';
  label: string;
  requirement: RequirementCode;
  met: boolean | null;
  status: ControlStatus;
  /** Why it is required (space type, area, watts) and what the engineer recorded as provided. */
  reason: string;
  section: string;
  verified: boolean;
}

export interface ZoneRectangleResult {
  kind: ZoneKind;
  source: string;
  x: string;
  y: string;
  /** Extent along x (the room length). */
  length: string;
  /** Extent along y (the room width). */
  width: string;
}

export interface DaylightResult {
  /** false where the room has no rectangle (length × width) to build zones on. */
  geometryEvaluated: boolean;
  windowArea: string;
  primarySidelitArea: string;
  secondarySidelitArea: string;
  toplitArea: string;
  primarySidelitW: string;
  secondarySidelitW: string;
  toplitW: string;
  sidelightingControlRequired: boolean;
  secondarySidelightingControlRequired: boolean;
  toplightingControlRequired: boolean;
  reasons: string[];
  /** Each opening's zone, clipped to the room; overlaps are resolved toplit > primary > secondary. */
  zones: ZoneRectangleResult[];
  section: string;
}

export interface ExemptLine {
  tag: string;
  count: string;
  watts: string;
  reason: string;
  section: string;
}

export interface LuminaireLine {
  tag: string;
  use: 'general' | 'decorative' | 'display' | 'exempt';
  count: string;
  unitWatts: string;
  watts: string;
  basis: string;
  zone?: ZoneKind;
  section: string;
}

/** A value the evaluation used that is not checked against a published source; every field is in words for people. */
export interface UnverifiedValue {
  /** Names the entry within one result; a space's `unverified` lists these. Not for people. */
  id: string;
  what: string;
  /** The short citation (the same as `citation.short`). */
  source: string;
  /** The note in words, or the short citation where the row has none. */
  note: string;
  citation: Citation;
}

export interface SpaceResult {
  id: string;
  name: string;
  level: string | null;
  area: string;
  /** Space type (space-by-space) or building area type (building area method) whose LPD applies. */
  lpdBasis: { kind: 'space-type' | 'building-area-type'; key: string; label: string };
  allowanceW: string;
  /** The part of allowanceW that is an additional allowance actually used by display lighting. */
  additionalAllowanceW: string;
  installedW: string;
  generalW: string;
  decorativeW: string;
  displayW: string;
  exemptW: string;
  allowedLpd: string;
  installedLpd: string;
  withinAllowance: boolean;
  marginW: string;
  marginPct: string | null;
  /**
   * 'entered': the space has luminaires; 'none-entered': it has none and nobody has said it is
   * unlit (an open item: the verdict waits for it); 'unlit': confirmed without lighting, so it has
   * no lighted floor area and adds nothing to the building's allowance.
   */
  lighting: 'entered' | 'none-entered' | 'unlit';
  rcr: string | null;
  roomGeometryIncreaseApplied: boolean;
  luminaires: LuminaireLine[];
  daylight: DaylightResult;
  controls: ControlLine[];
  exempt: ExemptLine[];
  /** The ids of the result's `unverifiedValues` this space's figures rest on (each entry is written once, there). */
  unverified: string[];
  section: string;
}

export interface LevelResult {
  level: string;
  area: string;
  allowanceW: string;
  installedW: string;
  marginW: string;
}

export interface AdditionalAllowanceLine {
  allowance: string;
  label: string;
  spaceId: string;
  area: string;
  claimedW: string;
  section: string;
}

export interface AdditionalAllowanceResult {
  lines: AdditionalAllowanceLine[];
  /** The edition's fixed adder (once per building), where one is stated. */
  fixedW: string;
  claimedW: string;
  /** Display watts in the claimed spaces: the most the allowance may cover (use it or lose it). */
  displayW: string;
  usableW: string;
}

export interface InteriorResult {
  section: string;
  area: string;
  allowanceW: string;
  installedW: string;
  exemptW: string;
  decorativeW: string;
  displayW: string;
  marginW: string;
  marginPct: string | null;
  complies: boolean;
  additional: AdditionalAllowanceResult | null;
  spaces: SpaceResult[];
  levels: LevelResult[] | null;
}

export interface ExteriorApplicationResult {
  key: string;
  label: string;
  tradable: boolean;
  /** Unit of the quantity and rate in the document's units, e.g. "W/m²" for W/ft² applications in SI. */
  unit: string;
  quantity: string;
  rate: string;
  allowanceW: string;
  installedW: string;
  /** Nontradable: base site allowance used to cover this application's excess. */
  baseSiteUsedW: string;
  /**
   * What is left (negative: the excess). A nontradable application counts the base site allowance
   * it uses; a tradable one is judged in its pool, so its margin is its own share before pooling.
   */
  marginW: string;
  withinAllowance: boolean;
  controls: ControlLine[];
  section: string;
}

export interface ExteriorResult {
  lightingZone: string;
  section: string;
  baseSiteAllowanceW: string;
  allowanceW: string;
  installedW: string;
  complies: boolean;
  /** The tradable pool: its margin counts the base site allowance it uses, so "within" never shows beside a negative margin. */
  tradable: { allowanceW: string; installedW: string; baseSiteUsedW: string; marginW: string; complies: boolean };
  baseSiteRemainingW: string;
  baseSiteCoversNontradable: boolean;
  applications: ExteriorApplicationResult[];
}

export interface EvaluationResult {
  edition: EditionId;
  dataVersion: string;
  method: 'building-area' | 'space-by-space';
  units: UnitSystem;
  /** true only when the verdict is 'complies'. */
  complies: boolean;
  /**
   * 'does-not-comply' when any requirement fails; otherwise 'incomplete' while something the verdict
   * needs is missing (see `openItems`), and 'complies' only when nothing is.
   */
  verdict: 'complies' | 'does-not-comply' | 'incomplete';
  /** The jurisdiction amendments applied over the model code. */
  amendments: { key: string; title: string }[];
  /** What keeps the verdict from being settled. */
  openItems: { spacesWithoutLuminaires: number; controlsToVerify: number };
  interior: InteriorResult;
  exterior: ExteriorResult | null;
  controlsComply: boolean;
  unverifiedValues: UnverifiedValue[];
  cautions: string[];
}
