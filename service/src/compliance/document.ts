import { z } from 'zod';
import type { EditionData, SpaceType } from './edition-data.js';
import { conditionWords, satisfies, sizeCondition } from './size-conditions.js';
import { areaToSquareFeet, areaWords, lengthToFeet, lengthWords } from './units.js';
import {
  boundedDecimal,
  decimalField,
  distinctKeys,
  documentLimits,
  listLimit,
  maxAmendments,
  ranges,
  textField,
  textLimits,
} from './bounds.js';
import { lpdFormulaProblems } from './lpd-formula.js';
import { type Dec, dec } from './numbers.js';
import { exteriorExemptionReasons, exteriorExemptions } from '../../../contract/editions.js';

/**
 * The project document an evaluation reads. Numbers arrive as decimal strings or JSON numbers and
 * leave the parser as normalised decimal strings, so nothing is ever held as a binary float.
 * Lengths are ft or m and areas ft² or m², as `units` says; watts are watts in both.
 *
 * Plan coordinates for daylight geometry: a rectangular room `length` (x, along the north and
 * south walls) by `width` (y, along the east and west walls), origin at the south-west corner.
 * A window's `offset` is measured along its wall from the wall's lower-coordinate end (the west
 * end of the north and south walls, the south end of the east and west walls); a skylight's
 * `x`/`y` is its south-west corner. Absent offsets and positions centre the opening.
 */

/**
 * An object of known fields: any other field is refused by name, so a misspelt one (a
 * `ceilingHieght`) is reported instead of silently ignored.
 */
function fields<Shape extends z.core.$ZodLooseShape>(shape: Shape) {
  return z.strictObject(shape, {
    error: (issue) =>
      issue.code === 'unrecognized_keys'
        ? `Unknown field${issue.keys.length > 1 ? 's' : ''} ${issue.keys.map((name) => `“${name}”`).join(', ')}: check the spelling.`
        : undefined,
  });
}

const key = textField(textLimits.key, { required: true });
const tag = textField(textLimits.tag, { required: true });
const note = textField(textLimits.note, { required: true, multiline: true });

export const luminaireUses = ['general', 'decorative', 'display', 'exempt'] as const;
export const wattageBases = ['rated', 'line-voltage-track', 'low-voltage-track', 'current-limited'] as const;
export const daylightZoneKinds = ['primary-sidelit', 'secondary-sidelit', 'toplit'] as const;
export const walls = ['north', 'east', 'south', 'west'] as const;

/** The general exceptions to the interior control requirements (90.1 §9.4.1.1 / IECC C405.2). */
export const controlExceptionReasons = [
  'security-or-emergency-continuous',
  'exit-stairway-ramp-passageway',
  'egress-normally-off',
  /** IECC C405.2.2: lighting intended for continuous operation needs no time switch. */
  'continuous-operation',
  /** For a requirement the product cannot settle ("to verify"): the engineer checked the adopted code and it does not apply here. */
  'verified-not-required',
  'other',
] as const;

export const luminaireTypeSchema = fields({
  tag,
  description: textField(textLimits.description).default(''),
  /** Rated input watts per luminaire (for track: the specified watts of the luminaires on one run). */
  inputWatts: decimalField(ranges.luminaireWatts),
  use: z.enum(luminaireUses),
  exemptReason: note.optional(),
  basis: z.enum(wattageBases).default('rated'),
  /** Track or busway run length, ft or m. */
  length: decimalField(ranges.length).optional(),
  /** Rating of the current limiter, breaker or transformer, W. */
  limitWatts: decimalField(ranges.limitWatts).optional(),
});

export const luminaireGroupSchema = fields({
  tag,
  count: decimalField(ranges.count),
  zone: z.enum(daylightZoneKinds).optional(),
});

