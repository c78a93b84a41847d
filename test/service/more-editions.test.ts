import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { evaluationResultSchema } from '../../service/src/evaluation/result.schema.js';
import { signIn, testApp, type SignedInAgent } from '../support/app.js';
import { freshDatabase, type TestDatabase } from '../support/database.js';

/**
 * Small documents evaluated against the seeded tables of the four editions added from
 * shared/reference-data/SOURCES-more-editions.md, each allowance worked by hand from the tables.
 * Areas, luminaires and heights are invented test input.
 */

let database: TestDatabase;
let engineer: SignedInAgent;

beforeAll(async () => {
  database = await freshDatabase();
  const { app } = testApp(database.db, database.url);
  engineer = await signIn(app, 'engineer@alderbay.example');
});

afterAll(async () => {
  await database.drop();
});

const write = (method: 'post' | 'put', url: string) => engineer.agent[method](url).set('X-CSRF-Token', engineer.csrfToken);
const evaluate = (document: object) => write('post', '/api/evaluate').send(document);

const luminaireTypes = [{ tag: 'A', description: 'troffer', inputWatts: '40', use: 'general' }];
const fullOff = [{ strategy: 'automatic-full-off', provided: true, timeoutMinutes: '20', zoneSize: '1000' }];

function spaceBySpace(edition: string, spaces: object[], units: 'ip' | 'si' = 'ip') {
  return { edition, method: 'space-by-space', units, luminaireTypes, spaces };
}

function buildingArea(edition: string, office: string, warehouse: string) {
  return {
    edition,
    method: 'building-area',
    units: 'ip',
    luminaireTypes,
    spaces: [
      { id: 'b1', name: 'Offices', buildingAreaType: office, area: '10000', luminaires: [{ tag: 'A', count: 150 }] },
      { id: 'b2', name: 'Stores', buildingAreaType: warehouse, area: '5000', luminaires: [{ tag: 'A', count: 40 }] },
    ],
  };
}

async function allowance(document: object): Promise<{
  allowanceW: string;
  installedW: string;
  spaces: Array<{ allowanceW: string; allowedLpd: string }>;
  body: Record<string, unknown>;
}> {
  const response = await evaluate(document);
  expect(response.status, JSON.stringify(response.body.error)).toBe(200);
  expect(evaluationResultSchema.safeParse(response.body).success).toBe(true);
  return { ...response.body.interior, body: response.body };
}

describe('POST /api/evaluate under ASHRAE 90.1-2016', () => {
  it('space by space: an open office and an atrium allowed by its height', async () => {
    const result = await allowance(
      spaceBySpace('ashrae-90.1-2016', [
        {
          id: 's1',
          name: 'Open office',
          spaceType: 'office-open-plan',
          area: '1000',
          luminaires: [{ tag: 'A', count: 18 }],
          controls: fullOff,
        },
        {
          id: 's2',
          name: 'Atrium',
          spaceType: 'atrium-ge-20-ft-and-le-40-ft-in-height',
          area: '2000',
          ceilingHeight: '30',
          luminaires: [{ tag: 'A', count: 40 }],
          controls: fullOff,
        },
        {
          id: 's3',
          name: 'Tall atrium',
          spaceType: 'atrium-gt-40-ft-in-height',
          area: '1000',
          ceilingHeight: '50',
          luminaires: [{ tag: 'A', count: 30 }],
          controls: fullOff,
        },
      ]),
    );
    // ASHRAE 90.1-2016 Table 9.6.1, via PNNL building-energy-standards-data: open office 0.81 W/ft² × 1,000 ft² = 810 W.
    // Atrium 20–40 ft: 0.03 W/ft² per ft of total height (the row notes; from memory "0.03 per ft total height") × 30 ft = 0.9 W/ft² × 2,000 ft² = 1,800 W.
    // Atrium > 40 ft: 0.4 + 0.02 × 50 ft = 1.4 W/ft² (the row notes; from memory "0.40 + 0.02 per ft total height") × 1,000 ft² = 1,400 W.
    expect(result.spaces.map((space) => [space.allowedLpd, space.allowanceW])).toEqual([
      ['0.81', '810'],
      ['0.9', '1800'],
      ['1.4', '1400'],
    ]);
    expect(result.allowanceW).toBe('4010');
    expect(result.installedW).toBe('3520'); // (18 + 40 + 30) × 40 W
    const unverified = (result.body['unverifiedValues'] as Array<{ what: string }>).map((value) => value.what);
    expect(unverified).toEqual(
      expect.arrayContaining(['Space type LPD: Atrium — ≥ 20 ft and ≤ 40 ft in height', 'Space type LPD: Atrium — > 40 ft in height']),
    );
  });

  it('building area: office and warehouse', async () => {
    const result = await allowance(buildingArea('ashrae-90.1-2016', 'office', 'warehouse'));
    // ASHRAE 90.1-2016 Table 9.5.1, via PNNL building-energy-standards-data: 0.79 × 10,000 + 0.48 × 5,000 = 7,900 + 2,400 = 10,300 W.
    expect(result.allowanceW).toBe('10300');
    expect(result.installedW).toBe('7600');
  });

  it('gives the same atrium allowance for the same room in SI', async () => {
    // 2,000 ft² = 185.80608 m² and 30 ft = 9.144 m exactly (1 ft = 0.3048 m).
    const result = await allowance(
      spaceBySpace(
        'ashrae-90.1-2016',
        [
          {
            id: 's2',
            name: 'Atrium',
            spaceType: 'atrium-ge-20-ft-and-le-40-ft-in-height',
            area: '185.80608',
            ceilingHeight: '9.144',
            luminaires: [{ tag: 'A', count: 40 }],
            controls: fullOff,
          },
        ],
        'si',
      ),
    );
    expect(result.allowanceW).toBe('1800');
  });
});

