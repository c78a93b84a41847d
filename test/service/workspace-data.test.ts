import type { Express } from 'express';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { signIn, testApp, type SignedInAgent } from '../support/app.js';
import { freshDatabase, type TestDatabase } from '../support/database.js';

let database: TestDatabase;
let app: Express;
let engineer: SignedInAgent;
let reviewer: SignedInAgent;
let demoId: string;

beforeAll(async () => {
  database = await freshDatabase();
  ({ app } = testApp(database.db, database.url));
  engineer = await signIn(app, 'engineer@alderbay.example');
  reviewer = await signIn(app, 'reviewer@alderbay.example');
  demoId = (await database.db('projects').where({ name: 'Alder Bay Library & Makerspace' }).first<{ id: string }>('id')).id;
});

afterAll(async () => {
  await database.drop();
});

function write(who: SignedInAgent, method: 'post' | 'put' | 'patch' | 'delete', url: string) {
  return who.agent[method](url).set('X-CSRF-Token', who.csrfToken);
}

async function newProject(fields: Record<string, unknown> = {}): Promise<string> {
  const created = await write(engineer, 'post', '/api/projects').send({
    name: 'Fire Station 4',
    edition: 'iecc-2021',
    method: 'space-by-space',
    units: 'ip',
    lightingZone: 2,
    ...fields,
  });
  expect(created.status).toBe(201);
  return created.body.id;
}

async function patchSetup(projectId: string, fields: Record<string, unknown>) {
  const version = (await engineer.agent.get(`/api/projects/${projectId}`)).body.version;
  return write(engineer, 'patch', `/api/projects/${projectId}`).send({ version, ...fields });
}

describe('the permit fields of the set-up', () => {
  it('keeps the permit, owner, occupancy, scope, floor area, designer and contractor', async () => {
    const permit = {
      permitNumber: 'BP-2026-0412',
      owner: 'Alder Bay Fire District',
      occupancy: 'Fire station (B and S-2)',
      scope: 'new-building',
      grossFloorArea: '12500',
      designerName: 'Ines Halvorsen, PE',
      designerFirm: 'Tideline Engineering',
      designerLicence: 'PE 41-0091',
      contractorName: 'Noor Abernathy',
      contractorFirm: 'Harbour Electric',
      contractorLicence: 'EC 2231',
      contractorContact: 'noor@harbour-electric.example',
    };
    const projectId = await newProject(permit);
    expect((await engineer.agent.get(`/api/projects/${projectId}`)).body).toMatchObject(permit);
    const scope = await patchSetup(projectId, { scope: 'demolition' });
    expect(scope.status).toBe(400);
    expect(scope.body.error.details[0].path).toBe('scope');
    const cleared = await patchSetup(projectId, { permitNumber: null });
    expect(cleared.body.permitNumber).toBeNull();
  });

  it('converts the gross floor area with the units, and back exactly', async () => {
    const projectId = await newProject({ grossFloorArea: '12500' });
    expect((await patchSetup(projectId, { units: 'si' })).body.grossFloorArea).toBe('1161.288'); // 12,500 ft² × 0.09290304 m²/ft² (mathjs units)
    expect((await patchSetup(projectId, { units: 'ip' })).body.grossFloorArea).toBe('12500');
  });
});

describe('switching the compliance method', () => {
  it('keeps each space’s space type and building area type, so switching back gives the same result', async () => {
    const projectId = await newProject({ name: 'Method switch' });
    await write(engineer, 'post', `/api/projects/${projectId}/luminaire-types`).send({ tag: 'A', inputWatts: '30', use: 'general' });
    const space = await write(engineer, 'post', `/api/projects/${projectId}/spaces`).send({
      name: 'Apparatus bay office',
      spaceType: 'office-enclosed',
      buildingAreaType: 'fire-station',
      area: '200',
      luminaires: [{ tag: 'A', count: 4 }],
      controls: [{ strategy: 'occupant-sensor', provided: true, timeoutMinutes: '20', autoOn: 'manual' }],
    });
    expect(space.status).toBe(201);
    const bySpace = (await engineer.agent.get(`/api/projects/${projectId}/results`)).body;
    expect(bySpace.interior.spaces[0].lpdBasis).toMatchObject({ kind: 'space-type', key: 'office-enclosed' });

    expect((await patchSetup(projectId, { method: 'building-area' })).status).toBe(200);
    const byArea = await engineer.agent.get(`/api/projects/${projectId}/results`);
    expect(byArea.status).toBe(200);
    expect(byArea.body.interior.spaces[0].lpdBasis).toMatchObject({ kind: 'building-area-type', key: 'fire-station' });
    // The space type still sets the controls under the building area method.
    expect(byArea.body.interior.spaces[0].controls.find((line: { strategy: string }) => line.strategy === 'occupant-sensor').status).toBe(
      'met',
    );

    expect((await patchSetup(projectId, { method: 'space-by-space' })).status).toBe(200);
    expect((await engineer.agent.get(`/api/projects/${projectId}/results`)).body.interior).toEqual(bySpace.interior);
  });
});

