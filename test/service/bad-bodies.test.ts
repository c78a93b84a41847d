import type { Express } from 'express';
import fc from 'fast-check';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { signIn, testApp, type SignedInAgent } from '../support/app.js';
import { freshDatabase, type TestDatabase } from '../support/database.js';

/**
 * Generated bad requests, with a fixed seed so a failure replays: every one must be refused with a
 * 4xx in the one error shape, never a 500, and must leave every row as it was.
 */
const seed = 20261202;

let database: TestDatabase;
let app: Express;
let engineer: SignedInAgent;
let projectId: string;
let spaceId: string;
let typeId: string;
let exteriorId: string;

beforeAll(async () => {
  database = await freshDatabase();
  ({ app } = testApp(database.db, database.url));
  engineer = await signIn(app, 'engineer@alderbay.example');
  const send = (method: 'post' | 'patch', url: string, body: object) =>
    engineer.agent[method](url).set('X-CSRF-Token', engineer.csrfToken).send(body);
  projectId = (
    await send('post', '/api/projects', { name: 'Generated', edition: 'iecc-2021', method: 'space-by-space', units: 'ip', lightingZone: 2 })
  ).body.id;
  typeId = (await send('post', `/api/projects/${projectId}/luminaire-types`, luminaireType)).body.id;
  spaceId = (await send('post', `/api/projects/${projectId}/spaces`, space)).body.id;
  exteriorId = (await send('post', `/api/projects/${projectId}/exterior-applications`, exterior)).body.id;
  expect([projectId, typeId, spaceId, exteriorId].every(Boolean)).toBe(true);
});

afterAll(async () => {
  await database.drop();
});

// Valid bodies (invented values); each generated request breaks one of them.
const luminaireType = { tag: 'A', description: 'Troffer', inputWatts: '30', use: 'general', basis: 'rated', wattageSource: 'Invented' };
const space = {
  name: 'Office',
  level: 'Level 1',
  spaceType: 'office-enclosed',
  area: '200',
  length: '20',
  width: '10',
  ceilingHeight: '9',
  enclosed: true,
  luminaires: [{ tag: 'A', count: 4 }],
  controls: [{ strategy: 'occupant-sensor', provided: true, timeoutMinutes: '20', autoOn: 'manual', device: 'Sensor' }],
  windows: [{ width: '4', headHeight: '7', sillHeight: '3', wall: 'south', offset: '2' }],
  skylights: [],
};
const exterior = { key: 'parking-lots-and-drives', description: 'Lot', quantity: '4000', installedWatts: '160', controls: [] };
const setup = {
  name: 'Generated',
  jurisdiction: 'Alder Bay',
  latitude: '47.04',
  longitude: '-122.9',
  timeZone: 'America/Los_Angeles',
  method: 'space-by-space',
  units: 'ip',
  lightingZone: 2,
};

type Kind = 'number' | 'text' | 'key' | 'enum' | 'boolean' | 'list' | 'version' | 'zone' | 'coordinate';

/** Values that no field of the kind accepts. */
const badValues: Record<Kind, fc.Arbitrary<unknown>> = {
  number: fc.constantFrom<unknown>(
    '1e100000000',
    '1e-100000000',
    '-1',
    'twelve',
    '',
    '0x10',
    '1,000',
    {},
    [],
    true,
    null,
    '9'.repeat(60),
    'Infinity',
    '\u0000',
    2 ** 60,
    -0.5,
  ),
  text: fc.constantFrom<unknown>(12, {}, [], true, 'x\u0000y', 'a\ud800b', '\udc00', 'x'.repeat(5000), 'line\u0007bell'),
  key: fc.constantFrom<unknown>(12, {}, [], '', '   ', 'k\u0000', 'k'.repeat(5000)),
  enum: fc.constantFrom<unknown>('nope', 3, {}, null, ''),
  boolean: fc.constantFrom<unknown>('yes', 1, {}, null, 'true'),
  list: fc.constantFrom<unknown>(
    {},
    'x',
    3,
    [null],
    [{}],
    [1, 2],
    Array.from({ length: 600 }, () => ({})),
  ),
  version: fc.constantFrom<unknown>(0, -1, 2 ** 40, 1.5, '1', null, {}, 'latest'),
  // The set-up's lighting zone and coordinates may be cleared (null), so null is not among their bad values.
  zone: fc.constantFrom<unknown>(5, -1, 1.5, '2', {}, 'two', 2 ** 40),
  coordinate: fc.constantFrom<unknown>('181', '-181', 'north', {}, '1e3', '1'.repeat(60), '47.04\u0000', true),
};

interface Route {
  name: string;
  method: 'post' | 'put' | 'patch';
  url: () => string;
  body: Record<string, unknown>;
  /** Field → kind; required fields may also be left out. */
  fields: Record<string, Kind>;
  required: string[];
}

