import type { ProvidedControl } from './document.js';
import type { ControlStrategy, EditionData, RequirementCode, SpaceType, StrategyKey } from './edition-data.js';
import { strategyKeys } from './edition-data.js';
import { type Dec, dec } from './numbers.js';
import { type UnitSystem, areaToSquareFeet, areaWords, densityWords } from './units.js';
import type { ControlLine } from './result.js';

/** One requirement before it is compared with what the engineer provided. */
export interface ControlRequirement {
  strategy: StrategyKey;
  requirement: RequirementCode;
  why: string;
  /** What the provided control must also do for this requirement (a space-specific function). */
  needs?: FunctionNeeds;
}

/** A space-specific occupant-sensor function: a reduction of at least so much, in zones of at most so much. */
export interface FunctionNeeds {
  reductionPercent?: string;
  zoneSizeLimitFt2?: string;
  /** Where the numbers come from, in words. */
  what: string;
}

export interface SpaceControlFacts {
  spaceType: SpaceType | undefined;
  areaFt2: Dec;
  /** The document's units: reasons give areas and densities in them. */
  units: UnitSystem;
  enclosed: boolean | undefined;
  sidelighting: DaylightTrigger;
  secondarySidelightingRequired: boolean;
  toplighting: DaylightTrigger;
  decorativeW: Dec;
  displayW: Dec;
  /** General, decorative and display watts together (exempt lighting excluded). */
  installedW: Dec;
  nonExemptLuminaires: { count: Dec; unitWatts: Dec }[];
  provided: ProvidedControl[];
}

/** Whether the daylight geometry and watts call for a daylight-responsive control, and why in words. */
export interface DaylightTrigger {
  requirement: 'required' | 'not-required' | 'to-verify';
  why: string;
}

/** The general exceptions free a space from every interior control requirement (90.1 §9.4.1.1, IECC C405.2). */
const generalExceptions = new Set<string>(['security-or-emergency-continuous', 'exit-stairway-ramp-passageway', 'egress-normally-off']);

export const controlExceptionWords: Record<NonNullable<ProvidedControl['exceptionReason']>, string> = {
  'security-or-emergency-continuous': 'security or emergency area that must stay lit continuously',
  'exit-stairway-ramp-passageway': 'interior exit stairway, exit ramp or exit passageway',
  'egress-normally-off': 'emergency egress lighting that is normally off',
  'continuous-operation': 'lighting intended for continuous operation',
  'verified-not-required': 'checked against the adopted code: not required here',
  other: 'another exception',
};

function parameter(edition: EditionData, strategy: StrategyKey, name: string): string | undefined {
  return edition.controlStrategies.find((entry) => entry.key === strategy)?.parameters[name];
}

/** 90.1: the space type's table columns; daylight columns apply only where the geometry and watts trigger them. */
function tableRequirements(edition: EditionData, facts: SpaceControlFacts): ControlRequirement[] {
  const type = facts.spaceType;
  if (type === undefined) return [];
  const requirements: ControlRequirement[] = [];
  for (const strategy of strategyKeys) {
    const code = type.controls[strategy];
    if (code === undefined) continue;
    const column = `${type.label}: ${code === 'required' ? 'required' : code.startsWith('one-of:') ? 'one of a set of alternatives' : code === 'to-verify' ? 'not yet checked against the printed table' : 'not required'}`;
    if ((strategy === 'daylight-sidelighting' || strategy === 'daylight-toplighting') && code !== 'not-required' && code !== 'to-verify') {
      const trigger = strategy === 'daylight-sidelighting' ? facts.sidelighting : facts.toplighting;
      const requirement = trigger.requirement === 'required' ? code : trigger.requirement;
      requirements.push({ strategy, requirement, why: `${column} where triggered; ${trigger.why}` });
      continue;
    }
    const needs: FunctionNeeds | undefined =
      strategy === 'automatic-partial-off' && parameter(edition, strategy, 'reductionPercent') !== undefined
        ? { reductionPercent: parameter(edition, strategy, 'reductionPercent'), what: 'automatic partial OFF' }
        : undefined;
    requirements.push({
      strategy,
      requirement: code,
      why: `${column} (${edition.title} space type controls)`,
      ...(needs ? { needs } : {}),
    });
  }
  return requirements;
}