export const controlSchema = fields({
  strategy: key,
  provided: z.boolean(),
  timeoutMinutes: decimalField(ranges.timeoutMinutes).optional(),
  /** Floor area one device or zone of this control serves, ft² or m² (checked against the strategy's zone size limit where one is stated). */
  zoneSize: decimalField(ranges.area).optional(),
  /** How far the control reduces the lighting power when it acts (partial OFF, light reduction), %. */
  reductionPercent: decimalField(ranges.percent).optional(),
  /** For occupant sensors: how lighting turns on. 'partial' means automatic-on to at most 50 %. */
  autoOn: z.enum(['manual', 'partial', 'full']).optional(),
  exceptionReason: z.enum(controlExceptionReasons).optional(),
  exceptionNote: note.optional(),
  device: textField(textLimits.device).optional(),
});

export const windowSchema = fields({
  width: decimalField(ranges.length),
  headHeight: decimalField(ranges.height),
  sillHeight: decimalField(ranges.heightAboveFloor).optional(),
  offset: decimalField(ranges.offset).optional(),
  wall: z.enum(walls).default('south'),
  /** The glazing's visible transmittance, 0 to 1; absent: not recorded. */
  visibleTransmittance: decimalField(ranges.visibleTransmittance).optional(),
  /**
   * The top of an existing adjacent structure is at least twice as high above the window as its
   * horizontal distance from it (90.1 §9.4.1.1(e)); absent: not recorded.
   */
  daylightBlocked: z.boolean().optional(),
});

export const skylightSchema = fields({
  length: decimalField(ranges.length),
  width: decimalField(ranges.length),
  x: decimalField(ranges.offset).optional(),
  y: decimalField(ranges.offset).optional(),
  /** The glazing's visible transmittance, 0 to 1; absent: not recorded. */
  visibleTransmittance: decimalField(ranges.visibleTransmittance).optional(),
  /**
   * Existing adjacent structures or natural objects block direct sunlight on the skylight for more
   * daytime hours a year than the edition's limit (90.1 §9.4.1.1(f)); absent: not recorded.
   */
  daylightBlocked: z.boolean().optional(),
});

export const spaceSchema = fields({
  id: key,
  name: textField(textLimits.name, { required: true }),
  level: textField(textLimits.level, { required: true }).optional(),
  spaceType: key.optional(),
  buildingAreaType: key.optional(),
  /** Building area method: the space type whose control requirements apply; the space type when absent. */
  controlSpaceType: key.optional(),
  area: decimalField(ranges.area),
  ceilingHeight: decimalField(ranges.height).optional(),
  length: decimalField(ranges.length).optional(),
  width: decimalField(ranges.length).optional(),
  /** Luminaire height above the floor; the ceiling height when absent. */
  luminaireHeight: decimalField(ranges.heightAboveFloor).optional(),
  /** Work plane above the floor; 2.5 ft when absent (common practice). */
  workPlaneHeight: decimalField(ranges.heightAboveFloor).optional(),
  enclosed: z.boolean().optional(),
  /**
   * How many like rooms this entry stands for (a space-by-space entry may group them); a size in
   * the space type's name applies to each room, so to the area divided by this. 1 when absent.
   */
  rooms: decimalField(ranges.rooms).optional(),
  /** The engineer confirms the space has no lighting; until then a space without luminaires is an open item, not a pass. */
  unlit: z.boolean().optional(),
  luminaires: z
    .array(luminaireGroupSchema)
    .max(documentLimits.luminaireGroupsPerSpace, listLimit(documentLimits.luminaireGroupsPerSpace, 'luminaire types in one space'))
    .default([]),
  controls: z
    .array(controlSchema)
    .max(documentLimits.controlsPerSpace, listLimit(documentLimits.controlsPerSpace, 'controls in one space'))
    .default([]),
  windows: z
    .array(windowSchema)
    .max(documentLimits.windowsPerSpace, listLimit(documentLimits.windowsPerSpace, 'windows in one space'))
    .default([]),
  skylights: z
    .array(skylightSchema)
    .max(documentLimits.skylightsPerSpace, listLimit(documentLimits.skylightsPerSpace, 'skylights in one space'))
    .default([]),
});

