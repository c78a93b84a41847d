import type { Express } from 'express';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { signIn, testApp, type SignedInAgent } from '../support/app.js';
import { freshDatabase, type TestDatabase } from '../support/database.js';

let database: TestDatabase;
let app: Express;
let engineer: SignedInAgent;

beforeAll(async () => {
  database = await freshDatabase();
  ({ app } = testApp(database.db, database.url));
  engineer = await signIn(app, 'engineer@alderbay.example');
});

afterAll(async () => {
  await database.drop();
});

function write(method: 'post' | 'put' | 'patch' | 'delete', url: string) {
  return engineer.agent[method](url).set('X-CSRF-Token', engineer.csrfToken);
}

async function newProject(edition: string): Promise<string> {
  const created = await write('post', '/api/projects').send({
    name: 'Harbour Hall',
    edition,
    method: 'space-by-space',
    units: 'ip',
    lightingZone: 2,
  });
  expect(created.status).toBe(201);
  return created.body.id;
}

describe('decorative allowance claims', () => {
  it('are taken on any space up to its area, and count only what its decorative luminaires use', async () => {
    const projectId = await newProject('ashrae-90.1-2022');
    const editions = (await engineer.agent.get('/api/code-editions/ashrae-90.1-2022/additional-allowances')).body;
    const decorative = editions.find((row: { kind: string }) => row.kind === 'decorative');
    // 90.1-2022 §9.5.2.2(a): the rate is from memory, so the row says it is not verified.
    expect(decorative).toMatchObject({ key: 'decorative', section: '9.5.2.2(a)', verified: false, citation: { checked: false } });
    expect(decorative.citation.short).toContain('9.5.2.2(a)');
    await write('post', `/api/projects/${projectId}/luminaire-types`).send({ tag: 'G', inputWatts: '30', use: 'general' });
    const room = await write('post', `/api/projects/${projectId}/spaces`).send({
      name: 'Meeting room',
      spaceType: 'conference-meeting-multipurpose-rooms',
      area: '400',
      luminaires: [{ tag: 'G', count: 10 }],
    });
    expect(room.status).toBe(201);
    const url = `/api/projects/${projectId}/additional-allowances`;

    const tooLarge = await write('post', url).send({ spaceId: room.body.id, allowance: 'decorative', area: '401' });
    expect(tooLarge.status).toBe(400);
    expect(tooLarge.body.error.details).toEqual([{ path: 'area', message: 'At most 400, the space’s floor area.' }]);

    // No decorative luminaire yet: the claim is kept (the luminaires may come later), and the result grants nothing, saying why.
    const claim = await write('post', url).send({ spaceId: room.body.id, allowance: 'decorative', area: '200' });
    expect(claim.status).toBe(201);
    let results = (await engineer.agent.get(`/api/projects/${projectId}/results`)).body;
    expect(results.interior.additional.lines[0]).toMatchObject({ kind: 'decorative', claimedW: '150', usableW: '0' });
    expect(results.interior.additional.lines[0].limitedBy).toContain('no decorative luminaires');
    expect(results.interior.spaces[0].additionalAllowanceW).toBe('0');
    expect(results.unverifiedValues.map((value: { what: string }) => value.what)).toContain('Additional allowance: Decorative lighting');

    // 0.75 W/ft² (from memory) × 200 ft² = 150 W claimed; 4 pendants × 25 W = 100 W decorative, so 100 W is granted.
    await write('post', `/api/projects/${projectId}/luminaire-types`).send({ tag: 'P', inputWatts: '25', use: 'decorative' });
    const withPendants = await write('put', `/api/projects/${projectId}/spaces/${room.body.id}`).send({
      name: 'Meeting room',
      spaceType: 'conference-meeting-multipurpose-rooms',
      area: '400',
      luminaires: [
        { tag: 'G', count: 10 },
        { tag: 'P', count: 4 },
      ],
      version: room.body.version,
    });
    expect(withPendants.status).toBe(200);
    results = (await engineer.agent.get(`/api/projects/${projectId}/results`)).body;
    expect(results.interior.spaces[0].additionalAllowanceW).toBe('100');
    expect(results.interior.additional.lines[0].usableW).toBe('100');
  });

  it('are not offered under an IECC edition', async () => {
    const projectId = await newProject('iecc-2021');
    const rows = (await engineer.agent.get('/api/code-editions/iecc-2021/additional-allowances')).body;
    expect(rows.some((row: { kind: string }) => row.kind === 'decorative')).toBe(false);
    const room = await write('post', `/api/projects/${projectId}/spaces`).send({
      name: 'Lobby',
      spaceType: 'lobby-otherwise',
      area: '400',
    });
    const claim = await write('post', `/api/projects/${projectId}/additional-allowances`).send({
      spaceId: room.body.id,
      allowance: 'decorative',
      area: '100',
    });
    expect(claim.status).toBe(400);
    expect(claim.body.error.message).toBe('This allowance is not one of the project’s code edition.');
  });
});

