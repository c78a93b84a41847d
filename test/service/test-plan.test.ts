import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { FieldTestSummary } from '../../contract/field-tests.js';
import { signIn, testApp, type SignedInAgent } from '../support/app.js';
import { freshDatabase, type TestDatabase } from '../support/database.js';

/*
 * The functional test plan of the seeded demo project (IECC 2021; the tests after C408.3, the
 * sampling rule of C408.3.1.1 — sub-section number from memory) and the contractor's record.
 */

let database: TestDatabase;
let engineer: SignedInAgent;
let contractor: SignedInAgent;
let reviewer: SignedInAgent;
let projectId: string;

interface Item {
  id: string;
  kind: string;
  title: string;
  spaceIds: string[];
  sample: boolean;
  required: boolean;
  steps: string[];
  expected: string;
  section: string;
  combination?: string;
  result?: { result: string; measured: Record<string, string>; notes: string | null; by: { name: string } | null };
  history: { result: string }[];
}
interface Group {
  kind: string;
  combination: string;
  population: number;
  sampleSize: number;
  widened: boolean;
  words: string;
  itemIds: string[];
}
interface Plan {
  items: Item[];
  groups: Group[];
  notices: string[];
  progress: {
    required: number;
    passed: number;
    failed: number;
    untested: number;
    complete: boolean;
    kinds: { kind: string; required: number }[];
  };
}

beforeAll(async () => {
  database = await freshDatabase();
  const { app } = testApp(database.db, database.url);
  engineer = await signIn(app, 'engineer@alderbay.example');
  contractor = await signIn(app, 'contractor@alderbay.example');
  reviewer = await signIn(app, 'reviewer@alderbay.example');
  const projects = await engineer.agent.get('/api/projects');
  projectId = projects.body.find((project: { name: string }) => project.name === 'Alder Bay Library & Makerspace').id;
});

afterAll(async () => {
  await database.drop();
});

async function planFor(who: SignedInAgent): Promise<Plan> {
  const response = await who.agent.get(`/api/projects/${projectId}/test-plan`);
  expect(response.status, JSON.stringify(response.body)).toBe(200);
  return response.body;
}

function record(who: SignedInAgent, itemId: string, body: object) {
  return who.agent
    .patch(`/api/projects/${projectId}/test-plan/items/${encodeURIComponent(itemId)}`)
    .set('X-CSRF-Token', who.csrfToken)
    .send(body);
}

function count(plan: Plan, kind: string, which: 'all' | 'required' = 'all'): number {
  return plan.items.filter((item) => item.kind === kind && (which === 'all' || item.required)).length;
}

describe('the demo project’s test plan', () => {
  it('lists every kind of test the design has, with the sample of the occupant sensors', async () => {
    const plan = await planFor(reviewer);
    // The demo's design (schema/seeds/demo-project.ts): 21 spaces with an occupant sensor in 14
    // combinations of sensor type, space type and area band. 21 > 7, so each combination's sample
    // is 10 % rounded up, no fewer than one: 1 for each of the 14 (the largest has 3 sensors).
    expect(count(plan, 'occupant-sensor')).toBe(21);
    const sensorGroups = plan.groups.filter((group) => group.kind === 'occupant-sensor');
    expect(sensorGroups).toHaveLength(14);
    expect(sensorGroups.every((group) => group.sampleSize === 1)).toBe(true);
    expect(count(plan, 'occupant-sensor', 'required')).toBe(14);
    expect(sensorGroups.find((group) => group.combination.includes('Office — Enclosed'))).toMatchObject({ population: 3, sampleSize: 1 });
    // Every other provided control is tested: 6 time switches, 4 sidelighting controls, 19 light
    // reductions, 4 automatic partial-off, and each of the 5 exterior applications' daylight off and
    // setback (the facade's being its shutoff).
    expect(count(plan, 'time-switch')).toBe(6);
    expect(count(plan, 'daylight')).toBe(4);
    expect(count(plan, 'light-reduction')).toBe(19);
    expect(count(plan, 'partial-off')).toBe(4);
    expect(count(plan, 'exterior-daylight-off')).toBe(5);
    expect(count(plan, 'exterior-setback')).toBe(5);
    expect(plan.items).toHaveLength(64);
    expect(plan.progress).toMatchObject({ required: 57, passed: 0, failed: 0, untested: 57, complete: false });
    expect(plan.notices).toEqual([]);
    for (const item of plan.items) {
      expect(item.steps.length, item.title).toBeGreaterThanOrEqual(3);
      expect(item.expected, item.title).not.toBe('');
      expect(item.section, item.title).toMatch(/^IECC 2021 C408\.3\.1/);
      expect(item.history).toEqual([]);
    }
  });

  it('names the project’s saved exterior schedule in the exterior tests', async () => {
    // The demo's schedule (schema/seeds/02_demo_project.ts): set back from 23:00 to 06:00 by 50 %, on and off 10 min from sunset and sunrise.
    const plan = await planFor(contractor);
    const setback = plan.items.find((item) => item.kind === 'exterior-setback' && !item.title.includes('facade'))!;
    expect(setback.expected).toContain('reduced by 50 % through the whole window (23:00 to 06:00)');
    expect(setback.steps.join(' ')).toContain('a minute before 23:00');
    const daylight = plan.items.find((item) => item.kind === 'exterior-daylight-off')!;
    expect(daylight.expected).toContain('off 10 min after sunrise');
  });

  it('draws the same sample on every read', async () => {
    const first = (await planFor(engineer)).items.filter((item) => item.sample).map((item) => item.id);
    const again = (await planFor(contractor)).items.filter((item) => item.sample).map((item) => item.id);
    expect(again).toEqual(first);
  });
});