/** IECC C405.2.1.2–C405.2.1.4 and C405.2.8: what the space-specific occupant-sensor function must do. */
function sensorFunctionNeeds(edition: EditionData, type: SpaceType): FunctionNeeds | null {
  const fn = type.iecc?.sensorFunction ?? 'general';
  const value = (name: string) => parameter(edition, 'automatic-partial-off', name);
  switch (fn) {
    case 'warehouse':
      return { reductionPercent: value('reductionPercent'), what: 'in warehouse aisles and open areas, reduced when unoccupied' };
    case 'open-office':
      return {
        reductionPercent: value('openOfficeReductionPercent'),
        zoneSizeLimitFt2: value('openOfficeZoneSizeLimitFt2'),
        what: 'in open plan offices, each vacant zone reduced',
      };
    case 'corridor':
      return { reductionPercent: value('reductionPercent'), what: 'in corridors and stairways, reduced when unoccupied' };
    case 'parking-garage':
      return {
        reductionPercent: value('parkingReductionPercent'),
        zoneSizeLimitFt2: value('parkingZoneSizeLimitFt2'),
        what: 'in parking garages, each zone reduced after a time without activity',
      };
    default:
      return null;
  }
}

function ruleRequirements(
  edition: EditionData,
  facts: SpaceControlFacts,
  catalogue: ReadonlyMap<string, ControlStrategy>,
): ControlRequirement[] {
  const type = facts.spaceType;
  const small = edition.rules.smallEnclosedSpaceFt2 === null ? null : dec(edition.rules.smallEnclosedSpaceFt2);
  const area = (squareFeet: Dec) => areaWords(squareFeet, facts.units);
  let occupant: ControlRequirement;
  if (type?.iecc?.occupantSensorListed) {
    occupant = { strategy: 'occupant-sensor', requirement: 'required', why: `${type.label} is a space type listed for occupant sensors` };
  } else if (type === undefined) {
    occupant = {
      strategy: 'occupant-sensor',
      requirement: 'to-verify',
      why: 'no control space type is given, so the occupant-sensor list cannot be checked',
    };
  } else if (small !== null && facts.areaFt2.lessThanOrEqualTo(small) && facts.enclosed === true) {
    occupant = {
      strategy: 'occupant-sensor',
      requirement: 'required',
      why: `enclosed space of ${area(facts.areaFt2)}, not more than ${area(small)}`,
    };
  } else if (small !== null && facts.areaFt2.lessThanOrEqualTo(small) && facts.enclosed === undefined) {
    // The small-space rule turns on whether the room is enclosed: blank is not "no".
    occupant = {
      strategy: 'occupant-sensor',
      requirement: 'to-verify',
      why: `a space of ${area(facts.areaFt2)} (not more than ${area(small)}) needs occupant sensors if it is enclosed by floor-to-ceiling walls, and that is not recorded`,
    };
  } else {
    const size =
      small === null
        ? ''
        : facts.enclosed === true
          ? `; enclosed but ${area(facts.areaFt2)} is more than ${area(small)}`
          : facts.enclosed === false
            ? '; not an enclosed space'
            : `; more than ${area(small)}`;
    occupant = { strategy: 'occupant-sensor', requirement: 'not-required', why: `${type.label} is not on the occupant-sensor list${size}` };
  }

  const requirements: ControlRequirement[] = [occupant, timeSwitch(facts, occupant, catalogue)];
  const needs = type ? sensorFunctionNeeds(edition, type) : null;
  if (needs)
    requirements.push({
      strategy: 'automatic-partial-off',
      requirement: 'required',
      why: `the occupant-sensor function ${needs.what}`,
      needs,
    });
  requirements.push(lightReduction(edition, facts));
  if (type?.iecc?.sleepingUnit) {
    requirements.push({
      strategy: 'specific-application',
      requirement: 'required',
      why: `${type.label} is a sleeping or dwelling unit, whose lighting has its own controls`,
    });
  }
  // The catalogue's daylight mapping excepts some space types (sleeping units, operating and imaging rooms).
  for (const strategy of ['daylight-sidelighting', 'daylight-toplighting'] as const) {
    const trigger = strategy === 'daylight-sidelighting' ? facts.sidelighting : facts.toplighting;
    const mapped = type?.controls[strategy];
    if (mapped === 'not-required') {
      requirements.push({
        strategy,
        requirement: 'not-required',
        why: `${type!.label} is excepted from daylight-responsive control in the space type catalogue`,
      });
    } else {
      requirements.push({ strategy, requirement: trigger.requirement, why: trigger.why });
    }
  }
  return requirements;
}

