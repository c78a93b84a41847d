/**
 * The names the service and the web app share: editions, units, methods, control strategies and
 * daylight zones. Plain values only, so both sides (Node and the browser) can read them.
 */

export const editionIds = ['ashrae-90.1-2013', 'ashrae-90.1-2016', 'ashrae-90.1-2019', 'ashrae-90.1-2022', 'iecc-2018', 'iecc-2021', 'iecc-2024'] as const;
export type EditionId = (typeof editionIds)[number];

export const unitSystems = ['ip', 'si'] as const;
export type UnitSystem = (typeof unitSystems)[number];

export const complianceMethods = ['building-area', 'space-by-space'] as const;
export type ComplianceMethod = (typeof complianceMethods)[number];

/** Our own keys for the control strategies; each edition says which section covers each. */
export const strategyKeys = [
  'local-control',
  'restricted-manual-on',
  'restricted-partial-auto-on',
  'bilevel',
  'daylight-sidelighting',
  'daylight-toplighting',
  'automatic-partial-off',
  'automatic-full-off',
  'scheduled-shutoff',
  'occupant-sensor',
  'time-switch',
  'light-reduction',
  'specific-application',
  'parking-daylight-transition',
  'exterior-daylight-off',
  'exterior-setback',
  'exterior-facade-landscape-off',
] as const;
export type StrategyKey = (typeof strategyKeys)[number];

/**
 * A table cell for one strategy in one space type: required, at least one of a group
 * (90.1's ADD1/ADD2 become `one-of:ADD1`), not required, or not known from a public source.
 */
export type RequirementCode = 'required' | 'not-required' | 'to-verify' | `one-of:${string}`;

export const zoneKinds = ['primary-sidelit', 'secondary-sidelit', 'toplit'] as const;
export type ZoneKind = (typeof zoneKinds)[number];

export const luminaireUses = ['general', 'decorative', 'display', 'exempt'] as const;
export type LuminaireUse = (typeof luminaireUses)[number];

/** An exact decimal number as text: what every number the calculation touches travels as. */
export const decimalPattern = /^-?\d+(\.\d+)?$/;

/**
 * The exact conversions between the unit systems, as decimals: 1 ft = 0.3048 m by definition, so
 * 1 ft² = 0.09290304 m² (NIST SP 811, appendix B). The service computes with them exactly; the web
 * app converts for display with the same figures.
 */
export const metresPerFootText = '0.3048';
export const squareMetresPerSquareFootText = '0.09290304';