describe('copying a project', () => {
  it('makes a new draft with the same design, owned by the person copying', async () => {
    const copied = await write(reviewer, 'post', `/api/projects/${demoId}/copy`).send({ name: 'Alder Bay Library, option B' });
    expect(copied.status).toBe(201);
    expect(copied.body).toMatchObject({
      name: 'Alder Bay Library, option B',
      state: 'draft',
      role: 'engineer',
      edition: 'iecc-2021',
      jurisdiction: 'Alder Bay Building Department',
    });
    expect(copied.body.members).toEqual([expect.objectContaining({ email: 'reviewer@alderbay.example', role: 'engineer' })]);
    const original = (await engineer.agent.get(`/api/projects/${demoId}/results`)).body;
    const copy = (await reviewer.agent.get(`/api/projects/${copied.body.id}/results`)).body;
    expect(copy.interior.allowanceW).toBe(original.interior.allowanceW);
    expect(copy.interior.installedW).toBe(original.interior.installedW);
    expect(copy.exterior.installedW).toBe(original.exterior.installedW);
    expect(copy.complies).toBe(original.complies);
    const spaces = (await reviewer.agent.get(`/api/projects/${copied.body.id}/spaces`)).body;
    expect(spaces).toHaveLength(original.interior.spaces.length);
    expect(spaces.every((space: { version: number }) => space.version === 1)).toBe(true);
    const history = (await reviewer.agent.get(`/api/projects/${copied.body.id}/history`)).body.entries;
    expect(history).toEqual([expect.objectContaining({ action: 'copy', entity: 'project' })]);
  });
});

describe('one control on many spaces', () => {
  it('records the same control on each chosen space in one step, or on none when one is stale', async () => {
    const projectId = await newProject({ name: 'Bulk controls' });
    const created = await write(engineer, 'post', `/api/projects/${projectId}/spaces/bulk`).send({
      spaces: [1, 2, 3].map((index) => ({ name: `Dorm ${index}`, spaceType: 'storage-room', area: '80' })),
    });
    const targets = created.body.map((space: { id: string; version: number }) => ({ id: space.id, version: space.version }));
    const control = { strategy: 'occupant-sensor', provided: true, timeoutMinutes: '15', autoOn: 'manual', device: 'Ceiling sensor' };
    const stale = await write(engineer, 'post', `/api/projects/${projectId}/spaces/controls`).send({
      spaces: [...targets.slice(0, 2), { ...targets[2], version: 7 }],
      control,
    });
    expect(stale.status).toBe(409);
    expect(stale.body.error.message).toContain('Dorm 3');
    // Each changed space is named at its place in the request, so the page can say which ones to reload.
    expect(stale.body.error.details).toEqual([{ path: 'spaces.2', message: '“Dorm 3” changed since you read it.' }]);
    expect(
      (await engineer.agent.get(`/api/projects/${projectId}/spaces`)).body.every(
        (space: { controls: unknown[] }) => space.controls.length === 0,
      ),
    ).toBe(true);

    const applied = await write(engineer, 'post', `/api/projects/${projectId}/spaces/controls`).send({ spaces: targets, control });
    expect(applied.status).toBe(200);
    expect(applied.body.map((space: { version: number; controls: unknown[] }) => [space.version, space.controls])).toEqual(
      targets.map(() => [2, [control]]),
    );
    const history = (await engineer.agent.get(`/api/projects/${projectId}/history`)).body.entries;
    expect(history.slice(0, 3).map((entry: { action: string; entity: string }) => `${entry.action} ${entry.entity}`)).toEqual(
      Array(3).fill('update space'),
    );
    const unknown = await write(engineer, 'post', `/api/projects/${projectId}/spaces/controls`).send({
      spaces: targets.map((target: { id: string }) => ({ ...target, version: 2 })),
      control: { ...control, strategy: 'moonlight-dimming' },
    });
    expect(unknown.status).toBe(400);
  });

  it('refuses an exception claim that one space’s write would refuse, and stores nothing', async () => {
    const projectId = await newProject({ name: 'Claims on many' });
    const created = await write(engineer, 'post', `/api/projects/${projectId}/spaces/bulk`).send({
      spaces: [1, 2].map((n) => ({ name: `Corridor ${n}`, spaceType: 'corridor-otherwise', area: '400' })),
    });
    expect(created.status).toBe(201);
    const targets = created.body.map((space: { id: string; version: number }) => ({ id: space.id, version: space.version }));
    const claim = (control: Record<string, unknown>) =>
      write(engineer, 'post', `/api/projects/${projectId}/spaces/controls`).send({ spaces: targets, control });

    // A check against the adopted code must say where it was made; continuous operation frees lighting from the time switch only (IECC 2021 C405.2.2, as document.ts holds it).
    const unsaid = await claim({ strategy: 'occupant-sensor', provided: false, exceptionReason: 'verified-not-required' });
    expect(unsaid.status).toBe(400);
    expect(unsaid.body.error.details).toEqual([
      { path: 'control.exceptionNote', message: 'Say where in the adopted code it was checked.' },
    ]);
    const misplaced = await claim({ strategy: 'occupant-sensor', provided: false, exceptionReason: 'continuous-operation' });
    expect(misplaced.body.error.details).toEqual([
      { path: 'control.exceptionReason', message: 'Continuous operation frees lighting from the time switch only.' },
    ]);
    expect(
      (await engineer.agent.get(`/api/projects/${projectId}/spaces`)).body.every(
        (space: { controls: unknown[] }) => space.controls.length === 0,
      ),
    ).toBe(true);

    const timeSwitch = await claim({ strategy: 'time-switch', provided: false, exceptionReason: 'continuous-operation' });
    expect(timeSwitch.status).toBe(200);
    // The project still evaluates: nothing stored breaks its document.
    expect((await engineer.agent.get(`/api/projects/${projectId}/results`)).status).toBe(200);
  });
});