export const exteriorApplicationEntrySchema = fields({
  key,
  /** ft² (m²), linear ft (m) or a count, as the application's unit says. */
  quantity: decimalField(ranges.exteriorQuantity),
  installedWatts: decimalField(ranges.exteriorWatts),
  /** The part of installedWatts the code exempts from the exterior allowance (with its reason). */
  exemptWatts: decimalField(ranges.exteriorWatts).optional(),
  exemptReason: z.enum(exteriorExemptionReasons, { error: 'Choose the reason from the list.' }).optional(),
  exemptNote: note.optional(),
  controls: z
    .array(controlSchema)
    .max(documentLimits.controlsPerSpace, listLimit(documentLimits.controlsPerSpace, 'controls on one application'))
    .default([]),
});

export const exteriorSchema = fields({
  lightingZone: z
    .union([z.string().max(10, 'Give the lighting zone as a number from 0 to 4.'), z.number()])
    .transform((zone) => String(zone).trim()),
  applications: z
    .array(exteriorApplicationEntrySchema)
    .max(documentLimits.exteriorApplications, listLimit(documentLimits.exteriorApplications, 'exterior applications'))
    .default([]),
});

export const retailDisplaySchema = fields({
  claims: z
    .array(
      fields({
        /** An additional-allowance key of the edition (e.g. a retail area category). */
        allowance: key,
        spaceId: key,
        /** Qualifying sales floor area, ft² or m². */
        area: decimalField(ranges.area),
      }),
    )
    .max(documentLimits.retailClaims, listLimit(documentLimits.retailClaims, 'additional allowance claims'))
    .default([]),
});

export const evaluationDocumentSchema = fields({
  edition: key,
  method: z.enum(['building-area', 'space-by-space']),
  units: z.enum(['ip', 'si']),
  luminaireTypes: z
    .array(luminaireTypeSchema)
    .max(documentLimits.luminaireTypes, listLimit(documentLimits.luminaireTypes, 'luminaire types'))
    .default([]),
  spaces: z
    .array(spaceSchema)
    .min(1, 'At least one space is needed.')
    .max(documentLimits.spaces, listLimit(documentLimits.spaces, 'spaces in one project')),
  exterior: exteriorSchema.optional(),
  retailDisplay: retailDisplaySchema.optional(),
  /** Jurisdiction amendments of the edition to apply (their keys); the model code alone when absent. */
  amendments: distinctKeys(key, maxAmendments, 'amendments').default([]),
});

export type EvaluationDocumentInput = z.input<typeof evaluationDocumentSchema>;
export type EvaluationDocument = z.output<typeof evaluationDocumentSchema>;
export type LuminaireType = EvaluationDocument['luminaireTypes'][number];
export type Space = EvaluationDocument['spaces'][number];
export type ProvidedControl = Space['controls'][number];
export type WindowOpening = Space['windows'][number];
export type Skylight = Space['skylights'][number];
export type ExteriorApplicationEntry = NonNullable<EvaluationDocument['exterior']>['applications'][number];

export interface DocumentProblem {
  path: string;
  message: string;
}

export type ValidationOutcome = { valid: true; document: EvaluationDocument; problems: [] } | { valid: false; problems: DocumentProblem[] };

/**
 * Checks a document against the schema and against one edition's tables. Every problem comes
 * back with its path (`spaces.3.area`); a document is evaluated only when there are none.
 */
export function validateDocument(input: unknown, edition: EditionData): ValidationOutcome {
  const parsed = evaluationDocumentSchema.safeParse(input);
  const problems: DocumentProblem[] = parsed.success
    ? []
    : parsed.error.issues.map((issue) => ({ path: issue.path.join('.'), message: issue.message }));
  problems.push(...referenceProblems(input, edition));
  if (parsed.success) {
    problems.push(...geometryProblems(parsed.data), ...lpdFormulaProblems(parsed.data, edition));
  }
  const unique = dedupe(problems);
  return parsed.success && unique.length === 0
    ? { valid: true, document: parsed.data, problems: [] }
    : { valid: false, problems: listed(unique) };
}

