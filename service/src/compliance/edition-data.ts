import type { AdditionalAllowanceKind, EditionId, RequirementCode, StrategyKey } from '../../../contract/editions.js';
import type { Citation } from './citation.js';

export { editionIds, strategyKeys, type EditionId, type RequirementCode, type StrategyKey } from '../../../contract/editions.js';

/**
 * The code tables of one edition, as the compliance engine reads them. The code-tables module
 * loads this from PostgreSQL (seeded from `reference/<edition>/`); tests may build it by hand.
 * Every number is an exact decimal string; nothing here is a JavaScript number.
 */

export type CodeFamily = 'ashrae-90.1' | 'iecc';

/** Where a value came from and how far it can be trusted. `verified: false` shows a "verify" mark. */
export interface Provenance {
  source: string;
  confidence: string;
  verified: boolean;
  note?: string;
  /** How the value is cited to people; the code tables give it, hand-built data may leave it out. */
  citation?: Citation;
}

export interface ControlStrategy {
  key: StrategyKey;
  label: string;
  /** The section of this edition that states the strategy, e.g. "9.4.1.1(h)" or "C405.2.1". */
  section: string;
  /** Parameters the edition states; absent where it states none. Decimal strings. */
  parameters: {
    timeoutMinutes?: string;
    reductionPercent?: string;
    zoneSizeLimitFt2?: string;
    [name: string]: string | undefined;
  };
  provenance: Provenance;
}

/** A row of another edition that this one equals (same use, same value), as the reference data records it. */
export interface EqualRow {
  edition: string;
  key: string;
}

export interface BuildingAreaType {
  key: string;
  label: string;
  sourceLabel: string;
  lpdWPerFt2: string;
  equalsRowOf?: EqualRow;
  provenance: Provenance;
}

/** The height range (ft) a formula row is for, as its label states it; a bound left out is open. */
export interface HeightRangeFt {
  above?: string;
  atLeast?: string;
  below?: string;
  atMost?: string;
}

/**
 * An allowance that depends on the space's height instead of a flat W/ft² (the atrium rows of
 * 90.1-2013/2016 and IECC 2018): W/ft² per foot of total height, or a base plus so much per foot.
 */
export type LpdFormula =
  | { kind: 'per-foot-of-height'; wPerFt2PerFt: string; heightFt: HeightRangeFt }
  | { kind: 'base-plus-per-foot-of-height'; baseWPerFt2: string; wPerFt2PerFt: string; heightFt: HeightRangeFt };

export interface SpaceType {
  key: string;
  label: string;
  sourceLabel: string;
  category: string;
  /** The table's number; for a formula row only the formula's first term, never a flat allowance. */
  lpdWPerFt2: string;
  /** Where present, the allowed LPD comes from the space's ceiling height through this formula. */
  lpdFormula?: LpdFormula;
  /** 90.1 only: the room cavity ratio at or above which the room-geometry increase applies. */
  rcrThreshold: string | null;
  /** A threshold the source states in words instead of a number (e.g. corridors "width < 8 ft"). */
  rcrCondition?: string;
  equalsRowOf?: EqualRow;
  /** 90.1: the table's control columns. IECC: derived from the rule inputs below, for display. */
  controls: Partial<Record<StrategyKey, RequirementCode>>;
  /** IECC rule inputs, held as data (C405.2.1 list and its full automatic-on exception list). */
  iecc?: {
    occupantSensorListed: boolean;
    fullAutoOnAllowed: boolean;
    /** Which occupant-sensor function applies: the general one or a space-specific one. */
    sensorFunction: 'general' | 'warehouse' | 'open-office' | 'corridor' | 'parking-garage';
    /** The C405.2.3 exception list item (e.g. "corridors") that frees this space type from light-reduction control. */
    lightReductionExemptItem?: string | null;
    /** The C405.2.2 exception list item (e.g. "sleeping units") that frees this space type from time-switch control. */
    timeSwitchExemptItem?: string | null;
    /** A dwelling or sleeping unit (guest room, dormitory, sleeping quarters): its own controls apply (C405.2.5). */
    sleepingUnit?: boolean;
  };
  provenance: Provenance;
}

export type ExteriorUnit = 'W' | 'W/ft2' | 'W/ft' | 'W/location' | 'W/door' | 'W/device' | 'W/window';

export interface ExteriorApplication {
  key: string;
  label: string;
  sourceLabel: string;
  unit: ExteriorUnit;
  /** true: tradable surface (pooled); false: nontradable (each only for itself); base site allowance is neither. */
  tradable: boolean;
  isBaseSiteAllowance: boolean;
  /** Allowance per unit for lighting zones "0".."4"; decimal strings. */
  allowanceByZone: Record<string, string>;
  /** Zones whose allowance here is not from a public source (a placeholder, or a corrected value). */
  unverifiedZones?: string[];
  controls: Partial<Record<StrategyKey, RequirementCode>>;
  provenance: Provenance;
}

