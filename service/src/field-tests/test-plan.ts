import { testKindLabels, testKinds, type TestKind, type TestPlanGroup, type TestPlanItem } from '../../../contract/field-tests.js';
import type { EvaluationResult, ControlLine } from '../../../contract/result.js';
import type { EvaluationDocument, ProvidedControl } from '../compliance/document.js';
import type { ScheduleSettings } from '../compliance/exterior-schedule.js';
import { dec } from '../compliance/numbers.js';
import { areaToSquareFeet } from '../compliance/units.js';

/**
 * The functional test plan of a project's lighting controls, made from its design (the evaluation
 * document and its result) each time it is asked for: pure, no express, no knex. Results recorded
 * in the field attach to the items by their id, which is made only of stable design keys (the
 * space's id, the exterior application's key, the strategy), so a result stays with its control
 * while the design around it changes.
 *
 * Sources: the tests and the sampling rule follow IECC C408.3 (the design primer, DOMAIN.md §6,
 * checked against the code's text for C408.3); the numbers of its sub-sections (C408.3.1.1 occupant
 * sensors, C408.3.1.2 time switches, C408.3.1.3 daylight-responsive controls) are from memory, and
 * so is ASHRAE 90.1's functional testing section (§9.9 in 90.1-2016, 2019 and 2022; §9.4.3 in 2013).
 */

export { testKindLabels, testKinds, type TestKind, type TestPlanGroup, type TestPlanItem };

/** Which strategy of the design each kind of test checks. */
const kindOfStrategy: Partial<Record<string, TestKind>> = {
  'occupant-sensor': 'occupant-sensor',
  'automatic-full-off': 'occupant-sensor',
  'time-switch': 'time-switch',
  'scheduled-shutoff': 'time-switch',
  'daylight-sidelighting': 'daylight',
  'daylight-toplighting': 'daylight',
  'light-reduction': 'light-reduction',
  bilevel: 'light-reduction',
  'automatic-partial-off': 'partial-off',
  'exterior-daylight-off': 'exterior-daylight-off',
  'exterior-setback': 'exterior-setback',
  'exterior-facade-landscape-off': 'exterior-setback',
};

/** IECC C408.3.1.1: seven or fewer occupant sensors in the project are each tested. */
export const testEachUpTo = 7;
/** IECC C408.3.1.1: at least 10 % of each combination, rounded up, and no fewer than one. */
export const samplePercent = 10;
/** IECC C408.3.1.1: when 30 % or more of a combination's sample fails, the rest of it is tested too. */
export const widenAtFailPercent = 30;

/**
 * Space geometry's area band, in ft² of one room (a space entry standing for several like rooms is
 * divided by their number). Our own choice, not the code's: the code asks for each "unique
 * combination of sensor type and space geometry" without defining geometry, so a combination here
 * is the space type plus one of these bands. The edges: 300 ft² is the IECC's small enclosed space
 * (C405.2.1), 5,000 ft² the largest area one automatic-off device may serve in 90.1; 1,000 and
 * 2,500 ft² split the rooms between (common practice: rooms of one band look alike to a sensor).
 */
export const areaBands = [
  { upTo: 300, words: 'up to 300 ft²' },
  { upTo: 1000, words: '300 to 1,000 ft²' },
  { upTo: 2500, words: '1,000 to 2,500 ft²' },
  { upTo: 5000, words: '2,500 to 5,000 ft²' },
  { upTo: Infinity, words: 'over 5,000 ft²' },
] as const;

export function areaBand(squareFeetPerRoom: number): string {
  return areaBands.find((band) => squareFeetPerRoom <= band.upTo)!.words;
}

/** A device's words, normalised for grouping: case, punctuation, dashes and spacing folded. */
export function sensorType(device: string | undefined): string {
  const folded = (device ?? '')
    .toLocaleLowerCase('en-US')
    .replace(/[‐-―−-]/g, ' ')
    .replace(/[^\p{L}\p{N}%]+/gu, ' ')
    .trim()
    .replace(/\s+/g, ' ');
  return folded === '' ? 'sensor type not recorded' : folded;
}

/** One recorded result; the latest of an item counts, the first tells whether its sample failed. */
export interface RecordedResult {
  itemId: string;
  result: 'pass' | 'fail';
  at: string;
}

export interface TestPlan {
  items: TestPlanItem[];
  groups: TestPlanGroup[];
  /** Controls the design requires but does not show as provided: nothing to test until they are. */
  gaps: string[];
}

