import { type DaylightTrigger, type SpaceControlFacts, interiorRequirements, linesComply, openLines, resolveControls } from './controls.js';
import type { EvaluationDocument, Space } from './document.js';
import { type Citation, citationOf, editionName } from './citation.js';
import type { EditionData, Provenance, SpaceType } from './edition-data.js';
import { amendedEdition } from './amendments.js';
import { evaluateExterior } from './exterior.js';
import { exteriorExemptionsNote } from '../../../contract/editions.js';
import { skylightVerdict, windowAreaFt2, windowVerdict } from './daylight-openings.js';
import { type RoomPlan, type ZoneRectangle, daylightAreas, rectangularRoomCavityRatio } from './geometry.js';
import { unitWattage } from './installed.js';
import { spaceTypeLpd } from './lpd-formula.js';
import { type Dec, ZERO, dec, min, reported, sum, text } from './numbers.js';
import type {
  AdditionalAllowanceResult,
  ControlLine,
  DaylightResult,
  EvaluationResult,
  ExemptLine,
  LevelResult,
  LuminaireLine,
  SpaceResult,
  UnverifiedValue,
} from './result.js';
import {
  type UnitSystem,
  areaFromSquareFeet,
  areaToSquareFeet,
  areaWords,
  densityFromPerSquareFoot,
  lengthFromFeet,
  lengthToFeet,
} from './units.js';

/** The edition section keys the engine cites from `EditionData.sections` (as `reference/<edition>/rules.json` names them). */
export const sectionKeys = [
  'buildingAreaMethod',
  'spaceBySpaceMethod',
  'installedPower',
  'trackLighting',
  'exemptLighting',
  'roomGeometry',
  'additionalAllowances',
  'controlsGeneral',
  'daylightSidelighting',
  'daylightToplighting',
  'exteriorAllowance',
] as const;

/** Work plane above the floor where the document gives none: 2.5 ft (common practice). */
export const defaultWorkPlaneFt = dec('2.5');

export const standingCautions = [
  'This evaluation covers energy-code compliance only: it does not check life safety, emergency or egress lighting.',
  'Local amendments and the authority having jurisdiction govern; check the adopted edition and any amendments.',
  'The engineer of record verifies every value flagged as unverified before relying on the result.',
];

/**
 * The values an evaluation used that are not checked against a published source, each once, cited
 * for people (the code tables' citation, or one made here for data built by hand).
 */
class Unverified {
  private readonly seen = new Map<string, UnverifiedValue>();
  constructor(private readonly edition: string) {}

  /** `reference` is the table or section to cite when the provenance carries no citation of its own. */
  add(what: string, provenance: Provenance, reference: string): void {
    if (provenance.verified || this.seen.has(what)) return;
    this.keep(what, provenance.citation ?? citationOf({ edition: this.edition, reference, ...provenance }));
  }

  /** A value the data cannot settle at all: not yet checked, with the reason in words. */
  unsettled(what: string, reference: string, reason: string, key = what): void {
    if (this.seen.has(key)) return;
    this.keep(
      what,
      citationOf({ edition: this.edition, reference, source: 'not found', confidence: 'none', verified: false, note: reason }),
      key,
    );
  }

  merge(values: readonly UnverifiedValue[]): void {
    for (const value of values) if (!this.seen.has(value.id)) this.seen.set(value.id, value);
  }

  values(): UnverifiedValue[] {
    return [...this.seen.values()];
  }

  ids(): string[] {
    return [...this.seen.keys()];
  }

  private keep(what: string, citation: Citation, key = what): void {
    this.seen.set(key, { id: key, what, source: citation.short, note: citation.note ?? citation.short, citation });
  }
}

interface ClaimLine {
  claimed: Dec;
  section: string;
  usable: Dec;
  limitedBy: string | null;
}

/**
 * The part of a space's claims of one kind its own luminaires of that kind use: the smaller of
 * the claims and those luminaires' watts, shared out to the claims in their order. Each claim
 * keeps its usable part and, where less than the claim, why.
 */
function usedBy(lines: ClaimLine[], luminaireWatts: Dec, use: 'display' | 'decorative', editionTitle: string): Dec {
  let left = luminaireWatts;
  for (const line of lines) {
    line.usable = min(line.claimed, left);
    left = left.minus(line.usable);
    if (line.usable.lessThan(line.claimed)) {
      const lost = `it cannot be traded to other lighting (${editionTitle} §${line.section})`;
      line.limitedBy = line.usable.isZero()
        ? `The space has no ${use} luminaires left to use this allowance, so none of it is counted: ${lost}.`
        : `Only ${reported.watts(line.usable)} W of it is used by the space’s ${use} luminaires; the rest is lost: ${lost}.`;
    }
  }
  return sum(lines.map((line) => line.usable));
}

function comparesAt(value: Dec, threshold: Dec, comparison: 'at-least' | 'more-than'): boolean {
  return comparison === 'at-least' ? value.greaterThanOrEqualTo(threshold) : value.greaterThan(threshold);
}