describe('names an import matched to a type', () => {
  it('are remembered for the project, one per name whatever its case or dashes', async () => {
    const projectId = await newProject({ name: 'Aliases' });
    const saved = await write(engineer, 'put', `/api/projects/${projectId}/import-aliases`).send({
      aliases: [
        { name: 'Apparatus Bay', spaceType: 'storage-room' },
        { name: 'apparatus-bay', spaceType: 'electrical-mechanical-room' },
        { name: 'Bunk room', spaceType: 'office-enclosed' },
      ],
    });
    expect(saved.status).toBe(200);
    expect(saved.body).toEqual([
      { name: 'apparatus-bay', spaceType: 'electrical-mechanical-room', buildingAreaType: null },
      { name: 'Bunk room', spaceType: 'office-enclosed', buildingAreaType: null },
    ]);
    const wrong = await write(engineer, 'put', `/api/projects/${projectId}/import-aliases`).send({
      aliases: [{ name: 'Hose tower', spaceType: 'hose-drying-tower' }],
    });
    expect(wrong.status).toBe(400);
    expect((await write(reviewer, 'put', `/api/projects/${projectId}/import-aliases`).send({ aliases: [] })).status).toBe(404);
  });
});

describe('luminaire schedule fields', () => {
  it('keeps the catalogue fields with the type and out of the evaluation document', async () => {
    const projectId = await newProject({ name: 'Schedule' });
    const type = await write(engineer, 'post', `/api/projects/${projectId}/luminaire-types`).send({
      tag: 'H1',
      description: 'High-bay',
      inputWatts: '151.5',
      use: 'general',
      manufacturer: 'Invented Lighting Co.',
      catalogNumber: 'HB-150-40K',
      lightSource: 'LED, 4000 K',
      driver: '0–10 V dimming',
      voltage: '120–277 V',
    });
    expect(type.status).toBe(201);
    expect(type.body).toMatchObject({
      inputWatts: '151.5',
      manufacturer: 'Invented Lighting Co.',
      catalogNumber: 'HB-150-40K',
      lightSource: 'LED, 4000 K',
      driver: '0–10 V dimming',
      voltage: '120–277 V',
    });
    const document = (await engineer.agent.get(`/api/projects/${projectId}/document`)).body;
    expect(Object.keys(document.luminaireTypes[0]).sort()).toEqual(['basis', 'description', 'inputWatts', 'tag', 'use']);
  });
});