// ---------------------------------------------------------------- sections

function family(edition: string): { iecc: boolean; year: string } {
  return { iecc: edition.startsWith('iecc-'), year: edition.replace(/^.*-/, '') };
}

function testSection(edition: string, kind: TestKind, requirementSection: string | undefined): string {
  const { iecc, year } = family(edition);
  const own = requirementSection ? `; the control itself: ${requirementSection}` : '';
  if (!iecc) {
    const number = year === '2013' ? '9.4.3' : '9.9';
    return `ASHRAE 90.1-${year} §${number} (number from memory)${own}`;
  }
  const sub =
    kind === 'occupant-sensor' ? 'C408.3.1.1' : kind === 'time-switch' ? 'C408.3.1.2' : kind === 'daylight' ? 'C408.3.1.3' : 'C408.3.1';
  return `IECC ${year} ${sub} (sub-section number from memory)${own}`;
}

// ---------------------------------------------------------------- steps in our words

function minutesWords(value: string | undefined, fallback: string): string {
  return value === undefined ? fallback : `${dec(value).toString()} minutes`;
}

function occupantSteps(control: ProvidedControl): { steps: string[]; expected: string } {
  const timeout = minutesWords(control.timeoutMinutes, 'the time-out set on the device (not recorded in the design: to verify)');
  const on =
    control.autoOn === 'manual'
      ? 'lights stay off until someone presses the switch'
      : control.autoOn === 'full'
        ? 'lights come on fully (allowed in this space type only)'
        : control.autoOn === 'partial'
          ? 'lights come on to no more than half'
          : 'lights come on as the design intends (how they turn on is not recorded: to verify)';
  return {
    steps: [
      'Check the sensor’s status light, where it has one, shows that it sees motion.',
      'Walk in: check how the lights come on.',
      'Press the manual off control: the lights go off while the room is occupied.',
      `Leave the room empty and time how long until the lights go off or down to the permitted level (design: ${timeout}).`,
      'With the room empty, move in the next space and in the doorway, and let air from the supply diffusers move: the lights stay off.',
    ],
    expected: `On entry ${on}; off or down to the permitted level within ${timeout} of the room being vacant, and never more than 20 minutes; no switching on from the next space or from air movement.`,
  };
}

function timeSwitchSteps(): { steps: string[]; expected: string } {
  return {
    steps: [
      'Check the controller’s date, time and time zone, and its daylight saving setting.',
      'Read the weekday, weekend and holiday programs against the owner’s hours.',
      'Set the clock to a minute before the next switching time and watch the lights change; repeat for an unoccupied period.',
      'Cut the controller’s power briefly: the program and the clock are kept.',
      'During an off period press the override: time how long the lights stay on.',
      'Hand the schedule and how to change it to the owner.',
    ],
    expected:
      'Lights follow every program; the program survives a power cut; an override keeps them on for no more than 2 hours (120 minutes).',
  };
}

function daylightSteps(strategy: string): { steps: string[]; expected: string } {
  const zone = strategy === 'daylight-toplighting' ? 'toplit zone under the skylights' : 'sidelit zone beside the windows';
  return {
    steps: [
      `Find the photosensor and the luminaires it controls in the ${zone}; check they are those the drawings show.`,
      'Check the calibration: measure the light level at the work plane in the zone, and compare with the set point on the controller.',
      'Raise the daylight (open the blinds, or shine a light at the sensor): the zone’s luminaires dim.',
      'Lower it (close the blinds, or cover the sensor): they return to full output.',
      'Check the luminaires outside the zone do not dim.',
    ],
    expected: `The ${zone} dims as daylight rises and recovers as it falls, holding the set point at the work plane; luminaires outside the zone are not affected.`,
  };
}

function lightReductionSteps(control: ProvidedControl): { steps: string[]; expected: string } {
  const by = control.reductionPercent === undefined ? 'at least 50 %' : `${dec(control.reductionPercent).toString()} % (design)`;
  return {
    steps: [
      'With the lights at full, use the reduction control (dimmer or step switch).',
      'Measure the light level at a few points of the room, at full and reduced.',
      'Check the reduction is spread evenly over the room, not by turning off one part.',
    ],
    expected: `The occupant can reduce the lighting by ${by}, and never less than 50 %, in a fairly even pattern.`,
  };
}