function percent(part: Dec, whole: Dec): string | null {
  return whole.isZero() ? null : reported.percent(part.dividedBy(whole).times(100));
}

interface SpaceWatts {
  lines: LuminaireLine[];
  exempt: ExemptLine[];
  general: Dec;
  decorative: Dec;
  display: Dec;
  exemptW: Dec;
  zoneW: { 'primary-sidelit': Dec; 'secondary-sidelit': Dec; toplit: Dec };
}

function spaceWatts(space: Space, document: EvaluationDocument, edition: EditionData, unverified: Unverified): SpaceWatts {
  const types = new Map(document.luminaireTypes.map((type) => [type.tag, type]));
  const installedSection = edition.sections['installedPower'] ?? '';
  const result: SpaceWatts = {
    lines: [],
    exempt: [],
    general: ZERO,
    decorative: ZERO,
    display: ZERO,
    exemptW: ZERO,
    zoneW: { 'primary-sidelit': ZERO, 'secondary-sidelit': ZERO, toplit: ZERO },
  };
  for (const group of space.luminaires) {
    const type = types.get(group.tag)!;
    const wattage = unitWattage(type, edition.rules, document.units);
    if (wattage.usesTrackRule && type.basis === 'line-voltage-track')
      unverified.add(
        'Line-voltage track: the least wattage counted per length of track',
        edition.rules.trackProvenance,
        edition.sections['trackLighting'] ?? installedSection,
      );
    if (wattage.fromMemory) {
      unverified.unsettled(
        'Low-voltage track counted at the transformer rating',
        edition.sections['trackLighting'] ?? installedSection,
        'No public source found for the low-voltage track rule; verify against the printed standard.',
      );
    }
    const count = dec(group.count);
    const watts = count.times(wattage.watts);
    const section = wattage.usesTrackRule ? (edition.sections['trackLighting'] ?? installedSection) : installedSection;
    const line: LuminaireLine = {
      tag: type.tag,
      use: type.use,
      count: text(count),
      unitWatts: reported.watts(wattage.watts),
      watts: reported.watts(watts),
      basis: wattage.basis,
      section,
    };
    if (group.zone !== undefined) line.zone = group.zone;
    result.lines.push(line);
    if (type.use === 'exempt') {
      result.exemptW = result.exemptW.plus(watts);
      result.exempt.push({
        tag: type.tag,
        count: text(count),
        watts: reported.watts(watts),
        reason: type.exemptReason ?? '',
        section: edition.sections['exemptLighting'] ?? '',
      });
    } else if (type.use === 'decorative') {
      result.decorative = result.decorative.plus(watts);
    } else if (type.use === 'display') {
      result.display = result.display.plus(watts);
    } else {
      result.general = result.general.plus(watts);
      if (group.zone !== undefined) result.zoneW[group.zone] = result.zoneW[group.zone].plus(watts);
    }
  }
  return result;
}

interface DaylightOutcome {
  result: DaylightResult;
  sidelighting: DaylightTrigger;
  toplighting: DaylightTrigger;
}