describe('POST /api/evaluate under ASHRAE 90.1-2013', () => {
  it('space by space: an open office and a low atrium', async () => {
    const result = await allowance(
      spaceBySpace('ashrae-90.1-2013', [
        {
          id: 's1',
          name: 'Open office',
          spaceType: 'office-open-plan',
          area: '1000',
          luminaires: [{ tag: 'A', count: 20 }],
          controls: fullOff,
        },
        {
          id: 's2',
          name: 'Atrium',
          spaceType: 'atrium-that-is-lt-20-ft-in-height',
          area: '1000',
          ceilingHeight: '15',
          luminaires: [{ tag: 'A', count: 10 }],
          controls: fullOff,
        },
      ]),
    );
    // ASHRAE 90.1-2013 Table 9.6.1, via PNNL building-energy-standards-data: open office 0.98 × 1,000 = 980 W;
    // atrium < 20 ft: 0.03 W/ft² per ft (the row notes; from memory) × 15 ft = 0.45 W/ft² × 1,000 ft² = 450 W.
    expect(result.spaces.map((space) => space.allowanceW)).toEqual(['980', '450']);
    expect(result.allowanceW).toBe('1430');
  });

  it('building area: office and warehouse', async () => {
    const result = await allowance(buildingArea('ashrae-90.1-2013', 'office', 'warehouse'));
    // ASHRAE 90.1-2013 Table 9.5.1, via PNNL building-energy-standards-data: 0.82 × 10,000 + 0.66 × 5,000 = 8,200 + 3,300 = 11,500 W.
    expect(result.allowanceW).toBe('11500');
  });
});

describe('POST /api/evaluate under IECC 2018', () => {
  it('space by space: an enclosed office and a tall atrium', async () => {
    const result = await allowance(
      spaceBySpace('iecc-2018', [
        { id: 's1', name: 'Office', spaceType: 'office-enclosed', area: '200', enclosed: true, luminaires: [{ tag: 'A', count: 4 }] },
        {
          id: 's2',
          name: 'Atrium',
          spaceType: 'atrium-greater-than-40-feet-in-height',
          area: '1500',
          ceilingHeight: '45',
          luminaires: [{ tag: 'A', count: 40 }],
        },
      ]),
    );
    // IECC 2018 Table C405.3.2(2), via PNNL building-energy-standards-data: enclosed office 0.93 × 200 = 186 W;
    // atrium > 40 ft: 0.40 + 0.02 × 45 ft = 1.3 W/ft² (the row notes; from memory "0.40 + 0.02 per foot in total height") × 1,500 ft² = 1,950 W.
    expect(result.spaces.map((space) => space.allowanceW)).toEqual(['186', '1950']);
    expect(result.allowanceW).toBe('2136');
    expect((result.body['interior'] as { section: string }).section).toBe('C405.3.2.2');
  });

  it('building area: office and warehouse, equal to 90.1-2016', async () => {
    const result = await allowance(buildingArea('iecc-2018', 'office', 'warehouse'));
    // IECC 2018 Table C405.3.2(1), via PNNL building-energy-standards-data: 0.79 × 10,000 + 0.48 × 5,000 = 10,300 W (as 90.1-2016).
    expect(result.allowanceW).toBe('10300');
  });
});

