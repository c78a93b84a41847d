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
}

export interface SpaceControlFacts {
  spaceType: SpaceType | undefined;
  areaFt2: Dec;
  /** The document's units: reasons give areas and densities in them. */
  units: UnitSystem;
  enclosed: boolean | undefined;
  sidelightingRequired: boolean;
  secondarySidelightingRequired: boolean;
  toplightingRequired: boolean;
  daylightWhy: { sidelighting: string; toplighting: string };
  decorativeW: Dec;
  displayW: Dec;
  /** General, decorative and display watts together (exempt lighting excluded). */
  installedW: Dec;
  nonExemptLuminaires: { count: Dec; unitWatts: Dec }[];
  occupantSensorProvided: boolean;
}

/** The general exceptions free a space from every interior control requirement (90.1 §9.4.1.1, IECC C405.2). */
const generalExceptions = new Set<string>(['security-or-emergency-continuous', 'exit-stairway-ramp-passageway', 'egress-normally-off']);

const exceptionWords: Record<NonNullable<ProvidedControl['exceptionReason']>, string> = {
  'security-or-emergency-continuous': 'security or emergency area that must stay lit continuously',
  'exit-stairway-ramp-passageway': 'interior exit stairway, exit ramp or exit passageway',
  'egress-normally-off': 'emergency egress lighting that is normally off',
  other: 'another exception',
};

/** 90.1: the space type's table columns; daylight columns apply only where the geometry and watts trigger them. */
function tableRequirements(edition: EditionData, facts: SpaceControlFacts): ControlRequirement[] {
  const type = facts.spaceType;
  if (type === undefined) return [];
  const requirements: ControlRequirement[] = [];
  for (const strategy of strategyKeys) {
    const code = type.controls[strategy];
    if (code === undefined) continue;
    const column = `${type.label}: ${code === 'required' ? 'required' : code.startsWith('one-of:') ? `at least one of group ${code.slice(7)}` : code}`;
    if ((strategy === 'daylight-sidelighting' || strategy === 'daylight-toplighting') && code !== 'not-required' && code !== 'to-verify') {
      const triggered = strategy === 'daylight-sidelighting' ? facts.sidelightingRequired : facts.toplightingRequired;
      const why = strategy === 'daylight-sidelighting' ? facts.daylightWhy.sidelighting : facts.daylightWhy.toplighting;
      requirements.push({ strategy, requirement: triggered ? code : 'not-required', why: `${column} where triggered; ${why}` });
      continue;
    }
    requirements.push({ strategy, requirement: code, why: `${column} (${edition.title} space type controls)` });
  }
  return requirements;
}

/** IECC: occupant-sensor list and small-space rule, time switch otherwise, light reduction, daylight from geometry. */
function ruleRequirements(edition: EditionData, facts: SpaceControlFacts): ControlRequirement[] {
  const type = facts.spaceType;
  const small = edition.rules.smallEnclosedSpaceFt2 === null ? null : dec(edition.rules.smallEnclosedSpaceFt2);
  const area = (squareFeet: Dec) => areaWords(squareFeet, facts.units);
  let occupant: ControlRequirement;
  if (type?.iecc?.occupantSensorListed) {
    occupant = { strategy: 'occupant-sensor', requirement: 'required', why: `${type.label} is a space type listed for occupant sensors` };
  } else if (small !== null && facts.enclosed === true && facts.areaFt2.lessThanOrEqualTo(small)) {
    occupant = { strategy: 'occupant-sensor', requirement: 'required', why: `enclosed space of ${area(facts.areaFt2)}, not more than ${area(small)}` };
  } else if (type === undefined && facts.enclosed !== false) {
    occupant = { strategy: 'occupant-sensor', requirement: 'to-verify', why: 'no control space type given, so the occupant-sensor list cannot be checked' };
  } else {
    const size =
      small === null
        ? ''
        : facts.enclosed === true
          ? `; enclosed but ${area(facts.areaFt2)} is more than ${area(small)}`
          : facts.enclosed === false
            ? '; not an enclosed space'
            : '; not recorded as enclosed';
    occupant = { strategy: 'occupant-sensor', requirement: 'not-required', why: `${type?.label ?? 'space'} is not on the occupant-sensor list${size}` };
  }
  const occupantRequired = occupant.requirement === 'required';
  // C405.2.2 asks for time-switch control where a space has no occupant sensor controls.
  const timeSwitch: ControlRequirement = occupantRequired
    ? { strategy: 'time-switch', requirement: 'not-required', why: 'occupant sensors are required here instead' }
    : facts.occupantSensorProvided
      ? { strategy: 'time-switch', requirement: 'not-required', why: 'occupant sensor controls are provided, and time-switch control applies only where there are none' }
      : { strategy: 'time-switch', requirement: occupant.requirement === 'to-verify' ? 'to-verify' : 'required', why: 'a space without occupant sensor controls needs time-switch control' };
  return [
    occupant,
    timeSwitch,
    lightReduction(edition, facts),
    { strategy: 'daylight-sidelighting', requirement: facts.sidelightingRequired ? 'required' : 'not-required', why: facts.daylightWhy.sidelighting },
    { strategy: 'daylight-toplighting', requirement: facts.toplightingRequired ? 'required' : 'not-required', why: facts.daylightWhy.toplighting },
  ];
}