function daylight(
  space: Space,
  watts: SpaceWatts,
  edition: EditionData,
  units: UnitSystem,
  unverified: Unverified,
  cautions: string[],
): DaylightOutcome {
  const rules = edition.rules.daylight;
  const openingRules = rules.openings ?? {};
  const feet = (value: string | undefined) => (value === undefined ? undefined : lengthToFeet(dec(value), units));
  const length = feet(space.length);
  const width = feet(space.width);
  const hasOpenings = space.windows.length > 0 || space.skylights.length > 0;
  if (hasOpenings)
    unverified.add('Daylight thresholds and zone geometry', rules.provenance, edition.sections['daylightSidelighting'] ?? '');
  const geometryEvaluated = length !== undefined && width !== undefined;
  let plan: RoomPlan | undefined;
  if (geometryEvaluated && hasOpenings) {
    plan = {
      length,
      width,
      windows: space.windows.map((window) => {
        const opening: RoomPlan['windows'][number] = {
          width: feet(window.width)!,
          headHeight: feet(window.headHeight)!,
          wall: window.wall,
        };
        if (window.offset !== undefined) opening.offset = feet(window.offset)!;
        return opening;
      }),
      skylights: space.skylights.map((skylight) => {
        const opening: RoomPlan['skylights'][number] = { length: feet(skylight.length)!, width: feet(skylight.width)! };
        if (skylight.x !== undefined) opening.x = feet(skylight.x)!;
        if (skylight.y !== undefined) opening.y = feet(skylight.y)!;
        return opening;
      }),
    };
    if (space.ceilingHeight !== undefined) plan.ceilingHeight = feet(space.ceilingHeight)!;
  }
  // Without a sill the glazing is counted from the floor: the larger area never clears a requirement.
  if (space.windows.some((window) => window.sillHeight === undefined)) {
    unverified.unsettled(
      'Window sill height',
      'common practice',
      'No sill height given for some windows: their area is counted from the floor.',
    );
  }
  const windowArea = sum(space.windows.map((window) => windowAreaFt2(window, units)));
  const roomArea = length !== undefined && width !== undefined ? length.times(width) : ZERO;
  const at = (threshold: string) => (rules.comparison === 'at-least' ? `${threshold} W or more` : `more than ${threshold} W`);
  const watt = (value: Dec) => `${value.toDecimalPlaces(1).toFixed()} W`;
  const windowException = rules.minimumWindowAreaFt2 !== null && windowArea.lessThan(dec(rules.minimumWindowAreaFt2));

  /**
   * The daylight areas and triggers with each blank glazing value read one way: as making its zone
   * (the reading shown) or as excepting it. The glazing rules take away the zones of the openings
   * they except; a zone kind that every opening of its sort has lost carries no watts, even ones
   * assigned to it.
   */
  const reading = (windowBlanksExcept: boolean, skylightBlanksExcept: boolean) => {
    const windows = space.windows.map((window, index) => windowVerdict(window, index, openingRules, units, windowBlanksExcept));
    const skylights = space.skylights.map((skylight, index) => skylightVerdict(skylight, index, openingRules, skylightBlanksExcept));
    const keep = (rectangle: ZoneRectangle): boolean => {
      const [sort, position] = rectangle.source.split('.');
      const verdict = (sort === 'windows' ? windows : skylights)[Number(position)];
      if (verdict === undefined || verdict.excludes === 'none') return true;
      return verdict.excludes === 'primary' ? rectangle.kind !== 'primary-sidelit' : false;
    };
    const areas = plan
      ? daylightAreas(plan, rules, keep)
      : { primarySidelit: ZERO, secondarySidelit: ZERO, toplit: ZERO, rectangles: [] as ZoneRectangle[] };
    const gone = {
      'primary-sidelit': windows.length > 0 && windows.every((verdict) => verdict.excludes !== 'none'),
      'secondary-sidelit': windows.length > 0 && windows.every((verdict) => verdict.excludes === 'all'),
      toplit: skylights.length > 0 && skylights.every((verdict) => verdict.excludes === 'all'),
    };
    const zoneAreas = {
      'primary-sidelit': areas.primarySidelit,
      'secondary-sidelit': areas.secondarySidelit,
      toplit: areas.toplit,
    } as const;
    const assignedW = (kind: keyof typeof zoneAreas) => (gone[kind] ? ZERO : watts.zoneW[kind]);
    const assigned = watts.zoneW['primary-sidelit'].plus(watts.zoneW['secondary-sidelit']).plus(watts.zoneW.toplit);
    // With zones on the plan, general lighting and none of it assigned to a zone, the zone watts are
    // estimated from each zone's share of the floor; an estimate can make a control required, but
    // below the threshold it leaves the question open rather than passing it.
    const estimated =
      assigned.isZero() && watts.general.greaterThan(0) && roomArea.greaterThan(0) && sum(Object.values(zoneAreas)).greaterThan(0);
    const zoneWatts = (kind: keyof typeof zoneAreas): Dec =>
      estimated ? min(watts.general, watts.general.times(zoneAreas[kind]).dividedBy(roomArea)) : assignedW(kind);
    const primaryW = zoneWatts('primary-sidelit');
    const secondaryW = zoneWatts('secondary-sidelit');
    const toplitW = zoneWatts('toplit');
    const primaryTriggers = comparesAt(primaryW, dec(rules.primarySidelitThresholdW), rules.comparison);
    const combined = primaryW.plus(secondaryW);
    const combinedTriggers =
      rules.combinedSidelitThresholdW !== null && comparesAt(combined, dec(rules.combinedSidelitThresholdW), rules.comparison);
    // 90.1 §9.4.1.1(e): the primary area alone at 150 W, or primary and secondary together at 300 W; the
    // edition data says which thresholds apply (IECC's sidelit zones count together).
    const sidelightingRequired = (primaryTriggers || combinedTriggers) && !windowException;
    return {
      windows,
      skylights,
      areas,
      zoneAreas,
      estimated,
      primaryW,
      secondaryW,
      toplitW,
      combined,
      primaryTriggers,
      combinedTriggers,
      sidelightingRequired,
      secondaryRequired: combinedTriggers && !windowException,
      toplightingRequired: comparesAt(toplitW, dec(rules.toplitThresholdW), rules.comparison),
    };
  };

  const shown = reading(false, false);
  const { areas, zoneAreas, estimated, primaryW, secondaryW, toplitW, combined } = shown;
  const estimateWords = estimated
    ? ' (estimated from the zone’s share of the floor area: no luminaires are assigned to daylight zones)'
    : '';
  const sidelitThresholds = [`primary sidelit general lighting ${watt(primaryW)}, required at ${at(rules.primarySidelitThresholdW)}`];
  if (rules.combinedSidelitThresholdW !== null)
    sidelitThresholds.push(`primary and secondary together ${watt(combined)}, required at ${at(rules.combinedSidelitThresholdW)}`);
  let sidelighting = `${sidelitThresholds.join('; ')}${estimateWords}`;
  if (windowException && (shown.primaryTriggers || shown.combinedTriggers)) {
    sidelighting += `; but the window area of ${areaWords(windowArea, units)} is below ${areaWords(dec(rules.minimumWindowAreaFt2!), units)}`;
  }
  const windowWords = shown.windows.flatMap((verdict) => verdict.words);
  if (windowWords.length > 0) sidelighting += `; ${windowWords.join('; ')}`;
  let toplighting = `toplit general lighting ${watt(toplitW)}, required at ${at(rules.toplitThresholdW)}${estimateWords}`;
  const skylightWords = shown.skylights.flatMap((verdict) => verdict.words);
  if (skylightWords.length > 0) toplighting += `; ${skylightWords.join('; ')}`;
  for (const verdict of [...shown.windows, ...shown.skylights]) {
    for (const { what, rule } of verdict.applied) unverified.add(what, rule.provenance, rule.section);
  }

  // A blank glazing value holds a control open only where reading it the other way changes the answer.
  const windowBlanks = shown.windows.flatMap((verdict) => verdict.blanks);
  const skylightBlanks = shown.skylights.flatMap((verdict) => verdict.blanks);
  const others = [
    ...(windowBlanks.length > 0 ? [{ reading: reading(true, false), blanks: windowBlanks }] : []),
    ...(skylightBlanks.length > 0 ? [{ reading: reading(false, true), blanks: skylightBlanks }] : []),
    ...(windowBlanks.length > 0 && skylightBlanks.length > 0
      ? [{ reading: reading(true, true), blanks: [...windowBlanks, ...skylightBlanks] }]
      : []),
  ];
  const deciding = (required: (outcome: typeof shown) => boolean): string[] => [
    ...new Set(others.filter((other) => required(other.reading) !== required(shown)).flatMap((other) => other.blanks)),
  ];
  const trigger = (required: boolean, why: string, hasZone: boolean, blanks: string[]): DaylightTrigger => {
    if (blanks.length > 0) {
      const answer = required ? 'required as entered' : 'not required as entered';
      return { requirement: 'to-verify', why: `${why}; ${answer}, but ${blanks.join('; and ')}, and that decides it` };
    }
    if (required) return { requirement: 'required', why };
    if (estimated && hasZone) return { requirement: 'to-verify', why: `${why}; assign the luminaires in the zone to settle it` };
    return { requirement: 'not-required', why };
  };
  const sidelitBlanks = deciding((outcome) => outcome.sidelightingRequired);
  const toplitBlanks = deciding((outcome) => outcome.toplightingRequired);
  const sidelightingTrigger = trigger(
    shown.sidelightingRequired,
    sidelighting,
    zoneAreas['primary-sidelit'].plus(zoneAreas['secondary-sidelit']).greaterThan(0),
    sidelitBlanks,
  );
  const toplightingTrigger = trigger(shown.toplightingRequired, toplighting, zoneAreas.toplit.greaterThan(0), toplitBlanks);

  const reasons: string[] = [`Sidelighting: ${sidelighting}.`];
  if (shown.secondaryRequired)
    reasons.push('Secondary sidelighting: the secondary sidelit zone is controlled separately from the primary.');
  if (sidelitBlanks.length > 0) reasons.push(`Sidelighting, to verify: ${sidelitBlanks.join('; and ')}.`);
  reasons.push(`Toplighting: ${toplighting}.`);
  if (toplitBlanks.length > 0) reasons.push(`Toplighting, to verify: ${toplitBlanks.join('; and ')}.`);
  for (const kind of ['primary-sidelit', 'secondary-sidelit', 'toplit'] as const) {
    if (watts.zoneW[kind].greaterThan(0) && zoneAreas[kind].isZero()) {
      cautions.push(
        `“${space.name}”: luminaires are assigned to the ${kind.replace('-', ' ')} zone, but the room's openings give no such zone.`,
      );
    }
  }
  const out = (value: Dec) => reported.length(lengthFromFeet(value, units));
  const result: DaylightResult = {
    geometryEvaluated: geometryEvaluated && hasOpenings,
    windowArea: reported.area(areaFromSquareFeet(windowArea, units)),
    primarySidelitArea: reported.area(areaFromSquareFeet(areas.primarySidelit, units)),
    secondarySidelitArea: reported.area(areaFromSquareFeet(areas.secondarySidelit, units)),
    toplitArea: reported.area(areaFromSquareFeet(areas.toplit, units)),
    primarySidelitW: reported.watts(primaryW),
    secondarySidelitW: reported.watts(secondaryW),
    toplitW: reported.watts(toplitW),
    sidelightingControlRequired: shown.sidelightingRequired,
    secondarySidelightingControlRequired: shown.secondaryRequired,
    toplightingControlRequired: shown.toplightingRequired,
    reasons,
    zones: areas.rectangles.map((rectangle) => ({
      kind: rectangle.kind,
      source: rectangle.source,
      x: out(rectangle.x0),
      y: out(rectangle.y0),
      length: out(rectangle.x1.minus(rectangle.x0)),
      width: out(rectangle.y1.minus(rectangle.y0)),
    })),
    section: [...new Set([edition.sections['daylightSidelighting'], edition.sections['daylightToplighting']])].filter(Boolean).join('; '),
  };
  return { result, sidelighting: sidelightingTrigger, toplighting: toplightingTrigger };
}