/**
 * C405.2.2: a time switch where a space has no occupant sensor controls. Only a sensor that meets
 * C405.2.1.1 (its time-out, and manual-on or the automatic-on allowed here) stands in for one.
 */
function timeSwitch(
  facts: SpaceControlFacts,
  occupant: ControlRequirement,
  catalogue: ReadonlyMap<string, ControlStrategy>,
): ControlRequirement {
  const strategy = 'time-switch';
  const exempt = facts.spaceType?.iecc?.timeSwitchExemptItem;
  if (exempt) return { strategy, requirement: 'not-required', why: `${exempt} are excepted from time-switch control` };
  if (occupant.requirement === 'required')
    return { strategy, requirement: 'not-required', why: 'occupant sensors are required here instead' };
  const sensor = facts.provided.find((control) => control.strategy === 'occupant-sensor' && control.provided);
  if (sensor) {
    const check = checkProvision('occupant-sensor', facts.provided, catalogue, facts.spaceType, facts.units, facts.areaFt2, undefined);
    if (check.state === 'ok')
      return {
        strategy,
        requirement: 'not-required',
        why: 'occupant sensor controls that meet the sensor rules are provided, and time-switch control applies only where there are none',
      };
    return {
      strategy,
      requirement: occupant.requirement === 'to-verify' ? 'to-verify' : 'required',
      why: `the occupant sensor recorded cannot stand in for a time switch: ${check.words}`,
    };
  }
  return {
    strategy,
    requirement: occupant.requirement === 'to-verify' ? 'to-verify' : 'required',
    why: 'a space without occupant sensor controls needs time-switch control',
  };
}

/** C405.2.3 with its exceptions, read from the data: listed space types, one small luminaire, a low installed density. */
function lightReduction(edition: EditionData, facts: SpaceControlFacts): ControlRequirement {
  const strategy = 'light-reduction';
  const exemptItem = facts.spaceType?.iecc?.lightReductionExemptItem;
  if (exemptItem) return { strategy, requirement: 'not-required', why: `${exemptItem} are excepted from light-reduction control` };
  const singleBelow = parameter(edition, strategy, 'exemptSingleLuminaireBelowW');
  const luminaires = facts.nonExemptLuminaires.reduce((total, group) => total.plus(group.count), dec(0));
  if (singleBelow !== undefined && luminaires.equals(1)) {
    const only = facts.nonExemptLuminaires.find((group) => group.count.equals(1))!;
    if (only.unitWatts.lessThan(dec(singleBelow))) {
      return {
        strategy,
        requirement: 'not-required',
        why: `the space has one luminaire of ${only.unitWatts.toFixed()} W, less than ${singleBelow} W`,
      };
    }
  }
  const lpdBelow = parameter(edition, strategy, 'exemptLpdBelowWPerFt2');
  if (lpdBelow !== undefined && facts.areaFt2.greaterThan(0)) {
    const density = facts.installedW.dividedBy(facts.areaFt2);
    if (density.lessThan(dec(lpdBelow))) {
      return {
        strategy,
        requirement: 'not-required',
        why: `the installed density of ${densityWords(density, facts.units)} is less than ${densityWords(dec(lpdBelow), facts.units)}`,
      };
    }
  }
  const reduction = parameter(edition, strategy, 'reductionPercent');
  return {
    strategy,
    requirement: 'required',
    why: 'the occupant can reduce the connected lighting load in a reasonably uniform pattern',
    ...(reduction ? { needs: { reductionPercent: reduction, what: 'light reduction' } } : {}),
  };
}

/** 90.1's own space type for the transition zone (90.1-2022) and for the rest of the garage. */
const transitionZoneType = 'parking-garage-daylight-transition-zone';

function isParkingGarage(type: SpaceType): boolean {
  return type.key === 'parking-area-interior' || type.key.startsWith('parking-garage-') || type.iecc?.sensorFunction === 'parking-garage';
}

