import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { ProjectState, ReviewDeskEntry, ReviewItem } from '../../contract/review.js';
import { signIn, testApp, type SignedInAgent } from '../support/app.js';
import { freshDatabase, type TestDatabase } from '../support/database.js';
import { reviewDeskEntrySchema, reviewItemSchema } from '../../service/src/review/review.schema.js';

/**
 * The reviewer's check items on the seeded demo project (IECC 2021, space by space): generated on
 * submission, verdicts by role and state, acceptance, threads, carry-over between rounds, bulk
 * confirmation, the review desk and the history. One scenario: each step builds on the last.
 */

let database: TestDatabase;
let engineer: SignedInAgent;
let reviewer: SignedInAgent;
let contractor: SignedInAgent;
let admin: SignedInAgent;
let projectId: string;
let otherId: string;

beforeAll(async () => {
  database = await freshDatabase();
  const { app } = testApp(database.db, database.url);
  engineer = await signIn(app, 'engineer@alderbay.example');
  reviewer = await signIn(app, 'reviewer@alderbay.example');
  contractor = await signIn(app, 'contractor@alderbay.example');
  admin = await signIn(app, 'admin@alderbay.example');
  const projects = await engineer.agent.get('/api/projects');
  projectId = projects.body.find((project: { name: string }) => project.name === 'Alder Bay Library & Makerspace').id;
  // An invented second project, with the same reviewer and nothing designed yet.
  const created = await engineer.agent
    .post('/api/projects')
    .set('X-CSRF-Token', engineer.csrfToken)
    .send({ name: 'Harbour Ferry Terminal', edition: 'iecc-2021', method: 'space-by-space', units: 'ip' });
  otherId = created.body.id;
  await engineer.agent
    .post(`/api/projects/${otherId}/members`)
    .set('X-CSRF-Token', engineer.csrfToken)
    .send({ email: 'reviewer@alderbay.example', role: 'reviewer' })
    .expect(200);
});

afterAll(async () => {
  await database.drop();
});

async function move(who: SignedInAgent, to: ProjectState, comment?: string, id = projectId) {
  const { version } = (await database.db('projects').where({ id }).first('version'))!;
  return who.agent
    .post(`/api/projects/${id}/transitions`)
    .set('X-CSRF-Token', who.csrfToken)
    .send({ to, version, ...(comment ? { comment } : {}) });
}

async function items(who: SignedInAgent = reviewer): Promise<ReviewItem[]> {
  const answer = await who.agent.get(`/api/projects/${projectId}/review-items`);
  expect(answer.status).toBe(200);
  return answer.body;
}

function item(list: ReviewItem[], title: string): ReviewItem {
  const found = list.find((candidate) => candidate.title === title);
  if (!found) throw new Error(`no item “${title}”`);
  return found;
}

function verdict(who: SignedInAgent, itemId: string, body: object) {
  return who.agent.patch(`/api/projects/${projectId}/review-items/${itemId}`).set('X-CSRF-Token', who.csrfToken).send(body);
}

function reply(who: SignedInAgent, itemId: string, text: string) {
  return who.agent.post(`/api/projects/${projectId}/review-items/${itemId}/replies`).set('X-CSRF-Token', who.csrfToken).send({ text });
}

function bulk(who: SignedInAgent, confirm: object) {
  return who.agent.post(`/api/projects/${projectId}/review-items/bulk`).set('X-CSRF-Token', who.csrfToken).send({ confirm });
}

async function desk(who: SignedInAgent): Promise<ReviewDeskEntry[]> {
  const answer = await who.agent.get('/api/review-desk');
  expect(answer.status).toBe(200);
  return answer.body;
}

const corridorSensing = '111 Corridor: Occupancy sensing';