/** A long list of problems is cut, with the rest counted, so an answer stays small whatever was sent. */
export function listed<Problem extends DocumentProblem>(problems: Problem[]): DocumentProblem[] {
  const max = documentLimits.problemsListed;
  if (problems.length <= max) return problems;
  return [...problems.slice(0, max), { path: '', message: `And ${problems.length - max} more problems not listed; fix these first.` }];
}

function dedupe(problems: DocumentProblem[]): DocumentProblem[] {
  const seen = new Set<string>();
  return problems.filter((problem) => {
    const id = `${problem.path}\u0000${problem.message}`;
    if (seen.has(id)) return false;
    seen.add(id);
    return true;
  });
}

type Loose = Record<string, unknown>;

function record(value: unknown): Loose {
  return typeof value === 'object' && value !== null && !Array.isArray(value) ? (value as Loose) : {};
}

/** The entries of a list, up to the most a document may hold (the schema reports a longer list). */
function list(value: unknown): Loose[] {
  return Array.isArray(value) ? value.slice(0, documentLimits.spaces).map(record) : [];
}

function word(value: unknown): string | undefined {
  return typeof value === 'string' && value.trim() !== '' ? value.trim() : undefined;
}

/** The space type of every edition whose lighting the retail display allowance is for. */
export const salesAreaSpaceType = 'sales-area';

/** A number that already passed the schema's bounds, or null (the schema reports the rest). */
function decimalOrNull(value: unknown): Dec | null {
  if (typeof value !== 'string' && typeof value !== 'number') return null;
  const checked = boundedDecimal(value, ranges.area);
  return checked.ok ? dec(checked.value) : null;
}

function present(value: unknown): boolean {
  return value !== undefined && value !== null && value !== '';
}

/**
 * Problems that need the edition's tables or cross-references inside the document. They read the
 * raw input tolerantly, so a document with schema problems still hears about these as well.
 */