/**
 * 90.1 §9.4.1.2 and IECC C405.2.8 (from memory): in a parking garage, the lighting of the daylight
 * transition zone at a covered vehicle entrance or exit is controlled apart from the rest and
 * reduced from sunset to sunrise. Where the space type does not say whether the space holds such
 * a zone, that is a question for the engineer, not a "no".
 */
function parkingTransition(type: SpaceType, edition: EditionData): ControlRequirement {
  const strategy = 'parking-daylight-transition';
  const rule =
    'lighting in the daylight transition zone at a covered vehicle entrance or exit is controlled apart from the garage’s other lighting and reduced automatically from sunset to sunrise';
  if (type.key === transitionZoneType) return { strategy, requirement: 'required', why: `${type.label}: ${rule}` };
  if (edition.spaceTypes.some((candidate) => candidate.key === transitionZoneType)) {
    return {
      strategy,
      requirement: 'not-required',
      why: `this edition gives the daylight transition zone its own space type, and this space is entered as ${type.label}`,
    };
  }
  return {
    strategy,
    requirement: 'to-verify',
    why: `in a parking garage, ${rule}; whether this space has a covered vehicle entrance or exit with such lighting is not recorded`,
  };
}

export function interiorRequirements(edition: EditionData, facts: SpaceControlFacts): ControlRequirement[] {
  const catalogue: ReadonlyMap<string, ControlStrategy> = new Map(edition.controlStrategies.map((strategy) => [strategy.key, strategy]));
  const requirements = edition.family === 'iecc' ? ruleRequirements(edition, facts, catalogue) : tableRequirements(edition, facts);
  const special = facts.decorativeW.plus(facts.displayW);
  const catalogued = catalogue.has('specific-application');
  if (special.greaterThan(0) && catalogued && !requirements.some((line) => line.strategy === 'specific-application')) {
    requirements.push({
      strategy: 'specific-application',
      requirement: 'required',
      why: `decorative ${facts.decorativeW.toFixed()} W and display ${facts.displayW.toFixed()} W are controlled apart from general lighting`,
    });
  }
  if (catalogue.has('parking-daylight-transition') && facts.spaceType && isParkingGarage(facts.spaceType)) {
    requirements.push(parkingTransition(facts.spaceType, edition));
  }
  if (facts.secondarySidelightingRequired) {
    const sidelighting = requirements.find((line) => line.strategy === 'daylight-sidelighting');
    if (sidelighting && sidelighting.requirement !== 'not-required') {
      sidelighting.why += '; the secondary sidelit zone is controlled separately from the primary';
    }
  }
  return requirements;
}

/** 'ok': provided and meets every recorded check; 'open': provided, but something it must show is not recorded; 'failed'. */
export interface ProvisionCheck {
  state: 'ok' | 'open' | 'failed';
  words: string;
}

/**
 * Compares what is provided for one strategy with what the strategy (and a space-specific
 * function) asks. Nothing unrecorded passes: a missing time-out, reduction or zone size where one
 * decides the answer leaves the line open.
 */
