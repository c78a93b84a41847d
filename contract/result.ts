import { z } from 'zod';
import {
  additionalAllowanceKinds,
  complianceMethods,
  decimalPattern,
  editionIds,
  exteriorExemptionReasons,
  luminaireUses,
  strategyKeys,
  unitSystems,
  zoneKinds,
  type RequirementCode,
} from './editions.js';

/**
 * The evaluation result: one schema, read by the service (its types, the served API description,
 * the tests that parse real results with these strict objects) and by the web app (its types).
 * Every number is an exact decimal string; watts are W, areas and lengths in the document's units
 * (ft²/ft or m²/m), power densities W/ft² or W/m². Round only for display.
 */

const decimal = z.string().regex(decimalPattern).describe('An exact decimal number as a string.');
const requirement = z
  .union([z.enum(['required', 'not-required', 'to-verify']), z.templateLiteral(['one-of:', z.string()])])
  .describe('Required, not required, to verify, or one of a group (one-of:GROUP).') as z.ZodType<RequirementCode>;

export const controlStatuses = ['met', 'not-met', 'exception-claimed', 'to-verify', 'not-required'] as const;

const controlLine = z.strictObject({
  /** The strategy, or 'control-space-type' where the space type that sets the controls is missing. */
  strategy: z.enum([...strategyKeys, 'control-space-type']),
  label: z.string(),
  requirement,
  met: z.boolean().nullable(),
  status: z.enum(controlStatuses),
  reason: z.string(),
  section: z.string(),
  verified: z.boolean(),
});

export const citationSchema = z
  .strictObject({
    short: z.string().describe('Edition, table or section, and what the value rests on, in words.'),
    layer: z.enum(['model-code', 'other-edition-or-state', 'modelling-dataset', 'not-checked']),
    checked: z.boolean(),
    note: z.string().nullable().describe('The source note in words, for those who ask.'),
  })
  .describe('How a code-table value is cited to people.');
const unverifiedValue = z.strictObject({
  id: z.string(),
  what: z.string(),
  source: z.string(),
  note: z.string(),
  citation: citationSchema,
});
const zoneKind = z.enum(zoneKinds);

const daylight = z.strictObject({
  /** false where the room has no rectangle (length × width) to build zones on. */
  geometryEvaluated: z.boolean(),
  windowArea: decimal,
  primarySidelitArea: decimal,
  secondarySidelitArea: decimal,
  toplitArea: decimal,
  primarySidelitW: decimal,
  secondarySidelitW: decimal,
  toplitW: decimal,
  sidelightingControlRequired: z.boolean(),
  secondarySidelightingControlRequired: z.boolean(),
  toplightingControlRequired: z.boolean(),
  reasons: z.array(z.string()),
  /** Each opening's zone, clipped to the room; overlaps are resolved toplit > primary > secondary. */
  zones: z.array(z.strictObject({ kind: zoneKind, source: z.string(), x: decimal, y: decimal, length: decimal, width: decimal })),
  section: z.string(),
});

const space = z.strictObject({
  id: z.string(),
  name: z.string(),
  level: z.string().nullable(),
  area: decimal,
  /** Space type (space-by-space) or building area type (building area method) whose LPD applies. */
  lpdBasis: z.strictObject({ kind: z.enum(['space-type', 'building-area-type']), key: z.string(), label: z.string() }),
  allowanceW: decimal,
  /** The part of allowanceW that is additional allowances actually used: by display lighting (retail display) and by decorative lighting (decorative). */
  additionalAllowanceW: decimal,
  installedW: decimal,
  generalW: decimal,
  decorativeW: decimal,
  displayW: decimal,
  exemptW: decimal,
  allowedLpd: decimal,
  installedLpd: decimal,
  withinAllowance: z.boolean(),
  marginW: decimal,
  marginPct: decimal.nullable(),
  /**
   * 'entered': the space has luminaires; 'none-entered': it has none and nobody has said it is
   * unlit (an open item: the verdict waits for it); 'unlit': confirmed without lighting, so it has
   * no lighted floor area and adds nothing to the building's allowance.
   */
  lighting: z.enum(['entered', 'none-entered', 'unlit']),
  rcr: decimal.nullable(),
  roomGeometryIncreaseApplied: z.boolean(),
  luminaires: z.array(
    z.strictObject({
      tag: z.string(),
      use: z.enum(luminaireUses),
      count: decimal,
      unitWatts: decimal,
      watts: decimal,
      basis: z.string(),
      zone: zoneKind.optional(),
      section: z.string(),
    }),
  ),
  daylight,
  controls: z.array(controlLine),
  exempt: z.array(z.strictObject({ tag: z.string(), count: decimal, watts: decimal, reason: z.string(), section: z.string() })),
  /** The ids of the result's `unverifiedValues` this space's figures rest on (each entry is written once, there). */
  unverified: z.array(z.string()),
  section: z.string(),
});

