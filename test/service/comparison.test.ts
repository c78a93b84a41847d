import type { Express } from 'express';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { signIn, testApp, type SignedInAgent } from '../support/app.js';
import { freshDatabase, type TestDatabase } from '../support/database.js';

let database: TestDatabase;
let app: Express;
let engineer: SignedInAgent;
let demoId: string;

beforeAll(async () => {
  database = await freshDatabase();
  ({ app } = testApp(database.db, database.url));
  engineer = await signIn(app, 'engineer@alderbay.example');
  demoId = (await database.db('projects').where({ name: 'Alder Bay Library & Makerspace' }).first<{ id: string }>('id')).id;
});

afterAll(async () => {
  await database.drop();
});

interface Comparison {
  edition: string;
  status: string;
  unmapped: { what: string; name: string; type: string }[];
  remapped: { space: string; from: string; to: string }[];
  controlsNotCarried: string[];
  result: { verdict: string; allowanceW: string; installedW: string; controls: { met: number; notMet: number; toVerify: number }; open: unknown[] } | null;
}

describe('GET /api/projects/:id/comparison', () => {
  it('sets the demo beside every other edition, mapping each space type through the rows the tables record as equal', async () => {
    const response = await engineer.agent.get(`/api/projects/${demoId}/comparison`);
    expect(response.status).toBe(200);
    const { current, editions } = response.body as { current: Comparison; editions: Comparison[] };
    const results = (await engineer.agent.get(`/api/projects/${demoId}/results`)).body;
    expect(current).toMatchObject({ edition: 'iecc-2021', status: 'evaluated', result: { verdict: results.verdict, allowanceW: results.interior.allowanceW, installedW: results.interior.installedW } });
    expect(editions.map((edition) => edition.edition)).toEqual(expect.arrayContaining(['ashrae-90.1-2019', 'ashrae-90.1-2022']));

    const ashrae = editions.find((edition) => edition.edition === 'ashrae-90.1-2019')!;
    // IECC 2021 rows record the 90.1-2019 row they equal (reference/iecc-2021/space-types.json, equalsRowOf, via BESD).
    expect(ashrae.status).toBe('evaluated');
    expect(ashrae.remapped).toEqual(expect.arrayContaining([expect.objectContaining({ space: '111 Corridor', to: expect.stringContaining('Corridor') })]));
    // The installed watts are the design's and do not change with the edition.
    expect(ashrae.result!.installedW).toBe(results.interior.installedW);
    // The IECC controls recorded (occupant sensors, time switches, light reduction) are not 90.1's: said, not carried.
    expect(ashrae.controlsNotCarried).toEqual(expect.arrayContaining([expect.stringMatching(/occupant sensor/i)]));
    expect(ashrae.result!.controls.notMet + ashrae.result!.controls.toVerify).toBeGreaterThan(0);
    expect(JSON.stringify(response.body)).not.toMatch(/\u0000/);
  });

  it('lists what does not map instead of guessing', async () => {
    const created = await engineer.agent
      .post('/api/projects')
      .set('X-CSRF-Token', engineer.csrfToken)
      .send({ name: 'Mapping', edition: 'ashrae-90.1-2022', method: 'space-by-space', units: 'ip' });
    // 90.1-2022's mother's wellness / massage rooms have no IECC 2021 counterpart in the tables.
    const types = (await engineer.agent.get('/api/code-editions/ashrae-90.1-2022/space-types')).body as { key: string }[];
    const special = types.find((type) => type.key === 'retail-facilities-massage')!;
    await engineer.agent
      .post(`/api/projects/${created.body.id}/spaces`)
      .set('X-CSRF-Token', engineer.csrfToken)
      .send({ name: 'Treatment room', spaceType: special.key, area: '120', unlit: true });
    const { editions } = (await engineer.agent.get(`/api/projects/${created.body.id}/comparison`)).body as { editions: Comparison[] };
    const iecc = editions.find((edition) => edition.edition === 'iecc-2021')!;
    expect(iecc.status).toBe('not-mapped');
    expect(iecc.unmapped).toEqual([expect.objectContaining({ what: 'space', name: 'Treatment room' })]);
    expect(iecc.result).toBeNull();
  });
});