describe('additional allowance claims', () => {
  it('are kept per space on the sales floor, at most its area, once per allowance, and count in the results', async () => {
    const projectId = await newProject({ name: 'Chandlery', edition: 'ashrae-90.1-2022' });
    await write(engineer, 'post', `/api/projects/${projectId}/luminaire-types`).send({ tag: 'D', inputWatts: '50', use: 'display' });
    const sales = await write(engineer, 'post', `/api/projects/${projectId}/spaces`).send({
      name: 'Sales floor',
      spaceType: 'sales-area',
      area: '1000',
      luminaires: [{ tag: 'D', count: 10 }],
    });
    const office = await write(engineer, 'post', `/api/projects/${projectId}/spaces`).send({
      name: 'Office',
      spaceType: 'office-enclosed-and-gt-150-ft2-and-le-300-ft2',
      area: '300',
    });
    expect([sales.status, office.status]).toEqual([201, 201]);
    const url = `/api/projects/${projectId}/additional-allowances`;

    const offFloor = await write(engineer, 'post', url).send({ spaceId: office.body.id, allowance: 'retail-area-1', area: '300' });
    expect(offFloor.status).toBe(400);
    expect(offFloor.body.error.details[0].path).toBe('spaceId');
    const tooLarge = await write(engineer, 'post', url).send({ spaceId: sales.body.id, allowance: 'retail-area-1', area: '1200' });
    expect(tooLarge.status).toBe(400);
    expect(tooLarge.body.error.details[0].path).toBe('area');
    const claim = await write(engineer, 'post', url).send({ spaceId: sales.body.id, allowance: 'retail-area-1', area: '600' });
    expect(claim.status).toBe(201);
    expect(claim.body).toMatchObject({ spaceId: sales.body.id, allowance: 'retail-area-1', area: '600', version: 1 });
    expect((await write(engineer, 'post', url).send({ spaceId: sales.body.id, allowance: 'retail-area-1', area: '100' })).status).toBe(409);

    const results = (await engineer.agent.get(`/api/projects/${projectId}/results`)).body;
    expect(results.interior.additional.lines).toHaveLength(1);
    const changed = await write(engineer, 'put', `${url}/${claim.body.id}`).send({
      spaceId: sales.body.id,
      allowance: 'retail-area-2',
      area: '500',
      version: 1,
    });
    expect(changed.body).toMatchObject({ allowance: 'retail-area-2', version: 2 });
    expect((await write(engineer, 'delete', `${url}/${claim.body.id}?version=2`)).status).toBe(204);
    expect((await engineer.agent.get(url)).body).toEqual([]);
    const actions = (await engineer.agent.get(`/api/projects/${projectId}/history`)).body.entries
      .slice(0, 3)
      .map((entry: { action: string; entity: string }) => `${entry.action} ${entry.entity}`);
    expect(actions).toEqual(['delete additional-allowance', 'update additional-allowance', 'create additional-allowance']);
  });
});