function checkProvision(
  strategy: StrategyKey,
  provided: ProvidedControl[],
  catalogue: ReadonlyMap<string, ControlStrategy>,
  spaceType: SpaceType | undefined,
  units: UnitSystem,
  areaFt2: Dec | undefined,
  needs: FunctionNeeds | undefined,
): ProvisionCheck {
  const own = provided.find((control) => control.strategy === strategy);
  // A full-OFF control satisfies a partial-OFF requirement.
  const entry =
    own?.provided !== true && strategy === 'automatic-partial-off'
      ? (provided.find((control) => control.strategy === 'automatic-full-off' && control.provided) ?? own)
      : own;
  if (entry === undefined || !entry.provided) return { state: 'failed', words: 'not provided' };
  const by = entry.strategy === strategy ? 'provided' : 'provided by automatic full OFF, which satisfies partial OFF';
  const device = entry.device ? ` (${entry.device})` : '';
  const open: string[] = [];
  const limit = catalogue.get(entry.strategy)?.parameters.timeoutMinutes;
  if (limit !== undefined) {
    if (entry.timeoutMinutes === undefined) open.push(`its time-out is not recorded (at most ${limit} min)`);
    else if (dec(entry.timeoutMinutes).greaterThan(dec(limit)))
      return { state: 'failed', words: `${by}${device}, but its time-out of ${entry.timeoutMinutes} min is longer than ${limit} min` };
  }
  if (strategy === 'occupant-sensor' && spaceType?.iecc) {
    if (entry.autoOn === 'full' && !spaceType.iecc.fullAutoOnAllowed) {
      return {
        state: 'failed',
        words: `${by}${device}, but full automatic-on is not allowed in ${spaceType.label}: manual-on or automatic-on to at most 50 %`,
      };
    }
    if (entry.autoOn === undefined) open.push('how it turns the lighting on is not recorded (manual-on, or automatic-on to at most 50 %)');
  }
  const zoneLimits = [catalogue.get(entry.strategy)?.parameters['zoneSizeLimitFt2'], needs?.zoneSizeLimitFt2].filter(
    (value): value is string => value !== undefined,
  );
  const zoneLimit = zoneLimits.length === 0 ? undefined : zoneLimits.map(dec).reduce((a, b) => (a.lessThan(b) ? a : b));
  if (zoneLimit !== undefined) {
    if (entry.zoneSize !== undefined) {
      const zoneFt2 = areaToSquareFeet(dec(entry.zoneSize), units);
      if (zoneFt2.greaterThan(zoneLimit)) {
        const served = units === 'ip' ? areaWords(zoneFt2.toDecimalPlaces(0), units) : areaWords(zoneFt2, units);
        return {
          state: 'failed',
          words: `${by}${device}, but one device or zone serves ${served}, more than ${areaWords(zoneLimit, units)}`,
        };
      }
    } else if (areaFt2 === undefined || areaFt2.greaterThan(zoneLimit)) {
      // A zone cannot be larger than its space, so only a space larger than the limit needs the zone size.
      open.push(`the floor area one device or zone serves is not recorded (at most ${areaWords(zoneLimit, units)})`);
    }
  }
  // Full OFF reduces by all of it; otherwise the recorded reduction decides.
  const reduction = entry.strategy === 'automatic-full-off' && strategy !== 'automatic-full-off' ? '100' : entry.reductionPercent;
  if (needs?.reductionPercent !== undefined) {
    if (reduction === undefined)
      open.push(`how far it reduces the lighting is not recorded (at least ${needs.reductionPercent} %, ${needs.what})`);
    else if (dec(reduction).lessThan(dec(needs.reductionPercent))) {
      return {
        state: 'failed',
        words: `${by}${device}, but it reduces the lighting by ${reduction} %, less than the ${needs.reductionPercent} % required (${needs.what})`,
      };
    }
  }
  const details = [
    entry.timeoutMinutes === undefined ? '' : `time-out ${entry.timeoutMinutes} min`,
    entry.reductionPercent === undefined ? '' : `reduction ${entry.reductionPercent} %`,
  ].filter(Boolean);
  const recorded = details.length ? `; ${details.join(', ')}` : '';
  if (open.length > 0) return { state: 'open', words: `${by}${device}${recorded}, but ${open.join('; and ')}` };
  return { state: 'ok', words: `${by}${device}${recorded}` };
}