const spaceFields: Record<string, Kind> = {
  name: 'text',
  level: 'text',
  spaceType: 'key',
  area: 'number',
  length: 'number',
  width: 'number',
  ceilingHeight: 'number',
  enclosed: 'boolean',
  luminaires: 'list',
  controls: 'list',
  windows: 'list',
  skylights: 'list',
  'luminaires.0.count': 'number',
  'luminaires.0.tag': 'key',
  'luminaires.0.zone': 'enum',
  'controls.0.timeoutMinutes': 'number',
  'controls.0.provided': 'boolean',
  'controls.0.autoOn': 'enum',
  'controls.0.device': 'text',
  'controls.0.strategy': 'key',
  'windows.0.width': 'number',
  'windows.0.headHeight': 'number',
  'windows.0.wall': 'enum',
  'windows.0.offset': 'number',
};
const typeFields: Record<string, Kind> = {
  tag: 'key',
  description: 'text',
  inputWatts: 'number',
  use: 'enum',
  basis: 'enum',
  wattageSource: 'text',
  length: 'number',
  limitWatts: 'number',
};
const exteriorFields: Record<string, Kind> = {
  key: 'key',
  description: 'text',
  quantity: 'number',
  installedWatts: 'number',
  controls: 'list',
};

const routes: Route[] = [
  {
    name: 'create space',
    method: 'post',
    url: () => `/api/projects/${projectId}/spaces`,
    body: space,
    fields: spaceFields,
    required: ['name', 'area'],
  },
  {
    name: 'replace space',
    method: 'put',
    url: () => `/api/projects/${projectId}/spaces/${spaceId}`,
    body: { ...space, version: 1 },
    fields: { ...spaceFields, version: 'version' },
    required: ['name', 'area', 'version'],
  },
  {
    name: 'patch space',
    method: 'patch',
    url: () => `/api/projects/${projectId}/spaces/${spaceId}`,
    body: { ...space, version: 1 },
    fields: { ...spaceFields, version: 'version' },
    required: ['version'],
  },
  {
    name: 'import spaces',
    method: 'post',
    url: () => `/api/projects/${projectId}/spaces/bulk`,
    body: { spaces: [space, { ...space, name: 'Office 2' }] },
    fields: prefixed('spaces.1.', spaceFields),
    required: ['spaces'],
  },
  {
    name: 'create type',
    method: 'post',
    url: () => `/api/projects/${projectId}/luminaire-types`,
    body: { ...luminaireType, tag: 'B' },
    fields: typeFields,
    required: ['tag', 'inputWatts', 'use'],
  },
  {
    name: 'replace type',
    method: 'put',
    url: () => `/api/projects/${projectId}/luminaire-types/${typeId}`,
    body: { ...luminaireType, version: 1 },
    fields: { ...typeFields, version: 'version' },
    required: ['tag', 'inputWatts', 'use', 'version'],
  },
  {
    name: 'create exterior',
    method: 'post',
    url: () => `/api/projects/${projectId}/exterior-applications`,
    body: { ...exterior, key: 'walkways-less-than-10-feet-wide' },
    fields: exteriorFields,
    required: ['key', 'quantity', 'installedWatts'],
  },
  {
    name: 'replace exterior',
    method: 'put',
    url: () => `/api/projects/${projectId}/exterior-applications/${exteriorId}`,
    body: { ...exterior, version: 1 },
    fields: { ...exteriorFields, version: 'version' },
    required: ['key', 'quantity', 'installedWatts', 'version'],
  },
  {
    name: 'set-up',
    method: 'patch',
    url: () => `/api/projects/${projectId}`,
    body: { ...setup, version: 1 },
    fields: {
      name: 'text',
      method: 'enum',
      units: 'enum',
      latitude: 'coordinate',
      longitude: 'coordinate',
      version: 'version',
      lightingZone: 'zone',
      timeZone: 'text',
    },
    required: ['version'],
  },
  {
    name: 'team',
    method: 'post',
    url: () => `/api/projects/${projectId}/members`,
    body: { email: 'reviewer@alderbay.example', role: 'reviewer' },
    fields: { email: 'key', role: 'enum' },
    required: ['email', 'role'],
  },
];

function prefixed(prefix: string, fields: Record<string, Kind>): Record<string, Kind> {
  return Object.fromEntries(Object.entries(fields).map(([path, kind]) => [`${prefix}${path}`, kind]));
}

function withValue(body: Record<string, unknown>, path: string, value: unknown, remove: boolean): Record<string, unknown> {
  const copy = structuredClone(body);
  const parts = path.split('.');
  let target: Record<string, unknown> = copy;
  for (const part of parts.slice(0, -1)) target = target[part] as Record<string, unknown>;
  const last = parts.at(-1)!;
  if (remove) delete target[last];
  else target[last] = value;
  return copy;
}