describe('POST /api/evaluate under IECC 2024', () => {
  it('space by space: an enclosed office and an open office', async () => {
    const result = await allowance(
      spaceBySpace('iecc-2024', [
        { id: 's1', name: 'Office', spaceType: 'office-enclosed', area: '200', enclosed: true, luminaires: [{ tag: 'A', count: 3 }] },
        { id: 's2', name: 'Open office', spaceType: 'office-open-plan', area: '1000', luminaires: [{ tag: 'A', count: 12 }] },
      ]),
    );
    // IECC 2024 Table C405.3.2(2), via PNNL building-energy-standards-data @804086b (single source): 0.73 × 200 + 0.56 × 1,000 = 146 + 560 = 706 W.
    expect(result.allowanceW).toBe('706');
    expect(result.installedW).toBe('600');
    expect(result.body['edition']).toBe('iecc-2024');
  });

  it('building area: office and warehouse', async () => {
    const result = await allowance(buildingArea('iecc-2024', 'office', 'warehouse'));
    // IECC 2024 Table C405.3.2(1), via PNNL building-energy-standards-data @804086b: 0.62 × 10,000 + 0.45 × 5,000 = 6,200 + 2,250 = 8,450 W.
    expect(result.allowanceW).toBe('8450');
  });
});

describe('an atrium whose allowance depends on its height', () => {
  it('is refused without the ceiling height, naming the field', async () => {
    const response = await evaluate(
      spaceBySpace('ashrae-90.1-2016', [
        { id: 's2', name: 'Atrium', spaceType: 'atrium-gt-40-ft-in-height', area: '1000', luminaires: [{ tag: 'A', count: 10 }] },
      ]),
    );
    expect(response.status).toBe(400);
    expect(response.body.error.details).toEqual([
      { path: 'spaces.0.ceilingHeight', message: "The atrium's allowance depends on its height: give the ceiling height." },
    ]);
  });

  it('is refused on the row for another height, in the project’s units', async () => {
    const ip = await evaluate(
      spaceBySpace('ashrae-90.1-2016', [
        {
          id: 's2',
          name: 'Atrium',
          spaceType: 'atrium-gt-40-ft-in-height',
          area: '1000',
          ceilingHeight: '30',
          luminaires: [{ tag: 'A', count: 10 }],
        },
      ]),
    );
    expect(ip.status).toBe(400);
    expect(ip.body.error.details).toEqual([
      {
        path: 'spaces.0.ceilingHeight',
        message: 'This space type is for atria more than 40 ft high; choose the atrium row for a height of 30 ft.',
      },
    ]);
    // 40 ft = 12.192 m and 20 ft = 6.096 m exactly (1 ft = 0.3048 m).
    const si = await evaluate(
      spaceBySpace(
        'ashrae-90.1-2016',
        [
          {
            id: 's2',
            name: 'Atrium',
            spaceType: 'atrium-ge-20-ft-and-le-40-ft-in-height',
            area: '100',
            ceilingHeight: '4',
            luminaires: [{ tag: 'A', count: 10 }],
          },
        ],
        'si',
      ),
    );
    expect(si.body.error.details).toEqual([
      {
        path: 'spaces.0.ceilingHeight',
        message: 'This space type is for atria at least 6.096 m and at most 12.192 m high; choose the atrium row for a height of 4 m.',
      },
    ]);
  });

  it('is refused when a project space is stored without the height, so the project stays evaluable', async () => {
    const created = await write('post', '/api/projects').send({
      name: 'Heron Hall',
      edition: 'ashrae-90.1-2016',
      method: 'space-by-space',
      units: 'ip',
    });
    expect(created.status).toBe(201);
    const space = await write('post', `/api/projects/${created.body.id}/spaces`).send({
      name: 'Atrium',
      spaceType: 'atrium-lt-20-ft-in-height',
      area: '800',
    });
    expect(space.status).toBe(400);
    expect(space.body.error.details).toEqual([
      { path: 'ceilingHeight', message: "The atrium's allowance depends on its height: give the ceiling height." },
    ]);
    const withHeight = await write('post', `/api/projects/${created.body.id}/spaces`).send({
      name: 'Atrium',
      spaceType: 'atrium-lt-20-ft-in-height',
      area: '800',
      ceilingHeight: '18',
    });
    expect(withHeight.status).toBe(201);
  });

  it('needs no height under the building area method, which reads the building area type', async () => {
    const response = await evaluate({
      ...buildingArea('ashrae-90.1-2016', 'office', 'warehouse'),
      spaces: [
        {
          id: 'b1',
          name: 'Offices',
          buildingAreaType: 'office',
          spaceType: 'atrium-gt-40-ft-in-height',
          area: '1000',
          luminaires: [{ tag: 'A', count: 10 }],
        },
      ],
    });
    expect(response.status).toBe(200);
  });
});