function partialOffSteps(control: ProvidedControl): { steps: string[]; expected: string } {
  const timeout = minutesWords(control.timeoutMinutes, 'the set time-out (not recorded in the design: to verify)');
  const by = control.reductionPercent === undefined ? 'at least 50 %' : `${dec(control.reductionPercent).toString()} % (design)`;
  return {
    steps: [
      'With the lights on, leave the space (or each zone of it) empty.',
      `Time how long until the lighting steps down (design: ${timeout}).`,
      'Measure the light level before and after the step.',
      'Walk back in: the lighting returns to full.',
    ],
    expected: `Within ${timeout} of vacancy, and never more than 20 minutes, the lighting drops by ${by}; it returns to full when someone comes back.`,
  };
}

function exteriorDaylightSteps(schedule: ScheduleSettings | undefined): { steps: string[]; expected: string } {
  const offsets = schedule
    ? `: on ${schedule.onMinutesBeforeSunset} min before sunset, off ${schedule.offMinutesAfterSunrise} min after sunrise, as the project’s schedule sets`
    : ', within the schedule’s offsets';
  return {
    steps: [
      'Check the astronomical clock’s location, date, time and time zone match the site, or find the photosensor and check it faces away from the lights it controls.',
      'Cover the photosensor, or set the clock to just after sunset: the lights come on.',
      'Uncover it, or set the clock to just after sunrise: the lights go off.',
    ],
    expected: `The lights are off whenever there is daylight and on only after sunset${offsets}.`,
  };
}

function exteriorSetbackSteps(strategy: string, schedule: ScheduleSettings | undefined): { steps: string[]; expected: string } {
  const off = strategy === 'exterior-facade-landscape-off';
  const window = schedule?.setback;
  const reduction = window?.reductionPercent !== undefined ? `${window.reductionPercent} %` : 'at least the edition’s figure';
  return {
    steps: [
      window
        ? `Read the setback window on the controller: the project’s schedule sets it from ${window.start} to ${window.end}; check it against the owner’s closing and opening hours.`
        : 'Read the setback or shutoff window on the controller against the owner’s closing and opening hours.',
      window
        ? `Set the clock to a minute before ${window.start} and watch the lights.`
        : 'Set the clock to a minute before the window starts and watch the lights.',
      off ? 'Check the lights go off.' : 'Measure the lighting power or light level before and after the step.',
      window
        ? `Set the clock to a minute before ${window.end} and watch the lights return.`
        : 'Set the clock to a minute before the window ends and watch the lights return.',
    ],
    expected: off
      ? `The facade or landscape lighting is off through the whole window (${window ? `${window.start} to ${window.end}` : 'midnight or closing to 6 a.m. or opening'}).`
      : `The lighting is reduced by ${reduction} through the whole window${window ? ` (${window.start} to ${window.end})` : ''}, then returns.`,
  };
}

// ---------------------------------------------------------------- sample choice

/** FNV-1a, 32 bits: a stable hash, so the same project always draws the same sample. */
function hash(text: string): number {
  let value = 0x811c9dc5;
  for (let index = 0; index < text.length; index++) {
    value ^= text.charCodeAt(index);
    value = Math.imul(value, 0x01000193) >>> 0;
  }
  return value;
}

/** The sample's size for a combination of `population` sensors, when the project has `total` in all. */
export function sampleSize(population: number, total: number): number {
  if (population <= 0) return 0;
  if (total <= testEachUpTo) return population;
  return Math.max(1, Math.ceil((population * samplePercent) / 100));
}

/**
 * The members of a combination chosen for its sample: sorted by their keys first (so the order the
 * design lists them in does not matter), then by a hash of the project id and each key, the first
 * `size` taken. The same design always gives the same sample; another project another draw.
 */
export function chooseSample(projectId: string, keys: readonly string[], size: number): Set<string> {
  const ordered = [...keys].sort().map((key) => ({ key, rank: hash(`${projectId}\u0000${key}`) }));
  ordered.sort((a, b) => a.rank - b.rank || (a.key < b.key ? -1 : a.key > b.key ? 1 : 0));
  return new Set(ordered.slice(0, size).map((entry) => entry.key));
}

/**
 * A combination's required items after the results so far: its sample, or all of it when 30 % or
 * more of the sample failed. A sample item counts as failed when its first test failed: a retest
 * after a repair does not take the finding back.
 */