const mutation = fc.constantFrom(...routes).chain((route) =>
  fc.oneof(
    {
      weight: 8,
      arbitrary: fc.constantFrom(...Object.keys(route.fields)).chain((path) =>
        badValues[route.fields[path]!].map((value) => ({
          route,
          body: withValue(route.body, path, value, false) as unknown,
          what: `${path} = ${JSON.stringify(value)?.slice(0, 40)}`,
        })),
      ),
    },
    {
      weight: 1,
      arbitrary: fc
        .constantFrom(...route.required)
        .map((path) => ({ route, body: withValue(route.body, path, undefined, true) as unknown, what: `without ${path}` })),
    },
    {
      weight: 1,
      arbitrary: fc
        .constantFrom<unknown>([], 'text', 42, null, [route.body])
        .map((body) => ({ route, body, what: `body ${JSON.stringify(body).slice(0, 40)}` })),
    },
  ),
);

/** Everything the routes could change, as one digest per table. */
async function snapshot(): Promise<Record<string, string>> {
  const tables = [
    'projects',
    'project_members',
    'spaces',
    'space_luminaires',
    'space_controls',
    'space_windows',
    'space_skylights',
    'luminaire_types',
    'exterior_applications',
    'audit_log',
    'idempotency_keys',
  ];
  const digests: Record<string, string> = {};
  for (const table of tables) {
    const { digest } = await database.db
      .first(database.db.raw(`coalesce(md5(string_agg(t::text, '|' order by t::text)), '') as digest`))
      .from(database.db.raw('?? as t', [table]));
    digests[table] = digest;
  }
  return digests;
}

describe('generated bad requests to the design write routes', () => {
  it('are each refused with a 4xx in the one error shape, and no row changes', async () => {
    const before = await snapshot();
    const statuses = new Map<number, number>();
    await fc.assert(
      fc.asyncProperty(mutation, async ({ route, body, what }) => {
        const response = await engineer.agent[route.method](route.url())
          .set('X-CSRF-Token', engineer.csrfToken)
          .set('Content-Type', 'application/json')
          .send(JSON.stringify(body));
        statuses.set(response.status, (statuses.get(response.status) ?? 0) + 1);
        expect(response.status, `${route.name}: ${what}`).toBeGreaterThanOrEqual(400);
        expect(response.status, `${route.name}: ${what}`).toBeLessThan(500);
        expect(response.body.error, `${route.name}: ${what}`).toEqual(
          expect.objectContaining({ code: expect.any(String), message: expect.any(String) }),
        );
      }),
      { seed, numRuns: 3000 },
    );
    expect(await snapshot()).toEqual(before);
    expect(statuses.get(500)).toBeUndefined();
  }, 300_000);

  it('and bad version queries on deletes are refused the same way', async () => {
    const before = await snapshot();
    const targets = [`spaces/${spaceId}`, `luminaire-types/${typeId}`, `exterior-applications/${exteriorId}`];
    for (const target of targets) {
      for (const version of ['', 'abc', '0', '-1', '1.5', '1e400', String(2 ** 40), '1&version=1']) {
        const response = await engineer.agent
          .delete(`/api/projects/${projectId}/${target}?version=${version}`)
          .set('X-CSRF-Token', engineer.csrfToken);
        expect(response.status, `${target} ?version=${version}`).toBeGreaterThanOrEqual(400);
        expect(response.status, `${target} ?version=${version}`).toBeLessThan(500);
      }
    }
    expect(await snapshot()).toEqual(before);
  });
});

describe('generated bad documents to POST /api/evaluate', () => {
  it('are each answered 400 with the path of a problem, never 500', async () => {
    const document = {
      edition: 'iecc-2021',
      method: 'space-by-space',
      units: 'ip',
      luminaireTypes: [luminaireType],
      spaces: [{ ...space, id: 's1' }],
      exterior: { lightingZone: 2, applications: [exterior] },
    };
    // The document has no descriptions or wattage sources: those are kept by the design records only.
    const { wattageSource: _source, ...documentTypeFields } = typeFields;
    const { description: _description, ...documentExteriorFields } = exteriorFields;
    const fields: Record<string, Kind> = {
      ...prefixed('spaces.0.', spaceFields),
      ...prefixed('luminaireTypes.0.', documentTypeFields),
      ...prefixed('exterior.applications.0.', documentExteriorFields),
      method: 'enum',
      units: 'enum',
    };
    await fc.assert(
      fc.asyncProperty(
        fc.constantFrom(...Object.keys(fields)).chain((path) => badValues[fields[path]!].map((value) => ({ path, value }))),
        async ({ path, value }) => {
          const response = await engineer.agent
            .post('/api/evaluate')
            .set('X-CSRF-Token', engineer.csrfToken)
            .send(withValue(document, path, value, false));
          expect(response.status, `${path} = ${JSON.stringify(value)?.slice(0, 40)}`).toBe(400);
          expect(response.body.error.details.length).toBeGreaterThan(0);
        },
      ),
      { seed, numRuns: 500 },
    );
  }, 120_000);
});