describe('recording the tests', () => {
  it('refuses the engineer and the reviewer (403): recording is the contractor’s', async () => {
    const item = (await planFor(engineer)).items.find((entry) => entry.kind === 'time-switch')!;
    expect((await record(engineer, item.id, { result: 'pass' })).status).toBe(403);
    expect((await record(reviewer, item.id, { result: 'pass' })).status).toBe(403);
  });

  it('answers 404 for an item the plan does not have, and 400 for values out of bounds', async () => {
    const unknown = await record(contractor, 'time-switch:time-switch:00000000-0000-0000-0000-000000000000', { result: 'pass' });
    expect(unknown.status).toBe(404);
    expect((await record(contractor, 'not an item', { result: 'pass' })).status).toBe(404);
    const item = (await planFor(contractor)).items.find((entry) => entry.kind === 'time-switch')!;
    expect((await record(contractor, item.id, { result: 'maybe' })).status).toBe(400);
    expect((await record(contractor, item.id, { result: 'pass', measured: { overrideMinutes: 2000 } })).status).toBe(400);
    expect((await record(contractor, item.id, { result: 'pass', measured: { lightLevel: -1 } })).status).toBe(400);
    expect((await record(contractor, item.id, { result: 'pass', notes: 'x'.repeat(2001) })).status).toBe(400);
    expect((await record(contractor, item.id, { result: 'pass', extra: 1 })).status).toBe(400);
    expect((await planFor(contractor)).items.find((entry) => entry.id === item.id)!.history).toEqual([]);
  });

  it('keeps a failed test and its retest in the item’s history, the latest counting', async () => {
    const item = (await planFor(contractor)).items.find((entry) => entry.kind === 'time-switch')!;
    const failed = await record(contractor, item.id, {
      result: 'fail',
      measured: { overrideMinutes: 180 },
      notes: 'Override held the lights for three hours.',
    });
    expect(failed.status, JSON.stringify(failed.body)).toBe(200);
    expect(failed.body.item.result).toMatchObject({ result: 'fail', measured: { overrideMinutes: '180' }, by: { name: 'Noor Abernathy' } });
    const passed = await record(contractor, item.id, { result: 'pass', measured: { overrideMinutes: '120' } });
    expect(passed.status).toBe(200);
    const after = (await planFor(engineer)).items.find((entry) => entry.id === item.id)!;
    expect(after.history.map((entry) => entry.result)).toEqual(['fail', 'pass']);
    expect(after.result).toMatchObject({ result: 'pass', measured: { overrideMinutes: '120' }, notes: null });
    const progress = (await planFor(engineer)).progress;
    expect(progress).toMatchObject({ required: 57, passed: 1, failed: 0, untested: 56 });
  });

  it('widens a combination whose sample failed: the other sensors become required and the plan says so', async () => {
    const plan = await planFor(contractor);
    const group = plan.groups.find((entry) => entry.combination.includes('Office — Enclosed'))!;
    const chosen = plan.items.find((item) => group.itemIds.includes(item.id) && item.sample)!;
    const response = await record(contractor, chosen.id, { result: 'fail', measured: { timeoutMinutes: 35, lightLevel: 42.5 } });
    expect(response.status).toBe(200);
    expect(response.body.group).toMatchObject({ population: 3, sampleSize: 1, widened: true });
    expect(response.body.item.result.measured).toEqual({ timeoutMinutes: '35', lightLevel: '42.5' });
    const after = await planFor(reviewer);
    const members = after.items.filter((item) => group.itemIds.includes(item.id));
    expect(members.map((item) => item.required)).toEqual([true, true, true]);
    expect(count(after, 'occupant-sensor', 'required')).toBe(16);
    expect(after.notices).toEqual([
      expect.stringMatching(/^The sensor chosen for the sample failed: every sensor of this combination is now to be tested/),
    ]);
    // A passing retest after the repair does not take the finding back.
    await record(contractor, chosen.id, { result: 'pass' });
    expect((await planFor(reviewer)).groups.find((entry) => entry.combination === group.combination)!.widened).toBe(true);
  });

  it('shows each test in the project’s history, in order, with the result and values', async () => {
    const response = await engineer.agent.get(`/api/projects/${projectId}/history?limit=10`);
    expect(response.status).toBe(200);
    const tests = response.body.entries.filter((entry: { entity: string }) => entry.entity === 'field-test');
    expect(tests.map((entry: { action: string }) => entry.action)).toEqual(['retest', 'record', 'retest', 'record']);
    expect(tests[3]).toMatchObject({
      user: { name: 'Noor Abernathy' },
      name: expect.stringMatching(/^Time-switch control in /),
      fieldTest: {
        result: 'fail',
        measured: { overrideMinutes: '180' },
        notes: 'Override held the lights for three hours.',
        retest: false,
      },
    });
    expect(tests[1]).toMatchObject({
      fieldTest: { result: 'fail', measured: { timeoutMinutes: '35', lightLevel: '42.5' }, lightLevelUnit: 'fc' },
    });
  });

  it('refuses a test on an archived project (409), which still shows its plan and results', async () => {
    const item = (await planFor(contractor)).items.find((entry) => entry.kind === 'daylight')!;
    const archive = await engineer.agent.post(`/api/projects/${projectId}/archive`).set('X-CSRF-Token', engineer.csrfToken);
    expect(archive.status).toBe(200);
    const refused = await record(contractor, item.id, { result: 'pass' });
    expect(refused.status).toBe(409);
    expect(refused.body.error.code).toBe('archived');
    // The time switch and the office sensor retested above.
    expect((await planFor(contractor)).progress.passed).toBe(2);
    await engineer.agent.post(`/api/projects/${projectId}/unarchive`).set('X-CSRF-Token', engineer.csrfToken);
  });
});