/** The room cavity ratio of a rectangular room, or null where the geometry is not given. */
function spaceRcr(space: Space, units: UnitSystem, cautions: string[], unverified: Unverified): Dec | null {
  if (space.length === undefined || space.width === undefined) return null;
  const mounting = space.luminaireHeight ?? space.ceilingHeight;
  if (mounting === undefined) return null;
  const workPlane = space.workPlaneHeight === undefined ? defaultWorkPlaneFt : lengthToFeet(dec(space.workPlaneHeight), units);
  if (space.workPlaneHeight === undefined)
    unverified.unsettled(
      'Work plane height',
      'common practice',
      `No work plane height given for some spaces: ${defaultWorkPlaneFt.toFixed()} ft (0.762 m) above the floor is assumed for the room cavity ratio.`,
    );
  const cavity = lengthToFeet(dec(mounting), units).minus(workPlane);
  if (cavity.lessThanOrEqualTo(0)) {
    cautions.push(`“${space.name}”: luminaires are not above the work plane, so no room cavity ratio is computed.`);
    return null;
  }
  return rectangularRoomCavityRatio(cavity, lengthToFeet(dec(space.length), units), lengthToFeet(dec(space.width), units));
}

/**
 * Evaluates a document that `validateDocument` accepted against one edition's tables. Pure: it
 * reads nothing but its arguments.
 */
