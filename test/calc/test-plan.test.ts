import { describe, expect, it } from 'vitest';
import { evaluate, validateDocument, type EvaluationDocumentInput } from '../../service/src/compliance/index.js';
import {
  areaBand,
  buildTestPlan,
  sampleSize,
  sensorType,
  widenedSample,
  type RecordedResult,
  type TestPlan,
} from '../../service/src/field-tests/test-plan.js';
import { iecc2021 } from './fixtures.js';

/*
 * The sampling rule, from IECC 2021 C408.3.1.1 as the design primer gives it (DOMAIN.md §6, after
 * C408.3 [S-ed]; the sub-section number from memory): seven or fewer occupant sensors in the
 * project → each tested; more → each unique combination of sensor type and space geometry, at
 * least 10 % of each combination (rounded up) and no fewer than one; when 30 % or more of those
 * tested fail, all the rest of that combination are tested.
 */

const device = 'Ceiling dual-technology occupant sensor';

type SpaceInput = EvaluationDocumentInput['spaces'][number];

/** `count` storage rooms of 200 ft², each with one occupant sensor of `sensor`. */
function storageRooms(count: number, sensor = device, prefix = 's'): SpaceInput[] {
  return Array.from({ length: count }, (_, index) => ({
    id: `${prefix}${String(index + 1).padStart(3, '0')}`,
    name: `Storage ${prefix}${index + 1}`,
    spaceType: 'storage',
    area: 200,
    luminaires: [{ tag: 'L', count: 1 }],
    controls: [{ strategy: 'occupant-sensor', provided: true, timeoutMinutes: 15, autoOn: 'partial', device: sensor }],
  }));
}

function documentOf(spaces: SpaceInput[], extra: Partial<EvaluationDocumentInput> = {}): EvaluationDocumentInput {
  return {
    edition: 'iecc-2021',
    method: 'space-by-space',
    units: 'ip',
    luminaireTypes: [{ tag: 'L', description: 'troffer', inputWatts: 30, use: 'general' }],
    spaces,
    ...extra,
  };
}

function plan(input: EvaluationDocumentInput, projectId = 'project-a', results: RecordedResult[] = []): TestPlan {
  const outcome = validateDocument(input, iecc2021);
  if (!outcome.valid) throw new Error(JSON.stringify(outcome.problems));
  return buildTestPlan(projectId, outcome.document, evaluate(outcome.document, iecc2021), results);
}

const sensors = (built: TestPlan) => built.items.filter((item) => item.kind === 'occupant-sensor');
const sampled = (built: TestPlan) => sensors(built).filter((item) => item.sample);

describe('the occupant sensor sample (IECC 2021 C408.3.1.1)', () => {
  it('tests each of 7 sensors: seven or fewer are each tested', () => {
    const built = plan(documentOf(storageRooms(7)));
    expect(sensors(built)).toHaveLength(7);
    expect(sampled(built)).toHaveLength(7);
    expect(built.groups.filter((group) => group.kind === 'occupant-sensor')).toEqual([
      expect.objectContaining({ population: 7, sampleSize: 7, widened: false }),
    ]);
  });

  it('tests 1 of 8 alike sensors: 10 % of 8 is 0.8, rounded up to 1', () => {
    const built = plan(documentOf(storageRooms(8)));
    expect(sensors(built)).toHaveLength(8);
    expect(sampled(built)).toHaveLength(1);
    expect(built.groups[0]).toMatchObject({ population: 8, sampleSize: 1 });
  });

  it('tests 7 of 70 (10 % of 70 is exactly 7) and 8 of 71 (7.1 rounded up)', () => {
    expect(sampled(plan(documentOf(storageRooms(70))))).toHaveLength(7);
    expect(sampled(plan(documentOf(storageRooms(71))))).toHaveLength(8);
    expect(sampleSize(70, 70)).toBe(7);
    expect(sampleSize(71, 71)).toBe(8);
  });

  it('samples each combination on its own once the project has more than seven: 5 + 3 sensors give 1 + 1', () => {
    const built = plan(documentOf([...storageRooms(5), ...storageRooms(3, 'Wall switch vacancy sensor', 'w')]));
    const groups = built.groups.filter((group) => group.kind === 'occupant-sensor');
    expect(groups.map((group) => [group.population, group.sampleSize])).toEqual([
      [5, 1],
      [3, 1],
    ]);
    expect(sampled(built)).toHaveLength(2);
  });

  it('tells combinations apart by the device’s words (normalised) and by the space geometry', () => {
    expect(sensorType('Ceiling  Dual-Technology occupant sensor')).toBe(sensorType('ceiling dual technology occupant sensor.'));
    expect(sensorType(undefined)).toBe('sensor type not recorded');
    expect(areaBand(300)).toBe('up to 300 ft²');
    expect(areaBand(301)).toBe('300 to 1,000 ft²');
    const large = storageRooms(4).map((space) => ({ ...space, id: `big-${space.id}`, area: 1200 }));
    const built = plan(documentOf([...storageRooms(4), ...large]));
    expect(built.groups.filter((group) => group.kind === 'occupant-sensor').map((group) => group.combination)).toEqual([
      'ceiling dual technology occupant sensor · Storage room · 1,000 to 2,500 ft²',
      'ceiling dual technology occupant sensor · Storage room · up to 300 ft²',
    ]);
  });

  it('counts a space entry standing for several like rooms as one sensor per room, banded by the area of one room', () => {
    const grouped: SpaceInput = { ...storageRooms(1)[0]!, rooms: 10, area: 2000 };
    const built = plan(documentOf([grouped]));
    // 10 rooms of 200 ft²: more than seven, one combination, 10 % of 10 → 1.
    expect(sensors(built)).toHaveLength(10);
    expect(built.groups[0]).toMatchObject({ population: 10, sampleSize: 1, combination: expect.stringContaining('up to 300 ft²') });
  });
});