describe('check items', () => {
  it('are none before the first submission, and the desk shows the project as never submitted', async () => {
    expect(await items()).toEqual([]);
    expect((await desk(reviewer)).find((entry) => entry.projectId === projectId)).toMatchObject({
      state: 'draft',
      round: 0,
      submittedAt: null,
      total: 0,
    });
  });

  it('refuses to submit a design whose results cannot be computed, in words', async () => {
    const refused = await move(engineer, 'in-review', undefined, otherId);
    expect(refused.status).toBe(409);
    expect(refused.body.error.message).toMatch(/cannot be submitted until its results can be computed/);
    expect(refused.body.error.message).toMatch(/Results page/);
  });

  it('are generated when the engineer submits, with the section, the values and the engine’s reasoning', async () => {
    expect((await move(engineer, 'in-review')).status).toBe(200);
    const list = await items(contractor);
    // The answer is what the served description says, field for field.
    reviewItemSchema.array().parse(list);
    const document = (await engineer.agent.get(`/api/projects/${projectId}/document`)).body as { spaces: unknown[] };
    expect(list.filter((entry) => entry.kind === 'power-allowance')).toHaveLength(document.spaces.length);
    expect(list.every((entry) => entry.round === 1 && entry.verdict === null && !entry.changed && entry.thread.length === 0)).toBe(true);

    const power = item(list, '102 Main reading room: Power allowance');
    // IECC 2021 Table C405.3.2(2): library reading area 0.96 W/ft² (the reference files' row); 0.96 × 2,400 ft² = 2,304 W.
    expect(power).toMatchObject({ section: 'IECC 2021 §C405.3.2.2', outcome: 'met' });
    expect(power.values).toEqual(
      expect.arrayContaining([
        { label: 'Floor area', value: '2,400 ft²' },
        { label: 'Allowed density', value: '0.96 W/ft²' },
        { label: 'Allowance', value: '2,304 W' },
      ]),
    );
    expect(power.reasoning).toMatch(/^Installed [\d,]+ W is within the allowance of 2,304 W/);

    // IECC 2021 §C405.2.1: occupant sensor controls (a lobby is not on its list, and is larger than 300 ft²).
    const lobby = item(list, '101 Entry lobby: Occupancy sensing');
    expect(lobby).toMatchObject({ section: 'IECC 2021 §C405.2.1', outcome: 'not-required' });
    expect(lobby.reasoning).toMatch(/not on the occupant-sensor list/);
    expect(lobby.values).toContainEqual({ label: 'Floor area', value: '600 ft²' });

    // IECC 2021 §C405.2.4: daylight-responsive controls.
    const daylight = item(list, '102 Main reading room: Daylight response');
    expect(daylight.outcome).toBe('met');
    expect(daylight.section).toBe('IECC 2021 §C405.2.4');
    expect(daylight.values.map((value) => value.label)).toEqual(expect.arrayContaining(['Window area', 'Primary sidelit zone']));

    // IECC 2021 §C405.5.2: the exterior allowance; C405.2.7: exterior controls.
    expect(item(list, 'Site: Exterior power')).toMatchObject({ section: 'IECC 2021 §C405.5.2', outcome: 'met' });
    expect(item(list, 'Site: Exterior controls').section).toMatch(/^IECC 2021 §C405\.2\.7/);
    // Words only: no keys or ids in what people read.
    for (const entry of list)
      expect(`${entry.title} ${entry.reasoning} ${JSON.stringify(entry.values)}`).not.toMatch(/[a-z]+-[a-z]+-[a-z]+|undefined|NaN/);

    const round = await database.db('review_rounds').where({ project_id: projectId }).first('number', 'revision', 'result', 'closed_at');
    expect(round).toMatchObject({ number: 1, revision: 1, closed_at: null });
    expect(round.result.edition).toBe('iecc-2021');
  });

  it('takes verdicts from the reviewer only, while in review; Needs revision needs a comment', async () => {
    const target = item(await items(), corridorSensing);
    expect((await verdict(contractor, target.id, { verdict: 'confirmed' })).status).toBe(403);
    expect((await verdict(engineer, target.id, { verdict: 'confirmed' })).status).toBe(403);
    const bare = await verdict(reviewer, target.id, { verdict: 'needs-revision', comment: '   ' });
    expect(bare.status).toBe(400);
    expect(bare.body.error.details).toContainEqual(expect.objectContaining({ path: 'comment' }));
    expect((await verdict(reviewer, target.id, { verdict: 'maybe' })).status).toBe(400);
    expect((await verdict(reviewer, target.id, { verdict: 'confirmed', comment: 'x'.repeat(2001) })).status).toBe(400);
    const notAnId = await verdict(reviewer, 'not-an-id', { verdict: 'confirmed' });
    expect(notAnId.status).toBe(404);
    expect(notAnId.body.error.code).toBe('not_found');
    expect((await verdict(reviewer, '00000000-0000-4000-8000-000000000000', { verdict: 'confirmed' })).status).toBe(404);

    const marked = await verdict(reviewer, target.id, {
      verdict: 'needs-revision',
      comment: '  Show the corridor sensors’ time-out at 15 minutes.  ',
    });
    expect(marked.status).toBe(200);
    expect(marked.body).toMatchObject({ id: target.id, verdict: 'needs-revision' });
    expect(marked.body.thread).toEqual([
      expect.objectContaining({
        by: reviewer.user.name,
        role: 'reviewer',
        verdict: 'needs-revision',
        text: 'Show the corridor sensors’ time-out at 15 minutes.',
        round: 1,
      }),
    ]);
  });

  it('keeps a thread of replies from the engineer and the reviewer, never the contractor', async () => {
    const target = item(await items(), corridorSensing);
    expect((await reply(contractor, target.id, 'Noted.')).status).toBe(403);
    expect((await reply(engineer, target.id, '')).status).toBe(400);
    const answered = await reply(engineer, target.id, 'The sensors are set at 20 minutes; I will change them to 15.');
    expect(answered.status).toBe(201);
    expect((await reply(reviewer, target.id, 'Thank you.')).status).toBe(201);
    const thread = item(await items(engineer), corridorSensing).thread;
    expect(thread.map((entry) => [entry.role, entry.text])).toEqual([
      ['reviewer', 'Show the corridor sensors’ time-out at 15 minutes.'],
      ['engineer', 'The sensors are set at 20 minutes; I will change them to 15.'],
      ['reviewer', 'Thank you.'],
    ]);
    expect(thread[1]).toMatchObject({ by: engineer.user.name, round: 1 });
    expect(thread[1]!.verdict).toBeUndefined();
  });

  it('shows on the reviewer’s desk with its counts, in review first; nobody else’s desk lists it', async () => {
    const list = await items();
    const entries = await desk(reviewer);
    reviewDeskEntrySchema.array().parse(entries);
    expect(entries.map((entry) => entry.projectId)).toEqual([projectId, otherId]);
    expect(entries[0]).toMatchObject({
      name: 'Alder Bay Library & Makerspace',
      state: 'in-review',
      round: 1,
      submittedBy: engineer.user.name,
      total: list.length,
      open: list.length - 1,
      needsRevision: 1,
    });
    expect(Date.parse(entries[0]!.submittedAt!)).not.toBeNaN();
    expect(entries[1]).toMatchObject({ state: 'draft', round: 0, total: 0 });
    expect(await desk(engineer)).toEqual([]);
    expect((await desk(admin)).map((entry) => entry.projectId)).toEqual(expect.arrayContaining([projectId, otherId]));
  });

  it('refuses acceptance while an item needs revision or has no verdict, with the counts in words', async () => {
    const open = (await items()).filter((entry) => entry.verdict === null).length;
    const refused = await move(reviewer, 'accepted');
    expect(refused.status).toBe(409);
    expect(refused.body.error.message).toBe(
      `The design cannot be accepted while 1 check item needs revision and ${open} check items have no verdict yet. Record a verdict on each, or return the design to the engineer.`,
    );
    expect(refused.body.error.details).toContainEqual({ path: 'state', message: 'in-review' });
  });

  it('confirms in one step every item of one kind still without a verdict', async () => {
    expect((await bulk(engineer, { kind: 'daylight-response' })).status).toBe(403);
    expect((await bulk(reviewer, { kind: 'not-a-kind' })).status).toBe(400);
    expect((await bulk(reviewer, { unchanged: false })).status).toBe(400);
    const daylight = (await items()).filter((entry) => entry.kind === 'daylight-response');
    const done = await bulk(reviewer, { kind: 'daylight-response' });
    expect(done.status).toBe(200);
    expect(done.body.confirmed).toBe(daylight.length);
    const after = (done.body.items as ReviewItem[]).filter((entry) => entry.kind === 'daylight-response');
    expect(after.every((entry) => entry.verdict === 'confirmed' && entry.thread.at(-1)?.verdict === 'confirmed')).toBe(true);
    expect(
      (done.body.items as ReviewItem[]).filter((entry) => entry.kind !== 'daylight-response' && entry.verdict === 'confirmed'),
    ).toEqual([]);
    // Nothing is left to confirm a second time.
    expect((await bulk(reviewer, { kind: 'daylight-response' })).body.confirmed).toBe(0);
  });

  it('refuses verdicts once the design is returned, and keeps the replies open', async () => {
    expect((await move(reviewer, 'returned', 'See the corridor’s sensors.')).status).toBe(200);
    const target = item(await items(), '101 Entry lobby: Power allowance');
    const refused = await verdict(reviewer, target.id, { verdict: 'confirmed' });
    expect(refused.status).toBe(409);
    expect(refused.body.error.message).toBe(
      'Verdicts are recorded while the design is in review, and it has been returned to the engineer.',
    );
    expect((await bulk(reviewer, { unchanged: true })).status).toBe(409);
    expect((await reply(engineer, item(await items(), corridorSensing).id, 'Changed now.')).status).toBe(201);
    expect(await database.db('review_rounds').where({ project_id: projectId, number: 1 }).first('outcome')).toEqual({
      outcome: 'returned',
    });
  });

  it('on resubmission marks the changed space’s items changed with the verdict cleared; the others keep theirs; a deleted space’s go', async () => {
    const before = await items();
    const spaces = (await engineer.agent.get(`/api/projects/${projectId}/spaces`)).body as {
      id: string;
      name: string;
      version: number;
      controls: { strategy: string; timeoutMinutes?: string }[];
    }[];
    const corridor = spaces.find((space) => space.name === '111 Corridor')!;
    const changed = await engineer.agent
      .patch(`/api/projects/${projectId}/spaces/${corridor.id}`)
      .set('X-CSRF-Token', engineer.csrfToken)
      .send({
        version: corridor.version,
        controls: corridor.controls.map((control) => (control.timeoutMinutes ? { ...control, timeoutMinutes: '15' } : control)),
      });
    expect(changed.status, changed.text).toBe(200);
    const closet = spaces.find((space) => space.name === '115 Custodial closet')!;
    await engineer.agent
      .delete(`/api/projects/${projectId}/spaces/${closet.id}?version=${closet.version}`)
      .set('X-CSRF-Token', engineer.csrfToken)
      .expect(204);

    const added = await engineer.agent
      .post(`/api/projects/${projectId}/spaces`)
      .set('X-CSRF-Token', engineer.csrfToken)
      .send({ name: '216 Quiet room', level: 'Level 2', spaceType: 'library-in-a-reading-area', area: '200', unlit: true });
    expect(added.status, added.text).toBe(201);

    expect((await move(engineer, 'in-review')).status).toBe(200);
    const after = await items();
    // A space new in this round: its items are new to the reviewer, so they count as changed.
    const fresh = after.filter((entry) => entry.spaceId === added.body.id);
    expect(fresh.length).toBeGreaterThan(0);
    expect(fresh.every((entry) => entry.changed && entry.verdict === null && entry.thread.length === 0)).toBe(true);
    expect(after.every((entry) => entry.round === 2)).toBe(true);
    expect(after.some((entry) => entry.spaceId === closet.id)).toBe(false);
    expect(after).toHaveLength(before.filter((entry) => entry.spaceId !== closet.id).length + fresh.length);

    const corridorItems = after.filter((entry) => entry.spaceId === corridor.id);
    expect(corridorItems.length).toBeGreaterThan(0);
    expect(corridorItems.every((entry) => entry.changed && entry.verdict === null)).toBe(true);
    // The thread keeps its history from the first round.
    expect(item(after, corridorSensing).thread.map((entry) => entry.round)).toEqual([1, 1, 1, 1]);

    const others = after.filter((entry) => entry.spaceId !== corridor.id && entry.spaceId !== added.body.id);
    expect(others.filter((entry) => entry.changed).map((entry) => entry.title)).toEqual([]);
    for (const entry of others) {
      expect(entry.verdict, entry.title).toBe(before.find((old) => old.id === entry.id)!.verdict);
    }
    expect(item(after, '102 Main reading room: Daylight response').verdict).toBe('confirmed');
  });

  it('confirms every unchanged item in one step, leaving the changed ones; accepts once every item has a verdict', async () => {
    const waiting = (await items()).filter((entry) => !entry.changed && entry.verdict === null).length;
    expect(waiting).toBeGreaterThan(0);
    const done = await bulk(reviewer, { unchanged: true });
    expect(done.status).toBe(200);
    expect(done.body.confirmed).toBe(waiting);
    const list = done.body.items as ReviewItem[];
    expect(list.filter((entry) => !entry.changed).every((entry) => entry.verdict === 'confirmed')).toBe(true);
    const changed = list.filter((entry) => entry.changed);
    expect(changed.every((entry) => entry.verdict === null)).toBe(true);

    expect((await move(reviewer, 'accepted')).status).toBe(409);
    for (const entry of changed) {
      const answer = await verdict(reviewer, entry.id, { verdict: entry.kind === 'daylight-response' ? 'not-applicable' : 'confirmed' });
      expect(answer.status).toBe(200);
    }
    const accepted = await move(reviewer, 'accepted');
    expect(accepted.status).toBe(200);
    expect(accepted.body.state).toBe('accepted');
    expect(await database.db('review_rounds').where({ project_id: projectId, number: 2 }).first('outcome')).toEqual({
      outcome: 'accepted',
    });
    // Replies stay open after acceptance; verdicts do not.
    expect((await reply(engineer, item(await items(), corridorSensing).id, 'Thanks.')).status).toBe(201);
    expect((await verdict(reviewer, changed[0]!.id, { verdict: 'confirmed' })).status).toBe(409);
  });

  it('shows each verdict, bulk confirmation and reply in the project’s history', async () => {
    const history = (await contractor.agent.get(`/api/projects/${projectId}/history?limit=200`)).body as {
      entries: { action: string; entity: string; name: string | null; review?: Record<string, unknown> }[];
    };
    const reviewEntries = history.entries.filter((entry) => entry.entity === 'review-item');
    expect(reviewEntries).toContainEqual(
      expect.objectContaining({
        action: 'verdict',
        name: corridorSensing,
        review: { verdict: 'needs-revision', comment: 'Show the corridor sensors’ time-out at 15 minutes.', round: 1 },
      }),
    );
    expect(reviewEntries).toContainEqual(
      expect.objectContaining({
        action: 'reply',
        name: corridorSensing,
        review: { text: 'The sensors are set at 20 minutes; I will change them to 15.', round: 1 },
      }),
    );
    const kindBulk = reviewEntries.find((entry) => entry.action === 'bulk-confirm' && entry.review?.['kind'] === 'daylight-response');
    expect(kindBulk?.review).toMatchObject({
      verdict: 'confirmed',
      round: 1,
      titles: expect.arrayContaining(['102 Main reading room: Daylight response']),
    });
    expect(reviewEntries.some((entry) => entry.action === 'bulk-confirm' && entry.review?.['unchanged'] === true)).toBe(true);
  });

  it('are in the served API description', async () => {
    const description = (await engineer.agent.get('/api/openapi.json')).body;
    expect(Object.keys(description.paths)).toEqual(
      expect.arrayContaining([
        '/api/projects/{projectId}/review-items',
        '/api/projects/{projectId}/review-items/{itemId}',
        '/api/projects/{projectId}/review-items/{itemId}/replies',
        '/api/projects/{projectId}/review-items/bulk',
        '/api/review-desk',
      ]),
    );
    expect(description.components.schemas.ReviewItem.properties).toHaveProperty('thread');
  });
});
