import { createHash } from 'node:crypto';
import { existsSync, readFileSync, readdirSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { z } from 'zod';
import { strategyKeys, type EditionId } from '../compliance/edition-data.js';
import { additionalAllowanceKinds, decimalPattern } from '../../../contract/editions.js';

/** Reads and checks the files under `reference/`: the seed loads them, the tests compare against them. */

export { editionIds } from '../compliance/edition-data.js';

export const defaultReferenceRoot = fileURLToPath(new URL('../../../reference/', import.meta.url));

const decimal = z.string().regex(decimalPattern, 'an exact decimal string');
const strategyKey = z.enum(strategyKeys);
const requirement = z.string().regex(/^(required|not-required|to-verify|one-of:[A-Z0-9-]+)$/);

const provenance = {
  source: z.string().min(1),
  confidence: z.string().min(1),
  verified: z.boolean(),
  note: z.string(),
  fromMemory: z.string().optional(),
};
const provenanceObject = z.object({ ...provenance, tag: z.string() });

const table = <Row extends z.ZodType>(row: Row) => z.object({ table: z.string(), sourceFile: z.string(), rows: z.array(row) });
const crossRow = z.object({ edition: z.string(), key: z.string() });

export const editionFileSchema = z.object({
  id: z.string(),
  family: z.enum(['ashrae-90.1', 'iecc']),
  title: z.string(),
  publisher: z.string(),
  year: z.number().int(),
  methods: z.array(z.string()),
});

export const buildingAreaTypeRow = z.object({
  key: z.string(),
  label: z.string(),
  sourceLabel: z.string(),
  lpdWPerFt2: decimal,
  ...provenance,
  equalsRowOf: crossRow.optional(),
});

export const controlCell = z.object({ requirement, ...provenance });

export const ieccInputs = z.object({
  occupantSensorListed: z.boolean(),
  occupantSensorListItem: z.string().nullable(),
  fullAutoOnAllowed: z.boolean(),
  fullAutoOnItem: z.string().nullable(),
  sensorFunction: z.enum(['general', 'warehouse', 'open-office', 'corridor', 'parking-garage']),
  /** The C405.2.3 exception list item that frees this space type from light-reduction control, if any. */
  lightReductionExemptItem: z.string().nullable().default(null),
  /** The C405.2.2 exception list item that frees this space type from time-switch control, if any. */
  timeSwitchExemptItem: z.string().nullable().default(null),
  /** A sleeping or dwelling unit, whose lighting has its own controls. */
  sleepingUnit: z.boolean().default(false),
  /** "[S-ed]" where another edition's list stands in for this edition's own; absent where sourced for it. */
  tag: z.literal('[S-ed]').optional(),
  note: z.string().optional(),
});

const heightRangeFt = z
  .strictObject({ above: decimal.optional(), atLeast: decimal.optional(), below: decimal.optional(), atMost: decimal.optional() })
  .refine((range) => Object.keys(range).length > 0, 'a height range needs at least one bound');

export const lpdFormula = z.discriminatedUnion('kind', [
  z.strictObject({ kind: z.literal('per-foot-of-height'), wPerFt2PerFt: decimal, heightFt: heightRangeFt }),
  z.strictObject({ kind: z.literal('base-plus-per-foot-of-height'), baseWPerFt2: decimal, wPerFt2PerFt: decimal, heightFt: heightRangeFt }),
]);

export const spaceTypeRow = z.object({
  key: z.string(),
  label: z.string(),
  sourceLabel: z.string(),
  category: z.string(),
  lpdWPerFt2: decimal,
  lpdFormula: lpdFormula.optional(),
  rcrThreshold: decimal.nullable(),
  rcrCondition: z.string().optional(),
  controls: z.partialRecord(strategyKey, controlCell).optional(),
  iecc: ieccInputs.optional(),
  daylight: z.object({ sidelighting: requirement, toplighting: requirement, note: z.string() }).optional(),
  equalsRowOf: crossRow.nullable().optional(),
  ...provenance,
});

export const exteriorApplicationRow = z.object({
  key: z.string(),
  label: z.string(),
  sourceLabel: z.string(),
  unit: z.string(),
  sourceUnit: z.string(),
  tradable: z.boolean(),
  isBaseSiteAllowance: z.boolean(),
  allowanceByZone: z.record(z.string(), decimal),
  unverifiedZones: z.array(z.string()).optional(),
  /** A zone value corrected from the source's obvious error; the source's own value, by zone. */
  correctedFrom: z.record(z.string(), decimal).optional(),
  controls: z.partialRecord(strategyKey, requirement),
  sourceControlFlags: z.record(z.string(), z.string()),
  ...provenance,
});

export const lightingZoneRow = z.object({
  zone: z.string().regex(/^\d$/),
  description: z.string(),
  sourceLabel: z.string(),
  ...provenance,
});

export const additionalAllowanceRow = z.object({
  key: z.string(),
  label: z.string(),
  sourceLabel: z.string(),
  kind: z.enum(additionalAllowanceKinds),
  /** The section that states this allowance, where it is not the edition's section for additional allowances. */
  section: z.string().optional(),
  lpdWPerFt2: decimal,
  fixedW: decimal.nullable(),
  ...provenance,
});

const parameter = z.object({ value: decimal, tag: z.string(), source: z.string(), note: z.string().optional() });
export const editionStrategyRow = z.object({
  key: strategyKey,
  section: z.string(),
  tag: z.string(),
  ...provenance,
  parameters: z.record(z.string(), parameter),
});

const section = z.object({ section: z.string(), tag: z.string(), verified: z.boolean(), note: z.string() });
const openingRule = z.strictObject({ section: z.string(), provenance: provenanceObject });
export const rulesFileSchema = z.object({
  sections: z.record(z.string(), section),
  daylight: z.object({
    primarySidelitThresholdW: decimal,
    combinedSidelitThresholdW: decimal.nullable(),
    toplitThresholdW: decimal,
    comparison: z.enum(['at-least', 'more-than']),
    minimumWindowAreaFt2: decimal.nullable(),
    sideExtension: z.union([
      z.object({ kind: z.literal('head-height-fraction'), fraction: decimal }),
      z.object({ kind: z.literal('fixed'), feet: decimal }),
    ]),
    primaryDepthHeadHeights: decimal,
    secondaryDepthHeadHeights: decimal,
    toplitExtensionCeilingHeights: decimal,
    overlapPrecedence: z
      .array(z.enum(['primary-sidelit', 'secondary-sidelit', 'toplit']))
      .length(3)
      .optional(),
    provenance: provenanceObject,
    openings: z
      .strictObject({
        blockedWindow: openingRule.extend({ excludes: z.enum(['primary', 'all']) }).optional(),
        windowMinimumVt: openingRule.extend({ vt: decimal }).optional(),
        windowMinimumAreaFt2: openingRule.extend({ ft2: decimal }).optional(),
        blockedSkylight: openingRule.extend({ hours: decimal }).optional(),
        skylightMinimumVt: openingRule.extend({ vt: decimal }).optional(),
      })
      .optional(),
  }),
  roomGeometry: z.object({ increasePercent: decimal, provenance: provenanceObject }).nullable(),
  smallEnclosedSpace: z.object({ ft2: decimal, provenance: provenanceObject }).nullable(),
  track: z.object({ minimumWPerFt: decimal, provenance: provenanceObject }),
  baseSite: z.object({ coversNontradable: z.boolean(), provenance: provenanceObject }),
});

export const amendmentRow = z.object({
  key: z.string(),
  title: z.string(),
  jurisdiction: z.string(),
  /** By strategy, the parameters the amendment sets in place of the edition's. */
  parameters: z.partialRecord(strategyKey, z.record(z.string(), decimal)),
  ...provenance,
});

const buildingAreaTypesFile = table(buildingAreaTypeRow);
const amendmentsFile = table(amendmentRow);
const spaceTypesFile = table(spaceTypeRow);
const exteriorApplicationsFile = table(exteriorApplicationRow);
const lightingZonesFile = table(lightingZoneRow);
const additionalAllowancesFile = table(additionalAllowanceRow);

export const catalogueSchema = z.object({ strategies: z.array(z.object({ key: strategyKey, label: z.string() })) });

export interface ReferenceEdition {
  id: EditionId;
  dataVersion: string;
  edition: z.infer<typeof editionFileSchema>;
  buildingAreaTypes: z.infer<typeof buildingAreaTypesFile>;
  spaceTypes: z.infer<typeof spaceTypesFile>;
  exteriorApplications: z.infer<typeof exteriorApplicationsFile>;
  lightingZones: z.infer<typeof lightingZonesFile>;
  additionalAllowances: z.infer<typeof additionalAllowancesFile>;
  controlStrategies: { edition: string; strategies: z.infer<typeof editionStrategyRow>[] };
  rules: z.infer<typeof rulesFileSchema>;
  /** Jurisdiction amendments over this edition (amendments.json; none when the file is absent). */
  amendments: z.infer<typeof amendmentsFile>;
  catalogue: z.infer<typeof catalogueSchema>;
}

export type SpaceTypeFileRow = z.infer<typeof spaceTypeRow>;
export type ControlCellFile = z.infer<typeof controlCell>;

function readJson(file: string): unknown {
  return JSON.parse(readFileSync(file, 'utf8'));
}

/** The edition's files and the shared catalogue, in a fixed order: what the data version is a hash of. */
function versionedFiles(root: string, id: EditionId): string[] {
  const folder = path.join(root, id);
  const files = readdirSync(folder)
    .filter((name) => name.endsWith('.json'))
    .sort()
    .map((name) => path.join(folder, name));
  return [path.join(root, 'control-strategies.json'), ...files];
}

/** sha256 over the edition's file names and bytes; the first 16 hex digits name the data version. */
export function dataVersionOf(root: string, id: EditionId): string {
  const hash = createHash('sha256');
  for (const file of versionedFiles(root, id)) {
    hash.update(path.relative(root, file));
    hash.update('\0');
    hash.update(readFileSync(file));
    hash.update('\0');
  }
  return hash.digest('hex').slice(0, 16);
}

export function readReferenceEdition(id: EditionId, root = defaultReferenceRoot): ReferenceEdition {
  const folder = path.join(root, id);
  const at = (name: string) => path.join(folder, name);
  const parsed = (schema: z.ZodType, file: string) => {
    const result = schema.safeParse(readJson(file));
    if (!result.success) throw new Error(`${path.relative(root, file)}: ${z.prettifyError(result.error)}`);
    return result.data;
  };
  const edition = parsed(editionFileSchema, at('edition.json')) as ReferenceEdition['edition'];
  if (edition.id !== id) throw new Error(`${id}/edition.json names ${edition.id}`);
  const strategies = parsed(
    z.object({ edition: z.string(), strategies: z.array(editionStrategyRow) }),
    at('control-strategies.json'),
  ) as ReferenceEdition['controlStrategies'];
  return {
    id,
    dataVersion: dataVersionOf(root, id),
    edition,
    buildingAreaTypes: parsed(buildingAreaTypesFile, at('building-area-types.json')) as ReferenceEdition['buildingAreaTypes'],
    spaceTypes: parsed(spaceTypesFile, at('space-types.json')) as ReferenceEdition['spaceTypes'],
    exteriorApplications: parsed(exteriorApplicationsFile, at('exterior-applications.json')) as ReferenceEdition['exteriorApplications'],
    lightingZones: parsed(lightingZonesFile, at('lighting-zones.json')) as ReferenceEdition['lightingZones'],
    additionalAllowances: parsed(additionalAllowancesFile, at('additional-allowances.json')) as ReferenceEdition['additionalAllowances'],
    controlStrategies: strategies,
    rules: parsed(rulesFileSchema, at('rules.json')) as ReferenceEdition['rules'],
    amendments: existsSync(at('amendments.json'))
      ? (parsed(amendmentsFile, at('amendments.json')) as ReferenceEdition['amendments'])
      : { table: 'none', sourceFile: 'none', rows: [] },
    catalogue: parsed(catalogueSchema, path.join(root, 'control-strategies.json')) as ReferenceEdition['catalogue'],
  };
}