export function widenedSample(
  group: Pick<TestPlanGroup, 'itemIds' | 'sampleSize'> & { sampleIds: readonly string[] },
  results: readonly RecordedResult[],
): { widened: boolean; failed: number; required: string[] } {
  const first = new Map<string, RecordedResult>();
  for (const result of [...results].sort((a, b) => (a.at < b.at ? -1 : a.at > b.at ? 1 : 0))) {
    if (!first.has(result.itemId)) first.set(result.itemId, result);
  }
  const failed = group.sampleIds.filter((id) => first.get(id)?.result === 'fail').length;
  const widened =
    group.sampleIds.length > 0 &&
    group.sampleIds.length < group.itemIds.length &&
    failed * 100 >= widenAtFailPercent * group.sampleIds.length;
  return { widened, failed, required: widened ? [...group.itemIds] : [...group.sampleIds] };
}

// ---------------------------------------------------------------- the plan

interface Unit {
  key: string;
  spaceId: string;
  title: string;
  control: ProvidedControl;
  combination: string;
  section: string | undefined;
}

function tested(control: ProvidedControl | undefined): control is ProvidedControl {
  return control !== undefined && control.provided && control.exceptionReason === undefined;
}

/** Words for a space type key the result does not name. */
function typeWords(key: string): string {
  return key.replace(/[-_]+/g, ' ');
}

/**
 * The plan from a validated document and its result. `projectId` seeds the sample's draw;
 * `results` (every recorded result, retests included) widen a combination whose sample failed.
 */