export function evaluate(document: EvaluationDocument, modelCode: EditionData): EvaluationResult {
  const edition = amendedEdition(modelCode, document.amendments);
  const units = document.units;
  const name = editionName(edition.family, edition.year);
  const unverified = new Unverified(name);
  const cautions: string[] = [...standingCautions];
  const spaceTypes = new Map(edition.spaceTypes.map((type) => [type.key, type]));
  const areaTypes = new Map(edition.buildingAreaTypes.map((type) => [type.key, type]));
  const spaceBySpace = document.method === 'space-by-space';
  const allowanceSection = edition.sections[spaceBySpace ? 'spaceBySpaceMethod' : 'buildingAreaMethod'] ?? '';

  // Additional allowances (space-by-space only): what each space claims, capped later by the watts of its own luminaires of that kind.
  const additionalCatalogue = new Map(edition.additionalAllowances.map((allowance) => [allowance.key, allowance]));
  const claims = document.retailDisplay?.claims ?? [];
  const claimLines = claims.map((claim) => {
    const allowance = additionalCatalogue.get(claim.allowance)!;
    const section = allowance.section ?? edition.sections['additionalAllowances'] ?? '';
    unverified.add(`Additional allowance: ${allowance.label}`, allowance.provenance, section);
    const areaFt2 = areaToSquareFeet(dec(claim.area), units);
    return { claim, allowance, section, claimed: dec(allowance.lpdWPerFt2).times(areaFt2), usable: ZERO, limitedBy: null as string | null };
  });

  const spaces: (SpaceResult & {
    allowance: Dec;
    installed: Dec;
    areaFt2: Dec;
    uncoveredDisplay: Dec;
    exact: { exempt: Dec; decorative: Dec; display: Dec; additional: Dec };
  })[] = document.spaces.map((space) => {
    const spaceUnverified = new Unverified(name);
    const areaFt2 = areaToSquareFeet(dec(space.area), units);
    const watts = spaceWatts(space, document, edition, spaceUnverified);
    let baseLpd: Dec;
    let lpdBasis: SpaceResult['lpdBasis'];
    let controlType: SpaceType | undefined;
    if (spaceBySpace) {
      const type = spaceTypes.get(space.spaceType!)!;
      spaceUnverified.add(`Space type LPD: ${type.label}`, type.provenance, allowanceSection);
      baseLpd = spaceTypeLpd(type, space, units);
      lpdBasis = { kind: 'space-type', key: type.key, label: type.label };
      controlType = type;
    } else {
      const type = areaTypes.get(space.buildingAreaType!)!;
      spaceUnverified.add(`Building area type LPD: ${type.label}`, type.provenance, allowanceSection);
      baseLpd = dec(type.lpdWPerFt2);
      lpdBasis = { kind: 'building-area-type', key: type.key, label: type.label };
      const controlKey = space.controlSpaceType ?? space.spaceType;
      controlType = controlKey === undefined ? undefined : spaceTypes.get(controlKey);
    }

    const rcr = spaceRcr(space, units, cautions, spaceUnverified);
    if (
      space.length !== undefined &&
      space.width !== undefined &&
      dec(space.area).lessThan(dec(space.length).times(dec(space.width)).times('0.5'))
    ) {
      cautions.push(
        `“${space.name}”: the floor area is less than half of its length × width; daylight zones and the room cavity ratio are worked out on the rectangle.`,
      );
    }
    let allowedLpd = baseLpd;
    let roomGeometryIncreaseApplied = false;
    const geometryRule = edition.rules.roomGeometry;
    if (spaceBySpace && geometryRule !== null && controlType !== undefined) {
      if (controlType.rcrThreshold !== null && rcr !== null && rcr.greaterThanOrEqualTo(dec(controlType.rcrThreshold))) {
        allowedLpd = baseLpd.times(dec(1).plus(dec(geometryRule.increasePercent).dividedBy(100)));
        roomGeometryIncreaseApplied = true;
        spaceUnverified.add(
          `Room-geometry increase of ${geometryRule.increasePercent} %`,
          geometryRule.provenance,
          edition.sections['roomGeometry'] ?? '',
        );
      } else if (controlType.rcrThreshold === null && controlType.rcrCondition !== undefined) {
        // Corridors carry "width < 8 ft" in the RCR column: a narrow corridor gets the increase.
        const narrower = /width\s*<\s*(\d+(?:\.\d+)?)\s*ft/i.exec(controlType.rcrCondition);
        const shorterSide =
          space.length !== undefined && space.width !== undefined ? lengthToFeet(min(dec(space.length), dec(space.width)), units) : null;
        if (narrower && shorterSide !== null) {
          if (shorterSide.lessThan(dec(narrower[1]!))) {
            allowedLpd = baseLpd.times(dec(1).plus(dec(geometryRule.increasePercent).dividedBy(100)));
            roomGeometryIncreaseApplied = true;
            spaceUnverified.add(
              `Room-geometry increase of ${geometryRule.increasePercent} %`,
              geometryRule.provenance,
              edition.sections['roomGeometry'] ?? '',
            );
          }
        } else if (narrower) {
          cautions.push(
            `“${space.name}”: a corridor narrower than ${narrower[1]} ft gets the room-geometry increase; give its length and width to have it applied.`,
          );
        } else {
          cautions.push(
            `“${space.name}”: the room-geometry condition "${controlType.rcrCondition}" is stated in words and was not applied.`,
          );
        }
      }
    }

    // A space without luminaires is either not entered yet (the verdict waits for it) or confirmed unlit
    // (no lighted floor area, so no allowance to lend to the other spaces).
    const hasLuminaires = watts.lines.some((line) => dec(line.count).greaterThan(0));
    const lighting: SpaceResult['lighting'] = hasLuminaires ? 'entered' : space.unlit === true ? 'unlit' : 'none-entered';
    if (lighting === 'none-entered') {
      cautions.push(
        `“${space.name}” has no luminaires entered: enter them, or confirm the space is unlit. Until then there is no verdict.`,
      );
    }
    const own = claimLines.filter((line) => line.claim.spaceId === space.id);
    const retailOwn = own.filter((line) => line.allowance.kind === 'retail-display');
    const decorativeOwn = own.filter((line) => line.allowance.kind === 'decorative');
    // Each additional allowance is usable only by the space's own luminaires it is for, so what they
    // do not use is lost, never traded to the space's other lighting or to other spaces
    // (90.1 §9.6.2, from memory: the added power serves only the luminaires it is granted for).
    const retailUsable = usedBy(retailOwn, watts.display, 'display', name);
    const decorativeUsable = usedBy(decorativeOwn, watts.decorative, 'decorative', name);
    const additional = retailUsable.plus(decorativeUsable);
    const allowance = allowedLpd.times(areaFt2).plus(additional);
    const installed = watts.general.plus(watts.decorative).plus(watts.display);
    const margin = allowance.minus(installed);

    const { result: daylightOut, sidelighting, toplighting } = daylight(space, watts, edition, units, spaceUnverified, cautions);
    const facts: SpaceControlFacts = {
      spaceType: controlType,
      areaFt2,
      units,
      enclosed: space.enclosed,
      sidelighting,
      secondarySidelightingRequired: daylightOut.secondarySidelightingControlRequired,
      toplighting,
      decorativeW: watts.decorative,
      displayW: watts.display,
      installedW: installed,
      nonExemptLuminaires: watts.lines
        .filter((line) => line.use !== 'exempt')
        .map((line) => ({ count: dec(line.count), unitWatts: dec(line.unitWatts) })),
      provided: space.controls,
    };
    let controls: ControlLine[] = resolveControls(
      interiorRequirements(edition, facts),
      space.controls,
      edition,
      controlType,
      units,
      areaFt2,
    );
    if (controlType === undefined && edition.family === 'ashrae-90.1') {
      controls = [
        {
          strategy: 'control-space-type',
          label: 'Control space type',
          requirement: 'to-verify',
          met: null,
          status: 'to-verify',
          reason: 'No control space type is given, so the space type control requirements cannot be applied.',
          section: edition.sections['controlsGeneral'] ?? '',
          verified: false,
        },
        ...controls,
      ];
    }
    // Controls govern lighting: a space confirmed unlit needs none. (An empty one keeps its lines: they say what its lighting will need.)
    if (lighting === 'unlit') {
      controls = controls.map((line) => ({
        ...line,
        met: null,
        status: 'not-required',
        reason: 'Not required: the space is confirmed unlit.',
      }));
    }
    for (const line of controls) {
      const strategy = edition.controlStrategies.find((candidate) => candidate.key === line.strategy);
      // A "not required" can rest on an unverified threshold just as a requirement can.
      if (strategy) spaceUnverified.add(`Control strategy: ${strategy.label}`, strategy.provenance, strategy.section);
      // People know a space by its name; the id only keeps two spaces of the same name apart.
      if (line.status === 'to-verify')
        spaceUnverified.unsettled(`${space.name}: ${line.label}`, line.section, line.reason, `${space.id}/${line.strategy}`);
    }
    unverified.merge(spaceUnverified.values());

    return {
      id: space.id,
      name: space.name,
      level: space.level ?? null,
      area: space.area,
      lpdBasis,
      allowanceW: reported.watts(allowance),
      additionalAllowanceW: reported.watts(additional),
      installedW: reported.watts(installed),
      generalW: reported.watts(watts.general),
      decorativeW: reported.watts(watts.decorative),
      displayW: reported.watts(watts.display),
      exemptW: reported.watts(watts.exemptW),
      allowedLpd: reported.density(densityFromPerSquareFoot(allowedLpd, units)),
      installedLpd: reported.density(densityFromPerSquareFoot(installed.dividedBy(areaFt2), units)),
      withinAllowance: installed.lessThanOrEqualTo(allowance),
      marginW: reported.watts(margin),
      marginPct: percent(margin, allowance),
      lighting,
      rcr: rcr === null ? null : reported.ratio(rcr),
      roomGeometryIncreaseApplied,
      luminaires: watts.lines,
      daylight: daylightOut,
      controls,
      exempt: watts.exempt,
      unverified: spaceUnverified.ids(),
      section: allowanceSection,
      allowance: lighting === 'unlit' ? ZERO : allowance,
      installed,
      areaFt2,
      exact: { exempt: watts.exemptW, decorative: watts.decorative, display: watts.display, additional },
      uncoveredDisplay: retailOwn.length > 0 ? watts.display.minus(retailUsable) : ZERO,
    };
  });

  let additional: AdditionalAllowanceResult | null = null;
  let fixedUsable = ZERO;
  if (claimLines.length > 0) {
    const retailLines = claimLines.filter((line) => line.allowance.kind === 'retail-display');
    const fixed = retailLines.reduce((largest, line) => {
      const value = dec(line.allowance.fixedW ?? '0');
      return value.greaterThan(largest) ? value : largest;
    }, ZERO);
    fixedUsable = min(fixed, sum(spaces.map((space) => space.uncoveredDisplay)));
    if (retailLines.length > 0 && retailLines.every((line) => line.allowance.fixedW === undefined)) {
      unverified.unsettled(
        'Retail display fixed adder',
        edition.sections['additionalAllowances'] ?? '',
        'This edition’s fixed wattage added once per building to the retail display allowance was not found; none is counted, which can only understate the allowance.',
      );
    }
    const claimedSpaces = new Set(retailLines.map((line) => line.claim.spaceId));
    const decorativeSpaces = new Set(claimLines.filter((line) => line.allowance.kind === 'decorative').map((line) => line.claim.spaceId));
    const claimed = sum(claimLines.map((line) => line.claimed)).plus(fixed);
    additional = {
      lines: claimLines.map((line) => ({
        allowance: line.allowance.key,
        kind: line.allowance.kind,
        label: line.allowance.label,
        spaceId: line.claim.spaceId,
        area: line.claim.area,
        claimedW: reported.watts(line.claimed),
        usableW: reported.watts(line.usable),
        limitedBy: line.limitedBy,
        section: line.section,
      })),
      fixedW: reported.watts(fixed),
      claimedW: reported.watts(claimed),
      displayW: reported.watts(sum(spaces.filter((space) => claimedSpaces.has(space.id)).map((space) => space.exact.display))),
      decorativeW: reported.watts(sum(spaces.filter((space) => decorativeSpaces.has(space.id)).map((space) => space.exact.decorative))),
      usableW: reported.watts(sum(spaces.map((space) => space.exact.additional)).plus(fixedUsable)),
    };
  }

  const allowanceW = sum(spaces.map((space) => space.allowance)).plus(fixedUsable);
  const installedW = sum(spaces.map((space) => space.installed));
  const interiorMargin = allowanceW.minus(installedW);
  const interiorComplies = installedW.lessThanOrEqualTo(allowanceW);

  let levels: LevelResult[] | null = null;
  if (spaces.some((space) => space.level !== null)) {
    const byLevel = new Map<string, typeof spaces>();
    for (const space of spaces) {
      const level = space.level ?? '';
      byLevel.set(level, [...(byLevel.get(level) ?? []), space]);
    }
    levels = [...byLevel.entries()].map(([level, members]) => {
      const allowance = sum(members.map((space) => space.allowance));
      const installed = sum(members.map((space) => space.installed));
      return {
        level,
        area: text(sum(members.map((space) => dec(space.area)))),
        allowanceW: reported.watts(allowance),
        installedW: reported.watts(installed),
        marginW: reported.watts(allowance.minus(installed)),
      };
    });
  }

  const exterior = document.exterior === undefined ? null : evaluateExterior(document.exterior, edition, units);
  if (exterior !== null) {
    const exteriorSection = edition.sections['exteriorAllowance'] ?? '';
    unverified.add('Whether the base site allowance may cover nontradable applications', edition.rules.baseSiteProvenance, exteriorSection);
    for (const entry of document.exterior!.applications) {
      const application = edition.exteriorApplications.find((candidate) => candidate.key === entry.key)!;
      unverified.add(`Exterior allowance: ${application.label}`, application.provenance, exteriorSection);
      const exempt = exterior.applications.find((line) => line.key === entry.key)?.exemption;
      if (exempt) unverified.unsettled(`Exterior exemption: ${exempt.label}`, exempt.section, exteriorExemptionsNote);
      if (application.unverifiedZones?.includes(exterior.lightingZone)) {
        unverified.unsettled(
          `Exterior allowance: ${application.label}, zone ${exterior.lightingZone}`,
          exteriorSection,
          `The allowance for lighting zone ${exterior.lightingZone} is not the published table as it stands: ${application.provenance.note ?? 'verify it'}`,
        );
      }
    }
    const base = edition.exteriorApplications.find((application) => application.isBaseSiteAllowance);
    if (base) unverified.add(`Exterior allowance: ${base.label}`, base.provenance, exteriorSection);
  }

  const exteriorLines = exterior?.applications.flatMap((application) => application.controls) ?? [];
  // A space without luminaires is out of the verdict until they are entered or it is confirmed unlit:
  // its lines say what its lighting will need, and wait with it (the verdict is incomplete meanwhile).
  const judgedLines = spaces.filter((space) => space.lighting !== 'none-entered').flatMap((space) => space.controls);
  const controlsComply = linesComply(judgedLines) && linesComply(exteriorLines);
  const controlsToVerify = openLines(judgedLines) + openLines(exteriorLines);
  if (controlsToVerify > 0) {
    cautions.push(
      `${controlsToVerify} control requirement(s) are marked "to verify": record what is provided, or that the adopted code was checked and it does not apply. Until then there is no verdict.`,
    );
  }

  const emptySpaces = spaces.filter((space) => space.lighting === 'none-entered').length;
  const passes = interiorComplies && controlsComply && (exterior?.complies ?? true);
  const verdict: EvaluationResult['verdict'] = !passes
    ? 'does-not-comply'
    : emptySpaces > 0 || controlsToVerify > 0
      ? 'incomplete'
      : 'complies';

  return {
    edition: edition.id,
    dataVersion: edition.dataVersion,
    method: document.method,
    units,
    complies: verdict === 'complies',
    verdict,
    amendments: (edition.amendments ?? [])
      .filter((amendment) => document.amendments.includes(amendment.key))
      .map((amendment) => ({ key: amendment.key, title: amendment.title })),
    openItems: { spacesWithoutLuminaires: emptySpaces, controlsToVerify },
    interior: {
      section: allowanceSection,
      area: reported.area(areaFromSquareFeet(sum(spaces.map((space) => space.areaFt2)), units)),
      allowanceW: reported.watts(allowanceW),
      installedW: reported.watts(installedW),
      exemptW: reported.watts(sum(spaces.map((space) => space.exact.exempt))),
      decorativeW: reported.watts(sum(spaces.map((space) => space.exact.decorative))),
      displayW: reported.watts(sum(spaces.map((space) => space.exact.display))),
      marginW: reported.watts(interiorMargin),
      marginPct: percent(interiorMargin, allowanceW),
      complies: interiorComplies,
      additional,
      spaces: spaces.map(
        ({ allowance: _allowance, installed: _installed, areaFt2: _areaFt2, uncoveredDisplay: _uncovered, exact: _exact, ...space }) =>
          space,
      ),
      levels,
    },
    exterior,
    controlsComply,
    unverifiedValues: unverified.values(),
    cautions,
  };
}