function referenceProblems(input: unknown, edition: EditionData): DocumentProblem[] {
  const problems: DocumentProblem[] = [];
  const add = (path: string, message: string) => problems.push({ path, message });
  const doc = record(input);
  const method = doc['method'];

  const editionId = word(doc['edition']);
  if (editionId !== undefined && editionId !== edition.id) {
    add('edition', `The document names another code edition than ${edition.title}.`);
  }

  const spaceTypes = new Set(edition.spaceTypes.map((type) => type.key));
  const spaceTypesByKey = new Map(edition.spaceTypes.map((type) => [type.key, type]));
  const units = doc['units'] === 'si' ? 'si' : 'ip';
  const buildingAreaTypes = new Set(edition.buildingAreaTypes.map((type) => type.key));
  const strategies = new Set(edition.controlStrategies.map((strategy) => strategy.key));

  const tags = new Map<string, Loose>();
  list(doc['luminaireTypes']).forEach((type, index) => {
    const path = `luminaireTypes.${index}`;
    const tag = word(type['tag']);
    if (tag !== undefined) {
      if (tags.has(tag)) add(`${path}.tag`, `Tag "${tag}" is defined more than once.`);
      tags.set(tag, type);
    }
    if (type['use'] === 'exempt' && word(type['exemptReason']) === undefined) {
      add(`${path}.exemptReason`, 'Exempt lighting needs the reason it is exempt.');
    }
    const basis = type['basis'];
    if (basis === 'line-voltage-track' && !present(type['length']) && !present(type['limitWatts'])) {
      add(`${path}.length`, 'Line-voltage track needs its length, or the rating of its current limiter.');
    }
    if (basis === 'low-voltage-track' && !present(type['limitWatts'])) {
      add(`${path}.limitWatts`, 'Low-voltage track counts at its transformer rating: enter the rating.');
    }
    if (basis === 'current-limited' && !present(type['limitWatts'])) {
      add(`${path}.limitWatts`, 'A current-limited circuit counts at the limiter rating: enter the rating.');
    }
  });

  const spaceIds = new Set<string>();
  const spacesById = new Map<string, Loose>();
  list(doc['spaces']).forEach((space, index) => {
    const path = `spaces.${index}`;
    const id = word(space['id']);
    if (id !== undefined) {
      if (spaceIds.has(id)) add(`${path}.id`, `Space id "${id}" is used more than once.`);
      spaceIds.add(id);
      spacesById.set(id, space);
    }
    const spaceType = word(space['spaceType']);
    const areaType = word(space['buildingAreaType']);
    const controlType = word(space['controlSpaceType']);
    // A space keeps both its space type and its building area type, so switching the method loses
    // nothing; each method reads the one it needs.
    if (method === 'building-area' && areaType === undefined)
      add(`${path}.buildingAreaType`, 'The building area method needs a building area type for every space.');
    if (method === 'space-by-space') {
      if (spaceType === undefined) add(`${path}.spaceType`, 'The space-by-space method needs a space type for every space.');
      if (controlType !== undefined && controlType !== spaceType)
        add(
          `${path}.controlSpaceType`,
          'With the space-by-space method the space type sets the controls; leave the control space type out.',
        );
    }
    if (spaceType !== undefined && !spaceTypes.has(spaceType))
      add(`${path}.spaceType`, `${edition.title} has no space type “${spaceType}”.`);
    if (controlType !== undefined && !spaceTypes.has(controlType))
      add(`${path}.controlSpaceType`, `${edition.title} has no space type “${controlType}”.`);
    if (areaType !== undefined && !buildingAreaTypes.has(areaType))
      add(`${path}.buildingAreaType`, `${edition.title} has no building area type “${areaType}”.`);
    if (spaceType !== undefined && spaceTypes.has(spaceType))
      sizeProblem(edition, spaceTypesByKey.get(spaceType)!, space, units, `${path}.spaceType`, add);

    list(space['luminaires']).forEach((group, groupIndex) => {
      const tag = word(group['tag']);
      if (tag !== undefined && !tags.has(tag)) add(`${path}.luminaires.${groupIndex}.tag`, `No luminaire type has the tag "${tag}".`);
      if (tag !== undefined && group['zone'] !== undefined && record(tags.get(tag))['use'] !== 'general' && tags.has(tag)) {
        add(`${path}.luminaires.${groupIndex}.zone`, 'Only general lighting is assigned to a daylight zone.');
      }
    });
    controlProblems(space['controls'], `${path}.controls`, strategies, edition, add);
  });

  const exterior = doc['exterior'];
  if (exterior !== undefined) {
    const ext = record(exterior);
    const zone = ext['lightingZone'];
    const zones = new Set(edition.lightingZones.map((lightingZone) => String(lightingZone.zone)));
    const zoneText = present(zone) ? String(zone).trim() : '';
    if (zoneText === '') add('exterior.lightingZone', 'Choose the site’s exterior lighting zone.');
    else if (!zones.has(zoneText)) add('exterior.lightingZone', `${edition.title} has no lighting zone “${zoneText}”.`);
    else {
      // A zone whose every allowance is a placeholder would price the whole site at zero.
      const base = edition.exteriorApplications.find((application) => application.isBaseSiteAllowance);
      if (base?.unverifiedZones?.includes(zoneText) && dec(base.allowanceByZone[zoneText] ?? '0').isZero()) {
        add(
          'exterior.lightingZone',
          `${edition.title}’s allowances for lighting zone ${zoneText} were not found in a public source, so the site cannot be priced in that zone; check the zone, or enter the site under the zone the authority having jurisdiction assigns.`,
        );
      }
    }
    const applications = new Map(edition.exteriorApplications.map((application) => [application.key, application]));
    const seen = new Set<string>();
    list(ext['applications']).forEach((entry, index) => {
      const path = `exterior.applications.${index}`;
      const applicationKey = word(entry['key']);
      if (applicationKey === undefined) return;
      const application = applications.get(applicationKey);
      if (application === undefined) add(`${path}.key`, `${edition.title} has no exterior application “${applicationKey}”.`);
      else if (application.isBaseSiteAllowance)
        add(`${path}.key`, 'The base site allowance is added by the lighting zone; do not list it.');
      if (seen.has(applicationKey)) add(`${path}.key`, `Exterior application "${applicationKey}" is listed more than once.`);
      seen.add(applicationKey);
      for (const problem of exteriorExemptionProblems(entry, edition)) add(`${path}.${problem.path}`, problem.message);
      controlProblems(entry['controls'], `${path}.controls`, strategies, edition, add);
    });
  }

  const known = new Set((edition.amendments ?? []).map((amendment) => amendment.key));
  if (Array.isArray(doc['amendments'])) {
    (doc['amendments'] as unknown[]).forEach((amendment, index) => {
      if (typeof amendment === 'string' && !known.has(amendment))
        add(`amendments.${index}`, `${edition.title} has no jurisdiction amendment “${amendment}” here.`);
    });
  }

  const retail = doc['retailDisplay'];
  if (retail !== undefined) {
    const allowances = new Map(edition.additionalAllowances.map((allowance) => [allowance.key, allowance]));
    const claimedPairs = new Set<string>();
    list(record(retail)['claims']).forEach((claim, index) => {
      const path = `retailDisplay.claims.${index}`;
      if (method === 'building-area') add(path, 'Additional allowances are part of the space-by-space method.');
      const allowance = word(claim['allowance']);
      if (allowance !== undefined && !allowances.has(allowance))
        add(`${path}.allowance`, `${edition.title} has no additional allowance “${allowance}”.`);
      const spaceId = word(claim['spaceId']);
      if (spaceId !== undefined && !spaceIds.has(spaceId)) add(`${path}.spaceId`, `No space has the id "${spaceId}".`);
      const space = spaceId === undefined ? undefined : spacesById.get(spaceId);
      if (space !== undefined && method === 'space-by-space') {
        // The retail display allowance is for lighting on a sales floor (90.1 §9.6.2(b), IECC C405.3.2.2.1); the decorative one is for any space.
        if (allowances.get(allowance ?? '')?.kind === 'retail-display' && word(space['spaceType']) !== salesAreaSpaceType)
          add(`${path}.spaceId`, `“${word(space['name']) ?? spaceId}” is not a sales area; the display allowance is for sales floors.`);
        const claimArea = decimalOrNull(claim['area']);
        const spaceArea = decimalOrNull(space['area']);
        if (claimArea !== null && spaceArea !== null && claimArea.greaterThan(spaceArea))
          add(`${path}.area`, `The claimed area is larger than the space (${spaceArea.toFixed()}).`);
        const pair = `${spaceId}\u0000${allowance}`;
        if (claimedPairs.has(pair)) add(`${path}.allowance`, 'This allowance is already claimed for this space.');
        claimedPairs.add(pair);
      }
    });
  }
  return problems;
}