export function buildTestPlan(
  projectId: string,
  document: EvaluationDocument,
  result: EvaluationResult,
  results: readonly RecordedResult[] = [],
  /** The project's saved exterior schedule: the exterior tests name its offsets and window. */
  schedule?: ScheduleSettings,
): TestPlan {
  const items: TestPlanItem[] = [];
  const groups: TestPlanGroup[] = [];
  const gaps: string[] = [];
  const spaceResults = new Map(result.interior.spaces.map((space) => [space.id, space]));
  const sensorUnits: Unit[] = [];

  const lineOf = (lines: readonly ControlLine[], strategy: string) => lines.find((line) => line.strategy === strategy);
  const perKind = new Map<TestKind, TestPlanItem[]>();
  const add = (item: Omit<TestPlanItem, 'sample' | 'required'>) => {
    const full = { ...item, sample: true, required: true };
    items.push(full);
    perKind.set(item.kind, [...(perKind.get(item.kind) ?? []), full]);
  };

  for (const space of document.spaces) {
    const evaluated = spaceResults.get(space.id);
    const lines = evaluated?.controls ?? [];
    const rooms = space.rooms === undefined ? 1 : Math.max(1, Math.trunc(Number(space.rooms)));
    for (const control of space.controls) {
      const kind = kindOfStrategy[control.strategy];
      if (kind === undefined || !tested(control)) continue;
      const line = lineOf(lines, control.strategy);
      const where = space.name;
      if (kind === 'occupant-sensor') {
        const perRoom = areaToSquareFeet(dec(space.area), document.units).dividedBy(rooms).toNumber();
        const typeLabel = evaluated?.lpdBasis.label ?? typeWords(space.spaceType ?? space.controlSpaceType ?? 'space type not chosen');
        const combination = `${sensorType(control.device)} · ${typeLabel} · ${areaBand(perRoom)}`;
        for (let room = 1; room <= rooms; room++) {
          sensorUnits.push({
            key: rooms === 1 ? `${control.strategy}:${space.id}` : `${control.strategy}:${space.id}:${room}`,
            spaceId: space.id,
            title: rooms === 1 ? `Occupant sensor in ${where}` : `Occupant sensor in ${where}, room ${room} of ${rooms}`,
            control,
            combination,
            section: line?.section,
          });
        }
        continue;
      }
      const words =
        kind === 'time-switch'
          ? timeSwitchSteps()
          : kind === 'daylight'
            ? daylightSteps(control.strategy)
            : kind === 'light-reduction'
              ? lightReductionSteps(control)
              : partialOffSteps(control);
      add({
        id: `${kind}:${control.strategy}:${space.id}`,
        kind,
        title: `${line?.label ?? testKindLabels[kind]} in ${where}`,
        spaceIds: [space.id],
        ...words,
        section: testSection(document.edition, kind, line?.section),
      });
    }
    for (const line of lines) {
      const kind = kindOfStrategy[line.strategy];
      if (kind === undefined || line.status !== 'not-met') continue;
      if (space.controls.some((control) => control.strategy === line.strategy && tested(control))) continue;
      gaps.push(`${line.label} in ${space.name} is required but not shown as provided, so there is nothing to test yet (to verify).`);
    }
  }

  // Occupant sensors: every sensor is an item; the sample marks those to test.
  const totalSensors = sensorUnits.length;
  const byCombination = new Map<string, Unit[]>();
  for (const unit of sensorUnits) byCombination.set(unit.combination, [...(byCombination.get(unit.combination) ?? []), unit]);
  for (const [combination, units] of [...byCombination].sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0))) {
    const ids = units.map((unit) => `occupant-sensor:${unit.key}`);
    const size = sampleSize(units.length, totalSensors);
    const chosen = chooseSample(projectId, ids, size);
    const sampleIds = ids.filter((id) => chosen.has(id));
    const widening = widenedSample({ itemIds: ids, sampleSize: size, sampleIds }, results);
    const required = new Set(widening.required);
    units.forEach((unit, index) => {
      const id = ids[index]!;
      items.push({
        id,
        kind: 'occupant-sensor',
        title: unit.title,
        spaceIds: [unit.spaceId],
        combination,
        sample: chosen.has(id),
        required: required.has(id),
        ...occupantSteps(unit.control),
        section: testSection(document.edition, 'occupant-sensor', unit.section),
      });
    });
    const words =
      totalSensors <= testEachUpTo
        ? `The project has ${totalSensors} occupant sensors, ${testEachUpTo} or fewer: each one is tested.`
        : widening.widened
          ? size === 1
            ? 'The sensor chosen for the sample failed: every sensor of this combination is now to be tested.'
            : `${widening.failed} of the ${size} sensors in the sample failed, ${widenAtFailPercent} % or more: every sensor of this combination is now to be tested.`
          : units.length === 1
            ? 'The only sensor of this combination is tested.'
            : size === units.length
              ? `Each of the ${units.length} sensors is tested.`
              : `${size} of ${units.length} sensors (at least ${samplePercent} %, rounded up), chosen by a fixed draw for this project.`;
    groups.push({
      kind: 'occupant-sensor',
      combination,
      population: units.length,
      sampleSize: size,
      widened: widening.widened,
      words,
      itemIds: ids,
    });
  }

  // Exterior lighting: each application's provided controls.
  const applications = document.exterior?.applications ?? [];
  const applicationResults = result.exterior?.applications ?? [];
  applications.forEach((application, index) => {
    const evaluated = applicationResults[index];
    const label = evaluated?.label ?? typeWords(application.key);
    for (const control of application.controls) {
      const kind = kindOfStrategy[control.strategy];
      if ((kind !== 'exterior-daylight-off' && kind !== 'exterior-setback') || !tested(control)) continue;
      const line = evaluated ? lineOf(evaluated.controls, control.strategy) : undefined;
      add({
        id: `${kind}:${control.strategy}:${application.key}`,
        kind,
        title: `${line?.label ?? testKindLabels[kind]}: ${label}`,
        spaceIds: [],
        applicationKey: application.key,
        ...(kind === 'exterior-daylight-off' ? exteriorDaylightSteps(schedule) : exteriorSetbackSteps(control.strategy, schedule)),
        section: testSection(document.edition, kind, line?.section),
      });
    }
    for (const line of evaluated?.controls ?? []) {
      const kind = kindOfStrategy[line.strategy];
      if (kind === undefined || line.status !== 'not-met') continue;
      if (application.controls.some((control) => control.strategy === line.strategy && tested(control))) continue;
      gaps.push(`${line.label} for ${label} is required but not shown as provided, so there is nothing to test yet (to verify).`);
    }
  });

  for (const kind of testKinds) {
    const list = perKind.get(kind);
    if (kind === 'occupant-sensor' || !list?.length) continue;
    groups.push({
      kind,
      combination: 'each one',
      population: list.length,
      sampleSize: list.length,
      widened: false,
      words: list.length === 1 ? 'The only one is tested.' : `Each of the ${list.length} is tested.`,
      itemIds: list.map((item) => item.id),
    });
  }

  const order = new Map(testKinds.map((kind, index) => [kind, index]));
  items.sort((a, b) => order.get(a.kind)! - order.get(b.kind)!);
  return { items, groups, gaps };
}