export interface LightingZone {
  zone: number;
  description: string;
  provenance: Provenance;
}

export interface AdditionalAllowance {
  key: string;
  label: string;
  kind: AdditionalAllowanceKind;
  /** The section that states this allowance, where it is not the edition's section for additional allowances. */
  section?: string;
  /** W/ft² of the qualifying area. */
  lpdWPerFt2: string;
  /** A fixed wattage added once per building where the edition states one. */
  fixedW?: string;
  provenance: Provenance;
}

/** One of an edition's rules on a window's or skylight's glazing, with the section that states it. */
export interface OpeningRule {
  section: string;
  provenance: Provenance;
}

/**
 * What an edition asks of an opening's glazing before its daylight area calls for control: the
 * exceptions of 90.1 §9.4.1.1(e)/(f) and the minimum glazing of the IECC's daylight zones. An
 * entry left out is no such rule in this edition.
 */
export interface DaylightOpeningRules {
  /**
   * A window blocked by an adjacent structure (its top at least twice as high above the window as
   * its distance from it): 'primary' — its primary sidelit area needs no control (90.1); 'all' —
   * it makes no sidelit zone (IECC, whose own test is less strict, so a window blocked this way
   * is blocked there too).
   */
  blockedWindow?: OpeningRule & { excludes: 'primary' | 'all' };
  /** A window of lower visible transmittance makes no sidelit zone. */
  windowMinimumVt?: OpeningRule & { vt: string };
  /** A window of less glazing area (ft²) makes no sidelit zone. */
  windowMinimumAreaFt2?: OpeningRule & { ft2: string };
  /** A skylight whose direct sunlight is blocked for more than this many daytime hours a year needs no toplighting control. */
  blockedSkylight?: OpeningRule & { hours: string };
  /** A skylight of lower visible transmittance needs no toplighting control. */
  skylightMinimumVt?: OpeningRule & { vt: string };
}

/** Edition-wide numbers the rules use. Each carries its provenance; unverified ones show "verify". */
export interface EditionRules {
  daylight: {
    /** Primary sidelit general lighting at which sidelighting control is required. */
    primarySidelitThresholdW: string;
    /** Primary + secondary sidelit lighting at which secondary sidelighting control is required; null where not a rule. */
    combinedSidelitThresholdW: string | null;
    toplitThresholdW: string;
    /** 'at-least' (≥, 90.1) or 'more-than' (>, IECC). */
    comparison: 'at-least' | 'more-than';
    /** Sidelighting is not required when the space's total window area is below this (ft²); null where no such exception. */
    minimumWindowAreaFt2: string | null;
    /** How far a sidelit zone extends beyond each side of a window. */
    sideExtension: { kind: 'head-height-fraction'; fraction: string } | { kind: 'fixed'; feet: string };
    primaryDepthHeadHeights: string;
    secondaryDepthHeadHeights: string;
    /** Toplit zone extends this many ceiling heights beyond each skylight edge. */
    toplitExtensionCeilingHeights: string;
    /**
     * Which zone keeps a piece of floor that two zones reach, first to last. Absent: toplit, then
     * primary sidelit, then secondary sidelit.
     */
    overlapPrecedence?: ('primary-sidelit' | 'secondary-sidelit' | 'toplit')[];
    provenance: Provenance;
    /** The glazing rules; absent: the edition's data states none. */
    openings?: DaylightOpeningRules;
  };
  /** 90.1 §9.6.3 room-geometry increase; null for IECC. */
  roomGeometry: { increasePercent: string; provenance: Provenance } | null;
  /** IECC: any other enclosed space at or below this area needs an occupant sensor (C405.2.1). */
  smallEnclosedSpaceFt2: string | null;
  /** Line-voltage track: at least this many watts per linear foot. */
  trackMinimumWPerFt: string;
  trackProvenance: Provenance;
  /** Whether the base site allowance may cover nontradable excess. */
  baseSiteCoversNontradable: boolean;
  baseSiteProvenance: Provenance;
}

/** A jurisdiction's amendment: its own values for some of the edition's parameters, chosen per project. */
export interface Amendment {
  key: string;
  title: string;
  jurisdiction: string;
  parameters: Partial<Record<StrategyKey, Record<string, string>>>;
  provenance: Provenance;
}

export interface EditionData {
  id: EditionId;
  family: CodeFamily;
  title: string;
  publisher: string;
  year: number;
  /** Changes whenever any value of the edition changes; stored with every result. */
  dataVersion: string;
  /** Sections cited in results, e.g. { interiorAllowanceBuildingArea: "9.5.1", ... }. */
  sections: Record<string, string>;
  buildingAreaTypes: BuildingAreaType[];
  spaceTypes: SpaceType[];
  controlStrategies: ControlStrategy[];
  exteriorApplications: ExteriorApplication[];
  lightingZones: LightingZone[];
  additionalAllowances: AdditionalAllowance[];
  rules: EditionRules;
  /** Jurisdiction amendments a project may choose; none for most editions. */
  amendments?: Amendment[];
}
