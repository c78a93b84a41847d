/**
 * The names the service and the web app share: editions, units, methods, control strategies and
 * daylight zones. Plain values only, so both sides (Node and the browser) can read them.
 */

export const editionIds = [
  'ashrae-90.1-2013',
  'ashrae-90.1-2016',
  'ashrae-90.1-2019',
  'ashrae-90.1-2022',
  'iecc-2018',
  'iecc-2021',
  'iecc-2024',
] as const;
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

/**
 * The kinds of additional interior allowance an edition may offer under the space-by-space method:
 * retail display (on a sales floor, for display luminaires) and decorative (any space, for
 * decorative luminaires). Each is usable only by the luminaires it is for.
 */
export const additionalAllowanceKinds = ['retail-display', 'decorative'] as const;
export type AdditionalAllowanceKind = (typeof additionalAllowanceKinds)[number];

export type EditionFamily = 'ashrae-90.1' | 'iecc';

/** Our own keys for the reasons exterior lighting may be left out of the exterior allowance. */
export const exteriorExemptionReasons = [
  'safety-approved',
  'emergency-normally-off',
  'exit-signs',
  'transportation-signal',
  'signage',
  'integral-to-equipment',
  'theatrical',
  'athletic-playing-area',
  'temporary',
  'industrial-production',
  'theme-park',
  'historic-landmark',
] as const;
export type ExteriorExemptionReason = (typeof exteriorExemptionReasons)[number];

export interface ExteriorExemption {
  reason: ExteriorExemptionReason;
  label: string;
  /** The section of the edition family that lists it. */
  section: string;
}

/**
 * The exterior exemptions of each edition family. From memory: the exceptions to 90.1 §9.4.2
 * (with §9.1.1's emergency lighting) and to IECC C405.5.1 were not found in the reference data, so
 * every use of one is listed among the unverified values.
 */
export const exteriorExemptions: Record<EditionFamily, readonly ExteriorExemption[]> = {
  'ashrae-90.1': [
    { reason: 'emergency-normally-off', label: 'Emergency lighting that is off in normal operation', section: '9.1.1' },
    { reason: 'transportation-signal', label: 'Signal, directional and marker lighting for transportation', section: '9.4.2 exception' },
    { reason: 'signage', label: 'Advertising or directional signage', section: '9.4.2 exception' },
    {
      reason: 'integral-to-equipment',
      label: 'Lighting integral to equipment or instruments, installed by their maker',
      section: '9.4.2 exception',
    },
    { reason: 'theatrical', label: 'Theatrical, stage, film or video production lighting', section: '9.4.2 exception' },
    { reason: 'athletic-playing-area', label: 'Lighting of athletic playing areas', section: '9.4.2 exception' },
    { reason: 'temporary', label: 'Temporary lighting', section: '9.4.2 exception' },
    {
      reason: 'industrial-production',
      label: 'Industrial production, material handling, transportation sites and their storage areas',
      section: '9.4.2 exception',
    },
    { reason: 'theme-park', label: 'Theme elements in theme or amusement parks', section: '9.4.2 exception' },
    {
      reason: 'historic-landmark',
      label: 'Lighting that highlights public monuments or registered historic landmarks',
      section: '9.4.2 exception',
    },
  ],
  iecc: [
    { reason: 'safety-approved', label: 'Lighting approved because of safety considerations', section: 'C405.5.1 exception' },
    { reason: 'emergency-normally-off', label: 'Emergency lighting that is off in normal operation', section: 'C405.5.1 exception' },
    { reason: 'exit-signs', label: 'Exit signs', section: 'C405.5.1 exception' },
    { reason: 'transportation-signal', label: 'Signal, directional and marker lighting for transportation', section: 'C405.5.1 exception' },
    { reason: 'signage', label: 'Advertising or directional signage', section: 'C405.5.1 exception' },
    {
      reason: 'integral-to-equipment',
      label: 'Lighting integral to equipment or instruments, installed by their maker',
      section: 'C405.5.1 exception',
    },
    { reason: 'theatrical', label: 'Theatrical, stage, film or video production lighting', section: 'C405.5.1 exception' },
    { reason: 'athletic-playing-area', label: 'Lighting of athletic playing areas', section: 'C405.5.1 exception' },
    { reason: 'temporary', label: 'Temporary lighting', section: 'C405.5.1 exception' },
    {
      reason: 'industrial-production',
      label: 'Industrial production, material handling, transportation sites and their storage areas',
      section: 'C405.5.1 exception',
    },
    { reason: 'theme-park', label: 'Theme elements in theme or amusement parks', section: 'C405.5.1 exception' },
    {
      reason: 'historic-landmark',
      label: 'Lighting that highlights art, public monuments or registered historic landmarks',
      section: 'C405.5.1 exception',
    },
  ],
};

/** No list above was checked against a printed code: each use is listed among the unverified values with this note. */
export const exteriorExemptionsNote =
  'The list of exterior lighting exempt from the allowance was not found in a public source; check this exception in the printed code.';

export function editionFamilyOf(edition: EditionId): EditionFamily {
  return edition.startsWith('iecc') ? 'iecc' : 'ashrae-90.1';
}
