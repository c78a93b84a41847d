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
  controlChanges: {
    place: string;
    exterior: boolean;
    changes: { control: string; requirement: string; before: string; status: string; section: string }[];
  }[];
  result: {
    verdict: string;
    units: string;
    area: string;
    allowanceW: string;
    installedW: string;
    marginW: string;
    allowanceLpd: string | null;
    installedLpd: string | null;
    interiorComplies: boolean;
    exterior: { allowanceW: string; installedW: string; marginW: string; complies: boolean } | null;
    controls: { met: number; notMet: number; toVerify: number };
    open: unknown[];
    unverifiedValues: number;
  } | null;
}

interface Results {
  verdict: string;
  units: string;
  interior: {
    area: string;
    allowanceW: string;
    installedW: string;
    marginW: string;
    complies: boolean;
    spaces: { name: string; controls: { label: string; requirement: string }[] }[];
  };
  exterior: { allowanceW: string; installedW: string; complies: boolean } | null;
  unverifiedValues: unknown[];
  cautions: string[];
}

/** The figures the page beside the project's own Results page must agree with. */
function expectSummaryOf(comparison: Comparison, results: Results): void {
  expect(comparison.result).toMatchObject({
    verdict: results.verdict,
    units: results.units,
    area: results.interior.area,
    allowanceW: results.interior.allowanceW,
    installedW: results.interior.installedW,
    marginW: results.interior.marginW,
    interiorComplies: results.interior.complies,
    unverifiedValues: results.unverifiedValues.length,
  });
  expect(comparison.result!.exterior).toEqual({
    allowanceW: results.exterior!.allowanceW,
    installedW: results.exterior!.installedW,
    marginW: String(Number((Number(results.exterior!.allowanceW) - Number(results.exterior!.installedW)).toFixed(1))),
    complies: results.exterior!.complies,
  });
  // Watts over the counted floor area, reported to 0.001 as the results report densities.
  expect(Number(comparison.result!.allowanceLpd)).toBeCloseTo(Number(results.interior.allowanceW) / Number(results.interior.area), 3);
  expect(Number(comparison.result!.installedLpd)).toBeCloseTo(Number(results.interior.installedW) / Number(results.interior.area), 3);
}

describe('GET /api/projects/:id/comparison', () => {
  it('sets the demo beside every other edition, mapping each space type through the rows the tables record as equal', async () => {
    const response = await engineer.agent.get(`/api/projects/${demoId}/comparison`);
    expect(response.status).toBe(200);
    const { current, editions, cautions } = response.body as { current: Comparison; editions: Comparison[]; cautions: string[] };
    const results = (await engineer.agent.get(`/api/projects/${demoId}/results`)).body as Results;
    expect(current).toMatchObject({ edition: 'iecc-2021', status: 'evaluated', controlChanges: [] });
    expectSummaryOf(current, results);
    expect(cautions).toEqual(results.cautions);
    expect(editions.map((edition) => edition.edition)).toEqual(expect.arrayContaining(['ashrae-90.1-2019', 'ashrae-90.1-2022']));

    const ashrae = editions.find((edition) => edition.edition === 'ashrae-90.1-2019')!;
    // IECC 2021 rows record the 90.1-2019 row they equal (reference/iecc-2021/space-types.json, equalsRowOf, via BESD).
    expect(ashrae.status).toBe('evaluated');
    expect(ashrae.remapped).toEqual(
      expect.arrayContaining([expect.objectContaining({ space: '111 Corridor', to: expect.stringContaining('Corridor') })]),
    );
    // The installed watts are the design's and do not change with the edition.
    expect(ashrae.result!.installedW).toBe(results.interior.installedW);
    // The IECC controls recorded (occupant sensors, time switches, light reduction) are not 90.1's: said, not carried.
    expect(ashrae.controlsNotCarried).toEqual(expect.arrayContaining([expect.stringMatching(/occupant sensor/i)]));
    expect(ashrae.result!.controls.notMet + ashrae.result!.controls.toVerify).toBeGreaterThan(0);
    expect(ashrae.result).toMatchObject({ units: 'ip', area: results.interior.area });
    expect(JSON.stringify(response.body)).not.toContain('\\u0000');
  });

  it("names, per space, each control whose requirement is not the one under the project's own edition", async () => {
    const { editions } = (await engineer.agent.get(`/api/projects/${demoId}/comparison`)).body as { editions: Comparison[] };
    const results = (await engineer.agent.get(`/api/projects/${demoId}/results`)).body as Results;
    const ownRequirement = (space: string, control: string) => {
      const line = results.interior.spaces
        .find((candidate) => candidate.name === space)
        ?.controls.find((candidate) => candidate.label === control);
      if (!line || line.requirement === 'not-required') return 'not-required';
      return line.requirement === 'to-verify' ? 'to-verify' : 'required';
    };
    const ashrae = editions.find((edition) => edition.edition === 'ashrae-90.1-2019')!;
    expect(ashrae.controlChanges.length).toBeGreaterThan(0);
    for (const { place, exterior, changes } of ashrae.controlChanges) {
      expect(changes.length).toBeGreaterThan(0);
      for (const change of changes) {
        expect(change.requirement).not.toBe(change.before);
        if (!exterior) expect(change.before, `${place}: ${change.control}`).toBe(ownRequirement(place, change.control));
      }
    }
    const changes = ashrae.controlChanges.flatMap((entry) => entry.changes);
    // Occupant sensors are an IECC 2021 §C405.2.1 strategy (reference/iecc-2021/control-strategies.json)
    // that 90.1-2019 does not list; its §9.4.1.1(h) automatic full OFF (reference/ashrae-90.1-2019/
    // control-strategies.json, via PNNL ConStrain) is required in their place.
    expect(changes).toEqual(
      expect.arrayContaining([expect.objectContaining({ control: 'Occupant sensor', before: 'required', requirement: 'not-required' })]),
    );
    expect(changes).toEqual(
      expect.arrayContaining([expect.objectContaining({ control: 'Automatic full OFF', before: 'not-required', requirement: 'required' })]),
    );
    // What the tables cannot settle stays to verify: never listed as not required.
    const undecided = changes.filter((entry) => entry.status === 'to-verify');
    expect(undecided.length).toBeGreaterThan(0);
    for (const change of undecided) expect(change.requirement).not.toBe('not-required');
  });

  it('reports an SI project in m² and W/m²', async () => {
    const copy = await engineer.agent
      .post(`/api/projects/${demoId}/copy`)
      .set('X-CSRF-Token', engineer.csrfToken)
      .send({ name: 'Alder Bay in SI' });
    expect(copy.status).toBe(201);
    const detail = (await engineer.agent.get(`/api/projects/${copy.body.id}`)).body as { version: number };
    const converted = await engineer.agent
      .patch(`/api/projects/${copy.body.id}`)
      .set('X-CSRF-Token', engineer.csrfToken)
      .send({ version: detail.version, units: 'si' });
    expect(converted.status).toBe(200);
    const { current, editions } = (await engineer.agent.get(`/api/projects/${copy.body.id}/comparison`)).body as {
      current: Comparison;
      editions: Comparison[];
    };
    const results = (await engineer.agent.get(`/api/projects/${copy.body.id}/results`)).body as Results;
    expect(results.units).toBe('si');
    expectSummaryOf(current, results);
    for (const edition of editions.filter((entry) => entry.result))
      expect(edition.result).toMatchObject({ units: 'si', area: results.interior.area });
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