describe('exempt exterior lighting', () => {
  it('needs a reason from the list, is kept with its note, and is left out of the installed total', async () => {
    const projectId = await newProject('iecc-2021');
    // An evaluation needs a space; this one is confirmed unlit.
    expect(
      (
        await write('post', `/api/projects/${projectId}/spaces`).send({
          name: 'Lobby',
          spaceType: 'lobby-otherwise',
          area: '400',
          unlit: true,
        })
      ).status,
    ).toBe(201);
    const url = `/api/projects/${projectId}/exterior-applications`;
    const noReason = await write('post', url).send({
      key: 'parking-lots-and-drives',
      quantity: '20000',
      installedWatts: '1500',
      exemptWatts: '600',
    });
    expect(noReason.status).toBe(400);
    expect(noReason.body.error.message).toBe('The exempt lighting is not complete.');
    expect(noReason.body.error.details).toEqual([
      { path: 'exemptReason', message: 'Exempt lighting needs the reason it is exempt: choose it from the list.' },
    ]);
    const unknown = await write('post', url).send({
      key: 'parking-lots-and-drives',
      quantity: '20000',
      installedWatts: '1500',
      exemptWatts: '600',
      exemptReason: 'because',
    });
    expect(unknown.status).toBe(400);
    expect(unknown.body.error.details[0]).toEqual({ path: 'exemptReason', message: 'Choose the reason from the list.' });
    const tooMuch = await write('post', url).send({
      key: 'parking-lots-and-drives',
      quantity: '20000',
      installedWatts: '1500',
      exemptWatts: '1600',
      exemptReason: 'athletic-playing-area',
    });
    expect(tooMuch.status).toBe(400);
    expect(tooMuch.body.error.details[0].path).toBe('exemptWatts');

    const created = await write('post', url).send({
      key: 'parking-lots-and-drives',
      quantity: '20000',
      installedWatts: '1500',
      exemptWatts: '600',
      exemptReason: 'athletic-playing-area',
      exemptNote: 'Court lights, own switch',
    });
    expect(created.status).toBe(201);
    expect(created.body).toMatchObject({
      exemptWatts: '600',
      exemptReason: 'athletic-playing-area',
      exemptNote: 'Court lights, own switch',
    });
    const document = (await engineer.agent.get(`/api/projects/${projectId}/document`)).body;
    expect(document.exterior.applications[0]).toMatchObject({
      exemptWatts: '600',
      exemptReason: 'athletic-playing-area',
      exemptNote: 'Court lights, own switch',
    });
    const results = (await engineer.agent.get(`/api/projects/${projectId}/results`)).body;
    expect(results.exterior.installedW).toBe('900');
    expect(results.exterior.exemptW).toBe('600');
    expect(results.exterior.applications[0].exemption).toMatchObject({
      label: 'Lighting of athletic playing areas',
      section: 'C405.5.1 exception',
      verified: false,
    });
    expect(results.unverifiedValues.map((value: { what: string }) => value.what)).toContain(
      'Exterior exemption: Lighting of athletic playing areas',
    );

    // Clearing the reason and the watts makes it ordinary lighting again.
    const cleared = await write('put', `${url}/${created.body.id}`).send({
      key: 'parking-lots-and-drives',
      quantity: '20000',
      installedWatts: '1500',
      version: created.body.version,
    });
    expect(cleared.status).toBe(200);
    expect(cleared.body.exemptReason).toBeUndefined();
    expect((await engineer.agent.get(`/api/projects/${projectId}/results`)).body.exterior.installedW).toBe('1500');
  });
});