/** C405.2.3 with its exceptions, read from the data: listed space types, one small luminaire, a low installed density. */
function lightReduction(edition: EditionData, facts: SpaceControlFacts): ControlRequirement {
  const strategy = 'light-reduction';
  const exemptItem = facts.spaceType?.iecc?.lightReductionExemptItem;
  if (exemptItem) return { strategy, requirement: 'not-required', why: `${exemptItem} are excepted from light-reduction control` };
  const parameters = edition.controlStrategies.find((entry) => entry.key === strategy)?.parameters ?? {};
  const singleBelow = parameters['exemptSingleLuminaireBelowW'];
  const luminaires = facts.nonExemptLuminaires.reduce((total, group) => total.plus(group.count), dec(0));
  if (singleBelow !== undefined && luminaires.equals(1)) {
    const only = facts.nonExemptLuminaires.find((group) => group.count.equals(1))!;
    if (only.unitWatts.lessThan(dec(singleBelow))) {
      return { strategy, requirement: 'not-required', why: `the space has one luminaire of ${only.unitWatts.toFixed()} W, less than ${singleBelow} W` };
    }
  }
  const lpdBelow = parameters['exemptLpdBelowWPerFt2'];
  if (lpdBelow !== undefined && facts.areaFt2.greaterThan(0)) {
    const density = facts.installedW.dividedBy(facts.areaFt2);
    if (density.lessThan(dec(lpdBelow))) {
      return { strategy, requirement: 'not-required', why: `the installed density of ${densityWords(density, facts.units)} is less than ${densityWords(dec(lpdBelow), facts.units)}` };
    }
  }
  return { strategy, requirement: 'required', why: 'the occupant can reduce the connected lighting load in a reasonably uniform pattern' };
}

export function interiorRequirements(edition: EditionData, facts: SpaceControlFacts): ControlRequirement[] {
  const requirements = edition.family === 'iecc' ? ruleRequirements(edition, facts) : tableRequirements(edition, facts);
  const special = facts.decorativeW.plus(facts.displayW);
  const catalogued = edition.controlStrategies.some((strategy) => strategy.key === 'specific-application');
  if (special.greaterThan(0) && catalogued && !requirements.some((line) => line.strategy === 'specific-application')) {
    requirements.push({
      strategy: 'specific-application',
      requirement: 'required',
      why: `decorative ${facts.decorativeW.toFixed()} W and display ${facts.displayW.toFixed()} W are controlled apart from general lighting`,
    });
  }
  if (facts.secondarySidelightingRequired) {
    const sidelighting = requirements.find((line) => line.strategy === 'daylight-sidelighting');
    if (sidelighting && sidelighting.requirement !== 'not-required') {
      sidelighting.why += '; the secondary sidelit zone is controlled separately from the primary';
    }
  }
  return requirements;
}

interface ProvisionCheck {
  ok: boolean;
  words: string;
}

function checkProvision(
  strategy: StrategyKey,
  provided: ProvidedControl[],
  catalogue: ReadonlyMap<string, ControlStrategy>,
  spaceType: SpaceType | undefined,
  units: UnitSystem,
): ProvisionCheck {
  const own = provided.find((control) => control.strategy === strategy);
  // A full-OFF control satisfies a partial-OFF requirement.
  const entry =
    own?.provided !== true && strategy === 'automatic-partial-off'
      ? (provided.find((control) => control.strategy === 'automatic-full-off' && control.provided) ?? own)
      : own;
  if (entry === undefined || !entry.provided) return { ok: false, words: 'not provided' };
  const by = entry.strategy === strategy ? 'provided' : 'provided by automatic full OFF, which satisfies partial OFF';
  const device = entry.device ? ` (${entry.device})` : '';
  const limit = catalogue.get(entry.strategy)?.parameters.timeoutMinutes;
  if (limit !== undefined && entry.timeoutMinutes !== undefined && dec(entry.timeoutMinutes).greaterThan(dec(limit))) {
    return { ok: false, words: `${by}${device}, but its time-out of ${entry.timeoutMinutes} min is longer than ${limit} min` };
  }
  if (strategy === 'occupant-sensor' && entry.autoOn === 'full' && spaceType?.iecc && !spaceType.iecc.fullAutoOnAllowed) {
    return { ok: false, words: `${by}${device}, but full automatic-on is not allowed in ${spaceType.label}: manual-on or automatic-on to at most 50 %` };
  }
  const zoneLimit = catalogue.get(entry.strategy)?.parameters['zoneSizeLimitFt2'];
  if (zoneLimit !== undefined && entry.zoneSize !== undefined) {
    const zoneFt2 = areaToSquareFeet(dec(entry.zoneSize), units);
    if (zoneFt2.greaterThan(dec(zoneLimit))) {
      const served = units === 'ip' ? areaWords(zoneFt2.toDecimalPlaces(0), units) : areaWords(zoneFt2, units);
      return { ok: false, words: `${by}${device}, but one device serves ${served}, more than ${areaWords(dec(zoneLimit), units)}` };
    }
  }
  const timeout =
    limit === undefined ? '' : entry.timeoutMinutes === undefined ? `; time-out not recorded (at most ${limit} min)` : `; time-out ${entry.timeoutMinutes} min`;
  return { ok: true, words: `${by}${device}${timeout}` };
}