describe('POST /api/projects/:id/additional-allowances/:claimId/restore', () => {
  it('brings a deleted claim back with its id into the evaluation, for the engineer only, and records it', async () => {
    const projectId = await newProject({ name: 'Net loft', edition: 'ashrae-90.1-2022' });
    await write(engineer, 'post', `/api/projects/${projectId}/members`).send({ email: 'reviewer@alderbay.example', role: 'reviewer' });
    await write(engineer, 'post', `/api/projects/${projectId}/luminaire-types`).send({ tag: 'D', inputWatts: '50', use: 'display' });
    const sales = await write(engineer, 'post', `/api/projects/${projectId}/spaces`).send({
      name: 'Sales floor',
      spaceType: 'sales-area',
      area: '1000',
      luminaires: [{ tag: 'D', count: 10 }],
    });
    const url = `/api/projects/${projectId}/additional-allowances`;
    const claim = await write(engineer, 'post', url).send({ spaceId: sales.body.id, allowance: 'retail-area-1', area: '600' });
    expect(claim.status).toBe(201);
    const evaluation = async () => {
      const results = (await engineer.agent.get(`/api/projects/${projectId}/results`)).body;
      const document = (await engineer.agent.get(`/api/projects/${projectId}/document`)).body;
      return {
        lines: results.interior.additional?.lines.length ?? 0,
        spaceW: results.interior.spaces[0].additionalAllowanceW,
        claims: document.retailDisplay?.claims ?? [],
      };
    };
    const claimed = await evaluation();
    expect(claimed.lines).toBe(1);
    expect(Number(claimed.spaceW)).toBeGreaterThan(0);
    expect(claimed.claims).toEqual([{ allowance: 'retail-area-1', spaceId: sales.body.id, area: '600' }]);

    expect((await write(engineer, 'delete', `${url}/${claim.body.id}?version=1`)).status).toBe(204);
    expect((await engineer.agent.get(url)).body).toEqual([]);
    expect(await evaluation()).toEqual({ lines: 0, spaceW: '0', claims: [] });
    // Deleted is not there to change or delete again.
    expect(
      (
        await write(engineer, 'put', `${url}/${claim.body.id}`).send({
          spaceId: sales.body.id,
          allowance: 'retail-area-1',
          area: '500',
          version: 2,
        })
      ).status,
    ).toBe(404);
    expect((await write(engineer, 'delete', `${url}/${claim.body.id}?version=2`)).status).toBe(404);
    const deleteEntry = (await engineer.agent.get(`/api/projects/${projectId}/history`)).body.entries[0];
    expect(deleteEntry).toMatchObject({ action: 'delete', entity: 'additional-allowance', entityId: claim.body.id, restorable: true });

    const refused = await write(reviewer, 'post', `${url}/${claim.body.id}/restore`);
    expect(refused.status).toBe(403);
    expect(await evaluation()).toEqual({ lines: 0, spaceW: '0', claims: [] });

    const restored = await write(engineer, 'post', `${url}/${claim.body.id}/restore`);
    expect(restored.status).toBe(201);
    expect(restored.body).toMatchObject({ id: claim.body.id, spaceId: sales.body.id, allowance: 'retail-area-1', area: '600', version: 3 });
    expect((await engineer.agent.get(url)).body.map((kept: { id: string }) => kept.id)).toEqual([claim.body.id]);
    expect(await evaluation()).toEqual(claimed);

    const entries = (await engineer.agent.get(`/api/projects/${projectId}/history`)).body.entries;
    expect(entries[0]).toMatchObject({
      action: 'restore',
      entity: 'additional-allowance',
      entityId: claim.body.id,
      name: 'Sales floor',
      user: { name: engineer.user.name },
    });
    expect(entries[0].after).toMatchObject({ id: claim.body.id, area: '600' });
    const restoreRow = await database
      .db('audit_log')
      .where({ entity_id: claim.body.id, action: 'restore' })
      .first<{ detail: { restoredFrom: string } }>('detail');
    expect(restoreRow.detail.restoredFrom).toBe(deleteEntry.id);
    expect(entries[1]).toMatchObject({ action: 'delete', restorable: false });
    expect((await write(engineer, 'post', `${url}/${claim.body.id}/restore`)).status).toBe(404);
  });

  it('comes back in the project’s units after a change of units while it was deleted', async () => {
    const projectId = await newProject({ name: 'Rope walk', edition: 'ashrae-90.1-2022' });
    const sales = await write(engineer, 'post', `/api/projects/${projectId}/spaces`).send({
      name: 'Counter',
      spaceType: 'sales-area',
      area: '1000',
    });
    const url = `/api/projects/${projectId}/additional-allowances`;
    const claim = await write(engineer, 'post', url).send({ spaceId: sales.body.id, allowance: 'retail-area-1', area: '600' });
    await write(engineer, 'delete', `${url}/${claim.body.id}?version=1`);
    expect((await patchSetup(projectId, { units: 'si' })).status).toBe(200);
    const restored = await write(engineer, 'post', `${url}/${claim.body.id}/restore`);
    expect(restored.status).toBe(201);
    expect(restored.body.area).toBe('55.741824'); // 600 ft² × 0.09290304 m²/ft² (mathjs units)
  });

  it('refuses a claim the project would not take now, and one deleted more than 30 days ago', async () => {
    const projectId = await newProject({ name: 'Sail shop', edition: 'ashrae-90.1-2022' });
    const sales = await write(engineer, 'post', `/api/projects/${projectId}/spaces`).send({
      name: 'Shop',
      spaceType: 'sales-area',
      area: '800',
    });
    const url = `/api/projects/${projectId}/additional-allowances`;
    const first = await write(engineer, 'post', url).send({ spaceId: sales.body.id, allowance: 'retail-area-1', area: '400' });
    expect((await write(engineer, 'delete', `${url}/${first.body.id}?version=1`)).status).toBe(204);
    // The same allowance claimed again on the floor since: the deleted one would claim it twice.
    const again = await write(engineer, 'post', url).send({ spaceId: sales.body.id, allowance: 'retail-area-1', area: '300' });
    expect(again.status).toBe(201);
    const twice = await write(engineer, 'post', `${url}/${first.body.id}/restore`);
    expect(twice.status).toBe(409);
    expect(twice.body.error).toMatchObject({ code: 'not_restorable' });
    expect(twice.body.error.message).toContain('“Shop” already claims this allowance');

    const second = await write(engineer, 'post', url).send({ spaceId: sales.body.id, allowance: 'retail-area-2', area: '200' });
    await write(engineer, 'delete', `${url}/${second.body.id}?version=1`);
    await database
      .db('retail_display_claims')
      .where({ id: second.body.id })
      .update({ deleted_at: database.db.raw("now() - interval '31 days'") });
    const old = await write(engineer, 'post', `${url}/${second.body.id}/restore`);
    expect(old.status).toBe(409);
    expect(old.body.error.message).toContain('more than 30 days ago');
    // The next delete clears claims past their days for good.
    await write(engineer, 'delete', `${url}/${again.body.id}?version=1`);
    expect(await database.db('retail_display_claims').where({ id: second.body.id }).first('id')).toBeUndefined();
    expect((await write(engineer, 'post', `${url}/${second.body.id}/restore`)).status).toBe(404);
    expect(
      (await engineer.agent.get(`/api/projects/${projectId}/history`)).body.entries.find(
        (entry: { entityId: string; action: string }) => entry.entityId === second.body.id && entry.action === 'delete',
      ).restorable,
    ).toBe(false);
  });
});