/**
 * A space type whose name carries a size (an enclosed office of at most 250 ft²) fits only spaces
 * of that size; the problem names the row of the same kind that fits, where there is one.
 */
function sizeProblem(
  edition: EditionData,
  type: SpaceType,
  space: Loose,
  units: 'ip' | 'si',
  path: string,
  add: (path: string, message: string) => void,
): void {
  const condition = sizeCondition(type.sourceLabel);
  // A row whose allowance grows with height checks the height itself (lpdFormulaProblems).
  if (condition === null || (condition.quantity === 'height' && type.lpdFormula !== undefined)) return;
  const raw = condition.quantity === 'area' ? space['area'] : space['ceilingHeight'];
  const value = decimalOrNull(raw);
  if (value === null) return;
  const rooms = condition.quantity === 'area' ? (decimalOrNull(space['rooms']) ?? dec(1)) : dec(1);
  const measured =
    condition.quantity === 'area' ? areaToSquareFeet(value, units).dividedBy(rooms.isZero() ? 1 : rooms) : lengthToFeet(value, units);
  if (satisfies(condition, measured)) return;
  const kind = type.sourceLabel.split('|')[0]!.trim();
  const fitting = edition.spaceTypes.find((other) => {
    if (other.key === type.key || other.sourceLabel.split('|')[0]!.trim() !== kind) return false;
    const otherCondition = sizeCondition(other.sourceLabel);
    return otherCondition !== null && otherCondition.quantity === condition.quantity && satisfies(otherCondition, measured);
  });
  const grouped = !rooms.equals(1);
  // The size in the project's units: ft² to 1 and ft to 0.1, or m² to 0.1 and m to 0.01.
  const size =
    condition.quantity === 'area'
      ? `${units === 'ip' ? `${measured.toDecimalPlaces(0).toFixed()} ft²` : areaWords(measured, units)}${grouped ? ' a room' : ''}`
      : `${units === 'ip' ? `${measured.toDecimalPlaces(1).toFixed()} ft` : lengthWords(measured, units)} high`;
  const hint = condition.quantity === 'area' && !grouped ? ' If this entry groups several rooms, give how many.' : '';
  add(
    path,
    `“${type.label}” is for spaces ${conditionWords(condition, units)}; this one is ${size}.${fitting ? ` Choose “${fitting.label}”.` : ''}${hint}`,
  );
}