/** Compares requirements with what the engineer recorded: all required met, at least one of each group. */
export function resolveControls(
  requirements: ControlRequirement[],
  provided: ProvidedControl[],
  edition: EditionData,
  spaceType?: SpaceType,
  units: UnitSystem = 'ip',
): ControlLine[] {
  const catalogue: ReadonlyMap<string, ControlStrategy> = new Map(edition.controlStrategies.map((strategy) => [strategy.key, strategy]));
  const checks = new Map(requirements.map((line) => [line.strategy, checkProvision(line.strategy, provided, catalogue, spaceType, units)]));
  const general = provided.find((control) => control.exceptionReason !== undefined && generalExceptions.has(control.exceptionReason));
  return requirements.map((line) => {
    const strategy = catalogue.get(line.strategy);
    const label = strategy?.label ?? line.strategy;
    const section = strategy?.section ?? '';
    const check = checks.get(line.strategy)!;
    const exception = provided.find((control) => control.strategy === line.strategy)?.exceptionReason;
    const claimed = exception === undefined ? '' : `exception claimed: ${exceptionWords[exception]}`;
    const note = provided.find((control) => control.strategy === line.strategy)?.exceptionNote;
    const claimedWords = note ? `${claimed} (${note})` : claimed;
    const verified = (strategy?.provenance.verified ?? false) && line.requirement !== 'to-verify';
    const base = { strategy: line.strategy, label, requirement: line.requirement, section, verified };
    if (line.requirement === 'not-required') {
      return { ...base, met: null, status: 'not-required', reason: `Not required: ${line.why}.` };
    }
    if (line.requirement === 'to-verify') {
      return { ...base, met: null, status: 'to-verify', reason: `To verify: ${line.why}; ${check.words}.` };
    }
    if (general?.exceptionReason !== undefined && !check.ok) {
      const words = `exception claimed for every control of this space: ${exceptionWords[general.exceptionReason]}`;
      return { ...base, met: null, status: 'exception-claimed', reason: `${line.requirement === 'required' ? 'Required' : line.why}: ${line.requirement === 'required' ? `${line.why}; ` : ''}${words}.` };
    }
    if (line.requirement === 'required') {
      if (check.ok) return { ...base, met: true, status: 'met', reason: `Required: ${line.why}; ${check.words}.` };
      if (claimedWords) return { ...base, met: null, status: 'exception-claimed', reason: `Required: ${line.why}; ${claimedWords}.` };
      return { ...base, met: false, status: 'not-met', reason: `Required: ${line.why}; ${check.words}.` };
    }
    const members = requirements.filter((other) => other.requirement === line.requirement);
    const names = members.map((member) => catalogue.get(member.strategy)?.label ?? member.strategy).join(', ');
    const chosen = members.filter((member) => checks.get(member.strategy)!.ok);
    const group = `at least one of ${names}`;
    if (chosen.length > 0) {
      const which = chosen.map((member) => catalogue.get(member.strategy)?.label ?? member.strategy).join(', ');
      return { ...base, met: true, status: 'met', reason: `${line.why}: ${group}; met by ${which}; this one ${check.words}.` };
    }
    const groupClaim = members.some((member) => provided.find((control) => control.strategy === member.strategy)?.exceptionReason !== undefined);
    if (groupClaim) return { ...base, met: null, status: 'exception-claimed', reason: `${line.why}: ${group}; ${claimedWords || 'exception claimed for the group'}.` };
    return { ...base, met: false, status: 'not-met', reason: `${line.why}: ${group}; none met; this one ${check.words}.` };
  });
}

export function linesComply(lines: ControlLine[]): boolean {
  return lines.every((line) => line.status !== 'not-met');
}