describe('the widened sample after failures (IECC 2021 C408.3.1.1: 30 % or more failing)', () => {
  const itemIds = Array.from({ length: 100 }, (_, index) => `occupant-sensor:occupant-sensor:s${index}`);
  // 100 sensors → a sample of 10 (10 %); 3 failures are 30 %, 2 are 20 %.
  const group = { itemIds, sampleSize: 10, sampleIds: itemIds.slice(0, 10) };
  const at = (minute: number) => `2026-12-03T10:${String(minute).padStart(2, '0')}:00.000Z`;

  it('stays at the sample with 2 of 10 failed (20 %)', () => {
    const results: RecordedResult[] = [0, 1].map((index) => ({ itemId: itemIds[index]!, result: 'fail', at: at(index) }));
    expect(widenedSample(group, results)).toEqual({ widened: false, failed: 2, required: itemIds.slice(0, 10) });
  });

  it('widens to all 100 with 3 of 10 failed (30 %), and a passing retest does not take it back', () => {
    const results: RecordedResult[] = [0, 1, 2].map((index) => ({ itemId: itemIds[index]!, result: 'fail', at: at(index) }));
    expect(widenedSample(group, results)).toMatchObject({ widened: true, failed: 3 });
    expect(widenedSample(group, results).required).toHaveLength(100);
    const retested = [...results, { itemId: itemIds[2]!, result: 'pass' as const, at: at(30) }];
    expect(widenedSample(group, retested).widened).toBe(true);
  });

  it('ignores failures outside the sample', () => {
    const results: RecordedResult[] = [50, 51, 52].map((index) => ({ itemId: itemIds[index]!, result: 'fail', at: at(index - 50) }));
    expect(widenedSample(group, results).widened).toBe(false);
  });

  it('widens through the plan: 1 of the 8 sampled fails (100 %), so all 8 are required and the group says so', () => {
    const before = plan(documentOf(storageRooms(8)));
    const chosen = sampled(before)[0]!;
    const after = plan(documentOf(storageRooms(8)), 'project-a', [{ itemId: chosen.id, result: 'fail', at: at(0) }]);
    expect(sensors(after).filter((item) => item.required)).toHaveLength(8);
    expect(sampled(after)).toEqual([expect.objectContaining({ id: chosen.id })]);
    expect(after.groups[0]).toMatchObject({ widened: true, sampleSize: 1, population: 8 });
    expect(after.groups[0]!.words).toBe('The sensor chosen for the sample failed: every sensor of this combination is now to be tested.');
  });
});

describe('the sample is chosen reproducibly', () => {
  it('draws the same sensors for the same project whatever order the design lists them in', () => {
    const spaces = storageRooms(71);
    const first = sampled(plan(documentOf(spaces))).map((item) => item.id);
    const again = sampled(plan(documentOf([...spaces].reverse()))).map((item) => item.id);
    expect(first).toHaveLength(8);
    expect([...again].sort()).toEqual([...first].sort());
  });

  it('draws another sample for another project', () => {
    const spaces = storageRooms(71);
    const a = sampled(plan(documentOf(spaces), 'project-a')).map((item) => item.id);
    const b = sampled(plan(documentOf(spaces), 'project-b')).map((item) => item.id);
    expect(new Set(b)).not.toEqual(new Set(a));
  });
});

