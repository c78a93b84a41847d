import type { Express } from 'express';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { documentLimits } from '../../service/src/compliance/bounds.js';
import { signIn, testApp, type SignedInAgent } from '../support/app.js';
import { freshDatabase, type TestDatabase } from '../support/database.js';

let database: TestDatabase;
let app: Express;
let engineer: SignedInAgent;
let projectId: string;

beforeAll(async () => {
  database = await freshDatabase();
  ({ app } = testApp(database.db, database.url));
  engineer = await signIn(app, 'engineer@alderbay.example');
  const created = await write('post', '/api/projects').send({
    name: 'Bounds check',
    edition: 'iecc-2021',
    method: 'space-by-space',
    units: 'ip',
    lightingZone: 2,
  });
  projectId = created.body.id;
  await write('post', `/api/projects/${projectId}/luminaire-types`).send({ tag: 'A', inputWatts: '30', use: 'general' });
});

afterAll(async () => {
  await database.drop();
});

function write(method: 'post' | 'put' | 'patch' | 'delete', url: string) {
  return engineer.agent[method](url).set('X-CSRF-Token', engineer.csrfToken);
}

/** A small IECC 2021 document (invented values) with one field replaced. */
function documentWith(change: (document: { spaces: Record<string, unknown>[]; luminaireTypes: Record<string, unknown>[] }) => void) {
  const document = {
    edition: 'iecc-2021',
    method: 'space-by-space',
    units: 'ip',
    luminaireTypes: [{ tag: 'A', inputWatts: '30', use: 'general' }],
    spaces: [{ id: 's1', name: 'Office', spaceType: 'office-enclosed', area: '200', luminaires: [{ tag: 'A', count: 4 }] }] as Record<
      string,
      unknown
    >[],
  };
  change(document);
  return document;
}

const space = { name: 'Office', level: 'Level 1', spaceType: 'office-enclosed', area: '200' };

describe('numbers are bounded before any arithmetic', () => {
  it('answers a huge exponent in POST /api/evaluate at once with a 400 naming the field and its range', async () => {
    const response = await engineer.agent
      .post('/api/evaluate')
      .set('X-CSRF-Token', engineer.csrfToken)
      .send(documentWith((d) => (d.spaces[0]!['area'] = '1e100000000')));
    expect(response.status).toBe(400);
    expect(response.body.error.details).toContainEqual({
      path: 'spaces.0.area',
      message: 'Out of range. Enter a number greater than 0 and at most 5,000,000.',
    });
    // The answer is small because nothing was expanded (before the bounds, it was a 60 MB body or a crash).
    expect(JSON.stringify(response.body).length).toBeLessThan(2000);
  });

  it('refuses the same in a design write, and exponents that would expand to millions of digits', async () => {
    for (const area of ['1e100000000', '1e10000000', '1e-10000000', '9'.repeat(41)]) {
      const response = await write('post', `/api/projects/${projectId}/spaces`).send({ ...space, area });
      expect(response.status, area.slice(0, 20)).toBe(400);
      expect(response.body.error.details[0].path).toBe('area');
    }
  });

  it('accepts numbers in exponent form inside the range, and normalises them', async () => {
    const response = await write('post', `/api/projects/${projectId}/spaces`).send({
      ...space,
      name: 'Exponent form',
      area: '2.5e2',
      ceilingHeight: 9,
    });
    expect(response.status).toBe(201);
    expect(response.body.area).toBe('250');
  });

  it('gives each kind of number its own plausible range', async () => {
    const cases: [Record<string, unknown>, string, string][] = [
      [{ area: '99999999999' }, 'area', 'greater than 0 and at most 5,000,000'],
      [{ ceilingHeight: '1001' }, 'ceilingHeight', 'greater than 0 and at most 1,000'],
      [{ length: '10001', width: '10' }, 'length', 'greater than 0 and at most 10,000'],
      [{ luminaires: [{ tag: 'A', count: 2 ** 31 }] }, 'luminaires.0.count', 'a whole number from 0 to 1,000,000'],
      [{ luminaires: [{ tag: 'A', count: '1e50' }] }, 'luminaires.0.count', 'a whole number from 0 to 1,000,000'],
      [{ luminaires: [{ tag: 'A', count: '2.5' }] }, 'luminaires.0.count', 'Must be a whole number'],
      [
        { controls: [{ strategy: 'occupant-sensor', provided: true, timeoutMinutes: '1441' }] },
        'controls.0.timeoutMinutes',
        'from 0 to 1,440',
      ],
      [{ area: '1.000000000000000000001' }, 'area', 'at most 20 decimal places'],
    ];
    for (const [fields, path, words] of cases) {
      const response = await write('post', `/api/projects/${projectId}/spaces`).send({ ...space, ...fields });
      expect(response.status, path).toBe(400);
      const detail = response.body.error.details.find((candidate: { path: string }) => candidate.path === path);
      expect(detail?.message, path).toContain(words);
    }
  });

  it('bounds luminaire watts, exterior quantities and versions too', async () => {
    const watts = await write('post', `/api/projects/${projectId}/luminaire-types`).send({ tag: 'W', inputWatts: '1e7', use: 'general' });
    expect(watts.status).toBe(400);
    expect(watts.body.error.details[0]).toMatchObject({ path: 'inputWatts', message: expect.stringContaining('from 0 to 100,000') });
    const quantity = await write('post', `/api/projects/${projectId}/exterior-applications`).send({
      key: 'parking-lots-and-drives',
      quantity: '1e12',
      installedWatts: '10',
    });
    expect(quantity.status).toBe(400);
    const spaces = (await engineer.agent.get(`/api/projects/${projectId}/spaces`)).body;
    const version = await write('put', `/api/projects/${projectId}/spaces/${spaces[0].id}`).send({ ...space, version: 2 ** 40 });
    expect(version.status).toBe(400);
    expect(version.body.error.details[0].path).toBe('version');
    const deleteVersion = await write('delete', `/api/projects/${projectId}/spaces/${spaces[0].id}?version=${2 ** 40}`);
    expect(deleteVersion.status).toBe(400);
  });
});

