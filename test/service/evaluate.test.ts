import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { evaluationResultSchema } from '../../service/src/evaluation/result.schema.js';
import { signIn, testApp, type SignedInAgent } from '../support/app.js';
import { freshDatabase, type TestDatabase } from '../support/database.js';

let database: TestDatabase;
let app: ReturnType<typeof testApp>['app'];
let engineer: SignedInAgent;

beforeAll(async () => {
  database = await freshDatabase();
  app = testApp(database.db, database.url).app;
  engineer = await signIn(app, 'engineer@alderbay.example');
});

afterAll(async () => {
  await database.drop();
});

const evaluate = (document: unknown) =>
  engineer.agent
    .post('/api/evaluate')
    .set('X-CSRF-Token', engineer.csrfToken)
    .send(document as object);

/** Two offices by the space-by-space method; LPDs from IECC 2021 Table C405.3.2(2), via PNNL building-energy-standards-data. */
function offices(units: 'ip' | 'si' = 'ip') {
  const area = units === 'ip' ? ['200', '1000'] : ['18.580608', '92.90304']; // 200 ft² and 1,000 ft² (1 ft² = 0.09290304 m², mathjs units)
  return {
    edition: 'iecc-2021',
    method: 'space-by-space',
    units,
    luminaireTypes: [{ tag: 'A', description: 'troffer', inputWatts: '30', use: 'general' }],
    spaces: [
      {
        id: 'o1',
        name: 'Office',
        spaceType: 'office-enclosed',
        area: area[0],
        enclosed: true,
        luminaires: [{ tag: 'A', count: 4 }],
        controls: [
          { strategy: 'occupant-sensor', provided: true, timeoutMinutes: '20', autoOn: 'manual' },
          { strategy: 'light-reduction', provided: true },
        ],
      },
      {
        id: 'o2',
        name: 'Open office',
        spaceType: 'office-open-plan',
        area: area[1],
        luminaires: [{ tag: 'A', count: 18 }],
        controls: [
          { strategy: 'occupant-sensor', provided: true, timeoutMinutes: '20', autoOn: 'partial' },
          { strategy: 'light-reduction', provided: true },
        ],
      },
    ],
  };
}

describe('POST /api/evaluate', () => {
  it('evaluates a document against the stored tables and stores nothing', async () => {
    const projectsBefore = await database.db('projects').count<{ count: string }[]>('* as count');
    const response = await evaluate(offices());
    expect(response.status).toBe(200);
    // Allowance = 0.74 × 200 + 0.61 × 1,000 = 148 + 610 = 758 W (IECC 2021 Table C405.3.2(2)); installed = 22 × 30 = 660 W.
    expect(response.body.interior.allowanceW).toBe('758');
    expect(response.body.interior.installedW).toBe('660');
    expect(response.body.interior.complies).toBe(true);
    expect(response.body.dataVersion).toMatch(/^[0-9a-f]{16}$/);
    expect(evaluationResultSchema.safeParse(response.body).success).toBe(true);
    const projectsAfter = await database.db('projects').count<{ count: string }[]>('* as count');
    expect(projectsAfter).toEqual(projectsBefore);
  });

  it('gives the same verdict and watts for the same building in SI', async () => {
    const ip = (await evaluate(offices('ip'))).body;
    const si = (await evaluate(offices('si'))).body;
    expect(si.complies).toBe(ip.complies);
    expect(si.interior.allowanceW).toBe(ip.interior.allowanceW);
    expect(si.interior.installedW).toBe(ip.interior.installedW);
  });

  it('lists the path of every problem in one 400 and computes nothing', async () => {
    const document = offices();
    const bad = {
      ...document,
      spaces: [
        { ...document.spaces[0], spaceType: 'no-such-type' },
        { ...document.spaces[1], area: '-5', luminaires: [{ tag: 'Q', count: 2 }] },
        { id: 'o3', name: 'Store', spaceType: 'storage-room', area: 'twelve' },
      ],
    };
    const response = await evaluate(bad);
    expect(response.status).toBe(400);
    expect(response.body.error.code).toBe('validation_failed');
    const paths = response.body.error.details.map((detail: { path: string }) => detail.path);
    expect(paths).toEqual(expect.arrayContaining(['spaces.0.spaceType', 'spaces.1.area', 'spaces.1.luminaires.0.tag', 'spaces.2.area']));
    expect(response.body).not.toHaveProperty('interior');
    // The summary is for people: it says what to do, and each detail names its field and the fix.
    expect(response.body.error.message).toBe('The results cannot be computed until the problems below are fixed.');
  });

  it('asks for the building area type under the building area method, and refuses an unknown edition', async () => {
    const document = { ...offices(), method: 'building-area' };
    const response = await evaluate(document);
    expect(response.status).toBe(400);
    const paths = response.body.error.details.map((detail: { path: string }) => detail.path);
    expect(paths).toEqual(expect.arrayContaining(['spaces.0.buildingAreaType']));
    expect(paths).not.toContain('spaces.0.spaceType');

    const unknown = await evaluate({ ...offices(), edition: 'iecc-1999' });
    expect(unknown.status).toBe(400);
    expect(unknown.body.error.details).toEqual([{ path: 'edition', message: 'There is no code edition "iecc-1999".' }]);
  });

  it('evaluates a 90.1-2019 building-area document with exterior lighting', async () => {
    const response = await evaluate({
      edition: 'ashrae-90.1-2019',
      method: 'building-area',
      units: 'ip',
      luminaireTypes: [{ tag: 'A', description: 'troffer', inputWatts: '30', use: 'general' }],
      spaces: [{ id: 'b', name: 'Whole building', buildingAreaType: 'office', area: '10000', luminaires: [{ tag: 'A', count: 200 }] }],
      exterior: { lightingZone: '2', applications: [{ key: 'parking-lots-and-drives', quantity: '10000', installedWatts: '350' }] },
    });
    expect(response.status, JSON.stringify(response.body)).toBe(200);
    // ASHRAE 90.1-2019 Table 9.5.1, via PNNL building-energy-standards-data: Office = 0.64 W/ft² → 6,400 W; installed 6,000 W.
    expect(response.body.interior.allowanceW).toBe('6400');
    // 90.1-2019 Table 9.4.2-2, via BESD: base site 400 W (zone 2) + parking 0.04 W/ft² × 10,000 ft² = 400 W.
    expect(response.body.exterior.allowanceW).toBe('800');
    const parsed = evaluationResultSchema.safeParse(response.body);
    expect(parsed.success, JSON.stringify(parsed.error?.issues.slice(0, 3))).toBe(true);
  });

  it('needs a session and the CSRF header', async () => {
    expect((await request(app).post('/api/evaluate').send(offices())).status).toBe(401);
    expect((await engineer.agent.post('/api/evaluate').send(offices())).status).toBe(403);
  });
});

describe('GET /api/openapi.json', () => {
  it('describes the document, the result and the error shape', async () => {
    const response = await engineer.agent.get('/api/openapi.json');
    expect(response.status).toBe(200);
    expect(response.body.openapi).toBe('3.1.0');
    const schemas = response.body.components.schemas;
    expect(schemas.EvaluationDocument.properties).toHaveProperty('spaces');
    expect(schemas.EvaluationDocument.required).toEqual(expect.arrayContaining(['edition', 'method', 'units', 'spaces']));
    expect(schemas.EvaluationResult.properties.interior.properties).toHaveProperty('spaces');
    expect(response.body.paths['/api/evaluate'].post.responses).toHaveProperty('400');
  });
});