describe('where testing stands, on the project', () => {
  async function listed(): Promise<FieldTestSummary | null> {
    const response = await engineer.agent.get('/api/projects');
    expect(response.status).toBe(200);
    return response.body.find((project: { id: string }) => project.id === projectId).fieldTests;
  }
  async function detail(who: SignedInAgent): Promise<FieldTestSummary | null> {
    const response = await who.agent.get(`/api/projects/${projectId}`);
    expect(response.status).toBe(200);
    return response.body.fieldTests;
  }

  it('lists the plan’s progress with the project once the plan is read, and says testing is complete when every required test passed', async () => {
    const plan = await planFor(contractor);
    const { required, passed, failed, untested } = plan.progress;
    expect(passed).toBeGreaterThan(0);
    expect(await listed()).toEqual({ required, passed, failed, untested, complete: false, completedAt: null });

    let last = '';
    for (const item of plan.items.filter((entry) => entry.required && entry.result?.result !== 'pass')) {
      const response = await record(contractor, item.id, { result: 'pass' });
      expect(response.status, JSON.stringify(response.body)).toBe(200);
      last = response.body.item.result.at;
    }
    const after = await planFor(contractor);
    expect(after.progress.complete).toBe(true);
    const complete = {
      required: after.progress.required,
      passed: after.progress.required,
      failed: 0,
      untested: 0,
      complete: true,
      completedAt: last,
    };
    expect(await listed()).toEqual(complete);
    expect(await detail(reviewer)).toEqual(complete);
  });

  it('drops the summary from the list when the design changes, and makes the plan again when the project is read', async () => {
    const space = (await engineer.agent.get(`/api/projects/${projectId}/spaces`)).body.find(
      (entry: { name: string }) => entry.name === '201 Makerspace',
    ) as { id: string; version: number };
    const changed = await engineer.agent
      .patch(`/api/projects/${projectId}/spaces/${space.id}`)
      .set('X-CSRF-Token', engineer.csrfToken)
      .send({ version: space.version, name: '201 Makerspace and lab' });
    expect(changed.status, JSON.stringify(changed.body)).toBe(200);
    expect(await listed()).toBeNull();
    // The project read makes the plan from the design as it now is; the renamed room keeps its tests.
    expect(await detail(contractor)).toMatchObject({ complete: true, untested: 0 });
    expect(await listed()).toMatchObject({ complete: true });
  });

  it('says nothing about testing for a project where no test is recorded', async () => {
    const copied = await engineer.agent
      .post(`/api/projects/${projectId}/copy`)
      .set('X-CSRF-Token', engineer.csrfToken)
      .send({ name: 'Alder Bay copy for testing' });
    expect(copied.status, JSON.stringify(copied.body)).toBe(201);
    expect(copied.body.fieldTests).toBeNull();
    const read = await engineer.agent.get(`/api/projects/${copied.body.id}`);
    expect(read.body.fieldTests).toBeNull();
  });
});
