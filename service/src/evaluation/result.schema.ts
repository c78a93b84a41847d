import { z } from 'zod';
import { editionIds, type EditionId } from '../compliance/edition-data.js';

/**
 * The evaluation result as a schema, for the served API description. It mirrors
 * `compliance/result.ts`; the service tests parse real results with it (strict objects), so the
 * two cannot drift apart unnoticed.
 */
const decimal = z.string().regex(/^-?\d+(\.\d+)?$/).describe('An exact decimal number as a string.');
const requirement = z.string().describe("'required' | 'not-required' | 'to-verify' | 'one-of:GROUP'");

const controlLine = z.strictObject({
  strategy: z.string(),
  label: z.string(),
  requirement,
  met: z.boolean().nullable(),
  status: z.enum(['met', 'not-met', 'exception-claimed', 'to-verify', 'not-required']),
  reason: z.string(),
  section: z.string(),
  verified: z.boolean(),
});

const citation = z
  .strictObject({
    short: z.string().describe('Edition, table or section, and what the value rests on, in words.'),
    layer: z.enum(['model-code', 'other-edition-or-state', 'modelling-dataset', 'not-checked']),
    checked: z.boolean(),
    note: z.string().nullable().describe('The source note in words, for those who ask.'),
  })
  .describe('How a code-table value is cited to people.');
const unverifiedValue = z.strictObject({ id: z.string(), what: z.string(), source: z.string(), note: z.string(), citation });
const zoneKind = z.enum(['primary-sidelit', 'secondary-sidelit', 'toplit']);

const daylight = z.strictObject({
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
  zones: z.array(z.strictObject({ kind: zoneKind, source: z.string(), x: decimal, y: decimal, length: decimal, width: decimal })),
  section: z.string(),
});

const space = z.strictObject({
  id: z.string(),
  name: z.string(),
  level: z.string().nullable(),
  area: decimal,
  lpdBasis: z.strictObject({ kind: z.enum(['space-type', 'building-area-type']), key: z.string(), label: z.string() }),
  allowanceW: decimal,
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
  lighting: z.enum(['entered', 'none-entered', 'unlit']),
  rcr: decimal.nullable(),
  roomGeometryIncreaseApplied: z.boolean(),
  luminaires: z.array(
    z.strictObject({
      tag: z.string(),
      use: z.enum(['general', 'decorative', 'display', 'exempt']),
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
  unverified: z.array(z.string()),
  section: z.string(),
});

const additional = z.strictObject({
  lines: z.array(z.strictObject({ allowance: z.string(), label: z.string(), spaceId: z.string(), area: decimal, claimedW: decimal, section: z.string() })),
  fixedW: decimal,
  claimedW: decimal,
  displayW: decimal,
  usableW: decimal,
});

const exteriorApplication = z.strictObject({
  key: z.string(),
  label: z.string(),
  tradable: z.boolean(),
  unit: z.string(),
  quantity: decimal,
  rate: decimal,
  allowanceW: decimal,
  installedW: decimal,
  baseSiteUsedW: decimal,
  marginW: decimal,
  withinAllowance: z.boolean(),
  controls: z.array(controlLine),
  section: z.string(),
});

export const evaluationResultSchema = z.strictObject({
  edition: z.enum(editionIds as [EditionId, ...EditionId[]]),
  dataVersion: z.string(),
  method: z.enum(['building-area', 'space-by-space']),
  units: z.enum(['ip', 'si']),
  complies: z.boolean(),
  verdict: z.enum(['complies', 'does-not-comply', 'incomplete']),
  amendments: z.array(z.strictObject({ key: z.string(), title: z.string() })),
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
    levels: z.array(z.strictObject({ level: z.string(), area: decimal, allowanceW: decimal, installedW: decimal, marginW: decimal })).nullable(),
  }),
  exterior: z
    .strictObject({
      lightingZone: z.string(),
      section: z.string(),
      baseSiteAllowanceW: decimal,
      allowanceW: decimal,
      installedW: decimal,
      complies: z.boolean(),
      tradable: z.strictObject({ allowanceW: decimal, installedW: decimal, baseSiteUsedW: decimal, marginW: decimal, complies: z.boolean() }),
      baseSiteRemainingW: decimal,
      baseSiteCoversNontradable: z.boolean(),
      applications: z.array(exteriorApplication),
    })
    .nullable(),
  controlsComply: z.boolean(),
  unverifiedValues: z.array(unverifiedValue),
  cautions: z.array(z.string()),
});