function controlProblems(
  controls: unknown,
  path: string,
  strategies: Set<string>,
  edition: EditionData,
  add: (path: string, message: string) => void,
): void {
  const seen = new Set<string>();
  list(controls).forEach((control, index) => {
    const strategy = word(control['strategy']);
    if (strategy === undefined) return;
    if (!strategies.has(strategy)) add(`${path}.${index}.strategy`, `“${strategy}” is not a control of ${edition.title}.`);
    if (seen.has(strategy)) add(`${path}.${index}.strategy`, `This control is listed more than once.`);
    seen.add(strategy);
    for (const problem of exceptionProblems(control)) add(`${path}.${index}.${problem.path}`, problem.message);
  });
}

/**
 * The rules of an exterior application's exempt part, its fields' paths relative to the
 * application: exempt watts need a reason of the edition's list (as exempt interior lighting needs
 * its reason), a reason needs the watts it covers, and the exempt part is at most what is installed.
 * Every write of an application passes them.
 */
export function exteriorExemptionProblems(
  entry: Record<string, unknown>,
  edition: Pick<EditionData, 'family' | 'title'>,
): DocumentProblem[] {
  const problems: DocumentProblem[] = [];
  const exempt = exteriorWattsOrNull(entry['exemptWatts']);
  const installed = exteriorWattsOrNull(entry['installedWatts']);
  const reason = word(entry['exemptReason']);
  if (exempt !== null && exempt.greaterThan(0) && reason === undefined) {
    problems.push({ path: 'exemptReason', message: 'Exempt lighting needs the reason it is exempt: choose it from the list.' });
  }
  if (reason !== undefined && (exempt === null || exempt.isZero())) {
    problems.push({ path: 'exemptWatts', message: 'Give the watts of the exempt lighting, or clear the reason.' });
  }
  if (
    reason !== undefined &&
    (exteriorExemptionReasons as readonly string[]).includes(reason) &&
    !exteriorExemptions[edition.family].some((exemption) => exemption.reason === reason)
  ) {
    problems.push({ path: 'exemptReason', message: `${edition.title} does not list this exemption; choose another reason.` });
  }
  if (exempt !== null && installed !== null && exempt.greaterThan(installed)) {
    problems.push({ path: 'exemptWatts', message: 'The exempt watts are part of the installed watts, so they cannot be more.' });
  }
  return problems;
}

function exteriorWattsOrNull(value: unknown): Dec | null {
  if (typeof value !== 'string' && typeof value !== 'number') return null;
  const checked = boundedDecimal(value, ranges.exteriorWatts);
  return checked.ok ? dec(checked.value) : null;
}

/**
 * The rules of one control's exception claim, its fields' paths relative to the control: a note
 * where the reason needs one, continuous operation for the time switch only. Every write of a
 * control passes them, so no stored design fails the evaluation for them later.
 */