describe('a thing deleted before a change of units', () => {
  // 1 ft = 0.3048 m exactly, so 1 ft² = 0.09290304 m² (mathjs units; the international foot).
  it('comes back in the project’s present units: a space with its window, a track type’s length, an exterior area', async () => {
    const projectId = await newProject({ name: 'Net loft' });
    const base = `/api/projects/${projectId}`;
    const track = await write(engineer, 'post', `${base}/luminaire-types`).send({
      tag: 'T9',
      description: 'Line-voltage track',
      use: 'general',
      inputWatts: '120',
      basis: 'line-voltage-track',
      length: '10',
    });
    expect(track.status, JSON.stringify(track.body)).toBe(201);
    const space = await write(engineer, 'post', `${base}/spaces`).send({
      name: 'Drying room',
      spaceType: 'storage-room',
      area: '1000',
      ceilingHeight: '10',
      length: '40',
      width: '25',
      windows: [{ width: '20', headHeight: '8' }],
    });
    expect(space.status, JSON.stringify(space.body)).toBe(201);
    const lot = await write(engineer, 'post', `${base}/exterior-applications`).send({
      key: 'parking-lots-and-drives',
      quantity: '5000',
      installedWatts: '300',
    });
    expect(lot.status, JSON.stringify(lot.body)).toBe(201);
    expect((await write(engineer, 'delete', `${base}/spaces/${space.body.id}?version=1`)).status).toBe(204);
    expect((await write(engineer, 'delete', `${base}/luminaire-types/${track.body.id}?version=1`)).status).toBe(204);
    expect((await write(engineer, 'delete', `${base}/exterior-applications/${lot.body.id}?version=1`)).status).toBe(204);
    expect((await patchSetup(projectId, { units: 'si' })).status).toBe(200);

    const restoredSpace = await write(engineer, 'post', `${base}/spaces/${space.body.id}/restore`);
    expect(restoredSpace.status).toBe(201);
    expect(restoredSpace.body).toMatchObject({ area: '92.90304', ceilingHeight: '3.048', length: '12.192', width: '7.62' });
    expect(restoredSpace.body.windows[0]).toMatchObject({ width: '6.096', headHeight: '2.4384' });
    const restoredTrack = await write(engineer, 'post', `${base}/luminaire-types/${track.body.id}/restore`);
    expect(restoredTrack.status).toBe(201);
    expect(restoredTrack.body.length).toBe('3.048');
    const restoredLot = await write(engineer, 'post', `${base}/exterior-applications/${lot.body.id}/restore`);
    expect(restoredLot.status).toBe(201);
    expect(restoredLot.body.quantity).toBe('464.5152');

    // Back to feet, every value is what was entered: the restored rows keep their origin as the others do.
    expect((await patchSetup(projectId, { units: 'ip' })).status).toBe(200);
    const again = await engineer.agent.get(`${base}/spaces/${space.body.id}`);
    expect(again.body).toMatchObject({ area: '1000', ceilingHeight: '10' });
  });
});