const additional = z.strictObject({
  lines: z.array(
    z.strictObject({
      allowance: z.string(),
      kind: z.enum(additionalAllowanceKinds),
      label: z.string(),
      spaceId: z.string(),
      area: decimal,
      claimedW: decimal,
      /**
       * What of the claim the space's own luminaires of this kind use (display for retail display,
       * decorative for decorative): the rest is lost, never traded to other lighting.
       */
      usableW: decimal,
      /** Why the usable part is less than the claim, in words; null when the claim is used whole. */
      limitedBy: z.string().nullable(),
      section: z.string(),
    }),
  ),
  /** The edition's fixed adder (once per building), where one is stated (retail display only). */
  fixedW: decimal,
  claimedW: decimal,
  displayW: decimal,
  /** Decorative watts of the spaces with a decorative claim. */
  decorativeW: decimal,
  usableW: decimal,
});

const exteriorApplication = z.strictObject({
  key: z.string(),
  label: z.string(),
  tradable: z.boolean(),
  /** Unit of the quantity and rate in the document's units, e.g. "W/m²" for W/ft² applications in SI. */
  unit: z.string(),
  quantity: decimal,
  rate: decimal,
  allowanceW: decimal,
  /** Installed watts counted against the allowance: the exempt part is left out. */
  installedW: decimal,
  /** The part of the application's lighting exempt from the allowance, with the reason. */
  exemptW: decimal,
  exemption: z
    .strictObject({
      reason: z.enum(exteriorExemptionReasons),
      label: z.string(),
      note: z.string(),
      section: z.string(),
      verified: z.boolean(),
    })
    .nullable(),
  /**
   * Nontradable: the base site allowance used to cover this application's excess. The margin is what
   * is left (negative: the excess); a tradable application is judged in its pool, so its margin is
   * its own share before pooling.
   */
  baseSiteUsedW: decimal,
  marginW: decimal,
  withinAllowance: z.boolean(),
  controls: z.array(controlLine),
  section: z.string(),
});

export const evaluationResultSchema = z.strictObject({
  edition: z.enum(editionIds),
  dataVersion: z.string(),
  method: z.enum(complianceMethods),
  units: z.enum(unitSystems),
  /** true only when the verdict is 'complies'. */
  complies: z.boolean(),
  verdict: z.enum(['complies', 'does-not-comply', 'incomplete']),
  /** The jurisdiction amendments applied over the model code. */
  amendments: z.array(z.strictObject({ key: z.string(), title: z.string() })),
  /** What keeps the verdict from being settled: 'incomplete' while any is open, 'complies' only when none is. */
  openItems: z.strictObject({ spacesWithoutLuminaires: z.number().int().nonnegative(), controlsToVerify: z.number().int().nonnegative() }),
  interior: z.strictObject({
    section: z.string(),
    area: decimal,
    allowanceW: decimal,
    installedW: decimal,
    exemptW: decimal,
    decorativeW: decimal,
    displayW: decimal,
    marginW: decimal,
    marginPct: decimal.nullable(),
    complies: z.boolean(),
    additional: additional.nullable(),
    spaces: z.array(space),
    levels: z
      .array(z.strictObject({ level: z.string(), area: decimal, allowanceW: decimal, installedW: decimal, marginW: decimal }))
      .nullable(),
  }),
  exterior: z
    .strictObject({
      lightingZone: z.string(),
      section: z.string(),
      baseSiteAllowanceW: decimal,
      allowanceW: decimal,
      installedW: decimal,
      /** Exterior lighting exempt from the allowance, left out of installedW. */
      exemptW: decimal,
      complies: z.boolean(),
      /** The tradable pool: its margin counts the base site allowance it uses, so "within" never shows beside a negative margin. */
      tradable: z.strictObject({
        allowanceW: decimal,
        installedW: decimal,
        baseSiteUsedW: decimal,
        marginW: decimal,
        complies: z.boolean(),
      }),
      baseSiteRemainingW: decimal,
      baseSiteCoversNontradable: z.boolean(),
      applications: z.array(exteriorApplication),
    })
    .nullable(),
  controlsComply: z.boolean(),
  unverifiedValues: z.array(unverifiedValue),
  cautions: z.array(z.string()),
});

export type EvaluationResult = z.infer<typeof evaluationResultSchema>;
export type Verdict = EvaluationResult['verdict'];
export type InteriorResult = EvaluationResult['interior'];
export type SpaceResult = InteriorResult['spaces'][number];
export type LevelResult = NonNullable<InteriorResult['levels']>[number];
export type AdditionalAllowanceResult = NonNullable<InteriorResult['additional']>;
export type AdditionalAllowanceLine = AdditionalAllowanceResult['lines'][number];
export type LuminaireLine = SpaceResult['luminaires'][number];
export type ExemptLine = SpaceResult['exempt'][number];
export type DaylightResult = SpaceResult['daylight'];
export type ZoneRectangleResult = DaylightResult['zones'][number];
export type ControlLine = SpaceResult['controls'][number];
export type ControlStatus = ControlLine['status'];
export type ExteriorResult = NonNullable<EvaluationResult['exterior']>;
export type ExteriorApplicationResult = ExteriorResult['applications'][number];
/** A value the evaluation used that is not checked against a published source; every field is in words for people. */
export type UnverifiedValue = EvaluationResult['unverifiedValues'][number];
/** How a code-table value is cited to people; `checked: false` shows the "verify" mark. */
export type Citation = z.infer<typeof citationSchema>;
export type CitationLayer = Citation['layer'];