export function exceptionProblems(control: Record<string, unknown>): DocumentProblem[] {
  const problems: DocumentProblem[] = [];
  const reason = control['exceptionReason'];
  if ((reason === 'other' || reason === 'verified-not-required') && word(control['exceptionNote']) === undefined) {
    problems.push({
      path: 'exceptionNote',
      message: reason === 'other' ? 'Say which exception is claimed.' : 'Say where in the adopted code it was checked.',
    });
  }
  if (reason === 'continuous-operation' && word(control['strategy']) !== 'time-switch') {
    problems.push({ path: 'exceptionReason', message: 'Continuous operation frees lighting from the time switch only.' });
  }
  return problems;
}

/** Geometry that must fit the room: openings inside their walls and ceiling, heights in order. */
function geometryProblems(doc: EvaluationDocument): DocumentProblem[] {
  const problems: DocumentProblem[] = [];
  doc.spaces.forEach((space, index) => {
    const path = `spaces.${index}`;
    const hasOpenings = space.windows.length > 0 || space.skylights.length > 0;
    if (hasOpenings && (space.length === undefined || space.width === undefined)) {
      if (space.length === undefined) problems.push({ path: `${path}.length`, message: 'Daylight zones need the room length.' });
      if (space.width === undefined) problems.push({ path: `${path}.width`, message: 'Daylight zones need the room width.' });
    }
    if (space.skylights.length > 0 && space.ceilingHeight === undefined) {
      problems.push({ path: `${path}.ceilingHeight`, message: 'Toplit zones need the ceiling height.' });
    }
    const length = space.length === undefined ? undefined : dec(space.length);
    const width = space.width === undefined ? undefined : dec(space.width);
    space.windows.forEach((window, windowIndex) => {
      const windowPath = `${path}.windows.${windowIndex}`;
      if (window.sillHeight !== undefined && dec(window.sillHeight).greaterThanOrEqualTo(dec(window.headHeight))) {
        problems.push({ path: `${windowPath}.sillHeight`, message: 'The sill must be below the head of the window.' });
      }
      const wallLength = window.wall === 'north' || window.wall === 'south' ? length : width;
      if (wallLength !== undefined) {
        const end = dec(window.offset ?? '0').plus(dec(window.width));
        if (end.greaterThan(wallLength)) {
          problems.push({
            path: `${windowPath}.${window.offset === undefined ? 'width' : 'offset'}`,
            message: 'The window runs past the end of its wall.',
          });
        }
      }
    });
    space.skylights.forEach((skylight, skylightIndex) => {
      const skylightPath = `${path}.skylights.${skylightIndex}`;
      if (
        length !== undefined &&
        dec(skylight.x ?? '0')
          .plus(dec(skylight.length))
          .greaterThan(length)
      ) {
        problems.push({ path: `${skylightPath}.x`, message: 'The skylight runs past the room along its length.' });
      }
      if (
        width !== undefined &&
        dec(skylight.y ?? '0')
          .plus(dec(skylight.width))
          .greaterThan(width)
      ) {
        problems.push({ path: `${skylightPath}.y`, message: 'The skylight runs past the room along its width.' });
      }
    });
    if (
      space.luminaireHeight !== undefined &&
      space.ceilingHeight !== undefined &&
      dec(space.luminaireHeight).greaterThan(dec(space.ceilingHeight))
    ) {
      problems.push({ path: `${path}.luminaireHeight`, message: 'Luminaires cannot be above the ceiling.' });
    }
    // A room's floor area cannot exceed the rectangle that holds it (2 % for rounding the dimensions).
    if (length !== undefined && width !== undefined && dec(space.area).greaterThan(length.times(width).times('1.02'))) {
      problems.push({
        path: `${path}.area`,
        message: `The floor area is larger than the room’s length × width (${length.times(width).toDecimalPlaces(2).toFixed()}); check the area or the dimensions.`,
      });
    }
    if (space.ceilingHeight !== undefined) {
      space.windows.forEach((window, windowIndex) => {
        if (dec(window.headHeight).greaterThan(dec(space.ceilingHeight!))) {
          problems.push({ path: `${path}.windows.${windowIndex}.headHeight`, message: 'The window head is above the ceiling.' });
        }
      });
    }
  });
  return problems;
}