describe('text is bounded and storable', () => {
  it('refuses NUL, unpaired surrogates and over-long text with a 400, not a 500', async () => {
    const cases: [Record<string, unknown>, string][] = [
      [{ name: 'Office\u0000' }, 'name'],
      [{ name: 'Office \ud800' }, 'name'],
      [{ level: 'x'.repeat(101) }, 'level'],
      [{ name: 'n'.repeat(201) }, 'name'],
      [{ controls: [{ strategy: 'occupant-sensor', provided: true, device: 'd'.repeat(201) }] }, 'controls.0.device'],
      [
        { controls: [{ strategy: 'occupant-sensor', provided: false, exceptionReason: 'other', exceptionNote: 'n'.repeat(1001) }] },
        'controls.0.exceptionNote',
      ],
    ];
    for (const [fields, path] of cases) {
      const response = await write('post', `/api/projects/${projectId}/spaces`).send({ ...space, ...fields });
      expect(response.status, path).toBe(400);
      expect(
        response.body.error.details.map((detail: { path: string }) => detail.path),
        path,
      ).toContain(path);
    }
    const project = await write('patch', `/api/projects/${projectId}`).send({ version: 1, jurisdiction: 'Alder Bay\u0000' });
    expect(project.status).toBe(400);
    const tag = await write('post', `/api/projects/${projectId}/luminaire-types`).send({
      tag: 'T'.repeat(41),
      inputWatts: '1',
      use: 'general',
    });
    expect(tag.status).toBe(400);
  });

  it('keeps a paired surrogate (an emoji) and line breaks in a note', async () => {
    const response = await write('post', `/api/projects/${projectId}/spaces`).send({
      ...space,
      name: 'Reading nook 📚',
      controls: [{ strategy: 'occupant-sensor', provided: false, exceptionReason: 'other', exceptionNote: 'Line one.\nLine two.' }],
    });
    expect(response.status).toBe(201);
    expect(response.body.name).toBe('Reading nook 📚');
  });
});

describe('limits on work', () => {
  it(`refuses a document of more than ${documentLimits.spaces.toLocaleString('en-US')} spaces, and lists at most ${documentLimits.problemsListed} problems`, async () => {
    const many = documentWith((d) => {
      d.spaces = Array.from({ length: documentLimits.spaces + 1 }, (_, index) => ({
        id: `s${index}`,
        name: `Room ${index}`,
        spaceType: 'ballroom',
        area: '10',
      }));
    });
    const response = await engineer.agent.post('/api/evaluate').set('X-CSRF-Token', engineer.csrfToken).send(many);
    expect(response.status).toBe(400);
    const details: { path: string; message: string }[] = response.body.error.details;
    expect(details.length).toBe(documentLimits.problemsListed + 1);
    expect(details.some((detail) => detail.path === 'spaces' && detail.message.includes('10,000'))).toBe(true);
    expect(details.at(-1)!.message).toMatch(/^And \d+ more problems not listed/);
  });

  it('refuses an import that would take a project past the ceiling', async () => {
    const spaces = Array.from({ length: documentLimits.spaces }, (_, index) => ({ ...space, name: `Room ${index}` }));
    const response = await write('post', `/api/projects/${projectId}/spaces/bulk`).send({ spaces });
    expect(response.status).toBe(400);
    expect(response.body.error.message).toContain('at most 10,000 spaces');
    const count = await database.db('spaces').where({ project_id: projectId }).count<{ count: string }[]>('* as count');
    expect(Number(count[0]!.count)).toBeLessThan(10);
  });
});