/** Compares requirements with what the engineer recorded: all required met, at least one of each group. */
export function resolveControls(
  requirements: ControlRequirement[],
  provided: ProvidedControl[],
  edition: EditionData,
  spaceType?: SpaceType,
  units: UnitSystem = 'ip',
  areaFt2?: Dec,
): ControlLine[] {
  const catalogue: ReadonlyMap<string, ControlStrategy> = new Map(edition.controlStrategies.map((strategy) => [strategy.key, strategy]));
  const checks = new Map(
    requirements.map((line) => [line.strategy, checkProvision(line.strategy, provided, catalogue, spaceType, units, areaFt2, line.needs)]),
  );
  const general = provided.find((control) => control.exceptionReason !== undefined && generalExceptions.has(control.exceptionReason));
  return requirements.map((line) => {
    const strategy = catalogue.get(line.strategy);
    const label = strategy?.label ?? line.strategy;
    const section = strategy?.section ?? '';
    const check = checks.get(line.strategy)!;
    const entry = provided.find((control) => control.strategy === line.strategy);
    const exception = entry?.exceptionReason;
    const claimed = exception === undefined ? '' : `exception claimed: ${controlExceptionWords[exception]}`;
    const claimedWords = entry?.exceptionNote ? `${claimed} (${entry.exceptionNote})` : claimed;
    const verified = (strategy?.provenance.verified ?? false) && line.requirement !== 'to-verify';
    const base = { strategy: line.strategy, label, requirement: line.requirement, section, verified };
    if (line.requirement === 'not-required') {
      return { ...base, met: null, status: 'not-required', reason: `Not required: ${line.why}.` };
    }
    if (general?.exceptionReason !== undefined && check.state !== 'ok') {
      const words = `exception claimed for every control of this space: ${controlExceptionWords[general.exceptionReason]}`;
      return {
        ...base,
        met: null,
        status: 'exception-claimed',
        reason: `${line.requirement === 'required' ? `Required: ${line.why}; ` : `${capitalised(line.why)}: `}${words}.`,
      };
    }
    if (line.requirement === 'to-verify') {
      // Settled by the engineer: provided anyway, or checked against the adopted code.
      if (check.state === 'ok')
        return {
          ...base,
          met: true,
          status: 'met',
          reason: `Provided (${check.words}); whether the code requires it here is not yet checked: ${line.why}.`,
        };
      if (exception === 'verified-not-required')
        return { ...base, met: null, status: 'exception-claimed', reason: `To verify: ${line.why}; ${claimedWords}.` };
      return { ...base, met: null, status: 'to-verify', reason: `To verify: ${line.why}; ${check.words}.` };
    }
    // A "checked: not required" statement answers an open question; it cannot set aside a requirement the tables state.
    const acceptedClaim = exception !== undefined && exception !== 'verified-not-required' ? claimedWords : '';
    if (line.requirement === 'required') {
      if (check.state === 'ok') return { ...base, met: true, status: 'met', reason: `Required: ${line.why}; ${check.words}.` };
      if (acceptedClaim) return { ...base, met: null, status: 'exception-claimed', reason: `Required: ${line.why}; ${acceptedClaim}.` };
      if (check.state === 'open') return { ...base, met: null, status: 'to-verify', reason: `Required: ${line.why}; ${check.words}.` };
      return { ...base, met: false, status: 'not-met', reason: `Required: ${line.why}; ${check.words}.` };
    }
    const members = requirements.filter((other) => other.requirement === line.requirement);
    const names = members.map((member) => catalogue.get(member.strategy)?.label ?? member.strategy).join(', ');
    const chosen = members.filter((member) => checks.get(member.strategy)!.state === 'ok');
    const group = `at least one of ${names}`;
    if (chosen.length > 0) {
      const which = chosen.map((member) => catalogue.get(member.strategy)?.label ?? member.strategy).join(', ');
      return { ...base, met: true, status: 'met', reason: `${capitalised(line.why)}: ${group}; met by ${which}; this one ${check.words}.` };
    }
    const groupClaim = members.some((member) => {
      const reason = provided.find((control) => control.strategy === member.strategy)?.exceptionReason;
      return reason !== undefined && reason !== 'verified-not-required';
    });
    if (groupClaim)
      return {
        ...base,
        met: null,
        status: 'exception-claimed',
        reason: `${capitalised(line.why)}: ${group}; ${acceptedClaim || 'exception claimed for the group'}.`,
      };
    if (members.some((member) => checks.get(member.strategy)!.state === 'open')) {
      return {
        ...base,
        met: null,
        status: 'to-verify',
        reason: `${capitalised(line.why)}: ${group}; none settled yet; this one ${check.words}.`,
      };
    }
    return { ...base, met: false, status: 'not-met', reason: `${capitalised(line.why)}: ${group}; none met; this one ${check.words}.` };
  });
}

function capitalised(text: string): string {
  return text.charAt(0).toUpperCase() + text.slice(1);
}

export function linesComply(lines: ControlLine[]): boolean {
  return lines.every((line) => line.status !== 'not-met');
}

/** Lines the verdict waits for: requirements the product cannot settle until the engineer records more. */
export function openLines(lines: ControlLine[]): number {
  return lines.filter((line) => line.status === 'to-verify').length;
}