describe('the other tests of the plan', () => {
  const office: SpaceInput = {
    id: 'office',
    name: 'Office 1',
    spaceType: 'office-enclosed',
    area: 150,
    luminaires: [{ tag: 'L', count: 2 }],
    controls: [
      { strategy: 'occupant-sensor', provided: true, timeoutMinutes: 20, autoOn: 'manual', device },
      { strategy: 'light-reduction', provided: true, reductionPercent: 60, device: 'Dimmer' },
    ],
  };
  const store: SpaceInput = {
    id: 'lobby',
    name: 'Lobby',
    spaceType: 'lobby',
    area: 800,
    luminaires: [{ tag: 'L', count: 4 }],
    controls: [{ strategy: 'time-switch', provided: true, device: 'Panel schedule' }],
  };
  const exterior = {
    lightingZone: '2',
    applications: [
      {
        key: 'parking',
        quantity: 10000,
        installedWatts: 300,
        controls: [
          { strategy: 'exterior-daylight-off', provided: true, device: 'Astronomical clock' },
          { strategy: 'exterior-setback', provided: false },
        ],
      },
    ],
  };
  const built = plan(documentOf([office, store], { exterior }));

  it('lists the time switch with the override limit of 2 hours and its section', () => {
    const item = built.items.find((entry) => entry.kind === 'time-switch')!;
    expect(item).toMatchObject({ id: 'time-switch:time-switch:lobby', spaceIds: ['lobby'], sample: true, required: true });
    expect(item.steps.length).toBeGreaterThanOrEqual(4);
    expect(item.steps.some((step) => step.includes('override'))).toBe(true);
    expect(item.expected).toContain('no more than 2 hours');
    expect(item.section).toMatch(/^IECC 2021 C408\.3\.1\.2 .*C405\.2\.2/);
  });

  it('gives the occupant sensor the design’s time-out and the manual-on behaviour', () => {
    const item = built.items.find((entry) => entry.kind === 'occupant-sensor')!;
    expect(item.expected).toContain('within 20 minutes');
    expect(item.expected).toContain('stay off until someone presses the switch');
    expect(item.section).toMatch(/^IECC 2021 C408\.3\.1\.1/);
  });

  it('tests the light reduction by the design’s figure', () => {
    const item = built.items.find((entry) => entry.kind === 'light-reduction')!;
    expect(item.expected).toContain('60 % (design)');
  });

  it('tests the exterior daylight off, and names the required setback that is not provided as a gap', () => {
    const item = built.items.find((entry) => entry.kind === 'exterior-daylight-off')!;
    expect(item).toMatchObject({ id: 'exterior-daylight-off:exterior-daylight-off:parking', applicationKey: 'parking', spaceIds: [] });
    expect(built.items.some((entry) => entry.kind === 'exterior-setback')).toBe(false);
    expect(built.gaps).toEqual([expect.stringMatching(/setback for Parking lots and drives is required but not shown as provided/)]);
  });

  it('cites 90.1’s functional testing section for a 90.1 design', async () => {
    const { ashrae2019 } = await import('./fixtures.js');
    const input: EvaluationDocumentInput = {
      edition: 'ashrae-90.1-2019',
      method: 'space-by-space',
      units: 'ip',
      luminaireTypes: [{ tag: 'L', description: 'troffer', inputWatts: 30, use: 'general' }],
      spaces: [
        {
          id: 'o',
          name: 'Office',
          spaceType: ashrae2019.spaceTypes[0]!.key,
          area: 150,
          luminaires: [{ tag: 'L', count: 1 }],
          controls: [{ strategy: 'automatic-full-off', provided: true, timeoutMinutes: 20, device }],
        },
      ],
    };
    const outcome = validateDocument(input, ashrae2019);
    if (!outcome.valid) throw new Error(JSON.stringify(outcome.problems));
    const built90 = buildTestPlan('p', outcome.document, evaluate(outcome.document, ashrae2019));
    expect(built90.items[0]).toMatchObject({ kind: 'occupant-sensor' });
    expect(built90.items[0]!.section).toMatch(/^ASHRAE 90\.1-2019 §9\.9 \(number from memory\)/);
  });
});

describe('the widening words for a larger sample', () => {
  it('counts the failures: 3 of 8 sampled from 71 fail (37.5 %, 30 % or more)', () => {
    const spaces = storageRooms(71);
    const chosen = sampled(plan(documentOf(spaces))).slice(0, 3);
    const results = chosen.map((item, index) => ({ itemId: item.id, result: 'fail' as const, at: `2026-12-03T10:0${index}:00.000Z` }));
    const after = plan(documentOf(spaces), 'project-a', results);
    expect(after.groups[0]).toMatchObject({ widened: true, sampleSize: 8 });
    expect(after.groups[0]!.words).toBe(
      '3 of the 8 sensors in the sample failed, 30 % or more: every sensor of this combination is now to be tested.',
    );
    expect(sensors(after).filter((item) => item.required)).toHaveLength(71);
    // 2 of 8 is 25 %: below 30 %, the sample stays.
    expect(plan(documentOf(spaces), 'project-a', results.slice(0, 2)).groups[0]!.widened).toBe(false);
  });
});
